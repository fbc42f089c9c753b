/**
 * `npx tsx bench/area-bound.ts [--tests N] [--steps N] [NAME…]`: for North DAGs (/work/shared/data/north,
 * see SOURCE.md there; NAME without .graphml), a lower bound on the area of ANY crossing-free layered
 * drawing with the layout bench's boxes and gaps (boxes on rows, an edge bending once on every row it
 * passes, the separations of coordinates.ts and the bands of banded-drawing.ts; our st-layout and level
 * drawings are such drawings), against dagre's area (bench/support/dagre-layout.ts) and ours
 * (layoutSmallest). Default: the graphs bench/layout.ts lists as larger than dagre's, found the same way
 * (every upward planar North DAG, the same boxes, flow up).
 *
 * Per row count k, from G's longest path up: a drawing with k rows is at least leastHeight(k) high
 * (row-bound.ts) and as wide as its widest row, and every row at least leastRowWidth wide; so its area
 * is at least leastHeight(k) times the least widest row over all level-planar assignments within k
 * rows. That least widest row is bracketed by searchLevels with the 'least' row-width estimate, each
 * answer a find (an assignment, the upper end) or a proven "none" (the lower end): first at dagre's
 * area over leastHeight(k) (the question: could a k-row drawing beat dagre's?), then halving the
 * bracket. Without a search, the widest row of k rows is at least the widest box and at least the
 * average row: all box extents plus, between consecutive boxes, the smaller of a box gap and two edge
 * gaps, over k rows. Row counts stop where leastHeight(k) times the widest box reaches dagre's area
 * (every larger k is out of reach). Each search gets `--tests` level tests (default 20,000) and
 * `--steps` levels tried (default 1,000,000), deterministic counts; a search that runs out leaves its
 * bracket open ("unknown (budget)").
 *
 * `--heights`: each row count asks the deciding question once, with searchLevels's area bound as well
 * (the widest row by the least width times the rows' real heights, each row as tall as its tallest
 * box, plus the layer gaps; RowWidthBound.area, a lower bound on the drawn area), asked below a hair
 * more than dagre's area: a "none" proves that no k-row drawing is at most dagre's area (the layout
 * bench's target, "no more than"), however its tall boxes share rows; no halving after.
 *
 * Verdict per graph: "out of reach (proved)" when every k is proved at least dagre's area; "room: a
 * k-row assignment with rows at most W exists" when some search found an assignment whose widest
 * row times leastHeight(k) is below dagre's area (its own drawing, by layoutLevels with the orders the
 * search found, printed beside it and through the geometric checker of the tests: the bound does
 * not say a drawing that small exists, the drawing may); else
 * "unknown (budget)".
 */
import {readdirSync} from 'node:fs'
import {loadavg} from 'node:os'
import {join} from 'node:path'
import {dagreLayout} from './support/dagre-layout.ts'
import {createDigraph, type Digraph} from '../packages/core/src/graph/digraph.ts'
import {testUpwardPlanarity} from '../packages/core/src/upward/index.ts'
import {stAugment, type StAugmentation} from '../packages/core/src/augment/index.ts'
import {defaultSpacing, layoutLevels, layoutSmallest, layoutStats} from '../packages/core/src/layout/index.ts'
import {longestPathUp, topologicalOrder} from '../packages/core/src/layout/layering.ts'
import {searchLevels, type LevelSearch} from '../packages/core/src/layout/level-search.ts'
import {leastHeight, leastWidth} from '../packages/core/src/layout/row-bound.ts'
import {labelBox} from '../packages/core/src/measure/index.ts'
import {readGraphml} from '../packages/core/test/support/graphml.ts'
import {checkDrawing} from '../packages/core/test/support/geometry-check.ts'
import {numberOption} from './support/number-option.ts'

const NORTH = '/work/shared/data/north'
const args = process.argv.slice(2)
const TESTS = numberOption('--tests', 20_000)
const STEPS = numberOption('--steps', 1_000_000)
const HEIGHTS = args.includes('--heights')
const names = args.filter((a, i) => !a.startsWith('--') && !(i > 0 && ['--tests', '--steps'].includes(args[i - 1]!)))
/** Halving stops when the bracket on the widest row is this narrow (px) or after this many searches. */
const TOLERANCE = 1
const MAX_PROBES = 10
/** With --heights: the relative hair above dagre's area the deciding question asks below (see `limit`). */
const AT_MOST = 1e-9
const {node: nodeGap, edge: edgeGap, layer: layerGap} = defaultSpacing
const load = (): string => loadavg().map((x) => x.toFixed(2)).join(' ')
const fmt = (x: number, d = 0): string => (Number.isFinite(x) ? x.toLocaleString('en-US', {maximumFractionDigits: d, minimumFractionDigits: d}) : '∞')

/** The layout bench's boxes (bench/layout.ts labelsFor): "item N", every seventh with a second line. */
const boxesFor = (n: number): Array<{width: number; height: number}> =>
  Array.from({length: n}, (_, v) => labelBox(v % 7 === 3 ? `item ${v}\nsecond line` : `item ${v}`)).map((b) => ({width: b.width, height: b.height}))

