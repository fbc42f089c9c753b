/**
 * The simple undirected graph underneath a digraph: directions dropped, self-loops set aside, and
 * parallel edges (u->v twice, or u->v and v->u) collapsed onto the first of them. A multigraph with
 * loops is planar iff this simplification is (common practice: a loop or a parallel copy can always be
 * drawn next to its vertex or its twin). O(n + m) with a stamp per vertex instead of sorting.
 */
import type {Digraph} from '../graph/digraph.ts'
import type {SimpleGraph} from './left-right.ts'

export interface Simplified {
  readonly simple: SimpleGraph
  /** g's edge id standing for each simple edge (the first of its parallel class). */
  readonly original: Int32Array
  /** g's other edges parallel to simple edge s: parallel[parallelStart[s] .. parallelStart[s+1]). */
  readonly parallelStart: Int32Array
  readonly parallel: Int32Array
  /** g's self-loops. */
  readonly loops: Int32Array
  /** 1 where the tail of g's edge original[s] is simple.a[s] (so its head is simple.b[s]), else 0. */
  readonly repTailIsA: Uint8Array
}

export function simplify(g: Digraph): Simplified {
  const n = g.vertexCount
  const m = g.edgeCount
  const stamp = new Int32Array(n).fill(-1)
  const simpleAt = new Int32Array(n)
  // Simple edge of each non-loop g edge; only filled (by a second sweep) when g has parallel edges,
  // since at 10^6 edges its scattered writes cost a visible share of the sweep.
  let classOf: Int32Array | null = null
  const a = new Int32Array(m)
  const b = new Int32Array(m)
  const original = new Int32Array(m)
  const repTailIsA = new Uint8Array(m)
  let k = 0
  let loops: number[] = []
  let repeated = false // a pair seen twice: g has parallel edges
  // Has u met w before? A vertex of degree at most NEAR looks through its own short list (in cache)
  // instead of stamp[w], a scattered read per edge end at 10^6 edges; O(NEAR) per edge end either way.
  const NEAR = 16
  const near = new Int32Array(NEAR)
  const nearId = new Int32Array(NEAR)
  let nearCount = 0
  let useStamp = false
  const visit = (u: number, e: number, w: number, uIsTail: number): void => {
    if (w <= u) return // loops are taken from out-lists only; other edges from their smaller end
    let id = -1
    if (useStamp) {
      if (stamp[w] === u) id = simpleAt[w]!
      else { stamp[w] = u; simpleAt[w] = k }
    } else {
      for (let i = 0; i < nearCount; i++) if (near[i] === w) { id = nearId[i]!; break }
      if (id < 0) { near[nearCount] = w; nearId[nearCount++] = k }
    }
    if (id < 0) {
      id = k
      a[k] = u
      b[k] = w
      repTailIsA[k] = uIsTail
      original[k++] = e
    } else {
      repeated = true
    }
    if (classOf !== null) classOf[e] = id
  }
  const sweep = (): void => {
    for (let u = 0; u < n; u++) {
      nearCount = 0
      useStamp = g.outStart[u + 1]! - g.outStart[u]! + g.inStart[u + 1]! - g.inStart[u]! > NEAR
      for (let i = g.outStart[u]!; i < g.outStart[u + 1]!; i++) {
        const e = g.outEdges[i]!
        if (g.head[e] === u) loops.push(e)
        else visit(u, e, g.head[e]!, 1)
      }
      for (let i = g.inStart[u]!; i < g.inStart[u + 1]!; i++) {
        const e = g.inEdges[i]!
        if (g.tail[e] !== u) visit(u, e, g.tail[e]!, 0)
      }
    }
  }
  sweep()
  const parallelStart = new Int32Array(k + 1)
  // Nothing parallel (the usual case): skip two passes of random reads through classOf/original.
  if (!repeated) {
    return {
      simple: {vertexCount: n, a: k === m ? a : a.slice(0, k), b: k === m ? b : b.slice(0, k)},
      original: k === m ? original : original.slice(0, k),
      parallelStart,
      parallel: new Int32Array(0),
      loops: Int32Array.from(loops),
      repTailIsA: k === m ? repTailIsA : repTailIsA.slice(0, k),
    }
  }
  // Same sweep again, now recording each edge's class (same k order, so the same simple edges).
  classOf = new Int32Array(m).fill(-1)
  stamp.fill(-1)
  k = 0
  loops = []
  sweep()
  for (let e = 0; e < m; e++) {
    const s = classOf[e]!
    if (s >= 0 && original[s] !== e) parallelStart[s + 1]!++
  }
  for (let s = 0; s < k; s++) parallelStart[s + 1]! += parallelStart[s]!
  const parallel = new Int32Array(parallelStart[k]!)
  const fill = parallelStart.slice(0, k)
  for (let e = 0; e < m; e++) {
    const s = classOf[e]!
    if (s >= 0 && original[s] !== e) parallel[fill[s]!++] = e
  }
  return {
    simple: {vertexCount: n, a: k === m ? a : a.slice(0, k), b: k === m ? b : b.slice(0, k)},
    original: k === m ? original : original.slice(0, k),
    parallelStart,
    parallel,
    loops: Int32Array.from(loops),
    repTailIsA: k === m ? repTailIsA : repTailIsA.slice(0, k),
  }
}
