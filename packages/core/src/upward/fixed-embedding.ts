/**
 * Upward planarity of a digraph with a FIXED planar embedding (Bertolazzi, Di Battista, Liotta &
 * Mannino, "Upward drawings of triconnected digraphs", Algorithmica 12, 1994).
 *
 * With every vertex bimodal, call an angle of a face a switch when both of its edges point into the
 * vertex or both point out of it; a face with 2·n_f switch angles needs n_f − 1 large angles if it
 * is inner and n_f + 1 if it is the outer face, and only a source or a sink can have a large angle,
 * exactly one each. The embedding (with outer face f0) is upward iff such an assignment exists.
 * Angles are counted, not faces: a cut vertex can meet one face in several angles and a degree-1
 * vertex has one 360° angle, a switch (checked against a brute-force oracle
 * in the tests). By Euler's formula the capacities add up to the number of sources plus sinks, so
 * the assignment is a maximum bipartite b-matching, solved as a flow:
 *   source -> each source/sink of G (capacity 1) -> each face where it has an angle (capacity 1)
 *   -> sink (capacity n_f − 1, plus 2 for the outer face).
 * One max flow with every face inner (Dinic, O(m·√n)) falls at most 2 short; each candidate outer
 * face then gets +2 capacity and at most two more augmenting paths on a copy, O(m) per face. Without
 * a given outer face that is O(m·√n + F·m) = O(n²) worst case on a planar graph.
 *
 * A graph is upward planar iff each connected component is: components can be drawn side by side.
 * Each component is solved on its own and gets its own outer face.
 */
import type {Digraph} from '../graph/digraph.ts'
import {dartHead, nextDarts, traceFaces, type RotationSystem} from '../embedding/rotation-system.ts'
import {findCycle, type Cycle} from '../acyclic/find-cycle.ts'
import {verifyPlanarEmbedding} from '../planarity/verify-embedding.ts'
import {isBimodal} from './bimodal.ts'
import {copyFlowNetwork, FlowNetworkBuilder, maxFlow, type FlowNetwork} from './max-flow.ts'
import type {UpwardEmbedding} from './upward-embedding.ts'

export interface UpwardEmbeddedOptions {
  /**
   * Face index (into traceFaces(emb).darts) that must be the outer face of its component. Other
   * components still try each of their faces. Default: the faces of each component are tried in a
   * fixed order (those reachable in the residual network of the all-inner flow, most switches first,
   * then by index) and the first that works is taken.
   */
  outerFace?: number | null | undefined
}

export type UpwardEmbeddedResult =
  | {ok: true; upward: UpwardEmbedding}
  /** G has a directed cycle (or a self-loop), so no drawing of it points up. */
  | {ok: false; reason: 'cyclic'; cycle: Cycle}
  /** The rotation at `vertex` interleaves incoming and outgoing edges. */
  | {ok: false; reason: 'not-bimodal'; vertex: number}
  /**
   * No outer face of this component admits the large-angle assignment; `component` lists its
   * vertices. `hall`, when present, certifies it (Hall's condition fails, read off a minimum cut).
   */
  | {ok: false; reason: 'no-assignment'; component: number[]; hall?: HallViolation}

/**
 * Sources and sinks that cannot all get a large angle: every angle of every vertex listed lies in
 * one of `faces`, and those faces hold fewer large angles than there are vertices. With outerFace
 * set (an index into traceFaces of the embedding), the bound is Σ (n_f − 1) over the faces, plus 2
 * if the outer face is among them; with outerFace −1 it is Σ (n_f − 1) + 2, whichever face is outer.
 */
export interface HallViolation {
  vertices: number[]
  faces: number[]
  outerFace: number
}

/**
 * Throws RangeError when `emb` is not a planar rotation system of its graph (a caller's bug, not a
 * property of the diagram), or when options.outerFace is not a face index.
 */
