/**
 * Independent check of a cycle certificate: a closed walk along existing edges with no repeated
 * vertex. Shares no code with find-cycle.
 */
import type {Digraph} from '../graph/digraph.ts'
import type {Cycle} from './find-cycle.ts'

export function verifyCycle(g: Digraph, cycle: Cycle): {ok: true} | {ok: false; reason: string} {
  const k = cycle.vertices.length
  if (k === 0) return {ok: false, reason: 'empty cycle'}
  if (cycle.edges.length !== k) return {ok: false, reason: `${k} vertices but ${cycle.edges.length} edges`}
  const seen = new Set<number>()
  for (let i = 0; i < k; i++) {
    const v = cycle.vertices[i]!
    if (!Number.isInteger(v) || v < 0 || v >= g.vertexCount) return {ok: false, reason: `vertex ${v} out of range`}
    if (seen.has(v)) return {ok: false, reason: `vertex ${v} repeats`}
    seen.add(v)
    const e = cycle.edges[i]!
    if (!Number.isInteger(e) || e < 0 || e >= g.edgeCount) return {ok: false, reason: `edge ${e} out of range`}
    const w = cycle.vertices[(i + 1) % k]!
    if (g.tail[e] !== v || g.head[e] !== w) {
      return {ok: false, reason: `edge ${e} is ${g.tail[e]}→${g.head[e]}, not ${v}→${w}`}
    }
  }
  return {ok: true}
}
