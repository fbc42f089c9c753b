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
import {cycleFailure, kuratowskiFailure, levelCrossingFailure, obstructionFailure, tierPathFailure, undecidedDiagnostic} from './failures.ts'
import {preferWrittenOrder} from './written-order.ts'
import {assignLevels, joinLabelledEdges, originalEdge, splitLabelledEdges, testLevelPlanarity, type EdgeLabelGraph, type LevelItem} from '../level/index.ts'
import {attachFix, type Fix} from '../explain/attach-fix.ts'
import {checkParsedLimits, checkTextLimits, resolveLimits, tooManyEdges, type Limits} from './limits.ts'

export interface CheckSettings {
  /** Milliseconds the upward test may spend on this diagram before answering `undecided`. */
  budgetMillis?: number
  /** Clock for the budget (injectable for tests); defaults to `performance.now`. */
  now?: () => number
  /** Size limits (each field defaults to `defaultLimits`); past one, the status is `too-large`. */
  limits?: Readonly<Partial<Limits>> | undefined
  /**
   * Where several upward embeddings exist, prefer one whose out-edges, left to right, keep the order
   * they were written in (check/written-order.ts): a tie-break, never a constraint. Default true.
   */
  preferWrittenOrder?: boolean
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
  /**
   * Once the graph is known, when some edge has a label: the graph with each labelled edge split at a
   * label vertex (numbering in level/edge-label-graph.ts: vertex n + k labels `labelledEdges[k]`), and
   * for status `upward` its upward embedding, which places every label vertex. `upward` above is the
   * same embedding with the label vertices taken out.
   */
  labels?: EdgeLabelGraph & {upward?: UpwardEmbedding}
  /**
   * For status `upward` when the diagram declares tiers: the level of every vertex (of `labels.graph`
   * when there are edge labels, else of `graph`), each tier's level, and per level the left-to-right
   * order of its vertices and of the edges passing through it (edge ids of that same graph). Drawn
   * with these levels and orders, every edge going straight from one level to the next, the picture is
   * upward and crossing-free.
   */
  levels?: DiagramLevels
  /**
   * For status `cycle`, `nonplanar` and `not-upward` (without tiers): the edges the message suggests
   * removing (parsed edge ids), see explain/suggest-fix.ts.
   */
  fix?: Fix
}

export interface DiagramLevels {
  level: Int32Array
  tierLevel: Int32Array
  orders: LevelItem[][]
}

export function checkDiagram(text: string, settings: Readonly<CheckSettings> = {}): DiagramCheck {
  // One budget for the whole check: the fix suggestion gets what the stages left, never a fresh one.
  const now = settings.now ?? (() => performance.now())
  const deadline = now() + (settings.budgetMillis ?? defaultBudgetMillis)
  const check = checkStages(text, {...settings, now}, deadline)
  return attachFix(check, {...settings, now, budgetMillis: Math.max(0, deadline - now())})
}

/**
 * After parsing, no stage starts once the deadline has passed: each is linear or worse and does not
 * look at the clock itself, so at 10^4 vertices one started late would overrun a short budget by its
 * whole length. The answer is then `undecided`, as when the search runs out.
 */
