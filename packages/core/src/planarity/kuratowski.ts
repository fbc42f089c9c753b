/**
 * Kuratowski subgraph extraction by edge deletion: an edge-minimal non-planar subgraph is a subdivision
 * of K5 or K3,3 (Kuratowski, 1930), so we delete every edge whose removal keeps the graph non-planar.
 * Edges are tried in blocks that halve (delta-debugging style, Zeller & Hildebrandt 2002): a block whose
 * removal keeps the graph non-planar goes at once, and the last pass tries single edges, which makes
 * the result minimal (an edge needed in a set is needed in every subset of it).
 *
 * Complexity: each trial is one left-right test, O(n' + m') on the edges still present. Worst case O(m)
 * trials, so O(m^2); typically O(k log m) trials for a subdivision with k edges. Branch vertices and the
 * type are then found by suppressing degree-2 vertices, O(k).
 */
import {isPlanarSimple, type SimpleGraph} from './left-right.ts'

export interface SimpleKuratowski {
  readonly type: 'K5' | 'K3,3'
  /** 5 vertices (K5), or 6 with the first 3 on one side and the last 3 on the other (K3,3). */
  readonly branch: number[]
  /** Simple edge ids, ascending. */
  readonly edges: Int32Array
}

/** Minimal non-planar edge subset of a non-planar simple graph, as simple edge ids. */
export function minimalNonplanarEdges(g: SimpleGraph): Int32Array {
  const n = g.vertexCount
  const order = new Int32Array(g.a.length)
  for (let i = 0; i < order.length; i++) order[i] = i
  let len = order.length
  const local = new Int32Array(n).fill(-1) // compact vertex ids per trial
  const a = new Int32Array(len)
  const b = new Int32Array(len)
  // Is order[0..len) without positions [lo, hi) non-planar?
  const nonplanarWithout = (lo: number, hi: number): boolean => {
    let k = 0
    let used = 0
    const touched: number[] = []
    const id = (v: number): number => {
      if (local[v] === -1) { local[v] = used++; touched.push(v) }
      return local[v]!
    }
    for (let i = 0; i < len; i++) {
      if (i === lo) { i = hi - 1; continue }
      const e = order[i]!
      a[k] = id(g.a[e]!)
      b[k++] = id(g.b[e]!)
    }
    for (const v of touched) local[v] = -1
    return !isPlanarSimple({vertexCount: used, a: a.subarray(0, k), b: b.subarray(0, k)})
  }
  let chunk = Math.max(1, Math.ceil(len / 2))
  for (;;) {
    let i = 0
    while (i < len) {
      const hi = Math.min(i + chunk, len)
      if (nonplanarWithout(i, hi)) {
        order.copyWithin(i, hi, len)
        len -= hi - i
      } else {
        i = hi
      }
    }
    if (chunk === 1) break
    chunk = Math.ceil(chunk / 2)
  }
  return order.slice(0, len).sort()
}

/** Branch vertices and type of a subdivided K5 or K3,3 given by its simple edge ids. */
export function classifySubdivision(g: SimpleGraph, edges: Int32Array): SimpleKuratowski {
  const n = g.vertexCount
  const deg = new Int32Array(n)
  for (const e of edges) { deg[g.a[e]!]!++; deg[g.b[e]!]!++ }
  const start = new Int32Array(n + 1)
  for (let v = 0; v < n; v++) start[v + 1] = start[v]! + deg[v]!
  const inc = new Int32Array(2 * edges.length)
  const fill = start.slice(0, n)
  for (const e of edges) { inc[fill[g.a[e]!]!++] = e; inc[fill[g.b[e]!]!++] = e }
  const branch: number[] = []
  for (let v = 0; v < n; v++) if (deg[v]! > 2) branch.push(v)
  const type = branch.length === 5 ? 'K5' : 'K3,3'
  if (type === 'K5' ? !branch.every((v) => deg[v] === 4) : !(branch.length === 6 && branch.every((v) => deg[v] === 3))) {
    throw new Error('internal: a minimal non-planar subgraph is not a subdivided K5 or K3,3')
  }
  if (type === 'K5') return {type, branch, edges}
  // Suppress degree-2 vertices: follow each path from branch[0] to learn its three neighbours.
  const across = new Set<number>()
  const v0 = branch[0]!
  for (let i = start[v0]!; i < start[v0 + 1]!; i++) {
    let prevEdge = inc[i]!
    let v = g.a[prevEdge] === v0 ? g.b[prevEdge]! : g.a[prevEdge]!
    while (deg[v] === 2) {
      const e = inc[start[v]!] === prevEdge ? inc[start[v]! + 1]! : inc[start[v]!]!
      v = g.a[e] === v ? g.b[e]! : g.a[e]!
      prevEdge = e
    }
    across.add(v)
  }
  const sideA = branch.filter((v) => !across.has(v))
  const sideB = branch.filter((v) => across.has(v))
  return {type, branch: [...sideA, ...sideB], edges}
}
