/**
 * Upward edge insertion into a planar st-digraph (the edge-insertion step of upward planarization:
 * Chimani, Gutwenger, Mutzel & Wong, "Layer-free upward crossing minimization", ACM J. Exp.
 * Algorithmics 15, 2010, and "Upward planarization layout", JGAA 15(1), 2011). Each dropped edge (u, v)
 * is routed through the faces of the embedded st-digraph H, crossing as few drawn edges as possible;
 * every crossing becomes a dummy vertex, so H stays an embedded planar st-digraph and the usual layout
 * draws the result with the crossings at the dummies.
 *
 * Keeping H acyclic. Fix a topological numbering tau of H together with the edges to insert. A route
 * is accepted only if its crossings can be given heights h_1 < h_2 < … with tau(u) < h_i, each h_i
 * strictly between the numbers of the crossed edge's ends, and h_k < tau(v): then ordering every
 * vertex by tau and every dummy by its h is a topological order of the new graph, so it is acyclic.
 * Greedily h_i sits just above max(tau(u), tau(a_1), …, tau(a_i)) (a_j the tails crossed), so the search
 * state is (face, that maximum L); crossing edge (a, b) needs L < tau(b) and sets L to max(L, tau(a)).
 * This is the monotone-curve picture of a visibility drawing with tau as the heights (Tamassia &
 * Tollis 1986), where such a curve always exists when tau(u) < tau(v).
 *
 * Bimodality: the route leaves u in a corner next to one of u's outgoing edges and enters v next to one
 * of v's incoming edges; a dummy on (a, b) has rotation b, right face, a, left face, so its two
 * outgoing edges (to b and onwards) are neighbours whichever side the route comes from.
 *
 * Search: Dijkstra over (face, L) (crossing a drawn edge costs `drawnCost`, an augmentation edge 1,
 * so the fewest crossings come first and needless bends second); a state is skipped when the same face
 * was reached with a lower or equal L at no greater cost. O(F · n · log) states per edge for F faces.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {traceFaces, type Faces, type RotationSystem} from '../embedding/rotation-system.ts'

const drawnCost = 1 << 16

/** A mutable embedded digraph: per edge its ends and owner, per vertex its rotation (edge ids, clockwise). */
export interface EditableEmbedding {
  tail: number[]
  head: number[]
  /** Which edge of the drawing an edge belongs to (pieces of a split edge share it); -1: augmentation. */
  owner: number[]
  rotation: number[][]
  /** Dummy kind per vertex: 0 none, 1 a crossing of two drawn edges, 2 a bend on a drawn edge. */
  dummy: number[]
}

export interface InsertionResult {
  ok: boolean
  /** Drawn edges crossed. */
  crossings: number
}

function view(h: EditableEmbedding): {graph: Digraph; embedding: RotationSystem; faces: Faces} {
  const graph = createDigraph(h.rotation.length, h.tail.map((t, e) => [t, h.head[e]!] as const))
  const embedding: RotationSystem = {graph, rotation: h.rotation.map((r) => Int32Array.from(r))}
  return {graph, embedding, faces: traceFaces(embedding)}
}

/**
 * Insert edge (u, v) with owner `owner`. `tau` numbers the vertices (dummies get none; the search
 * only needs the ends of crossed edges, and a crossed dummy end uses `height`, kept per vertex).
 * `outerDart` enters the new bottom vertex (its face is the outer face), `topDart` leaves the top
 * vertex's only neighbour for it.
 */
