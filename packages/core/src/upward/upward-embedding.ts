import type {Faces, RotationSystem} from '../embedding/rotation-system.ts'

/**
 * An upward embedding of a digraph G: a planar rotation system in which every vertex is bimodal, an
 * outer face, and an assignment of every source and sink to one of its switch angles (its large
 * angle) that satisfies the face condition of Bertolazzi, Di Battista, Liotta & Mannino
 * ("Upward drawings of triconnected digraphs", Algorithmica 12, 1994): a face with 2·n_f switch angles
 * holds n_f − 1 large angles if it is an inner face and n_f + 1 if it is the outer face.
 *
 * Angles. An angle is the corner of a face at a vertex, between two consecutive edges of the
 * vertex's rotation. It is named by the dart that ENTERS the vertex along the first of the two edges
 * in clockwise order: for a dart d with head v, the angle (d, next[d]) at v lies between d's edge and
 * the edge clockwise after it in v's rotation, in face faceOfDart[d]. Every dart names exactly one
 * angle, so a vertex of degree k has k angles; a vertex of degree 1 has one angle of 360°.
 */
export interface UpwardEmbedding {
  /** Of the input graph G (its own edge ids); every vertex is bimodal. */
  readonly embedding: RotationSystem
  /** traceFaces(embedding). */
  readonly faces: Faces
  /**
   * Index into faces.darts of the outer face of the first component (the one holding the lowest
   * vertex id that has an edge); -1 when G has no edges. For a disconnected G see outerFaces.
   */
  readonly outerFace: number
  /**
   * The outer face of every connected component with at least one edge, in order of each
   * component's lowest vertex id. The components are meant to stand side by side, each in the
   * outer face of the others, so the drawing's outer region is the union of these faces.
   */
  readonly outerFaces: Int32Array
  /**
   * Per vertex: for a source or sink of G (with at least one edge), the dart entering it that names
   * its large angle (see "Angles" above); the face holding the angle is faces.faceOfDart[largeAngle[v]].
   * -1 for every other vertex, and for isolated vertices.
   */
  readonly largeAngle: Int32Array
}
