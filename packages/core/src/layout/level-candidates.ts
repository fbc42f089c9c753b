/**
 * Level assignments with fewer rows than the st-graph's layering, each proved drawable by the exact
 * level-planarity test (level/level-planarity.ts, Randerath et al. 2001), which also returns the
 * per-level orders that level-layout.ts draws.
 *
 * Why: the upward layout (layout-upward.ts) layers the st-augmentation H, and the edges that saturate
 * faces lengthen H's longest path, so it often uses more rows than G's own longest path, the least
 * any layered drawing can have. A level-planar assignment closer to that bound gives an upward,
 * crossing-free drawing with fewer rows (usually a smaller area; the caller compares areas).
 *
 * Candidates, in this order (duplicates dropped):
 * 1. longest path from the sources (each vertex as low as its predecessors allow): the minimum
 *    number of rows of any layered drawing (common practice; e.g. Di Battista, Eades, Tamassia,
 *    Tollis, "Graph Drawing", 1999, sec. 9.1);
 * 2. longest path to the sinks (each vertex as high as its successors allow), the same height;
 * 3. the same height with the total edge span lowered by single-vertex moves (layering.ts, after the
 *    network-simplex layering of Gansner, Koutsofios, North, Vo, IEEE TSE 19(3), 1993);
 * 4. relaxed augmentation: longest path of G plus a subset S of H's added edges. With every added
 *    edge kept this is H's own layering, level planar by H's embedding; added edges on a longest path
 *    are then dropped while the test still answers planar, each drop lowering the height or keeping
 *    it. A greedy search (ours), capped by `maxTests`.
 * Each of these that passes the test is also tried with its rows evened out (balance-rows.ts: same
 * height, single vertices moved to narrower rows), as a further candidate when that passes too, or
 * when it does after the moves the test's odd cycle blames are set back (addEvenedOut below). So is
 * H's own layering, where 4. starts (the st-layout's rows).
 * 5. lifted: from G's longest-path layering, while the test answers "no", raise one vertex of the odd
 *    cycle it returns by a level (its successors follow as far as needed), taking the raise that
 *    passes, else the one with the fewest rows and then the shortest cycle; a greedy repair (ours),
 *    capped by `maxTests`. A raise that gives an assignment already tested is skipped (without it
 *    the search could raise a top vertex again and again, which compression undoes).
 * 6. compacted: the assignment found so far with the fewest rows, rows taken out one at a time while
 *    the test answers planar (compactLevels below), capped by `maxTests`.
 * 7. lifted, turned over: 5. on G with its edges reversed (from the longest path to the sinks, a
 *    vertex of the odd cycle lowered at a time), with what is left of the budget; kind 'lifted'.
 * 8. searched: with the rows fixed at one fewer than the fewest found so far, an exact search
 *    (level-search.ts) for a level-planar assignment, first near that assignment, then without a
 *    guide; repeated one row lower while it finds one, down to G's longest path; its own budget
 *    (`search`), so it never takes tests from the others. Past them because it costs the most per
 *    row it gains. Then, with `rows`, at the row count reached, the same search with a bound on the
 *    rows' widths for a narrower assignment (searchFewerRows), evened out like the others.
 * 9. area-searched (not here: smallest-layout.ts, area-search.ts, after these are drawn): from the
 *    fewest rows found to a few more, searchLevels with the 'least' row-width bound for an assignment
 *    drawn smaller than the smallest drawing kept so far, keeping the st-layout's written order by
 *    forced pairs; its own budget.
 * A "no" from the test only rules out that candidate; every level test is bounded by `maxWork`
 * (pairs set up) and `maxSteps` (witness search), all of them together by `workBudget` (pairs set
 * up), deterministic counts, and `undecided` counts as no.
 *
 * Time: each test is quadratic in the level widths (see level-planarity.ts), bounded as above; the
 * layerings are linear, O(n + m) per relaxation step.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {testLevelPlanarity, type LevelGraph, type LevelItem, type LevelPlanarity, type LevelPlanarityOptions} from '../level/level-planarity.ts'
import type {StAugmentation} from '../augment/index.ts'
import {dropEmptyLevels, evenRows} from './balance-rows.ts'
import {layerByWeightedSpan, longestPathToSinks, longestPathUp, topologicalOrder} from './layering.ts'
import {searchLevels, widestRow, type LevelSearch} from './level-search.ts'

/**
 * Level tests, and pairs they set up, that the searched candidate (8. above) may spend per diagram;
 * deterministic counts. On the 813 upward planar North DAGs (2026-12-02, scratch comparison with the
 * bench's boxes): 150 tests with the first row capped at 40 draw 9 graphs smaller, none larger; 150
 * uncapped 13 smaller but twice the CPU; 100 uncapped 11.
 */
