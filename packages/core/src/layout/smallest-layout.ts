/**
 * The drawing a diagram without tiers gets: the smallest in area among the st-layout
 * (layout-upward.ts, rows from the st-augmentation H) and level drawings (level-layout.ts) of the
 * level-planar assignments with fewer rows that level-candidates.ts finds. All are upward and
 * crossing-free by construction; the choice only compares width × height, row counts and total edge
 * lengths, so it is deterministic (no clock). Ties keep the earlier candidate, the st-layout first. A
 * level drawing with as many rows as the st-layout must be clearly smaller (SAME_ROWS_GAIN), and any
 * level drawing must have less area times total edge length than the st-layout (`ink`): a smaller
 * drawing whose edges wind round the rows reads worse than the st-layout's.
 *
 * Then the smallest drawing kept so far is tried once more with one spare row (balance-rows.ts:
 * evenRowsWithSpare), on budgets of its own; then the area search runs once more on deeper budgets,
 * below the drawing that would be kept, and last that drawing's rows are evened out by area (tall
 * boxes sharing rows); both offer only drawings below it, so they can only make it smaller, and only
 * drawings that also lower its area times its total edge length (`ink`), so they do not buy a little
 * room with long winding edges.
 *
 * The level candidates are tried only up to `maxEdges` edges (the level test is quadratic in the
 * level widths; past that size the st-layout alone is used, which is linear) and each test is bounded
 * by deterministic work counts (level-candidates.ts).
 *
 * Orders on the levels: each level assignment is drawn with three preferred orders, where they differ:
 * the st-layout's (each vertex's and edge's abscissa in H's visibility representation, dual-order.ts),
 * the written order (edge ids) and a depth-first walk in written order. Each is used as it is when it
 * draws no crossing, and otherwise breaks ties in the level test; a drawing is mirrored when the
 * mirror shows more out-edges in written order. A level drawing smaller than the st-layout but below
 * its written order gets other witnesses of its levels asked for (towardsWrittenOrder); one vertex
 * short, witnesses with the written order of the vertices that show it and of one more forced
 * (forcedWrittenOrder); where none shows more, the out-neighbours of the vertices out of written order
 * lowered (lowerOutNeighbours), and, one vertex short, nearby levels walked to by the forced pairs'
 * certificates (forcedLevelMoves); all within per-diagram counts of tests. Each level drawing is also asked once for a witness whose widest
 * level packs narrower (narrowerWitness), kept when drawn narrower. Last, on its own budget, level
 * drawings of assignments searched for by area (area-search.ts) below the smallest drawing kept so
 * far, with the st-layout's written order forced. A level drawing that shows fewer vertices' out-edges in written
 * order than the st-layout is kept only for a clear gain in area, per vertex (WRITTEN_GAIN; with
 * `keepWrittenOrder` false, areas alone), so the choice seldom undoes the written-order preference of the upward test.
 */
import {boxHalves, resolveSpacing} from './banded-drawing.ts'
import {dualOrder} from './dual-order.ts'
import {layoutLevels} from './level-layout.ts'
import {levelCandidates, levelTestWork, undoMoves, type LevelCandidateKind, type OrderPreference} from './level-candidates.ts'
import {testLevelPlanarity, type ForcedLevelPlanarity, type ForcedPair, type LevelItem} from '../level/level-planarity.ts'
import {checkLevelDrawing} from '../level/check-level-drawing.ts'
import {layoutUpward} from './layout-upward.ts'
import {dropEmptyLevels, evenRows, evenRowsWithSpare} from './balance-rows.ts'
import {searchByArea} from './area-search.ts'
import {totalEdgeLength} from './stats.ts'
import type {Digraph} from '../graph/digraph.ts'
import type {Layout, LayoutInput} from './types.ts'

/**
 * A level drawing with no fewer rows than the st-layout is kept only when its area is at most this
 * share of the st-layout's. The st-layout's rows follow the diagram's own paths from its sources (an
 * author's layers stay layers); moving vertices to other rows of the same height changes that picture
 * and is worth it only for a clear gain. Tuned on the North sample of `bench/layout.ts --quick`
 * (2026-12-02): 0.8 keeps every graph that the rearrangements bring under the reference library's
 * area (5 of 82 larger, as without the rule; 12 of 82 if same-height drawings are never kept), while
 * the demo's service diagram (a 17% gain) keeps its layers. A level drawing with exactly the
 * st-layout's rows (every vertex on the same row) moves no vertex, so it is kept whenever smaller (8 North
 * DAGs drawn smaller, 2026-12-03, bench/README.md).
 */
export const SAME_ROWS_GAIN = 0.8

/**
 * A level drawing that shows k vertices fewer with their out-edges in written order than the
 * st-layout is kept only when its area is at most this share to the power k of the smallest drawing
 * that shows as many: the author's order is a strong preference, not a wall, and each vertex given
 * up must pay for itself. On the 813 North DAGs with the layout bench's boxes (2026-12-03, scratch
 * comparisons with the code before, bench/README.md): 16 graphs drawn smaller, 19 of their 3,140
 * written-order vertices given up; g.14.40, g.37.18 and g.43.0 go below the reference library's area.
 * One share for any k (0.8) drew 20 smaller for 31 vertices, and the area search's finds out of
 * written order, kept at that share, redrew the demo's seed-lot diagram with half its lists reordered;
 * per vertex, those finds draw 2 more graphs smaller and leave that diagram as it was.
 */
export const WRITTEN_GAIN = 0.8

/**
 * Level tests, and pairs they set up, that the written-order repair (towardsWrittenOrder) may spend
 * per diagram; deterministic counts, no clock. On the North DAGs (2026-12-02, a scratch run of the
 * bench's comparison): 12, 24 or 48 tests left ours larger than the reference library in 53 of 813
 * graphs, 24 with the smallest total area; without the repair 60.
 */
const REPAIR_TESTS = 24
const REPAIR_WORK = 500_000

/**
 * Level tests, and pairs they set up, that forcedWrittenOrder may spend per diagram (its own budget,
 * so the repair above keeps every test it had); deterministic counts.
 */
const FORCED_TESTS = 96
const FORCED_WORK = 1_000_000
/** Level tests forcedLevelMoves may spend on one vertex's walk. */
const FORCED_MOVES_PER_VERTEX = 16

