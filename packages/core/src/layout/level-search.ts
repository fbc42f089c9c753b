/**
 * A level assignment with a given number of rows, built one vertex at a time with backtracking,
 * each partial assignment checked by the exact level-planarity test (level/level-planarity.ts,
 * Randerath et al. 2001) on the subgraph placed so far.
 *
 * Why: the greedy candidates of level-candidates.ts move whole rows, or one vertex of an odd cycle at
 * a time, from one full assignment to the next, and on sparse graphs with many sources and sinks they
 * stop far above G's longest path (a North DAG with a 6-vertex longest path: 15 rows at best). Here the
 * rows are fixed first and each vertex takes a level in its window: a subgraph of a level-planar graph
 * with the same levels is level planar, so a partial assignment the test rejects is cut off with
 * everything below it in the search tree. The search is exact (a backtracking search, ours): run to
 * the end, a "none" is a proof that no assignment within that many rows is level planar.
 *
 * Order of the vertices: breadth first over the underlying undirected graph from a vertex of a longest
 * path (the one with most neighbours), neighbours with more neighbours first, so each vertex but the
 * first of each component joins the placed part by an edge. The window of v: at least the
 * placed u with a path u ⇝ v, plus that path's longest length; at most the same from above; and within
 * its longest paths from the sources and to the sinks.
 *
 * A vertex with at most one placed neighbour is placed without a test (on sparse graphs most are, and
 * they seldom fail), and so is every second vertex that closes a cycle (TEST_EVERY): the next test,
 * at the latest the last one on the whole graph, sees it, and an odd cycle through it names it, so
 * nothing accepted is unchecked and the search stays exact.
 *
 * Backtracking is conflict-directed (below): a failed level records the placed vertices whose levels
 * make the odd cycle, and when every level of a vertex fails the search goes back to the latest of
 * those, not to the vertex placed just before. Each odd cycle is also kept (nogood recording), so the
 * same levels of its ends met again later are ruled out without a test.
 *
 * With a bound on the rows' widths (RowWidthBound), a level that makes a row of the placed part as
 * wide as the bound is ruled out without a test (rows only widen as vertices are placed), its
 * culprits the placed vertices on that row and the ends of the placed edges passing it; so a "none"
 * says no level-planar assignment has every row narrower (branch and bound on the widest row). With
 * the 'least' estimate (row-bound.ts) that "none" holds for the drawn rows: no drawing of any
 * level-planar assignment within the rows has every row narrower than the bound. With an area bound
 * as well (RowWidthBound.area), the widest row times the height of the rows used so far (their
 * tallest boxes and the layer gaps) must stay below it; both only grow as vertices are placed.
 *
 * With `written` (vertices whose out-edges must leave left to right in written order, edge id
 * order), every test also gets forced pairs (level-planarity.ts): for each such vertex placed, the
 * points where its placed out-edges meet the level above it (the head, or the edge's bend there),
 * consecutive edges by id (what the ports follow, smallest-layout.ts). A subgraph's pairs are a
 * subset of the whole graph's, so a partial assignment refuted with them is cut off as above. A
 * refutation by a chain of equations names the ends of its edges and of the two forced pairs' edges
 * as culprits; one by the exhausted witness search names every placed vertex (plain backtracking).
 * Constrained level planarity is NP-hard in general, so each test stays bounded by its steps.
 *
 * Levels tried first: with `guide`, those nearest the guide's level of the vertex (a known assignment
 * with one row more keeps most vertices where they are); then the least total span of the edges to
 * placed neighbours; then the lower.
 *
 * Time: O(n · (n + m)) for the longest distances; each test is quadratic in the level widths
 * (level-planarity.ts), the number of tests bounded by `budget` (tests, and pairs set up as
 * levelTestWork counts them), deterministic counts; exponential without a budget.
 */
