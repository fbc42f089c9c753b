/**
 * `pnpm bench svg [--max N]`: time of renderSvg (build hast → to-html → svgo → back to hast → to-html)
 * on generated grid layouts of 100 … 10,000 vertices, in CPU milliseconds (steadier than wall time on
 * a shared machine), with two references measured in the same run on the same unoptimized SVG text:
 *  - svgo's preset-default (with our three accessibility/theming overrides), the pass list a caller
 *    would reach for first;
 *  - to-html alone (writing the bytes, no optimization), the floor.
 * The layouts are hand-made grids (each vertex points to the one above and the one above-right), so
 * this measures the renderer only; the layout's own bench is bench/layout.ts.
 */
import {createDigraph} from '../packages/core/src/graph/digraph.ts'
import {labelBox} from '../packages/core/src/measure/index.ts'
import {optimizeSvg, renderSvg, unoptimizedSvg, type RenderInput} from '../packages/svg/src/render-svg.ts'

const maxArg = process.argv.indexOf('--max')
const max = maxArg >= 0 ? Number(process.argv[maxArg + 1]) : 10_000
const presetMax = 10_000

function grid(n: number): RenderInput {
  const cols = Math.ceil(Math.sqrt(n))
  const labels = Array.from({length: n}, (_, i) => (i % 7 === 0 ? `Store ${i}\nannex` : `Store ${i}`))
  const boxes = labels.map((l) => labelBox(l))
  const colWidth = Math.max(...boxes.map((b) => b.width)) + 24
  const rowHeight = Math.max(...boxes.map((b) => b.height)) + 40
  const rows = Math.ceil(n / cols)
  const nodes = boxes.map((b, v) => ({
    vertex: v,
    x: colWidth / 2 + (v % cols) * colWidth,
    y: rowHeight / 2 + (rows - 1 - Math.floor(v / cols)) * rowHeight,
    width: b.width,
    height: b.height
  }))
  const pairs: Array<[number, number]> = []
  for (let v = 0; v < n; v++) {
    if (v + cols < n) pairs.push([v, v + cols])
    if (v % cols !== cols - 1 && v + cols + 1 < n) pairs.push([v, v + cols + 1])
  }
  const edges = pairs.map(([t, h], e) => {
    const a = nodes[t]!
    const b = nodes[h]!
    const start: [number, number] = [a.x, a.y - a.height / 2]
    const end: [number, number] = [b.x, b.y + b.height / 2]
    const mid = (start[1] + end[1]) / 2
    return {edge: e, points: a.x === b.x ? [start, end] : [start, [a.x, mid] as [number, number], [b.x, mid] as [number, number], end]}
  })
  return {
    layout: {flow: 'up', width: cols * colWidth, height: rows * rowHeight, nodes, edges},
    graph: createDigraph(n, pairs),
    labels,
    ids: labels.map((_, i) => `s${i}`)
  }
}

/** Best of `runs` CPU times (user + system), ms. */
function cpu<T>(run: () => T, runs = 3): {ms: number; value: T} {
  let best = Infinity
  let value: T | undefined
  for (let i = 0; i < runs; i++) {
    const start = process.cpuUsage()
    value = run()
    const used = process.cpuUsage(start)
    best = Math.min(best, (used.user + used.system) / 1000)
  }
  return {ms: best, value: value!}
}

console.log('| vertices | edges | renderSvg ms | bytes | preset-default ms | bytes | preset / ours | to-html only ms | ours / to-html |')
console.log('|---:|---:|---:|---:|---:|---:|---:|---:|---:|')
renderSvg(grid(300)) // warm-up (JIT)
renderSvg(grid(300))
for (const n of [100, 300, 1000, 3000, 10000].filter((k) => k <= max)) {
  const input = grid(n)
  const ours = cpu(() => renderSvg(input))
  const raw = cpu(() => unoptimizedSvg(input))
  const preset = n <= presetMax ? cpu(() => optimizeSvg(raw.value.svg, raw.value.precision, 'preset-default')) : undefined
  console.log(
    `| ${n} | ${input.layout.edges.length} | ${ours.ms.toFixed(0)} | ${ours.value.svg.length} | ` +
      `${preset ? preset.ms.toFixed(0) : '—'} | ${preset ? preset.value.length : '—'} | ${preset ? (preset.ms / ours.ms).toFixed(1) : '—'} | ` +
      `${raw.ms.toFixed(0)} | ${(ours.ms / raw.ms).toFixed(1)} |`
  )
}