/**
 * Level tests, and pairs they set up, that narrowerWitness may spend per diagram (its own budget, so
 * it never takes tests from the written-order repair); deterministic counts.
 */
const NARROW_TESTS = 8
const NARROW_WORK = 250_000

/**
 * The area-searched candidate (area-search.ts): its own budget per diagram (level tests, pairs they
 * set up, levels tried), the most tests one search may spend, the row counts it searches past the
 * fewest any level candidate has, and by how much (px) each find must be narrower than the last at one
 * row count; deterministic counts. On the 813 North DAGs (2026-12-03, scratch comparison with the
 * bench's boxes, bench/README.md): 48 tests and 1,000 levels drew 257 graphs smaller, none larger.
 * With the bar for more rows at 0.8 (TALLER_GAIN): 313 at 1.25x the CPU, 3,000 levels 348 at 1.42x,
 * 96 tests and 6,000 levels 382 at 1.60x, 32 tests and 2,000 levels 307 at 1.36x (two-round runs).
 */
const AREA_TESTS = 48
const AREA_WORK = 1_000_000
const AREA_STEPS = 1_000
const AREA_PER_SEARCH = 16
const AREA_EXTRA_ROWS = 2
const AREA_STEP = 0.5
/**
 * The rows evened out by area (the 'area-evened' candidate), last: level tests per pass (the first,
 * then one per round of moves set back), and passes. On the 813 North DAGs with the bench's boxes
 * (2026-12-03, scratch A/B against the code before, CPU of layoutSmallest in one process): one pass by
 * area 98 drawn smaller, none larger, total area 0.989, CPU within noise; three passes 10 more; by
 * widths alone when by area offers nothing, 5 more (99 in all, total 0.986). By widths alone only:
 * 45 smaller, total 0.995. g.49.17 goes under the reference library's area (1.016 to 0.742 of it).
 * Run before the deep search instead: 90 smaller but 4 larger (it changes that search's bound and
 * guides).
 */
const EVEN_TESTS = 25
const EVEN_PASSES = 3
/**
 * The deep area search (the 'deep-searched' candidate): the area search once more, after the spare
 * row, aiming below the drawing layoutSmallest would keep, on budgets of its own per diagram (level tests, levels
 * tried, the retry's tests and levels, pairs set up for each); deterministic counts. Small diagrams run
 * out of levels tried first, large ones out of pairs, so the pairs bound its cost by the graph's size.
 * On the 813 North DAGs with the bench's boxes (2026-12-03, scratch A/B against the code before, CPU
 * of layoutSmallest in one process): 275 drawn smaller, none larger, total area 0.972, CPU 2.6x;
 * g.21.34, g.23.99 and g.31.0 go below the reference library's area. 10,000 and 15,000 levels: 252
 * smaller at 2.3x; 40,000 and 60,000: 294 at 3.1x; 100,000 and 150,000 with 50,000,000 pairs: 319 at
 * 5.2x, and a 100-vertex generated graph 2 s slower for nothing.
 */
const DEEP_TESTS = 2_000
const DEEP_STEPS = 20_000
const DEEP_PER_SEARCH = 400
const DEEP_RETRY_TESTS = 1_000
const DEEP_RETRY_STEPS = 30_000
const DEEP_WORK = 500_000
/**
 * The area-searched candidate's retry with other written-order sets (area-search.ts): its own
 * budget per diagram (level tests, pairs, levels tried) and the most sets tried at one row count;
 * deterministic counts. Its own so that the searches before it are the same as without it. On the
 * 813 North DAGs (2026-12-03, scratch A/B, bench's boxes): 24 drawn smaller, none larger, CPU 1.05x;
 * 16 tests 21 smaller, 32 tests 28 or 29 smaller but one larger (g.22.19), 8 sets as 4 (bench/README.md).
 */
const AREA_RETRY_TESTS = 24
const AREA_RETRY_STEPS = 1_500
const AREA_RETRY_SETS = 4
/**
 * The candidate's own bar for more rows than the st-layout: at most this share of its area (the
 * same-height rule asks 0.8 of any drawing). Stretched over more rows than the diagram's paths give,
 * a drawing reads worse for its area: at 0.8 the golden diamond-down was redrawn with its two
 * siblings on two rows (0.78 of the area, a column with curved edges), fan-left and
 * edge-labels-right likewise; at 0.7 they keep their drawings (bench/README.md).
 */
const TALLER_GAIN = 0.7

/**
 * The spare-row candidate's own budgets per diagram (level tests for the test and the written-order
 * repair, tests for the forced repair, pairs set up by each); deterministic counts. On the North DAGs
 * (2026-12-03, scratch A/B against the code before): 4 and 8 tests drew 111 graphs smaller, 8 and 16
 * 113, 16 and 32 116, none larger, each within the CPU noise of one pass (bench/README.md).
 */
const SPARE_TESTS = 8
const SPARE_FORCED_TESTS = 16
const SPARE_WORK = 250_000

export interface SmallestLayoutOptions {
  /** Try level candidates only for graphs with at most this many edges. Default 600. */
  maxEdges?: number | undefined
  /**
   * Keep a level drawing only if at least as many vertices show their out-edges left to right in
   * written order (edge id order) as in the st-layout, whose embedding was chosen with that
   * preference (check/written-order.ts), or if, with k vertices fewer, it is at most WRITTEN_GAIN^k
   * of the area of every drawing that does. Default true; false compares areas alone.
   */
  keepWrittenOrder?: boolean | undefined
}

/** Budgets of one area search per diagram (searchByArea's budget and retry, and its most tests per search). */
interface AreaBudget {
  tests: number
  steps: number
  perSearch: number
  retryTests: number
  retrySteps: number
  work: number
}

export interface SmallestLayout {
  layout: Layout
  /** Which drawing was kept. */
  kind: 'st' | LevelCandidateKind | 'area-searched' | 'spare-row' | 'area-evened' | 'deep-searched'
  /** For a level drawing: whether its rows were evened out. */
  balanced: boolean
}

export function layoutSmallest(input: LayoutInput, options: Readonly<SmallestLayoutOptions> = {}): SmallestLayout {
  return choose(input.graph, layoutCandidates(input, options), options.keepWrittenOrder ?? true)
}

/**
 * The drawing layoutSmallest keeps among these candidates (the st-layout first): the smallest the
 * written-order and same-height rules allow, unless (with `keep`) a drawing the same-height rule
 * allows with k vertices fewer in written order than the st-layout is at most WRITTEN_GAIN^k of its
 * area; the written order yields only to a clear gain, paid per vertex.
 */
