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
 * With `keeps` and `retry`, a row count where the st-layout's written-order set finds nothing is
 * searched again with other sets of as many vertices (layoutSmallest counts how many vertices keep
 * their written order, not which), with the rows' real heights in the bound (RowWidthBound.area).
 *
 * The bound is a lower bound on the drawn area (row-bound.ts), so no assignment the search rules out
 * could have been drawn smaller; a find may still draw larger (coordinates add more than the least
 * gaps). Every search is bounded by `budget` (level tests, pairs they set up, levels tried),
 * deterministic counts; each test is quadratic in the level widths (level-planarity.ts).
 */
import type {Digraph} from '../graph/digraph.ts'
import type {LevelItem} from '../level/level-planarity.ts'
import {longestPathUp} from './layering.ts'
import {searchLevels, type LevelSearch} from './level-search.ts'
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
  /**
   * With `written`: the vertices whose out-edges the drawing of a find keeps in written order (the
   * caller's count). A row count where the search with `written` finds nothing is then searched once
   * more with other sets of as many vertices (see searchByArea) and searchLevels's area bound, on
   * `retry`'s budget (spent in place), so the searches before it are the same as without it.
   */
  keeps?: ((level: Int32Array, orders: LevelItem[][]) => readonly number[]) | undefined
  retry?: {tests: number; work: number; steps: number} | undefined
  /** Most sets tried at one row count by the retry. */
  retrySets?: number | undefined
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
    /**
     * Finds at k, each narrower than the last and each drawn, while `budget` lasts; with `byArea`,
     * searchLevels's area bound too (the rows' real heights). The status of the first search and
     * the first find.
     */
    const narrowing = (written: readonly number[] | undefined, budget: Budget, byArea: boolean): {status?: LevelSearch['status']; find?: Found} => {
      let narrowest = Infinity
      let at = guide
      const out: {status?: LevelSearch['status']; find?: Found} = {}
      while (budget.tests > 0 && budget.steps > 0) {
        const below = Math.min(capped() / height, narrowest - o.step)
        if (below <= widestBox) break
        const part = {tests: Math.min(o.perSearch, budget.tests), work: budget.work, steps: budget.steps}
        const start = {...part}
        const byHeight = byArea ? {along: o.along, layerGap: o.layerGap, below: capped()} : undefined
        const bound = {across: o.across, nodeGap: o.nodeGap, edgeGap: o.edgeGap, below, estimate: 'least' as const, area: byHeight}
        const r = searchLevels(g, k, part, at, bound, written)
        budget.tests -= start.tests - part.tests
        budget.work -= start.work - part.work
        budget.steps -= start.steps - part.steps
        out.status ??= r.status
        if (r.status !== 'found') break
        out.find ??= r
        narrowest = leastWidth(g, r.level, o.across, o.nodeGap, o.edgeGap)
        area = Math.min(area, o.measure(r.level, r.orders))
        at = r.level
      }
      return out
    }
    const first = narrowing(o.written, o.budget, false)
    if (first.status === 'found' || first.status === undefined || !o.written?.length || !o.keeps || !o.retry) continue
    // Other written-order sets at k (ours), on the retry budget. The rule that keeps a level drawing
    // counts how many vertices keep their out-edges in written order, not which, so a set as large
    // as the st-layout's may have level-planar rows under the bound where its own has none (g.43.0).
    // Searches without written order (and with the area bound), each find drawn (one may keep enough
    // by itself); the vertices the first find keeps in order, S, propose the sets: S when it is as
    // large as `written`, else `written` with one vertex swapped for one of S, at most retrySets.
    const before = area
    const free = narrowing(undefined, o.retry, true)
    if (!free.find || area < before) continue
    const kept = o.keeps(free.find.level, free.find.orders)
    const sets: number[][] = []
    const own = new Set(o.written)
    if (kept.length >= o.written.length) sets.push([...kept])
    else {
      // Swaps for a vertex of S first, then (a set of one or two) for any other with two out-edges.
      const others: number[] = []
      if (o.written.length <= 2) for (let v = 0; v < g.vertexCount; v++) if (g.outStart[v + 1]! - g.outStart[v]! >= 2 && !own.has(v) && !kept.includes(v)) others.push(v)
      for (const u of [...kept.filter((v) => !own.has(v)), ...others]) for (const w of o.written) sets.push([...o.written.filter((x) => x !== w), u].sort((a, b) => a - b))
    }
    for (const set of sets.slice(0, o.retrySets ?? 4)) {
      narrowing(set, o.retry, true)
      if (area < before || o.retry.tests < 1 || o.retry.steps < 1) break
    }
  }
}

type Budget = {tests: number; work: number; steps: number}
type Found = {level: Int32Array; orders: LevelItem[][]}
