/**
 * The pipeline for one diagram body: parse → graph → acyclic? → planar? → upward planar?
 * Each stage either passes its witness on or stops with a certificate and messages that point at the
 * writer's own lines. Stages only read what earlier stages produced; nothing reaches back.
 */
import {findCycle} from '../acyclic/index.ts'
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {parseDiagram, type ParsedDiagram} from '../parse/index.ts'
import type {Diagnostic} from '../source-range.ts'
import type {Certificate, DiagramStatus} from './certificate.ts'
import {testPlanarity} from '../planarity/index.ts'
import {findMinimalObstruction, testUpwardPlanarity, type UpwardEmbedding} from '../upward/index.ts'
import {cycleFailure, kuratowskiFailure, obstructionFailure, undecidedDiagnostic} from './failures.ts'
import {checkParsedLimits, checkTextLimits, resolveLimits, tooManyEdges, type Limits} from './limits.ts'

export interface CheckSettings {
  /** Milliseconds the upward test may spend on this diagram before answering `undecided`. */
  budgetMillis?: number
  /** Clock for the budget (injectable for tests); defaults to `performance.now`. */
  now?: () => number
  /** Size limits (each field defaults to `defaultLimits`); past one, the status is `too-large`. */
  limits?: Readonly<Partial<Limits>> | undefined
}

export const defaultBudgetMillis = 3000

export interface DiagramCheck {
  status: DiagramStatus
  /** Errors and warnings in diagram-body coordinates, parse warnings first. */
  diagnostics: Diagnostic[]
  certificate?: Certificate
  parsed: ParsedDiagram
  /** The graph, once the text parsed: vertex i is `parsed.vertices[i]`, edge j is `parsed.edges[j]`. */
  graph?: Digraph
  /** For status `upward`: the upward embedding the drawing is built from. */
  upward?: UpwardEmbedding
}

export function checkDiagram(text: string, settings: Readonly<CheckSettings> = {}): DiagramCheck {
  const now = settings.now ?? (() => performance.now())
  const budgetMillis = settings.budgetMillis ?? defaultBudgetMillis
  const deadline = now() + budgetMillis
  const limits = resolveLimits(settings.limits)
  // Size limits first: the parser only sees bodies of bounded size with bounded lines.
  const textLimits = checkTextLimits(text, limits)
  if (textLimits.length > 0) return {status: 'too-large', diagnostics: textLimits, parsed: {vertices: [], edges: [], diagnostics: []}}
  const parsed = parseDiagram(text, {maxEdges: limits.maxEdges})
  const overLimits = checkParsedLimits(parsed, limits)
  if (parsed.edgeLimitReached) overLimits.push(tooManyEdges(parsed.edgeLimitReached, limits.maxEdges))
  if (overLimits.length > 0) {
    const all = [...parsed.diagnostics, ...overLimits].sort((a, b) => a.range.start.offset - b.range.start.offset)
    return {status: 'too-large', diagnostics: all, parsed}
  }
  const diagnostics = [...parsed.diagnostics]
  if (diagnostics.some((d) => d.severity === 'error')) return {status: 'syntax', diagnostics, parsed}

  const graph = createDigraph(
    parsed.vertices.length,
    parsed.edges.map((e) => [e.from, e.to] as const)
  )
  const acyclic = findCycle(graph)
  if (!acyclic.acyclic) {
    const failure = cycleFailure(parsed, acyclic.cycle)
    return {status: 'cycle', diagnostics: [...diagnostics, failure.diagnostic], certificate: failure.certificate, parsed, graph}
  }

  const planarity = testPlanarity(graph)
  if (!planarity.planar) {
    const failure = kuratowskiFailure(parsed, planarity.kuratowski)
    return {status: 'nonplanar', diagnostics: [...diagnostics, failure.diagnostic], certificate: failure.certificate, parsed, graph}
  }

  const upward = testUpwardPlanarity(graph, {maxMillis: deadline - now(), now})
  if (upward.status === 'upward') return {status: 'upward', diagnostics, parsed, graph, upward: upward.upward}
  if (upward.status === 'undecided') {
    return {status: 'undecided', diagnostics: [...diagnostics, undecidedDiagnostic(parsed, budgetMillis)], parsed, graph}
  }
  // Not upward: narrow it down to an edge-minimal obstruction with what is left of the budget.
  const obstruction = findMinimalObstruction(graph, {maxMillis: Math.max(0, deadline - now()), now})
  const edges = obstruction.ok ? obstruction.edges : [...Array(graph.edgeCount).keys()]
  const failure = obstructionFailure(parsed, edges, obstruction.ok)
  return {status: 'not-upward', diagnostics: [...diagnostics, failure.diagnostic], certificate: failure.certificate, parsed, graph}
}