function choose(g: Digraph, candidates: readonly SmallestLayout[], keep: boolean): SmallestLayout {
  const [first, ...levelDrawings] = candidates
  const area = (l: Layout): number => l.width * l.height
  const kept = keptBy(g, first!.layout, keep)
  let best = first!
  for (const c of levelDrawings) if (kept(c.layout) && area(c.layout) < area(best.layout)) best = c
  if (!keep) return best
  const sameHeight = keptBy(g, first!.layout, false)
  const floor = writtenOrderKept(g, first!.layout)
  let plain = best
  for (const c of levelDrawings) if (sameHeight(c.layout) && area(c.layout) < area(plain.layout) && paysForOrder(g, floor, c.layout, area(best.layout))) plain = c
  return plain
}

/**
 * Whether a drawing with fewer vertices in written order than `floor` (the st-layout's count) is
 * small enough for it: at most WRITTEN_GAIN per vertex given up of `inOrder`, the smallest area that
 * keeps the order (true for a drawing that gives none up and is no larger). O(m log m).
 */
function paysForOrder(g: Digraph, floor: number, layout: Layout, inOrder: number): boolean {
  return layout.width * layout.height <= WRITTEN_GAIN ** (floor - writtenOrderKept(g, layout)) * inOrder
}

/**
 * A drawing's area times its total edge length. A drawing with less than another saves more room
 * than it adds ink: a level drawing must have less than the st-layout (keptBy), and a drawing of the
 * last steps (the deep search, the rows evened out by area) less than the drawing it would replace.
 * Those drawings fold wide rows and fans over more rows; without this, some folds bought a few
 * percent of area with bundles of long edges winding round the rows (g.14.68 of the North DAGs:
 * 0.985 of the area for 1.4 times the edge length), and some small trees were drawn as cramped
 * columns (bench/README.md). Callers compute the side they compare against once. O(points).
 */
function ink(layout: Layout): number {
  return layout.width * layout.height * totalEdgeLength(layout)
}

/**
 * Whether layoutSmallest may keep a level drawing beside this st-layout: the written-order rule
 * (with `keep`), the same-height rule (SAME_ROWS_GAIN), and less ink than the st-layout (`ink`).
 */
function keptBy(g: Digraph, st: Layout, keep: boolean): (l: Layout) => boolean {
  const floor = keep ? writtenOrderKept(g, st) : 0
  const stRows = rowCount(st)
  const stArea = st.width * st.height
  const stLevels = rowsOf(g, st).join(',')
  const stInk = ink(st)
  return (l) =>
    !(keep && writtenOrderKept(g, l) < floor) &&
    !(rowCount(l) >= stRows && l.width * l.height > SAME_ROWS_GAIN * stArea && rowsOf(g, l).join(',') !== stLevels) &&
    ink(l) < stInk
}

