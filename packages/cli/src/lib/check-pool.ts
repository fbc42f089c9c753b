/**
 * `upright check` over many files: on the calling thread, or spread over worker threads (tinypool)
 * when there are enough files to repay starting them. Reports come back in the order of `files`
 * whichever thread finished first, so output is the same for every `--jobs`.
 *
 * The main thread only deals out file names and collects reports: reading, parsing, checking and
 * the cache all happen in the workers, so nothing serial stands before or between them.
 *
 * Workers run the same code as the CLI. When this module is itself a `.ts` file (the CLI runs from
 * its sources under tsx), each worker starts from check-worker-tsx.mjs, which loads the worker
 * module through tsx (Node 20 workers do not inherit the main thread's loader hooks); a built `.js`
 * CLI starts check-worker.js directly.
 */
import {availableParallelism} from 'node:os'
import {setFlagsFromString} from 'node:v8'
import {threadId} from 'node:worker_threads'
import {bytesWrittenInThread} from '@upright/cache'
import {checkFile, type CheckFilesOptions, type FileReport} from './check-files.ts'
import type {CacheChoice} from './file-cache.ts'
import type {CheckTask, CheckTaskResult} from './check-worker.ts'
import {fromPortable, toPortable} from './portable-report.ts'
import {threadCpuSeconds, type ThreadTiming} from './thread-timing.ts'

export interface PoolOptions {
  /** Worker threads; 1 checks on the calling thread. */
  jobs: number
  /** The cache: a folder, memory only (`true`), or none (`false`). */
  cache: CacheChoice
  /** Called after each file with the number done so far and the thread that checked it (0: this one). */
  onProgress?: ((done: number, thread: number) => void) | undefined
  /** Filled with each thread's share of the work, when given (`--timing`). */
  timing?: Map<number, ThreadTiming> | undefined
  /** Called with the bytes each thread's run of files wrote to the cache folder. */
  onCacheWritten?: ((bytes: number) => void) | undefined
}

export async function checkFiles(files: readonly string[], options: Omit<CheckFilesOptions, 'cache'>, pool: PoolOptions): Promise<FileReport[]> {
  const jobs = Math.max(1, Math.min(pool.jobs, files.length))
  const withCache: CheckFilesOptions = {...options, cache: pool.cache}
  let done = 0
  const progress = (thread: number) => pool.onProgress?.(++done, thread)
  if (jobs === 1) {
    const start = performance.now()
    const written = bytesWrittenInThread()
    const reports: FileReport[] = []
    for (const file of files) {
      // Kept as workers send theirs: a run over thousands of files holding every syntax tree and
      // check result until the end grew the heap by ~110 KiB a file (bench/README.md, Scale).
      reports.push(fromPortable(toPortable(await checkFile(file, withCache))))
      progress(threadId)
    }
    pool.onCacheWritten?.(bytesWrittenInThread() - written)
    const diagrams = reports.reduce((n, r) => n + r.results.length, 0)
    pool.timing?.set(threadId, {thread: threadId, files: files.length, diagrams, busyMs: performance.now() - start, cpuSeconds: threadCpuSeconds()})
    return reports
  }
  const {Tinypool} = await import('tinypool')
  if (jobs >= availableParallelism()) tierUpLaterInWorkers()
  const workers = new Tinypool({
    filename: workerUrl().href,
    minThreads: jobs,
    maxThreads: jobs
  })
  // Runs of a few files per message: enough tasks to balance the threads (at least 16 per thread),
  // few enough to keep the messaging (a structured clone each way) a small part of the work.
  const size = Math.max(1, Math.min(16, Math.floor(files.length / (jobs * 16))))
  const runs: string[][] = []
  for (let i = 0; i < files.length; i += size) runs.push(files.slice(i, i + size))
  try {
    const done = await Promise.all(
      runs.map(async (run) => {
        const task: CheckTask = {files: run, options: withCache}
        const result = (await workers.run(task)) as CheckTaskResult
        for (const report of result.reports) progress(report.thread)
        pool.onCacheWritten?.(result.cacheBytesWritten)
        if (pool.timing) record(pool.timing, result)
        return result.reports.map(fromPortable)
      })
    )
    return done.flat()
  } finally {
    await workers.destroy()
  }
}

function record(timing: Map<number, ThreadTiming>, result: CheckTaskResult): void {
  const t = timing.get(result.thread) ?? {thread: result.thread, files: 0, diagrams: 0, busyMs: 0, cpuSeconds: undefined}
  t.files += result.reports.length
  t.diagrams += result.reports.reduce((n, r) => n + r.results.length, 0)
  t.busyMs += result.busyMs
  // Tasks of one thread finish in order, but their messages may not arrive in order: keep the largest.
  if (result.cpuSeconds !== undefined) t.cpuSeconds = Math.max(t.cpuSeconds ?? 0, result.cpuSeconds)
  timing.set(result.thread, t)
}

/**
 * V8's interrupt budget (bytecode a function runs before the runtime considers optimizing it) raised
 * from Node 20's 67,584 to 8× that, before the workers start, so each isolate sends fewer functions to
 * its optimizing compiler. Every worker isolate compiles the same code again on V8's helper threads;
 * when the workers fill the cores, that compiling takes cores from them, and a run takes at least the
 * process's CPU time over the cores. Over the site bench's 2,000 files, two jobs on two cores, one
 * build with and without (alternating, load 6–7): process CPU 14.3–14.6 s → 12.3–13.6 s, the
 * workers' own threads 8.7–8.9 s → 9.0–9.9 s (they run unoptimized code longer); over 1,000 files
 * 878 → 496 optimizing compilations (bench/README.md, Scale). With fewer jobs than cores, or one job,
 * the compiler has a spare core and the default is kept. Process-wide, so set only here, where the
 * main thread does nothing but deal out names. Tiers change speed, not what the code computes.
 */
let tieredUp = false
function tierUpLaterInWorkers(): void {
  if (tieredUp) return
  tieredUp = true
  // A budget given on node's command line (`node --interrupt-budget=N`, as bench/site.ts can) wins.
  if (process.execArgv.some((a) => /^--interrupt[-_]budget=/.test(a))) return
  setFlagsFromString('--interrupt-budget=540672')
}

function workerUrl(): URL {
  const self = import.meta.url
  return new URL(self.endsWith('.ts') ? './check-worker-tsx.mjs' : './check-worker.js', self)
}
