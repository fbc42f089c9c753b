/**
 * `upright check|…` — the command line. Only this package touches the file system and the process;
 * `run` takes its world as an argument so tests can drive it in-process.
 */
import {Command, CommanderError, InvalidArgumentError, Option} from 'commander'
import {defaultLimits, flows, resolveLimits, type Flow, type Limits} from '@upright/core'
import {collectFiles} from './collect-files.ts'
import type {FileReport} from './check-files.ts'
import {checkFiles} from './check-pool.ts'
import {parseShard, selectShard, type Shard} from './shard.ts'
import {createProgressBar} from './progress-bar.ts'
import {findCacheDir} from '@upright/cache'
import {openFileCache} from './file-cache.ts'
import {threadCpuSeconds, type ThreadTiming} from './thread-timing.ts'
import {availableParallelism} from 'node:os'
import {cpuUsage} from 'node:process'
import {threadId} from 'node:worker_threads'
import {toJsonReport} from './format-json.ts'
import {formatText, summarize} from './format-text.ts'
import {writeFile} from 'node:fs/promises'
import path from 'node:path'

export interface Io {
  cwd: string
  env: Readonly<Record<string, string | undefined>>
  stdout: {write(s: string): unknown; isTTY?: boolean | undefined}
  stderr: {write(s: string): unknown; isTTY?: boolean | undefined}
}

export const exitCodes = {ok: 0, failed: 1, usage: 2} as const

export async function run(argv: readonly string[], io: Io): Promise<number> {
  let exit: number = exitCodes.ok
  const program = new Command()
    .name('upright')
    .description('Check and draw upward planar diagrams written in Markdown.')
    .exitOverride()
    .configureOutput({
      writeOut: (s) => io.stdout.write(s),
      writeErr: (s) => io.stderr.write(s)
    })

  program
    .command('check')
    .description('check every upright diagram in the given Markdown (.md) and diagram (.upright) files and folders')
    .argument('<paths...>', 'files or folders')
    .addOption(new Option('--format <format>', 'report format').choices(['text', 'json']).default('text'))
    .addOption(new Option('--flow <flow>', 'default flow (for .upright files: their flow)').choices(flows))
    .option('--title <title>', 'title (for .upright files)')
    .option('--budget <ms>', 'milliseconds the upward test may spend per diagram', parseBudget)
    .option('--limits <json>', limitsHelp, parseLimits)
    .option('-j, --jobs <n>', 'worker threads (default: the number of cores from 64 files on, else 1)', parsePositive)
    .option('--shard <i/n>', 'check only the i-th of n disjoint slices of the files (for splitting across CI jobs)', parseShardOption)
    .option('--cache-dir <dir>', 'cache folder (default: node_modules/.cache/upright of the nearest package.json)')
    .option('--no-cache', 'check every diagram afresh, without reading or writing the cache')
    .option('--timing', 'print to standard error where the time went: per thread, files, busy time and CPU time')
    .action(async (paths: string[], opts: CheckOpts) => {
      exit = await check(paths, opts, io)
    })

  program
    .command('explain')
    .description('print the whole diagnosis of every diagram in a file: each problem with code frames for every edge involved, and a suggested fix')
    .argument('<file>', 'a Markdown (.md) or diagram (.upright) file')
    .addOption(new Option('--format <format>', 'report format (json: as check\'s, with "fix" per failing diagram)').choices(['text', 'json']).default('text'))
    .addOption(new Option('--flow <flow>', 'default flow (for .upright files: their flow)').choices(flows))
    .option('--title <title>', 'title (for .upright files)')
    .option('--budget <ms>', 'milliseconds the upward test may spend per diagram', parseBudget)
    .option('--limits <json>', limitsHelp, parseLimits)
    .action(async (file: string, opts: Omit<CheckOpts, 'jobs' | 'shard' | 'cacheDir' | 'cache'>) => {
      exit = await explain(file, opts, io)
    })

  for (const name of ['layout', 'render'] as const) {
    const command = program
      .command(name)
      .argument('<file>', 'a .upright file, or a Markdown file (see --diagram)')
      .option('--diagram <n>', 'which diagram of a Markdown file, counting from 1', parsePositive, 1)
      .addOption(new Option('--flow <flow>', 'flow (overrides the default; a diagram that sets flow keeps it)').choices(flows))
      .option('--title <title>', 'title (for .upright files)')
      .option('--budget <ms>', 'milliseconds the upward test may spend', parseBudget)
      .option('--limits <json>', limitsHelp, parseLimits)
    if (name === 'layout') {
      command
        .description('print the drawing\'s geometry: boxes and edge polylines in SVG coordinates')
        .addOption(new Option('--format <format>', 'output format').choices(['json']).default('json'))
        .option('--stats', 'add area, aspect ratio, bends, total edge length and crossings')
        .action(async (file: string, opts: DrawOpts & {stats?: boolean}) => {
          exit = await draw(file, opts, io, (drawing, _title, lib) => JSON.stringify(lib.layoutJson(drawing, Boolean(opts.stats))) + '\n')
        })
    } else {
      command
        .description('write the drawing as an optimized, accessible SVG')
        .option('-o, --output <file>', 'write to this file instead of standard output')
        .action(async (file: string, opts: DrawOpts & {output?: string}) => {
          exit = await draw(file, opts, io, (drawing, title, lib) => lib.renderFileSvg(drawing, title) + '\n', opts.output)
        })
    }
  }

  try {
    await program.parseAsync([...argv], {from: 'user'})
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and version print and exit 0; every other commander error is a usage error.
      return error.exitCode === 0 ? exitCodes.ok : exitCodes.usage
    }
    throw error
  }
  return exit
}