/** Every drawing layoutSmallest compares, the st-layout first (for tests and benches). */
export function layoutCandidates(input: LayoutInput, options: Readonly<SmallestLayoutOptions> = {}): SmallestLayout[] {
  const out: SmallestLayout[] = [{layout: layoutUpward(input), kind: 'st', balanced: false}]
  const g = input.graph
  if (g.edgeCount === 0 || g.edgeCount > (options.maxEdges ?? 600)) return out
  const {vertexKey, edgeKey} = dualOrder(input.st.embedding, input.st.faces, input.st.outerFace)
  const spacing = resolveSpacing(input.spacing)
  const {halfU} = boxHalves(input.boxes, g.vertexCount, input.flow)
  const rows = {across: halfU.map((h) => 2 * h), nodeGap: spacing.node, edgeGap: spacing.edge}
  const preferences = [{rank: vertexKey.subarray(0, g.vertexCount), edgeRank: edgeKey.subarray(0, g.edgeCount)}, writtenPlaces(g), depthFirstPlaces(g)]
  const floor = writtenOrderKept(g, out[0]!.layout)
  const stArea = out[0]!.layout.width * out[0]!.layout.height
  const repair = {tests: REPAIR_TESTS, work: REPAIR_WORK}
  const forcing: ForcedBudget = {tests: FORCED_TESTS, work: FORCED_WORK, failed: new Map()}
  const narrow = {tests: NARROW_TESTS, work: NARROW_WORK}
  const draw = (level: Int32Array, orders: LevelItem[][]): Layout => layoutLevels({graph: g, level, orders, boxes: input.boxes, flow: input.flow, spacing: input.spacing}).layout
  const levels: Int32Array[] = []
  /**
   * The drawing of a level-planar assignment: smaller than the st-layout but below its written order
   * (so layoutSmallest would pass it by): other orders of the same levels that show more of it, else
   * (one vertex short) orders that keep what is in written order and add a vertex, else the same
   * drawing with the out-neighbours of the vertices not in written order lowered, while the budgets
   * last; then a narrower witness if it draws narrower.
   */
  const finish = (start: Int32Array, witness: LevelItem[][], repair: {tests: number; work: number}, forcing: ForcedBudget, narrow: {tests: number; work: number}): {layout: Layout; level: Int32Array} => {
    let level = start
    let orders = writtenOrderFacing(g, level, witness)
    let layout = draw(level, orders)
    while (layout.width * layout.height < stArea && writtenOrderKept(g, layout) < floor) {
      const better = towardsWrittenOrder(g, level, orders, repair) ?? forcedWrittenOrder(g, level, orders, floor, forcing)
      if (better) orders = better
      else {
        const lowered = lowerOutNeighbours(g, level, orders, repair) ?? forcedLevelMoves(g, level, orders, floor, forcing)
        if (!lowered) break
        ;({level, orders} = lowered)
      }
      layout = draw(level, orders)
    }
    const narrower = narrowerWitness(g, level, orders, rows.across, spacing, narrow)
    if (narrower) {
      const other = draw(level, narrower)
      if (other.width < layout.width && writtenOrderKept(g, other) >= writtenOrderKept(g, layout)) layout = other
    }
    return {layout, level}
  }
  for (const c of levelCandidates(g, input.st, {preferences, rows})) {
    const {layout, level} = finish(c.level, c.orders, repair, forcing, narrow)
    out.push({layout, kind: c.kind, balanced: c.balanced})
    levels.push(level)
  }
  // Last, on its own budget: assignments searched for by area (area-search.ts), below the smallest
  // drawing layoutSmallest would keep so far, each keeping the written order the st-layout shows.
  // With the default rules whatever `keepWrittenOrder` says, so that the drawings compared do not
  // depend on it (only the choice among them does).
  if (levels.length === 0) return out
  const kept = keptBy(g, out[0]!.layout, true)
  // Guides: the rows of the drawings it may keep (the st-layout's too), the smallest first.
  const keepable = [out[0]!, ...out.slice(1).filter((c) => kept(c.layout))].sort((a, b) => a.layout.width * a.layout.height - b.layout.width * b.layout.height)
  let fewest = Infinity
  for (const level of levels) fewest = Math.min(fewest, 1 + Math.max(...level))
  const {halfV} = boxHalves(input.boxes, g.vertexCount, input.flow)
  const stRows = rowCount(out[0]!.layout)
  const cap = (k: number): number => (k < stRows ? Infinity : k === stRows ? SAME_ROWS_GAIN * stArea : TALLER_GAIN * stArea)
  const sameHeight = keptBy(g, out[0]!.layout, false)
  let inOrder = keepable[0]!.layout.width * keepable[0]!.layout.height
  const along = halfV.map((h) => 2 * h)
  /**
   * One area search (area-search.ts) below `area`, on these budgets; a find is offered to
   * layoutSmallest, as `kind`, only when drawn below `below` too and `worth` it.
   */
  const searchArea = (kind: 'area-searched' | 'deep-searched', area: number, below: number, guides: Int32Array[], budget: AreaBudget, worth: (l: Layout) => boolean = () => true): void =>
    searchByArea(g, {
      across: rows.across,
      along,
      nodeGap: spacing.node,
      edgeGap: spacing.edge,
      layerGap: spacing.layer,
      area,
      from: fewest,
      to: fewest + AREA_EXTRA_ROWS,
      cap,
      guides,
      written: writtenOrderVertices(g, out[0]!.layout),
      budget: {tests: budget.tests, work: budget.work, steps: budget.steps},
      keeps: (level, orders) => {
        const {wrong} = writtenOrderCounts(g, level, writtenOrderFacing(g, level, orders))
        const out = new Set(wrong)
        const kept: number[] = []
        for (let v = 0; v < g.vertexCount; v++) if (g.outStart[v + 1]! - g.outStart[v]! >= 2 && !out.has(v)) kept.push(v)
        return kept
      },
      retry: {tests: budget.retryTests, work: budget.work, steps: budget.retrySteps},
      retrySets: AREA_RETRY_SETS,
      perSearch: budget.perSearch,
      step: AREA_STEP,
      measure: (level, orders) => {
        const layout = draw(level, writtenOrderFacing(g, level, orders))
        const area = layout.width * layout.height
        if (area > cap(rowCount(layout)) || area >= below || !worth(layout)) return Infinity
        if (!kept(layout)) {
          // Out of written order (the retry's searches without it): offered to layoutSmallest when
          // the same-height rule allows it and it pays for each vertex it gives up (WRITTEN_GAIN); the
          // search still aims below the smallest drawing that keeps the order.
          if (sameHeight(layout) && paysForOrder(g, floor, layout, inOrder)) out.push({layout, kind, balanced: false})
          return Infinity
        }
        out.push({layout, kind, balanced: false})
        inOrder = Math.min(inOrder, area)
        return area
      },
    })
  searchArea('area-searched', inOrder, Infinity, keepable.map((c) => rowsOf(g, c.layout)), {tests: AREA_TESTS, steps: AREA_STEPS, perSearch: AREA_PER_SEARCH, retryTests: AREA_RETRY_TESTS, retrySteps: AREA_RETRY_STEPS, work: AREA_WORK})
  // Then, on budgets of its own: the smallest drawing layoutSmallest would keep so far, with one
  // spare row (balance-rows.ts: evenRowsWithSpare), so a fan of sinks or sources on its widest row
  // can spread over a row of its own; drawn and repaired like the candidates above.
  let smallest = out[0]!.layout
  for (const c of out.slice(1)) if (kept(c.layout) && c.layout.width * c.layout.height < smallest.width * smallest.height) smallest = c.layout
  // The st-layout's places (H's visibility abscissae) as the level test's preference.
  const stPlaces = {rank: Float64Array.from(vertexKey.subarray(0, g.vertexCount)), edgeRank: Float64Array.from(edgeKey.subarray(0, g.edgeCount)), majority: true}
  const spare = {repair: {tests: SPARE_TESTS, work: SPARE_WORK}, forcing: {tests: SPARE_FORCED_TESTS, work: SPARE_WORK, failed: new Map()} as ForcedBudget, narrow: {tests: NARROW_TESTS, work: NARROW_WORK}}
  for (const level of evenRowsWithSpare(g, rowsOf(g, smallest), rows.across, rows.nodeGap, rows.edgeGap)) {
    const tested = paidLevelTest(g, level, stPlaces, spare.repair)
    if (tested?.status !== 'planar') continue
    const {layout} = finish(level, tested.orders, spare.repair, spare.forcing, spare.narrow)
    // Taller than the st-layout: the area-searched candidate's bar (TALLER_GAIN) holds here too.
    if (rowCount(layout) > rowCount(out[0]!.layout) && layout.width * layout.height > TALLER_GAIN * stArea) continue
    out.push({layout, kind: 'spare-row', balanced: true})
  }
  // Then, on deeper budgets of its own: the area search once more, below the drawing layoutSmallest
  // would keep now, a find offered only when drawn below it, so this can make the kept drawing
  // smaller, never larger (larger budgets in the search above change what it steers, both ways:
  // bench/README.md). Guides: the rows of that drawing first, then those of the keepable ones.
  const now = choose(g, out, true).layout
  const nowInk = ink(now)
  for (const c of out) if (kept(c.layout)) inOrder = Math.min(inOrder, c.layout.width * c.layout.height)
  const guides = [now, ...out.filter((c) => kept(c.layout)).map((c) => c.layout).sort((a, b) => a.width * a.height - b.width * b.height)].map((l) => rowsOf(g, l))
  searchArea('deep-searched', now.width * now.height, now.width * now.height, guides, {tests: DEEP_TESTS, steps: DEEP_STEPS, perSearch: DEEP_PER_SEARCH, retryTests: DEEP_RETRY_TESTS, retrySteps: DEEP_RETRY_STEPS, work: DEEP_WORK}, (l) => ink(l) < nowInk)
  // Last, the rows of the drawing that would be kept, evened out by area (balance-rows.ts with the
  // rows' heights: single vertices moved where that lowers the widest row times the rows' height, so
  // tall boxes can share rows), else by widths alone, the moves the level test's odd cycle blames set
  // back as level-candidates.ts does; drawn and repaired like the spare row, offered only when drawn
  // smaller than that drawing (so the kept drawing can only shrink), again from each smaller one,
  // EVEN_PASSES times at most. Each pass on budgets of its own, the spare row's sizes for the repair.
  // After the deep search, whose bound and guides it would change both ways (bench/README.md).
  for (let pass = 0; pass < EVEN_PASSES; pass++) {
    const before = choose(g, out, true).layout
    const beforeInk = ink(before)
    const from = rowsOf(g, before)
    const tests = {tests: EVEN_TESTS, work: SPARE_WORK}
    const repairs = {repair: {tests: SPARE_TESTS, work: SPARE_WORK}, forcing: {tests: SPARE_FORCED_TESTS, work: SPARE_WORK, failed: new Map()} as ForcedBudget, narrow: {tests: NARROW_TESTS, work: NARROW_WORK}}
    const count = out.length
    for (const heights of [{along, layerGap: spacing.layer}, undefined]) {
      if (out.length > count) break
      let raw = evenRows(g, from, rows.across, rows.nodeGap, rows.edgeGap, 0, heights)
      while (raw) {
        const level = dropEmptyLevels(raw)
        const tested = paidLevelTest(g, level, stPlaces, tests)
        if (tested?.status === 'planar') {
          const {layout} = finish(level, tested.orders, repairs.repair, repairs.forcing, repairs.narrow)
          if (layout.width * layout.height < before.width * before.height && ink(layout) < beforeInk) out.push({layout, kind: 'area-evened', balanced: true})
        }
        if (tested?.status !== 'not-planar') break
        raw = undoMoves(g, from, raw, tested.edges)
      }
    }
    if (out.length === count) break
  }
  return out
}

