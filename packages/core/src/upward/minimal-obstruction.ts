/**
 * An edge-minimal obstruction to upward planarity: a set of edges whose subgraph is not upward
 * planar while dropping any one of them leaves an upward planar subgraph.
 *
 * Deletion filter (common practice for minimal certificates, e.g. minimal infeasible subsystems):
 * drop chunks of edges while the rest stays non-upward, then walk the edges one at a time, dropping
 * each edge whose removal keeps the rest non-upward. A kept edge e was needed at its turn: S − e was
 * upward there, and the final set minus e is a subgraph of S − e, so it is upward too (upward
 * planarity is closed under taking subgraphs). For a nonplanar graph the walk
 * starts from the planarity test's Kuratowski subgraph, which is already non-upward and small; for a
 * planar graph, from the reduced core (reduce.ts) of a failing component with its merged edges
 * expanded back into paths, which is not upward either since the reductions preserve the answer.
 * Time: one exact test per component core, then one per chunk tried: O(k·log N) tests for k kept
 * edges out of N, all within one budget.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {testPlanarity} from '../planarity/test-planarity.ts'
import {reduceComponent} from './reduce.ts'
import {testUpwardPlanarity, weakComponents, type UpwardBudget} from './test-upward-planarity.ts'

export type MinimalObstructionResult = {ok: true; edges: number[]} | {ok: false; reason: 'budget' | 'upward'}

/** g must be acyclic (RangeError otherwise, as for testUpwardPlanarity). */
export function findMinimalObstruction(g: Digraph, budget?: Readonly<UpwardBudget>): MinimalObstructionResult {
  const now = budget?.now ?? (() => performance.now())
  const deadline = now() + (budget?.maxMillis ?? 3000)
  const left = (): UpwardBudget => ({maxMillis: Math.max(0, deadline - now()), now})

  const sub = (edges: readonly number[]) => createDigraph(g.vertexCount, edges.map((e) => [g.tail[e]!, g.head[e]!] as const))
  let keep: number[]
  const planar = testPlanarity(g)
  if (!planar.planar) keep = [...planar.kuratowski.edges]
  else {
    // The first component whose reduced core is not upward; the reductions preserve the answer, so
    // when every core is upward so is g.
    let found: number[] | null = null
    for (const comp of weakComponents(g)) {
      const core = expandedCore(g, comp)
      const r = testUpwardPlanarity(sub(core), left())
      if (r.status === 'undecided') return {ok: false, reason: 'budget'}
      if (r.status === 'not-upward') {
        found = core
        break
      }
    }
    if (found === null) return {ok: false, reason: 'upward'}
    keep = found
  }
  // Chunks first (halving down to single edges, in the manner of delta debugging), since most
  // edges of the start set can go; the last pass, one edge at a time, gives the minimality argument.
  for (let chunk = Math.max(1, keep.length >> 2); ; chunk = Math.max(1, chunk >> 1)) {
    for (let i = 0; i < keep.length; ) {
      if (now() > deadline) return {ok: false, reason: 'budget'}
      const without = [...keep.slice(0, i), ...keep.slice(i + chunk)]
      const r = testUpwardPlanarity(sub(without), left())
      if (r.status === 'undecided') return {ok: false, reason: 'budget'}
      if (r.status === 'not-upward') keep = without
      else i += chunk
    }
    if (chunk === 1) break
  }
  return {ok: true, edges: keep}
}

/** g's edges making up the reduced core of one component: merged edges stand for paths of g. */
function expandedCore(g: Digraph, comp: readonly number[]): number[] {
  const red = reduceComponent(g, comp)
  const parts = new Map<number, [number, number]>()
  for (const s of red.steps) if (s.kind === 'subdivide') parts.set(s.merged, [s.inEdge, s.outEdge])
  const out: number[] = []
  const stack = [...red.coreEdges]
  while (stack.length > 0) {
    const e = stack.pop()!
    const p = parts.get(e)
    if (p === undefined) out.push(e)
    else stack.push(...p)
  }
  return out.sort((x, y) => x - y)
}
