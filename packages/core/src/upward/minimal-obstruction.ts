/**
 * An edge-minimal obstruction to upward planarity: a set of edges whose subgraph is not upward
 * planar while dropping any one of them leaves an upward planar subgraph.
 *
 * Deletion filter (common practice for minimal certificates, e.g. minimal infeasible subsystems):
 * walk the edges once, dropping each edge whose removal keeps the rest non-upward. A kept edge e was
 * needed at its turn: S − e was upward there, and the final set minus e is a subgraph of S − e, so it
 * is upward too (upward planarity is closed under taking subgraphs). For a nonplanar graph the walk
 * starts from the planarity test's Kuratowski subgraph, which is already non-upward and small.
 * Time: one exact test per edge of the starting set, all within one budget.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {testPlanarity} from '../planarity/test-planarity.ts'
import {testUpwardPlanarity, type UpwardBudget} from './test-upward-planarity.ts'

export type MinimalObstructionResult = {ok: true; edges: number[]} | {ok: false; reason: 'budget' | 'upward'}

export function findMinimalObstruction(g: Digraph, budget?: Readonly<UpwardBudget>): MinimalObstructionResult {
  const now = budget?.now ?? (() => performance.now())
  const deadline = now() + (budget?.maxMillis ?? 3000)
  const left = (): UpwardBudget => ({maxMillis: Math.max(0, deadline - now()), now})

  let keep: number[]
  const planar = testPlanarity(g)
  if (!planar.planar) keep = [...planar.kuratowski.edges]
  else {
    const whole = testUpwardPlanarity(g, left())
    if (whole.status === 'undecided') return {ok: false, reason: 'budget'}
    if (whole.status === 'upward') return {ok: false, reason: 'upward'}
    keep = Array.from({length: g.edgeCount}, (_, e) => e)
  }
  const sub = (edges: readonly number[]) => createDigraph(g.vertexCount, edges.map((e) => [g.tail[e]!, g.head[e]!] as const))
  for (let i = 0; i < keep.length; ) {
    if (now() > deadline) return {ok: false, reason: 'budget'}
    const without = keep.filter((_, j) => j !== i)
    const r = testUpwardPlanarity(sub(without), left())
    if (r.status === 'undecided') return {ok: false, reason: 'budget'}
    if (r.status === 'not-upward') keep = without
    else i++
  }
  return {ok: true, edges: keep}
}