/**
 * How many vertices show their out-edges in written order with these orders, and with them mirrored,
 * and the vertices that do not. A vertex's out-edges leave in the order of their next objects on the
 * level above (level-layout.ts, ties by edge id), so this is read off the orders. O(N + m log m) for
 * N items.
 */
function writtenOrderCounts(g: Digraph, level: ArrayLike<number>, orders: LevelItem[][]): {forward: number; backward: number; wrong: number[]} {
  const vertexAt = new Int32Array(g.vertexCount)
  const edgeAt = new Map<number, number>()
  const lv = orders.length
  for (let l = 0; l < lv; l++) {
    orders[l]!.forEach((item, i) => {
      if (item.kind === 'vertex') vertexAt[item.vertex] = i
      else edgeAt.set(item.edge * (lv + 1) + l, i)
    })
  }
  const next = (e: number): number => {
    const t = g.tail[e]!
    const h = g.head[e]!
    return level[h] === level[t]! + 1 ? vertexAt[h]! : edgeAt.get(e * (lv + 1) + level[t]! + 1)!
  }
  let forward = 0
  let backward = 0
  const wrong: number[] = []
  for (let v = 0; v < g.vertexCount; v++) {
    const from = g.outStart[v]!
    const to = g.outStart[v + 1]!
    if (to - from < 2) continue
    const edges = Array.from(g.outEdges.subarray(from, to))
    const inOrder = (sign: number): boolean => {
      const sorted = edges.slice().sort((a, b) => sign * (next(a) - next(b)) || a - b)
      return sorted.every((e, i) => i === 0 || sorted[i - 1]! < e)
    }
    if (inOrder(1)) forward++
    else wrong.push(v)
    if (inOrder(-1)) backward++
  }
  return {forward, backward, wrong}
}

/**
 * Another witness of the same levels, asked of the level test with the current orders as the
 * preference (each level's places scaled to [0, 1]; an edge at the mean of its places) except that
 * each vertex not in written order gets its out-edges' next objects reordered as written. The test
 * settles each group of linked left-right choices by its pairs' preference (most pairs, then the
 * first pair), so a group flips only where the reordered pairs carry it. Kept when it shows more
 * written order (after the mirror choice); else undefined. At most two level tests, each counted
 * against `budget` (tests, and pairs set up as levelTestWork counts them); none once it runs out.
 */
export function towardsWrittenOrder(g: Digraph, level: Int32Array, orders: LevelItem[][], budget: {tests: number; work: number}): LevelItem[][] | undefined {
  const now = writtenOrderCounts(g, level, orders)
  // The levels stay, so every edge the test places (a long one) has bends here, at its mean place.
  const {rank, edgeRank} = placesOf(g, orders)
  const place = (e: number): number => (level[g.head[e]!] === level[g.tail[e]!]! + 1 ? rank[g.head[e]!]! : edgeRank[e]!)
  const setPlace = (e: number, x: number): void => {
    if (level[g.head[e]!] === level[g.tail[e]!]! + 1) rank[g.head[e]!] = x
    else edgeRank[e] = x
  }
  for (const v of now.wrong) {
    const edges = Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
    const places = edges.map(place).sort((a, b) => a - b)
    edges.forEach((e, i) => setPlace(e, places[i]!))
  }
  const work = levelTestWork(g, level)
  for (const majority of [true, false]) {
    const r = paidLevelTest(g, level, {rank, edgeRank, majority}, budget, work)
    if (!r) return undefined
    if (r.status !== 'planar') continue
    const facing = writtenOrderFacing(g, level, r.orders)
    const after = writtenOrderCounts(g, level, facing)
    if (after.forward > now.forward) return facing
  }
  return undefined
}

/**
 * Orders of the same levels one vertex further in written order, by forced pairs: for orders that
 * show one vertex fewer than `floor` with its out-edges in written order, the level test is asked
 * for a witness that keeps the out-edges of every vertex already in written order and of one more
 * (each vertex out of written order in turn): the next objects of a vertex's out-edges on the level
 * above (what the ports follow, see writtenOrderCounts), each consecutive pair in written order,
 * forced left to right; the current orders are the preference. A witness is re-checked
 * (checkLevelDrawing, and the count on its orders) before it is returned. Undefined when the orders
 * are not exactly one vertex short, no witness is found, or the budget is spent (one level test per
 * vertex tried, counted against `budget`). Constrained level planarity is NP-hard in general, so
 * each test is bounded (level-planarity.ts); O(n + m log m) per try besides the test.
 */
