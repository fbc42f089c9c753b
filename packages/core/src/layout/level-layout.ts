/**
 * Drawing of a level graph whose per-level left-to-right orders are given (the witness of the exact
 * level-planarity test, level/level-planarity.ts): every vertex sits on the line of its level, every
 * edge spanning several levels bends through one point per level in between, at the place the order
 * gives it. Used for diagrams with tiers, where the levels are fixed by the author.
 *
 * Steps, the same as the upward layout's from step 3 on (layout-upward.ts; Sugiyama, Tagawa, Toda,
 * IEEE SMC 11, 1981, with the crossing-minimisation step replaced by the given orders; the shared
 * steps live in banded-drawing.ts):
 * 1. Objects: the vertices, and one bend object per edge per level it passes, in the given orders.
 * 2. Ports: a vertex's out-edges leave its flow-facing side in the order of their next objects on the
 *    level above, its in-edges enter the other side in the order of their previous objects below.
 * 3. Cross-flow coordinates by coordinates.ts (orders and separations kept).
 * 4. Bands along the flow, one per level, as thick as its thickest box (or `minBand`); boxes centred.
 *    An edge runs straight along the flow inside a band and straight across each gap.
 *
 * Why no crossings: the orders come from a level-planar solution, so for two segments between levels
 * l and l+1 the order of their lower ends and of their upper ends never disagree (ends at one vertex
 * are split by the ports in the order of the other ends). Inside a band every object keeps to its own
 * column (halfway to each neighbour), so crossing points on the band lines are strictly increasing in
 * that common order on both lines, and two straight segments between the lines cannot meet. Upward:
 * every segment strictly increases the coordinate along the flow (bands ≥ 0 thick, gaps positive).
 *
 * Time: O(n + m + B) for B bend objects, port sorts aside (O(d log d) per vertex of degree d), plus the
 * sweeps of coordinates.ts, each linear.
 */
import type {Digraph} from '../graph/digraph.ts'
import type {LevelItem} from '../level/level-planarity.ts'
import {assignCoordinates} from './coordinates.ts'
import {bandCentres, boxHalves, dropStraightThrough, layeredGraph, orient, resolveSpacing, SEGMENT_WEIGHT, spreadPorts, typicalStep, type Point} from './banded-drawing.ts'
import type {BoxSize, Flow, Layout, Spacing} from './types.ts'

export interface LevelLayoutInput {
  graph: Digraph
  /** Level of every vertex; every edge goes to a strictly higher level. */
  level: ArrayLike<number>
  /** Per level, left to right: its vertices and the edges passing through it (each exactly once). */
  orders: ReadonlyArray<ReadonlyArray<LevelItem>>
  boxes: ReadonlyArray<BoxSize>
  flow: Flow
  spacing?: Partial<Spacing> | undefined
  /** Per level: the least thickness of its band along the flow (room for a caption), default 0. */
  minBand?: ArrayLike<number> | undefined
}

export interface LevelLayout {
  layout: Layout
  /**
   * Per level: its band along the flow in SVG coordinates, as [low, high] on the y axis for flows up
   * and down, on the x axis for left and right. Boxes of the level are centred in it.
   */
  bands: Array<[number, number]>
}