import type {Digraph} from '../graph/digraph.ts'
import {testLevelPlanarity, type ForcedPair, type LevelGraph, type LevelItem} from '../level/level-planarity.ts'
import {levelTestWork} from './level-candidates.ts'
import {longestPathToSinks, longestPathUp, topologicalOrder} from './layering.ts'
import {rowWidths} from './balance-rows.ts'
import {leastGaps, leastGapsToCome, rowsHeight} from './row-bound.ts'

export type LevelSearch =
  | {status: 'found'; level: Int32Array; orders: LevelItem[][]}
  /** No assignment with that many rows is level planar (the search ran to its end). */
  | {status: 'none'}
  /** The budget ran out first. */
  | {status: 'stopped'}

/**
 * Of the vertices that close a cycle with the placed part, every how many is tested. Testing every
 * second one (against every one) cut the tests to a find on the North DAGs searched most (scratch,
 * bench/level-rows.ts and per-graph drawings; see bench/README.md); the cycle still names the culprits.
 */
const TEST_EVERY = 2

export interface LevelSearchBudget {
  tests: number
  work: number
  /**
   * Levels tried (placements, tested or not), when given. A width bound rules levels out without a
   * test, so with one only this count bounds the search.
   */
  steps?: number
}

/**
 * A bound on the rows' widths, each estimated as balance-rows.ts does: every box's extent across the
 * flow plus the gap between boxes, and the edge gap for each edge passing through the row; or, with
 * `estimate: 'least'`, as the least width any order of the row can be drawn with (row-bound.ts:
 * leastRowWidth), so that a "none" says no drawing of these rows is narrower.
 */
export interface RowWidthBound {
  across: ArrayLike<number>
  nodeGap: number
  edgeGap: number
  /** Every row must stay narrower than this. */
  below: number
  /** 'sum' (the default): balance-rows.ts's estimate; 'least': row-bound.ts's lower bound. */
  estimate?: 'sum' | 'least' | undefined
  /**
   * Also: the widest row times the height (rowsHeight: each row's tallest box, `along` its extents,
   * and the layer gaps between the rows) must stay below `below`. With 'least' that product is a
   * lower bound on the drawn area, so a "none" says no drawing of these rows is smaller.
   */
  area?: {along: ArrayLike<number>; layerGap: number; below: number} | undefined
}

/** The widest row of an assignment, by the estimate of RowWidthBound. O(n + m + L · m) at worst. */
export function widestRow(g: Digraph, level: ArrayLike<number>, across: ArrayLike<number>, nodeGap: number, edgeGap: number): number {
  let widest = 0
  for (const w of rowWidths(g, level, across, nodeGap, edgeGap)) widest = Math.max(widest, w)
  return widest
}

/** Longest path length from each vertex to every other (-1: no path). O(n · (n + m)). */
function longestDistances(g: Digraph, order: Int32Array): Int32Array[] {
  const n = g.vertexCount
  return Array.from({length: n}, (_, s) => {
    const d = new Int32Array(n).fill(-1)
    d[s] = 0
    for (const v of order) {
      if (d[v]! < 0) continue
      for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
        const w = g.head[g.outEdges[i]!]!
        if (d[v]! + 1 > d[w]!) d[w] = d[v]! + 1
      }
    }
    return d
  })
}

/** Neighbours of v (both directions), in edge order. */
function neighbours(g: Digraph, v: number): number[] {
  const out: number[] = []
  for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) out.push(g.head[g.outEdges[i]!]!)
  for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) out.push(g.tail[g.inEdges[i]!]!)
  return out
}

