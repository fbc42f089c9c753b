/**
 * One fuzz case through the whole pipeline (parse → check → draw → SVG), with every answer re-checked
 * by a checker that shares no code with the stage that produced it. Returns problems as strings (no
 * `expect`), so both the vitest file and `pnpm fuzz` (bench/fuzz.ts) can use it.
 *
 * Checks, per case:
 * - nothing throws;
 * - every diagnostic (and related) range lies inside the body, and its line/column agree with a
 *   reference computation from its offset (split on CRLF, CR, LF; a BOM at offset 0 not counted);
 * - the budget: the check runs on a tick clock (each `now()` call advances one unit); it may read the
 *   clock only a bounded number of times past its deadline, and `undecided` only after the deadline;
 * - `upward`: the drawing passes the independent geometric checker (support/geometry-check.ts), the
 *   st-augmentation passes verifyStGraph against the upward embedding, and the SVG holds exactly the
 *   label lines as text (nothing escaped out of or into the markup);
 * - `cycle`: the certificate, mapped back to vertex and edge ids, passes verifyCycle;
 * - `nonplanar`: the Kuratowski certificate passes verifyKuratowski;
 * - `not-upward`: the obstruction is not upward planar (testUpwardPlanarity on the subgraph) and, when
 *   reported minimal, each edge removed leaves an upward planar graph; for at most 7 vertices also by
 *   the brute-force oracle (support/upward-oracle.ts);
 * - `syntax` and `too-large`: at least one error, of a parse or limit rule.
 */
import {verifyCycle} from '../../src/acyclic/index.ts'
import {verifyStGraph} from '../../src/augment/index.ts'
import {checkDiagram, type DiagramCheck} from '../../src/check/index.ts'
import {limitRuleIds, type Limits} from '../../src/check/limits.ts'
import {drawDiagram, EDGE_LABEL_BOX, TIER_CAPTION_BOX} from '../../src/draw/index.ts'
import {createDigraph, type Digraph} from '../../src/graph/digraph.ts'
import {labelBox} from '../../src/measure/index.ts'
import {parseRuleIds, type Flow} from '../../src/parse/index.ts'
import {verifyKuratowski} from '../../src/planarity/index.ts'
import type {Point, SourceRange} from '../../src/source-range.ts'
import {testUpwardPlanarity} from '../../src/upward/index.ts'
import {renderSvg} from '../../../svg/src/index.ts'
import {checkDecoratedDrawing} from './decorated-check.ts'
import {isUpwardPlanarBruteForce} from './upward-oracle.ts'

export type Outcome = DiagramCheck['status'] | 'threw'

export interface CaseResult {
  outcome: Outcome
  problems: string[]
  /** Clock reads after the deadline had passed. */
  lateReads: number
}

export interface CaseSettings {
  /** Budget in clock ticks (each `now()` call is one tick). */
  budgetTicks: number
  flow?: Flow
  limits?: Partial<Limits>
  /** Draw and render passing diagrams (default true). */
  draw?: boolean
  /** Re-check obstructions edge by edge (default true). */
  recheckObstructions?: boolean
}

/** Clock reads allowed past the deadline: each stage checks once more before it stops. */
export const lateReadAllowance = 64

const knownRules = new Set<string>([...parseRuleIds, ...limitRuleIds, 'cycle', 'nonplanar', 'not-upward', 'undecided', 'tiers-not-drawable', 'path-against-tiers'])

export function referencePoint(text: string, offset: number): {line: number; column: number} {
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0
  const lines = text.slice(Math.min(bom, offset), offset).split(/\r\n|\r|\n/)
  return {line: lines.length, column: lines.at(-1)!.length + 1}
}

function checkPoint(text: string, p: Point, what: string, problems: string[]): void {
  if (!(Number.isInteger(p.offset) && p.offset >= 0 && p.offset <= text.length)) {
    problems.push(`${what}: offset ${p.offset} outside the body (length ${text.length})`)
    return
  }
  const ref = referencePoint(text, p.offset)
  if (ref.line !== p.line || ref.column !== p.column) {
    problems.push(`${what}: ${p.line}:${p.column} at offset ${p.offset}, expected ${ref.line}:${ref.column}`)
  }
}

function checkRange(text: string, r: SourceRange, what: string, problems: string[]): void {
  checkPoint(text, r.start, `${what} start`, problems)
  checkPoint(text, r.end, `${what} end`, problems)
  if (r.start.offset > r.end.offset) problems.push(`${what}: start after end`)
}

function tickClock(): {now: () => number; reads: () => number} {
  let t = 0
  return {now: () => ++t, reads: () => t}
}

