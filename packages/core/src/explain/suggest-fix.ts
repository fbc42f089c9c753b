/**
 * The concrete fix offered with each failure: which edges to remove.
 * - cycle: a smallest feedback arc set (feedback-arc-set.ts; exact up to 20 vertices per strongly
 *   connected component, the Eades–Lin–Smyth heuristic beyond);
 * - nonplanar: a minimal planarizing set (planarizing-set.ts);
 * - not-upward: the complement of a maximal upward planar subgraph grown in written order
 *   (upward-subgraph.ts), so putting back any one of the removed edges breaks it again.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import type {ParsedDiagram} from '../parse/index.ts'
import type {UserEdge} from '../check/certificate.ts'
import type {Diagnostic} from '../source-range.ts'
import type {UpwardBudget} from '../upward/index.ts'
import {feedbackArcSet} from './feedback-arc-set.ts'
import {planarizingSet} from './planarizing-set.ts'
import {maximalUpwardSubgraph} from './upward-subgraph.ts'

export interface Fix {
  /** What removing `edges` achieves: no cycle, a planar graph, or an upward planar one. */
  goal: 'acyclic' | 'planar' | 'upward'
  /** Parsed edge ids, ascending. */
  edges: number[]
  /** True when no smaller set of edges does it. */
  exact: boolean
}

/** The fix as the CLI's JSON carries it: `{"remove": [["u","v"], …], "exact": …}`. */
export interface UserFix {
  remove: UserEdge[]
  exact: boolean
}

export function suggestFix(status: string, graph: Digraph, budget?: Readonly<UpwardBudget>): Fix | undefined {
  if (status === 'cycle') {
    const fas = feedbackArcSet(graph)
    return {goal: 'acyclic', edges: fas.edges, exact: fas.exact}
  }
  if (status === 'nonplanar') {
    const set = planarizingSet(graph)
    return {goal: 'planar', edges: set.edges, exact: set.exact}
  }
  if (status === 'not-upward') {
    const sub = maximalUpwardSubgraph(graph, budget)
    return {goal: 'upward', edges: sub.dropped, exact: sub.exact}
  }
  return undefined
}

export function userFix(parsed: ParsedDiagram, fix: Fix): UserFix {
  return {remove: fix.edges.map((e) => [parsed.vertices[parsed.edges[e]!.from]!.key, parsed.vertices[parsed.edges[e]!.to]!.key]), exact: fix.exact}
}

/** The sentence added to the failure's reason. */
export function fixSentence(parsed: ParsedDiagram, fix: Fix): string {
  const names = fix.edges.map((e) => `\`${parsed.vertices[parsed.edges[e]!.from]!.key} -> ${parsed.vertices[parsed.edges[e]!.to]!.key}\``).join(', ')
  const count = fix.edges.length === 1 ? 'this edge' : `these ${fix.edges.length} edges`
  const effect =
    fix.goal === 'acyclic' ? 'removes every cycle' : fix.goal === 'planar' ? 'lets the diagram be drawn without crossings if arrows could point any way' : 'makes the diagram drawable'
  const size = fix.exact ? (fix.edges.length === 1 ? '' : ' (no fewer edges will do)') : ''
  return `Suggested fix: dropping ${count} ${effect}${size}: ${names}.`
}

/** The note's extra sentence: how the fix was found. */
export function fixNote(fix: Fix): string {
  if (fix.goal === 'acyclic') {
    return fix.exact
      ? 'The suggested edges are a smallest feedback arc set (exact, by dynamic programming over vertex orders); reversing them instead of dropping them also removes every cycle.'
      : 'The suggested edges are a small feedback arc set (Eades, Lin & Smyth 1993 heuristic, not proven smallest); reversing them instead of dropping them also removes every cycle.'
  }
  if (fix.goal === 'planar') return 'The suggested edges were found by removing one edge of each Kuratowski subgraph in turn and putting back every edge that could return; no single one of them can go back, but a smaller set may exist.'
  return 'The suggested edges are what is left out when the edges are added in written order, each kept if the diagram stays drawable; putting back any one of them breaks the drawing again. A different choice of edges may be smaller.'
}

/** The failing diagnostic with the fix appended, and every suggested edge among its positions. */
export function withFixMessage(diagnostic: Diagnostic, parsed: ParsedDiagram, fix: Fix): Diagnostic {
  const related = [...(diagnostic.related ?? [])]
  for (const e of fix.edges) {
    const edge = parsed.edges[e]!
    related.push({range: edge.range, reason: `suggested: drop \`${parsed.vertices[edge.from]!.key} -> ${parsed.vertices[edge.to]!.key}\``})
  }
  return {
    ...diagnostic,
    reason: `${diagnostic.reason} ${fixSentence(parsed, fix)}`,
    note: diagnostic.note ? `${diagnostic.note} ${fixNote(fix)}` : fixNote(fix),
    related
  }
}

/** The graph without the fix's edges (for checks). */
export function withoutEdges(graph: Digraph, edges: readonly number[]): Digraph {
  const out = new Set(edges)
  const pairs: Array<[number, number]> = []
  for (let e = 0; e < graph.edgeCount; e++) if (!out.has(e)) pairs.push([graph.tail[e]!, graph.head[e]!])
  return createDigraph(graph.vertexCount, pairs)
}
