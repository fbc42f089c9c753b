/**
 * A maximal upward planar subgraph of an acyclic digraph: greedy insertion in a given order (the
 * order the edges were written), keeping each edge whose addition leaves the subgraph upward planar,
 * decided by the exact test (upward/test-upward-planarity.ts) within a time budget. Upward planarity
 * is closed under taking subgraphs, so an edge refused at its turn would still be refused at the end:
 * the result is maximal by construction (adding back any dropped edge breaks upward planarity), though
 * not necessarily maximum (that problem is NP-hard, as upward planarity testing is; Garg & Tamassia
 * 2001). Starting from a whole graph that is already upward planar costs one test.
 *
 * To spare tests, edges are first added in chunks (a chunk that keeps the graph upward planar is kept
 * whole, one that does not is split in halves), so k dropped edges out of m cost O(k · log m + 1)
 * tests rather than m; the outcome is the same as one edge at a time in the same order, because
 * a chunk is kept whole only when each of its edges would have been kept at its turn (subgraph
 * closure again).
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {testUpwardPlanarity, type UpwardBudget} from '../upward/index.ts'
import type {UpwardEmbedding} from '../upward/upward-embedding.ts'

/**
 * An extra condition on a candidate subgraph that the exact test found upward planar: `ids` are its
 * edges (edge i of `sub` is edge ids[i] of g), `upward` the embedding the test found. The fallback
 * drawing uses it to keep only subgraphs whose st-augmentation leaves room for the dropped edges.
 * With such a condition the result is maximal only with respect to test-and-condition.
 */
export type SubgraphCondition = (ids: readonly number[], sub: Digraph, upward: UpwardEmbedding) => boolean

export interface UpwardSubgraph {
  /** Edge ids left out, ascending. */
  dropped: number[]
  /** False when some test ran out of budget (its edges were left out; maximality is then not proven). */
  maximal: boolean
  /** True when one edge is dropped from a graph that is not upward planar: no smaller fix exists. */
  exact: boolean
}

/** g must be acyclic. `order` lists every edge id once (default: ascending); see SubgraphCondition. */
export function maximalUpwardSubgraph(g: Digraph, budget?: Readonly<UpwardBudget>, order?: readonly number[], condition?: SubgraphCondition): UpwardSubgraph {
  const now = budget?.now ?? (() => performance.now())
  const deadline = now() + (budget?.maxMillis ?? 3000)
  const sequence = order ?? [...Array(g.edgeCount).keys()]
  const kept: number[] = []
  const dropped: number[] = []
  let maximal = true
  const test = (extra: readonly number[]): 'yes' | 'no' | 'undecided' => {
    // Past the deadline no test can finish: answer at once instead of starting one per chunk.
    if (now() > deadline) return 'undecided'
    const ids = [...kept, ...extra]
    const sub = createDigraph(g.vertexCount, ids.map((e) => [g.tail[e]!, g.head[e]!] as const))
    const r = testUpwardPlanarity(sub, {maxMillis: Math.max(0, deadline - now()), now})
    if (r.status === 'upward') return !condition || condition(ids, sub, r.upward) ? 'yes' : 'no'
    return r.status === 'not-upward' ? 'no' : 'undecided'
  }
  // Work list of chunks, earliest first.
  const stack: number[][] = [[...sequence]]
  while (stack.length > 0) {
    const chunk = stack.pop()!
    if (chunk.length === 0) continue
    const verdict = test(chunk)
    if (verdict === 'yes') {
      kept.push(...chunk)
      continue
    }
    if (chunk.length === 1) {
      dropped.push(chunk[0]!)
      if (verdict === 'undecided') maximal = false
      continue
    }
    const half = chunk.length >> 1
    stack.push(chunk.slice(half), chunk.slice(0, half))
  }
  dropped.sort((a, b) => a - b)
  return {dropped, maximal, exact: maximal && dropped.length <= 1}
}