/** Vertex and edge ids of a user-vocabulary certificate: keys are unique, and edges are simple. */
function idsOf(check: DiagramCheck): {vertex: Map<string, number>; edge: Map<string, number>} {
  const vertex = new Map(check.parsed.vertices.map((v, i) => [v.key, i]))
  const edge = new Map(check.parsed.edges.map((e, i) => [`${e.from},${e.to}`, i]))
  return {vertex, edge}
}

function subgraph(g: Digraph, edges: readonly number[]): Digraph {
  return createDigraph(
    g.vertexCount,
    edges.map((e) => [g.tail[e]!, g.head[e]!] as const)
  )
}

/** The part of a hast node these checks read. */
interface HastNode {
  type: string
  tagName?: string
  value?: string
  children?: HastNode[]
}

function textsOf(node: HastNode, into: string[], inText = false): void {
  if (node.type === 'text') {
    if (inText) into.push(node.value ?? '')
    return
  }
  const isText = node.type === 'element' && (node.tagName === 'text' || node.tagName === 'tspan')
  for (const child of node.children ?? []) textsOf(child, into, inText || isText)
}

function countElements(node: HastNode, name: string): number {
  let count = node.type === 'element' && node.tagName === name ? 1 : 0
  for (const child of node.children ?? []) count += countElements(child, name)
  return count
}

export function runCase(text: string, settings: CaseSettings): CaseResult {
  const problems: string[] = []
  const clock = tickClock()
  let deadline = 0
  const now = (): number => {
    const t = clock.now()
    if (deadline === 0) deadline = t + settings.budgetTicks
    return t
  }
  let check: DiagramCheck
  try {
    check = checkDiagram(text, {budgetMillis: settings.budgetTicks, now, limits: settings.limits})
  } catch (error) {
    return {outcome: 'threw', problems: [`checkDiagram threw: ${error instanceof Error ? error.stack : String(error)}`], lateReads: 0}
  }
  const lateReads = Math.max(0, clock.reads() - deadline)
  if (lateReads > lateReadAllowance) problems.push(`read the clock ${lateReads} times after the deadline`)
  if (check.status === 'undecided' && clock.reads() <= deadline) problems.push('undecided before the deadline')

  check.diagnostics.forEach((d, i) => {
    checkRange(text, d.range, `diagnostic ${i} (${d.ruleId})`, problems)
    d.related?.forEach((r, j) => checkRange(text, r.range, `diagnostic ${i} related ${j}`, problems))
    if (!knownRules.has(d.ruleId)) problems.push(`unknown rule id ${d.ruleId}`)
    if (!d.reason) problems.push(`diagnostic ${i} has no reason`)
  })
  const errors = check.diagnostics.filter((d) => d.severity === 'error')
  if (check.status === 'upward' && errors.length > 0) problems.push('upward with errors')
  if (check.status !== 'upward' && errors.length === 0) problems.push(`${check.status} without an error`)

  try {
    verifyOutcome(check, settings, problems)
  } catch (error) {
    problems.push(`a later stage threw: ${error instanceof Error ? error.stack : String(error)}`)
    return {outcome: 'threw', problems, lateReads}
  }
  return {outcome: check.status, problems, lateReads}
}