export function testUpwardEmbedded(
  emb: RotationSystem,
  options?: Readonly<UpwardEmbeddedOptions> | null
): UpwardEmbeddedResult {
  const g = emb.graph
  const valid = verifyPlanarEmbedding(emb)
  if (!valid.ok) throw new RangeError(`testUpwardEmbedded needs a planar rotation system: ${valid.reason}`)
  const acyclic = findCycle(g)
  if (!acyclic.acyclic) return {ok: false, reason: 'cyclic', cycle: acyclic.cycle}
  const bimodal = isBimodal(emb)
  if (!bimodal.ok) return {ok: false, reason: 'not-bimodal', vertex: bimodal.vertex}

  const n = g.vertexCount
  const faces = traceFaces(emb)
  const next = nextDarts(emb)
  const faceCount = faces.darts.length
  const fixedOuter = options?.outerFace ?? -1
  if (fixedOuter !== -1 && !(Number.isInteger(fixedOuter) && fixedOuter >= 0 && fixedOuter < faceCount)) {
    throw new RangeError(`outerFace ${fixedOuter} is not a face index (0..${faceCount - 1})`)
  }

  // Switch angles per face; the angle named by dart d (entering v) is a switch when d's edge and
  // next[d]'s edge both point into v (d forward, next[d] backward) or both out of v.
  const switches = new Int32Array(faceCount)
  for (let f = 0; f < faceCount; f++) {
    let c = 0
    for (const d of faces.darts[f]!) if ((d & 1) !== (next[d]! & 1)) c++
    switches[f] = c
  }

  const component = components(g)
  const facesOf: number[][] = []
  for (let f = 0; f < faceCount; f++) {
    const c = component[dartHead(g, faces.darts[f]![0]!)]!
    while (facesOf.length <= c) facesOf.push([])
    facesOf[c]!.push(f)
  }
  const verticesOf: number[][] = [] // by push: an Array#map result is holey or packed by tier
  for (let c = 0; c < facesOf.length; c++) verticesOf.push([])
  for (let v = 0; v < n; v++) if (component[v]! >= 0) verticesOf[component[v]!]!.push(v)

  const assignedFace = new Int32Array(n).fill(-1)
  const outerFaces = new Int32Array(facesOf.length)
  const faceNode = new Int32Array(faceCount)
  const faceMark = new Int32Array(faceCount)
  for (let c = 0; c < facesOf.length; c++) {
    const outer = solveComponent(
      g, emb, faces.faceOfDart, switches, verticesOf[c]!, facesOf[c]!, fixedOuter, assignedFace, faceNode, faceMark
    )
    if (typeof outer !== 'number') {
      return outer.hall === undefined
        ? {ok: false, reason: 'no-assignment', component: verticesOf[c]!}
        : {ok: false, reason: 'no-assignment', component: verticesOf[c]!, hall: outer.hall}
    }
    outerFaces[c] = outer
  }

  // Name each large angle by the first dart of its face's walk that enters the vertex.
  const largeAngle = new Int32Array(n).fill(-1)
  for (let f = 0; f < faceCount; f++) {
    for (const d of faces.darts[f]!) {
      const v = dartHead(g, d)
      if (assignedFace[v] === f && largeAngle[v] === -1) largeAngle[v] = d
    }
  }
  return {
    ok: true,
    upward: {embedding: emb, faces, outerFace: outerFaces.length > 0 ? outerFaces[0]! : -1, outerFaces, largeAngle}
  }
}

/** Component id per vertex (by lowest vertex id), -1 for isolated vertices. */
function components(g: Digraph): Int32Array {
  const n = g.vertexCount
  const comp = new Int32Array(n).fill(-1)
  const stack = new Int32Array(n)
  let count = 0
  for (let r = 0; r < n; r++) {
    if (comp[r] !== -1) continue
    if (g.outStart[r + 1] === g.outStart[r] && g.inStart[r + 1] === g.inStart[r]) continue
    let top = 0
    stack[top++] = r
    comp[r] = count
    while (top > 0) {
      const v = stack[--top]!
      for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
        const w = g.head[g.outEdges[i]!]!
        if (comp[w] === -1) {
          comp[w] = count
          stack[top++] = w
        }
      }
      for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) {
        const w = g.tail[g.inEdges[i]!]!
        if (comp[w] === -1) {
          comp[w] = count
          stack[top++] = w
        }
      }
    }
    count++
  }
  return comp
}

/**
 * Solves one component; writes the chosen face of each of its sources and sinks into assignedFace
 * and returns the outer face, or a failure with a Hall violation when one cut suffices to show it
 * (a fixed outer face, or a shortfall of 3 or more with every face inner). faceNode and faceMark are scratch arrays
 * indexed by face, shared between components (faceNode entries are set here before use).
 */