const SEARCH_TESTS = 150
const SEARCH_WORK = 750_000
/**
 * Of those, what the first row searched may spend (searchFewerRows), and how much of it goes to the
 * guided search: on the North DAGs most finds are guided (g.18.29 needs 38 tests at its first row,
 * guided), a few unguided within about ten (g.36.7). 72 and 56 against 52 and 40: 2 drawn smaller
 * (g.31.0 2.128 -> 1.682 of dagre's area), none larger, 1.04x the CPU (bench/README.md).
 */
/**
 * Of those, the level tests, and levels tried (a width bound rules levels out without a test), that
 * the search for narrower rows at the final row count (searchFewerRows) may spend per diagram; and
 * by how much each find must be narrower than the last. On the North DAGs (2026-12-02, scratch, the
 * bench's boxes and dagre drawings): 8 tests and 300 levels drew 162 graphs smaller, 8 of them from
 * above dagre's area to under it, at 1.07x the CPU; 12 and 500 186 and 8 at 1.17x; 24 and 1,000 207
 * and 11 at 1.32x (bench/README.md).
 */
/**
 * Rounds of setting moves back when rows evened out fail the level test (addEvenedOut), per evened-out
 * assignment, and the pairs their tests may set up per diagram (their own budget, so they never take
 * tests from the other candidates).
 */
const UNDO_ROUNDS = 24
const UNDO_WORK = 500_000
const SEARCH_WIDTH_TESTS = 8
const SEARCH_WIDTH_STEPS = 300
const WIDTH_STEP = 0.5
const SEARCH_FIRST_TESTS = 72
const SEARCH_FIRST_GUIDED = 56

export type LevelCandidateKind = 'longest-path' | 'longest-path-down' | 'short-edges' | 'relaxed-augmentation' | 'lifted' | 'compacted' | 'searched'

export interface LevelCandidate {
  kind: LevelCandidateKind
  /** Level of each vertex of G, 0-based, every level holding a vertex; every edge goes up. */
  level: Int32Array
  /** Per level, left to right (the level-planarity witness). */
  orders: LevelItem[][]
  /** Whether the rows of the `kind` assignment were evened out (balance-rows.ts). */
  balanced: boolean
  /** Index of the order preference the orders follow. */
  preference: number
}

/**
 * A preferred left-to-right order: per vertex a place (`rank`, smaller = further left) and per edge a
 * place for its bends on the same scale (`edgeRank`). With both given, the levels sorted by them are
 * used as they are when they draw no crossing; otherwise they break ties in the level test.
 */
export interface OrderPreference {
  rank: ArrayLike<number>
  edgeRank?: ArrayLike<number> | undefined
}

export interface LevelCandidateOptions {
  /**
   * Orders to follow, the first one when deciding; every assignment that passes gets a drawing per
   * preference whose orders differ. Default: one, the vertex ids without edge places.
   */
  preferences?: ReadonlyArray<OrderPreference> | undefined
  /** Pairs set up per level test (P + Q in level-planarity.ts); past it the candidate is skipped. Default 250,000. */
  maxWork?: number | undefined
  /**
   * Pairs set up over all level tests together; a test that would go past what is left is not run
   * (its candidate is skipped). Default 500,000.
   */
  workBudget?: number | undefined
  /** Propagation steps per level test's witness search. Default 250,000. */
  maxSteps?: number | undefined
  /** Level tests of each search: the relaxed augmentation, the lifted and the compacted assignment (4.–6. above). Default 24. */
  maxTests?: number | undefined
  /** Budget of the searched candidate (8. above); default SEARCH_TESTS tests and SEARCH_WORK pairs. */
  search?: {tests: number; work: number} | undefined
  /**
   * Row balancing (balance-rows.ts): each box's extent across the flow and the gaps between boxes and
   * beside bends. Without it, rows are not balanced.
   */
  rows?: {across: ArrayLike<number>; nodeGap: number; edgeGap: number} | undefined
}

