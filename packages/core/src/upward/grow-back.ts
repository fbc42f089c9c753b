/**
 * Undo the reductions of reduce.ts on an upward embedding, keeping it upward at every step.
 *
 * The embedding is held as rotations (clockwise, edge ids) plus each source's and sink's large angle:
 * angle i of v lies between rot[v][i] and rot[v][i + 1] (cyclically). With the face-assignment
 * condition of Bertolazzi, Di Battista, Liotta & Mannino (Algorithmica 12, 1994) in mind, each step
 * below changes switch counts and large angles so that every face still gets its share:
 * - leaf v at u: put the edge at the end of u's out-block (in-block), which turns a non-switch angle
 *   into one switch plus one non-switch; v's own 360° angle is a switch and takes that face's extra
 *   large angle. If u is a sink (source) it goes into u's large angle, which v inherits.
 * - subdivision: rotations change only by renaming; the new vertex has no switch.
 * - parallel path a -> v -> b beside a -> b: drawn on the right of a -> b (after it clockwise at a,
 *   before it at b), which makes a thin face with two switches and no large angle.
 * Time: O(total degree) per step.
 */
import type {Reduction} from './reduce.ts'

export interface AngleEmbedding {
  /** rot[v]: working edge ids around v, clockwise (y up). */
  rot: number[][]
  /** large[v]: index of v's large angle if v is a source or sink with edges, else -1. */
  large: Int32Array
  /** A source or sink whose large angle lies in the outer face; -1 when there are no edges. */
  outerVertex: number
}

export function growBack(red: Reduction, emb: AngleEmbedding): void {
  const {tail, head} = red
  const {rot, large} = emb
  for (let k = red.steps.length - 1; k >= 0; k--) {
    const s = red.steps[k]!
    if (s.kind === 'subdivide') {
      const a = tail[s.inEdge]!, b = head[s.outEdge]!
      const ra = rot[a]!, rb = rot[b]!
      ra[ra.indexOf(s.merged)] = s.inEdge
      rb[rb.indexOf(s.merged)] = s.outEdge
      rot[s.v] = [s.inEdge, s.outEdge]
      large[s.v] = -1
    } else if (s.kind === 'parallel') {
      const a = tail[s.twin]!, b = head[s.twin]!
      const ra = rot[a]!, rb = rot[b]!
      const i = ra.indexOf(s.twin)
      ra.splice(i + 1, 0, s.inEdge)
      if (large[a]! >= i) large[a]!++
      const j = rb.indexOf(s.twin)
      rb.splice(j, 0, s.outEdge)
      if (large[b]! >= j) large[b]!++
      rot[s.v] = [s.inEdge, s.outEdge]
      large[s.v] = -1
    } else {
      const {u, v, e} = s
      const out = tail[e] === u // v lies above u
      const ru = rot[u]!
      rot[v] = [e]
      large[v] = 0
      if (ru.length === 0) {
        ru.push(e)
        large[u] = 0
        emb.outerVertex = u
        continue
      }
      const isOut = (x: number) => tail[x] === u
      let hasOut = false, hasIn = false
      for (const x of ru) {
        if (isOut(x)) hasOut = true
        else hasIn = true
      }
      if (hasOut && hasIn) {
        // end of the out-block (for an out-edge) or of the in-block (for an in-edge)
        const d = ru.length
        let i = 0
        while (!(isOut(ru[i]!) === out && isOut(ru[(i + 1) % d]!) !== out)) i++
        ru.splice(i + 1, 0, e)
      } else if (hasOut === out) {
        // u is a source receiving an out-edge (or a sink an in-edge): stays one; keep its large angle
        ru.splice(large[u]! + 1, 0, e)
      } else {
        // u is a sink receiving an out-edge (or a source an in-edge): v takes over u's large angle
        ru.splice(large[u]! + 1, 0, e)
        large[u] = -1
        if (emb.outerVertex === u) emb.outerVertex = v
      }
    }
  }
}
