/**
 * Acyclicity with a witness: iterative depth-first search with three colours (Tarjan 1972; common
 * practice). O(n + m) time and memory, no recursion, so deep chains cannot overflow the stack.
 *
 * Vertices are tried in id order and out-edges in stored order, so the same graph always yields the
 * same cycle (or the same topological order).
 */
import type {Digraph} from '../graph/digraph.ts'

export interface Cycle {
  /** v0, v1, …, v(k-1): edges[i] runs from vertices[i] to vertices[(i + 1) % k]. */
  vertices: number[]
  edges: number[]
}

export type AcyclicityResult =
  | {acyclic: true; order: Int32Array}
  | {acyclic: false; cycle: Cycle}

const WHITE = 0
const GREY = 1
const BLACK = 2

export function findCycle(g: Digraph): AcyclicityResult {
  const n = g.vertexCount
  const colour = new Uint8Array(n)
  // The edge by which each vertex was entered, to walk a cycle back from its closing edge.
  const viaEdge = new Int32Array(n).fill(-1)
  // Per vertex on the stack: the next out-edge position to try.
  const cursor = new Int32Array(n)
  const stack = new Int32Array(n)
  const postorder = new Int32Array(n)
  let finished = 0

  for (let root = 0; root < n; root++) {
    if (colour[root] !== WHITE) continue
    let top = 0
    stack[0] = root
    colour[root] = GREY
    cursor[root] = g.outStart[root]!
    while (top >= 0) {
      const v = stack[top]!
      if (cursor[v]! < g.outStart[v + 1]!) {
        const e = g.outEdges[cursor[v]!++]!
        const w = g.head[e]!
        if (colour[w] === WHITE) {
          colour[w] = GREY
          viaEdge[w] = e
          cursor[w] = g.outStart[w]!
          stack[++top] = w
        } else if (colour[w] === GREY) {
          return {acyclic: false, cycle: walkBack(g, viaEdge, e)}
        }
      } else {
        colour[v] = BLACK
        postorder[finished++] = v
        top--
      }
    }
  }
  return {acyclic: true, order: postorder.reverse()}
}

/** The closing edge e = (v, w) with w grey: w is an ancestor of v on the DFS stack. */
function walkBack(g: Digraph, viaEdge: Int32Array, closing: number): Cycle {
  const w = g.head[closing]!
  const vertices: number[] = []
  const edges: number[] = [closing]
  let v = g.tail[closing]!
  vertices.push(v)
  while (v !== w) {
    const e = viaEdge[v]!
    edges.push(e)
    v = g.tail[e]!
    vertices.push(v)
  }
  vertices.reverse()
  edges.reverse()
  // Now vertices = w … v and edges = (w→…)…, closing last: edges[i] leaves vertices[i].
  return {vertices, edges}
}
