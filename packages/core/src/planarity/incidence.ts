/**
 * Undirected incidence lists (CSR) for the left-right test, built straight from its input.
 *
 * Slot s of vertex v (adjStart[v] <= s < adjStart[v+1]) holds other[s] the other end and label[s] a
 * label of the edge end; the labels may be left out (the decision needs none), which halves what the
 * build writes and keeps the other ends, all the DFS reads, in 8 bytes per edge. A vertex's slots are in the order of the simple graph's edge ids, which
 * is what fixes the DFS, the tie order of the nesting sort and so the rotation: both builders below
 * give the same slots for the same graph.
 *
 * incidenceOfDigraph reads a digraph that has no loops and no parallel edges directly, in the edge
 * order `simplify` would give it, so that case skips the simple graph's arrays and one scattered pass
 * over them (at 10^6 edges each scattered pass costs tens of nanoseconds per edge: bench/README.md,
 * "Planarity"). O(n + m) either way.
 */
import type {Digraph} from '../graph/digraph.ts'

export interface SimpleGraph {
  readonly vertexCount: number
  /** Endpoints of edge i: (a[i], b[i]), a[i] !== b[i], no pair repeated. */
  readonly a: Int32Array
  readonly b: Int32Array
}

export interface Incidence {
  readonly vertexCount: number
  readonly edgeCount: number
  readonly adjStart: Int32Array
  readonly other: Int32Array
  /** Empty when the lists were built without labels. */
  readonly label: Int32Array
  /**
   * True: an edge's label is the same at both ends (an edge id of the caller's). False: half-edges,
   * 2e at the end a[e] and 2e+1 at b[e] of simple edge e.
   */
  readonly labelsAreIds: boolean
}

/** Slots of a simple graph; labels are half-edges, or ids[e] for edge e when ids is given. */
export function incidenceOfSimple(g: SimpleGraph, ids?: Int32Array): Incidence {
  const n = g.vertexCount
  const m = g.a.length
  const adjStart = new Int32Array(n + 1)
  for (let e = 0; e < m; e++) { adjStart[g.a[e]! + 1]!++; adjStart[g.b[e]! + 1]!++ }
  for (let v = 0; v < n; v++) adjStart[v + 1]! += adjStart[v]!
  const other = new Int32Array(2 * m)
  const label = new Int32Array(2 * m)
  const fill = adjStart.slice(0, n)
  for (let e = 0; e < m; e++) {
    const x = g.a[e]!, y = g.b[e]!
    const s = fill[x]!++, t = fill[y]!++
    label[s] = ids === undefined ? 2 * e : ids[e]!; other[s] = y
    label[t] = ids === undefined ? 2 * e + 1 : ids[e]!; other[t] = x
  }
  return {vertexCount: n, edgeCount: m, adjStart, other, label, labelsAreIds: ids !== undefined}
}

/**
 * Slots of a digraph's underlying graph, labelled by g's edge ids; null when g has a loop or two
 * edges between the same vertices (the caller then goes through `simplify`).
 *
 * Order: simplify numbers the edges while sweeping the vertices u in order, each u's out-list then
 * in-list, taking the edges whose other end w is larger. Sweeping the same way and appending each
 * edge to u's and to w's slots gives every vertex its slots in that numbering's order: u's slots
 * from smaller vertices were all appended by earlier sweeps, before its own. The sweep reads each
 * edge's other end at a scattered place, but no read waits on another, so their misses overlap.
 */
