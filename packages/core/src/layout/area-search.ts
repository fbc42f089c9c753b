/**
 * Level assignments searched for by area (the 'area-searched' candidate of smallest-layout.ts): for
 * row counts from the fewest the other candidates reached up to a few more, an exact search
 * (searchLevels, level-search.ts) for a level-planar assignment whose widest row, by row-bound.ts's
 * least width, times the least height of that many rows (leastHeight) is below the smallest area
 * drawn so far. Every find is drawn by the caller (`measure`); a smaller drawing lowers the area to
 * beat, and at the same row count the next search asks for a narrower widest row than the last find
 * (branch and bound on the area; ours).
 *
 * Why: the other candidates reach an assignment from the rows of a layering, by moving rows or single
 * vertices, and the searched one (level-candidates.ts, 8.) looks for fewer rows or narrower rows at
 * one row count only. A smaller drawing can need a row more than the fewest (a wide top row split
 * over two, g.14.40 of the North DAGs) or rows that no move from a layering reaches (g.22.19, g.43.0;
 * bench/area-bound.ts found them). With `written`, the search keeps those vertices' out-edges in
 * written order (forced pairs, level-search.ts), so its finds pass smallest-layout.ts's written-order
 * rule.
 *
 * The bound is a lower bound on the drawn area (row-bound.ts), so no assignment the search rules out
 * could have been drawn smaller; a find may still draw larger (coordinates add more than the least
 * gaps). Every search is bounded by `budget` (level tests, pairs they set up, levels tried),
 * deterministic counts; each test is quadratic in the level widths (level-planarity.ts).
 */
import type {Digraph} from '../graph/digraph.ts'
import type {LevelItem} from '../level/level-planarity.ts'
import {longestPathUp} from './layering.ts'
import {searchLevels} from './level-search.ts'
import {leastHeight, leastWidth} from './row-bound.ts'

export interface AreaSearchOptions {
  /** Each box's extent across the flow and along it; the gaps between boxes, beside bends and between rows. */
  across: ArrayLike<number>
  along: ArrayLike<number>
  nodeGap: number
  edgeGap: number
  layerGap: number
  /** The area to beat: the smallest drawn so far that the caller would keep. */
  area: number
  /** A drawing with at least `rows` rows must also be below `area` (the caller's same-height rule). */
  tall?: {rows: number; area: number} | undefined
  /** The most area a drawing with this many rows may have (besides `area` and `tall`). */
  cap?: ((rows: number) => number) | undefined
  /** Row counts to search, `from` to `to` inclusive (fewer rows than G's longest path are skipped). */
  from: number
  to: number
  /** Known assignments; each search stays near the one whose row count is nearest (then the first). */
  guides: ReadonlyArray<Int32Array>
  /** Vertices whose out-edges must leave in written order (searchLevels's `written`). */
  written?: readonly number[] | undefined
  /** Spent in place over every search. */
  budget: {tests: number; work: number; steps: number}
  /** Most level tests one search may spend (so one row count cannot take the whole budget). */
  perSearch: number
  /** By how much (px) the next find at one row count must be narrower than the last. */
  step: number
  /**
   * Draws a find and returns its area, or Infinity when the caller would not keep it; the search
   * then aims below the smallest area returned.
   */
  measure: (level: Int32Array, orders: LevelItem[][]) => number
}

/** Runs the searches described above; the finds are reported through `measure` only. */
export function searchByArea(g: Digraph, o: AreaSearchOptions): void {
  const rowsOf = (level: Int32Array): number => {
    let top = 0
    for (const l of level) top = Math.max(top, l + 1)
    return top
  }
  let widestBox = 0
  let boxTotal = 0
  for (let v = 0; v < g.vertexCount; v++) {
    widestBox = Math.max(widestBox, o.across[v]!)
    boxTotal += o.across[v]!
  }
  let area = o.area
  const least = rowsOf(longestPathUp(g))
  for (let k = Math.max(o.from, least); k <= Math.min(o.to, g.vertexCount); k++) {
    const height = leastHeight(o.along, k, o.layerGap)
    const capped = (): number => Math.min(area, o.tall && k >= o.tall.rows ? o.tall.area : Infinity, o.cap?.(k) ?? Infinity)
    // Every drawing with k rows is at least this tall and as wide as the widest box.
    if (height * widestBox >= capped()) continue
    // Counting: k rows hold every box, and a row of b boxes at least b − 1 gaps of the smaller of a
    // box gap and two edge gaps (row-bound.ts), so the widest row is at least the average row.
    const average = (boxTotal + (g.vertexCount - k) * Math.min(o.nodeGap, 2 * o.edgeGap)) / k
    if (average * height >= capped()) continue
    let guide: Int32Array | undefined
    for (const c of o.guides) if (!guide || Math.abs(rowsOf(c) - k) < Math.abs(rowsOf(guide) - k)) guide = c
    let narrowest = Infinity
    while (o.budget.tests > 0 && o.budget.steps > 0) {
      const below = Math.min(capped() / height, narrowest - o.step)
      if (below <= widestBox) break
      const part = {tests: Math.min(o.perSearch, o.budget.tests), work: o.budget.work, steps: o.budget.steps}
      const start = {...part}
      const bound = {across: o.across, nodeGap: o.nodeGap, edgeGap: o.edgeGap, below, estimate: 'least' as const}
      const r = searchLevels(g, k, part, guide, bound, o.written)
      o.budget.tests -= start.tests - part.tests
      o.budget.work -= start.work - part.work
      o.budget.steps -= start.steps - part.steps
      if (r.status !== 'found') break
      narrowest = leastWidth(g, r.level, o.across, o.nodeGap, o.edgeGap)
      area = Math.min(area, o.measure(r.level, r.orders))
      guide = r.level
    }
  }
}
