/**
 * Kuratowski subgraph extraction by edge deletion: an edge-minimal non-planar subgraph is a subdivision
 * of K5 or K3,3 (Kuratowski, 1930), so we delete every edge whose removal keeps the graph non-planar.
 * First the shortest non-planar prefix of the edge list is found by binary search. Its edges are then
 * grouped into units (maximal paths through degree-2 vertices, pendant trees dropped), and units are
 * tried in blocks that halve (delta-debugging style, Zeller & Hildebrandt 2002): a block whose removal
 * keeps the graph non-planar goes at once, and the last pass tries single units, which makes the result
 * minimal (a unit needed in a set is needed in every subset of it, and removing one edge of a unit is
 * as good as removing all of it).
 *
 * Complexity: each trial is one left-right test, O(n' + m') on the edges still present. Worst case O(m)
 * trials, so O(m^2); typically O(log m) trials for the prefix plus O(u log m) for u units left. Branch vertices and the
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

/** Minimal non-planar edge subset of a non-planar simple graph, as simple edge ids (ascending). */
export function minimalNonplanarEdges(g: SimpleGraph): Int32Array {
  const n = g.vertexCount
  const m = g.a.length
  const local = new Int32Array(n).fill(-1) // compact vertex ids, reset after each use
  const a = new Int32Array(m)
  const b = new Int32Array(m)
  let used = 0
  const touched = new Int32Array(n)
  const id = (v: number): number => {
    if (local[v] === -1) { local[v] = used; touched[used++] = v }
    return local[v]!
  }
  const nonplanar = (k: number): boolean => {
    for (let i = 0; i < used; i++) local[touched[i]!] = -1
    const vertexCount = used
    used = 0
    return !isPlanarSimple({vertexCount, a: a.subarray(0, k), b: b.subarray(0, k)})
  }

  // 1. Shortest non-planar prefix of the edge list, by binary search: O(log m) trials.
  let lo = 0 // edges [0, lo) planar
  let hi = m // edges [0, hi) non-planar
  while (hi - lo > 1) {
    const mid = (lo + hi) >>> 1
    for (let e = 0; e < mid; e++) { a[e] = id(g.a[e]!); b[e] = id(g.b[e]!) }
    if (nonplanar(mid)) hi = mid
    else lo = mid
  }

  // 2. Units: maximal chains through degree-2 vertices, after trees hanging off the graph are pruned.
  const {unitStart, unitEdges} = chainUnits(g, hi, local)

  // 3. Delete units in halving blocks while the rest stays non-planar.
  const units = unitStart.length - 1
  const order = new Int32Array(units)
  for (let u = 0; u < units; u++) order[u] = u
  let len = units
  const nonplanarWithout = (from: number, to: number): boolean => {
    let k = 0
    for (let i = 0; i < len; i++) {
      if (i === from) { i = to - 1; continue }
      const u = order[i]!
      for (let j = unitStart[u]!; j < unitStart[u + 1]!; j++) {
        const e = unitEdges[j]!
        a[k] = id(g.a[e]!)
        b[k++] = id(g.b[e]!)
      }
    }
    return nonplanar(k)
  }
  let chunk = Math.max(1, Math.ceil(len / 2))
  for (;;) {
    let i = 0
    while (i < len) {
      const to = Math.min(i + chunk, len)
      if (nonplanarWithout(i, to)) {
        order.copyWithin(i, to, len)
        len -= to - i
      } else {
        i = to
      }
    }
    if (chunk === 1) break
    chunk = Math.ceil(chunk / 2)
  }
  const out: number[] = []
  for (let i = 0; i < len; i++) {
    const u = order[i]!
    for (let j = unitStart[u]!; j < unitStart[u + 1]!; j++) out.push(unitEdges[j]!)
  }
  return Int32Array.from(out).sort()
}

/**
 * Split edges 0..count-1 into units whose removal is interchangeable with removing any one of their
 * edges: first strip pendant trees (a vertex of degree 1 lies on no cycle, so on no Kuratowski
 * subgraph), drop components that are plain cycles, then cut the rest into maximal paths whose
 * inner vertices have degree 2. Deleting one edge of such a path leaves the rest of it pendant, so
 * the test's answer is the same as for deleting the whole path. O(n + count).
 */
function chainUnits(g: SimpleGraph, count: number, local: Int32Array): {unitStart: Int32Array; unitEdges: Int32Array} {
  // Compact vertex ids.
  const verts: number[] = []
  const ea = new Int32Array(count)
  const eb = new Int32Array(count)
  for (let e = 0; e < count; e++) {
    for (const [v, arr] of [[g.a[e]!, ea], [g.b[e]!, eb]] as const) {
      if (local[v] === -1) { local[v] = verts.length; verts.push(v) }
      arr[e] = local[v]!
    }
  }
  for (const v of verts) local[v] = -1
  const k = verts.length
  const deg = new Int32Array(k)
  for (let e = 0; e < count; e++) { deg[ea[e]!]!++; deg[eb[e]!]!++ }
  const start = new Int32Array(k + 1)
  for (let v = 0; v < k; v++) start[v + 1] = start[v]! + deg[v]!
  const inc = new Int32Array(2 * count)
  const fill = start.slice(0, k)
  for (let e = 0; e < count; e++) { inc[fill[ea[e]!]!++] = e; inc[fill[eb[e]!]!++] = e }
  const dead = new Uint8Array(count)
  const other = (e: number, v: number): number => (ea[e] === v ? eb[e]! : ea[e]!)
  // Strip pendant trees.
  const queue: number[] = []
  for (let v = 0; v < k; v++) if (deg[v] === 1) queue.push(v)
  while (queue.length > 0) {
    const v = queue.pop()!
    if (deg[v] !== 1) continue
    for (let i = start[v]!; i < start[v + 1]!; i++) {
      const e = inc[i]!
      if (dead[e]) continue
      dead[e] = 1
      deg[v] = 0
      const w = other(e, v)
      if (--deg[w]! === 1) queue.push(w)
      break
    }
  }
  // The other live edge at a degree-2 vertex v.
  const nextAt = (v: number, e: number): number => {
    for (let i = start[v]!; i < start[v + 1]!; i++) {
      const f = inc[i]!
      if (f !== e && !dead[f]) return f
    }
    return -1
  }
  const unitStart: number[] = [0]
  const unitEdges: number[] = []
  const done = new Uint8Array(count)
  const chain: number[] = []
  for (let e0 = 0; e0 < count; e0++) {
    if (dead[e0] || done[e0]) continue
    chain.length = 0
    chain.push(e0)
    done[e0] = 1
    let cycle = false
    for (const end of [ea[e0]!, eb[e0]!]) {
      let v = end
      let e = e0
      while (deg[v] === 2) {
        const f = nextAt(v, e)
        if (f === e0) { cycle = true; break }
        done[f] = 1
        chain.push(f)
        v = other(f, v)
        e = f
      }
      if (cycle) break
    }
    if (cycle) continue // a component that is a plain cycle: planar, never needed
    for (const e of chain) unitEdges.push(e)
    unitStart.push(unitEdges.length)
  }
  return {unitStart: Int32Array.from(unitStart), unitEdges: Int32Array.from(unitEdges)}
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
