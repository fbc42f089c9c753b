/**
 * Certificates turned into messages a writer can act on: a plain reason, the theory in a note, the
 * primary position, and every involved edge's position.
 */
import type {Cycle} from '../acyclic/index.ts'
import type {ParsedDiagram} from '../parse/index.ts'
import type {Diagnostic} from '../source-range.ts'
import type {Certificate} from './certificate.ts'
import {edgeName, vertexName} from './describe.ts'

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