interface DrawOpts {
  diagram: number
  flow?: Flow
  title?: string
  budget?: number
  limits?: Partial<Limits>
}

async function draw(
  file: string,
  opts: DrawOpts,
  io: Io,
  format: (drawing: import('@upright/core').Drawing, title: string | undefined, lib: typeof import('./draw-file.ts')) => string,
  output?: string
): Promise<number> {
  const base = baseDirectory(io)
  // Loaded here so that `check` never loads the drawing code (the SVG optimizer is slow to load).
  const lib = await import('./draw-file.ts')
  const result = await lib.drawFile(path.resolve(base, file), {base, ...opts})
  if (!result.ok) {
    if (result.problem === 'no-such-diagram') {
      io.stderr.write(`upright: ${file} has ${result.report.results.length} diagram(s); there is no diagram ${opts.diagram}\n`)
      return exitCodes.usage
    }
    const colour = Boolean(io.stderr.isTTY) && io.env['NO_COLOR'] === undefined
    io.stderr.write(formatText([result.report], {colour}))
    return result.problem === 'unreadable' ? exitCodes.usage : exitCodes.failed
  }
  const text = format(result.drawing, result.title, lib)
  if (output) {
    try {
      await writeFile(path.resolve(base, output), text)
    } catch (error) {
      io.stderr.write(`upright: cannot write ${output}: ${error instanceof Error ? error.message : String(error)}\n`)
      return exitCodes.usage
    }
  } else io.stdout.write(text)
  return exitCodes.ok
}

function parsePositive(value: string): number {
  const n = Number(value)
  if (!Number.isInteger(n) || n < 1) throw new InvalidArgumentError('expected a whole number from 1')
  return n
}

const limitsHelp = `size limits per diagram as a JSON object, any of ${Object.keys(defaultLimits).join(', ')} (see docs/language.md#limits)`

/** `--limits '{"maxVertices": 5000}'`: a JSON object of known limit names, each a whole number ≥ 1. */
function parseLimits(value: string): Partial<Limits> {
  let parsed: unknown
  try {
    parsed = JSON.parse(value)
  } catch {
    throw new InvalidArgumentError('expected a JSON object such as \'{"maxVertices": 5000}\'')
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
    throw new InvalidArgumentError('expected a JSON object such as \'{"maxVertices": 5000}\'')
  }
  for (const key of Object.keys(parsed)) {
    if (!(key in defaultLimits)) throw new InvalidArgumentError(`unknown limit ${JSON.stringify(key)}; the limits are ${Object.keys(defaultLimits).join(', ')}`)
  }
  try {
    resolveLimits(parsed as Partial<Limits>)
  } catch (error) {
    throw new InvalidArgumentError(error instanceof Error ? error.message : String(error))
  }
  return parsed as Partial<Limits>
}

function parseBudget(value: string): number {
  const n = Number(value)
  if (!Number.isFinite(n) || n <= 0) throw new InvalidArgumentError('expected a positive number of milliseconds')
  return n
}

/** Where relative paths start: where the user typed the command, also under `pnpm upright`. */
export function baseDirectory(io: Io): string {
  return io.env['npm_lifecycle_event'] === 'upright' && io.env['INIT_CWD'] ? io.env['INIT_CWD'] : io.cwd
}

async function explain(file: string, opts: Omit<CheckOpts, 'jobs' | 'shard' | 'cacheDir' | 'cache'>, io: Io): Promise<number> {
  const base = baseDirectory(io)
  const {checkFile} = await import('./check-files.ts')
  const {formatExplain} = await import('./explain-text.ts')
  const report = await checkFile(path.resolve(base, file), {base, flow: opts.flow, title: opts.title, budget: opts.budget, limits: opts.limits})
  if (opts.format === 'json') io.stdout.write(JSON.stringify(toJsonReport([report]), null, 2) + '\n')
  else io.stdout.write(formatExplain([report], {colour: Boolean(io.stdout.isTTY) && io.env['NO_COLOR'] === undefined}))
  if (report.error) return exitCodes.usage
  return summarize([report]).failed > 0 ? exitCodes.failed : exitCodes.ok
}

