/**
 * One worker thread of `upright check`: checks the files it is handed with the same code as the
 * single-threaded path, through its own view of the shared cache folder (writes are atomic, so
 * threads and processes can share it).
 */
import {threadId} from 'node:worker_threads'
import {bytesWrittenInThread} from '@upright/cache'
import {checkFile, type CheckFilesOptions} from './check-files.ts'
import {toPortable, type PortableReport} from './portable-report.ts'
import {threadCpuSeconds} from './thread-timing.ts'

export interface CheckTask {
  /** A run of consecutive files (several per message, to keep messaging cheap). */
  files: string[]
  /** The cache setting included, as the main thread resolved it: a folder, memory only, or none. */
  options: CheckFilesOptions
}

export interface CheckTaskResult {
  reports: PortableReport[]
  thread: number
  /** Wall milliseconds this task took. */
  busyMs: number
  /** CPU seconds this thread has used so far (start-up included). */
  cpuSeconds: number | undefined
  /** Bytes this task wrote to the cache folder (0: the end-of-run prune has nothing to do for it). */
  cacheBytesWritten: number
}

export default async function checkTask(task: CheckTask): Promise<CheckTaskResult> {
  const start = performance.now()
  const written = bytesWrittenInThread()
  const reports: PortableReport[] = []
  for (const file of task.files) reports.push(toPortable(await checkFile(file, task.options)))
  return {reports, thread: threadId, busyMs: performance.now() - start, cpuSeconds: threadCpuSeconds(), cacheBytesWritten: bytesWrittenInThread() - written}
}