export function insertEdge(h: EditableEmbedding, height: number[], u: number, v: number, owner: number, outerDart: number, topDart: number): InsertionResult {
  const {faces} = view(h)
  const outer = faces.faceOfDart[outerDart]!
  // The outer face's walk runs from the new bottom up one side to the new top and down the other. A
  // route through the outer face must enter and leave it on the same side, or it would shut the top
  // or the bottom inside a face; side[d] is 0 or 1 for the outer face's darts.
  const side = new Map<number, number>()
  {
    const walk = faces.darts[outer]!
    const start = walk.indexOf(outerDart ^ 1)
    let current = 0
    for (let i = 0; i < walk.length; i++) {
      const d = walk[(start + i) % walk.length]!
      if (d === topDart) current = 1
      side.set(d, current)
    }
  }
  const sideOf = (d: number): number => (faces.faceOfDart[d] === outer ? side.get(d)! : -1)
  const dartHeadOf = (d: number): number => ((d & 1) === 0 ? h.head[d >> 1]! : h.tail[d >> 1]!)
  const position = (w: number, e: number): number => h.rotation[w]!.indexOf(e)
  // Corners: a dart d entering w names the corner after d's edge (clockwise) in face faceOfDart[d].
  const cornerOk = (d: number, w: number, wantOut: boolean): boolean => {
    const rot = h.rotation[w]!
    const i = position(w, d >> 1)
    const a = rot[i]!
    const b = rot[(i + 1) % rot.length]!
    const isOut = (e: number): boolean => h.tail[e] === w
    return wantOut ? isOut(a) || isOut(b) : !isOut(a) || !isOut(b)
  }
  const hu = height[u]!
  const hv = height[v]!
  if (!(hu < hv)) return {ok: false, crossings: 0}
  // End corners per face key (face, or outer face and side).
  const key = (face: number, sd: number): number => (face === outer ? -1 - sd : face)
  const endCorner = new Map<number, number>()
  for (let d = 0; d < h.tail.length * 2; d++) {
    const k = key(faces.faceOfDart[d]!, sideOf(d))
    if (dartHeadOf(d) === v && cornerOk(d, v, false) && !endCorner.has(k)) endCorner.set(k, d)
  }
  // Dijkstra over (face, L); L is a height value.
  interface State {cost: number; face: number; side: number; level: number; prev: State | null; via: number}
  const heap: State[] = []
  const push = (s: State): void => {
    heap.push(s)
    let i = heap.length - 1
    while (i > 0) {
      const p = (i - 1) >> 1
      if (less(heap[p]!, heap[i]!)) break
      ;[heap[p], heap[i]] = [heap[i]!, heap[p]!]
      i = p
    }
  }
  const less = (a: State, b: State): boolean => a.cost < b.cost || (a.cost === b.cost && a.level <= b.level)
  const pop = (): State => {
    const top = heap[0]!
    const last = heap.pop()!
    if (heap.length > 0) {
      heap[0] = last
      let i = 0
      for (;;) {
        const l = 2 * i + 1
        const r = l + 1
        let m = i
        if (l < heap.length && !less(heap[m]!, heap[l]!)) m = l
        if (r < heap.length && !less(heap[m]!, heap[r]!)) m = r
        if (m === i) break
        ;[heap[m], heap[i]] = [heap[i]!, heap[m]!]
        i = m
      }
    }
    return top
  }
  for (let d = 0; d < h.tail.length * 2; d++) {
    if (dartHeadOf(d) === u && cornerOk(d, u, true)) push({cost: 0, face: faces.faceOfDart[d]!, side: sideOf(d), level: hu, prev: null, via: d})
  }
  const settled = new Map<number, number[]>()
  let found: State | null = null
  while (heap.length > 0) {
    const s = pop()
    const k = key(s.face, s.side)
    const seen = settled.get(k)
    if (seen?.some((level) => level <= s.level)) continue
    if (seen) seen.push(s.level)
    else settled.set(k, [s.level])
    if (endCorner.has(k) && s.level < hv) {
      found = s
      break
    }
    for (const d of faces.darts[s.face]!) {
      if (s.face === outer && side.get(d) !== s.side) continue
      const e = d >> 1
      const a = h.tail[e]!
      const b = h.head[e]!
      if (!(s.level < height[b]!)) continue
      const next = faces.faceOfDart[d ^ 1]!
      if (next === s.face) continue
      push({cost: s.cost + (h.owner[e]! >= 0 ? drawnCost : 1), face: next, side: sideOf(d ^ 1), level: Math.max(s.level, height[a]!), prev: s, via: d})
    }
  }
  if (!found) return {ok: false, crossings: 0}
  // Unwind: the start corner dart, then crossed darts in order.
  const crossed: number[] = []
  let s: State = found
  while (s.prev) {
    crossed.push(s.via)
    s = s.prev
  }
  crossed.reverse()
  const startDart = s.via
  const endDart = endCorner.get(key(found.face, found.side))!
  // Heights for the dummies, strictly increasing and inside each crossed edge's span.
  let level = hu
  const dummyHeights: number[] = []
  for (let i = 0; i < crossed.length; i++) {
    const e = crossed[i]! >> 1
    const lo = Math.max(level, height[h.tail[e]!]!)
    // Leave room for the later crossings and v: halfway towards the smallest later upper bound.
    let hi = Math.min(height[h.head[e]!]!, hv)
    for (let j = i + 1; j < crossed.length; j++) hi = Math.min(hi, height[h.head[crossed[j]! >> 1]!]!)
    const x = lo + (hi - lo) / (crossed.length - i + 1)
    dummyHeights.push(x)
    level = x
  }
  // Apply: new edge ids for the route, split each crossed edge at a dummy.
  const newEdge = (t: number, hd: number, own: number): number => {
    h.tail.push(t)
    h.head.push(hd)
    h.owner.push(own)
    return h.tail.length - 1
  }
  // Corner positions are found by edge id at use, since rotations change as we go.
  const startEdgeBefore = startDart >> 1
  const endEdgeBefore = endDart >> 1
  let current = u
  let drawnCrossed = 0
  const routeEdges: number[] = []
  const dummies: number[] = []
  /** Split edges: old id -> [old head, the new upper piece]. */
  const split = new Map<number, [number, number]>()
  for (let i = 0; i < crossed.length; i++) {
    const d = crossed[i]!
    const e = d >> 1
    const a = h.tail[e]!
    const b = h.head[e]!
    const x = h.rotation.length
    const crossingDrawn = h.owner[e]! >= 0
    if (crossingDrawn) drawnCrossed++
    h.rotation.push([])
    h.dummy.push(crossingDrawn ? 1 : 2)
    height.push(dummyHeights[i]!)
    const upper = newEdge(x, b, h.owner[e]!)
    split.set(e, [b, upper])
    h.head[e] = x
    const rb = h.rotation[b]!
    rb[rb.indexOf(e)] = upper
    const into = newEdge(current, x, owner)
    routeEdges.push(into)
    dummies.push(x)
    // Left to right (dart 2e is a -> b, its left face is the one we came from) or right to left.
    const fromLeft = (d & 1) === 0
    // Clockwise with y up: towards b, right side, towards a, left side. The route's outgoing edge is
    // added once known (below); keep a placeholder -1.
    h.rotation[x] = fromLeft ? [upper, -1, e, into] : [upper, into, e, -1]
    current = x
  }
  const last = newEdge(current, v, owner)
  routeEdges.push(last)
  // Fill the placeholders: the route edge leaving each dummy is the next route edge.
  dummies.forEach((x, i) => {
    const r = h.rotation[x]!
    r[r.indexOf(-1)] = routeEdges[i + 1]!
  })
  // At u: after the corner's first edge (clockwise); at v likewise. That edge may have been split by
  // this very route, and then the piece at the vertex is the upper one when the vertex was its head.
  const atVertex = (e: number, w: number): number => {
    const cut = split.get(e)
    return cut && cut[0] === w ? cut[1] : e
  }
  const ru = h.rotation[u]!
  ru.splice(ru.indexOf(atVertex(startEdgeBefore, u)) + 1, 0, routeEdges[0]!)
  const rv = h.rotation[v]!
  rv.splice(rv.indexOf(atVertex(endEdgeBefore, v)) + 1, 0, last)
  return {ok: true, crossings: drawnCrossed}
}


