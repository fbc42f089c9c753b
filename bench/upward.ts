/**
 * `pnpm bench upward [--budget MS] [--runs K] [--stress] [--thinned N [--against DIR]]`: the exact
 * upward-planarity test on every North DAG (/work/shared/data/north, see its SOURCE.md), timed per graph. Prints median, p95, max and total,
 * the same per size decade, counts per answer and per deciding method, and as a reference in the same
 * run the linear-time planarity test on the same graphs (ratio of totals).
 * One untimed pass warms the JIT first; each graph's time is the best of K runs (default 3).
 */
import {readdirSync, readFileSync} from 'node:fs'
import {createDigraph, type Digraph} from '../packages/core/src/graph/digraph.ts'
import {testPlanarity} from '../packages/core/src/planarity/index.ts'
import {findMinimalObstruction, testUpwardPlanarity} from '../packages/core/src/upward/index.ts'
import {numberOption} from './support/number-option.ts'

const dir = '/work/shared/data/north'
const budget = numberOption('--budget', 3000)
const runs = numberOption('--runs', 3)

function read(file: string): Digraph {
  const text = readFileSync(`${dir}/${file}`, 'utf8')
  const ids = new Map<string, number>()
  for (const m of text.matchAll(/<node\s[^>]*\bid="([^"]+)"/g)) ids.set(m[1]!, ids.size)
  const edges: Array<[number, number]> = []
  for (const m of text.matchAll(/<edge\s[^>]*>/g)) {
    const s = /\bsource="([^"]+)"/.exec(m[0])![1]!, t = /\btarget="([^"]+)"/.exec(m[0])![1]!
    edges.push([ids.get(s)!, ids.get(t)!])
  }
  return createDigraph(ids.size, edges)
}

// --thinned N: only time the single-source route on bench/growth.ts's "thinned" family (a k×k grid
// with one diagonal per cell, seed 78, every vertex keeping one random in-edge and each other edge
// surviving with probability 1/2, seed 79: one source, many sinks, upward planar), budget --budget.
const thinned = numberOption('--thinned', 0)
if (thinned > 0) {
  // The growth bench's thinned family, same seeds: one random in-edge per vertex kept, half the rest.
  const {singleSource, stGrid} = await import('./support/grid-families.ts')
  const fam = singleSource(stGrid(thinned, 78), 79)
  const g = createDigraph(fam.n, fam.edges)
  // --runs K: K fresh calls in this process (the first one pays for JIT warm-up, as a CLI run
  // does); CPU time beside wall time, since on a shared machine the wall clock counts waiting.
  // --against DIR: A/B with the upward test of another checkout (e.g. `git worktree add DIR REV`,
  // node_modules linked), the two called alternately in this process, the order swapped each run.
  const {loadavg} = await import('node:os')
  const againstAt = process.argv.indexOf('--against')
  const contenders: Array<[string, typeof testUpwardPlanarity]> = [['this checkout', testUpwardPlanarity]]
  if (againstAt !== -1) {
    const dir = process.argv[againstAt + 1]!
    const other = (await import(`${dir}/packages/core/src/upward/index.ts`)) as {testUpwardPlanarity: typeof testUpwardPlanarity}
    contenders.push([dir, other.testUpwardPlanarity])
  }
  for (let run = 1; run <= numberOption('--runs', 1); run++) {
    for (const [name, test] of run % 2 === 1 ? contenders : [...contenders].reverse()) {
      const t0 = performance.now()
      const c0 = process.cpuUsage()
      const r = test(g, {maxMillis: budget})
      const ms = performance.now() - t0
      const cpu = process.cpuUsage(c0)
      console.log(
        `thinned single-source grid: ${g.vertexCount} vertices, ${g.edgeCount} edges, budget ${budget} ms: ${r.status}${r.status === 'undecided' ? '' : ` (${r.method})`} ` +
          `in ${(ms / 1000).toFixed(2)} s (cpu ${((cpu.user + cpu.system) / 1e6).toFixed(2)} s; run ${run}${contenders.length > 1 ? `, ${name}` : ''})`
      )
    }
  }
  console.log(`load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}`)
  process.exit(0)
}