interface Graph {
  name: string
  g: Digraph
  st: StAugmentation
  boxes: Array<{width: number; height: number}>
  dagreArea: number
  dagreCrossings: number
  oursArea: number
}

function load1(name: string): Graph | undefined {
  const {vertexCount, edges} = readGraphml(join(NORTH, `${name}.graphml`))
  const g = createDigraph(vertexCount, edges)
  const r = testUpwardPlanarity(g)
  if (r.status !== 'upward') return undefined
  const st = stAugment(r.upward)
  const boxes = boxesFor(vertexCount)
  const dagre = dagreLayout(g, boxes)
  const ours = layoutSmallest({graph: g, st, boxes, flow: 'up'}).layout
  return {name, g, st, boxes, dagreArea: dagre.width * dagre.height, dagreCrossings: layoutStats(dagre).crossings, oursArea: ours.width * ours.height}
}

console.log(`${new Date().toISOString()}, load average ${load()}; budget per search: ${fmt(TESTS)} level tests, ${fmt(STEPS)} levels tried; gaps box ${nodeGap}, edge ${edgeGap}, layer ${layerGap}`)
let graphs: Graph[]
if (names.length > 0) graphs = names.map(load1).filter((x): x is Graph => x !== undefined)
else {
  const all = readdirSync(NORTH).filter((f) => f.endsWith('.graphml')).sort().map((f) => f.slice(0, -'.graphml'.length))
  graphs = all.map(load1).filter((x): x is Graph => x !== undefined && x.oursArea > x.dagreArea)
  console.log(`larger than dagre's (as bench/layout.ts finds them): ${graphs.length} of the upward planar North DAGs`)
}

type Verdict = 'out of reach' | 'room' | 'drawn below' | 'unknown'
const tally = new Map<Verdict, string[]>()

