/**
 * `pnpm bench growth [--max N]`: time against size for each stage, on generated families from 10 to
 * 10^5 vertices (default --max 100000), printed as a table with the fitted exponent per stage
 * (least squares on log-log), and drawn to bench/growth.svg by bench/growth-chart.ts.
 *
 * Families (seeded, linear-time to generate, planar by construction):
 *  - st: a k×m grid, edges rightward and upward, one diagonal per cell (either way), oriented by the
 *    potential i + (k+1)·j, so it is acyclic with one source (0,0) and one sink (k−1,m−1), both on
 *    the outer face: a planar st-graph, hence upward planar (Di Battista & Tamassia 1988; Kelly 1987).
 *  - single-source, st minus sink: the st family without its sink, so the vertices next to it become
 *    sinks: one source, a few sinks, upward planar (a subgraph of an upward planar graph).
 *  - single-source, thinned: every vertex keeps one random in-edge and each further edge survives
 *    with probability 1/2. Still reachable from (0,0), so one source, many sinks; upward planar.
 *  - general: the st family with each edge kept with probability 0.6: many sources and sinks.
 * Stages: planarity (st family), upward test on the single-source families (budget 10 s) and the
 * general family (budget 3 s), layout = drawDiagram (label boxes, st-augmentation, layout) and SVG = renderSvg (with
 * svgo), both on the st family. Best of 5 runs up to 1,000 vertices, of 2 up to 10,000, then 1 (and
 * 1 whenever a run takes over a second). A stage stops growing once one size took over 20 s or
 * answered undecided. `--budget-only` runs only the short-budget checks at 10,000 vertices.
 */
import {writeFileSync} from 'node:fs'
import {cpus, loadavg} from 'node:os'
import {fileURLToPath} from 'node:url'
import {checkDiagram, createDigraph, drawDiagram, parseDiagram, testPlanarity, testUpwardPlanarity, type Digraph} from '../packages/core/src/index.ts'
import {renderSvg} from '../packages/svg/src/index.ts'
import {fitExponent, logLogChart} from './growth-chart.ts'
import {mulberry32 as prng} from '../test/support/random.ts'
import {general, singleSource, stGrid, withoutSink, type Family} from './support/grid-families.ts'

const args = process.argv.slice(2)
const maxIndex = args.indexOf('--max')
const max = maxIndex >= 0 ? Number(args[maxIndex + 1]) : 100_000
// --budget-only: just the short-budget runs at 10,000 vertices (see budgetNotes), no table or chart.
const budgetOnly = args.includes('--budget-only')
const sizes = [10, 30, 100, 300, 1000, 3000, 10_000, 30_000, 100_000].filter((n) => n <= max)
const noLimits = {maxVertices: Infinity, maxEdges: Infinity, maxTextBytes: Infinity, maxLineLength: Infinity, maxLabelLength: Infinity}


/** Diagram text with vertex names shuffled and edges in shuffled order, so input order helps nothing. */
function text(f: Family, seed: number): string {
  const rnd = prng(seed)
  const name = Array.from({length: f.n}, (_, i) => i)
  for (let i = name.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1))
    ;[name[i], name[j]] = [name[j]!, name[i]!]
  }
  const lines = f.edges.map(([a, b]) => `v${name[a]} -> v${name[b]}`)
  for (let i = lines.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1))
    ;[lines[i], lines[j]] = [lines[j]!, lines[i]!]
  }
  return lines.join('\n')
}

const digraph = (f: Family): Digraph => createDigraph(f.n, f.edges)

function best<T>(runs: number, fn: () => T): {ms: number; value: T} {
  let ms = Infinity
  let value: T | undefined
  for (let r = 0; r < runs; r++) {
    const t = performance.now()
    value = fn()
    ms = Math.min(ms, performance.now() - t)
    if (ms > 1000) break
  }
  return {ms, value: value!}
}