export function levelCandidates(g: Digraph, st: StAugmentation, options: Readonly<LevelCandidateOptions> = {}): LevelCandidate[] {
  const n = g.vertexCount
  if (n === 0 || g.edgeCount === 0) return []
  const preferences = options.preferences?.length ? options.preferences : [{rank: Int32Array.from({length: n}, (_, v) => v)}]
  const limits = (p: OrderPreference): LevelPlanarityOptions => {
    const l: LevelPlanarityOptions = {maxWork: options.maxWork ?? 250_000, maxSteps: options.maxSteps ?? 250_000, majority: true, rank: p.rank}
    if (p.edgeRank) l.edgeRank = p.edgeRank
    return l
  }
  // Pairs the level tests may set up: `shared` by all candidates, `undo` by addEvenedOut's rounds after
  // the first.
  const shared = {work: options.workBudget ?? 500_000}
  const undo = {work: UNDO_WORK}
  /**
   * Orders for `level` following preference p: its own orders when they draw cleanly, else the test's
   * (`tested`: the test's answer, when it ran).
   */
  const witness = (level: Int32Array, p: OrderPreference, pool = shared): {orders?: LevelItem[][] | undefined; tested?: LevelPlanarity | undefined} => {
    const own = p.edgeRank ? ordersByRank(g, level, p.rank, p.edgeRank) : undefined
    if (own) return {orders: own}
    const tested = probe(level, p, pool)
    return {orders: tested?.status === 'planar' ? tested.orders : undefined, tested}
  }
  const ordersFor = (level: Int32Array, p: OrderPreference): LevelItem[][] | undefined => witness(level, p).orders
  /** The level test within what is left of `pool`; undefined when it would go past it. */
  const probe = (level: Int32Array, p: OrderPreference, pool = shared): LevelPlanarity | undefined => {
    const work = levelTestWork(g, level)
    if (work > pool.work) return undefined
    pool.work -= work
    return testLevelPlanarity(g, level, limits(p))
  }
  const test = (level: Int32Array): LevelItem[][] | undefined => ordersFor(level, preferences[0]!)
  const found: Array<{kind: LevelCandidateKind; level: Int32Array; orders: LevelItem[][]; balanced: boolean}> = []
  const seen: Int32Array[] = []
  const add = (kind: LevelCandidateKind, level: Int32Array, balanced: boolean): void => {
    if (seen.some((s) => sameLevels(s, level))) return
    seen.push(level)
    const orders = test(level)
    if (orders) found.push({kind, level, orders, balanced})
  }
  // Rows evened out (balance-rows.ts) may not be level planar any more. Then the moved vertices among
  // the ends of the odd cycle's edges go back to their levels (and any moved neighbour an edge then
  // needs), and the test is asked again, up to UNDO_ROUNDS times: the rest of the moves stay.
  const addEvenedOut = (kind: LevelCandidateKind, from: Int32Array, moved: Int32Array): void => {
    const p = preferences[0]!
    let raw = moved
    for (let round = 0; ; round++) {
      const level = dropEmptyLevels(raw)
      if (seen.some((s) => sameLevels(s, level))) return
      // The first test from the shared budget, as for any candidate; the rounds after it from their own.
      const {orders, tested: r} = witness(level, p, round === 0 ? shared : undo)
      if (orders || r?.status !== 'not-planar' || round === UNDO_ROUNDS) {
        seen.push(level)
        if (orders) found.push({kind, level, orders, balanced: true})
        return
      }
      const back = undoMoves(g, from, raw, r.edges)
      if (!back) {
        seen.push(level)
        return
      }
      raw = back
    }
  }
  add('longest-path', longestPathUp(g), false)
  add('longest-path-down', longestPathDown(g), false)
  add('short-edges', compress(layerByWeightedSpan(g, () => 1).rank, n), false)
  const relaxed = relaxAugmentation(g, st, options.maxTests ?? 24, test)
  // The relaxed assignment, and H's own layering it started from (the st-layout's rows): evened out,
  // the latter can narrow a drawing that keeps the st-layout's height, where fewer rows would lose the
  // written order (g.10.45 of the North DAGs: a vertex between two that meet above it must stay
  // below their meeting point, so 7 rows; one box moved up beside another narrows it by a third).
  // It brings its own budget (its tests evened out, one per preference), so it never takes tests from
  // the candidates after it.
  for (const r of relaxed ? [relaxed.best, relaxed.first] : []) {
    if (seen.some((s) => sameLevels(s, r.level))) continue
    seen.push(r.level)
    found.push({kind: 'relaxed-augmentation', ...r, balanced: false})
    if (r === relaxed!.first) shared.work += 2 * preferences.length * levelTestWork(g, r.level)
  }
  // Each assignment found also with its rows evened out, and all with the orders of the other
  // preferences where they differ. The lifted and compacted assignments (the costliest searches)
  // come last, with what is left of the budget, so they never crowd out the others.
  const out: LevelCandidate[] = []
  const expand = (from: number): void => {
    const rows = options.rows
    if (rows) {
      for (const c of found.slice(from)) {
        // The narrower searched assignment (searchFewerRows) too: its bound holds the widest row
        // under the narrowest found, and evening out narrows the rest (36 drawings smaller on the
        // North DAGs, none larger; bench/README.md).
        const moved = evenRows(g, c.level, rows.across, rows.nodeGap, rows.edgeGap)
        if (moved) addEvenedOut(c.kind, c.level, moved)
      }
    }
    for (const c of found.slice(from)) {
      out.push({...c, preference: 0})
      const keys = [ordersKey(c.orders)]
      for (let p = 1; p < preferences.length; p++) {
        const orders = ordersFor(c.level, preferences[p]!)
        if (!orders || keys.includes(ordersKey(orders))) continue
        keys.push(ordersKey(orders))
        out.push({kind: c.kind, level: c.level, orders, balanced: c.balanced, preference: p})
      }
    }
  }
  expand(0)
  const done = found.length
  const lifted = liftLevels(g, options.maxTests ?? 24, (level) => probe(level, preferences[0]!))
  if (lifted) add('lifted', lifted, false)
  // From the assignment found with the fewest rows (the first of them), rows taken out one at a time.
  let fewest: Int32Array | undefined
  for (const c of found) if (!fewest || height(c.level) < height(fewest)) fewest = c.level
  const compacted = fewest && compactLevels(g, fewest, options.maxTests ?? 24, (level) => probe(level, preferences[0]!))
  if (compacted) add('compacted', compacted, false)
  // 7. The lifted search turned over: on G with its edges reversed, from the longest path to the
  // sinks, each vertex of the odd cycle lowered instead of raised.
  const reversed = createDigraph(n, Array.from({length: g.edgeCount}, (_, e): [number, number] => [g.head[e]!, g.tail[e]!]))
  const turn = (l: Int32Array): Int32Array => {
    const top = height(l) - 1
    return l.map((x) => top - x)
  }
  const lowered = liftLevels(reversed, options.maxTests ?? 24, (level) => probe(turn(level), preferences[0]!))
  if (lowered) add('lifted', turn(lowered), false)
  // 8. Searched: rows fixed, from one fewer than the fewest found down, with its own budget. The
  // others are expanded first: the searched ones' tests then never take the shared budget from them.
  expand(done)
  const expanded = found.length
  const {fewer, narrower} = searchFewerRows(g, found, options.search ?? {tests: SEARCH_TESTS, work: SEARCH_WORK}, options.rows)
  for (const searched of [fewer, narrower]) {
    if (!searched || seen.some((s) => sameLevels(s, searched.level))) continue
    seen.push(searched.level)
    found.push({kind: 'searched', level: searched.level, orders: test(searched.level) ?? searched.orders, balanced: false})
  }
  expand(expanded)
  return out
}