/** The placing order described above. O(n log n + m). */
function placingOrder(g: Digraph, up: Int32Array, down: Int32Array): number[] {
  const n = g.vertexCount
  const degree = (v: number): number => g.outStart[v + 1]! - g.outStart[v]! + g.inStart[v + 1]! - g.inStart[v]!
  let top = 0
  for (let v = 0; v < n; v++) top = Math.max(top, up[v]! + down[v]!)
  const onLongest = (v: number): boolean => up[v]! + down[v]! === top
  let start = -1
  for (let v = 0; v < n; v++) if (onLongest(v) && (start < 0 || degree(v) > degree(start))) start = v
  const order: number[] = []
  const seen = new Uint8Array(n)
  const queue: number[] = [start]
  seen[start] = 1
  let head = 0
  let next = 0
  while (order.length < n) {
    if (head === queue.length) {
      while (seen[next]) next++
      queue.push(next)
      seen[next] = 1
    }
    const v = queue[head++]!
    order.push(v)
    const nb = neighbours(g, v).sort((a, b) => degree(b) - degree(a) || a - b)
    for (const w of nb) {
      if (seen[w]) continue
      seen[w] = 1
      queue.push(w)
    }
  }
  return order
}

/**
 * A level-planar assignment of G within `rows` levels (levels left empty removed), or a proof that
 * none exists, or 'stopped' when `budget` runs out (spent in place). `guide`: levels to stay near.
 * `bound`: only assignments whose rows all stay narrower (a "none" then says none of those exists).
 */
