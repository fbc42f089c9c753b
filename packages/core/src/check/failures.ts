/**
 * Certificates turned into messages a writer can act on: a plain reason, the theory in a note, the
 * primary position, and every involved edge's position.
 */
import type {Cycle} from '../acyclic/index.ts'
import type {ParsedDiagram} from '../parse/index.ts'
import type {KuratowskiSubgraph} from '../planarity/index.ts'
import type {Diagnostic} from '../source-range.ts'
import type {Certificate} from './certificate.ts'
import {edgeName, plural, vertexName} from './describe.ts'

export interface Failure {
  diagnostic: Diagnostic
  certificate: Certificate
}

export function cycleFailure(parsed: ParsedDiagram, cycle: Cycle): Failure {
  const names = cycle.vertices.map((v) => vertexName(parsed, v))
  const closing = cycle.edges[cycle.edges.length - 1]!
  const loop = cycle.vertices.length === 1
  const walk = [...names, names[0]!].join(' -> ')
  const reason = loop
    ? `\`${walk}\` points ${names[0]} at itself, so its arrow cannot point the same way as the others.`
    : `These ${cycle.edges.length} edges form a cycle \`${walk}\`, so they cannot all point the same way.`
  return {
    certificate: {kind: 'cycle', vertices: names},
    diagnostic: {
      severity: 'error',
      ruleId: 'cycle',
      reason,
      range: parsed.edges[closing]!.range,
      note: 'A drawing in which every arrow points one way orders the vertices along that direction; a cycle would have to return to where it started. Remove or reverse one edge of the cycle.',
      related: cycle.edges.map((e) => ({range: parsed.edges[e]!.range, reason: `\`${edgeName(parsed, e)}\` is on the cycle`}))
    }
  }
}

export function kuratowskiFailure(parsed: ParsedDiagram, k: KuratowskiSubgraph): Failure {
  const edges = k.edges.map((e) => [vertexName(parsed, parsed.edges[e]!.from), vertexName(parsed, parsed.edges[e]!.to)] as [string, string])
  const branch = k.branch.map((v) => vertexName(parsed, v))
  const shape =
    k.type === 'K5'
      ? `five vertices (${branch.join(', ')}) each joined to every other`
      : `two groups of three (${branch.slice(0, 3).join(', ')} and ${branch.slice(3).join(', ')}) with each vertex of one joined to each of the other`
  // Point at the edge written last: the likeliest to be the change that broke the diagram.
  const last = k.edges.reduce((a, b) => (parsed.edges[b]!.range.start.offset > parsed.edges[a]!.range.start.offset ? b : a))
  return {
    certificate: {kind: 'kuratowski', type: k.type, branch, edges},
    diagnostic: {
      severity: 'error',
      ruleId: 'nonplanar',
      reason: `These ${plural(k.edges.length, 'edge')} form a subdivided ${k.type}, so no drawing of them avoids a crossing.`,
      range: parsed.edges[last]!.range,
      note: `They connect ${shape}, directly or through chains of other vertices; by Kuratowski's theorem (1930) no such pattern can be drawn in the plane without two lines crossing, whichever way the arrows point. Removing one of these edges breaks the pattern.`,
      related: k.edges.map((e) => ({range: parsed.edges[e]!.range, reason: `\`${edgeName(parsed, e)}\` is part of the ${k.type}`}))
    }
  }
}

export function obstructionFailure(parsed: ParsedDiagram, edges: number[], minimal: boolean): Failure {
  const userEdges = edges.map((e) => [vertexName(parsed, parsed.edges[e]!.from), vertexName(parsed, parsed.edges[e]!.to)] as [string, string])
  const last = edges.reduce((a, b) => (parsed.edges[b]!.range.start.offset > parsed.edges[a]!.range.start.offset ? b : a))
  const reason = minimal
    ? `These ${plural(edges.length, 'edge')} cannot all point the same way without two of them crossing; removing any one of them, e.g. \`${edgeName(parsed, last)}\`, makes them drawable.`
    : `These ${plural(edges.length, 'edge')} cannot all point the same way without two of them crossing (the time budget ran out before the smallest such set was found).`
  return {
    certificate: {kind: 'obstruction', edges: userEdges},
    diagnostic: {
      severity: 'error',
      ruleId: 'not-upward',
      reason,
      range: parsed.edges[last]!.range,
      note: 'The diagram has no cycle and could be drawn without crossings if arrows were free to point any way, but no crossing-free drawing keeps every arrow pointing the same way (it is not upward planar). Removing or reversing one of these edges, or splitting the diagram, fixes it.',
      related: edges.map((e) => ({range: parsed.edges[e]!.range, reason: `\`${edgeName(parsed, e)}\` is part of the obstruction`}))
    }
  }
}

