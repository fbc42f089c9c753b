/**
 * st-augmentation of an upward embedding by face saturation (Bertolazzi, Di Battista, Liotta &
 * Mannino, "Upward drawings of triconnected digraphs", Algorithmica 12, 1994: an upward embedding
 * with its large-angle assignment is completed into a planar st-digraph by saturating faces).
 *
 * Walk a face and list its switch angles, each marked L (the large angle of its source or sink) or
 * S. Whenever three consecutive switches read L, S, S, say x, y, z, the face can be split by an edge
 * between z and x: if x is a source switch (y is then a sink switch and z a source switch) the edge
 * is z -> x, otherwise x -> z. The piece x..y..z becomes a face with one source and one sink switch
 * (no large angle), x stops being a source or sink, and the rest of the face keeps z (still small)
 * and loses x and y, so its count n_f − 1 or n_f + 1 still holds. An inner face with 2·n_f switches
 * and n_f − 1 L's always has such a triple until n_f = 1, so it ends as an st-face.
 *
 * The outer face ends with no L, S, S left, so its S's stand alone between L's; as the switch types
 * alternate along the walk, its L's then form one run of source switches (the bottom of the drawing)
 * and one run of sink switches (the top). A new source s joined to every bottom L and a new sink t
 * joined from every top L finish the st-digraph, with s and t on the outer face; s (or t) is left
 * out when there is a single bottom (top) L, which is then the source (sink) itself. Components of a
 * disconnected graph, and isolated vertices, stand side by side between the same s and t.
 *
 * Each face's switch list is a doubly linked list. By default the saturations are chosen to keep H
 * shallow (saturateShallow: a heap per face, O((n + m) log(n + m)) in all); with an allowEdge hook
 * they are taken in walk order, stepping back two places after each (O(n + m)). The new edges may be
 * parallel to existing ones; the input is never mutated.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {dartHead, nextDarts, traceFaces, type Faces, type RotationSystem} from '../embedding/rotation-system.ts'
import type {UpwardEmbedding} from '../upward/upward-embedding.ts'

export interface StAugmentation {
  /** H ⊇ G: G's vertices keep ids 0..n-1 and G's edges ids 0..m-1; what was added comes after. */
  graph: Digraph
  /** A planar embedding of H in which every vertex is bimodal and s, t lie on the outer face. */
  embedding: RotationSystem
  /** traceFaces(embedding). */
  faces: Faces
  /** The outer face of H (index into faces.darts), holding s and t; -1 when H has no edges. */
  outerFace: number
  /** The single source and single sink of H (equal only when H is one vertex; -1 when H is empty). */
  source: number
  sink: number
  /** Ids (in H) of the edges and vertices added, ascending. */
  addedEdges: number[]
  addedVertices: number[]
}

/** Mutable rotations as circular lists of the darts leaving each vertex. */
class Rotations {
  tail: Int32Array
  head: Int32Array
  /** cw[d] = the dart after d, clockwise, around d's tail; -1 for an unused slot. */
  cw: Int32Array
  edgeCount: number
  /** A dart leaving each vertex, or -1. */
  anyDart: number[]
  /** For added vertices: the dart placed last (their edges are placed in clockwise order). */
  lastDart: number[]

  constructor(g: Digraph, emb: RotationSystem, capacity: number) {
    this.tail = new Int32Array(capacity)
    this.head = new Int32Array(capacity)
    this.cw = new Int32Array(2 * capacity).fill(-1)
    this.tail.set(g.tail)
    this.head.set(g.head)
    this.edgeCount = g.edgeCount
    this.anyDart = []
    this.lastDart = []
    for (let v = 0; v < g.vertexCount; v++) {
      const rot = emb.rotation[v]!
      const k = rot.length
      this.anyDart.push(k > 0 ? this.dartFrom(rot[0]!, v) : -1)
      this.lastDart.push(k > 0 ? this.dartFrom(rot[k - 1]!, v) : -1)
      for (let i = 0; i < k; i++) this.cw[this.dartFrom(rot[i]!, v)] = this.dartFrom(rot[(i + 1) % k]!, v)
    }
  }

  dartFrom(e: number, v: number): number {
    return this.tail[e] === v ? 2 * e : 2 * e + 1
  }

  addVertex(): number {
    this.anyDart.push(-1)
    this.lastDart.push(-1)
    return this.anyDart.length - 1
  }

  /** A new edge u -> v, not yet placed in any rotation. */
  addEdge(u: number, v: number): number {
    const e = this.edgeCount++
    this.tail[e] = u
    this.head[e] = v
    return e
  }

