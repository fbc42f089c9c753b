/**
 * Drop added edges the layout does not need, so they constrain the layers less.
 *
 * In a planar st-graph H (one source, one sink, embedded with both on the outer face), deleting an
 * edge u -> v where u keeps another out-edge and v another in-edge leaves a planar st-graph with the
 * restricted embedding: still acyclic, every vertex but s still has an in-edge and every vertex but t
 * an out-edge, so s and t stay the only source and sink; the two faces beside the edge merge, and s
 * and t stay on the outer face (Di Battista, Eades, Tamassia, Tollis, "Graph Drawing", 1999, sec. 4.2,
 * for the facts on planar st-graphs used here). G's own edges are never deleted, so the result is
 * still an st-augmentation of G, with fewer order constraints for the layering and fewer faces.
 * Edges are tried in id order (deterministic, greedy). Faces are merged with union-find to name the
 * new outer face.
 *
 * Time: O((n + m) α(m)).
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {traceFaces, type Faces, type RotationSystem} from '../embedding/rotation-system.ts'
import type {StAugmentation} from '../augment/index.ts'

export interface PrunedAugmentation {
  graph: Digraph
  embedding: RotationSystem
  faces: Faces
  outerFace: number
}

export function pruneAugmentation(st: StAugmentation, keptEdges: number): PrunedAugmentation {
  const h = st.graph
  const m = h.edgeCount
  const outDeg = new Int32Array(h.vertexCount)
  const inDeg = new Int32Array(h.vertexCount)
  for (let e = 0; e < m; e++) {
    outDeg[h.tail[e]!]!++
    inDeg[h.head[e]!]!++
  }
  const faceCount = st.faces.darts.length
  const parent = Int32Array.from({length: faceCount}, (_, i) => i)
  const find = (f: number): number => {
    while (parent[f] !== f) {
      parent[f] = parent[parent[f]!]!
      f = parent[f]!
    }
    return f
  }
  const deleted = new Uint8Array(m)
  let deletions = 0
  for (let e = keptEdges; e < m; e++) {
    const u = h.tail[e]!
    const v = h.head[e]!
    if (outDeg[u]! < 2 || inDeg[v]! < 2) continue
    deleted[e] = 1
    deletions++
    outDeg[u]!--
    inDeg[v]!--
    const a = find(st.faces.faceOfDart[2 * e]!)
    const b = find(st.faces.faceOfDart[2 * e + 1]!)
    if (a !== b) parent[a] = b
  }
  if (deletions === 0) return {graph: h, embedding: st.embedding, faces: st.faces, outerFace: st.outerFace}
  const newId = new Int32Array(m).fill(-1)
  const pairs: Array<[number, number]> = []
  for (let e = 0; e < m; e++) {
    if (deleted[e]) continue
    newId[e] = pairs.length
    pairs.push([h.tail[e]!, h.head[e]!])
  }
  const graph = createDigraph(h.vertexCount, pairs)
  const rotation = st.embedding.rotation.map((rot) => {
    const out: number[] = []
    for (const e of rot) if (!deleted[e]) out.push(newId[e]!)
    return Int32Array.from(out)
  })
  const embedding: RotationSystem = {graph, rotation}
  const faces = traceFaces(embedding)
  const outerClass = find(st.outerFace)
  let outerFace = -1
  for (let e = 0; e < m && outerFace < 0; e++) {
    if (deleted[e]) continue
    for (const side of [0, 1]) {
      if (find(st.faces.faceOfDart[2 * e + side]!) === outerClass) {
        outerFace = faces.faceOfDart[2 * newId[e]! + side]!
        break
      }
    }
  }
  return {graph, embedding, faces, outerFace}
}
