/**
 * One worker thread of `upright check`: checks the files it is handed with the same code as the
 * single-threaded path, through its own view of the shared cache folder (writes are atomic, so
 * threads and processes can share it).
 */
import {openOutcomeCache} from 'remark-upright/check'
import {checkFile, type CheckFilesOptions} from './check-files.ts'
import {openFileCache} from './file-cache.ts'
import {toPortable, type PortableReport} from './portable-report.ts'

export interface CheckTask {
  /** A run of consecutive files (several per message, to keep messaging cheap). */
  files: string[]
  options: Omit<CheckFilesOptions, 'cache' | 'fileCache'>
  /** The cache setting, resolved by the main thread: a folder, memory only, or none. */
  cache: {dir: string} | boolean
}

export default async function checkTask(task: CheckTask): Promise<PortableReport[]> {
  const cache = openOutcomeCache(task.cache, task.options.base)
  const fileCache = openFileCache(task.cache, task.options.base)
  const reports: PortableReport[] = []
  for (const file of task.files) reports.push(toPortable(await checkFile(file, {...task.options, cache, fileCache})))
  return reports
}
