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
  /**
   * Optional flat form of the same rotations, set by producers that build one (testPlanarity):
   * rotation[v] is rotationOrder[rotationStart[v] .. rotationStart[v + 1]).
   */
  readonly rotationStart?: Int32Array
  readonly rotationOrder?: Int32Array
}

/**
 * A rotation system held as one flat buffer plus offsets. `rotation` (one Int32Array view per vertex)
 * is made on first access and cached: at 10^5+ vertices making and collecting those views is a visible
 * share of the planarity test (bench/README.md, "Planarity"), and readers of the flat form never pay it.
 */
export function flatRotationSystem(graph: Digraph, rotationStart: Int32Array, rotationOrder: Int32Array): RotationSystem {
  let views: Int32Array[] | undefined
  return {
    graph,
    rotationStart,
    rotationOrder,
    get rotation(): ReadonlyArray<Int32Array> {
      if (views === undefined) {
        const n = graph.vertexCount
        const bytes = rotationOrder.buffer
        const at = rotationOrder.byteOffset
        views = new Array<Int32Array>(n)
        for (let v = 0; v < n; v++) {
          views[v] = new Int32Array(bytes, at + 4 * rotationStart[v]!, rotationStart[v + 1]! - rotationStart[v]!)
        }
      }
      return views
    },
  }
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
  const {rotationStart: start, rotationOrder: order} = emb
  if (start !== undefined && order !== undefined) return nextDartsFlat(g, start, order)
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

/** nextDarts on the flat form: the same answer without per-vertex views. */
function nextDartsFlat(g: Digraph, start: Int32Array, order: Int32Array): Int32Array {
  const m2 = 2 * g.edgeCount
  // at[d] = position of dart d's edge in the flat order, within d's tail vertex's range.
  const at = new Int32Array(m2)
  for (let v = 0; v < g.vertexCount; v++) {
    for (let i = start[v]!; i < start[v + 1]!; i++) at[dartFrom(g, order[i]!, v)] = i
  }
  const next = new Int32Array(m2)
  for (let d = 0; d < m2; d++) {
    const v = dartHead(g, d)
    const i = at[d ^ 1]! + 1 // d ^ 1 is the dart v -> u along the same edge
    next[d] = dartFrom(g, order[i === start[v + 1] ? start[v]! : i]!, v)
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