export function forcedWrittenOrder(g: Digraph, level: Int32Array, orders: LevelItem[][], floor: number, budget: ForcedBudget): LevelItem[][] | undefined {
  const {forward, wrong} = writtenOrderCounts(g, level, orders)
  if (forward + 1 !== floor || wrong.length === 0) return undefined
  const out = new Set(wrong)
  const base: ForcedPair[] = []
  for (let v = 0; v < g.vertexCount; v++) if (g.outStart[v + 1]! - g.outStart[v]! >= 2 && !out.has(v)) base.push(...writtenPairs(g, level, v))
  const preference = {...placesOf(g, orders), majority: true}
  const work = levelTestWork(g, level)
  for (const v of wrong) {
    const r = forcedTest(g, level, preference, budget, [...base, ...writtenPairs(g, level, v)], work)
    if (!r) return undefined
    if (r.status !== 'planar') continue
    const facing = writtenOrderFacing(g, level, r.orders)
    if (writtenOrderCounts(g, level, facing).forward >= floor && checkLevelDrawing(g, level, facing).ok) return facing
  }
  return undefined
}

/**
 * Where no orders of these levels keep the written order of one more vertex (forcedWrittenOrder
 * proved it or ran out): nearby levels that do. For each vertex out of written order in turn, a
 * breadth-first walk over level assignments from these levels: each is asked for a witness with the
 * same forced pairs (recomputed for its levels); when the test answers that the forced pairs
 * disagree through a chain of equations, each end of that chain's edges moved one level up or down
 * (within its neighbours' levels and the current rows) is a next assignment, unless seen before.
 * The first witness found is re-checked (checkLevelDrawing and the count on its orders) and
 * returned with its levels (empty levels removed). At most `perVertex` tests per vertex, each counted
 * against `budget`; undefined when none is found. A local search, not exhaustive.
 */
export function forcedLevelMoves(g: Digraph, level: Int32Array, orders: LevelItem[][], floor: number, budget: ForcedBudget, perVertex = FORCED_MOVES_PER_VERTEX): {level: Int32Array; orders: LevelItem[][]} | undefined {
  const {forward, wrong} = writtenOrderCounts(g, level, orders)
  if (forward + 1 !== floor || wrong.length === 0) return undefined
  const out = new Set(wrong)
  const kept: number[] = []
  for (let v = 0; v < g.vertexCount; v++) if (g.outStart[v + 1]! - g.outStart[v]! >= 2 && !out.has(v)) kept.push(v)
  let top = 0
  for (const l of level) top = Math.max(top, l)
  const preference = {...placesOf(g, orders), majority: true}
  for (const v of wrong) {
    const seen = new Set<string>([level.join(',')])
    const queue: Int32Array[] = [level]
    let tests = 0
    for (let q = 0; q < queue.length && tests < perVertex; q++) {
      const at = queue[q]!
      const forced = [...kept, v].flatMap((u) => writtenPairs(g, at, u))
      tests++
      const r = forcedTest(g, at, preference, budget, forced)
      if (!r) return undefined
      if (r.status === 'planar') {
        const used = new Set(at)
        const index = new Map(Array.from(used).sort((a, b) => a - b).map((l, i) => [l, i]))
        const next = Int32Array.from(at, (l) => index.get(l)!)
        // Levels without a vertex dropped, with the bends on them: the orders of the others stay
        // crossing-free (the bends kept their order across the dropped level).
        const facing = writtenOrderFacing(g, next, r.orders.filter((_, l) => used.has(l)))
        if (writtenOrderCounts(g, next, facing).forward >= floor && checkLevelDrawing(g, next, facing).ok) return {level: next, orders: facing}
        continue
      }
      if (r.status !== 'forced-infeasible' || r.edges.length === 0) continue
      const ends = new Set<number>()
      for (const e of r.edges) ends.add(g.tail[e]!).add(g.head[e]!)
      for (const x of [...ends].sort((a, b) => a - b)) {
        let low = 0
        let high = top
        for (let i = g.inStart[x]!; i < g.inStart[x + 1]!; i++) low = Math.max(low, at[g.tail[g.inEdges[i]!]!]! + 1)
        for (let i = g.outStart[x]!; i < g.outStart[x + 1]!; i++) high = Math.min(high, at[g.head[g.outEdges[i]!]!]! - 1)
        for (const to of [at[x]! - 1, at[x]! + 1]) {
          if (to < low || to > high) continue
          const next = at.slice()
          next[x] = to
          const key = next.join(',')
          if (seen.has(key)) continue
          seen.add(key)
          queue.push(next)
        }
      }
    }
  }
  return undefined
}

/**
 * The budget of forcedWrittenOrder and forcedLevelMoves, and the answers other than planar they met
 * (by levels and forced pairs): several candidates of a diagram share levels, and the walks meet the
 * same assignments again, so each is paid for once.
 */
interface ForcedBudget {
  tests: number
  work: number
  failed: Map<string, ForcedLevelPlanarity>
}

/** paidLevelTest with forced pairs, an answer other than planar remembered (then free) in `budget.failed`. */
function forcedTest(g: Digraph, level: Int32Array, preference: {rank: Float64Array; edgeRank: Float64Array; majority: boolean}, budget: ForcedBudget, forced: readonly ForcedPair[], work = levelTestWork(g, level)): ForcedLevelPlanarity | undefined {
  const item = (i: LevelItem): string => (i.kind === 'vertex' ? `v${i.vertex}` : `e${i.edge}`)
  const key = `${level.join(',')}|${forced.map((p) => `${p.level}:${item(p.left)}<${item(p.right)}`).join(' ')}`
  const known = budget.failed.get(key)
  if (known) return known
  const r = paidLevelTest(g, level, preference, budget, work, forced)
  if (r && r.status !== 'planar') budget.failed.set(key, r)
  return r
}

/**
 * The pairs that put vertex v's out-edges left to right in written order: the point where each
 * out-edge meets the level above v (its head, or its bend there), consecutive edges by id. Two edges
 * to one head share their point (the ports then follow the ids anyway) and give no pair.
 */
