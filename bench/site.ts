/**
 * `pnpm bench site [--files N] [--diagrams N] [--repeat R] [--node-flag F ...]`: `upright check`
 * over a generated documentation tree (default 2,000 Markdown files holding 5,000 diagrams of 5–80
 * vertices, mostly upward planar; see packages/cli/test/support/docs-tree.ts), each run a fresh
 * process as in CI.
 *
 * The CLI runs as users run it: compiled. The packages are built with tsc from their
 * tsconfig.build.json (as `pnpm --filter … build` does; type checking skipped, the JavaScript is the
 * same) into a copy of the workspace whose package.json files carry their publishConfig (as `pnpm
 * publish` writes them), so `node packages/cli/dist/bin.js` loads only dist/ JavaScript. The copy also
 * keeps the cache key stable while others edit the sources. One row starts the CLI from its
 * TypeScript sources under tsx, for comparison.
 *
 *   startup       — an empty folder: the fixed cost of a process (built, and from sources)
 *   cold, 1 job   — an empty cache folder, checked on the main thread
 *   cold, 2 jobs  — another empty cache folder, two worker threads
 *   warm, 1 job / 2 jobs — the same folders again
 *   warm after an edit — one diagram changed in one file, the rest from the cache
 *
 * Start-up runs five times each (the median counts). With --repeat R the cold pair runs R times,
 * alternating, each time with fresh cache folders, and the fastest of each counts (the load on a
 * shared machine comes and goes). Every run passes `--timing`,
 * so beside wall time, CPU time and peak memory of the process (/usr/bin/time) it prints each
 * thread's files, busy time and CPU time: a worker busy for 10 s that used 5 s of CPU waited for a
 * core half the time. Every run's JSON report must equal the first cold single-job one.
 */
import {spawn, spawnSync} from 'node:child_process'
import {cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync} from 'node:fs'
import {createRequire} from 'node:module'
import {cpus, loadavg, tmpdir} from 'node:os'
import path from 'node:path'
import {fileURLToPath, pathToFileURL} from 'node:url'
import {writeDocsTree} from '../packages/cli/test/support/docs-tree.ts'

