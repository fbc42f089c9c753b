/**
 * Left-to-right order from the embedding of a planar st-graph, via its dual st-graph.
 *
 * Tamassia & Tollis, "A unified approach to visibility representations of planar graphs", Discrete
 * Comput. Geom. 1, 1986 (also Di Battista, Eades, Tamassia, Tollis, "Graph Drawing", 1999, ch. 4):
 * the dual D of a planar st-graph H has a vertex per inner face plus s* and t* (the outer face split
 * into its left and right part) and an edge left(e) -> right(e) for every edge e of H; D is again a
 * planar st-graph. With psi any topological numbering of D, give edge e the abscissa psi(left(e)) and
 * vertex v the interval [psi(left(v)), psi(right(v)) - 1]. For any topological numbering of H used as
 * ordinates, the segments form a visibility representation: two objects met by the same horizontal
 * line are disjoint, one left of the other (their lemma: a vertex and an edge, or two vertices, or two
 * edges, are either joined by a directed path in H, and then cannot share a horizontal line, or one
 * lies left of the other by a path in D). So sorting by the left end gives, on every layer, an order
 * that never makes two edges cross between consecutive layers.
 *
 * Conventions (rotation-system.ts): rotations are clockwise with y up, and the face traced on dart d
 * lies on d's left; so left(e) is the face of dart 2e and right(e) that of dart 2e + 1. On the outer
 * face, the darts walked tail -> head run up the drawing's left side (left face s*), the others run
 * down its right side (right face t*).
 *
 * Faces come traced as in rotation-system.ts, with the outer face named by the augmentation.
 *
 * Time: O(n + m).
 */
import type {RotationSystem} from '../embedding/rotation-system.ts'
import type {Faces} from '../embedding/rotation-system.ts'

export interface DualOrder {
  /** psi(left(e)) per edge of H: the edge's abscissa in the visibility representation. */
  edgeKey: Int32Array
  /** psi(left(v)) per vertex of H: the left end of the vertex's interval (0 for isolated vertices). */
  vertexKey: Int32Array
}

export function dualOrder(emb: RotationSystem, faces: Faces, outer: number): DualOrder {
  const g = emb.graph
  const m = g.edgeCount
  const n = g.vertexCount
  const edgeKey = new Int32Array(m)
  const vertexKey = new Int32Array(n)
  if (m === 0) return {edgeKey, vertexKey}
  const faceCount = faces.darts.length
  if (!(outer >= 0 && outer < faceCount)) throw new Error('layout: the st-augmentation names no outer face')
  // Dual vertices: faces 0..faceCount-1 with the outer face standing for s*, and t* = faceCount.
  const tStar = faceCount
  const left = new Int32Array(m)
  const right = new Int32Array(m)
  for (let e = 0; e < m; e++) {
    left[e] = faces.faceOfDart[2 * e]!
    const r = faces.faceOfDart[2 * e + 1]!
    right[e] = r === outer ? tStar : r
  }
  // Kahn's algorithm on D (edges left(e) -> right(e)), CSR by left face.
  const dn = faceCount + 1
  const start = new Int32Array(dn + 1)
  const indeg = new Int32Array(dn)
  for (let e = 0; e < m; e++) {
    start[left[e]! + 1]!++
    indeg[right[e]!]!++
  }
  for (let f = 0; f < dn; f++) start[f + 1]! += start[f]!
  const fill = start.slice(0, dn)
  const adj = new Int32Array(m)
  for (let e = 0; e < m; e++) adj[fill[left[e]!]!++] = right[e]!
  const psi = new Int32Array(dn).fill(-1)
  const queue = new Int32Array(dn)
  let qh = 0
  let qt = 0
  for (let f = 0; f < dn; f++) if (indeg[f] === 0) queue[qt++] = f
  while (qh < qt) {
    const f = queue[qh]!
    psi[f] = qh++
    for (let i = start[f]!; i < start[f + 1]!; i++) {
      const h = adj[i]!
      if (--indeg[h] === 0) queue[qt++] = h
    }
  }
  if (qt !== dn) throw new Error('layout: the dual of the embedding has a cycle; the embedding is not that of a planar st-graph')
  for (let e = 0; e < m; e++) edgeKey[e] = psi[left[e]!]!
  // left(v): the left face of v's leftmost edges, which has the smallest psi among v's edges' left faces.
  vertexKey.fill(0x7fffffff)
  for (let e = 0; e < m; e++) {
    const k = edgeKey[e]!
    if (k < vertexKey[g.tail[e]!]!) vertexKey[g.tail[e]!] = k
    if (k < vertexKey[g.head[e]!]!) vertexKey[g.head[e]!] = k
  }
  for (let v = 0; v < n; v++) if (vertexKey[v] === 0x7fffffff) vertexKey[v] = 0
  return {edgeKey, vertexKey}
}
