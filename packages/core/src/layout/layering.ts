/**
 * Layering of a DAG: an integer rank per vertex with rank(head) > rank(tail) for every edge.
 *
 * Start from the longest-path layering (rank = length of the longest path from a source; minimum
 * height, see e.g. Di Battista, Eades, Tamassia, Tollis, "Graph Drawing", 1999, sec. 9.1), then lower
 * the weighted total edge span sum w(e) * (rank(head) - rank(tail)) by moving single vertices inside
 * the interval their neighbours allow. The cost is linear in a single vertex's rank, with slope
 * (weighted in-degree - weighted out-degree), so the best place is an end of that interval: the
 * vertex-at-a-time move of the network-simplex layering (Gansner, Koutsofios, North, Vo, "A technique
 * for drawing directed graphs", IEEE TSE 19(3), 1993), without its tree moves, so the result is a local
 * optimum rather than the optimum. Every move lowers the integer cost, so it terminates; passes are capped.
 *
 * Zero-weight edges (the augmentation's) keep the order constraint but cost nothing, so they shape the
 * layers without stretching the drawn edges. The height never grows: no vertex moves above the
 * longest-path maximum.
 *
 * Time: O(n + m) per pass, at most MAX_PASSES passes.
 */
import type {Digraph} from '../graph/digraph.ts'

const MAX_PASSES = 40

export interface Layering {
  rank: Int32Array
  /** Vertices in a topological order. */
  order: Int32Array
}

/** Kahn's topological order; throws if the graph has a cycle (a precondition of the layout). */
export function topologicalOrder(g: Digraph): Int32Array {
  const n = g.vertexCount
  const indeg = new Int32Array(n)
  for (let v = 0; v < n; v++) indeg[v] = g.inStart[v + 1]! - g.inStart[v]!
  const order = new Int32Array(n)
  let head = 0
  let tailPos = 0
  for (let v = 0; v < n; v++) if (indeg[v] === 0) order[tailPos++] = v
  while (head < tailPos) {
    const v = order[head++]!
    for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
      const w = g.head[g.outEdges[i]!]!
      if (--indeg[w] === 0) order[tailPos++] = w
    }
  }
  if (tailPos !== n) throw new Error('layout: the st-augmented graph has a directed cycle')
  return order
}

/** Longest path from the sources: rank(v) = edges on the longest path ending at v. O(n + m). */
export function longestPathUp(g: Digraph, order: Int32Array = topologicalOrder(g)): Int32Array {
  const rank = new Int32Array(g.vertexCount)
  for (const v of order) {
    for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) {
      const r = rank[g.tail[g.inEdges[i]!]!]! + 1
      if (r > rank[v]!) rank[v] = r
    }
  }
  return rank
}

/** Longest path to the sinks: depth(v) = edges on the longest path starting at v. O(n + m). */
export function longestPathToSinks(g: Digraph, order: Int32Array = topologicalOrder(g)): Int32Array {
  const depth = new Int32Array(g.vertexCount)
  for (let k = order.length - 1; k >= 0; k--) {
    const v = order[k]!
    for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
      const d = depth[g.head[g.outEdges[i]!]!]! + 1
      if (d > depth[v]!) depth[v] = d
    }
  }
  return depth
}

export function layerByWeightedSpan(g: Digraph, weight: (e: number) => number): Layering {
  const n = g.vertexCount
  const order = topologicalOrder(g)
  const rank = longestPathUp(g, order)
  let maxRank = 0
  for (let v = 0; v < n; v++) if (rank[v]! > maxRank) maxRank = rank[v]!

  // Weighted in-degree minus weighted out-degree: the slope of the cost in rank(v).
  const slope = new Float64Array(n)
  for (let e = 0; e < g.edgeCount; e++) {
    const w = weight(e)
    slope[g.head[e]!]! += w
    slope[g.tail[e]!]! -= w
  }
  for (let pass = 0; pass < MAX_PASSES; pass++) {
    let moved = false
    // Alternate directions so pushes travel both ways through chains.
    for (let k = 0; k < n; k++) {
      const v = order[pass % 2 === 0 ? n - 1 - k : k]!
      const s = slope[v]!
      if (s === 0) continue
      let lo = 0
      for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) {
        const pr = rank[g.tail[g.inEdges[i]!]!]! + 1
        if (pr > lo) lo = pr
      }
      let hi = maxRank
      for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
        const sr = rank[g.head[g.outEdges[i]!]!]! - 1
        if (sr < hi) hi = sr
      }
      const target = s > 0 ? lo : hi
      if (target !== rank[v]) {
        rank[v] = target
        moved = true
      }
    }
    if (!moved) break
  }
  return {rank, order}
}