const root = fileURLToPath(new URL('..', import.meta.url))
const args = process.argv.slice(2)
const arg = (name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`)
  return i >= 0 ? Number(args[i + 1]) : fallback
}
const fileCount = arg('files', 2000)
const diagramCount = arg('diagrams', 5000)
const repeat = Math.max(1, arg('repeat', 1))
// `--node-flag F` (repeatable): a node or V8 flag for every `upright check` process, e.g.
// `--node-flag --no-concurrent-recompilation` to see what the optimizing compiler costs a thread.
const nodeFlags = args.flatMap((a, i) => (a === '--node-flag' && args[i + 1] !== undefined ? [args[i + 1]!] : []))
if (nodeFlags.length > 0) console.log(`node flags for every run: ${nodeFlags.join(' ')}`)
const load = () => loadavg()[0]!.toFixed(1)

const work = mkdtempSync(path.join(tmpdir(), 'upright-site-'))
const docs = path.join(work, 'docs')
const t0 = performance.now()
const tree = writeDocsTree(docs, {files: fileCount, diagrams: diagramCount, seed: 2026})
console.log(
  `tree: ${tree.files.length} files, ${tree.diagrams} diagrams (${tree.failing} with a cycle), ${tree.vertices} vertices, written in ${((performance.now() - t0) / 1000).toFixed(1)} s to ${docs}`
)

const require = createRequire(import.meta.url)
const tsx = pathToFileURL(require.resolve('tsx')).href
const t1 = performance.now()
const builtBin = path.join(await buildPackages(path.join(work, 'repo')), 'cli/dist/bin.js')
console.log(`packages built with tsc into ${path.dirname(path.dirname(path.dirname(builtBin)))} in ${((performance.now() - t1) / 1000).toFixed(1)} s`)

/**
 * A copy of the workspace as it would be installed from the registry: each package's package.json
 * with its publishConfig applied and its dist/ compiled by tsc, keeping its node_modules links
 * (relative, to the sibling packages and, through a node_modules link beside them, to the store).
 */
async function buildPackages(repo: string): Promise<string> {
  const packages = path.join(repo, 'packages')
  mkdirSync(packages, {recursive: true})
  symlinkSync(path.join(root, 'node_modules'), path.join(repo, 'node_modules'))
  const tsc = require.resolve('typescript/bin/tsc')
  const builds: Array<Promise<void>> = []
  for (const name of readdirSync(path.join(root, 'packages'))) {
    const from = path.join(root, 'packages', name)
    if (!existsSync(path.join(from, 'package.json')) || !existsSync(path.join(from, 'tsconfig.build.json'))) continue
    const to = path.join(packages, name)
    mkdirSync(to)
    const manifest = JSON.parse(readFileSync(path.join(from, 'package.json'), 'utf8')) as Record<string, unknown>
    const {publishConfig, ...rest} = manifest
    writeFileSync(path.join(to, 'package.json'), JSON.stringify({...rest, ...(publishConfig as object | undefined)}, null, 2))
    if (existsSync(path.join(from, 'node_modules'))) cpSync(path.join(from, 'node_modules'), path.join(to, 'node_modules'), {recursive: true, verbatimSymlinks: true})
    const tscArgs = [tsc, '-p', path.join(from, 'tsconfig.build.json'), '--outDir', path.join(to, 'dist'), '--noCheck', '--declaration', 'false']
    builds.push(
      new Promise((resolve, reject) => {
        const child = spawn(process.execPath, tscArgs, {stdio: ['ignore', 'pipe', 'pipe']})
        let out = ''
        child.stdout.on('data', (d) => (out += d))
        child.stderr.on('data', (d) => (out += d))
        child.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`tsc for ${name} failed:\n${out}`))))
      })
    )
  }
  await Promise.all(builds)
  return packages
}

interface ThreadTiming {
  thread: number
  files: number
  diagrams: number
  busyMs: number
  cpuSeconds?: number
}
interface Timing {
  jobs: number
  phasesMs: {startup: number; collect: number; check: number; finish: number}
  processCpuSeconds: number
  mainCpuSeconds?: number
  threads: ThreadTiming[]
}
interface Run {
  name: string
  wall: number
  cpu: number
  maxRssMiB: number
  load: string
  report: string
  timing: Timing | undefined
}

function check(name: string, jobs: number, cacheDir: string, target = docs, fromSources = false): Run {
  const timing = path.join(work, 'time.txt')
  const before = load()
  const node = fromSources ? [process.execPath, ...nodeFlags, '--import', tsx, path.join(root, 'packages/cli/src/bin.ts')] : [process.execPath, ...nodeFlags, builtBin]
  const child = spawnSync(
    '/usr/bin/time',
    ['-o', timing, '-f', '%e %U %S %M', ...node, 'check', '--format', 'json', '--timing', '--jobs', String(jobs), '--cache-dir', cacheDir, target],
    {cwd: work, encoding: 'utf8', maxBuffer: 1 << 30}
  )
  if (child.status !== 0 && child.status !== 1) throw new Error(`${name}: exit ${child.status}\n${child.stderr}`)
  const [wall, user, sys, rssKiB] = readFileSync(timing, 'utf8').trim().split('\n').at(-1)!.split(' ').map(Number)
  const line = child.stderr.split('\n').find((l) => l.startsWith('{"timing"'))
  const run: Run = {
    name,
    wall: wall!,
    cpu: user! + sys!,
    maxRssMiB: rssKiB! / 1024,
    load: `${before}→${load()}`,
    report: child.stdout,
    timing: line ? (JSON.parse(line) as {timing: Timing}).timing : undefined
  }
  console.log(
    `${name.padEnd(26)} wall ${run.wall.toFixed(2).padStart(6)} s  cpu ${run.cpu.toFixed(2).padStart(6)} s  peak RSS ${run.maxRssMiB.toFixed(0).padStart(4)} MiB  load ${run.load}`
  )
  if (run.timing && run.timing.threads.length > 0) console.log(`${' '.repeat(28)}${describeThreads(run.timing)}`)
  return run
}

const secs = (ms: number) => (ms / 1000).toFixed(2)
const cpuOf = (t: ThreadTiming) => (t.cpuSeconds === undefined ? '?' : t.cpuSeconds.toFixed(2))

function describeThreads(t: Timing): string {
  const threads = t.threads.map((x) => `${x.thread === 0 ? 'main' : `worker ${x.thread}`}: ${x.files} files, busy ${secs(x.busyMs)} s, cpu ${cpuOf(x)} s`)
  const main = t.jobs > 1 && t.mainCpuSeconds !== undefined ? `; main thread cpu ${t.mainCpuSeconds.toFixed(2)} s` : ''
  return `startup ${secs(t.phasesMs.startup)} s, check ${secs(t.phasesMs.check)} s, finish ${secs(t.phasesMs.finish)} s; ${threads.join('; ')}${main}`
}

// The fixed cost of a process that finds no file: built, and from the TypeScript sources under tsx.
const empty = path.join(work, 'empty')
mkdirSync(empty)
// Five of each, as start-up varies from run to run: the median counts.
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
function startupRuns(name: string, fromSources: boolean): Run {
  const runs = Array.from({length: 5}, (_, i) => check(`${name} ${i + 1}/5`, 1, path.join(work, 'cache-0'), empty, fromSources))
  const wall = median(runs.map((r) => r.wall))
  const cpu = median(runs.map((r) => r.cpu))
  console.log(`${name}: median wall ${wall.toFixed(2)} s, cpu ${cpu.toFixed(2)} s (min ${Math.min(...runs.map((r) => r.wall)).toFixed(2)} s)`)
  return {...runs[0]!, name, wall, cpu}
}
const startupSources = startupRuns('startup, sources (tsx)', true)
const startup = startupRuns('startup, built', false)

const colds: Array<{one: Run; two: Run; cacheOne: string; cacheTwo: string}> = []
for (let r = 0; r < repeat; r++) {
  const cacheOne = path.join(work, `cache-1-${r}`)
  const cacheTwo = path.join(work, `cache-2-${r}`)
  const suffix = repeat > 1 ? ` (${r + 1}/${repeat})` : ''
  // Alternate which goes first, so a change in load hits both alike.
  const first = r % 2 === 0
  const a = first ? check(`cold, 1 job${suffix}`, 1, cacheOne) : check(`cold, 2 jobs${suffix}`, 2, cacheTwo)
  const b = first ? check(`cold, 2 jobs${suffix}`, 2, cacheTwo) : check(`cold, 1 job${suffix}`, 1, cacheOne)
  colds.push(first ? {one: a, two: b, cacheOne, cacheTwo} : {one: b, two: a, cacheOne, cacheTwo})
}
const best = (runs: Run[]) => runs.reduce((x, y) => (y.wall < x.wall ? y : x))
const coldOne = best(colds.map((c) => c.one))
const coldTwo = best(colds.map((c) => c.two))
const last = colds.at(-1)!
const warmOne = check('warm, 1 job', 1, last.cacheOne)
const warmTwo = check('warm, 2 jobs', 2, last.cacheTwo)

// A one-line edit: a new edge in the first diagram of one page; only that diagram is recomputed.
const edited = tree.files[Math.floor(tree.files.length / 2)]!
const text = readFileSync(edited, 'utf8')
writeFileSync(edited, text.replace(/(```upright[^\n]*\n|:::upright[^\n]*\n)/, '$1fresh-a -> fresh-b\n'))
const afterEdit = check('warm after an edit, 1 job', 1, last.cacheOne)
writeFileSync(edited, text)

