/**
 * The steps the upward layout (layout-upward.ts) and the level layout (level-layout.ts) share once
 * every object has its layer and its place in the layer's order: box extents in flow terms, the
 * segment weights and starting guess for coordinates.ts, bands along the flow, ports on box sides,
 * merging straight runs of a route, and turning the internal drawing (u across the flow, v along it)
 * into SVG coordinates for the flow. All linear in their input, port sorts aside (O(d log d) per
 * vertex of degree d).
 */
import type {Digraph} from '../graph/digraph.ts'
import type {LayeredGraph} from './coordinates.ts'
import {defaultSpacing, type BoxSize, type Flow, type Layout, type Spacing} from './types.ts'

/** Smallest gap accepted, so separations stay positive whatever the caller passes. */
const MIN_GAP = 1
/** Segment weights by number of bend ends (0, 1, 2), see coordinates.ts. */
export const SEGMENT_WEIGHT = [1, 2, 8] as const

export type Point = [number, number]

/** The caller's gaps over the defaults, each raised to MIN_GAP. */
export function resolveSpacing(spacing: Partial<Spacing> | undefined): Spacing {
  return {
    layer: Math.max(MIN_GAP, spacing?.layer ?? defaultSpacing.layer),
    node: Math.max(MIN_GAP, spacing?.node ?? defaultSpacing.node),
    edge: Math.max(MIN_GAP, spacing?.edge ?? defaultSpacing.edge),
  }
}

/** Half extents of the first n boxes across the flow (halfU) and along it (halfV). */
export function boxHalves(boxes: ReadonlyArray<BoxSize>, n: number, flow: Flow): {halfU: Float64Array; halfV: Float64Array} {
  const sideways = flow === 'left' || flow === 'right'
  const halfU = new Float64Array(n)
  const halfV = new Float64Array(n)
  for (let v = 0; v < n; v++) {
    const b = boxes[v]!
    halfU[v] = (sideways ? b.height : b.width) / 2
    halfV[v] = (sideways ? b.width : b.height) / 2
  }
  return {halfU, halfV}
}

/** The objects of a layered drawing with room for `segCount` segments, filled in by the caller. */
export function layeredGraph(objectCount: number, layers: Int32Array[], half: Float64Array, isBox: Uint8Array, segCount: number): LayeredGraph {
  return {
    objectCount,
    layers,
    half,
    isBox,
    segLow: new Int32Array(segCount),
    segHigh: new Int32Array(segCount),
    segLowPort: new Float64Array(segCount),
    segHighPort: new Float64Array(segCount),
    segWeight: new Float64Array(segCount),
  }
}

/** One step across the flow for the coordinates' starting guess: half a typical box plus gap. */
export function typicalStep(halfU: Float64Array, nodeGap: number): number {
  let widthSum = 0
  for (let v = 0; v < halfU.length; v++) widthSum += 2 * halfU[v]!
  return (widthSum / halfU.length + nodeGap) / 2
}

/**
 * Centre line of each band along the flow, bands `bandHalf` thick on each side. Next to a band of
 * bends only (no box, half thickness 0) the gap is halved: nothing there needs room for a label or an
 * arrowhead, and any positive gap keeps the drawing crossing-free.
 */
export function bandCentres(bandHalf: Float64Array, layerGap: number): Float64Array {
  const centre = new Float64Array(bandHalf.length)
  for (let l = 0; l < bandHalf.length; l++) {
    const gap = bandHalf[l - 1] === 0 || bandHalf[l] === 0 ? layerGap / 2 : layerGap
    centre[l] = l === 0 ? bandHalf[0]! : centre[l - 1]! + bandHalf[l - 1]! + gap + bandHalf[l]!
  }
  return centre
}

/**
 * Port offsets across the flow: each vertex's out-edges (`out`) or in-edges spread along its side in
 * the order of `rank` (edge id breaks ties), centred, at most `gap` apart and strictly inside the side.
 */
export function spreadPorts(
  g: Digraph,
  halfU: Float64Array,
  gap: number,
  out: boolean,
  rank: (e: number) => number,
  port: Float64Array
): void {
  const start = out ? g.outStart : g.inStart
  const list = out ? g.outEdges : g.inEdges
  for (let v = 0; v < g.vertexCount; v++) {
    const k = start[v + 1]! - start[v]!
    if (k === 0) continue
    const edges = Array.from(list.subarray(start[v]!, start[v + 1]!)).sort((a, b) => rank(a) - rank(b) || a - b)
    // k ports at most `gap` apart, spanning less than the side: |offset| <= (k-1)/2 * 2h/k < h.
    const step = Math.min(gap, (2 * halfU[v]!) / k)
    for (let i = 0; i < k; i++) port[edges[i]!] = (i - (k - 1) / 2) * step
  }
}