function writtenPairs(g: Digraph, level: ArrayLike<number>, v: number): ForcedPair[] {
  const above = level[v]! + 1
  const nextItem = (e: number): LevelItem => {
    const h = g.head[e]!
    return level[h] === above ? {kind: 'vertex', vertex: h} : {kind: 'edge', edge: e}
  }
  const edges = Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
  const pairs: ForcedPair[] = []
  for (let i = 1; i < edges.length; i++) {
    const left = nextItem(edges[i - 1]!)
    const right = nextItem(edges[i]!)
    if (left.kind === 'vertex' && right.kind === 'vertex' && left.vertex === right.vertex) continue
    pairs.push({level: above, left, right})
  }
  return pairs
}

/**
 * When no witness of these levels shows more written order: the out-neighbours of each vertex not in
 * written order moved down to the lowest level their in-edges allow, and the level test asked for
 * orders of the new levels with the current ones as the preference (as in towardsWrittenOrder).
 * Why: a head far above its tail (row balancing and the layering to the sinks lift sinks to the top)
 * turns the out-edge into a long edge that has to pass beside whatever lies between, which can force
 * the out-edges out of written order; the shortest edges leave the most freedom. Returned when the
 * test answers planar, even without a gain yet (the next round can repair the orders or lower
 * further); the levels only go down, so the rounds end. One level test, counted against `budget`;
 * undefined when nothing moves, the test says no or the budget is spent. O(n log n + m) besides the test.
 */
export function lowerOutNeighbours(g: Digraph, level: Int32Array, orders: LevelItem[][], budget: {tests: number; work: number}): {level: Int32Array; orders: LevelItem[][]} | undefined {
  const {wrong} = writtenOrderCounts(g, level, orders)
  const heads = new Set<number>()
  for (const v of wrong) for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) heads.add(g.head[g.outEdges[i]!]!)
  const raw = level.slice()
  let moved = false
  // Lowest level first, so a lowered head's own lowered out-neighbour sees its new level.
  for (const h of [...heads].sort((a, b) => level[a]! - level[b]! || a - b)) {
    let low = 0
    for (let i = g.inStart[h]!; i < g.inStart[h + 1]!; i++) low = Math.max(low, raw[g.tail[g.inEdges[i]!]!]! + 1)
    if (low < raw[h]!) {
      raw[h] = low
      moved = true
    }
  }
  if (!moved) return undefined
  // Levels left empty disappear (fewer rows).
  const index = new Map(Array.from(new Set(raw)).sort((a, b) => a - b).map((l, i) => [l, i]))
  const next = Int32Array.from(raw, (l) => index.get(l)!)
  const r = paidLevelTest(g, next, {...placesOf(g, orders), majority: true}, budget)
  if (r?.status !== 'planar') return undefined
  return {level: next, orders: writtenOrderFacing(g, next, r.orders)}
}

/**
 * One level test with these preferred places (and forced pairs, if any), paid from `budget`: one
 * test, and the pairs it sets up as levelTestWork counts them (`work`, when the caller has it
 * already). Undefined, and nothing spent, when the budget cannot pay.
 */
function paidLevelTest(
  g: Digraph,
  level: Int32Array,
  preference: {rank: Float64Array; edgeRank: Float64Array; majority: boolean},
  budget: {tests: number; work: number},
  work = levelTestWork(g, level),
  forced?: readonly ForcedPair[]
): ForcedLevelPlanarity | undefined {
  if (budget.tests < 1 || work > budget.work) return undefined
  budget.tests--
  budget.work -= work
  const limits = {...preference, maxWork: 250_000, maxSteps: 250_000}
  return forced ? testLevelPlanarity(g, level, {...limits, forced}) : testLevelPlanarity(g, level, limits)
}

/** Each level's places scaled to [0, 1]: a vertex at its place, an edge at the mean of its places. */
function placesOf(g: Digraph, orders: LevelItem[][]): {rank: Float64Array; edgeRank: Float64Array} {
  const rank = new Float64Array(g.vertexCount)
  const edgeRank = new Float64Array(g.edgeCount).fill(-1)
  const edgeSum = new Float64Array(g.edgeCount)
  const edgeSeen = new Float64Array(g.edgeCount)
  orders.forEach((items) => {
    const scale = items.length > 1 ? 1 / (items.length - 1) : 0
    items.forEach((item, i) => {
      if (item.kind === 'vertex') rank[item.vertex] = i * scale
      else {
        edgeSum[item.edge]! += i * scale
        edgeSeen[item.edge]!++
      }
    })
  })
  // An edge with no bend yet (it may get some on new levels): between its ends.
  for (let e = 0; e < g.edgeCount; e++) edgeRank[e] = edgeSeen[e] ? edgeSum[e]! / edgeSeen[e]! : (rank[g.tail[e]!]! + rank[g.head[e]!]!) / 2
  return {rank, edgeRank}
}

/**
 * Another witness of the same levels whose widest level packs narrower. A level's least width is its
 * boxes and bends side by side with the gaps between them (coordinates.ts: a box gap between two
 * boxes, the smaller edge gap next to a bend; its drawing is that wide when it is the widest), so a
 * bend between two boxes costs two edge gaps where a bend at the end of the level costs one edge gap
 * on top of the box gap. The bends before the first box and after the last one of the widest level
 * get places between its two outer boxes as the preference (the rest as now, as in
 * towardsWrittenOrder), and the level test is asked once. Undefined when there are no such bends,
 * the test says no or gives the same orders, or the budget is spent; the caller keeps it only if
 * drawn narrower without less written order. O(N) for N items besides the test.
 */