const files = readdirSync(dir).filter((f) => f.endsWith('.graphml')).sort()
const graphs = files.map((f) => ({file: f, g: read(f)}))

const time = (fn: () => unknown): number => {
  let best = Infinity
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now()
    fn()
    best = Math.min(best, performance.now() - t0)
  }
  return best
}

for (const {g} of graphs) testUpwardPlanarity(g, {maxMillis: budget}) // warm-up
const rows = graphs.map(({file, g}) => {
  const r = testUpwardPlanarity(g, {maxMillis: budget})
  const ms = time(() => testUpwardPlanarity(g, {maxMillis: budget}))
  const ref = time(() => testPlanarity(g))
  const label = r.status === 'undecided' ? 'undecided' : r.status === 'upward' ? 'upward' : r.reason === 'nonplanar' ? 'nonplanar' : 'planar, not upward'
  let sources = 0
  for (let v = 0; v < g.vertexCount; v++) if (g.inStart[v + 1] === g.inStart[v]) sources++
  return {file, n: g.vertexCount, ms, ref, label, method: r.status === 'undecided' ? 'budget' : r.method, single: sources === 1}
})

const stats = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b)
  const q = (p: number) => s[Math.min(s.length - 1, Math.floor(p * s.length))] ?? 0
  return {count: s.length, median: q(0.5), p95: q(0.95), max: s[s.length - 1] ?? 0, total: s.reduce((a, b) => a + b, 0)}
}
const fmt = (x: number) => x.toFixed(x < 10 ? 2 : 1).padStart(8)
const line = (name: string, xs: number[]) => {
  const s = stats(xs)
  return `${name.padEnd(22)} ${String(s.count).padStart(5)} ${fmt(s.median)} ${fmt(s.p95)} ${fmt(s.max)} ${fmt(s.total)}`
}
const header = `${'graphs (ms)'.padEnd(22)} ${'count'.padStart(5)} ${'median'.padStart(8)} ${'p95'.padStart(8)} ${'max'.padStart(8)} ${'total'.padStart(8)}`

console.log(`upward planarity on ${rows.length} North DAGs, budget ${budget} ms, best of ${runs}`)
console.log(header)
console.log(line('all', rows.map((r) => r.ms)))
for (const label of ['upward', 'planar, not upward', 'nonplanar', 'undecided']) {
  const xs = rows.filter((r) => r.label === label).map((r) => r.ms)
  if (xs.length > 0) console.log(line(label, xs))
}
console.log(line('planar only', rows.filter((r) => r.label !== 'nonplanar').map((r) => r.ms)))
console.log('\nby size (vertices)')
for (let lo = 10; lo <= 100; lo += 10) {
  const xs = rows.filter((r) => r.n >= lo && r.n < lo + 10).map((r) => r.ms)
  if (xs.length > 0) console.log(line(`${lo}-${lo + 9}`, xs))
}
console.log('\nby deciding method')
for (const method of [...new Set(rows.map((r) => r.method))].sort()) {
  console.log(line(method, rows.filter((r) => r.method === method).map((r) => r.ms)))
}
// One source: decided in polynomial time (single-source.ts) unless reductions settle them first.
console.log('\nsingle-source DAGs, by deciding method')
for (const method of [...new Set(rows.filter((r) => r.single).map((r) => r.method))].sort()) {
  console.log(line(method, rows.filter((r) => r.single && r.method === method).map((r) => r.ms)))
}
console.log(line('all single-source', rows.filter((r) => r.single).map((r) => r.ms)))
const ref = stats(rows.map((r) => r.ref)).total
const tot = stats(rows.map((r) => r.ms)).total
console.log(`\nreference: planarity test alone, total ${ref.toFixed(1)} ms; upward / planarity = ${(tot / ref).toFixed(2)}`)
console.log('slowest:', [...rows].sort((a, b) => b.ms - a.ms).slice(0, 5).map((r) => `${r.file} ${r.ms.toFixed(1)} ms (${r.method})`).join(', '))

