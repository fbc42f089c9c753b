/**
 * `pnpm bench site [--files N] [--diagrams N]`: `upright check` over a generated documentation tree
 * (default 2,000 Markdown files holding 5,000 diagrams of 5–80 vertices, mostly upward planar; see
 * packages/cli/test/support/docs-tree.ts), each run a fresh process as in CI:
 *
 *   cold, 1 job   — empty cache folder, checked on the main thread
 *   cold, 2 jobs  — another empty cache folder, two worker threads
 *   warm, 1 job / 2 jobs — the same folders again
 *   warm after an edit — one diagram changed in one file, the rest from the cache
 *
 * Wall time and CPU time (user + system) and peak resident memory of the process (worker threads
 * included) come from /usr/bin/time. Every run's JSON report must equal the cold single-job one.
 */
import {spawnSync} from 'node:child_process'
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

const work = mkdtempSync(path.join(tmpdir(), 'upright-site-'))
const docs = path.join(work, 'docs')
const t0 = performance.now()
const tree = writeDocsTree(docs, {files: fileCount, diagrams: diagramCount, seed: 2026})
console.log(
  `tree: ${tree.files.length} files, ${tree.diagrams} diagrams (${tree.failing} with a cycle), ${tree.vertices} vertices, written in ${((performance.now() - t0) / 1000).toFixed(1)} s to ${docs}`
)

const tsx = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href
const bin = path.join(snapshotPackages(), 'cli/src/bin.ts')

/**
 * Run a copy of the packages' sources taken now: the cache is keyed on a hash of the sources, and on
 * a machine where others are editing them a live tree would turn every warm run cold (correctly).
 * The copies keep their node_modules links (relative), and reach the workspace's store through a
 * node_modules link beside them.
 */
function snapshotPackages(): string {
  const repo = path.join(work, 'repo')
  mkdirSync(path.join(repo, 'packages'), {recursive: true})
  symlinkSync(path.join(root, 'node_modules'), path.join(repo, 'node_modules'))
  for (const name of readdirSync(path.join(root, 'packages'))) {
    const from = path.join(root, 'packages', name)
    if (!existsSync(path.join(from, 'package.json'))) continue
    for (const part of ['package.json', 'src', 'node_modules']) {
      if (existsSync(path.join(from, part))) cpSync(path.join(from, part), path.join(repo, 'packages', name, part), {recursive: true, verbatimSymlinks: true})
    }
  }
  return path.join(repo, 'packages')
}

interface Run {
  name: string
  wall: number
  cpu: number
  maxRssMiB: number
  load: number
  report: string
}

function check(name: string, jobs: number, cacheDir: string, target = docs): Run {
  const timing = path.join(work, 'time.txt')
  const load = loadavg()[0]!
  const child = spawnSync(
    '/usr/bin/time',
    ['-o', timing, '-f', '%e %U %S %M', process.execPath, '--import', tsx, bin, 'check', '--format', 'json', '--jobs', String(jobs), '--cache-dir', cacheDir, target],
    {cwd: work, encoding: 'utf8', maxBuffer: 1 << 30}
  )
  if (child.status !== 0 && child.status !== 1) throw new Error(`${name}: exit ${child.status}\n${child.stderr}`)
  const [wall, user, sys, rssKiB] = readFileSync(timing, 'utf8').trim().split('\n').at(-1)!.split(' ').map(Number)
  const run = {name, wall: wall!, cpu: user! + sys!, maxRssMiB: rssKiB! / 1024, load, report: child.stdout}
  console.log(`${name.padEnd(22)} wall ${run.wall.toFixed(2).padStart(7)} s  cpu ${run.cpu.toFixed(2).padStart(7)} s  peak RSS ${run.maxRssMiB.toFixed(0).padStart(5)} MiB  (load ${load.toFixed(1)})`)
  return run
}

// The fixed cost of a process that loads the CLI from its TypeScript sources and finds no file.
const empty = path.join(work, 'empty')
mkdirSync(empty)
const startup = check('startup (no files)', 1, path.join(work, 'cache-0'), empty)
const cacheOne = path.join(work, 'cache-1')
const cacheTwo = path.join(work, 'cache-2')
const coldOne = check('cold, 1 job', 1, cacheOne)
const coldTwo = check('cold, 2 jobs', 2, cacheTwo)
const warmOne = check('warm, 1 job', 1, cacheOne)
const warmTwo = check('warm, 2 jobs', 2, cacheTwo)

// A one-line edit: a new edge in the first diagram of one page; only that diagram is recomputed.
const edited = tree.files[Math.floor(tree.files.length / 2)]!
const text = readFileSync(edited, 'utf8')
writeFileSync(edited, text.replace(/(```upright[^\n]*\n|:::upright[^\n]*\n)/, '$1fresh-a -> fresh-b\n'))
const afterEdit = check('warm after an edit, 1 job', 1, cacheOne)
writeFileSync(edited, text)

for (const run of [coldTwo, warmOne, warmTwo]) {
  if (run.report !== coldOne.report) throw new Error(`${run.name}: report differs from the cold single-job run`)
}
const summary = JSON.parse(coldOne.report).summary as {diagrams: number; passed: number; failed: number}
console.log(`reports identical across runs: ${summary.diagrams} diagrams, ${summary.passed} passed, ${summary.failed} failed`)
console.log(`warm speed-up (1 job): ${(coldOne.wall / warmOne.wall).toFixed(1)}x wall; (2 jobs): ${(coldTwo.wall / warmTwo.wall).toFixed(1)}x wall`)
const net = (r: Run) => Math.max(0.01, r.wall - startup.wall)
console.log(`warm speed-up net of the ${startup.wall.toFixed(2)} s startup (1 job): ${(net(coldOne) / net(warmOne)).toFixed(1)}x; cpu ratio ${(coldOne.cpu / warmOne.cpu).toFixed(1)}x`)
console.log(`worker speed-up, cold: ${(coldOne.wall / coldTwo.wall).toFixed(2)}x wall (cpu ${coldOne.cpu.toFixed(1)} s vs ${coldTwo.cpu.toFixed(1)} s)`)
console.log(`edit rebuild: ${afterEdit.wall.toFixed(2)} s (${(coldOne.wall / afterEdit.wall).toFixed(1)}x faster than cold)`)
console.log(`machine: ${cpus().length} cores, load average now ${loadavg().map((l) => l.toFixed(1)).join(' ')}`)
rmSync(work, {recursive: true, force: true})
