/**
 * Written order as a tie-break between an upward embedding and its mirror image. Reflecting an upward
 * drawing left to right keeps it upward and crossing-free, and reverses every rotation; so of the two,
 * take the one whose out-edges, read left to right at each vertex, agree more often with the order the
 * edges were written in (edge ids are written order). Equal scores keep the embedding found. O(Σ deg²)
 * for the score, O(m) for the mirror.
 *
 * This is the cheap half of the tie-break: the choice between the other embeddings is made in the
 * embedding search (upward/embedding-search.ts), which does not look at written order yet.
 */
import {dartFrom, traceFaces, type RotationSystem} from '../embedding/rotation-system.ts'
import type {UpwardEmbedding} from '../upward/index.ts'

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
    for (let i = 0; i < order.length; i++) for (let j = i + 1; j < order.length; j++) score += order[i]! < order[j]! ? 1 : -1
  }
  return score
}

/** The mirror image: rotations reversed, each large angle renamed by the dart that names it there. */
export function mirrorUpwardEmbedding(up: UpwardEmbedding): UpwardEmbedding {
  const g = up.embedding.graph
  const rotation = up.embedding.rotation.map((r) => Int32Array.from(r).reverse())
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
