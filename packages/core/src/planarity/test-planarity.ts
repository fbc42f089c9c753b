/**
 * Planarity of a digraph's underlying undirected graph, with a certificate either way: a rotation
 * system over g's own edge ids (left-right test, Brandes 2009; see left-right.ts), or a subdivided K5
 * or K3,3 (see kuratowski.ts). Directions are ignored.
 *
 * Multigraphs: parallel edges are placed right beside their twin (at the twin's tail just after it,
 * at its head just before it, so each extra copy bounds a two-sided face), and a self-loop appears twice,
 * consecutively, in its vertex's rotation (one entry per end). Note that rotation-system.ts's dart
 * functions cannot tell the two ends of a loop apart, so use verifyPlanarEmbedding (which can) on
 * graphs with loops; loop-free graphs work with traceFaces as usual.
 *
 * Time: O(n + m) for a planar graph; the Kuratowski extraction costs more, see kuratowski.ts.
 */
import type {Digraph} from '../graph/digraph.ts'
import {flatRotationSystem, type RotationSystem} from '../embedding/rotation-system.ts'
import type {PlanarityResult} from './index.ts'
import {embedIncidence, embedPlanarSimple, isPlanarIncidence, isPlanarSimple, type SimpleRotation} from './left-right.ts'
import {incidenceForDecision, incidenceOfDigraph} from './incidence.ts'
import {classifySubdivision, minimalNonplanarEdges} from './kuratowski.ts'
import {simplify, type Simplified} from './simplify.ts'

export function testPlanarity(g: Digraph): PlanarityResult {
  // No loops and no parallel edges (the usual case): the incidence lists come straight from g, labelled
  // by g's edge ids, and the rotation is g's as it stands.
  const inc = incidenceOfDigraph(g)
  if (inc !== null) {
    const rot = embedIncidence(inc)
    if (rot !== null) return {planar: true, embedding: flatRotationSystem(g, rot.start, rot.order)}
    return kuratowskiOf(simplify(g))
  }
  const s = simplify(g)
  const rot = embedPlanarSimple(s.simple)
  return rot !== null ? {planar: true, embedding: liftRotation(g, s, rot)} : kuratowskiOf(s)
}

/** Is g's underlying graph planar? The decision alone (no embedding, no certificate). O(n + m). */
export function isPlanar(g: Digraph): boolean {
  const inc = incidenceForDecision(g) // any slot order gives the same answer
  return inc !== null ? isPlanarIncidence(inc) : isPlanarSimple(simplify(g).simple)
}

function kuratowskiOf(s: Simplified): PlanarityResult {
  const k = classifySubdivision(s.simple, minimalNonplanarEdges(s.simple))
  const edges = Array.from(k.edges, (e) => s.original[e]!).sort((x, y) => x - y)
  return {planar: false, kuratowski: {type: k.type, branch: k.branch, edges}}
}

/** g's rotation from the simple graph's: parallel copies beside their twin, loops twice at their vertex. */
function liftRotation(g: Digraph, s: Simplified, rot: SimpleRotation): RotationSystem {
  const n = g.vertexCount
  const rotationStart = new Int32Array(n + 1)
  for (let v = 0; v < n; v++) {
    rotationStart[v + 1] = rotationStart[v]! + g.outStart[v + 1]! - g.outStart[v]! + g.inStart[v + 1]! - g.inStart[v]!
  }
  const buffer = new Int32Array(2 * g.edgeCount)
  const fill = new Int32Array(n)
  const {original, repTailIsA, parallelStart, parallel} = s
  const {start, order} = rot
  for (let v = 0; v < n; v++) {
    let k = rotationStart[v]!
    for (let i = start[v]!; i < start[v + 1]!; i++) {
      const h = order[i]!
      const se = h >> 1
      const rep = original[se]!
      // v is the simple edge's a-end when h is even; rep leaves v iff its tail is that end.
      const repLeaves = (h & 1) === 0 ? repTailIsA[se] === 1 : repTailIsA[se] === 0
      const p0 = parallelStart[se]!, p1 = parallelStart[se + 1]!
      if (repLeaves) {
        buffer[k++] = rep
        for (let j = p0; j < p1; j++) buffer[k++] = parallel[j]!
      } else {
        for (let j = p1 - 1; j >= p0; j--) buffer[k++] = parallel[j]!
        buffer[k++] = rep
      }
    }
    fill[v] = k
  }
  for (const e of s.loops) {
    const v = g.tail[e]!
    buffer[fill[v]!++] = e
    buffer[fill[v]!++] = e
  }
  return flatRotationSystem(g, rotationStart, buffer)
}
