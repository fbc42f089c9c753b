/**
 * Undo the reductions of reduce.ts on an upward embedding, keeping it upward at every step.
 *
 * The embedding is held as rotations (clockwise, edge ids) plus each source's and sink's large angle:
 * angle i of v lies between rot[v][i] and rot[v][i + 1] (cyclically). With the face-assignment
 * condition of Bertolazzi, Di Battista, Liotta & Mannino (Algorithmica 12, 1994) in mind, each step
 * below changes switch counts and large angles so that every face still gets its share:
 * - leaf v at u: an in-edge goes at the end of u's in-block; an out-edge anywhere in u's out-block,
 *   ends included (for a source, its large angle is the gap between its two ends). Either way one
 *   angle becomes two, which adds two switches to that face, and v's own 360° angle is a switch that
 *   takes the face's extra large angle. The place in the out-block is the one that agrees best with
 *   the written order (edge ids; a merged edge takes the id of its first piece), a tie-break only.
 *   If u is a sink (source) receiving an out-edge (in-edge) it goes into u's large angle, which v
 *   inherits.
 * - subdivision: rotations change only by renaming; the new vertex has no switch.
 * - parallel path a -> v -> b beside a -> b: drawn beside a -> b on the left if a -> v was written
 *   first, else on the right, which makes a thin face with two switches and no large angle.
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
  const key = writtenKeys(red)
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
      // Left of the twin: before it clockwise at a, after it at b; right: the other way round.
      const left = key[s.inEdge]! < key[s.twin]!
      const i = ra.indexOf(s.twin)
      ra.splice(left ? i : i + 1, 0, s.inEdge)
      if (large[a]! >= i) large[a]!++
      const j = rb.indexOf(s.twin)
      rb.splice(left ? j + 1 : j, 0, s.outEdge)
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
      if (out && hasOut && (hasIn || large[u]! >= 0)) {
        // an out-edge into the out-block, where the written order puts it
        rot[u] = placeOutEdge(ru, isOut, large[u]!, e, key)
        if (!hasIn) large[u] = rot[u]!.length - 1
      } else if (hasOut && hasIn) {
        // end of the in-block
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

/** Written order of every working edge: its own id, or for a merged edge that of its first piece. */
export function writtenKeys(red: Reduction): number[] {
  const key: number[] = [] // by push: an Array#map result is holey or packed by tier
  for (let e = 0; e < red.tail.length; e++) key.push(e)
  for (const s of red.steps) if (s.kind === 'subdivide') key[s.merged] = key[s.inEdge]!
  return key
}

/**
 * u's rotation with out-edge e added to its out-block, read left to right: clockwise from the first
 * out-edge after an in-edge, or for a source from the edge after its large angle. The new place is
 * the one with most pairs in written order (ties: the rightmost); for a source the large angle then
 * lies between the last edge of the result and its first.
 */
function placeOutEdge(ru: number[], isOut: (x: number) => boolean, large: number, e: number, key: readonly number[]): number[] {
  const d = ru.length
  let start = (large + 1) % d
  if (large < 0) for (let i = 0; i < d; i++) if (isOut(ru[i]!) && !isOut(ru[(i + d - 1) % d]!)) start = i
  const order: number[] = []
  for (let i = 0; i < d && isOut(ru[(start + i) % d]!); i++) order.push(ru[(start + i) % d]!)
  const rest: number[] = []
  for (let i = order.length; i < d; i++) rest.push(ru[(start + i) % d]!)
  // score(p) - score(0) grows by 2 for each edge before p written before e, and falls for the others
  let best = 0, bestScore = 0, score = 0
  order.forEach((x, i) => {
    score += key[x]! < key[e]! ? 1 : -1
    if (score >= bestScore) [best, bestScore] = [i + 1, score]
  })
  order.splice(best, 0, e)
  return [...order, ...rest]
}
