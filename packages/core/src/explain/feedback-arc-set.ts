/**
 * A small feedback arc set: edges whose removal leaves the digraph acyclic.
 *
 * Only edges inside a strongly connected component (and self-loops) can lie on a cycle, so each
 * nontrivial component is solved on its own (Tarjan 1972 for the components, O(n + m)).
 * - Exact, for a component of at most `exactVertexLimit` vertices: a minimum feedback arc set is the
 *   set of backward edges of a best vertex order, found by dynamic programming over vertex subsets
 *   (the Held–Karp style recurrence for linear ordering: best(S) = min over v in S of best(S − v) +
 *   weight of edges from v into S − v, v being placed last among S). O(2^k · k · d) for k vertices.
 * - Heuristic beyond: Eades, Lin & Smyth, "A fast and effective heuristic for the feedback arc set
 *   problem", Inf. Process. Lett. 47 (1993): peel sinks to the back and sources to the front, else move
 *   the vertex of largest outdegree − indegree to the front; backward edges of that order form the set.
 *   Then every chosen edge that closes no cycle with the kept edges is put back, so the set is minimal
 *   (no edge can be dropped from it) though not necessarily minimum. O(m) per edge put back.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {findCycle} from '../acyclic/index.ts'

export interface FeedbackArcSet {
  /** Edge ids, ascending. */
  edges: number[]
  /** True when the set is known to be of minimum size. */
  exact: boolean
}

export const exactVertexLimit = 20

export function feedbackArcSet(g: Digraph, options: {exactVertexLimit?: number} = {}): FeedbackArcSet {
  const limit = options.exactVertexLimit ?? exactVertexLimit
  const chosen: number[] = []
  let exact = true
  for (let e = 0; e < g.edgeCount; e++) if (g.tail[e] === g.head[e]) chosen.push(e)
  for (const comp of stronglyConnectedComponents(g)) {
    if (comp.length < 2) continue
    const order = comp.length <= limit ? exactOrder(g, comp) : eadesLinSmyth(g, comp)
    if (comp.length > limit) exact = false
    const rank = new Map<number, number>()
    order.forEach((v, i) => rank.set(v, i))
    for (const v of comp) {
      for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
        const e = g.outEdges[i]!
        const w = g.head[e]!
        if (w !== v && rank.has(w) && rank.get(w)! < rank.get(v)!) chosen.push(e)
      }
    }
  }
  chosen.sort((a, b) => a - b)
  return {edges: exact ? chosen : makeMinimal(g, chosen), exact}
}

/** Tarjan's algorithm, iterative. Components in reverse topological order. */
export function stronglyConnectedComponents(g: Digraph): number[][] {
  const n = g.vertexCount
  const index = new Int32Array(n).fill(-1)
  const low = new Int32Array(n)
  const onStack = new Uint8Array(n)
  const stack: number[] = []
  const comps: number[][] = []
  const next = new Int32Array(n)
  let counter = 0
  for (let root = 0; root < n; root++) {
    if (index[root] !== -1) continue
    const call: number[] = [root]
    index[root] = low[root] = counter++
    next[root] = g.outStart[root]!
    stack.push(root)
    onStack[root] = 1
    while (call.length > 0) {
      const v = call[call.length - 1]!
      if (next[v]! < g.outStart[v + 1]!) {
        const w = g.head[g.outEdges[next[v]++]!]!
        if (index[w] === -1) {
          index[w] = low[w] = counter++
          next[w] = g.outStart[w]!
          stack.push(w)
          onStack[w] = 1
          call.push(w)
        } else if (onStack[w]) low[v] = Math.min(low[v]!, index[w]!)
        continue
      }
      call.pop()
      if (call.length > 0) {
        const p = call[call.length - 1]!
        low[p] = Math.min(low[p]!, low[v]!)
      }
      if (low[v] === index[v]) {
        const comp: number[] = []
        let w: number
        do {
          w = stack.pop()!
          onStack[w] = 0
          comp.push(w)
        } while (w !== v)
        comps.push(comp.sort((a, b) => a - b))
      }
    }
  }
  return comps
}

