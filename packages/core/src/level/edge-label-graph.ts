/**
 * Edge labels as vertices. A labelled edge u → v is split into u → ℓ → v at a label vertex ℓ, where
 * the drawing puts the label. Subdividing an edge never changes whether a digraph is upward planar
 * (an upward drawing of one gives an upward drawing of the other: place ℓ on the curve, or forget it),
 * so the exact checks run on the split graph and cover the labels' room too.
 *
 * Numbering, chosen so that consumers can ignore labels: vertices 0..n−1 are the original ones and
 * n + k is the label vertex of `labelledEdges[k]`; edge e < m is edge e of the original graph (for a
 * labelled edge, its first half u → ℓ), and edge m + k is the second half ℓ → v of `labelledEdges[k]`.
 * Linear time.
 */
import {traceFaces, type RotationSystem} from '../embedding/rotation-system.ts'
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import type {UpwardEmbedding} from '../upward/index.ts'

export interface EdgeLabelGraph {
  graph: Digraph
  /** Label vertex n + k labels original edge `labelledEdges[k]`. */
  labelledEdges: number[]
}

export function splitLabelledEdges(graph: Digraph, labelledEdges: readonly number[]): EdgeLabelGraph {
  const n = graph.vertexCount
  const pairs: Array<[number, number]> = []
  const labelVertexOf = new Map<number, number>()
  labelledEdges.forEach((e, k) => labelVertexOf.set(e, n + k))
  for (let e = 0; e < graph.edgeCount; e++) {
    const label = labelVertexOf.get(e)
    pairs.push([graph.tail[e]!, label ?? graph.head[e]!])
  }
  labelledEdges.forEach((e, k) => pairs.push([n + k, graph.head[e]!]))
  return {graph: createDigraph(n + labelledEdges.length, pairs), labelledEdges: [...labelledEdges]}
}

/** The original edge an edge of the split graph belongs to. */
export function originalEdge(split: EdgeLabelGraph, original: Digraph, e: number): number {
  return e < original.edgeCount ? e : split.labelledEdges[e - original.edgeCount]!
}

/**
 * The upward embedding of the original graph from one of the split graph: label vertices dropped,
 * each half of a split edge read as the whole edge. Darts keep their direction (tail-to-head halves
 * both map to the edge's tail-to-head dart, and both lie on the same two faces), so rotations, angles
 * and faces carry over.
 */
export function joinLabelledEdges(split: EdgeLabelGraph, original: Digraph, upward: UpwardEmbedding): UpwardEmbedding {
  const m = original.edgeCount
  const edgeOf = (e: number): number => (e < m ? e : split.labelledEdges[e - m]!)
  const dartOf = (d: number): number => 2 * edgeOf(d >> 1) + (d & 1)
  const rotation: Int32Array[] = []
  for (let v = 0; v < original.vertexCount; v++) rotation.push(Int32Array.from(upward.embedding.rotation[v]!, edgeOf))
  const embedding: RotationSystem = {graph: original, rotation}
  const faces = traceFaces(embedding)
  const faceOf = (face: number): number => (face < 0 ? -1 : faces.faceOfDart[dartOf(upward.faces.darts[face]![0]!)]!)
  const largeAngle = new Int32Array(original.vertexCount)
  for (let v = 0; v < original.vertexCount; v++) largeAngle[v] = upward.largeAngle[v]! < 0 ? -1 : dartOf(upward.largeAngle[v]!)
  return {embedding, faces, outerFace: faceOf(upward.outerFace), outerFaces: Int32Array.from(upward.outerFaces, faceOf), largeAngle}
}