/**
 * Take an inserted edge out again (for re-insertion): its pieces and the dummies on its route go,
 * and each edge it crossed is joined back into one piece. Ids are compacted in order; the ids of H
 * before any insertion are smaller than every piece and dummy, so they stay as they were. `height`
 * is compacted with the vertices (the rest keep their heights, still a topological numbering).
 * Returns the number of drawn edges the route crossed. O(size of H).
 */
export function removeEdge(h: EditableEmbedding, height: number[], owner: number): number {
  const edgeCount = h.tail.length
  const vertexCount = h.rotation.length
  const goneEdge = new Uint8Array(edgeCount)
  const goneVertex = new Uint8Array(vertexCount)
  let crossed = 0
  for (let e = 0; e < edgeCount; e++) if (h.owner[e] === owner) goneEdge[e] = 1
  for (let e = 0; e < edgeCount; e++) {
    if (h.owner[e] !== owner) continue
    const x = h.head[e]!
    if (h.dummy[x] === 0) continue // the route's end
    // x is a dummy of the route: two of its edges are pieces of this edge, the other two of the edge
    // it crossed, lower piece into x and upper piece out of x; the lower piece takes the upper's place.
    goneVertex[x] = 1
    if (h.dummy[x] === 1) crossed++
    const others = h.rotation[x]!.filter((f) => !goneEdge[f])
    const lower = others.find((f) => h.head[f] === x)!
    const upper = others.find((f) => h.tail[f] === x)!
    const b = h.head[upper]!
    h.head[lower] = b
    const rb = h.rotation[b]!
    rb[rb.indexOf(upper)] = lower
    goneEdge[upper] = 1
  }
  const edgeId = new Int32Array(edgeCount)
  let nextEdge = 0
  for (let e = 0; e < edgeCount; e++) edgeId[e] = goneEdge[e] ? -1 : nextEdge++
  const vertexId = new Int32Array(vertexCount)
  let nextVertex = 0
  for (let v = 0; v < vertexCount; v++) vertexId[v] = goneVertex[v] ? -1 : nextVertex++
  const keepEdge = (_: unknown, e: number): boolean => !goneEdge[e]
  const keepVertex = (_: unknown, v: number): boolean => !goneVertex[v]
  h.tail = h.tail.filter(keepEdge).map((v) => vertexId[v]!)
  h.head = h.head.filter(keepEdge).map((v) => vertexId[v]!)
  h.owner = h.owner.filter(keepEdge)
  h.rotation = h.rotation.filter(keepVertex).map((rot) => rot.filter((e) => !goneEdge[e]).map((e) => edgeId[e]!))
  h.dummy = h.dummy.filter(keepVertex)
  const heights = height.filter(keepVertex)
  height.length = 0
  height.push(...heights)
  return crossed
}