  /**
   * Places edge e at vertex v in the angle named by dart dIn (entering v): right after dIn's edge,
   * clockwise. dIn = -1 places it after the last edge placed this way at v (for isolated and added
   * vertices, whose rotation is built in clockwise order).
   */
  placeInAngle(e: number, v: number, dIn: number): void {
    const d = this.dartFrom(e, v)
    if (dIn === -1) {
      const first = this.anyDart[v]!
      if (first === -1) {
        this.cw[d] = d
        this.anyDart[v] = d
      } else {
        const last = this.lastDart[v]!
        this.cw[last] = d
        this.cw[d] = first
      }
      this.lastDart[v] = d
      return
    }
    const out = dIn ^ 1 // the dart leaving v along dIn's edge
    this.cw[d] = this.cw[out]!
    this.cw[out] = d
  }
}

interface SwitchList {
  dart: number[]
  vertex: number[]
  /** true for a source switch (both edges leave the vertex). */
  sourceSwitch: boolean[]
  large: boolean[]
  next: number[]
  prev: number[]
  removed: boolean[]
}

export interface StAugmentOptions {
  /**
   * Asked before each face-saturating edge tail -> head is added; false skips that saturation (and
   * true commits the edge, so a caller may record it). Lets a caller keep H acyclic together with
   * edges it will add later (the fallback drawing's feasible subgraph). With a hook the saturation
   * may get stuck; stAugment then returns undefined instead of throwing.
   */
  allowEdge?: (tail: number, head: number) => boolean
}

export function stAugment(up: UpwardEmbedding): StAugmentation
export function stAugment(up: UpwardEmbedding, options: Readonly<StAugmentOptions>): StAugmentation | undefined
export function stAugment(up: UpwardEmbedding, options: Readonly<StAugmentOptions> = {}): StAugmentation | undefined {
  const emb = up.embedding
  const g = emb.graph
  const n = g.vertexCount
  const m = g.edgeCount
  const next = nextDarts(emb)
  const faces = up.faces

  // Every face's switch angles, in walk order.
  let isolated = 0
  for (let v = 0; v < n; v++) if (emb.rotation[v]!.length === 0) isolated++
  const rot = new Rotations(g, emb, m + 2 * n + 2 * isolated + 4)
  const outerSet = new Set<number>(up.outerFaces)
  // Per component, in the order of up.outerFaces: its bottom and top L angles for s and t.
  const bottoms: Array<Array<[number, number]>> = []
  const tops: Array<Array<[number, number]>> = []
  const outerIndex = new Map<number, number>()
  up.outerFaces.forEach((f, i) => outerIndex.set(f, i))

  // Without a hook, saturations are chosen to keep H shallow (saturateShallow); with one, the plain
  // walk-order saturation the hook's caller was written against.
  const depth = options.allowEdge ? undefined : pathDepths(g)
  for (let f = 0; f < faces.darts.length; f++) {
    const list = switchList(g, faces.darts[f]!, next, up.largeAngle)
    if (depth) saturateShallow(rot, list, depth)
    else saturate(rot, list, options.allowEdge)
    const alive = aliveNodes(list)
    if (!outerSet.has(f)) {
      if (alive.length !== 2 || alive.some((i) => list.large[i])) {
        if (options.allowEdge) return undefined
        throw new Error(`stAugment: inner face ${f} did not saturate; the upward embedding is inconsistent`)
      }
      continue
    }
    const chains = outerChains(list, alive, f, options.allowEdge !== undefined)
    if (!chains) return undefined
    const [bottom, top] = chains
    bottoms[outerIndex.get(f)!] = bottom
    tops[outerIndex.get(f)!] = top
  }

  // Parts side by side in order of lowest vertex id: components, and isolated vertices.
  const parts: Array<{bottom: Array<[number, number]>; top: Array<[number, number]>}> = []
  const component = componentOfVertex(g, up)
  const placed = new Uint8Array(up.outerFaces.length)
  for (let v = 0; v < n; v++) {
    if (emb.rotation[v]!.length === 0) {
      parts.push({bottom: [[v, -1]], top: [[v, -1]]})
      continue
    }
    const c = component[v]!
    if (placed[c]) continue
    placed[c] = 1
    parts.push({bottom: bottoms[c]!, top: tops[c]!})
  }

  const bottomCount = parts.reduce((k, p) => k + p.bottom.length, 0)
  const topCount = parts.reduce((k, p) => k + p.top.length, 0)
  const addedVertices: number[] = []
  let source = -1
  let sink = -1
  let outerDart = -1
  if (bottomCount === 1) {
    const [v, dIn] = parts[0]!.bottom[0]!
    source = v
    outerDart = dIn
  } else if (bottomCount > 1) {
    source = rot.addVertex()
    addedVertices.push(source)
    let lastEdge = -1
    // Around s, clockwise: each part's bottom run in reverse walk order, parts in order; the
    // angle after the last edge (the first part's last bottom L comes next) faces outward.
    for (const p of parts) {
      for (let i = p.bottom.length - 1; i >= 0; i--) {
        const [v, dIn] = p.bottom[i]!
        const e = rot.addEdge(source, v)
        rot.placeInAngle(e, v, dIn)
        rot.placeInAngle(e, source, -1)
        lastEdge = e
      }
    }
    outerDart = 2 * lastEdge + 1 // enters s along its last edge: the angle facing outward
  }
  if (topCount === 1) {
    sink = parts[0]!.top[0]![0]
  } else if (topCount > 1) {
    sink = rot.addVertex()
    addedVertices.push(sink)
    // Around t, clockwise: the parts in reverse order, each top run in reverse walk order.
    for (let j = parts.length - 1; j >= 0; j--) {
      const p = parts[j]!
      for (let i = p.top.length - 1; i >= 0; i--) {
        const [v, dIn] = p.top[i]!
        const e = rot.addEdge(v, sink)
        rot.placeInAngle(e, v, dIn)
        rot.placeInAngle(e, sink, -1)
      }
    }
  }

  const nH = rot.anyDart.length
  const edges: Array<[number, number]> = []
  for (let e = 0; e < rot.edgeCount; e++) edges.push([rot.tail[e]!, rot.head[e]!])
  const graph = createDigraph(nH, edges)
  const rotation: Int32Array[] = []
  for (let v = 0; v < nH; v++) {
    const first = rot.anyDart[v]!
    const list: number[] = []
    if (first !== -1) {
      let d = first
      do {
        list.push(d >> 1)
        d = rot.cw[d]!
      } while (d !== first)
    }
    rotation.push(Int32Array.from(list))
  }
  const embedding: RotationSystem = {graph, rotation}
  const hFaces = traceFaces(embedding)
  const outerFace = outerDart === -1 ? -1 : hFaces.faceOfDart[outerDart]!
  const addedEdges: number[] = []
  for (let e = m; e < rot.edgeCount; e++) addedEdges.push(e)
  return {graph, embedding, faces: hFaces, outerFace, source, sink, addedEdges, addedVertices}
}

