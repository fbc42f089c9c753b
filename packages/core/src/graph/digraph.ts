/**
 * A static directed graph on vertices 0..n-1 with edges 0..m-1, stored as compressed adjacency
 * (CSR) in typed arrays: the layout every algorithm in core reads. Edge order is the order given,
 * and each vertex's out- and in-lists keep that order, so results are deterministic.
 */
export interface Digraph {
  readonly vertexCount: number
  readonly edgeCount: number
  /** tail[e] -> head[e] */
  readonly tail: Int32Array
  readonly head: Int32Array
  /** Outgoing edge ids of v: outEdges[outStart[v] .. outStart[v + 1]). */
  readonly outStart: Int32Array
  readonly outEdges: Int32Array
  /** Incoming edge ids of v: inEdges[inStart[v] .. inStart[v + 1]). */
  readonly inStart: Int32Array
  readonly inEdges: Int32Array
}

export type EdgeList = ReadonlyArray<readonly [number, number]>

export function createDigraph(vertexCount: number, edges: EdgeList): Digraph {
  const m = edges.length
  const tail = new Int32Array(m)
  const head = new Int32Array(m)
  const outStart = new Int32Array(vertexCount + 1)
  const inStart = new Int32Array(vertexCount + 1)
  for (let e = 0; e < m; e++) {
    const [u, v] = edges[e]!
    if (!(u >= 0 && u < vertexCount && v >= 0 && v < vertexCount)) {
      throw new RangeError(`edge ${e} (${u}, ${v}) has an endpoint outside 0..${vertexCount - 1}`)
    }
    tail[e] = u
    head[e] = v
    outStart[u + 1]!++
    inStart[v + 1]!++
  }
  for (let v = 0; v < vertexCount; v++) {
    outStart[v + 1]! += outStart[v]!
    inStart[v + 1]! += inStart[v]!
  }
  const outEdges = new Int32Array(m)
  const inEdges = new Int32Array(m)
  const outFill = outStart.slice(0, vertexCount)
  const inFill = inStart.slice(0, vertexCount)
  for (let e = 0; e < m; e++) {
    outEdges[outFill[tail[e]!]!++] = e
    inEdges[inFill[head[e]!]!++] = e
  }
  return {vertexCount, edgeCount: m, tail, head, outStart, outEdges, inStart, inEdges}
}

export function outDegree(g: Digraph, v: number): number {
  return g.outStart[v + 1]! - g.outStart[v]!
}

export function inDegree(g: Digraph, v: number): number {
  return g.inStart[v + 1]! - g.inStart[v]!
}

/** The vertex at the other end of edge e from v. */
export function opposite(g: Digraph, e: number, v: number): number {
  return g.tail[e] === v ? g.head[e]! : g.tail[e]!
}

/** Edge list as pairs, for building subgraphs and for tests. */
export function edgePairs(g: Digraph): Array<[number, number]> {
  const out: Array<[number, number]> = []
  for (let e = 0; e < g.edgeCount; e++) out.push([g.tail[e]!, g.head[e]!])
  return out
}