type Searched = {level: Int32Array; orders: LevelItem[][]}

/**
 * 8. above: while the budget lasts, a level-planar assignment with one row fewer than the fewest
 * found (searchLevels, level-search.ts), down to G's longest path; `fewer`, the last one found. Then,
 * with `widths`, at the row count reached (fewer's, else the fewest found): the narrowest assignment
 * found by searching for one whose widest row (widestRow) is narrower than the narrowest there so far,
 * near it, each find lowering the bound (branch and bound; ours); `narrower`. Assignments at the same
 * row count differ much in width (g.23.118: the 8-row drawing kept before was 772 wide, one found
 * so 510), and the other candidates only move whole rows or single vertices.
 */
function searchFewerRows(
  g: Digraph,
  found: ReadonlyArray<{level: Int32Array}>,
  budget: {tests: number; work: number},
  widths?: {across: ArrayLike<number>; nodeGap: number; edgeGap: number}
): {fewer?: Searched | undefined; narrower?: Searched | undefined} {
  if (found.length === 0) return {}
  const least = height(longestPathUp(g))
  let guide = found[0]!.level
  for (const c of found) if (height(c.level) < height(guide)) guide = c.level
  /** A search given at most `tests` of the budget, charged with what it spent. */
  const within = (tests: number, run: (part: {tests: number; work: number}) => LevelSearch): LevelSearch => {
    const part = {tests: Math.min(tests, budget.tests), work: budget.work}
    const start = {...part}
    const r = run(part)
    budget.tests -= start.tests - part.tests
    budget.work -= start.work - part.work
    return r
  }
  let best: Searched | undefined
  while (height(guide) > least) {
    // The first row is capped (SEARCH_FIRST_TESTS): most searches that find one do so within a few
    // tests, and most that do not would spend the whole budget. Each row: first near the fewest-row
    // assignment (its levels, clamped to each window) with half of the tests (the first row:
    // SEARCH_FIRST_GUIDED), then, if that stopped, without a guide with the rest.
    const rows = height(guide) - 1
    const cap = best ? budget.tests : Math.min(budget.tests, SEARCH_FIRST_TESTS)
    const before = budget.tests
    let r = within(best ? Math.ceil(cap / 2) : SEARCH_FIRST_GUIDED, (part) => searchLevels(g, rows, part, guide))
    if (r.status === 'stopped') r = within(cap - (before - budget.tests), (part) => searchLevels(g, rows, part))
    if (r.status !== 'found') break
    best = r
    guide = r.level
  }
  if (!widths) return {fewer: best}
  // With what is left, at the final row count: assignments whose widest row (widestRow) is narrower
  // than the narrowest one there so far, near it, each find tightening the bound (branch and bound).
  const rows = height(guide)
  let ref = guide
  let below = widestRow(g, ref, widths.across, widths.nodeGap, widths.edgeGap)
  for (const c of found) {
    if (height(c.level) !== rows) continue
    const w = widestRow(g, c.level, widths.across, widths.nodeGap, widths.edgeGap)
    if (w < below) [ref, below] = [c.level, w]
  }
  let narrower: Searched | undefined
  const left = {tests: SEARCH_WIDTH_TESTS, steps: SEARCH_WIDTH_STEPS}
  while (budget.tests > 0 && left.tests > 0 && left.steps > 0) {
    const before = budget.tests
    const r = within(left.tests, (part) => {
      const counted = {...part, steps: left.steps}
      const answer = searchLevels(g, rows, counted, ref, {...widths, below: below - WIDTH_STEP})
      ;[part.tests, part.work, left.steps] = [counted.tests, counted.work, counted.steps!]
      return answer
    })
    left.tests -= before - budget.tests
    if (r.status !== 'found') break
    narrower = r
    ref = r.level
    below = widestRow(g, ref, widths.across, widths.nodeGap, widths.edgeGap)
  }
  return {fewer: best, narrower}
}