function verifyOutcome(check: DiagramCheck, settings: CaseSettings, problems: string[]): void {
  const g = check.graph
  switch (check.status) {
    case 'upward': {
      if (!g || !check.upward) return void problems.push('upward without graph or embedding')
      if (settings.draw === false) return
      const drawn = drawDiagram(check, {flow: settings.flow ?? 'up'})
      if (!drawn.ok) return void problems.push('a passing diagram could not be drawn')
      const {layout, st, labels, ids, edgeLabels, tiers} = drawn.drawing
      const st1 = verifyStGraph(g, st, check.upward.embedding)
      if (!st1.ok) problems.push(`st-augmentation: ${st1.reason}`)
      const boxes = labels.map((label) => labelBox(label))
      // Edge-label boxes and tier rows too (support/decorated-check.ts).
      const labelBoxes = edgeLabels.map((label) => labelBox(label.text, EDGE_LABEL_BOX))
      const geometry = checkDecoratedDrawing(g, layout, {boxes, labels: edgeLabels, labelBoxes, tiers, level: check.levels?.level})
      if (!geometry.ok) problems.push(`drawing: ${geometry.problems.join('; ')}`)
      const rendered = renderSvg({layout, graph: g, labels, ids, edgeLabels, tiers})
      if (!rendered.svg.startsWith('<svg')) problems.push('SVG does not start with <svg')
      if (countElements(rendered.hast as HastNode, 'svg') !== 1) problems.push('not exactly one <svg> element')
      for (const forbidden of ['script', 'foreignObject', 'a', 'iframe']) {
        if (countElements(rendered.hast as HastNode, forbidden) > 0) problems.push(`SVG holds a <${forbidden}> element`)
      }
      const drawnTexts = [] as string[]
      textsOf(rendered.hast as HastNode, drawnTexts)
      const expected = [
        ...labels.flatMap((label) => labelBox(label).lines.filter((line) => line !== '')),
        ...edgeLabels.flatMap((label) => labelBox(label.text, EDGE_LABEL_BOX).lines.filter((line) => line !== '')),
        ...tiers.flatMap((tier) => labelBox(tier.text, TIER_CAPTION_BOX).lines.filter((line) => line !== ''))
      ]
      if (JSON.stringify([...drawnTexts].sort()) !== JSON.stringify([...expected].sort())) {
        problems.push(`SVG text ${JSON.stringify(drawnTexts)} is not the label lines ${JSON.stringify(expected)}`)
      }
      return
    }
    case 'cycle': {
      const c = check.certificate
      if (!g || c?.kind !== 'cycle') return void problems.push('cycle without graph or cycle certificate')
      const {vertex, edge} = idsOf(check)
      const vertices = c.vertices.map((k) => vertex.get(k) ?? -1)
      const edges = vertices.map((v, i) => edge.get(`${v},${vertices[(i + 1) % vertices.length]}`) ?? -1)
      const r = verifyCycle(g, {vertices, edges})
      if (!r.ok) problems.push(`cycle certificate: ${r.reason}`)
      return
    }
    case 'nonplanar': {
      const c = check.certificate
      if (!g || c?.kind !== 'kuratowski') return void problems.push('nonplanar without graph or Kuratowski certificate')
      const {vertex, edge} = idsOf(check)
      const edges = c.edges.map(([a, b]) => edge.get(`${vertex.get(a)},${vertex.get(b)}`) ?? -1).sort((x, y) => x - y)
      const r = verifyKuratowski(g, {type: c.type, branch: c.branch.map((k) => vertex.get(k) ?? -1), edges})
      if (!r.ok) problems.push(`Kuratowski certificate: ${r.reason}`)
      return
    }
    case 'not-upward': {
      const c = check.certificate
      const {vertex, edge} = idsOf(check)
      if (c?.kind === 'level') {
        // Tiers: the named edges must be edges of the diagram (the level certificate has its own tests).
        if (c.edges.length === 0 || c.edges.some(([a, b]) => !edge.has(`${vertex.get(a)},${vertex.get(b)}`))) {
          problems.push('level certificate names an edge the diagram lacks')
        }
        return
      }
      if (!g || c?.kind !== 'obstruction') return void problems.push('not-upward without graph or obstruction')
      const edges = c.edges.map(([a, b]) => edge.get(`${vertex.get(a)},${vertex.get(b)}`) ?? -1)
      if (edges.some((e) => e < 0)) return void problems.push('obstruction names an edge the diagram lacks')
      const whole = testUpwardPlanarity(subgraph(g, edges), {maxMillis: 60_000})
      if (whole.status !== 'not-upward') problems.push(`the obstruction is ${whole.status}`)
      const minimal = check.diagnostics.some((d) => d.ruleId === 'not-upward' && d.reason.includes('removing any one'))
      const small = g.vertexCount <= 7 && edges.length <= 12
      if (small) {
        const pairs = edges.map((e) => [g.tail[e]!, g.head[e]!] as const)
        if (isUpwardPlanarBruteForce(g.vertexCount, pairs)) problems.push('the oracle finds the obstruction upward planar')
      }
      if (!minimal || settings.recheckObstructions === false) return
      for (let i = 0; i < edges.length; i++) {
        const rest = edges.filter((_, j) => j !== i)
        const r = testUpwardPlanarity(subgraph(g, rest), {maxMillis: 60_000})
        if (r.status !== 'upward') problems.push(`obstruction minus edge ${edges[i]} is ${r.status}`)
        if (small && !isUpwardPlanarBruteForce(g.vertexCount, rest.map((e) => [g.tail[e]!, g.head[e]!] as const))) {
          problems.push(`the oracle finds the obstruction minus edge ${edges[i]} not upward planar`)
        }
      }
      return
    }
    case 'syntax':
      if (!check.diagnostics.some((d) => d.severity === 'error' && (parseRuleIds as readonly string[]).includes(d.ruleId))) {
        problems.push('syntax without a parse error')
      }
      return
    case 'too-large':
      if (!check.diagnostics.some((d) => (limitRuleIds as readonly string[]).includes(d.ruleId))) problems.push('too-large without a limit rule')
      return
    case 'undecided':
      return
  }
}
