/**
 * Bimodality of an embedding: around every vertex the incoming edges form one contiguous block of
 * the rotation and the outgoing edges another (so the direction flips at most twice going around).
 * A necessary condition for an upward drawing with that embedding (Bertolazzi, Di Battista, Liotta &
 * Mannino, Algorithmica 12, 1994; Garg & Tamassia, SIAM J. Comput. 31, 2001). O(n + m).
 */
import type {RotationSystem} from '../embedding/rotation-system.ts'

export type BimodalResult = {ok: true} | {ok: false; vertex: number}

export function isBimodal(emb: RotationSystem): BimodalResult {
  const g = emb.graph
  for (let v = 0; v < g.vertexCount; v++) {
    if (!isBimodalAt(emb, v)) return {ok: false, vertex: v}
  }
  return {ok: true}
}

/** Whether v's rotation has at most two direction changes. A self-loop never is (it cannot point up). */
export function isBimodalAt(emb: RotationSystem, v: number): boolean {
  const g = emb.graph
  const rot = emb.rotation[v]!
  const k = rot.length
  if (k === 0) return true
  let changes = 0
  let prevOut = g.tail[rot[k - 1]!] === v
  for (let i = 0; i < k; i++) {
    const e = rot[i]!
    if (g.tail[e] === g.head[e]) return false
    const out = g.tail[e] === v
    if (out !== prevOut) changes++
    prevOut = out
  }
  return changes <= 2
}
