/**
 * A floor for the planarity bench: the least a depth-first planarity test must do on its input.
 *
 * Every linear-time planarity test we know of walks the graph depth first before anything else
 * (Hopcroft and Tarjan 1974; the left-right test of de Fraysseix and Rosenstiehl, as described by
 * Brandes; Boyer and Myrvold 2004; PQ-tree tests through an st-numbering, which Even and Tarjan 1976
 * compute by a depth-first walk). So the undirected lists of the input plus a walk that only visits
 * (each slot read once, each neighbour's mark read once, no lowpoints, no records) is work every such
 * test pays; on random labels at 10^6 edges its reads miss the caches (bench/README.md, "Planarity").
 * Bench only: nothing in the product calls it.
 */
import type {Incidence} from '../../packages/core/src/planarity/incidence.ts'

/** Visits every vertex once, depth first from the smallest unvisited label; returns a checksum of the marks read. */
export function bareDepthFirst(inc: Incidence): number {
  const n = inc.vertexCount
  const {adjStart, other} = inc
  const mark = new Int32Array(n) // 0 unseen, else preorder number + 1
  const next = new Int32Array(n) // next slot to scan
  const stack = new Int32Array(n)
  let count = 0
  let sum = 0
  for (let r = 0; r < n; r++) {
    if (mark[r] !== 0) continue
    mark[r] = ++count
    next[r] = adjStart[r]!
    let top = 0
    stack[0] = r
    while (top >= 0) {
      const v = stack[top]!
      const i = next[v]!
      if (i === adjStart[v + 1]!) { top--; continue }
      next[v] = i + 1
      const w = other[i]!
      const seen = mark[w]!
      if (seen === 0) {
        mark[w] = ++count
        next[w] = adjStart[w]!
        stack[++top] = w
      } else sum += seen
    }
  }
  if (count !== n) throw new Error('bare depth-first walk missed a vertex')
  return sum
}