/** Longest path length between every two vertices (-1: none). O(n · (n + m)). */
function longestDistances(g: Digraph): Int32Array[] {
  const order = topologicalOrder(g)
  return Array.from({length: g.vertexCount}, (_, s) => {
    const d = new Int32Array(g.vertexCount).fill(-1)
    d[s] = 0
    for (const v of order) {
      if (d[v]! < 0) continue
      for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) d[g.head[g.outEdges[i]!]!] = Math.max(d[g.head[g.outEdges[i]!]!]!, d[v]! + 1)
    }
    return d
  })
}
for (const x of graphs) {
  const {g, boxes, dagreArea} = x
  const n = g.vertexCount
  const t0 = performance.now()
  const across = boxes.map((b) => b.width)
  const along = boxes.map((b) => b.height)
  const widestBox = Math.max(...across)
  const boxTotal = across.reduce((a, b) => a + b, 0)
  const between = Math.min(nodeGap, 2 * edgeGap)
  // Bends every assignment has: an edge spans at least the longest path between its ends.
  const longest = longestDistances(g)
  let bendsAtLeast = 0
  for (let e = 0; e < g.edgeCount; e++) bendsAtLeast += longest[g.tail[e]!]![g.head[e]!]! - 1
  const least = Math.max(...longestPathUp(g)) + 1
  const lines: string[] = []
  let lowerBound = Infinity
  let room: string | undefined
  let drawnBelow = false
  let open = false
  // The narrowest assignment found so far, within fewer rows (it is within k rows too).
  let best: {level: Int32Array; width: number; found: LevelSearch | undefined} | undefined
  let tail = ''
  // With --heights the question is the target's own, "at most dagre's area", asked as below a hair
  // more, so that a "none" (and a row count cut off by counting) also rules out a drawing exactly as large.
  const limit = HEIGHTS ? dagreArea * (1 + AT_MOST) : dagreArea
  for (let k = least; k <= n; k++) {
    const height = leastHeight(along, k, layerGap)
    if (height * widestBox >= limit) {
      lowerBound = Math.min(lowerBound, height * widestBox)
      tail = `; ${k}+ rows: height at least ${fmt(height)} × widest box ${fmt(widestBox)} ≥ dagre's area`
      break
    }
    const target = limit / height
    // Counting: the k rows hold every box, n − k + bends gaps of at least min(box gap, edge gap), and
    // between consecutive boxes of a row at least min(box gap, two edge gaps).
    const gaps = Math.max((n - k + bendsAtLeast) * Math.min(nodeGap, edgeGap), (n - k) * between)
    let lo = Math.max(widestBox, (boxTotal + gaps) / k)
    let hi = best?.width ?? Infinity
    let hiLevel = best?.level
    let hiOrders: LevelSearch | undefined = best?.found
    const answers: string[] = []
    let stopped = false
    let tests = 0
    let steps = 0
    const search = (below: number): LevelSearch => {
      const budget = {tests: TESTS, work: 1e12, steps: STEPS}
      const area = HEIGHTS ? {along, layerGap, below: limit} : undefined
      const bound = Number.isFinite(below) ? {across, nodeGap, edgeGap, below, estimate: 'least' as const, area} : undefined
      const r = searchLevels(g, k, budget, hiLevel, bound)
      tests += TESTS - budget.tests
      steps += STEPS - budget.steps
      return r
    }
    if (lo * height >= limit) answers.push('counting')
    else if (room) answers.push('not searched (room found)')
    else {
      // The first probe asks the question that decides the verdict; then the bracket is halved (an
      // open upper end first closed by a search without a bound).
      let asked = false
      for (let probes = 0; probes < MAX_PROBES && hi - lo > TOLERANCE; probes++) {
        let below: number
        if (!asked && lo < target && target < hi) below = target
        else below = Number.isFinite(hi) ? (lo + hi) / 2 : Infinity
        asked = true
        const r = search(below)
        if (r.status === 'stopped') {
          stopped = true
          answers.push(`stopped < ${fmt(below, 1)}`)
          break
        }
        if (r.status === 'none' && HEIGHTS && Number.isFinite(below)) {
          // No assignment at most dagre's area with the rows' real heights: every k-row drawing is
          // larger (said as lo · height); the widest row itself is not bracketed.
          answers.push(`none at most dagre's area with the rows' heights (widest < ${fmt(below, 1)})`)
          lo = below
          break
        }
        if (r.status === 'none') {
          answers.push(Number.isFinite(below) ? `none < ${fmt(below, 1)}` : 'not level planar')
          lo = below
        } else {
          hi = leastWidth(g, r.level, across, nodeGap, edgeGap)
          hiLevel = r.level
          hiOrders = r
          answers.push(`found ${fmt(hi, 1)}`)
          if (HEIGHTS && Number.isFinite(below)) break
        }
      }
    }
    if (hiLevel && hi < (best?.width ?? Infinity)) best = {level: hiLevel, width: hi, found: hiOrders}
    lowerBound = Math.min(lowerBound, lo * height)
    if (stopped && lo * height < limit) open = true
    let mark = ''
    // The assignment's own rows (it may use fewer than k) and the least height for them.
    const ownRows = hiLevel ? Math.max(...hiLevel) + 1 : k
    const ownHeight = leastHeight(along, ownRows, layerGap)
    if (hi * ownHeight < dagreArea && hiLevel && !room) {
      let drawn = ''
      if (hiOrders?.status === 'found') {
        const {layout} = layoutLevels({graph: g, level: hiOrders.level, orders: hiOrders.orders, boxes, flow: 'up'})
        const check = checkDrawing(g, layout, {boxes})
        drawnBelow = layout.width * layout.height < dagreArea && check.ok
        drawn = `, drawn with the search's orders ${fmt(layout.width)} × ${fmt(layout.height)} = ${fmt((layout.width * layout.height) / dagreArea, 3)} of dagre's, geometric check ${check.ok ? 'passed' : `failed: ${check.problems[0]}`}`
      }
      room = `room: a ${ownRows}-row assignment with rows at most ${fmt(hi)} exists (bound ${fmt((hi * ownHeight) / dagreArea, 3)} of dagre's area${drawn}; levels ${Array.from(hiLevel).join(',')})`
      mark = ' ← room'
    }
    lines.push(`  ${k} rows: height ≥ ${fmt(height)}, widest row in [${fmt(lo)}, ${fmt(hi)}] (area ≥ ${fmt((lo * height) / dagreArea, 3)} of dagre's; ${answers.join(', ')}; ${fmt(tests)} tests, ${fmt(steps)} levels)${mark}`)
  }
  const verdict: Verdict = room ? (drawnBelow ? 'drawn below' : 'room') : open ? 'unknown' : 'out of reach'
  tally.set(verdict, [...(tally.get(verdict) ?? []), x.name])
  const said = room ?? (open ? 'unknown (budget)' : 'out of reach (proved)')
  console.log(`${x.name} (${n} vertices, ${g.edgeCount} edges): dagre ${fmt(dagreArea)} (${x.dagreCrossings} crossings), ours ${fmt(x.oursArea)} (${fmt(x.oursArea / dagreArea, 3)}), lower bound ${fmt(lowerBound)} (${fmt(lowerBound / dagreArea, 3)}); ${said}; ${fmt(performance.now() - t0)} ms`)
  for (const l of lines) console.log(l)
  if (tail) console.log(`  ${tail.slice(2)}`)
  if (x.oursArea < lowerBound - 1e-6) console.log(`  ERROR: ours is below the lower bound`)
}
console.log(`\nout of reach (proved) ${tally.get('out of reach')?.length ?? 0}: ${(tally.get('out of reach') ?? []).join(', ')}`)
console.log(`room, and the assignment found drawn (layoutLevels, the search's orders) below dagre's area ${tally.get('drawn below')?.length ?? 0}: ${(tally.get('drawn below') ?? []).join(', ')}`)
console.log(`room by the bound only (that drawing not below dagre's) ${tally.get('room')?.length ?? 0}: ${(tally.get('room') ?? []).join(', ')}`)
console.log(`unknown (budget) ${tally.get('unknown')?.length ?? 0}: ${(tally.get('unknown') ?? []).join(', ')}`)
console.log(`load average at end ${load()}`)
