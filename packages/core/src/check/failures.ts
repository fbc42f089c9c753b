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

export function undecidedDiagnostic(parsed: ParsedDiagram, budgetMillis: number): Diagnostic {
  return {
    severity: 'error',
    ruleId: 'undecided',
    reason: `The check could not decide within its time budget (${budgetMillis} ms) whether this diagram can be drawn with every arrow pointing the same way and no crossings.`,
    range: parsed.edges[0]?.range ?? parsed.vertices[0]!.range,
    note: 'Deciding this is NP-complete for diagrams with several sources and several sinks (Garg & Tamassia 2001), so a large tangled diagram can take long. Raise the budget (`--budget`, plugin option `budget`) or split the diagram into smaller ones.'
  }
}