/** Levels used: one more than the highest. */
function height(level: Int32Array): number {
  let top = 0
  for (let v = 0; v < level.length; v++) top = Math.max(top, level[v]! + 1)
  return top
}

function ordersKey(orders: LevelItem[][]): string {
  return orders.map((level) => level.map((item) => (item.kind === 'vertex' ? `v${item.vertex}` : `e${item.edge}`)).join(' ')).join('|')
}

/**
 * Each level sorted by rank (vertices) and edgeRank (the points where edges pass), ties by vertex
 * before edge and then id, if that draws no two segments across each other; else undefined. Between
 * two consecutive levels, segments a→c and b→d with a ≠ b and c ≠ d cross exactly when a, b and c, d
 * are in opposite orders, so sorted by their lower ends (then upper ends) the upper ends must never
 * go back. O(N log N) for N points and segments.
 */
export function ordersByRank(g: Digraph, level: Int32Array, rank: ArrayLike<number>, edgeRank: ArrayLike<number>): LevelItem[][] | undefined {
  const n = g.vertexCount
  let height = 0
  for (let v = 0; v < n; v++) height = Math.max(height, level[v]! + 1)
  // Points: vertices 0..n-1, then one per edge per level it passes.
  const pointLevel: number[] = []
  const pointKey: number[] = []
  const items: LevelItem[] = []
  for (let v = 0; v < n; v++) {
    pointLevel.push(level[v]!)
    pointKey.push(rank[v]!)
    items.push({kind: 'vertex', vertex: v})
  }
  const segLow: number[] = []
  const segHigh: number[] = []
  for (let e = 0; e < g.edgeCount; e++) {
    let prev = g.tail[e]!
    for (let l = level[g.tail[e]!]! + 1; l < level[g.head[e]!]!; l++) {
      const p = pointLevel.length
      pointLevel.push(l)
      pointKey.push(edgeRank[e]!)
      items.push({kind: 'edge', edge: e})
      segLow.push(prev)
      segHigh.push(p)
      prev = p
    }
    segLow.push(prev)
    segHigh.push(g.head[e]!)
  }
  const byLevel: number[][] = Array.from({length: height}, () => [])
  for (let p = 0; p < pointLevel.length; p++) byLevel[pointLevel[p]!]!.push(p)
  const position = new Int32Array(pointLevel.length)
  for (const points of byLevel) {
    points.sort((a, b) => pointKey[a]! - pointKey[b]! || Number(a >= n) - Number(b >= n) || a - b)
    points.forEach((p, i) => (position[p] = i))
  }
  const bands: number[][] = Array.from({length: height}, () => [])
  for (let s = 0; s < segLow.length; s++) bands[pointLevel[segLow[s]!]!]!.push(s)
  for (const band of bands) {
    band.sort((a, b) => position[segLow[a]!]! - position[segLow[b]!]! || position[segHigh[a]!]! - position[segHigh[b]!]!)
    for (let i = 1; i < band.length; i++) if (position[segHigh[band[i]!]!]! < position[segHigh[band[i - 1]!]!]!) return undefined
  }
  return byLevel.map((points) => points.map((p) => items[p]!))
}

