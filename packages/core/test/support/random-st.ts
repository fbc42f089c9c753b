/**
 * Seeded random planar st-graphs with an upward embedding, and random spanning subgraphs of them.
 *
 * Construction (tests only): start from the triangle s -> a -> t, s -> t, whose face left of the
 * dart s -> t is the outer face; then repeatedly (a) subdivide an edge, or (b) put a new vertex w
 * inside an inner face and join it to some boundary vertices, every edge pointing from the lower
 * to the higher vertex of a height y kept for each vertex; finally (c) add chords inside inner faces,
 * again from lower to higher. Each step keeps the graph a planar st-graph with s and t on the outer
 * face: edges go up in y (acyclic), every new vertex gets one edge from below and one from above (no
 * new source or sink), and everything is drawn inside a face. A planar st-graph embedded with s and
 * t on the outer face is upward (Di Battista & Tamassia, Theor. Comput. Sci. 61, 1988; Kelly 1987),
 * and so is every subgraph, with the restricted embedding. The inner faces stay st-faces (two
 * y-monotone chains), so the vertices below w on a face are contiguous and w is bimodal.
 */
import {createDigraph} from '../../src/graph/digraph.ts'
import type {RotationSystem} from '../../src/embedding/rotation-system.ts'
import {mulberry32} from '../../../../test/support/random.ts'

export {mulberry32} from '../../../../test/support/random.ts'

export interface EmbeddedGraphData {
  vertexCount: number
  edges: Array<[number, number]>
  /** Incident edge ids per vertex, clockwise (y up), as in RotationSystem. */
  rotation: number[][]
}

export interface RandomStGraph extends EmbeddedGraphData {
  source: number
  sink: number
  /** A dart (2e tail->head, 2e+1 head->tail) whose left face is the outer face. */
  outerDart: number
}

export interface RandomUpwardPlanar extends EmbeddedGraphData {
  /** The planar st-graph this graph spans (same vertex ids). */
  st: RandomStGraph
  /** Edge i of this graph is edge stEdge[i] of st, same direction. */
  stEdge: number[]
  /** A dart of this graph on its outer face (the face holding st's outer face), or -1 if none survives. */
  outerDart: number
}

export interface RandomStOptions {
  /** Chord attempts after the vertices are placed. Default: a random count up to n. */
  chords?: number
  /** Probability of keeping each edge in the spanning subgraph. Default: random in [0.3, 1]. */
  keep?: number
}

export function toRotationSystem(data: EmbeddedGraphData): RotationSystem {
  return {graph: createDigraph(data.vertexCount, data.edges), rotation: data.rotation.map((r) => Int32Array.from(r))}
}

/** Left faces of every dart, traced directly on the mutable arrays (independent of core). */
function faceWalks(edges: Array<[number, number]>, rot: number[][]): number[][] {
  const head = (d: number) => (d & 1 ? edges[d >> 1]![0] : edges[d >> 1]![1])
  const seen = new Uint8Array(2 * edges.length)
  const walks: number[][] = []
  for (let d0 = 0; d0 < 2 * edges.length; d0++) {
    if (seen[d0]) continue
    const walk: number[] = []
    let d = d0
    do {
      seen[d] = 1
      walk.push(d)
      const v = head(d)
      const r = rot[v]!
      const e2 = r[(r.indexOf(d >> 1) + 1) % r.length]!
      d = edges[e2]![0] === v ? 2 * e2 : 2 * e2 + 1
    } while (d !== d0)
    walks.push(walk)
  }
  return walks
}