export function layoutLevels(input: LevelLayoutInput): LevelLayout {
  const {graph: g, level, orders, boxes, flow} = input
  const n = g.vertexCount
  const m = g.edgeCount
  const spacing = resolveSpacing(input.spacing)
  if (boxes.length < n) throw new Error('layoutLevels: a box size is missing for some vertex')
  const layerCount = orders.length
  if (n === 0) return {layout: {flow, width: 0, height: 0, nodes: [], edges: []}, bands: []}

  const {halfU, halfV} = boxHalves(boxes, n, flow)

  // 1. Objects in the given orders; `bendAt` finds an edge's bend object on a level.
  const layers: Int32Array[] = []
  const layerOf: number[] = []
  const bendAt = new Map<number, number>()
  const key = (e: number, l: number): number => e * (layerCount + 1) + l
  let objectCount = n
  const seen = new Uint8Array(n)
  for (let l = 0; l < layerCount; l++) {
    const order = orders[l]!
    const layer = new Int32Array(order.length)
    order.forEach((item, i) => {
      if (item.kind === 'vertex') {
        if (level[item.vertex] !== l || seen[item.vertex]) throw new Error(`layoutLevels: vertex ${item.vertex} misplaced on level ${l}`)
        seen[item.vertex] = 1
        layer[i] = item.vertex
        layerOf[item.vertex] = l
      } else {
        bendAt.set(key(item.edge, l), objectCount)
        layer[i] = objectCount
        layerOf[objectCount] = l
        objectCount++
      }
    })
    layers.push(layer)
  }
  for (let v = 0; v < n; v++) if (!seen[v]) throw new Error(`layoutLevels: vertex ${v} is in no order`)
  const chain = (e: number): number[] => {
    const t = g.tail[e]!
    const h = g.head[e]!
    const objects = [t]
    for (let l = level[t]! + 1; l < level[h]!; l++) {
      const o = bendAt.get(key(e, l))
      if (o === undefined) throw new Error(`layoutLevels: edge ${e} is missing on level ${l}`)
      objects.push(o)
    }
    objects.push(h)
    return objects
  }
  const chains = Array.from({length: m}, (_, e) => chain(e))
  const position = new Int32Array(objectCount)
  for (const layer of layers) layer.forEach((o, i) => (position[o] = i))
  const half = new Float64Array(objectCount)
  const isBox = new Uint8Array(objectCount)
  for (let v = 0; v < n; v++) {
    half[v] = halfU[v]!
    isBox[v] = 1
  }

  // 2. Ports, ordered by the other end of each edge's first (or last) segment.
  const tailPort = new Float64Array(m)
  const headPort = new Float64Array(m)
  spreadPorts(g, halfU, spacing.edge, true, (e) => position[chains[e]![1]!]!, tailPort)
  spreadPorts(g, halfU, spacing.edge, false, (e) => position[chains[e]![chains[e]!.length - 2]!]!, headPort)

  let segCount = 0
  for (const c of chains) segCount += c.length - 1
  const lg = layeredGraph(objectCount, layers, half, isBox, segCount)
  let s = 0
  chains.forEach((c, e) => {
    for (let i = 0; i + 1 < c.length; i++) {
      const a = c[i]!
      const b = c[i + 1]!
      lg.segLow[s] = a
      lg.segHigh[s] = b
      lg.segLowPort[s] = i === 0 ? tailPort[e]! : 0
      lg.segHighPort[s] = i + 2 === c.length ? headPort[e]! : 0
      lg.segWeight[s] = SEGMENT_WEIGHT[(isBox[a] ? 0 : 1) + (isBox[b] ? 0 : 1)]!
      s++
    }
  })

  // 3. Cross-flow coordinates, starting from each object's place in its order at a typical step.
  const unit = typicalStep(halfU, spacing.node)
  const initial = new Float64Array(objectCount)
  for (let o = 0; o < objectCount; o++) initial[o] = position[o]! * unit
  const x = assignCoordinates(lg, initial, spacing.node, spacing.edge)

  // 4. Bands along the flow.
  const bandHalf = new Float64Array(layerCount)
  for (let v = 0; v < n; v++) bandHalf[layerOf[v]!] = Math.max(bandHalf[layerOf[v]!]!, halfV[v]!)
  for (let l = 0; l < layerCount; l++) bandHalf[l] = Math.max(bandHalf[l]!, (input.minBand?.[l] ?? 0) / 2)
  const centre = bandCentres(bandHalf, spacing.layer)

  const routes: Point[][] = chains.map((c, e) => {
    const t = c[0]!
    const h = c[c.length - 1]!
    const pts: Point[] = []
    const pu = x[t]! + tailPort[e]!
    const lt = layerOf[t]!
    pts.push([pu, centre[lt]! + halfV[t]!])
    pts.push([pu, centre[lt]! + bandHalf[lt]!])
    for (let i = 1; i + 1 < c.length; i++) {
      const o = c[i]!
      const l = layerOf[o]!
      pts.push([x[o]!, centre[l]! - bandHalf[l]!])
      pts.push([x[o]!, centre[l]! + bandHalf[l]!])
    }
    const qu = x[h]! + headPort[e]!
    const lh = layerOf[h]!
    pts.push([qu, centre[lh]! - bandHalf[lh]!])
    pts.push([qu, centre[lh]! - halfV[h]!])
    return simplify(pts)
  })

  // A band thicker than its boxes (room for a caption) belongs to the drawing too: along the flow only.
  const bandEnds = new Float64Array(2 * layerCount)
  for (let l = 0; l < layerCount; l++) {
    bandEnds[2 * l] = centre[l]! - bandHalf[l]!
    bandEnds[2 * l + 1] = centre[l]! + bandHalf[l]!
  }
  const {layout, map, origin} = orient(flow, g, x, layerOf, centre, boxes, routes, bandEnds)
  // Each band in SVG coordinates, translated like the drawing.
  const alongAxis = sidewaysAxis(flow)
  const bands = Array.from(centre, (c, l): [number, number] => {
    const a = map(0, c - bandHalf[l]!)
    const b = map(0, c + bandHalf[l]!)
    const shift = origin[alongAxis]
    const lo = Math.min(a[alongAxis], b[alongAxis]) - shift
    const hi = Math.max(a[alongAxis], b[alongAxis]) - shift
    return [lo, hi]
  })
  return {layout, bands}
}

/** Drop repeated points, then middle points of runs along the flow. */
function simplify(pts: Point[]): Point[] {
  return dropStraightThrough(pts.filter((p, i) => i === 0 || p[0] !== pts[i - 1]![0] || p[1] !== pts[i - 1]![1]))
}

/** The SVG axis along the flow: 1 (y) for up and down, 0 (x) for left and right. */
function sidewaysAxis(flow: Flow): 0 | 1 {
  return flow === 'left' || flow === 'right' ? 0 : 1
}