/** Weighted adjacency inside a component: weight[i][j] = number of edges from comp[i] to comp[j]. */
function localWeights(g: Digraph, comp: readonly number[]): number[][] {
  const local = new Map<number, number>()
  comp.forEach((v, i) => local.set(v, i))
  const weight = comp.map(() => new Array<number>(comp.length).fill(0))
  comp.forEach((v, i) => {
    for (let k = g.outStart[v]!; k < g.outStart[v + 1]!; k++) {
      const j = local.get(g.head[g.outEdges[k]!]!)
      if (j !== undefined && j !== i) weight[i]![j]!++
    }
  })
  return weight
}

/** Vertex order of the component with the fewest backward edges (subset dynamic programming). */
function exactOrder(g: Digraph, comp: readonly number[]): number[] {
  const k = comp.length
  const weight = localWeights(g, comp)
  const targets = weight.map((row) => row.flatMap((w, j) => (w > 0 ? [[j, w] as const] : [])))
  const size = 1 << k
  const best = new Int32Array(size).fill(0x3fffffff)
  const lastOf = new Int8Array(size).fill(-1)
  best[0] = 0
  for (let s = 1; s < size; s++) {
    let bestCost = 0x3fffffff
    let bestLast = -1
    for (let v = 0; v < k; v++) {
      const bit = 1 << v
      if (!(s & bit)) continue
      const rest = s ^ bit
      let cost = best[rest]!
      if (cost >= bestCost) continue
      for (const [j, w] of targets[v]!) if (rest & (1 << j)) cost += w
      if (cost < bestCost) {
        bestCost = cost
        bestLast = v
      }
    }
    best[s] = bestCost
    lastOf[s] = bestLast
  }
  const order: number[] = []
  for (let s = size - 1; s > 0; s ^= 1 << lastOf[s]!) order.push(comp[lastOf[s]!]!)
  return order.reverse()
}

/** Eades, Lin & Smyth (1993) vertex order for one component. */
function eadesLinSmyth(g: Digraph, comp: readonly number[]): number[] {
  const k = comp.length
  const weight = localWeights(g, comp)
  const outW = new Array<number>(k).fill(0)
  const inW = new Array<number>(k).fill(0)
  for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) {
    outW[i]! += weight[i]![j]!
    inW[j]! += weight[i]![j]!
  }
  const alive = new Array<boolean>(k).fill(true)
  const front: number[] = []
  const back: number[] = []
  const remove = (i: number): void => {
    alive[i] = false
    for (let j = 0; j < k; j++) {
      outW[j]! -= weight[j]![i]!
      inW[j]! -= weight[i]![j]!
    }
  }
  let left = k
  while (left > 0) {
    let moved = true
    while (moved) {
      moved = false
      for (let i = 0; i < k; i++) {
        if (alive[i] && outW[i] === 0) {
          back.push(i)
          remove(i)
          left--
          moved = true
        }
      }
      for (let i = 0; i < k; i++) {
        if (alive[i] && inW[i] === 0) {
          front.push(i)
          remove(i)
          left--
          moved = true
        }
      }
    }
    if (left === 0) break
    let pick = -1
    for (let i = 0; i < k; i++) if (alive[i] && (pick < 0 || outW[i]! - inW[i]! > outW[pick]! - inW[pick]!)) pick = i
    front.push(pick)
    remove(pick)
    left--
  }
  return [...front, ...back.reverse()].map((i) => comp[i]!)
}

/** Put back every chosen edge that closes no cycle with the edges kept so far (in id order). */
function makeMinimal(g: Digraph, chosen: readonly number[]): number[] {
  const out = new Set(chosen)
  for (const e of chosen) {
    out.delete(e)
    const pairs: Array<[number, number]> = []
    for (let f = 0; f < g.edgeCount; f++) if (!out.has(f)) pairs.push([g.tail[f]!, g.head[f]!])
    if (!findCycle(createDigraph(g.vertexCount, pairs)).acyclic) out.add(e)
  }
  return [...out].sort((a, b) => a - b)
}