/** Component index (the position of its outer face in up.outerFaces) per vertex; -1 if isolated. */
function componentOfVertex(g: Digraph, up: UpwardEmbedding): Int32Array {
  const n = g.vertexCount
  const comp = new Int32Array(n).fill(-1)
  up.outerFaces.forEach((f, c) => {
    const start = dartHead(g, up.faces.darts[f]![0]!)
    const stack = [start]
    comp[start] = c
    while (stack.length > 0) {
      const v = stack.pop()!
      for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
        const w = g.head[g.outEdges[i]!]!
        if (comp[w] === -1) {
          comp[w] = c
          stack.push(w)
        }
      }
      for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) {
        const w = g.tail[g.inEdges[i]!]!
        if (comp[w] === -1) {
          comp[w] = c
          stack.push(w)
        }
      }
    }
  })
  return comp
}

function switchList(g: Digraph, walk: Int32Array, next: Int32Array, largeAngle: Int32Array): SwitchList {
  const list: SwitchList = {dart: [], vertex: [], sourceSwitch: [], large: [], next: [], prev: [], removed: []}
  for (const d of walk) {
    if ((d & 1) === (next[d]! & 1)) continue
    const v = dartHead(g, d)
    list.dart.push(d)
    list.vertex.push(v)
    // Arriving along a backward dart means that edge leaves v: a source switch.
    list.sourceSwitch.push((d & 1) === 1)
    list.large.push(largeAngle[v] === d)
    list.removed.push(false)
  }
  const k = list.dart.length
  for (let i = 0; i < k; i++) {
    list.next.push((i + 1) % k)
    list.prev.push((i + k - 1) % k)
  }
  return list
}