export function narrowerWitness(g: Digraph, level: Int32Array, orders: LevelItem[][], across: ArrayLike<number>, spacing: {node: number; edge: number}, budget: {tests: number; work: number}): LevelItem[][] | undefined {
  let widest = -1
  let most = -Infinity
  orders.forEach((items, l) => {
    let w = 0
    items.forEach((item, i) => {
      if (item.kind === 'vertex') w += across[item.vertex]!
      if (i > 0) w += item.kind === 'vertex' && items[i - 1]!.kind === 'vertex' ? spacing.node : spacing.edge
    })
    if (w > most) {
      most = w
      widest = l
    }
  })
  const items = orders[widest]!
  const boxesAt = items.flatMap((item, i) => (item.kind === 'vertex' ? [i] : []))
  if (boxesAt.length < 2) return undefined
  const first = boxesAt[0]!
  const last = boxesAt[boxesAt.length - 1]!
  const outer = items.filter((item, i) => item.kind === 'edge' && (i < first || i > last))
  if (outer.length === 0) return undefined
  const {rank, edgeRank} = placesOf(g, orders)
  const scale = 1 / (items.length - 1)
  for (const [k, item] of items.entries()) {
    if (item.kind !== 'edge' || (k > first && k < last)) continue
    // Between the two outer boxes on this side, in the bends' own order.
    const [a, b] = k < first ? [first, boxesAt[1]!] : [boxesAt[boxesAt.length - 2]!, last]
    edgeRank[item.edge] = (a + (b - a) * (0.25 + (0.5 * (k + 1)) / (items.length + 1))) * scale
  }
  const r = paidLevelTest(g, level, {rank, edgeRank, majority: true}, budget)
  if (r?.status !== 'planar') return undefined
  const facing = writtenOrderFacing(g, level, r.orders)
  const key = (o: LevelItem[][]): string => o.map((l) => l.map((i) => (i.kind === 'vertex' ? `v${i.vertex}` : `e${i.edge}`)).join(' ')).join('|')
  return key(facing) === key(orders) ? undefined : facing
}

/**
 * The orders as they are, or mirrored (every level reversed, still level planar) when the mirror
 * shows more vertices' out-edges left to right in written order.
 */
export function writtenOrderFacing(g: Digraph, level: ArrayLike<number>, orders: LevelItem[][]): LevelItem[][] {
  const {forward, backward} = writtenOrderCounts(g, level, orders)
  return backward > forward ? orders.map((items) => items.slice().reverse()) : orders
}

/**
 * Places from a depth-first walk in written order: the sources by their first written out-edge,
 * each vertex's out-edges by id, a vertex numbered when first reached (preorder). In a tree this
 * preorder is the left-to-right order that shows every vertex's out-edges as written; elsewhere it
 * is a guess the level test follows where it has the choice. An edge's bends sit just before its
 * head. O(n + m log m).
 */
export function depthFirstPlaces(g: Digraph): OrderPreference {
  const n = g.vertexCount
  const rank = new Float64Array(n).fill(-1)
  const outs = (v: number): number[] => Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
  let next = 0
  const walk = (root: number): void => {
    rank[root] = next++
    const stack: Array<{edges: number[]; at: number}> = [{edges: outs(root), at: 0}]
    while (stack.length > 0) {
      const top = stack[stack.length - 1]!
      if (top.at === top.edges.length) {
        stack.pop()
        continue
      }
      const h = g.head[top.edges[top.at++]!]!
      if (rank[h]! >= 0) continue
      rank[h] = next++
      stack.push({edges: outs(h), at: 0})
    }
  }
  const firstOut = (v: number): number => outs(v)[0] ?? Infinity
  const sources = Array.from({length: n}, (_, v) => v).filter((v) => g.inStart[v + 1] === g.inStart[v])
  sources.sort((a, b) => firstOut(a) - firstOut(b) || a - b)
  for (const v of sources) walk(v) // every vertex of a DAG is reached from a source
  const edgeRank = Float64Array.from({length: g.edgeCount}, (_, e) => rank[g.head[e]!]! - 0.5)
  return {rank, edgeRank}
}

/**
 * Places on the written order's scale (edge ids are written order): an edge's bends at its id, a
 * vertex at the first edge written into it, a source just before the first edge written out of it,
 * a vertex with no edges after all of them.
 */
function writtenPlaces(g: Digraph): OrderPreference {
  const rank = new Float64Array(g.vertexCount).fill(Infinity)
  for (let e = g.edgeCount - 1; e >= 0; e--) {
    rank[g.head[e]!] = e
    const t = g.tail[e]!
    if (g.inStart[t + 1] === g.inStart[t]) rank[t] = e - 0.5
  }
  for (let v = 0; v < g.vertexCount; v++) if (rank[v] === Infinity) rank[v] = g.edgeCount + v
  return {rank, edgeRank: Int32Array.from({length: g.edgeCount}, (_, e) => e)}
}

/**
 * Vertices with two or more out-edges whose out-edges leave their box left to right in id order (x
 * for flows up and down, y for left and right, the directions layout-upward.ts maps left to).
 * O(m log m).
 */
export function writtenOrderKept(g: Digraph, layout: Layout): number {
  return writtenOrderVertices(g, layout).length
}

/** The vertices writtenOrderKept counts, in id order. O(m log m). */
function writtenOrderVertices(g: Digraph, layout: Layout): number[] {
  const sideways = layout.flow === 'left' || layout.flow === 'right'
  const kept: number[] = []
  for (let v = 0; v < g.vertexCount; v++) {
    const from = g.outStart[v]!
    const to = g.outStart[v + 1]!
    if (to - from < 2) continue
    const edges = Array.from(g.outEdges.subarray(from, to)).sort((a, b) => a - b)
    const at = (e: number): number => layout.edges[e]!.points[0]![sideways ? 1 : 0]
    let ok = true
    for (let i = 1; i < edges.length && ok; i++) ok = at(edges[i - 1]!) < at(edges[i]!)
    if (ok) kept.push(v)
  }
  return kept
}

/**
 * Each vertex's row in a layered drawing: the rank of its box centre along the flow, 0 on the
 * sources' side (boxes of one row share their band's centre). O(n log n).
 */
function rowsOf(g: Digraph, layout: Layout): Int32Array {
  const sideways = layout.flow === 'left' || layout.flow === 'right'
  const at = new Map<number, number>()
  for (const node of layout.nodes) at.set(node.vertex, Math.round((sideways ? node.x : node.y) * 100))
  const keys = Array.from(new Set(at.values())).sort((a, b) => a - b)
  const e = 0
  // Reversed when the first edge's tail lies further along the axis than its head.
  const turned = g.edgeCount > 0 && at.get(g.tail[e]!)! > at.get(g.head[e]!)!
  const index = new Map(keys.map((k, i) => [k, turned ? keys.length - 1 - i : i]))
  return Int32Array.from({length: g.vertexCount}, (_, v) => index.get(at.get(v)!)!)
}

/** Rows of boxes: distinct box centres along the flow (boxes of one row share their band's centre). */
function rowCount(layout: Layout): number {
  const sideways = layout.flow === 'left' || layout.flow === 'right'
  return new Set(layout.nodes.map((n) => Math.round((sideways ? n.x : n.y) * 100))).size
}
