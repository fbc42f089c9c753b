/**
 * The reference layered layout for the benches: @dagrejs/dagre on our graph with our box sizes and our
 * gaps (layer, node, edge from defaultSpacing), read back as our Layout type so both drawings go
 * through the same statistics and crossing count.
 */
import dagre from '@dagrejs/dagre'
import type {Digraph} from '../../packages/core/src/graph/digraph.ts'
import {defaultSpacing, type Layout} from '../../packages/core/src/layout/index.ts'

export type Box = {width: number; height: number}

export function dagreLayout(g: Digraph, boxes: Box[]): Layout {
  const d = new dagre.graphlib.Graph({multigraph: true})
  d.setGraph({rankdir: 'BT', nodesep: defaultSpacing.node, edgesep: defaultSpacing.edge, ranksep: defaultSpacing.layer, marginx: 0, marginy: 0})
  d.setDefaultEdgeLabel(() => ({}))
  for (let v = 0; v < g.vertexCount; v++) d.setNode(String(v), {width: boxes[v]!.width, height: boxes[v]!.height})
  for (let e = 0; e < g.edgeCount; e++) d.setEdge(String(g.tail[e]), String(g.head[e]), {}, String(e))
  dagre.layout(d)
  const nodes = Array.from({length: g.vertexCount}, (_, v) => {
    const n = d.node(String(v))
    return {vertex: v, x: n.x, y: n.y, width: boxes[v]!.width, height: boxes[v]!.height}
  })
  const edges = Array.from({length: g.edgeCount}, (_, e) => {
    const pts = d.edge({v: String(g.tail[e]), w: String(g.head[e]), name: String(e)}).points as Array<{x: number; y: number}>
    return {edge: e, points: pts.map((p): [number, number] => [p.x, p.y])}
  })
  const graph = d.graph()
  return {flow: 'up', width: graph.width ?? 0, height: graph.height ?? 0, nodes, edges}
}
