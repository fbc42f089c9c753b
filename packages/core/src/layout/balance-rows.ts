/**
 * Narrower rows at the same height: move single vertices between the levels their neighbours allow
 * (never past the lowest or highest level) when that makes the widest row narrower, or keeps it and
 * evens the rows out. A row's width is estimated as what coordinates.ts must at least give it: each
 * box's extent across the flow plus the gap between boxes, and the edge gap for each edge passing
 * through the row (its bend). Ties in the move are broken by level, then vertex id, so the result is
 * deterministic.
 *
 * The idea is that of width-bounded layering (Coffman & Graham, "Optimal scheduling for two-processor
 * systems", Acta Informatica 1, 1972) and of promoting single vertices to other layers (Nikolov &
 * Tarassov, "Graph layering by promotion of nodes", Discrete Applied Mathematics 154(5), 2006),
 * here as a local search on a given layering with the row width as its measure. The result still
 * needs the level-planarity test: moving a vertex can make the levels non-level-planar.
 *
 * With `heights` the measure is the area instead: the widest row times the height of the rows that
 * hold boxes (each row's tallest box plus the gaps between rows, row-bound.ts's rowsHeight; ours), so a move that puts a tall box
 * on a row that already has one, or empties a row, counts; ties as before.
 *
 * Time: O(passes · Σ_v (slack(v) + 1) · (L + deg v)) for L levels, at most MAX_PASSES passes; with
 * `heights`, times the number of distinct box heights, H: O(passes · Σ_v (slack(v) + 1) · (L·H + deg v)).
 */
import type {Digraph} from '../graph/digraph.ts'
import {rowsHeight} from './row-bound.ts'

const MAX_PASSES = 4

/**
 * `across[v]`: the extent of v's box across the flow. Returns new levels (the input is not changed), or
 * undefined when no move helps. They keep the input's numbering (a level the moves left empty stays,
 * empty; dropEmptyLevels closes it up), so each vertex's new level can be compared with, and set back
 * to, its old one. `levels`: the levels the vertices may use, 0..levels − 1, at least the input's; one
 * more than the input's height offers a spare level on top (shift the input up by one for a spare
 * level below), so a crowded row can give vertices to a row of its own.
 */
export function evenRows(g: Digraph, level: Int32Array, across: ArrayLike<number>, nodeGap: number, edgeGap: number, levels = 0, heights?: RowHeights): Int32Array | undefined {
  const n = g.vertexCount
  let height = levels
  for (let v = 0; v < n; v++) height = Math.max(height, level[v]! + 1)
  if (height < 2) return undefined
  const lv = level.slice()
  const row = new Float64Array(height)
  row.set(rowWidths(g, lv, across, nodeGap, edgeGap))
  // With heights: per row, how many boxes of each distinct height it holds (tallest first).
  const distinct = heights ? [...new Set(Array.from({length: n}, (_, v) => heights.along[v]!))].sort((a, b) => b - a) : []
  const kind = heights ? Int32Array.from({length: n}, (_, v) => distinct.indexOf(heights.along[v]!)) : new Int32Array(0)
  const counts = new Int32Array(heights ? height * distinct.length : 0)
  if (heights) for (let v = 0; v < n; v++) counts[lv[v]! * distinct.length + kind[v]!]!++
  // Each row's tallest box (−1: no box), read off the counts for rowsHeight (row-bound.ts).
  const tallest = new Float64Array(heights ? height : 0)
  const addVertex = (v: number, l: number, sign: number): void => {
    row[l]! += sign * (across[v]! + nodeGap)
    if (heights) counts[l * distinct.length + kind[v]!]! += sign
    for (let p = g.inStart[v]!; p < g.inStart[v + 1]!; p++) {
      const u = g.tail[g.inEdges[p]!]!
      for (let r = lv[u]! + 1; r < l; r++) row[r]! += sign * edgeGap
    }
    for (let p = g.outStart[v]!; p < g.outStart[v + 1]!; p++) {
      const w = g.head[g.outEdges[p]!]!
      for (let r = l + 1; r < lv[w]!; r++) row[r]! += sign * edgeGap
    }
  }
  const score = (): [number, number] => {
    let max = 0
    let squares = 0
    for (let l = 0; l < height; l++) {
      max = Math.max(max, row[l]!)
      squares += row[l]! * row[l]!
    }
    if (!heights) return [max, squares]
    for (let l = 0; l < height; l++) {
      const k = distinct.findIndex((_, i) => counts[l * distinct.length + i]! > 0)
      tallest[l] = k < 0 ? -1 : distinct[k]!
    }
    return [max * rowsHeight(tallest, heights.layerGap), squares]
  }
  const better = (a: [number, number], b: [number, number]): boolean => a[0] < b[0] - 1e-9 || (a[0] <= b[0] + 1e-9 && a[1] < b[1] - 1e-6)
  let changed = false
  for (let pass = 0; pass < MAX_PASSES; pass++) {
    let moved = false
    for (let v = 0; v < n; v++) {
      let lo = 0
      let hi = height - 1
      for (let p = g.inStart[v]!; p < g.inStart[v + 1]!; p++) lo = Math.max(lo, lv[g.tail[g.inEdges[p]!]!]! + 1)
      for (let p = g.outStart[v]!; p < g.outStart[v + 1]!; p++) hi = Math.min(hi, lv[g.head[g.outEdges[p]!]!]! - 1)
      if (lo === hi) continue
      const from = lv[v]!
      let best = score()
      let bestLevel = from
      // A self-loop-free DAG: v's own contributions never involve v's other edges, so remove and re-add.
      addVertex(v, from, -1)
      for (let l = lo; l <= hi; l++) {
        if (l === from) continue
        addVertex(v, l, 1)
        const s = score()
        if (better(s, best)) {
          best = s
          bestLevel = l
        }
        addVertex(v, l, -1)
      }
      addVertex(v, bestLevel, 1)
      if (bestLevel !== from) {
        lv[v] = bestLevel
        moved = true
        changed = true
      }
    }
    if (!moved) break
  }
  return changed ? lv : undefined
}