function solveComponent(
  g: Digraph,
  emb: RotationSystem,
  faceOfDart: Int32Array,
  switches: Int32Array,
  vertices: number[],
  compFaces: number[],
  fixedOuter: number,
  assignedFace: Int32Array,
  faceNode: Int32Array,
  faceMark: Int32Array
): number | {hall?: HallViolation} {
  // Nodes: 0 = source, 1 = sink, then this component's sources/sinks, then its faces.
  const extremes = vertices.filter((v) => g.outStart[v + 1] === g.outStart[v] || g.inStart[v + 1] === g.inStart[v])
  const k = extremes.length
  compFaces.forEach((f, i) => (faceNode[f] = 2 + k + i))
  const b = new FlowNetworkBuilder(2 + k + compFaces.length)
  for (let i = 0; i < k; i++) {
    const v = extremes[i]!
    b.addArc(0, 2 + i, 1)
    const rot = emb.rotation[v]!
    for (let j = 0; j < rot.length; j++) {
      // The dart entering v along rot[j] names the angle after rot[j]; every angle of a source or
      // sink is a switch. One arc per face, however many angles v has there.
      const e = rot[j]!
      const f = faceOfDart[g.head[e] === v ? 2 * e : 2 * e + 1]!
      if (faceMark[f] === v + 1) continue
      faceMark[f] = v + 1
      b.addArc(2 + i, faceNode[f]!, 1)
    }
  }
  const sinkArc = new Int32Array(compFaces.length)
  for (let i = 0; i < compFaces.length; i++) {
    const cap = switches[compFaces[i]!]! / 2 - 1
    // cap < 0 only for a face without switches, i.e. bounded by a directed cycle (excluded earlier).
    if (cap < 0) return {}
    sinkArc[i] = b.addArc(2 + k + i, 1, cap)
  }
  const base = b.build()
  const baseFlow = maxFlow(base, 0, 1)
  const hallFrom = (net: FlowNetwork, outer: number): HallViolation => {
    // Minimum cut: the sources/sinks reachable from the source in the residual network have all
    // their angles in reachable faces (a face adjacent to one of them is reachable), and those faces
    // are saturated by flow that comes from these vertices only, some of which are unmatched.
    const reach = residualReach(net, 0)
    const vertices: number[] = []
    const faces: number[] = []
    for (let i = 0; i < k; i++) {
      if (reach[2 + i] !== 1) continue
      const v = extremes[i]!
      vertices.push(v)
      const rot = emb.rotation[v]!
      for (let j = 0; j < rot.length; j++) {
        const e = rot[j]!
        const f = faceOfDart[g.head[e] === v ? 2 * e : 2 * e + 1]!
        if (faceMark[f] === -(c0 + 1)) continue
        faceMark[f] = -(c0 + 1)
        faces.push(f)
      }
    }
    faces.sort((x, y) => x - y)
    return {vertices, faces, outerFace: outer}
  }
  const c0 = vertices[0]!
  if (baseFlow < k - 2) return {hall: hallFrom(base, -1)}
  let candidates: number[]
  if (fixedOuter !== -1 && compFaces.includes(fixedOuter)) {
    candidates = [fixedOuter]
  } else {
    // Only a face reachable from the source in the residual network can take the missing units;
    // faces with more switches first (an outer face needs n_f + 1 large angles), then by index.
    const reach = residualReach(base, 0)
    candidates = compFaces
      .filter((f) => baseFlow === k || reach[faceNode[f]!] === 1)
      .sort((x, y) => switches[y]! - switches[x]! || x - y)
  }
  for (const f0 of candidates) {
    const net: FlowNetwork = copyFlowNetwork(base)
    net.residual[sinkArc[faceNode[f0]! - 2 - k]!]! += 2
    if (baseFlow + maxFlow(net, 0, 1, k - baseFlow) !== k) {
      if (candidates.length === 1 && f0 === fixedOuter) return {hall: hallFrom(net, f0)}
      continue
    }
    for (let i = 0; i < k; i++) {
      const node = 2 + i
      for (let p = net.start[node]!; p < net.start[node + 1]!; p++) {
        const a = net.arcs[p]!
        // Forward arcs to faces (even ids) carrying flow have no residual left.
        if ((a & 1) === 0 && net.to[a]! >= 2 + k && net.residual[a] === 0) {
          assignedFace[extremes[i]!] = compFaces[net.to[a]! - 2 - k]!
        }
      }
    }
    return f0
  }
  return {}
}

/** 1 for every node reachable from s along arcs with residual capacity. */
function residualReach(net: FlowNetwork, s: number): Uint8Array {
  const seen = new Uint8Array(net.nodeCount)
  const stack = [s]
  seen[s] = 1
  while (stack.length > 0) {
    const u = stack.pop()!
    for (let p = net.start[u]!; p < net.start[u + 1]!; p++) {
      const a = net.arcs[p]!
      const v = net.to[a]!
      if (net.residual[a]! > 0 && seen[v] === 0) {
        seen[v] = 1
        stack.push(v)
      }
    }
  }
  return seen
}