/**
 * What the level test sets up for these levels (its P + Q, level-planarity.ts): pairs of points on
 * one level and pairs of segments between two consecutive levels, every edge passing a level being a
 * point there. O(n + m + L) for L levels.
 */
export function levelTestWork(g: LevelGraph, level: Int32Array): number {
  let height = 0
  for (let v = 0; v < g.vertexCount; v++) height = Math.max(height, level[v]! + 1)
  const points = new Float64Array(height)
  const segments = new Float64Array(height)
  for (let v = 0; v < g.vertexCount; v++) points[level[v]!]!++
  // Difference arrays: an edge from level a to b adds a point on a+1..b-1 and a segment on a..b-1.
  const pointStep = new Float64Array(height + 1)
  const segStep = new Float64Array(height + 1)
  for (let e = 0; e < g.edgeCount; e++) {
    const a = level[g.tail[e]!]!
    const b = level[g.head[e]!]!
    pointStep[a + 1]!++
    pointStep[b]!--
    segStep[a]!++
    segStep[b]!--
  }
  let work = 0
  let p = 0
  let q = 0
  for (let l = 0; l < height; l++) {
    p += pointStep[l]!
    q += segStep[l]!
    const k = points[l]! + p
    work += (k * (k - 1)) / 2 + (q * (q - 1)) / 2
  }
  return work
}