/** Each box's extent along the flow and the gap between rows, for evenRows's area measure. */
export interface RowHeights {
  along: ArrayLike<number>
  layerGap: number
}

/**
 * The rows evened out with one spare level, on top and then below (the input shifted up by one):
 * sinks may then move above the top row and sources below the bottom one, so the widest row can give
 * boxes to a row of its own, one row taller. Each result has its empty levels removed; results equal
 * to the input or to each other are left out. Why: evenRows keeps the height, and a drawing whose
 * widest row is a fan of sinks (or of sources) cannot narrow without one more row (g.22.19 of the
 * North DAGs: 0.49 of its area, one row taller; bench/README.md). O(evenRows) twice.
 */
export function evenRowsWithSpare(g: Digraph, level: Int32Array, across: ArrayLike<number>, nodeGap: number, edgeGap: number): Int32Array[] {
  let height = 0
  for (const l of level) height = Math.max(height, l + 1)
  const out: Int32Array[] = []
  for (const base of [level, level.map((l) => l + 1)]) {
    const moved = evenRows(g, base, across, nodeGap, edgeGap, height + 1)
    if (!moved) continue
    const next = dropEmptyLevels(moved)
    if (!same(next, level) && !out.some((o) => same(o, next))) out.push(next)
  }
  return out
}

function same(a: Int32Array, b: Int32Array): boolean {
  return a.length === b.length && a.every((x, i) => x === b[i])
}

/** The same levels with every empty one removed (the rest renumbered in order). O(n + L). */
export function dropEmptyLevels(level: Int32Array): Int32Array {
  let height = 0
  for (const l of level) height = Math.max(height, l + 1)
  const used = new Uint8Array(height)
  for (const l of level) used[l] = 1
  const renumber = new Int32Array(height)
  for (let l = 0, k = 0; l < height; l++) renumber[l] = used[l] ? k++ : -1
  return level.map((l) => renumber[l]!)
}

/**
 * Each row's estimated width: every box's extent across the flow plus the gap between boxes, and the
 * edge gap for each edge passing through the row. Boxes once per vertex, bends once per edge. O(n + m · L).
 */
export function rowWidths(g: Digraph, level: ArrayLike<number>, across: ArrayLike<number>, nodeGap: number, edgeGap: number): Float64Array {
  let height = 0
  for (let v = 0; v < g.vertexCount; v++) height = Math.max(height, level[v]! + 1)
  const row = new Float64Array(height)
  for (let v = 0; v < g.vertexCount; v++) row[level[v]!]! += across[v]! + nodeGap
  for (let e = 0; e < g.edgeCount; e++) for (let r = level[g.tail[e]!]! + 1; r < level[g.head[e]!]!; r++) row[r]! += edgeGap
  return row
}