/** Saturates every L, S, S triple of the list (in walk order), adding edges to rot. */
function saturate(rot: Rotations, list: SwitchList, allowEdge?: (tail: number, head: number) => boolean): void {
  let size = list.dart.length
  if (size < 3) return
  let x = 0
  let quiet = 0 // steps since the last saturation
  while (quiet < size && size >= 3) {
    const y = list.next[x]!
    const z = list.next[y]!
    const vx = list.vertex[x]!
    const vz = list.vertex[z]!
    if (list.large[x] && !list.large[y] && !list.large[z] && (!allowEdge || (list.sourceSwitch[x] ? allowEdge(vz, vx) : allowEdge(vx, vz)))) {
      if (vx === vz) throw new Error(`stAugment: saturating edge would be a loop at ${vx}`)
      const e = list.sourceSwitch[x] ? rot.addEdge(vz, vx) : rot.addEdge(vx, vz)
      rot.placeInAngle(e, vz, list.dart[z]!)
      rot.placeInAngle(e, vx, list.dart[x]!)
      // z stays, small, its angle in the remaining face now after the new edge.
      list.dart[z] = rot.dartFrom(e, vz) ^ 1
      const p = list.prev[x]!
      list.removed[x] = true
      list.removed[y] = true
      list.next[p] = z
      list.prev[z] = p
      size -= 2
      quiet = 0
      x = list.prev[p]!
      continue
    }
    x = list.next[x]!
    quiet++
  }
}

/** Longest path (in edges) in G ending at each vertex (`up`) and starting at it (`down`); O(n + m). */
function pathDepths(g: Digraph): {up: Int32Array; down: Int32Array} {
  const n = g.vertexCount
  const indeg = new Int32Array(n)
  for (let e = 0; e < g.edgeCount; e++) indeg[g.head[e]!]!++
  const order = new Int32Array(n)
  let qt = 0
  for (let v = 0; v < n; v++) if (indeg[v] === 0) order[qt++] = v
  for (let qh = 0; qh < qt; qh++) {
    const v = order[qh]!
    for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
      const w = g.head[g.outEdges[i]!]!
      if (--indeg[w] === 0) order[qt++] = w
    }
  }
  if (qt !== n) throw new Error('stAugment: the graph has a directed cycle')
  const up = new Int32Array(n)
  const down = new Int32Array(n)
  for (let k = 0; k < n; k++) {
    const v = order[k]!
    for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
      const w = g.head[g.outEdges[i]!]!
      if (up[v]! + 1 > up[w]!) up[w] = up[v]! + 1
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const v = order[k]!
    for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
      const w = g.head[g.outEdges[i]!]!
      if (down[w]! + 1 > down[v]!) down[v] = down[w]! + 1
    }
  }
  return {up, down}
}

/**
 * Saturates a face like `saturate`, choosing among the possible saturations the ones that lengthen
 * paths least. Besides L, S, S (x, y, z in walk order) the mirror S, S, L (z, y, x) is equally valid:
 * reading the walk backwards turns one into the other, and the same edge between x and z, placed in
 * the same two angles, cuts off the piece z..y..x as an st-face; the rest keeps z (small, its angle
 * unchanged) and loses y and x. Either way the count argument of the file comment holds, and a face
 * is finished exactly when no two S's are adjacent, so the end state is the same as saturate's.
 *
 * Which saturations come first decides the edges (an L's partner two steps on depends on what was
 * cut off before). Each candidate edge a -> b is scored by the longest path of G it would close,
 * up(a) + 1 + down(b) (longest G paths into a and out of b), and the lowest score goes first: an
 * edge joining a low vertex to a high one costs no height, one from high up to low down stacks two
 * parts of G on top of each other. Greedy, with G's depths fixed at the start (edges added in other
 * faces are not counted), so a heuristic; a binary heap with lazy deletion keeps it O(k log k) for a
 * face of k switches, so O((n + m) log(n + m)) in all.
 */