export function searchLevels(g: Digraph, rows: number, budget: LevelSearchBudget, guide?: ArrayLike<number>, bound?: RowWidthBound, written?: readonly number[]): LevelSearch {
  const n = g.vertexCount
  const topo = topologicalOrder(g)
  const up = longestPathUp(g, topo)
  const down = longestPathToSinks(g, topo)
  for (let v = 0; v < n; v++) if (up[v]! + down[v]! >= rows) return {status: 'none'}
  const dist = longestDistances(g, topo)
  const order = placingOrder(g, up, down)
  const position = new Int32Array(n)
  order.forEach((v, i) => (position[v] = i))
  const adjacent = Array.from({length: n}, (_, v) => neighbours(g, v))
  const level = new Int32Array(n).fill(-1)
  let orders: LevelItem[][] | undefined

  // The subgraph on the first `count` positions is G's edges with both ends placed (edgeEnd[e] <
  // count), in G's edge order, vertex i the one placed i-th. Each test fills these arrays, allocated
  // once, and passes them as edge arrays (no adjacency lists built). O(n + m) a test.
  const m = g.edgeCount
  const tailAt = new Int32Array(m)
  const headAt = new Int32Array(m)
  const edgeEnd = new Int32Array(m)
  for (let e = 0; e < m; e++) {
    tailAt[e] = position[g.tail[e]!]!
    headAt[e] = position[g.head[e]!]!
    edgeEnd[e] = Math.max(tailAt[e]!, headAt[e]!)
  }
  const subTail = new Int32Array(m)
  const subHead = new Int32Array(m)
  /** The subgraph's edge j is G's edgeOf[j]; G's edge e is the subgraph's subEdge[e] (when in it). */
  const edgeOf = new Int32Array(m)
  const subEdge = new Int32Array(m)
  const placedLevel = new Int32Array(n)
  /**
   * The level test on the first `count` vertices of the order: true when planar, else the positions
   * of the ends of the odd cycle's edges (the placed vertices whose levels make it), or undefined
   * when the budget is spent or the test undecided (the search stops).
   */
  const test = (count: number): true | number[] | undefined => {
    let k = 0
    for (let e = 0; e < m; e++) {
      if (edgeEnd[e]! >= count) continue
      subTail[k] = tailAt[e]!
      subHead[k] = headAt[e]!
      edgeOf[k] = e
      subEdge[e] = k++
    }
    const sub: LevelGraph = {vertexCount: count, edgeCount: k, tail: subTail.subarray(0, k), head: subHead.subarray(0, k)}
    for (let i = 0; i < count; i++) placedLevel[i] = level[order[i]!]!
    const subLevel = placedLevel.subarray(0, count)
    const work = levelTestWork(sub, subLevel)
    if (budget.tests < 1 || work > budget.work) return undefined
    budget.tests--
    budget.work -= work
    const decideOnly = count < n
    const pairs = written ? writtenPairs(g, subLevel, written, position, count, edgeEnd, subEdge, subHead) : undefined
    const r = pairs?.forced.length ? testLevelPlanarity(sub, subLevel, {maxWork: 250_000, maxSteps: 250_000, decideOnly, forced: pairs.forced}) : testLevelPlanarity(sub, subLevel, {maxWork: 250_000, maxSteps: 250_000, decideOnly})
    if (r.status === 'undecided') return undefined
    if (r.status === 'not-planar') {
      const ends: number[] = []
      for (const e of r.edges) ends.push(subTail[e]!, subHead[e]!)
      return ends
    }
    if (r.status === 'forced-infeasible') {
      const ends: number[] = []
      if (r.proof === 'search') {
        for (let p = 0; p < count; p++) ends.push(p)
        return ends
      }
      for (const e of r.edges) ends.push(subTail[e]!, subHead[e]!)
      for (const p of r.pairs) for (const e of pairs!.edges[p]!) ends.push(subTail[e]!, subHead[e]!)
      return ends
    }
    // Back to G's ids: the subgraph's vertex i is order[i], its edge j is G's edgeOf[j].
    if (count === n) orders = r.orders.map((items) => items.map((item): LevelItem => (item.kind === 'vertex' ? {kind: 'vertex', vertex: order[item.vertex]!} : {kind: 'edge', edge: edgeOf[item.edge]!})))
    return true
  }

  // Conflict-directed backjumping (Prosser, "Hybrid algorithms for the constraint satisfaction
  // problem", Computational Intelligence 9(3), 1993): conflicts[i] holds the earlier positions whose
  // levels ruled out levels of position i. An odd cycle depends only on the levels of its edges' ends
  // (which points each edge has on which level, and so which equations exist), so those ends are the
  // culprits; when every level of i fails, the search jumps back to the latest culprit, not to i − 1.
  const conflicts: Array<Set<number>> = Array.from({length: n}, () => new Set())
  // Nogood recording (Dechter, "Enhancement schemes for constraint processing: backjumping, learning,
  // and cutset decomposition", Artificial Intelligence 41(3), 1990): each odd cycle is kept as the
  // levels of its ends, filed under the latest of them. Those ends with those levels carry a
  // non-level-planar subgraph in any assignment, so when the search comes back to the same levels
  // after a jump, they are ruled out without a test. Filed by the latest end's position and level
  // (key position · rows + level), so a level tried there is checked only against the nogoods that
  // give that very level; each a flat [vertex, level, …] list of the other ends, in recording order.
  const nogoods = new Map<number, number[][]>()
  const record = (ends: number[]): void => {
    const members = Array.from(new Set(ends))
    let latest = -1
    for (const p of members) latest = Math.max(latest, p)
    // The other ends latest first: the later a position, the more often the search has moved it
    // since, so a stale nogood tends to fail on its first comparison.
    const others: number[] = []
    for (const p of members.sort((a, b) => b - a)) if (p !== latest) others.push(order[p]!, level[order[p]!]!)
    const key = latest * rows + level[order[latest]!]!
    const filed = nogoods.get(key)
    if (filed) filed.push(others)
    else nogoods.set(key, [others])
  }
  /** The first recorded nogood of position i at level l that the levels placed so far match, or undefined. */
  const matching = (i: number, l: number): number[] | undefined => {
    const filed = nogoods.get(i * rows + l)
    if (!filed) return undefined
    for (const ng of filed) {
      let all = true
      for (let k = 0; k < ng.length && all; k += 2) all = level[ng[k]!] === ng[k + 1]
      if (all) return ng
    }
    return undefined
  }
  // Row widths of the placed part (with `bound`): a row only widens as vertices are placed, so a
  // row at or past the bound rules the partial assignment out, and its culprits are the placed
  // vertices on it and the ends of the placed edges passing through it. With the 'least' estimate
  // each row keeps its boxes' extent, boxes and bends, and a partial row counts the least it can
  // still come to (leastGapsToCome: more bends can narrow it when a bend between two boxes is
  // cheaper than a box gap); the whole assignment is then checked with its own bends (`final`).
  const least = bound?.estimate === 'least'
  const width = bound ? new Float64Array(rows) : undefined
  const boxCount = least ? new Int32Array(rows) : undefined
  const bendCount = least ? new Int32Array(rows) : undefined
  const rowValue = (r: number, final: boolean): number => {
    if (!least) return width![r]!
    // A level without boxes is dropped from the assignment found (with the bends on it).
    if (boxCount![r] === 0) return 0
    const gaps = final ? leastGaps : leastGapsToCome
    return width![r]! + gaps(boxCount![r]!, bendCount![r]!, bound!.nodeGap, bound!.edgeGap)
  }
  /** Adds (sign 1) or takes away (-1) v's box at l and its edges to `placed`; the first row at or past the bound, or -1. */
  const widen = (v: number, l: number, placed: number[], sign: number): number => {
    if (least) return widenLeast(v, l, placed, sign)
    const w = width!
    const b = bound!
    let over = -1
    w[l]! += sign * (b.across[v]! + b.nodeGap)
    if (w[l]! >= b.below) over = l
    for (const u of placed) {
      const lo = Math.min(l, level[u]!)
      const hi = Math.max(l, level[u]!)
      for (let r = lo + 1; r < hi; r++) {
        w[r]! += sign * b.edgeGap
        if (over < 0 && w[r]! >= b.below) over = r
      }
    }
    return over
  }
  /** widen for the 'least' estimate; with the last vertex, every row is checked with its own bends. */
  const widenLeast = (v: number, l: number, placed: number[], sign: number): number => {
    const b = bound!
    const final = position[v] === n - 1
    width![l]! += sign * b.across[v]!
    boxCount![l]! += sign
    for (const u of placed) {
      const lo = Math.min(l, level[u]!)
      const hi = Math.max(l, level[u]!)
      for (let r = lo + 1; r < hi; r++) bendCount![r]! += sign
    }
    if (sign < 0) return -1
    if (final) {
      for (let r = 0; r < rows; r++) if (rowValue(r, true) >= b.below) return r
      return -1
    }
    if (rowValue(l, false) >= b.below) return l
    for (const u of placed) {
      const lo = Math.min(l, level[u]!)
      const hi = Math.max(l, level[u]!)
      for (let r = lo + 1; r < hi; r++) if (rowValue(r, false) >= b.below) return r
    }
    return -1
  }
  /** Positions below i that put a box on row r or an edge through it. O(n + m). */
  const widthCulprits = (r: number, i: number): number[] => {
    const out: number[] = []
    for (let j = 0; j < i; j++) if (level[order[j]!] === r) out.push(j)
    for (let e = 0; e < g.edgeCount; e++) {
      const a = position[g.tail[e]!]!
      const b = position[g.head[e]!]!
      if (a > i || b > i) continue
      if (level[g.tail[e]!]! < r && r < level[g.head[e]!]!) for (const p of [a, b]) if (p < i) out.push(p)
    }
    return out
  }
  // The area bound (with `bound.area`), one more cut of the same kind: placing vertices only adds
  // boxes and bends to rows (rowValue only grows, as above) and makes rows taller or used, and a
  // used row adds its box and at least half a layer gap on each side it has a neighbour, so the
  // height of the placed part (rowsHeight) never exceeds that of a completion: the widest row so far
  // times it is at most the area of every completion (with 'least', of every drawing of one). The
  // culprits: those of the widest row (as for the width bound), and on each used row the placed
  // vertex with its tallest box (the first placed among equals). Any assignment that keeps these
  // vertices' levels has that row at least as wide and each of those rows used and at least as tall,
  // so it is ruled out as well. O(n + m + L) per level tried.
  const tallestAt = bound?.area ? new Float64Array(rows) : undefined
  const tallestBy = bound?.area ? new Int32Array(rows) : undefined
  /** The culprits when the placed part through position i reaches the area bound, else undefined. */
  const areaOver = (i: number): number[] | undefined => {
    const a = bound?.area
    if (!a) return undefined
    tallestAt!.fill(-1)
    for (let p = 0; p <= i; p++) {
      const r = level[order[p]!]!
      if (a.along[order[p]!]! > tallestAt![r]!) [tallestAt![r], tallestBy![r]] = [a.along[order[p]!]!, p]
    }
    const height = rowsHeight(tallestAt!, a.layerGap)
    const widest = (final: boolean): [number, number] => {
      let most = 0
      let at = -1
      for (let r = 0; r < rows; r++) if (rowValue(r, final) > most) [most, at] = [rowValue(r, final), r]
      return [most, at]
    }
    // Rows counted at the least they can still come to: a row of another assignment that keeps the
    // culprits' levels may have more bends, which can narrow it (leastGapsToCome).
    const [most, at] = widest(false)
    if (at >= 0 && most * height >= a.below) {
      const out = widthCulprits(at, i)
      for (let r = 0; r < rows; r++) if (tallestAt![r]! >= 0 && tallestBy![r]! < i) out.push(tallestBy![r]!)
      return out
    }
    // The whole assignment with its own bends: ruled out, it blames every placed vertex (plain
    // backtracking), since only this assignment is known to reach the bound.
    if (i === n - 1 && widest(true)[0] * height >= a.below) return Array.from({length: i}, (_, p) => p)
    return undefined
  }
  const STOP = -3
  const SOLVED = -1
  /**
   * SOLVED, STOP, or the position to go back to (-2: none, the search is over). `untested`: vertices
   * closing a cycle placed since the last test on this path.
   */
  const place = (i: number, untested = 0): number => {
    if (i === n) return SOLVED
    const v = order[i]!
    const mine = conflicts[i]!
    mine.clear()
    // The window, and for each level of the global window it leaves out, the earliest placed vertex
    // that rules it out (a culprit too: were it moved, that level could come back).
    let lo = up[v]!
    let hi = rows - 1 - down[v]!
    const from = lo
    const to = hi
    for (let j = 0; j < i; j++) {
      const u = order[j]!
      if (dist[u]![v]! > 0) lo = Math.max(lo, level[u]! + dist[u]![v]!)
      if (dist[v]![u]! > 0) hi = Math.min(hi, level[u]! - dist[v]![u]!)
    }
    for (let l = from; l <= to; l++) {
      if (l >= lo && l <= hi) continue
      for (let j = 0; j < i; j++) {
        const u = order[j]!
        if ((dist[u]![v]! > 0 && level[u]! + dist[u]![v]! > l) || (dist[v]![u]! > 0 && level[u]! - dist[v]![u]! < l)) {
          mine.add(j)
          break
        }
      }
    }
    const placed = adjacent[v]!.filter((w) => position[w]! < i)
    // Each level's keys once (the sort compares them many times).
    const levels: number[] = []
    const near: number[] = []
    const span: number[] = []
    for (let l = lo; l <= hi; l++) {
      levels.push(l)
      near.push(guide ? Math.abs(l - guide[v]!) : 0)
      span.push(placed.reduce((s, w) => s + Math.abs(level[w]! - l), 0))
    }
    levels.sort((a, b) => near[a - lo]! - near[b - lo]! || span[a - lo]! - span[b - lo]! || a - b)
    for (const l of levels) {
      if (budget.steps !== undefined && budget.steps-- < 1) return STOP
      level[v] = l
      const known = matching(i, l)
      if (known) {
        for (let k = 0; k < known.length; k += 2) mine.add(position[known[k]!]!)
        continue
      }
      if (width) {
        const over = widen(v, l, placed, 1)
        if (over >= 0) {
          widen(v, l, placed, -1)
          for (const p of widthCulprits(over, i)) mine.add(p)
          continue
        }
        const large = areaOver(i)
        if (large) {
          widen(v, l, placed, -1)
          for (const p of large) mine.add(p)
          continue
        }
      }
      try {
        // A vertex joined to the placed part by one edge or none rarely makes it non-planar, and of
        // those that close a cycle only every TEST_EVERY-th is tested: an untested one is checked with
        // the next vertex tested (the last one always is), and a cycle through it names it as a
        // culprit, so the jump goes back to it as if it had been tested.
        const closes = placed.length >= 2
        const untestedHere = i + 1 < n && (!closes || untested + 1 < TEST_EVERY)
        const answer = untestedHere || test(i + 1)
        if (answer === undefined) return STOP
        if (answer !== true) {
          record(answer)
          for (const p of answer) if (p !== i) mine.add(p)
          // A cycle without v rules out every level of v.
          if (!answer.includes(i)) break
          continue
        }
        const next = place(i + 1, untestedHere ? untested + (closes ? 1 : 0) : 0)
        if (next === SOLVED || next === STOP) return next
        if (next < i) {
          level[v] = -1
          return next
        }
      } finally {
        // Every way out of this level (a failure, a jump back past v) takes v's widths away again.
        if (width) widen(v, l, placed, -1)
      }
    }
    level[v] = -1
    let back = -2
    for (const p of mine) back = Math.max(back, p)
    if (back >= 0) for (const p of mine) if (p !== back) conflicts[back]!.add(p)
    return back
  }

  const result = place(0)
  if (result === STOP) return {status: 'stopped'}
  if (result !== SOLVED) return {status: 'none'}
  // Levels left empty (possible when `rows` is above G's longest path) go: an edge passing one just
  // loses its point there, and two crossing-free bands in a row make one.
  const used = Array.from(new Set(level)).sort((a, b) => a - b)
  if (used.length === rows) return {status: 'found', level, orders: orders!}
  const index = new Map(used.map((l, i) => [l, i]))
  return {status: 'found', level: Int32Array.from(level, (l) => index.get(l)!), orders: used.map((l) => orders![l]!)}
}