export function incidenceOfDigraph(g: Digraph, withLabels = true): Incidence | null {
  const n = g.vertexCount
  const m = g.edgeCount
  const {outStart, outEdges, inStart, inEdges, head, tail} = g
  const {adjStart, maxDegree} = slotStarts(g)
  const other = new Int32Array(2 * m)
  const label = new Int32Array(withLabels ? 2 * m : 0)
  const fill = adjStart.slice(0, n)
  // Each vertex's edges and other ends are first copied into a short local list by a loop that does
  // not branch on what it reads, so the scattered reads of head[e] and tail[e] are all in flight at
  // once; the loop that branches on them (which end is smaller, repeats) then reads the local list.
  const edge = new Int32Array(maxDegree)
  const ends = new Int32Array(maxDegree)
  // Repeated pairs: as in simplify, a vertex of small degree looks through its own short list (in
  // cache), a larger one marks its neighbours in a stamp array; O(NEAR) per edge end either way.
  let stamp: Int32Array | null = null
  for (let u = 0; u < n; u++) {
    const o0 = outStart[u]!, o1 = outStart[u + 1]!, i0 = inStart[u]!, i1 = inStart[u + 1]!
    let d = 0
    for (let i = o0; i < o1; i++) { const e = outEdges[i]!; edge[d] = e; ends[d++] = head[e]! }
    for (let i = i0; i < i1; i++) { const e = inEdges[i]!; edge[d] = e; ends[d++] = tail[e]! }
    const big = d > NEAR
    if (big && stamp === null) stamp = new Int32Array(n).fill(-1)
    let taken = 0 // ends[0 .. taken) are the larger ends met so far, when not big
    for (let j = 0; j < d; j++) {
      const w = ends[j]!
      if (w <= u) {
        if (w === u) return null // a loop
        continue
      }
      if (big) {
        if (stamp![w] === u) return null
        stamp![w] = u
      } else {
        for (let k = 0; k < taken; k++) if (ends[k] === w) return null
        ends[taken++] = w
      }
      const s = fill[u]!++, t = fill[w]!++
      other[s] = w; other[t] = u
      if (withLabels) { label[s] = edge[j]!; label[t] = edge[j]! }
    }
  }
  return {vertexCount: n, edgeCount: m, adjStart, other, label, labelsAreIds: true}
}

const NEAR = 16

/** Where each vertex's slots start (its degree, both directions, summed up), and the largest degree. O(n). */
function slotStarts(g: Digraph): {adjStart: Int32Array; maxDegree: number} {
  const {vertexCount: n, outStart, inStart} = g
  const adjStart = new Int32Array(n + 1)
  let maxDegree = 0
  for (let v = 0; v < n; v++) {
    const d = outStart[v + 1]! - outStart[v]! + inStart[v + 1]! - inStart[v]!
    adjStart[v + 1] = adjStart[v]! + d
    if (d > maxDegree) maxDegree = d
  }
  return {adjStart, maxDegree}
}

/**
 * Unlabelled slots of a digraph's underlying graph for the decision alone, in each vertex's own order
 * (its out-list, then its in-list); null on a loop or two edges between the same vertices.
 *
 * Whether a graph is planar does not depend on the order of its incidence lists, so the decision
 * need not reproduce `simplify`'s numbering (incidenceOfDigraph does, for the rotation's sake). Each
 * vertex then fills only its own slots: its edges' other ends are read at scattered places but no
 * read waits on another, and nothing is written out of order. incidenceOfDigraph also appends every
 * edge to the larger end's slots, a scattered read-modify-write of that end's fill counter and a
 * scattered write per edge, which at 10^6 edges costs about as much again (bench/README.md,
 * "Planarity"). Every edge is seen from both ends here, so repeats are looked for among all of a
 * vertex's neighbours. O(n + m).
 */
export function incidenceForDecision(g: Digraph): Incidence | null {
  const n = g.vertexCount
  const m = g.edgeCount
  const {outStart, outEdges, inStart, inEdges, head, tail} = g
  const {adjStart} = slotStarts(g)
  const other = new Int32Array(2 * m)
  let stamp: Int32Array | null = null
  for (let u = 0; u < n; u++) {
    const s0 = adjStart[u]!
    let s = s0
    // Gather first (reads that do not wait on each other), then check what was gathered.
    for (let i = outStart[u]!, i1 = outStart[u + 1]!; i < i1; i++) other[s++] = head[outEdges[i]!]!
    for (let i = inStart[u]!, i1 = inStart[u + 1]!; i < i1; i++) other[s++] = tail[inEdges[i]!]!
    if (s - s0 > NEAR) {
      if (stamp === null) stamp = new Int32Array(n).fill(-1)
      for (let j = s0; j < s; j++) {
        const w = other[j]!
        if (w === u || stamp[w] === u) return null
        stamp[w] = u
      }
    } else {
      for (let j = s0; j < s; j++) {
        const w = other[j]!
        if (w === u) return null
        for (let k = s0; k < j; k++) if (other[k] === w) return null
      }
    }
  }
  return {vertexCount: n, edgeCount: m, adjStart, other, label: new Int32Array(0), labelsAreIds: true}
}