/** Drop middle points of runs along the flow (three points with the same cross coordinate). */
export function dropStraightThrough(pts: Point[]): Point[] {
  const out: Point[] = [pts[0]!]
  for (let i = 1; i < pts.length - 1; i++) {
    const a = out[out.length - 1]!
    const b = pts[i]!
    const c = pts[i + 1]!
    if (a[0] === b[0] && b[0] === c[0]) continue
    out.push(b)
  }
  out.push(pts[pts.length - 1]!)
  return out
}

export interface Oriented {
  layout: Layout
  /** Internal (u, v) to SVG before the translation by `origin`. */
  map: (u: number, v: number) => Point
  /** What was subtracted from every SVG point so the drawing starts at 0. */
  origin: Point
}

/**
 * Internal (u, v) to SVG (x, y): up (u, -v); down (u, v); right (v, u); left (-v, u). Then translate
 * so the drawing starts at 0. The drawing is the boxes, the routes and, along the flow only, the
 * positions `along` (e.g. bands thicker than their boxes). End points are recomputed from the final
 * box so that they lie on the box's side exactly as a checker computes it (centre ± half size).
 */
export function orient(
  flow: Flow,
  g: Digraph,
  x: Float64Array,
  layerOf: ArrayLike<number>,
  centre: Float64Array,
  boxes: ReadonlyArray<BoxSize>,
  routes: Point[][],
  along: ArrayLike<number> = []
): Oriented {
  const map = (u: number, v: number): Point =>
    flow === 'up' ? [u, -v] : flow === 'down' ? [u, v] : flow === 'right' ? [v, u] : [-v, u]
  const n = g.vertexCount
  let minX = Infinity
  let minY = Infinity
  let maxX = -Infinity
  let maxY = -Infinity
  const centres: Point[] = []
  for (let v = 0; v < n; v++) {
    const c = map(x[v]!, centre[layerOf[v]!]!)
    centres.push(c)
    const b = boxes[v]!
    minX = Math.min(minX, c[0] - b.width / 2)
    maxX = Math.max(maxX, c[0] + b.width / 2)
    minY = Math.min(minY, c[1] - b.height / 2)
    maxY = Math.max(maxY, c[1] + b.height / 2)
  }
  const mapped = routes.map((pts) => pts.map(([u, v]) => map(u, v)))
  for (const pts of mapped) {
    for (const [px, py] of pts) {
      minX = Math.min(minX, px)
      maxX = Math.max(maxX, px)
      minY = Math.min(minY, py)
      maxY = Math.max(maxY, py)
    }
  }
  const sideways = flow === 'left' || flow === 'right'
  for (let i = 0; i < along.length; i++) {
    const p = map(0, along[i]!)
    if (sideways) {
      minX = Math.min(minX, p[0])
      maxX = Math.max(maxX, p[0])
    } else {
      minY = Math.min(minY, p[1])
      maxY = Math.max(maxY, p[1])
    }
  }
  const nodes = centres.map(([cx, cy], v) => ({
    vertex: v,
    x: cx - minX,
    y: cy - minY,
    width: boxes[v]!.width,
    height: boxes[v]!.height,
  }))
  const edges = mapped.map((pts, e) => {
    const points = pts.map(([px, py]): Point => [px - minX, py - minY])
    const tb = nodes[g.tail[e]!]!
    const hb = nodes[g.head[e]!]!
    const first = points[0]!
    const last = points[points.length - 1]!
    // Snap the along-flow coordinate of each end onto the box side.
    if (flow === 'up') {
      first[1] = tb.y - tb.height / 2
      last[1] = hb.y + hb.height / 2
    } else if (flow === 'down') {
      first[1] = tb.y + tb.height / 2
      last[1] = hb.y - hb.height / 2
    } else if (flow === 'right') {
      first[0] = tb.x + tb.width / 2
      last[0] = hb.x - hb.width / 2
    } else {
      first[0] = tb.x - tb.width / 2
      last[0] = hb.x + hb.width / 2
    }
    return {edge: e, points}
  })
  return {layout: {flow, width: maxX - minX, height: maxY - minY, nodes, edges}, map, origin: [minX, minY]}
}