function saturateShallow(rot: Rotations, list: SwitchList, depth: {up: Int32Array; down: Int32Array}): void {
  const k = list.dart.length
  if (k < 3) return
  // Heap of candidates keyed score * 4k + 2x + dir (dir 0: L, S, S forward from x; 1: S, S, L back).
  const heap: number[] = []
  const partner = new Int32Array(2 * k).fill(-1)
  const push = (key: number): void => {
    let i = heap.length
    heap.push(key)
    while (i > 0) {
      const p = (i - 1) >> 1
      if (heap[p]! <= key) break
      heap[i] = heap[p]!
      i = p
    }
    heap[i] = key
  }
  const pop = (): number => {
    const top = heap[0]!
    const last = heap.pop()!
    if (heap.length > 0) {
      let i = 0
      for (;;) {
        let c = 2 * i + 1
        if (c >= heap.length) break
        if (c + 1 < heap.length && heap[c + 1]! < heap[c]!) c++
        if (heap[c]! >= last) break
        heap[i] = heap[c]!
        i = c
      }
      heap[i] = last
    }
    return top
  }
  // The partner z of x in direction dir, or -1 when that pattern does not hold now.
  const partnerOf = (x: number, dir: number): number => {
    if (list.removed[x] || !list.large[x]) return -1
    const step = dir === 0 ? list.next : list.prev
    const y = step[x]!
    const z = step[y]!
    return z !== x && !list.large[y] && !list.large[z] ? z : -1
  }
  const offer = (x: number): void => {
    for (let dir = 0; dir < 2; dir++) {
      const z = partnerOf(x, dir)
      if (z < 0 || partner[2 * x + dir] === z) continue
      partner[2 * x + dir] = z
      const vx = list.vertex[x]!
      const vz = list.vertex[z]!
      const score = list.sourceSwitch[x] ? depth.up[vz]! + depth.down[vx]! : depth.up[vx]! + depth.down[vz]!
      push(score * 4 * k + 2 * x + dir)
    }
  }
  for (let x = 0; x < k; x++) offer(x)
  while (heap.length > 0) {
    const key = pop()
    const x = (key % (4 * k)) >> 1
    const dir = key & 1
    const z = partnerOf(x, dir)
    if (z < 0 || z !== partner[2 * x + dir]) continue
    const y = (dir === 0 ? list.next : list.prev)[x]!
    const vx = list.vertex[x]!
    const vz = list.vertex[z]!
    if (vx === vz) throw new Error(`stAugment: saturating edge would be a loop at ${vx}`)
    const e = list.sourceSwitch[x] ? rot.addEdge(vz, vx) : rot.addEdge(vx, vz)
    rot.placeInAngle(e, vz, list.dart[z]!)
    rot.placeInAngle(e, vx, list.dart[x]!)
    list.removed[x] = true
    list.removed[y] = true
    let a: number
    let b: number
    if (dir === 0) {
      // z stays, small, its angle in the remaining face now after the new edge.
      list.dart[z] = rot.dartFrom(e, vz) ^ 1
      a = list.prev[x]!
      b = z
    } else {
      a = z
      b = list.next[x]!
    }
    list.next[a] = b
    list.prev[b] = a
    // Only patterns within two steps of the new junction a, b changed.
    let w = list.prev[list.prev[a]!]!
    for (let i = 0; i < 6; i++, w = list.next[w]!) offer(w)
  }
}

function aliveNodes(list: SwitchList): number[] {
  const start = list.removed.indexOf(false)
  if (start === -1) return []
  const out: number[] = []
  let i = start
  do {
    out.push(i)
    i = list.next[i]!
  } while (i !== start)
  return out
}

/**
 * The bottom run (source-switch L's) and top run (sink-switch L's) of a saturated outer face, each
 * in walk order starting after the other run, as [vertex, angle dart] pairs.
 */
function outerChains(list: SwitchList, alive: number[], f: number, quiet: boolean): [Array<[number, number]>, Array<[number, number]>] | undefined {
  const k = alive.length
  const bad = () => new Error(`stAugment: outer face ${f} does not split into a bottom and a top run`)
  // A hook may have left an L, S, S triple unsaturated: two S's in a row would leave a face with two
  // source (or sink) switches once s and t are joined.
  if (quiet && alive.some((a, i) => !list.large[a] && !list.large[alive[(i + 1) % k]!])) return undefined
  // The first bottom L: a source-switch L right after a sink-switch L.
  let startPos = -1
  for (let i = 0; i < k; i++) {
    const a = alive[i]!
    const p = alive[(i + k - 1) % k]!
    if (list.large[a] && list.sourceSwitch[a] && list.large[p] && !list.sourceSwitch[p]) {
      startPos = i
      break
    }
  }
  if (startPos === -1) {
    if (quiet) return undefined
    throw bad()
  }
  const bottom: Array<[number, number]> = []
  const top: Array<[number, number]> = []
  let inTop = false
  for (let j = 0; j < k; j++) {
    const a = alive[(startPos + j) % k]!
    if (!list.large[a]) continue
    if (list.sourceSwitch[a]) {
      if (inTop) {
        if (quiet) return undefined
        throw bad()
      }
      bottom.push([list.vertex[a]!, list.dart[a]!])
    } else {
      inTop = true
      top.push([list.vertex[a]!, list.dart[a]!])
    }
  }
  return [bottom, top]
}
