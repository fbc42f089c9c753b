/**
 * Upward, crossing-free polyline drawing of a graph G from a planar st-graph H ⊇ G with its embedding.
 *
 * Pipeline (a layered drawing in the manner of Sugiyama, Tagawa, Toda, IEEE SMC 11, 1981, with the
 * crossing-minimisation step replaced by the embedding, which makes it exact):
 * 0. Added edges that H can do without are dropped (prune-augmentation.ts).
 * 1. Layers of H (layering.ts): every edge of H points to a higher layer; only G's edges count towards
 *    the span that is minimised.
 * 2. Every G edge spanning several layers gets a bend object on each layer in between; H's added
 *    vertices and edges are dropped from here on (they have shaped the layers and the orders).
 * 3. Per-layer order from the visibility representation of H (dual-order.ts), so consecutive layers
 *    are joined by segments whose orders agree at both ends: no two edges cross, for every input.
 * 4. Cross-flow coordinates (coordinates.ts) keep those orders and the separations.
 * 5. Routing: layers are bands as tall as their tallest box, boxes centred in the band. An edge leaves
 *    its tail box on the side facing the flow at a port (ports spread in embedding order, centred), goes
 *    straight along the flow to the band's edge when the box is shorter than the band, crosses the gap
 *    straight to the next layer, passes each bend layer as a vertical run or, where it stays inside the
 *    bend's own column, as one point, and enters its head box the same way. Collinear runs along the
 *    flow are merged, so an edge is straight wherever its ports and bends line up.
 * 6. The internal drawing (u across, v along the flow) is turned into SVG coordinates for the flow.
 *    Bands, ports, merging of straight runs and this last step are shared with level-layout.ts
 *    (banded-drawing.ts).
 *
 * Why no crossings: inside a band each object keeps strictly to its own column (halfway to each
 * neighbour), and columns are disjoint; between two bands every segment crosses the upper line of
 * one band and the lower line of the next, each inside its object's column (ports of one box in port
 * order), so the crossing points on both lines are strictly increasing in the same (visibility)
 * order and two such segments cannot meet. Why upward: every segment strictly
 * increases v (bands have non-negative height, gaps positive).
 *
 * Time: O(n + m + B + F) for B bend objects and F faces of H (counting sorts, port sorts aside:
 * O(d log d) per vertex of degree d), plus the passes of layering.ts and coordinates.ts, each linear.
 * B is at most m times the number of layers, typically a small multiple of m.
 */
import type {Digraph} from '../graph/digraph.ts'
import {layerByWeightedSpan} from './layering.ts'
import {dualOrder} from './dual-order.ts'
import {pruneAugmentation} from './prune-augmentation.ts'
import {assignCoordinates} from './coordinates.ts'
import {bandCentres, boxHalves, dropStraightThrough, layeredGraph, orient, resolveSpacing, SEGMENT_WEIGHT, spreadPorts, typicalStep, type Point} from './banded-drawing.ts'
import type {Layout, LayoutInput} from './types.ts'