const stages = ['planarity', 'single-source test, st minus sink', 'single-source test, thinned', 'general test', 'layout', 'SVG'] as const
type Stage = (typeof stages)[number]
const results = new Map<Stage, Array<{n: number; ms: number; note?: string}>>(stages.map((s) => [s, []]))
const stopped = new Set<Stage>()
const notes: string[] = []
const capMs = 20_000

for (const target of budgetOnly ? [] : sizes) {
  const runs = target <= 1000 ? 5 : target <= 10_000 ? 2 : 1
  const st = stGrid(target, target)
  const ss = singleSource(st, target + 1)
  const gen = general(st, target + 2)
  const record = (stage: Stage, n: number, ms: number, note?: string) => {
    results.get(stage)!.push(note === undefined ? {n, ms} : {n, ms, note})
    if (ms > capMs) stopped.add(stage)
    process.stdout.write(`  ${stage.padEnd(34)} n=${String(n).padStart(6)}  ${ms.toFixed(2).padStart(10)} ms${note ? `  (${note})` : ''}\n`)
  }
  if (!stopped.has('planarity')) {
    const g = digraph(st)
    const r = best(runs, () => testPlanarity(g))
    if (!r.value.planar) throw new Error('st family must be planar')
    record('planarity', st.n, r.ms)
  }
  for (const [stage, fam] of [
    ['single-source test, st minus sink', withoutSink(st)],
    ['single-source test, thinned', ss]
  ] as const) {
    if (stopped.has(stage)) continue
    const g = digraph(fam)
    const r = best(runs, () => testUpwardPlanarity(g, {maxMillis: 10_000}))
    if (r.value.status === 'not-upward') throw new Error('single-source family must be upward planar')
    record(stage, fam.n, r.ms, r.value.status === 'upward' ? undefined : r.value.status)
    if (r.value.status === 'undecided') stopped.add(stage)
  }
  if (!stopped.has('general test')) {
    const g = digraph(gen)
    const r = best(runs, () => testUpwardPlanarity(g, {maxMillis: 3000}))
    if (r.value.status === 'not-upward') throw new Error('general family must be upward planar')
    record('general test', gen.n, r.ms, r.value.status === 'upward' ? undefined : r.value.status)
    if (r.value.status === 'undecided') stopped.add('general test')
  }
  if (!stopped.has('layout') || !stopped.has('SVG')) {
    const check = checkDiagram(text(st, target + 3), {budgetMillis: 60_000, limits: noLimits})
    if (check.status !== 'upward') throw new Error(`st family: check said ${check.status}`)
    const drawn = best(stopped.has('layout') ? 1 : runs, () => drawDiagram(check, {flow: 'up'}))
    if (!drawn.value.ok) throw new Error('drawing failed')
    const drawing = drawn.value.drawing
    if (!stopped.has('layout')) record('layout', st.n, drawn.ms)
    if (!stopped.has('SVG')) {
      const input = {layout: drawing.layout, graph: check.graph!, labels: drawing.labels, ids: drawing.ids}
      const r = best(target <= 10_000 ? runs : 1, () => renderSvg(input))
      record('SVG', st.n, r.ms, `${(r.value.svg.length / 1024).toFixed(0)} KiB`)
    }
  }
}

// Whole-text checks at 10,000 vertices (limits raised): decided and drawn, and a general diagram
// too hard for a small budget answers undecided instead of running on.
if (max >= 10_000) {
  for (const [name, fam] of budgetOnly ? [] : [
    ['st-planar', stGrid(10_000, 77)],
    ['single-source (st minus sink)', withoutSink(stGrid(10_000, 78))],
    ['single-source (thinned)', singleSource(stGrid(10_000, 78), 79)]
  ] as const) {
    const t = performance.now()
    const check = checkDiagram(text(fam, 80), {budgetMillis: 20_000, limits: noLimits})
    const checked = performance.now() - t
    const drawn = drawDiagram(check, {flow: 'up'})
    const drawnAt = performance.now() - t
    const svg = drawn.ok ? renderSvg({layout: drawn.drawing.layout, graph: check.graph!, labels: drawn.drawing.labels, ids: drawn.drawing.ids}).svg : ''
    const total = performance.now() - t
    notes.push(
      `${name}, ${fam.n} vertices, ${fam.edges.length} edges: ${check.status}; check ${(checked / 1000).toFixed(2)} s, drawn by ${(drawnAt / 1000).toFixed(2)} s, SVG (${(svg.length / 1048576).toFixed(1)} MiB) by ${(total / 1000).toFixed(2)} s`
    )
  }
  budgetNotes()
}

