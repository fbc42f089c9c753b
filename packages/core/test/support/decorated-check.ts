/**
 * The geometric checker (geometry-check.ts) extended to edge labels and tiers (tests only). Shares no
 * code with the layout.
 *
 * Edge labels: a label box sits on its edge. The edge's polyline must have a point on the label box's
 * side facing against the flow immediately followed by a point on its side facing the flow (the line
 * runs straight through the box). Cutting each labelled polyline there gives a drawing of the graph
 * with every labelled edge split at a label vertex, which must pass checkDrawing: so a label box meets
 * no other box, no other label box and no other edge, and its own edge only where it enters and leaves.
 *
 * Tiers (and levels): vertices of one level have one centre coordinate along the flow, and a higher
 * level lies strictly further along it; each tier's band contains the boxes of its vertices, bands are
 * pairwise disjoint and in tier order along the flow; each caption lies inside its band along the flow,
 * inside the drawing, and meets no box, label box, edge or other caption.
 */
import type {Digraph} from '../../src/graph/digraph.ts'
import {createDigraph} from '../../src/graph/digraph.ts'
import type {BoxSize, Layout, LayoutNode} from '../../src/layout/index.ts'
import {checkDrawing, segmentMeetsRect, type DrawingCheck} from './geometry-check.ts'

export interface LabelBoxAt {
  edge: number
  x: number
  y: number
  width: number
  height: number
}

export interface RectAt {
  x: number
  y: number
  width: number
  height: number
}

export interface TierAt {
  band: RectAt
  caption: RectAt
  vertices: readonly number[]
}

export interface DecoratedOptions {
  boxes?: ReadonlyArray<BoxSize> | undefined
  /** Least size of each label box, in the order of `labels`. */
  labelBoxes?: ReadonlyArray<BoxSize> | undefined
  labels?: ReadonlyArray<LabelBoxAt> | undefined
  tiers?: ReadonlyArray<TierAt> | undefined
  /**
   * Level of every vertex of the split graph (vertices, then one per label in the order of `labels`),
   * as the check returned it.
   */
  level?: ArrayLike<number> | undefined
}