/**
 * The forced pairs of searchLevels's `written` vertices on the subgraph of the first `count`
 * positions (vertex i is G's vertex placed i-th; G's edge e is the subgraph's subEdge[e] when
 * edgeEnd[e] < count, and subHead holds the subgraph's heads), and per pair the two subgraph edges
 * that make it. O(m log m).
 */
function writtenPairs(g: Digraph, level: Int32Array, written: readonly number[], position: Int32Array, count: number, edgeEnd: Int32Array, subEdge: Int32Array, subHead: Int32Array): {forced: ForcedPair[]; edges: Array<[number, number]>} {
  const forced: ForcedPair[] = []
  const edges: Array<[number, number]> = []
  for (const v of written) {
    const i = position[v]!
    if (i >= count) continue
    const above = level[i]! + 1
    // Out-edges in the subgraph, in G's id order (the written order); subgraph ids follow G's.
    const outs: number[] = []
    for (let x = g.outStart[v]!; x < g.outStart[v + 1]!; x++) if (edgeEnd[g.outEdges[x]!]! < count) outs.push(subEdge[g.outEdges[x]!]!)
    outs.sort((a, b) => a - b)
    const item = (e: number): LevelItem => (level[subHead[e]!] === above ? {kind: 'vertex', vertex: subHead[e]!} : {kind: 'edge', edge: e})
    for (let k = 1; k < outs.length; k++) {
      const [a, b] = [outs[k - 1]!, outs[k]!]
      if (subHead[a] === subHead[b] && level[subHead[a]!] === above) continue
      forced.push({level: above, left: item(a), right: item(b)})
      edges.push([a, b])
    }
  }
  return {forced, edges}
}