export function randomPlanarStGraph(seed: number, n: number, options?: RandomStOptions): RandomStGraph {
  if (n < 2) throw new RangeError('an st-graph here has at least 2 vertices')
  const rnd = mulberry32(seed)
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!
  const y: number[] = [0, 1]
  const edges: Array<[number, number]> = [[0, 1]]
  const rot: number[][] = [[0], [0]]
  const headOf = (d: number) => (d & 1 ? edges[d >> 1]![0] : edges[d >> 1]![1])
  const insertAfter = (v: number, after: number, e: number) => {
    const r = rot[v]!
    r.splice(r.indexOf(after) + 1, 0, e)
  }
  const addVertex = (h: number) => {
    y.push(h)
    rot.push([])
    return y.length - 1
  }
  const subdivide = (e: number) => {
    const [u, v] = edges[e]!
    const w = addVertex((y[u]! + y[v]!) / 2)
    const e2 = edges.length
    edges[e] = [u, w]
    edges.push([w, v])
    const r = rot[v]!
    r[r.indexOf(e)] = e2
    rot[w] = [e, e2]
  }
  if (n >= 3) subdivide(0) // now s -> a -> t
  if (n >= 3) {
    // The edge s -> t beside the path; dart 2e of it (s -> t) has the outer face on its left.
    const e = edges.length
    edges.push([0, 1])
    rot[0]!.push(e)
    rot[1]!.push(e)
  }
  // Keep dart 2·(last s->t edge) as the outer marker: edge 0 is now s -> a.
  const outerEdge = n >= 3 ? edges.length - 1 : 0
  const isOuter = (w: number[]) => w.includes(2 * outerEdge)
  while (y.length < n) {
    const faces = faceWalks(edges, rot).filter((w) => !isOuter(w))
    if (faces.length === 0 || rnd() < 0.35) {
      subdivide(Math.floor(rnd() * edges.length))
      continue
    }
    const walk = pick(faces)
    const heights = walk.map((d) => y[headOf(d)]!)
    const lo = Math.min(...heights)
    const hi = Math.max(...heights)
    const h = lo + (hi - lo) * (0.05 + 0.9 * rnd())
    const chosen = walk.filter((_, i) => heights[i] === lo || heights[i] === hi || rnd() < 0.5)
    const w = addVertex(h)
    const wRot: number[] = []
    for (const d of chosen) {
      const v = headOf(d)
      const e = edges.length
      edges.push(y[v]! < h ? [v, w] : [w, v])
      insertAfter(v, d >> 1, e)
      wRot.push(e)
    }
    rot[w] = wRot.reverse()
  }
  const chordTries = options?.chords ?? Math.floor(rnd() * (n + 1))
  for (let i = 0; i < chordTries; i++) {
    const faces = faceWalks(edges, rot).filter((w) => !isOuter(w))
    if (faces.length === 0) break
    const walk = pick(faces)
    if (walk.length < 4) continue
    const a = Math.floor(rnd() * walk.length)
    const b = Math.floor(rnd() * walk.length)
    const gap = Math.abs(a - b)
    if (gap <= 1 || gap === walk.length - 1) continue
    const u = headOf(walk[a]!)
    const v = headOf(walk[b]!)
    if (edges.some(([p, q]) => (p === u && q === v) || (p === v && q === u))) continue
    const e = edges.length
    edges.push(y[u]! < y[v]! ? [u, v] : [v, u])
    insertAfter(u, walk[a]! >> 1, e)
    insertAfter(v, walk[b]! >> 1, e)
  }
  // Relabel vertices and edges at random, and mirror half of the time.
  const vperm = shuffle(Array.from({length: y.length}, (_, i) => i), rnd)
  const eperm = shuffle(Array.from({length: edges.length}, (_, i) => i), rnd)
  const mirror = rnd() < 0.5
  const newEdges: Array<[number, number]> = new Array(edges.length)
  edges.forEach(([u, v], e) => (newEdges[eperm[e]!] = [vperm[u]!, vperm[v]!]))
  const newRot: number[][] = new Array(y.length)
  rot.forEach((r, v) => {
    const mapped = r.map((e) => eperm[e]!)
    if (mirror) mapped.reverse()
    const shift = mapped.length > 0 ? Math.floor(rnd() * mapped.length) : 0
    newRot[vperm[v]!] = [...mapped.slice(shift), ...mapped.slice(0, shift)]
  })
  // Mirroring swaps left and right: the outer face is then left of the reverse dart.
  const oe = eperm[outerEdge]!
  const outerDart = mirror ? 2 * oe + 1 : 2 * oe
  return {vertexCount: y.length, edges: newEdges, rotation: newRot, source: vperm[0]!, sink: vperm[1]!, outerDart}
}

/** A random spanning subgraph of a random planar st-graph, with the restricted embedding. */
export function randomUpwardPlanar(seed: number, n: number, options?: RandomStOptions): RandomUpwardPlanar {
  const st = randomPlanarStGraph(seed, n, options)
  const rnd = mulberry32(seed ^ 0x5bd1e995)
  const keep = options?.keep ?? 0.3 + 0.7 * rnd()
  const kept = shuffle(
    st.edges.map((_, e) => e).filter(() => rnd() < keep),
    rnd
  )
  const newId = new Map<number, number>()
  kept.forEach((e, i) => newId.set(e, i))
  const edges = kept.map((e) => [st.edges[e]![0], st.edges[e]![1]] as [number, number])
  const rotation = st.rotation.map((r) => r.filter((e) => newId.has(e)).map((e) => newId.get(e)!))
  let outerDart = -1
  const stOuter = faceWalks(st.edges, st.rotation).find((w) => w.includes(st.outerDart))!
  for (const d of stOuter) {
    if (newId.has(d >> 1)) {
      outerDart = 2 * newId.get(d >> 1)! + (d & 1)
      break
    }
  }
  return {vertexCount: st.vertexCount, edges, rotation, st, stEdge: kept, outerDart}
}

function shuffle<T>(xs: T[], rnd: () => number): T[] {
  for (let i = xs.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1))
    const t = xs[i]!
    xs[i] = xs[j]!
    xs[j] = t
  }
  return xs
}