/** 5. above: lift vertices of the odd cycle until the test says planar; the levels, or undefined. */
function liftLevels(g: Digraph, maxTests: number, probe: (level: Int32Array) => LevelPlanarity | undefined): Int32Array | undefined {
  const n = g.vertexCount
  const order = topologicalOrder(g)
  // Raw levels: longest path from the sources with a floor per vertex; compressed for the test.
  const raise = (floor: Int32Array): Int32Array => {
    const raw = new Int32Array(n)
    for (const v of order) {
      raw[v] = floor[v]!
      for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) raw[v] = Math.max(raw[v]!, raw[g.tail[g.inEdges[i]!]!]! + 1)
    }
    return raw
  }
  let floor: Int32Array = new Int32Array(n)
  let raw: Int32Array = raise(floor)
  // Assignments already tested: a raise that gives one of them again (its vertex was already on top,
  // or the compression undoes it) would repeat the step without progress.
  const seen = new Set<string>([compress(raw, n).join(',')])
  let result = probe(compress(raw, n))
  let tests = 1
  while (result?.status === 'not-planar' && tests < maxTests) {
    const touched = new Set<number>()
    for (const e of result.edges) {
      touched.add(g.tail[e]!)
      touched.add(g.head[e]!)
    }
    let best: {floor: Int32Array; raw: Int32Array; result: LevelPlanarity; score: number} | undefined
    for (const v of [...touched].sort((a, b) => a - b)) {
      if (tests >= maxTests) break
      const f = floor.slice()
      f[v] = raw[v]! + 1
      const r = raise(f)
      const level = compress(r, n)
      const key = level.join(',')
      if (seen.has(key)) continue
      seen.add(key)
      const answer = probe(level)
      tests++
      if (!answer || answer.status === 'undecided') continue
      const score = (answer.status === 'planar' ? 0 : 1e9) + height(level) * 1e5 + (answer.status === 'not-planar' ? answer.edges.length : 0)
      if (!best || score < best.score) best = {floor: f, raw: r, result: answer, score}
      if (answer.status === 'planar') break
    }
    if (!best) return undefined
    floor = best.floor
    raw = best.raw
    result = best.result
  }
  return result?.status === 'planar' ? compress(raw, n) : undefined
}

/**
 * 6. above: take rows out of a level-planar assignment one at a time. Row r goes by moving every
 * vertex from r up one level down, or every vertex below r one level up, each as far as its edges
 * allow (a vertex whose neighbour blocks it stays, and pushes its own successors, or predecessors,
 * back); a move counts only if the height drops. The first move (top row first, down before up)
 * that the test answers planar is taken, until none is or `maxTests` tests have run. Assignments
 * already tested are not tested again. A greedy search (ours); O(L · (n + m)) per step besides the
 * tests, for L levels.
 */
function compactLevels(g: Digraph, start: Int32Array, maxTests: number, probe: (level: Int32Array) => LevelPlanarity | undefined): Int32Array | undefined {
  const n = g.vertexCount
  const order = topologicalOrder(g)
  let cur = start
  let improved = false
  let tests = 0
  const seen = new Set<string>([start.join(',')])
  while (tests < maxTests) {
    const h = height(cur)
    let next: Int32Array | undefined
    const moves: Array<[number, boolean]> = []
    for (let r = h - 1; r >= 1; r--) moves.push([r, true], [r, false])
    for (const [r, down] of moves) {
      if (tests >= maxTests) break
      const raw = new Int32Array(n)
      if (down) {
        for (const v of order) {
          raw[v] = cur[v]! >= r ? cur[v]! - 1 : cur[v]!
          for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) raw[v] = Math.max(raw[v]!, raw[g.tail[g.inEdges[i]!]!]! + 1)
        }
      } else {
        for (let k = n - 1; k >= 0; k--) {
          const v = order[k]!
          raw[v] = cur[v]! < r ? cur[v]! + 1 : cur[v]!
          for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) raw[v] = Math.min(raw[v]!, raw[g.head[g.outEdges[i]!]!]! - 1)
        }
      }
      const level = compress(raw, n)
      if (height(level) >= h) continue
      const key = level.join(',')
      if (seen.has(key)) continue
      seen.add(key)
      tests++
      if (probe(level)?.status === 'planar') {
        next = level
        break
      }
    }
    if (!next) break
    cur = next
    improved = true
  }
  return improved ? cur : undefined
}

/** Longest path to the sinks, turned over: the top level minus the longest path starting at v. */
export function longestPathDown(g: Digraph): Int32Array {
  const depth = longestPathToSinks(g)
  let top = 0
  for (let v = 0; v < depth.length; v++) if (depth[v]! > top) top = depth[v]!
  return depth.map((d) => top - d)
}

/** The first n ranks renumbered 0, 1, … keeping their order (ranks no vertex of G uses disappear). */
function compress(rank: ArrayLike<number>, n: number): Int32Array {
  const used = Array.from(new Set(Array.from({length: n}, (_, v) => rank[v]!))).sort((a, b) => a - b)
  const index = new Map(used.map((r, i) => [r, i]))
  return Int32Array.from({length: n}, (_, v) => index.get(rank[v]!)!)
}

