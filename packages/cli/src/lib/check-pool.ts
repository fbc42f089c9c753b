/**
 * `upright check` over many files: on the calling thread, or spread over worker threads (tinypool)
 * when there are enough files to repay starting them. Reports come back in the order of `files`
 * whichever thread finished first, so output is the same for every `--jobs`.
 *
 * Workers run the same TypeScript sources as the CLI. When this module is itself a `.ts` file (the
 * CLI runs under tsx, with no build step), each worker starts from check-worker-tsx.mjs, which loads
 * the worker module through tsx (Node 20 workers do not inherit the main thread's loader hooks); a
 * built `.js` CLI starts check-worker.js directly.
 */
import {threadId} from 'node:worker_threads'
import {Tinypool} from 'tinypool'
import {openOutcomeCache} from 'remark-upright/check'
import {checkFile, type CheckFilesOptions, type FileReport} from './check-files.ts'
import {openFileCache} from './file-cache.ts'
import type {CheckTask} from './check-worker.ts'
import {fromPortable, type PortableReport} from './portable-report.ts'

export interface PoolOptions {
  /** Worker threads; 1 checks on the calling thread. */
  jobs: number
  /** The cache: a folder, memory only (`true`), or none (`false`). */
  cache: {dir: string} | boolean
  /** Called after each file with the number done so far and the thread that checked it (0: this one). */
  onProgress?: ((done: number, thread: number) => void) | undefined
}

export async function checkFiles(files: readonly string[], options: Omit<CheckFilesOptions, 'cache' | 'fileCache'>, pool: PoolOptions): Promise<FileReport[]> {
  const jobs = Math.max(1, Math.min(pool.jobs, files.length))
  let done = 0
  const progress = (thread: number) => pool.onProgress?.(++done, thread)
  if (jobs === 1) {
    const cache = openOutcomeCache(pool.cache, options.base)
    const fileCache = openFileCache(pool.cache, options.base)
    const reports: FileReport[] = []
    for (const file of files) {
      reports.push(await checkFile(file, {...options, cache, fileCache}))
      progress(threadId)
    }
    return reports
  }
  const workers = new Tinypool({
    filename: workerUrl().href,
    minThreads: jobs,
    maxThreads: jobs
  })
  // Runs of a few files per message: enough tasks to balance the threads, few enough to keep the
  // messaging (a structured clone each way) a small part of the work.
  const size = Math.max(1, Math.min(16, Math.floor(files.length / (jobs * 16))))
  const runs: string[][] = []
  for (let i = 0; i < files.length; i += size) runs.push(files.slice(i, i + size))
  try {
    const done = await Promise.all(
      runs.map(async (run) => {
        const task: CheckTask = {files: run, options, cache: pool.cache}
        const portable = (await workers.run(task)) as PortableReport[]
        for (const report of portable) progress(report.thread)
        return portable.map(fromPortable)
      })
    )
    return done.flat()
  } finally {
    await workers.destroy()
  }
}

function workerUrl(): URL {
  const self = import.meta.url
  return new URL(self.endsWith('.ts') ? './check-worker-tsx.mjs' : './check-worker.js', self)
}

