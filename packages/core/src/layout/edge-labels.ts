/**
 * Edge labels in a drawing. The check splits each labelled edge u → v at a label vertex ℓ
 * (level/edge-label-graph.ts); the split graph is laid out with a box for ℓ sized by the label text,
 * so the layout's own guarantees keep every label box clear of every other box and edge. Here the two
 * halves u → ℓ and ℓ → v become one polyline again: ℓ has one in-edge and one out-edge, both at the
 * middle of its sides, so the joined line runs straight through the label box along the flow, and the
 * box (drawn over the line) reads as a label on the edge.
 *
 * Numbering as in edge-label-graph.ts: vertex n + k and edge m + k belong to `labelledEdges[k]`.
 * Linear time.
 */
import type {Layout, LayoutEdge} from './types.ts'

/** A label's box on the drawn edge `edge` (an edge id of the diagram's own graph), centre and size. */
export interface EdgeLabelBox {
  edge: number
  x: number
  y: number
  width: number
  height: number
}

export interface JoinedLayout {
  /** The drawing of the diagram's own graph: n nodes, m edges. */
  layout: Layout
  /** One box per labelled edge, in the order of `labelledEdges`. */
  labels: EdgeLabelBox[]
}

export function joinEdgeLabels(split: Layout, vertexCount: number, edgeCount: number, labelledEdges: readonly number[]): JoinedLayout {
  const n = vertexCount
  const m = edgeCount
  const nodeOf = new Map(split.nodes.map((node) => [node.vertex, node]))
  const pointsOf = new Map(split.edges.map((edge) => [edge.edge, edge.points]))
  const secondHalf = new Map<number, number>()
  labelledEdges.forEach((e, k) => secondHalf.set(e, m + k))
  const edges: LayoutEdge[] = []
  for (let e = 0; e < m; e++) {
    const first = pointsOf.get(e)
    if (!first) throw new Error(`joinEdgeLabels: edge ${e} is not drawn`)
    const k = secondHalf.get(e)
    if (k === undefined) {
      edges.push({edge: e, points: first})
      continue
    }
    const second = pointsOf.get(k)
    if (!second) throw new Error(`joinEdgeLabels: the second half of edge ${e} is not drawn`)
    edges.push({edge: e, points: [...first, ...second]})
  }
  const labels = labelledEdges.map((e, k): EdgeLabelBox => {
    const node = nodeOf.get(n + k)
    if (!node) throw new Error(`joinEdgeLabels: the label of edge ${e} is not placed`)
    return {edge: e, x: node.x, y: node.y, width: node.width, height: node.height}
  })
  const nodes = split.nodes.filter((node) => node.vertex < n)
  return {layout: {flow: split.flow, width: split.width, height: split.height, nodes, edges}, labels}
}
