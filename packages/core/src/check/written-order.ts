/**
 * Written order as a tie-break: where several upward embeddings exist, prefer the one whose out-edges,
 * read left to right at each vertex, agree most often with the order the edges were written in (edge
 * ids are written order). The upward test already tries written order first where it has a choice
 * (upward/grow-back.ts places leaves and parallel paths, upward/embedding-search.ts tries corners in
 * that order); here, on the embedding it found:
 * - a source's large angle may move to any other of its angles in the same face (the face condition
 *   only counts large angles per face), which turns its out-edges round like a carousel: take the
 *   turn that agrees best;
 * - reflecting the drawing keeps it upward and crossing-free and reverses every rotation: take the
 *   mirror image if it agrees better.
 * Equal scores keep what was found, so the same text gives the same picture. O(Σ deg·log deg) for
 * the sources and the scores, O(m) for the mirror.
 */
import {dartFrom, traceFaces, type RotationSystem} from '../embedding/rotation-system.ts'
import type {UpwardEmbedding} from '../upward/index.ts'
import {int32Rows} from '../upward/int32-rows.ts'

/** Out-edges of every vertex, left to right in a drawing with flow up (rotations are clockwise, y up). */
export function outEdgesLeftToRight(up: UpwardEmbedding): number[][] {
  const g = up.embedding.graph
  const result: number[][] = []
  for (let v = 0; v < g.vertexCount; v++) {
    const r = up.embedding.rotation[v]!
    const k = r.length
    const isOut = (i: number): boolean => g.tail[r[((i % k) + k) % k]!] === v
    let start = -1
    if (up.largeAngle[v]! >= 0 && r.every((_, i) => isOut(i))) {
      // A source: the edge clockwise after its large angle (at the bottom) is the leftmost.
      const e = up.largeAngle[v]! >> 1
      start = (r.indexOf(e) + 1) % k
    } else {
      // Otherwise the out-edges follow the in-edges clockwise (from the west, over the top).
      for (let i = 0; i < k; i++) if (isOut(i) && !isOut(i - 1)) start = i
    }
    const order: number[] = []
    if (start >= 0) for (let i = 0; i < k && isOut(start + i); i++) order.push(r[(start + i) % k]!)
    result.push(order)
  }
  return result
}

/** Pairs of out-edges drawn in written order minus pairs drawn against it, over all vertices. */
export function writtenOrderScore(up: UpwardEmbedding): number {
  let score = 0
  for (const order of outEdgesLeftToRight(up)) {
    const k = order.length
    score += (k * (k - 1)) / 2 - 2 * inversions(order.slice())
  }
  return score
}

/** Pairs out of order (i < j, a[i] > a[j]), counted while merge-sorting a in place: O(k log k). */
function inversions(a: number[]): number {
  if (a.length < 2) return 0
  const mid = a.length >> 1
  const left = a.slice(0, mid), right = a.slice(mid)
  let count = inversions(left) + inversions(right)
  let i = 0, j = 0, o = 0
  while (i < left.length && j < right.length) {
    if (left[i]! <= right[j]!) a[o++] = left[i++]!
    else {
      count += left.length - i
      a[o++] = right[j++]!
    }
  }
  while (i < left.length) a[o++] = left[i++]!
  while (j < right.length) a[o++] = right[j++]!
  return count
}

/** The mirror image: rotations reversed, each large angle renamed by the dart that names it there. */
export function mirrorUpwardEmbedding(up: UpwardEmbedding): UpwardEmbedding {
  const g = up.embedding.graph
  const rotation = int32Rows(up.embedding.rotation, (r) => r)
  for (const r of rotation) r.reverse()
  const embedding: RotationSystem = {graph: g, rotation}
  const faces = traceFaces(embedding)
  const largeAngle = new Int32Array(g.vertexCount).fill(-1)
  for (let v = 0; v < g.vertexCount; v++) {
    const d = up.largeAngle[v]!
    if (d < 0) continue
    // The angle lay between d's edge and the edge clockwise after it; mirrored, that edge comes first.
    const r = up.embedding.rotation[v]!
    const after = r[(r.indexOf(d >> 1) + 1) % r.length]!
    largeAngle[v] = dartFrom(g, after, v) ^ 1
  }
  // The face on the left of a dart is, mirrored, the face on the left of its reverse.
  const faceOf = (face: number): number => (face < 0 ? -1 : faces.faceOfDart[up.faces.darts[face]![0]! ^ 1]!)
  return {embedding, faces, outerFace: faceOf(up.outerFace), outerFaces: Int32Array.from(up.outerFaces, faceOf), largeAngle}
}

/**
 * How far a drawing keeps the written order: of the vertices with two or more out-edges, how many
 * show all of them left to right in the order written.
 */
export function writtenOrderAgreement(up: UpwardEmbedding): {vertices: number; kept: number} {
  let vertices = 0, kept = 0
  for (const order of outEdgesLeftToRight(up)) {
    if (order.length < 2) continue
    vertices++
    if (order.every((e, i) => i === 0 || order[i - 1]! < e)) kept++
  }
  return {vertices, kept}
}

/** Every source's large angle moved, within its face, to where its out-edges best keep written order. */
export function turnSourcesToWrittenOrder(up: UpwardEmbedding): UpwardEmbedding {
  const g = up.embedding.graph
  const largeAngle = Int32Array.from(up.largeAngle)
  for (let v = 0; v < g.vertexCount; v++) {
    const r = up.embedding.rotation[v]!
    if (largeAngle[v]! < 0 || r.length < 2 || !r.every((e) => g.tail[e] === v)) continue
    const face = up.faces.faceOfDart[largeAngle[v]!]!
    const scores = turnScores(r)
    let best = largeAngle[v]!
    let bestScore = scores[r.indexOf(best >> 1)]!
    r.forEach((e, i) => {
      const d = dartFrom(g, e, v) ^ 1
      if (up.faces.faceOfDart[d] === face && scores[i]! > bestScore) [best, bestScore] = [d, scores[i]!]
    })
    largeAngle[v] = best
  }
  return {...up, largeAngle}
}

/**
 * For each i, pairs in written order minus pairs against it when r is read clockwise from r[i + 1]
 * (the large angle after r[i]). Turning by one moves r[i] from first to last, which flips the sign
 * of each of its pairs: (edges written after it) − (edges written before it) = k − 1 − 2·rank.
 * O(k log k) for all k turns.
 */
function turnScores(r: Int32Array): number[] {
  const k = r.length
  const rank = new Map<number, number>()
  Array.from(r).sort((a, b) => a - b).forEach((e, i) => rank.set(e, i))
  let score = (k * (k - 1)) / 2 - 2 * inversions(Array.from(r)) // read from r[0]: the turn i = k - 1
  const scores = new Array<number>(k)
  for (let i = 0; i < k; i++) {
    score -= 2 * (k - 1 - 2 * rank.get(r[i]!)!)
    scores[i] = score
  }
  return scores
}

/** The embedding or its mirror image, sources turned, whichever keeps the written order better. */
export function preferWrittenOrder(up: UpwardEmbedding): UpwardEmbedding {
  const found = turnSourcesToWrittenOrder(up)
  const mirrored = turnSourcesToWrittenOrder(mirrorUpwardEmbedding(found))
  return writtenOrderScore(mirrored) > writtenOrderScore(found) ? mirrored : found
}
