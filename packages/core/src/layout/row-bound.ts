/**
 * Lower bounds on the size of a layered drawing (level-layout.ts, and layout-upward.ts, which share
 * banded-drawing.ts and coordinates.ts), from the separations those modules enforce:
 *
 * Across the flow, on one level: every object keeps the separation coordinates.ts gives consecutive
 * objects, half(a) + half(b) + gap, the gap `nodeGap` between two boxes and `edgeGap` when a bend
 * (an edge passing the level, half 0) is one of the two. Every object lies inside the drawing (a bend
 * is a point of its route, a box is drawn), so the drawing is at least as wide as each level's objects
 * packed in their order: the boxes' extents plus the gaps between neighbours. Over every order of b
 * boxes and p bends the gaps add up to at least leastGaps(b, p) (below), so no order, and no drawing,
 * has a level narrower than leastRowWidth. The row-width estimate of balance-rows.ts (each box plus a
 * box gap, an edge gap per bend) is not a lower bound: it counts a gap after the last box, and a bend
 * between two boxes costs two edge gaps, which can be less than a box gap plus an edge gap.
 *
 * Along the flow: each level is a band as thick as its tallest box, and consecutive bands are
 * `layerGap` apart (half that next to a band without boxes, but then there are two such gaps between
 * the box rows around it); the drawing spans the bands from the first to the last. With k rows of
 * boxes, the tallest boxes of the rows are k different boxes, one of them the tallest of all, so the
 * height is at least leastHeight: the tallest box, the k − 1 shortest others, and k − 1 layer gaps.
 *
 * All O(1) per row or O(n log n) per call (the sort in leastHeight), O(n + m · L) for leastRowWidths.
 */
import type {Digraph} from '../graph/digraph.ts'

/**
 * The least sum of the gaps between neighbours over every left-to-right order of `boxes` boxes and
 * `bends` bends on one level. With no box: p − 1 edge gaps. Otherwise the boxes leave b − 1 slots
 * between them, each a box gap when empty and (j + 1) edge gaps with j bends in it, and a bend outside
 * them costs one edge gap; a bend in an empty slot changes the total by edgeGap − nodeGap, so when the
 * edge gap is the smaller, up to b − 1 bends go one to a slot and the rest outside.
 */
export function leastGaps(boxes: number, bends: number, nodeGap: number, edgeGap: number): number {
  if (boxes === 0) return bends > 0 ? (bends - 1) * edgeGap : 0
  return (boxes - 1) * nodeGap + bends * edgeGap - Math.min(bends, boxes - 1) * Math.max(0, nodeGap - edgeGap)
}

/**
 * The least leastGaps(boxes, p) over p ≥ bends: what a row can still come to when more edges may pass
 * it later (a partial assignment in level-search.ts). It differs from leastGaps only when a bend
 * between two boxes is cheaper than the box gap it replaces (2 · edgeGap < nodeGap); then more bends,
 * up to one per slot, narrow the row. Never more than leastGaps for any completion with at least these
 * boxes and bends: leastGaps grows with the boxes for any number of bends.
 */
export function leastGapsToCome(boxes: number, bends: number, nodeGap: number, edgeGap: number): number {
  const p = 2 * edgeGap < nodeGap ? Math.max(bends, boxes - 1) : bends
  return leastGaps(boxes, p, nodeGap, edgeGap)
}

/** The least width of a level with boxes of total extent `boxWidth` (across the flow), `boxes` boxes and `bends` bends. */
export function leastRowWidth(boxWidth: number, boxes: number, bends: number, nodeGap: number, edgeGap: number): number {
  return boxWidth + leastGaps(boxes, bends, nodeGap, edgeGap)
}

/**
 * Each level's least width under the assignment `level` (levels 0..max; an edge passing a level puts
 * a bend on it), whatever the orders: a lower bound on how wide that level is drawn. O(n + m · L).
 */
export function leastRowWidths(g: Digraph, level: ArrayLike<number>, across: ArrayLike<number>, nodeGap: number, edgeGap: number): Float64Array {
  let rows = 0
  for (let v = 0; v < g.vertexCount; v++) rows = Math.max(rows, level[v]! + 1)
  const boxWidth = new Float64Array(rows)
  const boxes = new Int32Array(rows)
  const bends = new Int32Array(rows)
  for (let v = 0; v < g.vertexCount; v++) {
    boxWidth[level[v]!]! += across[v]!
    boxes[level[v]!]!++
  }
  for (let e = 0; e < g.edgeCount; e++) for (let r = level[g.tail[e]!]! + 1; r < level[g.head[e]!]!; r++) bends[r]!++
  return Float64Array.from(boxWidth, (w, r) => leastRowWidth(w, boxes[r]!, bends[r]!, nodeGap, edgeGap))
}

/** The widest of leastRowWidths: a lower bound on the width (across the flow) of any drawing of these levels. */
export function leastWidth(g: Digraph, level: ArrayLike<number>, across: ArrayLike<number>, nodeGap: number, edgeGap: number): number {
  let widest = 0
  for (const w of leastRowWidths(g, level, across, nodeGap, edgeGap)) widest = Math.max(widest, w)
  return widest
}

/**
 * A lower bound on the extent along the flow of any layered drawing whose boxes (extents `along`)
 * stand on `rows` rows (1 ≤ rows ≤ boxes): the tallest box, the rows − 1 shortest of the others, and a
 * layer gap between consecutive rows (half of it when some box has no extent: a band without
 * thickness gets half gaps on both sides). O(n log n).
 */
export function leastHeight(along: ArrayLike<number>, rows: number, layerGap: number): number {
  const sorted = Float64Array.from(along).sort()
  const n = sorted.length
  if (n === 0 || rows < 1) return 0
  if (rows > n) throw new RangeError(`leastHeight: ${rows} rows for ${n} boxes`)
  let total = sorted[n - 1]!
  for (let i = 0; i < rows - 1; i++) total += sorted[i]!
  const gap = sorted[0]! > 0 ? layerGap : layerGap / 2
  return total + (rows - 1) * gap
}

/**
 * The height of rows whose tallest boxes are `tallest` (negative: a level without boxes, dropped):
 * their sum, and a layer gap between consecutive rows, half of it next to a row of no extent (as
 * banded-drawing.ts's bandCentres separates bands). A lower bound on the extent along the flow of
 * any layered drawing whose used rows include these with boxes at least this tall: a row more adds
 * its band and at least half a layer gap on each side (see the top). O(L).
 */
export function rowsHeight(tallest: ArrayLike<number>, layerGap: number): number {
  let total = 0
  let last = -1
  for (let r = 0; r < tallest.length; r++) {
    if (tallest[r]! < 0) continue
    total += tallest[r]!
    if (last >= 0) total += tallest[last]! > 0 && tallest[r]! > 0 ? layerGap : layerGap / 2
    last = r
  }
  return total
}