function sameLevels(a: Int32Array, b: Int32Array): boolean {
  if (a.length !== b.length) return false
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false
  return true
}

/** Ranks of H's vertices by longest path over G's edges and the kept added edges. */
interface Relaxation {
  rank: Int32Array
  /** Longest path starting at each vertex, over the same edges. */
  depth: Int32Array
  /** G's levels: the ranks of G's vertices, compressed. */
  level: Int32Array
}

function longest(r: Relaxation): number {
  let top = 0
  for (let v = 0; v < r.rank.length; v++) top = Math.max(top, r.rank[v]!)
  return top
}

function relaxation(g: Digraph, h: Digraph, keep: Uint8Array): Relaxation {
  const m = g.edgeCount
  const edges: Array<[number, number]> = []
  for (let e = 0; e < h.edgeCount; e++) if (e < m || keep[e - m]) edges.push([h.tail[e]!, h.head[e]!])
  const k = createDigraph(h.vertexCount, edges)
  const order = topologicalOrder(k)
  const rank = longestPathUp(k, order)
  return {rank, depth: longestPathToSinks(k, order), level: compress(rank, g.vertexCount)}
}

/** 4. above: drop added edges on longest paths while the level test says planar. */
function relaxAugmentation(
  g: Digraph,
  st: StAugmentation,
  maxTests: number,
  test: (level: Int32Array) => LevelItem[][] | undefined
): {best: {level: Int32Array; orders: LevelItem[][]}; first: {level: Int32Array; orders: LevelItem[][]}} | undefined {
  const h = st.graph
  const m = g.edgeCount
  const added = h.edgeCount - m
  if (added === 0 || maxTests < 1) return undefined
  const keep = new Uint8Array(added).fill(1)
  let current = relaxation(g, h, keep)
  let orders = test(current.level)
  let tests = 1
  if (!orders) return undefined
  const first = {level: current.level, orders}
  let best = first
  while (tests < maxTests) {
    // Kept added edges that are tight and lie on a longest path of the current graph.
    const top = longest(current)
    const critical: number[] = []
    for (let e = m; e < h.edgeCount; e++) {
      const a = h.tail[e]!
      const b = h.head[e]!
      if (keep[e - m] && current.rank[a]! + 1 === current.rank[b]! && current.rank[b]! + current.depth[b]! === top) critical.push(e)
    }
    if (critical.length === 0) break
    const all = keep.slice()
    for (const e of critical) all[e - m] = 0
    const lower = relaxation(g, h, all)
    // A longest path of G's own edges: no drop can lower the height. (H's longest path counts its
    // added source and sink too, which G's levels do not, so compare H's.)
    if (longest(lower) >= top) break
    tests++
    const allOrders = test(lower.level)
    if (allOrders) {
      keep.set(all)
      current = lower
      best = {level: lower.level, orders: allOrders}
      continue
    }
    // One at a time, in id order: the first drop that stays planar is kept.
    let moved = false
    for (const e of critical) {
      if (tests >= maxTests) break
      const one = keep.slice()
      one[e - m] = 0
      const next = relaxation(g, h, one)
      tests++
      const nextOrders = test(next.level)
      if (!nextOrders) continue
      keep.set(one)
      current = next
      best = {level: next.level, orders: nextOrders}
      moved = true
      break
    }
    if (!moved) break
  }
  return {best, first}
}

/**
 * `moved` with the moved vertices among the ends of `edges` set back to their levels in `from` (same
 * numbering), then every moved vertex an edge no longer rises over set back too, until every edge
 * rises (it does once all are back); undefined when none of the ends was moved. O((n + m) · rounds).
 */
export function undoMoves(g: Digraph, from: Int32Array, moved: Int32Array, edges: readonly number[]): Int32Array | undefined {
  const out = moved.slice()
  let any = false
  for (const e of edges) {
    for (const v of [g.tail[e]!, g.head[e]!]) {
      if (out[v] !== from[v]) { out[v] = from[v]!; any = true }
    }
  }
  if (!any) return undefined
  for (let again = true; again;) {
    again = false
    for (let e = 0; e < g.edgeCount; e++) {
      const a = g.tail[e]!, b = g.head[e]!
      if (out[a]! < out[b]!) continue
      for (const v of [a, b]) if (out[v] !== from[v]) { out[v] = from[v]!; again = true }
    }
  }
  return out
}