function userEdge(parsed: ParsedDiagram, e: number): [string, string] {
  return [vertexName(parsed, parsed.edges[e]!.from), vertexName(parsed, parsed.edges[e]!.to)]
}

/** Tiers: edges (parsed ids) that cannot be drawn on their levels without a crossing. */
export function levelCrossingFailure(parsed: ParsedDiagram, edges: number[], minimal: boolean): Failure {
  const last = edges.reduce((a, b) => (parsed.edges[b]!.range.start.offset > parsed.edges[a]!.range.start.offset ? b : a))
  const reason = minimal
    ? `With the tiers as declared, these ${plural(edges.length, 'edge')} cannot all be drawn without two of them crossing; removing any one of them, e.g. \`${edgeName(parsed, last)}\`, makes them drawable.`
    : `With the tiers as declared, these ${plural(edges.length, 'edge')} cannot all be drawn without two of them crossing.`
  return {
    certificate: {kind: 'level', problem: 'crossing', edges: edges.map((e) => userEdge(parsed, e))},
    diagnostic: {
      severity: 'error',
      ruleId: 'tiers-not-drawable',
      reason,
      range: parsed.edges[last]!.range,
      note: 'Each tier is drawn as one row and every vertex in no tier sits on the first row above all of its predecessors; no left-to-right order of the rows lets these edges pass each other (checked exactly, with the method of Randerath et al. 2001). Move a vertex to another tier, take it out of the tiers, or remove one of these edges.',
      related: edges.map((e) => ({range: parsed.edges[e]!.range, reason: `\`${edgeName(parsed, e)}\` is involved`}))
    }
  }
}

/** Tiers: a path (parsed edge ids, in order) from a tier through untiered vertices back to the same or an earlier tier. */
export function tierPathFailure(parsed: ParsedDiagram, path: number[]): Failure {
  const first = parsed.vertices[parsed.edges[path[0]!]!.from]!
  const lastVertex = parsed.vertices[parsed.edges[path.at(-1)!]!.to]!
  const tiers = parsed.tiers ?? []
  const from = tiers[first.tier!]!.name
  const to = tiers[lastVertex.tier!]!.name
  const walk = [first.key, ...path.map((e) => vertexName(parsed, parsed.edges[e]!.to))].join(' -> ')
  const where = from === to ? `back into tier \`${to}\`` : `back to the earlier tier \`${to}\``
  return {
    certificate: {kind: 'level', problem: 'path-against-tiers', edges: path.map((e) => userEdge(parsed, e))},
    diagnostic: {
      severity: 'error',
      ruleId: 'path-against-tiers',
      reason: `The path \`${walk}\` leaves tier \`${from}\` and leads ${where} through vertices in no tier, so its edges cannot all point the way the tiers go.`,
      range: parsed.edges[path.at(-1)!]!.range,
      note: 'Tiers are drawn in the order declared and every edge points from an earlier row to a later one, so a path can never return to its own tier or an earlier one. Put the vertices on the path in a tier of their own, change the tier order, or reverse an edge.',
      related: path.map((e) => ({range: parsed.edges[e]!.range, reason: `\`${edgeName(parsed, e)}\` is on the path`}))
    }
  }
}

export function undecidedDiagnostic(parsed: ParsedDiagram, budgetMillis: number): Diagnostic {
  return {
    severity: 'error',
    ruleId: 'undecided',
    reason: `The check could not decide within its time budget (${budgetMillis} ms) whether this diagram can be drawn with every arrow pointing the same way and no crossings.`,
    range: parsed.edges[0]?.range ?? parsed.vertices[0]?.range ?? parsed.outOfTime!,
    note: 'Deciding this is NP-complete for diagrams with several sources and several sinks (Garg & Tamassia 2001), so a large tangled diagram can take long. Raise the budget (`--budget`, plugin option `budget`) or split the diagram into smaller ones.'
  }
}