export function layoutUpward(input: LayoutInput): Layout {
  const {graph: g, boxes, flow} = input
  checkInput(g, input.st.graph, boxes.length)
  const st = pruneAugmentation(input.st, g.edgeCount)
  const h = st.graph
  const n = g.vertexCount
  const m = g.edgeCount
  const spacing = resolveSpacing(input.spacing)
  if (n === 0) return {flow, width: 0, height: 0, nodes: [], edges: []}

  // Box extents in internal coordinates: u across the flow, v along it.
  const {halfU, halfV} = boxHalves(boxes, n, flow)

  // 1. Layers of H, then keep only the layers G uses.
  const {rank} = layerByWeightedSpan(h, (e) => (e < m ? 1 : 0))
  let maxRank = 0
  for (let v = 0; v < h.vertexCount; v++) if (rank[v]! > maxRank) maxRank = rank[v]!
  const used = new Uint8Array(maxRank + 2)
  for (let v = 0; v < n; v++) used[rank[v]!] = 1
  for (let e = 0; e < m; e++) for (let r = rank[g.tail[e]!]! + 1; r < rank[g.head[e]!]!; r++) used[r] = 1
  const layerOfRank = new Int32Array(maxRank + 1)
  let layerCount = 0
  for (let r = 0; r <= maxRank; r++) layerOfRank[r] = used[r] ? layerCount++ : -1

  // 2. Objects: G's vertices 0..n-1, then each edge's bends bottom to top.
  const {edgeKey, vertexKey} = dualOrder(st.embedding, st.faces, st.outerFace)
  const bendStart = new Int32Array(m + 1)
  let objectCount = n
  for (let e = 0; e < m; e++) {
    bendStart[e] = objectCount
    objectCount += layerOfRank[rank[g.head[e]!]!]! - layerOfRank[rank[g.tail[e]!]!]! - 1
  }
  bendStart[m] = objectCount
  const layerOf = new Int32Array(objectCount)
  const key = new Int32Array(objectCount)
  const half = new Float64Array(objectCount)
  const isBox = new Uint8Array(objectCount)
  for (let v = 0; v < n; v++) {
    layerOf[v] = layerOfRank[rank[v]!]!
    key[v] = vertexKey[v]!
    half[v] = halfU[v]!
    isBox[v] = 1
  }
  for (let e = 0; e < m; e++) {
    const low = layerOf[g.tail[e]!]!
    for (let o = bendStart[e]!; o < bendStart[e + 1]!; o++) {
      layerOf[o] = low + 1 + (o - bendStart[e]!)
      key[o] = edgeKey[e]!
    }
  }

  // 3. Per-layer order by visibility abscissa (ties cannot occur between objects on one layer;
  //    the id order among equal keys only keeps the sort total).
  const sorted = sortByLayerThenKey(layerOf, key, layerCount)
  const layers: Int32Array[] = []
  for (let i = 0, l = 0; l < layerCount; l++) {
    const from = i
    while (i < objectCount && layerOf[sorted[i]!] === l) i++
    layers.push(sorted.subarray(from, i))
  }

  // Ports: out-edges along the flow-facing side, in-edges along the opposite side, both in embedding
  // (visibility) order, centred, at most `edge` apart and strictly inside the side.
  const tailPort = new Float64Array(m)
  const headPort = new Float64Array(m)
  const byKey = (e: number): number => edgeKey[e]!
  spreadPorts(g, halfU, spacing.edge, true, byKey, tailPort)
  spreadPorts(g, halfU, spacing.edge, false, byKey, headPort)

  // Segments along each edge's chain of objects.
  const segCount = objectCount - n + m
  const lg = layeredGraph(objectCount, layers, half, isBox, segCount)
  let s = 0
  for (let e = 0; e < m; e++) {
    let prev = g.tail[e]!
    let prevPort = tailPort[e]!
    for (let o = bendStart[e]!; o <= bendStart[e + 1]!; o++) {
      const next = o < bendStart[e + 1]! ? o : g.head[e]!
      const nextPort = o < bendStart[e + 1]! ? 0 : headPort[e]!
      lg.segLow[s] = prev
      lg.segHigh[s] = next
      lg.segLowPort[s] = prevPort
      lg.segHighPort[s] = nextPort
      lg.segWeight[s] = SEGMENT_WEIGHT[(isBox[prev] ? 0 : 1) + (isBox[next] ? 0 : 1)]!
      s++
      prev = next
      prevPort = nextPort
    }
  }

  // 4. Coordinates across the flow; start from the visibility abscissae scaled to a typical step.
  const unit = typicalStep(halfU, spacing.node)
  const initial = new Float64Array(objectCount)
  for (let o = 0; o < objectCount; o++) initial[o] = key[o]! * unit
  const x = assignCoordinates(lg, initial, spacing.node, spacing.edge)

  // 5. Bands along the flow.
  const bandHalf = new Float64Array(layerCount)
  for (let v = 0; v < n; v++) bandHalf[layerOf[v]!] = Math.max(bandHalf[layerOf[v]!]!, halfV[v]!)
  const centre = bandCentres(bandHalf, spacing.layer)
  // Each object's column: from halfway to its left neighbour to halfway to its right neighbour. In a
  // band, everything belonging to an object (its box and ports, or its bend) stays strictly inside.
  const colLeft = new Float64Array(objectCount).fill(-Infinity)
  const colRight = new Float64Array(objectCount).fill(Infinity)
  for (const layer of layers) {
    for (let i = 1; i < layer.length; i++) {
      const a = layer[i - 1]!
      const b = layer[i]!
      const mid = (x[a]! + half[a]! + x[b]! - half[b]!) / 2
      colRight[a] = mid
      colLeft[b] = mid
    }
  }
  const within = (o: number, u: number): boolean => colLeft[o]! < u && u < colRight[o]!
  const uAt = (p: Readonly<Point>, q: Readonly<Point>, v: number): number =>
    p[0] + ((q[0] - p[0]) * (v - p[1])) / (q[1] - p[1])

  const routes: Point[][] = []
  for (let e = 0; e < m; e++) {
    const t = g.tail[e]!
    const hd = g.head[e]!
    const lt = layerOf[t]!
    const lh = layerOf[hd]!
    const pts: Point[] = []
    const pu = x[t]! + tailPort[e]!
    pts.push([pu, centre[lt]! + halfV[t]!])
    if (halfV[t]! < bandHalf[lt]!) pts.push([pu, centre[lt]! + bandHalf[lt]!])
    const qu = x[hd]! + headPort[e]!
    // Where the edge enters band l from below (the bend's lower point, or the head's port or stub).
    const entry = (o: number): Point => {
      if (o < bendStart[e + 1]!) {
        const l = layerOf[o]!
        return [x[o]!, centre[l]! - bandHalf[l]!]
      }
      return [qu, centre[lh]! - bandHalf[lh]!]
    }
    // A bend crosses its band as one vertical run, or as a single point at the band's centre line
    // when both segments through that point stay inside the bend's column within the band (and,
    // if the previous bend was also reduced to a point, inside that one's column too).
    let prevPoint = -1
    for (let o = bendStart[e]!; o < bendStart[e + 1]!; o++) {
      const l = layerOf[o]!
      const hb = bandHalf[l]!
      if (hb === 0) {
        pts.push([x[o]!, centre[l]!])
        prevPoint = -1
        continue
      }
      const mid: Point = [x[o]!, centre[l]!]
      const before = pts[pts.length - 1]!
      const after = entry(o + 1)
      const single =
        within(o, uAt(before, mid, centre[l]! - hb)) &&
        within(o, uAt(mid, after, centre[l]! + hb)) &&
        (prevPoint < 0 || within(prevPoint, uAt(before, mid, centre[l - 1]! + bandHalf[l - 1]!)))
      if (single) {
        pts.push(mid)
        prevPoint = o
      } else {
        pts.push([x[o]!, centre[l]! - hb])
        pts.push([x[o]!, centre[l]! + hb])
        prevPoint = -1
      }
    }
    if (halfV[hd]! < bandHalf[lh]!) pts.push([qu, centre[lh]! - bandHalf[lh]!])
    pts.push([qu, centre[lh]! - halfV[hd]!])
    routes.push(dropStraightThrough(pts))
  }

  // 6. To SVG coordinates.
  return orient(flow, g, x, layerOf, centre, boxes, routes).layout
}

