import type {Digraph} from '../graph/digraph.ts'

/**
 * A combinatorial embedding of a graph's underlying undirected graph: for every vertex, its incident
 * edge ids in clockwise order (as seen in a drawing whose y axis points up). Directions are kept in
 * the graph, not here.
 *
 * Darts: edge e has dart 2e (tail -> head) and dart 2e + 1 (head -> tail).
 * Faces are traced with the face on the left: after dart (u -> v) comes the dart leaving v along the
 * edge that follows {u, v} in v's clockwise rotation. (Common practice; see e.g. Mohar & Thomassen,
 * "Graphs on Surfaces", 2001, for rotation systems.)
 */
export interface RotationSystem {
  readonly graph: Digraph
  readonly rotation: ReadonlyArray<Int32Array>
}

export interface Faces {
  /** face[d] = the face on the left of dart d. */
  readonly faceOfDart: Int32Array
  /** The darts of each face in walking order. */
  readonly darts: ReadonlyArray<Int32Array>
}

export function dartTail(g: Digraph, d: number): number {
  const e = d >> 1
  return (d & 1) === 0 ? g.tail[e]! : g.head[e]!
}

export function dartHead(g: Digraph, d: number): number {
  const e = d >> 1
  return (d & 1) === 0 ? g.head[e]! : g.tail[e]!
}

/** Dart leaving v along edge e. */
export function dartFrom(g: Digraph, e: number, v: number): number {
  return g.tail[e] === v ? 2 * e : 2 * e + 1
}

/**
 * For every dart, the next dart along its face. Position lookups make this O(m) overall.
 */
export function nextDarts(emb: RotationSystem): Int32Array {
  const g = emb.graph
  // posAt[d] = index of dart d's edge in the rotation of d's tail vertex.
  const posAt = new Int32Array(2 * g.edgeCount)
  for (let v = 0; v < g.vertexCount; v++) {
    const rot = emb.rotation[v]!
    for (let i = 0; i < rot.length; i++) posAt[dartFrom(g, rot[i]!, v)] = i
  }
  const next = new Int32Array(2 * g.edgeCount)
  for (let d = 0; d < 2 * g.edgeCount; d++) {
    const v = dartHead(g, d)
    const back = d ^ 1 // dart v -> u along the same edge
    const rot = emb.rotation[v]!
    const i = posAt[back]!
    const e = rot[(i + 1) % rot.length]!
    next[d] = dartFrom(g, e, v)
  }
  return next
}

/** Trace all faces. O(m). Isolated vertices belong to no face. */
export function traceFaces(emb: RotationSystem): Faces {
  const g = emb.graph
  const next = nextDarts(emb)
  const faceOfDart = new Int32Array(2 * g.edgeCount).fill(-1)
  const darts: Int32Array[] = []
  for (let d0 = 0; d0 < 2 * g.edgeCount; d0++) {
    if (faceOfDart[d0] !== -1) continue
    const f = darts.length
    const walk: number[] = []
    let d = d0
    do {
      faceOfDart[d] = f
      walk.push(d)
      d = next[d]!
    } while (d !== d0)
    darts.push(Int32Array.from(walk))
  }
  return {faceOfDart, darts}
}
