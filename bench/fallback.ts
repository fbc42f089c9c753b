/**
 * `pnpm bench fallback [--quick] [--limit N]`: the marked fallback drawing (packages/core/src/fallback)
 * against @dagrejs/dagre (a general-purpose layered layout) on graphs that have no upward planar
 * drawing, same graphs, same box sizes and gaps, in one run.
 *
 * Graphs: the North DAGs (/work/shared/data/north, see SOURCE.md there) that the exact test finds not
 * upward planar (planar or not), and the Rome graphs (/work/shared/data/rome, see SOURCE.md there)
 * oriented from the lower to the higher vertex number, those not upward planar. Per graph: edges
 * removed (inserted afterwards), crossings of our drawing and of dagre's (layoutStats, counted
 * geometrically on both), and the ratio.
 */
import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {dagreLayout, type Box} from './support/dagre-layout.ts'
import {createDigraph, type Digraph} from '../packages/core/src/graph/digraph.ts'
import {testUpwardPlanarity} from '../packages/core/src/upward/index.ts'
import {layoutStats, type Layout} from '../packages/core/src/layout/index.ts'
import {layoutFallback} from '../packages/core/src/fallback/index.ts'
import {readGraphml} from '../packages/core/test/support/graphml.ts'
import {labelBox} from '../packages/core/src/measure/index.ts'

const args = process.argv.slice(2)
const quick = args.includes('--quick')
const limitAt = args.indexOf('--limit')
const limit = limitAt >= 0 ? Number(args[limitAt + 1]) : quick ? 40 : Infinity
const strideAt = args.indexOf('--rome-stride')
/** Every k-th Rome file (sorted by name) is tried; default 3, to keep a run near ten minutes. */
const romeStride = strideAt >= 0 ? Number(args[strideAt + 1]) : 3

function boxesFor(n: number): Box[] {
  return Array.from({length: n}, (_, v) => {
    const b = labelBox(v % 7 === 3 ? `item ${v}\nsecond line` : `item ${v}`)
    return {width: b.width, height: b.height}
  })
}

interface Row {set: string; name: string; n: number; m: number; removed: number; against: number; ours: number; dummies: number; dagre: number; ms: number}

function run(set: string, dir: string, orient: (edges: [number, number][]) => [number, number][], stride = 1): Row[] {
  const rows: Row[] = []
  const files = readdirSync(dir).filter((f) => f.endsWith('.graphml')).sort().filter((_, i) => i % stride === 0)
  for (const file of files) {
    if (rows.length >= limit) break
    const {vertexCount, edges} = readGraphml(join(dir, file))
    const g = createDigraph(vertexCount, orient(edges))
    const verdict = testUpwardPlanarity(g, {maxMillis: 5000})
    if (verdict.status !== 'not-upward') continue
    const boxes = boxesFor(vertexCount)
    const t0 = performance.now()
    const ours = layoutFallback(g, {flow: 'up', boxes, budget: {maxMillis: 20000}})
    const ms = performance.now() - t0
    const theirs = dagreLayout(g, boxes)
    rows.push({set, name: file, n: vertexCount, m: g.edgeCount, removed: ours.inserted.length, against: ours.reversed.length, ours: layoutStats(ours.layout).crossings, dummies: ours.crossings, dagre: layoutStats(theirs).crossings, ms})
    if (rows.length % 50 === 0) process.stderr.write(`${set}: ${rows.length} graphs\n`)
  }
  return rows
}

const north = run('north', '/work/shared/data/north', (e) => e)
const rome = run('rome', '/work/shared/data/rome', (e) => e.map(([a, b]) => (a < b ? [a, b] : [b, a])), romeStride)

function summary(label: string, rows: Row[]): void {
  const fewer = rows.filter((r) => r.ours < r.dagre).length
  const equal = rows.filter((r) => r.ours === r.dagre).length
  const more = rows.filter((r) => r.ours > r.dagre)
  const worst = rows.reduce((w, r) => Math.max(w, r.dagre === 0 ? (r.ours === 0 ? 0 : Infinity) : r.ours / r.dagre), 0)
  const sum = (f: (r: Row) => number): number => rows.reduce((s, r) => s + f(r), 0)
  console.log(`${label}: ${rows.length} graphs; fewer crossings than dagre on ${fewer} (${((100 * fewer) / Math.max(1, rows.length)).toFixed(1)}%), equal on ${equal}, more on ${more.length}; worst ratio ours/dagre ${worst.toFixed(2)}`)
  console.log(`  edges removed: total ${sum((r) => r.removed)}, mean ${(sum((r) => r.removed) / Math.max(1, rows.length)).toFixed(2)}; crossings total ours ${sum((r) => r.ours)}, dagre ${sum((r) => r.dagre)}; our time mean ${(sum((r) => r.ms) / Math.max(1, rows.length)).toFixed(1)} ms`)
  const against = rows.filter((r) => r.against > 0)
  console.log(`  graphs with an edge drawn against the flow (only if no feasible subgraph was found in the budget): ${against.length}, edges ${against.reduce((s, r) => s + r.against, 0)}; geometric crossings differ from dummy count on ${rows.filter((r) => r.ours !== r.dummies).length}`)
  for (const r of more.slice(0, 10)) console.log(`  more: ${r.name} n=${r.n} m=${r.m} removed=${r.removed} ours=${r.ours} dagre=${r.dagre}`)
}
if (args.includes('--rows')) for (const r of [...north, ...rome]) console.log(`${r.set} ${r.name} n=${r.n} m=${r.m} removed=${r.removed} against=${r.against} ours=${r.ours} dummies=${r.dummies} dagre=${r.dagre} ${r.ms.toFixed(0)}ms`)
summary('North DAGs, not upward planar', north)
summary('Rome graphs by vertex number, not upward planar', rome)
summary('all', [...north, ...rome])