const reference = colds[0]!.one
for (const run of [...colds.flatMap((c) => [c.one, c.two]), warmOne, warmTwo]) {
  if (run.report !== reference.report) throw new Error(`${run.name}: report differs from the first cold single-job run`)
}
const summary = JSON.parse(reference.report).summary as {diagrams: number; passed: number; failed: number}
console.log(`\nreports identical across runs: ${summary.diagrams} diagrams, ${summary.passed} passed, ${summary.failed} failed`)
console.log(`startup (median of 5): ${startup.wall.toFixed(2)} s built, ${startupSources.wall.toFixed(2)} s from sources under tsx`)
console.log(`warm speed-up: ${(coldOne.wall / warmOne.wall).toFixed(1)}x wall with 1 job (cpu ${(coldOne.cpu / warmOne.cpu).toFixed(1)}x), ${(coldTwo.wall / warmTwo.wall).toFixed(1)}x with 2 jobs`)
console.log(`edit rebuild: ${afterEdit.wall.toFixed(2)} s (${(coldOne.wall / afterEdit.wall).toFixed(1)}x faster than cold)`)

// Workers: the wall-time ratio, and what each thread's own CPU time says it would be if each had a
// core to itself (the machine is shared: a thread that waits for a core is busy without using CPU).
// CPU time also grows under contention (caches shared with other processes), so each side takes the
// smallest over the repeats.
console.log(`worker speed-up, cold: ${(coldOne.wall / coldTwo.wall).toFixed(2)}x wall (best of ${repeat}: ${coldOne.wall.toFixed(2)} s vs ${coldTwo.wall.toFixed(2)} s)`)
const threadCpu = (run: Run) => run.timing?.threads.map((t) => t.cpuSeconds)
const ones = colds.map((c) => threadCpu(c.one)?.[0]).filter((x): x is number => x !== undefined)
const twos = colds.map((c) => threadCpu(c.two)).filter((xs): xs is number[] => xs !== undefined && xs.length > 0 && xs.every((x) => x !== undefined))
if (ones.length > 0 && twos.length > 0) {
  const main = Math.min(...ones)
  const slowest = Math.min(...twos.map((xs) => Math.max(...xs)))
  const sum = Math.min(...twos.map((xs) => xs.reduce((a, b) => a + b, 0)))
  for (const c of colds) {
    const one = c.one.timing?.threads[0]
    const workers = c.two.timing?.threads ?? []
    console.log(
      `  1 job: main thread cpu ${one ? cpuOf(one) : '?'} s of ${c.one.cpu.toFixed(2)} s for the process (the rest: the runtime's compiler and collector threads); ` +
        `2 jobs: workers ${workers.map((w) => `${w.files} files / cpu ${cpuOf(w)} s / busy ${secs(w.busyMs)} s`).join(', ')} of ${c.two.cpu.toFixed(2)} s for the process`
    )
  }
  console.log(`  workers' cpu together: ${sum.toFixed(2)} s against ${main.toFixed(2)} s on one thread (${((sum / main) * 100).toFixed(0)}%, smallest of each)`)
  console.log(`  by CPU time per thread (each thread on a core of its own): ${(main / slowest).toFixed(2)}x`)
  const share = (run: Run) => (run.timing?.threads ?? []).map((t) => ((t.cpuSeconds ?? 0) / (t.busyMs / 1000)) * 100)
  console.log(`  threads got a core ${share(coldOne).map((p) => p.toFixed(0)).join('/')}% (1 job) and ${share(coldTwo).map((p) => p.toFixed(0)).join('/')}% (2 jobs) of their busy time; near 100% on a quiet machine`)
}
console.log(`machine: ${cpus().length} cores, load average now ${loadavg().map((l) => l.toFixed(1)).join(' ')}`)
rmSync(work, {recursive: true, force: true})