interface CheckOpts {
  format: 'text' | 'json'
  flow?: Flow
  title?: string
  budget?: number
  limits?: Partial<Limits>
  jobs?: number
  shard?: Shard
  cacheDir?: string
  cache: boolean
  timing?: boolean
}

function parseShardOption(value: string): Shard {
  const parsed = parseShard(value)
  if (!parsed.ok) throw new InvalidArgumentError(parsed.reason)
  return parsed.shard
}

/** Below this many files, starting worker threads costs more than it saves (unless --jobs is given). */
const minFilesForWorkers = 64

async function check(paths: string[], opts: CheckOpts, io: Io): Promise<number> {
  const started = performance.now()
  const base = baseDirectory(io)
  const collected = await collectFiles(paths, base)
  const collectedAt = performance.now()
  for (const p of collected.problems) io.stderr.write(`upright: cannot read ${p.path}: ${p.reason}\n`)
  const files = opts.shard ? selectShard(collected.files, base, opts.shard) : collected.files
  // No package.json above the base and no --cache-dir: keep results in memory rather than pick a folder.
  const dir = opts.cache ? (opts.cacheDir !== undefined ? path.resolve(base, opts.cacheDir) : findCacheDir(base)) : undefined
  const cache = opts.cache ? (dir !== undefined ? {dir} : true) : false
  const jobs = opts.jobs ?? (files.length >= minFilesForWorkers ? availableParallelism() : 1)
  const bar = Boolean(io.stderr.isTTY) && files.length > 20 ? createProgressBar(io.stderr, files.length, 'checking') : undefined
  const timing = opts.timing ? new Map<number, ThreadTiming>() : undefined
  let written = 0
  const reports: FileReport[] = await checkFiles(
    files,
    {base, flow: opts.flow, title: opts.title, budget: opts.budget, limits: opts.limits},
    {jobs, cache, onProgress: bar ? (done) => bar.tick(done) : undefined, timing, onCacheWritten: (bytes) => (written += bytes)}
  )
  bar?.clear()
  const checkedAt = performance.now()
  // Keep the folder within its bound (workers only add to it). A run that wrote nothing left it as
  // it found it, so it skips the scan of every entry (on a warm run, most of the time after the check).
  if (dir !== undefined && written > 0) openFileCache({dir})?.prune()

  if (opts.format === 'json') {
    io.stdout.write(JSON.stringify(toJsonReport(reports), null, 2) + '\n')
  } else {
    const colour = Boolean(io.stdout.isTTY) && io.env['NO_COLOR'] === undefined
    io.stdout.write(formatText(reports, {colour}))
  }
  if (timing) {
    const phases = {startup: started, collect: collectedAt - started, check: checkedAt - collectedAt, finish: performance.now() - checkedAt}
    io.stderr.write(formatTiming(jobs, phases, timing, opts.format))
  }
  const summary = summarize(reports)
  if (collected.problems.length > 0 || summary.unreadable > 0) return exitCodes.usage
  return summary.failed > 0 ? exitCodes.failed : exitCodes.ok
}

/**
 * `--timing`: wall milliseconds by phase (startup counts from the process start), then per thread its
 * files, busy time and CPU time, and the process's CPU time (every thread, the runtime's own helpers
 * included). JSON on one line with `--format json`, for scripts such as bench/site.ts.
 */
function formatTiming(jobs: number, phases: Record<'startup' | 'collect' | 'check' | 'finish', number>, timing: Map<number, ThreadTiming>, format: 'text' | 'json'): string {
  const usage = cpuUsage()
  const processCpuSeconds = (usage.user + usage.system) / 1e6
  const mainCpuSeconds = threadCpuSeconds()
  const threads = [...timing.values()].sort((a, b) => a.thread - b.thread)
  if (format === 'json') return JSON.stringify({timing: {jobs, phasesMs: phases, processCpuSeconds, mainCpuSeconds, threads}}) + '\n'
  const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`
  const cpu = (x: number | undefined) => (x === undefined ? '?' : `${x.toFixed(2)} s`)
  const lines = [
    `timing: startup ${s(phases.startup)}, collect ${s(phases.collect)}, check ${s(phases.check)}, finish ${s(phases.finish)}; ` +
      `CPU ${processCpuSeconds.toFixed(2)} s in all, main thread ${cpu(mainCpuSeconds)}`
  ]
  for (const t of threads) {
    lines.push(`  ${t.thread === threadId ? 'main thread' : `worker thread ${t.thread}`}: ${t.files} files, ${t.diagrams} diagrams, busy ${s(t.busyMs)}, CPU ${cpu(t.cpuSeconds)}`)
  }
  return lines.join('\n') + '\n'
}