function checkStages(text: string, settings: Readonly<CheckSettings>, deadline: number): DiagramCheck {
  const now = settings.now ?? (() => performance.now())
  const budgetMillis = settings.budgetMillis ?? defaultBudgetMillis
  const expired = () => now() > deadline
  const limits = resolveLimits(settings.limits)
  // Size limits first: the parser only sees bodies of bounded size with bounded lines.
  const textLimits = checkTextLimits(text, limits)
  if (textLimits.length > 0) return {status: 'too-large', diagnostics: textLimits, parsed: {vertices: [], edges: [], diagnostics: []}}
  // The parse asks the clock too (every 256 lines): at 10^4 vertices it alone can outlast a short budget.
  const parsed = parseDiagram(text, {maxEdges: limits.maxEdges, expired})
  if (parsed.outOfTime) {
    return {status: 'undecided', diagnostics: [...parsed.diagnostics, undecidedDiagnostic(parsed, budgetMillis)], parsed}
  }
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
  const undecided = (labels?: EdgeLabelGraph): DiagramCheck => ({
    status: 'undecided',
    diagnostics: [...diagnostics, undecidedDiagnostic(parsed, budgetMillis)],
    parsed,
    graph,
    ...(labels ? {labels} : {})
  })
  if (expired()) return undecided()
  const acyclic = findCycle(graph)
  if (!acyclic.acyclic) {
    const failure = cycleFailure(parsed, acyclic.cycle)
    return {status: 'cycle', diagnostics: [...diagnostics, failure.diagnostic], certificate: failure.certificate, parsed, graph}
  }

  if (expired()) return undecided()
  const planarity = testPlanarity(graph)
  if (!planarity.planar) {
    const failure = kuratowskiFailure(parsed, planarity.kuratowski)
    return {status: 'nonplanar', diagnostics: [...diagnostics, failure.diagnostic], certificate: failure.certificate, parsed, graph}
  }

  // Edge labels: run the exact checks on the graph with every labelled edge split at its label.
  const labelled = parsed.edges.flatMap((edge, e) => (edge.label === undefined ? [] : [e]))
  const split = labelled.length > 0 ? splitLabelledEdges(graph, labelled) : undefined
  const work = split?.graph ?? graph
  const withLabels = split ? {labels: split} : {}

  if (expired()) return undecided(split)
  let levels: DiagramLevels | undefined
  if (parsed.tiers) {
    const tiered = checkTiers(parsed, graph, split, work)
    if (!tiered.ok) {
      if (tiered.failure === undefined) return undecided(split)
      return {status: 'not-upward', diagnostics: [...diagnostics, tiered.failure.diagnostic], certificate: tiered.failure.certificate, parsed, graph, ...withLabels}
    }
    levels = tiered.levels
  }

  // Subdividing edges at their labels keeps the graph acyclic and planar: the upward test need not ask.
  const upward = testUpwardPlanarity(work, {maxMillis: deadline - now(), now, preferWrittenOrder: settings.preferWrittenOrder !== false, knownAcyclicPlanar: true})
  if (upward.status === 'upward') {
    // Label vertices have one out-edge and first halves keep their edge ids, so the written order
    // reads the same on the split graph: choose there, then join.
    const splitUpward = settings.preferWrittenOrder === false ? upward.upward : preferWrittenOrder(upward.upward)
    const original = split ? joinLabelledEdges(split, graph, splitUpward) : splitUpward
    return {
      status: 'upward',
      diagnostics,
      parsed,
      graph,
      upward: original,
      ...(split ? {labels: {...split, upward: splitUpward}} : {}),
      ...(levels ? {levels} : {})
    }
  }
  if (upward.status === 'undecided') return undecided(split)
  // A level drawing is an upward drawing, so this cannot happen with levels found.
  if (levels) throw new Error('checkDiagram: a level planar diagram was found not upward planar')
  // Not upward: narrow it down to an edge-minimal obstruction with what is left of the budget.
  const obstruction = findMinimalObstruction(graph, {maxMillis: Math.max(0, deadline - now()), now})
  const edges = obstruction.ok ? obstruction.edges : [...Array(graph.edgeCount).keys()]
  const failure = obstructionFailure(parsed, edges, obstruction.ok)
  return {status: 'not-upward', diagnostics: [...diagnostics, failure.diagnostic], certificate: failure.certificate, parsed, graph, ...withLabels}
}

type TierCheck = {ok: true; levels: DiagramLevels} | {ok: false; failure: ReturnType<typeof levelCrossingFailure> | undefined}

/**
 * Tiers: levels for every vertex (level/level-assignment.ts), then exact level planarity on them. A
 * "no" is narrowed to an edge-minimal set by deleting edges one at a time while the rest stays non-level
 * planar (on the same levels), as long as the set is small.
 */
function checkTiers(parsed: ParsedDiagram, graph: Digraph, split: EdgeLabelGraph | undefined, work: Digraph): TierCheck {
  const n = parsed.vertices.length
  const tierOf = new Int32Array(work.vertexCount).fill(-1)
  // Ties go to the written order: a tier's listing first, then first mention; a label sits with its edge.
  const rank = new Float64Array(work.vertexCount)
  parsed.vertices.forEach((vertex, v) => {
    if (vertex.tier !== undefined) tierOf[v] = vertex.tier
    rank[v] = n + v
  })
  for (const tier of parsed.tiers!) tier.vertices.forEach((v, i) => (rank[v] = i))
  split?.labelledEdges.forEach((e, k) => (rank[n + k] = rank[graph.tail[e]!]! + 0.5))
  const toParsed = (e: number): number => (split ? originalEdge(split, graph, e) : e)
  const unique = (edges: number[]): number[] => [...new Set(edges.map(toParsed))]

  const assigned = assignLevels(work, tierOf, parsed.tiers!.length)
  if (!assigned.ok) return {ok: false, failure: tierPathFailure(parsed, unique(assigned.path))}
  const result = testLevelPlanarity(work, assigned.level, {rank})
  if (result.status === 'planar') return {ok: true, levels: {level: assigned.level, tierLevel: assigned.tierLevel, orders: result.orders}}
  if (result.status === 'undecided') return {ok: false, failure: undefined}

  let kept = unique(result.edges).sort((a, b) => a - b)
  const minimal = kept.length <= 200
  if (minimal) {
    const stillFails = (edges: number[]): boolean => {
      const keep = new Set(edges)
      const pairs: Array<[number, number]> = []
      for (let e = 0; e < work.edgeCount; e++) if (keep.has(toParsed(e))) pairs.push([work.tail[e]!, work.head[e]!])
      return testLevelPlanarity(createDigraph(work.vertexCount, pairs), assigned.level, {rank}).status === 'not-planar'
    }
    for (const e of [...kept]) {
      const without = kept.filter((f) => f !== e)
      if (stillFails(without)) kept = without
    }
  }
  return {ok: false, failure: levelCrossingFailure(parsed, kept, minimal)}
}
