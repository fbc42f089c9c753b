/**
 * Levels for a diagram with tiers: every vertex of tier i shares one level, tiers go up in declared
 * order, and every vertex in no tier (and every edge-label vertex) gets the lowest level above all of
 * its predecessors — longest-path layering from the sources (common practice), with each tier acting
 * as one node. Linear: one topological pass over the vertices and one tier node per tier.
 *
 * Why fix the free vertices' levels here rather than leave them free: the drawing puts them exactly
 * there, so the level-planarity answer is exact for the drawing that will be produced. (With free
 * vertices left free, the question would be upward planarity with some levels fixed, which is
 * NP-hard in general — Garg & Tamassia 2001 — and the answer would not say where to put them.) The
 * cost is that a "no" is for these levels; the message says so.
 *
 * Before levelling, a path that leaves a tier, runs through vertices in no tier and arrives at the same
 * or an earlier tier is reported: no levels can satisfy it.
 */
import type {Digraph} from '../graph/digraph.ts'

export type LevelAssignment =
  | {ok: true; level: Int32Array; tierLevel: Int32Array}
  /**
   * `path`: edge ids in order, from a vertex of some tier through vertices in no tier to a vertex of
   * the same or an earlier tier.
   */
  | {ok: false; path: number[]}

/**
 * `tierOf[v]`: the tier of v (0 = first declared), or −1. Preconditions (RangeError otherwise): the
 * graph is acyclic and every edge between two tiered vertices goes to a strictly later tier.
 */
export function assignLevels(graph: Digraph, tierOf: ArrayLike<number>, tierCount: number): LevelAssignment {
  const n = graph.vertexCount
  for (let e = 0; e < graph.edgeCount; e++) {
    const a = tierOf[graph.tail[e]!]!
    const b = tierOf[graph.head[e]!]!
    if (a >= 0 && b >= 0 && a >= b) throw new RangeError(`edge ${e} does not go to a later tier`)
  }
  const order = topologicalOrder(graph)
  if (!order) throw new RangeError('assignLevels needs an acyclic graph')

  // Highest tier that reaches each free vertex through free vertices only, and the edge it came by.
  const reach = new Int32Array(n).fill(-1)
  const via = new Int32Array(n).fill(-1)
  for (const x of order) {
    if (tierOf[x]! >= 0) continue
    for (let p = graph.inStart[x]!; p < graph.inStart[x + 1]!; p++) {
      const e = graph.inEdges[p]!
      const u = graph.tail[e]!
      const from = tierOf[u]! >= 0 ? tierOf[u]! : reach[u]!
      if (from > reach[x]!) {
        reach[x] = from
        via[x] = e
      }
    }
  }
  for (let e = 0; e < graph.edgeCount; e++) {
    const x = graph.tail[e]!
    const t = graph.head[e]!
    if (tierOf[x]! >= 0 || tierOf[t]! < 0 || reach[x]! < tierOf[t]!) continue
    const path = [e]
    let at = x
    while (tierOf[at]! < 0) {
      path.push(via[at]!)
      at = graph.tail[via[at]!]!
    }
    return {ok: false, path: path.reverse()}
  }

  // Longest path from the sources, each tier one node: tier i's level is at least tier i−1's plus one
  // and above every predecessor of each of its vertices.
  const level = new Int32Array(n)
  const tierLevel = new Int32Array(tierCount)
  const byTier: number[][] = Array.from({length: tierCount}, () => [])
  for (let v = 0; v < n; v++) if (tierOf[v]! >= 0) byTier[tierOf[v]!]!.push(v)
  // Process in topological order, but a tier only once all of its vertices' predecessors are placed:
  // count, per tier, the in-edges still unplaced.
  const waiting = new Int32Array(tierCount)
  for (let e = 0; e < graph.edgeCount; e++) {
    const t = tierOf[graph.head[e]!]!
    if (t >= 0) waiting[t]!++
  }
  const remaining = new Int32Array(n)
  for (let v = 0; v < n; v++) remaining[v] = graph.inStart[v + 1]! - graph.inStart[v]!
  const ready: number[] = []
  for (let v = 0; v < n; v++) if (tierOf[v]! < 0 && remaining[v] === 0) ready.push(v)
  let nextTier = 0
  const floor = new Int32Array(n)
  let tierFloor = 0
  const placeVertex = (v: number, l: number): void => {
    level[v] = l
    for (let p = graph.outStart[v]!; p < graph.outStart[v + 1]!; p++) {
      const e = graph.outEdges[p]!
      const w = graph.head[e]!
      if (floor[w]! < l + 1) floor[w] = l + 1
      const t = tierOf[w]!
      if (t >= 0) {
        waiting[t]!--
      } else if (--remaining[w] === 0) {
        ready.push(w)
      }
    }
  }
  for (;;) {
    if (ready.length > 0) {
      const v = ready.pop()!
      placeVertex(v, floor[v]!)
      continue
    }
    if (nextTier < tierCount && waiting[nextTier] === 0) {
      let l = tierFloor
      for (const v of byTier[nextTier]!) l = Math.max(l, floor[v]!)
      tierLevel[nextTier] = l
      tierFloor = l + 1
      for (const v of byTier[nextTier]!) placeVertex(v, l)
      nextTier++
      continue
    }
    break
  }
  if (nextTier < tierCount) throw new Error('assignLevels: a tier could not be placed (a path against the tiers was missed)')
  return {ok: true, level, tierLevel}
}

function topologicalOrder(graph: Digraph): number[] | undefined {
  const n = graph.vertexCount
  const remaining = new Int32Array(n)
  const order: number[] = []
  for (let v = 0; v < n; v++) {
    remaining[v] = graph.inStart[v + 1]! - graph.inStart[v]!
    if (remaining[v] === 0) order.push(v)
  }
  for (let i = 0; i < order.length; i++) {
    const v = order[i]!
    for (let p = graph.outStart[v]!; p < graph.outStart[v + 1]!; p++) {
      const w = graph.head[graph.outEdges[p]!]!
      if (--remaining[w] === 0) order.push(w)
    }
  }
  return order.length === n ? order : undefined
}