/**
 * A general diagram of 10,000 vertices with short budgets (50 ms is shorter than the parse alone):
 * the check answers `undecided` once the deadline passes, at the next stage boundary or inside the
 * parse (which looks every 256 lines); the parse's time is printed beside (the best of three,
 * parsed alone).
 */
function budgetNotes(): void {
  const hard = general(stGrid(10_000, 81), 82)
  const source = text(hard, 83)
  const parse = best(3, () => parseDiagram(source, {maxEdges: Infinity}))
  for (const budgetMillis of [50, 200, 1000]) {
    for (let r = 0; r < 3; r++) {
      const t = performance.now()
      const cpu = process.cpuUsage()
      const check = checkDiagram(source, {budgetMillis, limits: noLimits})
      const used = process.cpuUsage(cpu)
      // CPU time beside wall time: on a loaded machine the wall clock also counts waiting for a core.
      notes.push(
        `general, ${hard.n} vertices, ${hard.edges.length} edges, budget ${budgetMillis} ms: ${check.status} after ${(performance.now() - t).toFixed(0)} ms, ` +
          `cpu ${((used.user + used.system) / 1000).toFixed(0)} ms (run ${r + 1}; parsing alone ${parse.ms.toFixed(0)} ms)`
      )
    }
  }
}
if (budgetOnly) {
  for (const n of notes) console.log(n)
  console.log(`machine: ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}`)
  process.exit(0)
}

console.log('\ntime (ms, best of runs) by stage and vertex count\n')
const header = ['stage', ...sizes.map((n) => `~${n}`), 'exponent']
const rows = stages.map((stage) => {
  const points = results.get(stage)!
  const cells = sizes.map((_, i) => {
    const p = points[i]
    return p ? `${p.ms < 10 ? p.ms.toFixed(2) : p.ms.toFixed(0)}${p.note && !p.note.endsWith('KiB') ? ` (${p.note})` : ''}` : '—'
  })
  // Fit only where the clock resolves the time well (≥ 0.05 ms) and the answer was decided.
  const fit = fitExponent(points.filter((p) => p.ms >= 0.05 && p.note !== 'undecided').map((p) => [p.n, p.ms] as [number, number]))
  return [stage, ...cells, fit === undefined ? '—' : fit.toFixed(2)]
})
const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)))
const line = (cells: string[]) => `| ${cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join(' | ')} |`
console.log(line(header))
console.log(`|${widths.map((w, i) => (i === 0 ? '-'.repeat(w + 2) : `${'-'.repeat(w + 1)}:`)).join('|')}|`)
for (const r of rows) console.log(line(r))
for (const n of notes) console.log(`\n${n}`)
console.log(`\nmachine: ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}`)

const colours = ['#2e5e57', '#b5562c', '#c08a2a', '#6b4fa0', '#2f6fb0', '#8a7a12']
const chart = logLogChart(
  stages.map((stage, i) => ({
    name: `${stage} (k=${rows[i]!.at(-1)})`,
    colour: colours[i]!,
    points: results.get(stage)!.filter((p) => p.note !== 'undecided').map((p) => [p.n, p.ms] as [number, number])
  })),
  {title: 'Upright: time against diagram size (log-log)', xLabel: 'vertices', yLabel: 'time (ms, best of runs)'}
)
const out = fileURLToPath(new URL('./growth.svg', import.meta.url))
writeFileSync(out, chart)
console.log(`chart: ${out}`)
