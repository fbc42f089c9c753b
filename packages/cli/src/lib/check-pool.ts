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

export async function checkFiles(files: readonly string[], options: Omit<CheckFilesOptions, 'cache'>, pool: PoolOptions): Promise<FileReport[]> {
  const jobs = Math.max(1, Math.min(pool.jobs, files.length))
  let done = 0
  const progress = (thread: number) => pool.onProgress?.(++done, thread)
  if (jobs === 1) {
    const cache = openOutcomeCache(pool.cache, options.base)
    const reports: FileReport[] = []
    for (const file of files) {
      reports.push(await checkFile(file, {...options, cache}))
      progress(threadId)
    }
    return reports
  }
  const workers = new Tinypool({
    filename: workerUrl().href,
    minThreads: jobs,
    maxThreads: jobs
  })
  try {
    return await Promise.all(
      files.map(async (file) => {
        const task: CheckTask = {file, options, cache: pool.cache}
        const portable = (await workers.run(task)) as PortableReport
        progress(portable.thread)
        return fromPortable(portable)
      })
    )
  } finally {
    await workers.destroy()
  }
}

function workerUrl(): URL {
  const self = import.meta.url
  return new URL(self.endsWith('.ts') ? './check-worker-tsx.mjs' : './check-worker.js', self)
}