/** Object ids sorted by (layer, key, id): two stable counting sorts, O(objects + keys + layers). */
function sortByLayerThenKey(layerOf: Int32Array, key: Int32Array, layerCount: number): Int32Array {
  const count = layerOf.length
  let maxKey = 0
  for (let o = 0; o < count; o++) if (key[o]! > maxKey) maxKey = key[o]!
  const byKey = countingSort(Int32Array.from({length: count}, (_, i) => i), key, maxKey + 1)
  return countingSort(byKey, layerOf, layerCount)
}

function countingSort(items: Int32Array, by: Int32Array, range: number): Int32Array {
  const start = new Int32Array(range + 1)
  for (const o of items) start[by[o]! + 1]!++
  for (let r = 0; r < range; r++) start[r + 1]! += start[r]!
  const out = new Int32Array(items.length)
  for (const o of items) out[start[by[o]!]!++] = o
  return out
}

function checkInput(g: Digraph, h: Digraph, boxCount: number): void {
  if (h.vertexCount < g.vertexCount || h.edgeCount < g.edgeCount) {
    throw new Error('layout: the st-augmentation is smaller than the graph')
  }
  for (let e = 0; e < g.edgeCount; e++) {
    if (h.tail[e] !== g.tail[e] || h.head[e] !== g.head[e]) {
      throw new Error(`layout: edge ${e} of the st-augmentation differs from the graph's`)
    }
  }
  if (boxCount < g.vertexCount) throw new Error('layout: a box size is missing for some vertex')
}