export function checkDecoratedDrawing(graph: Digraph, layout: Layout, options: DecoratedOptions = {}): DrawingCheck {
  const problems: string[] = []
  const n = graph.vertexCount
  const m = graph.edgeCount
  const flow = layout.flow
  const labels = options.labels ?? []
  const sideways = flow === 'left' || flow === 'right'
  const along = (x: number, y: number): number => (flow === 'up' ? -y : flow === 'down' ? y : flow === 'right' ? x : -x)

  // Edge labels: split each labelled polyline at its label box.
  const pairs: Array<[number, number]> = []
  for (let e = 0; e < m; e++) pairs.push([graph.tail[e]!, graph.head[e]!])
  const edges = new Map(layout.edges.map((edge) => [edge.edge, edge.points]))
  const splitEdges: Array<{edge: number; points: Array<[number, number]>}> = layout.edges.map((edge) => ({edge: edge.edge, points: edge.points}))
  const labelNodes: LayoutNode[] = []
  const seenEdge = new Set<number>()
  labels.forEach((label, k) => {
    const e = label.edge
    const pts = edges.get(e)
    if (!pts || seenEdge.has(e) || e < 0 || e >= m) {
      problems.push(`label ${k} is on edge ${e}, which is not drawn or has another label`)
      return
    }
    seenEdge.add(e)
    const x0 = label.x - label.width / 2
    const x1 = label.x + label.width / 2
    const y0 = label.y - label.height / 2
    const y1 = label.y + label.height / 2
    const onIn = ([px, py]: readonly [number, number]): boolean =>
      flow === 'up' ? py === y1 && x0 <= px && px <= x1
        : flow === 'down' ? py === y0 && x0 <= px && px <= x1
          : flow === 'right' ? px === x0 && y0 <= py && py <= y1
            : px === x1 && y0 <= py && py <= y1
    const onOut = ([px, py]: readonly [number, number]): boolean =>
      flow === 'up' ? py === y0 && x0 <= px && px <= x1
        : flow === 'down' ? py === y1 && x0 <= px && px <= x1
          : flow === 'right' ? px === x1 && y0 <= py && py <= y1
            : px === x0 && y0 <= py && py <= y1
    let cut = -1
    for (let i = 0; i + 1 < pts.length; i++) if (onIn(pts[i]!) && onOut(pts[i + 1]!)) cut = i
    if (cut < 0) {
      problems.push(`edge ${e} does not run through its label box`)
      return
    }
    const want = options.labelBoxes?.[k]
    if (want && (label.width < want.width || label.height < want.height)) {
      problems.push(`label of edge ${e}: box ${label.width}x${label.height} smaller than its text box ${want.width}x${want.height}`)
    }
    const vertex = n + labelNodes.length
    const index = splitEdges.findIndex((s) => s.edge === e)
    splitEdges[index] = {edge: e, points: pts.slice(0, cut + 1)}
    splitEdges.push({edge: m + labelNodes.length, points: pts.slice(cut + 1)})
    pairs[e] = [graph.tail[e]!, vertex]
    pairs.push([vertex, graph.head[e]!])
    labelNodes.push({vertex, x: label.x, y: label.y, width: label.width, height: label.height})
  })
  if (problems.length > 0) return {ok: false, problems}
  const split = createDigraph(n + labelNodes.length, pairs)
  const splitLayout: Layout = {...layout, nodes: [...layout.nodes, ...labelNodes], edges: splitEdges}
  const base = checkDrawing(split, splitLayout, options.boxes ? {boxes: options.boxes} : {})
  if (!base.ok) problems.push(...base.problems)

  // Levels: one centre per level, strictly increasing along the flow.
  const centreOf = new Map<number, number>()
  for (const node of splitLayout.nodes) centreOf.set(node.vertex, along(node.x, node.y))
  if (options.level) {
    const levelCentre = new Map<number, number>()
    for (let v = 0; v < split.vertexCount; v++) {
      const l = options.level[v]!
      const c = centreOf.get(v)!
      const known = levelCentre.get(l)
      if (known === undefined) levelCentre.set(l, c)
      else if (known !== c) problems.push(`vertex ${v} is off the line of level ${l} (${c} vs ${known})`)
    }
    const sorted = [...levelCentre].sort((a, b) => a[0] - b[0])
    for (let i = 1; i < sorted.length; i++) {
      if (!(sorted[i]![1] > sorted[i - 1]![1])) problems.push(`level ${sorted[i]![0]} is not beyond level ${sorted[i - 1]![0]} along the flow`)
    }
  }

  // Tiers.
  const tiers = options.tiers ?? []
  const rectOf = (r: RectAt): {x0: number; y0: number; x1: number; y1: number} => ({x0: r.x, y0: r.y, x1: r.x + r.width, y1: r.y + r.height})
  const meets = (a: RectAt, b: RectAt): boolean =>
    !(a.x + a.width < b.x || b.x + b.width < a.x || a.y + a.height < b.y || b.y + b.height < a.y)
  const contains = (outer: RectAt, inner: RectAt): boolean =>
    outer.x <= inner.x && outer.y <= inner.y && inner.x + inner.width <= outer.x + outer.width && inner.y + inner.height <= outer.y + outer.height
  const nodeRect = (node: LayoutNode): RectAt => ({x: node.x - node.width / 2, y: node.y - node.height / 2, width: node.width, height: node.height})
  const nodeOf = new Map(splitLayout.nodes.map((node) => [node.vertex, node]))
  const whole: RectAt = {x: 0, y: 0, width: layout.width, height: layout.height}
  tiers.forEach((tier, t) => {
    if (!contains(whole, tier.band) || !contains(whole, tier.caption)) problems.push(`tier ${t}: band or caption outside the drawing`)
    const centres = new Set<number>()
    for (const v of tier.vertices) {
      const node = nodeOf.get(v)!
      centres.add(along(node.x, node.y))
      if (!contains(tier.band, nodeRect(node))) problems.push(`tier ${t}: the box of vertex ${v} is not inside its band`)
    }
    if (centres.size > 1) problems.push(`tier ${t}: its vertices are not on one line`)
    // The caption lies within its band along the flow.
    const [b0, b1, c0, c1] = sideways
      ? [tier.band.x, tier.band.x + tier.band.width, tier.caption.x, tier.caption.x + tier.caption.width]
      : [tier.band.y, tier.band.y + tier.band.height, tier.caption.y, tier.caption.y + tier.caption.height]
    if (!(b0 <= c0 && c1 <= b1)) problems.push(`tier ${t}: caption outside its band along the flow`)
    const cap = rectOf(tier.caption)
    for (const node of splitLayout.nodes) if (meets(tier.caption, nodeRect(node))) problems.push(`tier ${t}: caption meets the box of vertex ${node.vertex}`)
    for (const edge of splitLayout.edges) {
      for (let i = 1; i < edge.points.length; i++) {
        const [ax, ay] = edge.points[i - 1]!
        const [bx, by] = edge.points[i]!
        if (segmentMeetsRect(ax, ay, bx, by, cap)) {
          problems.push(`tier ${t}: caption meets edge ${edge.edge}`)
          break
        }
      }
    }
    for (let u = 0; u < t; u++) {
      const other = tiers[u]!
      if (meets(other.band, tier.band)) problems.push(`tiers ${u} and ${t}: bands meet`)
      if (meets(other.caption, tier.caption)) problems.push(`tiers ${u} and ${t}: captions meet`)
      const mid = (r: RectAt): number => (sideways ? along(r.x + r.width / 2, 0) : along(0, r.y + r.height / 2))
      if (!(mid(other.band) < mid(tier.band))) problems.push(`tier ${t} is not beyond tier ${u} along the flow`)
    }
  })
  return problems.length === 0 ? {ok: true} : {ok: false, problems: problems.slice(0, 20)}
}