// Minimal obstructions for the planar DAGs that are not upward (one run each).
const noRows = rows.filter((r) => r.label === 'planar, not upward')
const obs = noRows.map((r) => {
  const g = graphs.find((x) => x.file === r.file)!.g
  const t0 = performance.now()
  const o = findMinimalObstruction(g, {maxMillis: 10 * budget})
  return {ms: performance.now() - t0, size: o.ok ? o.edges.length : -1}
})
if (obs.length > 0) {
  console.log(`\nminimal obstructions for the ${obs.length} planar, not upward DAGs (deletion filter)`)
  console.log(header)
  console.log(line('obstruction', obs.map((o) => o.ms)))
  const sizes = obs.map((o) => o.size)
  console.log(`edges per obstruction: min ${Math.min(...sizes)}, median ${stats(sizes).median}, max ${Math.max(...sizes)}; failed: ${sizes.filter((s) => s < 0).length}`)
}

// --stress: harder inputs than the North set, to see how the budget holds. Random orientations
// (random vertex order) of (a) the planar Rome graphs (/work/shared/data/rome, see its SOURCE.md),
// every other file, and (b) random planar st-graphs' underlying graphs with a random share of edges.
if (process.argv.includes('--stress')) {
  const {mulberry32, randomPlanarStGraph} = await import('../packages/core/test/support/random-st.ts')
  const orient = (n: number, edges: ReadonlyArray<readonly [number, number]>, rnd: () => number) => {
    const rank = Array.from({length: n}, (_, i) => i)
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(rnd() * (i + 1))
      ;[rank[i], rank[j]] = [rank[j]!, rank[i]!]
    }
    return createDigraph(n, edges.map(([a, b]) => (rank[a]! < rank[b]! ? [a, b] : [b, a]) as [number, number]))
  }
  const report = (name: string, gs: Digraph[]) => {
    const tally: Record<string, number> = {}
    const ms: number[] = []
    for (const g of gs) {
      const t0 = performance.now()
      const r = testUpwardPlanarity(g, {maxMillis: budget})
      ms.push(performance.now() - t0)
      const key = r.status === 'not-upward' ? r.reason : r.status
      tally[key] = (tally[key] ?? 0) + 1
    }
    console.log(line(name, ms), JSON.stringify(tally))
  }
  console.log(`\nstress (one run each, budget ${budget} ms)`)
  console.log(header)
  const romeDir = '/work/shared/data/rome'
  const rnd = mulberry32(5)
  const rome = readdirSync(romeDir).filter((f) => f.endsWith('.graphml')).sort().filter((_, i) => i % 2 === 0)
  const romeGraphs: Digraph[] = []
  for (const f of rome) {
    const text = readFileSync(`${romeDir}/${f}`, 'utf8')
    const ids = new Map<string, number>()
    for (const m of text.matchAll(/<node\s[^>]*\bid="([^"]+)"/g)) ids.set(m[1]!, ids.size)
    const edges = [...text.matchAll(/<edge\s[^>]*>/g)].map((m) => [ids.get(/\bsource="([^"]+)"/.exec(m[0])![1]!)!, ids.get(/\btarget="([^"]+)"/.exec(m[0])![1]!)!] as const)
    const g = orient(ids.size, edges, rnd)
    if (testPlanarity(g).planar) romeGraphs.push(g)
  }
  report('rome planar, oriented', romeGraphs)
  for (const n of [20, 40, 60]) {
    const gs: Digraph[] = []
    for (let seed = 1; seed <= 40; seed++) {
      const st = randomPlanarStGraph(seed * 7 + n, n)
      const r = mulberry32(seed)
      const keep = 0.5 + 0.5 * r()
      gs.push(orient(st.vertexCount, st.edges.filter(() => r() < keep), r))
    }
    report(`planar n=${n}, oriented`, gs)
  }
}
