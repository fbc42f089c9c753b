/**
 * Exact upward-planarity test for any acyclic digraph, with an upward embedding for "yes" and a
 * time budget after which the answer is `undecided`, never a guess.
 *
 * Plan (each step sound on its own; lemmas in reduce.ts and below):
 * 1. Planarity of the whole graph (left-right test, linear): nonplanar means not upward.
 * 2. Per weakly connected component (a graph is upward planar iff each component is; components can
 *    stand side by side): reduce leaves, subdivision vertices and parallel paths (reduce.ts).
 * 3. On the reduced core:
 *    - no edges left: upward (the component was a tree-like piece that grows back around a vertex);
 *    - one source s and one sink t: upward iff core + (s, t) is planar (Di Battista & Tamassia,
 *      "Algorithms for plane representations of acyclic digraphs", TCS 61, 1988; s and t must share
 *      a face); the embedding of core + (s, t) minus that edge is the upward embedding;
 *    - every vertex a source or a sink: planar suffices (Di Battista, Liu & Rival, IPL 36, 1990), and
 *      the planarity embedding is checked with the face-assignment condition before it is used;
 *    - otherwise: first the planarity test's own embedding is tried with the face-assignment
 *      condition (cheap, often enough), then core + a new source S before every source + a new
 *      sink T after every sink + (S, T), an st-digraph, for planarity (sufficient: all sources and
 *      sinks on the outer face); then, for a core with one source, the polynomial single-source
 *      test (single-source.ts, Bertolazzi, Di Battista, Mannino & Tamassia, SIAM J. Comput. 27,
 *      1998; O(n²) here), and for any other the exact branch and bound over all planar embeddings
 *      (embedding-search.ts), restarted from other roots with growing node caps. When it finds
 *      nothing, the reason is "no bimodal embedding at all" if only bimodality ever cut the search,
 *      or if a bimodal-only search of similar size finishes empty; else "no upward embedding".
 * 4. The core's embedding is grown back through the reductions (grow-back.ts) and handed to the
 *    fixed-embedding test (fixed-embedding.ts), which returns the UpwardEmbedding of the input graph.
 * Only the search in 3 (reached by cores with several sources) is exponential (the problem is
 * NP-complete, Garg & Tamassia 2001); all else is linear, or O(F·m) for the assignment over all
 * outer faces, or O(n²) for the single-source test.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import type {RotationSystem} from '../embedding/rotation-system.ts'
import {traceFaces} from '../embedding/rotation-system.ts'
import {findCycle} from '../acyclic/find-cycle.ts'
import {testPlanarity} from '../planarity/test-planarity.ts'
import {isPlanarSimple} from '../planarity/left-right.ts'
import {simplify} from '../planarity/simplify.ts'
import {reduceComponent, type Reduction} from './reduce.ts'
import {growBack, writtenKeys, type AngleEmbedding} from './grow-back.ts'
import {assignLargeAngles} from './large-angle-assignment.ts'
import {searchUpwardEmbedding} from './embedding-search.ts'
import {testUpwardEmbedded} from './fixed-embedding.ts'
import {expansionGraph, upwardRotationSingleSource} from './single-source.ts'
import type {UpwardEmbedding} from './upward-embedding.ts'
import {int32Rows} from './int32-rows.ts'

export interface UpwardBudget {
  /** Wall-clock limit for one test, in milliseconds. Default 3000. */
  maxMillis: number
  /** Clock in milliseconds. Default performance.now. */
  now?: () => number
  /**
   * Prefer the written order (edge ids) where several upward embeddings exist: the branch and bound
   * tries corners in written order first (a tie-break; the answer is the same). Default false.
   */
  preferWrittenOrder?: boolean
  /**
   * The caller has found g acyclic and planar already (checkDiagram has, on g or on a graph g
   * subdivides): skip both linear tests, which at 10^4 vertices cost about as much as all else
   * before the search and would run past a short budget without looking at the clock.
   */
  knownAcyclicPlanar?: boolean
}

/**
 * Which path decided: 'planarity' (the graph is not planar), 'reduced' (every component reduced to
 * nothing), 'st', 'sources-sinks', 'first-embedding' (the planarity embedding was already upward),
 * 'extremes-outside' (all sources and sinks fit on the outer face), 'single-source' (the polynomial
 * single-source test), 'search' (branch and bound). With several components, the costliest path taken is named.
 */
export type UpwardMethod =
  | 'planarity'
  | 'reduced'
  | 'st'
  | 'sources-sinks'
  | 'first-embedding'
  | 'extremes-outside'
  | 'single-source'
  | 'search'

export type UpwardTestResult =
  | {status: 'upward'; upward: UpwardEmbedding; method: UpwardMethod; searchNodes: number}
  | {
      status: 'not-upward'
      reason: 'nonplanar' | 'not-bimodal' | 'no-upward-embedding'
      method: UpwardMethod
      searchNodes: number
    }
  | {status: 'undecided'; reason: 'budget'; searchNodes: number}

const methodRank: readonly UpwardMethod[] = ['reduced', 'st', 'sources-sinks', 'first-embedding', 'extremes-outside', 'single-source', 'search', 'planarity']

/**
 * Throws RangeError when g has a directed cycle or a self-loop: the caller checks acyclicity first
 * (with its own certificate), so reaching here with a cycle is a bug, not a property of a diagram.
 * Parallel edges are fine (a copy beside its twin changes nothing).
 */
export function testUpwardPlanarity(g: Digraph, budget?: Readonly<UpwardBudget>): UpwardTestResult {
  const known = budget?.knownAcyclicPlanar === true
  if (!known && !findCycle(g).acyclic) throw new RangeError('testUpwardPlanarity needs an acyclic digraph')
  const now = budget?.now ?? (() => performance.now())
  const deadline = now() + (budget?.maxMillis ?? 3000)
  const expired = () => now() > deadline
  let searchNodes = 0

  if (!known && !testPlanarity(g).planar) return {status: 'not-upward', reason: 'nonplanar', method: 'planarity', searchNodes}

  const n = g.vertexCount
  const rot: number[][] = Array.from({length: n}, () => [])
  const large = new Int32Array(n).fill(-1)
  let method: UpwardMethod = 'reduced'
  const raise = (m: UpwardMethod) => {
    if (methodRank.indexOf(m) > methodRank.indexOf(method)) method = m
  }
  let firstOuter = -1 // outer vertex of the component holding the lowest vertex with an edge

  for (const comp of weakComponents(g)) {
    if (expired()) return {status: 'undecided', reason: 'budget', searchNodes}
    const red = reduceComponent(g, comp)
    const core = decideCore(red, expired, budget?.preferWrittenOrder === true)
    searchNodes += core.nodes
    if (core.kind === 'budget') return {status: 'undecided', reason: 'budget', searchNodes}
    raise(core.method)
    if (core.kind === 'no') return {status: 'not-upward', reason: core.reason, method, searchNodes}
    // lift the core's embedding to working edge ids and grow it back
    const emb: AngleEmbedding = {rot, large, outerVertex: -1}
    core.rot.forEach((r, i) => {
      const v = red.coreVertices[i]!
      rot[v] = r.map((e) => red.coreEdges[e]!)
      large[v] = core.large[i]!
    })
    emb.outerVertex = core.outerVertex === -1 ? -1 : red.coreVertices[core.outerVertex]!
    growBack(red, emb)
    if (firstOuter === -1 && g.edgeCount > 0 && comp.some((v) => rot[v]!.length > 0)) firstOuter = emb.outerVertex
  }

  const rotation = int32Rows(rot, (r) => r)
  const embedding: RotationSystem = {graph: g, rotation}
  let outerFace: number | null = null
  if (firstOuter !== -1) {
    const faces = traceFaces(embedding)
    const r = rotation[firstOuter]!
    const e = r[large[firstOuter]!]!
    outerFace = faces.faceOfDart[g.head[e] === firstOuter ? 2 * e : 2 * e + 1]!
  }
  const fixed = testUpwardEmbedded(embedding, {outerFace})
  if (!fixed.ok) throw new Error(`internal: grown-back embedding rejected by the fixed-embedding test (${fixed.reason})`)
  return {status: 'upward', upward: fixed.upward, method, searchNodes}
}

type CoreDecision =
  | {kind: 'yes'; method: UpwardMethod; rot: number[][]; large: Int32Array; outerVertex: number; nodes: number}
  | {kind: 'no'; method: UpwardMethod; reason: 'not-bimodal' | 'no-upward-embedding'; nodes: number}
  | {kind: 'budget'; nodes: number}

/** Decide a reduced core; rotations use core-local vertex and edge ids. */
function decideCore(red: Reduction, expired: () => boolean, preferWrittenOrder: boolean): CoreDecision {
  const k = red.coreVertices.length
  const local = new Map<number, number>()
  red.coreVertices.forEach((v, i) => local.set(v, i))
  // Typed arrays, not Array#map results: a map result is holey or packed depending on whether the
  // caller runs optimized, and the search and assignment below, fed both, deoptimized on "wrong map".
  const m = red.coreEdges.length
  const tail = new Int32Array(m), head = new Int32Array(m)
  for (let e = 0; e < m; e++) {
    tail[e] = local.get(red.tail[red.coreEdges[e]!]!)!
    head[e] = local.get(red.head[red.coreEdges[e]!]!)!
  }
  if (m === 0) {
    return {kind: 'yes', method: 'reduced', rot: Array.from({length: k}, () => []), large: new Int32Array(k).fill(-1), outerVertex: -1, nodes: 0}
  }
  // The fast paths below are linear or O(F·m) each, and do not look at the clock: start none late.
  if (expired()) return {kind: 'budget', nodes: 0}
  const indeg = new Int32Array(k), outdeg = new Int32Array(k)
  for (let e = 0; e < m; e++) {
    outdeg[tail[e]!]!++
    indeg[head[e]!]!++
  }
  const sources: number[] = [], sinks: number[] = []
  let mixed = 0
  for (let v = 0; v < k; v++) {
    if (indeg[v] === 0) sources.push(v)
    else if (outdeg[v] === 0) sinks.push(v)
    else mixed++
  }
  const pairs: Array<[number, number]> = []
  for (let e = 0; e < m; e++) pairs.push([tail[e]!, head[e]!])
  // an embedding of core plus extra edges (ids >= m) and extra vertices (ids >= k), restricted to core
  const tryEmbedding = (emb: RotationSystem) => {
    // rows built by push, so they are always packed (see tail and head above)
    const r: number[][] = []
    for (let v = 0; v < k; v++) {
      const row: number[] = []
      for (const e of emb.rotation[v]!) if (e < m) row.push(e)
      r.push(row)
    }
    const angles = assignLargeAngles(r, tail, head)
    return angles === null ? null : {rot: r, angles}
  }

  if (sources.length === 1 && sinks.length === 1) {
    const s = sources[0]!, t = sinks[0]!
    const withST = testPlanarity(createDigraph(k, [...pairs, [s, t]]))
    if (!withST.planar) return {kind: 'no', method: 'st', reason: 'no-upward-embedding', nodes: 0}
    const found = tryEmbedding(withST.embedding)
    if (found !== null) return {kind: 'yes', method: 'st', rot: found.rot, large: found.angles.large, outerVertex: found.angles.outerVertex, nodes: 0}
  } else {
    const plain = testPlanarity(createDigraph(k, pairs))
    if (plain.planar) {
      const found = tryEmbedding(plain.embedding)
      const method: UpwardMethod = mixed === 0 ? 'sources-sinks' : 'first-embedding'
      if (found !== null) return {kind: 'yes', method, rot: found.rot, large: found.angles.large, outerVertex: found.angles.outerVertex, nodes: 0}
      // All sources and sinks on the outer face: a new source S before every source, a new sink T
      // after every sink, and S -> T make an st-digraph; if that is planar it is upward planar, and
      // so is the core inside it (sufficient only, so a failure falls through to the search).
      const S = k, T = k + 1
      const ends: Array<[number, number]> = []
      for (const v of sources) ends.push([S, v])
      for (const v of sinks) ends.push([v, T])
      ends.push([S, T])
      // A yes/no test first: when it is not planar the Kuratowski subgraph testPlanarity would extract
      // (superlinear, kuratowski.ts) is never used.
      if (expired()) return {kind: 'budget', nodes: 0}
      const outerGraph = createDigraph(k + 2, [...pairs, ...ends])
      const outer = isPlanarSimple(simplify(outerGraph).simple) ? testPlanarity(outerGraph) : undefined
      if (outer?.planar) {
        const inside = tryEmbedding(outer.embedding)
        if (inside !== null) return {kind: 'yes', method: 'extremes-outside', rot: inside.rot, large: inside.angles.large, outerVertex: inside.angles.outerVertex, nodes: 0}
      }
    }
  }

  if (sources.length === 1) {
    // One source: after the cheap checks above (so their embeddings, and drawings, stay as they
    // were), the polynomial test (single-source.ts, Bertolazzi et al. 1998) decides; never the search.
    const core = createDigraph(k, pairs)
    const rot = upwardRotationSingleSource(core, expired)
    if (rot === 'budget') return {kind: 'budget', nodes: 0}
    if (rot === null) {
      // no bimodal planar embedding at all iff the expansion graph (v split into v -> v') is nonplanar
      const x = expansionGraph(core)
      const bimodal = testPlanarity(createDigraph(x.vertexCount, x.edges)).planar
      return {kind: 'no', method: 'single-source', reason: bimodal ? 'no-upward-embedding' : 'not-bimodal', nodes: 0}
    }
    const angles = assignLargeAngles(rot, tail, head)
    if (angles === null) throw new Error('internal: single-source embedding has no large-angle assignment')
    return {kind: 'yes', method: 'single-source', rot, large: angles.large, outerVertex: angles.outerVertex, nodes: 0}
  }

  // Restarts (common practice against the heavy tails of backtracking search; Gomes, Selman & Kautz,
  // AAAI 1998): runs capped at 1024, 2048, 4096, ... nodes, each grown from another root vertex, until
  // one finds an embedding or finishes its search (a finished search is a proof of "no").
  let spent = 0
  let out: ReturnType<typeof searchUpwardEmbedding>
  const written = preferWrittenOrder ? writtenKeys(red) : undefined
  const key = written && Int32Array.from(red.coreEdges, (e) => written[e]!)
  for (let attempt = 0; ; attempt++) {
    let left = 1024 * 2 ** attempt
    const root = (attempt * 7919) % k
    let capped = false
    out = searchUpwardEmbedding(k, tail, head, 'upward', () => {
      if (--left < 0) capped = true
      return capped || expired()
    }, root, key)
    spent += out.nodes
    if (out.found !== 'budget') break
    if (!capped) return {kind: 'budget', nodes: spent}
  }
  if (out.found) {
    return {kind: 'yes', method: 'search', rot: out.rot, large: out.angles.large, outerVertex: out.angles.outerVertex, nodes: spent}
  }
  // If the assignment bound never cut, the search met only non-bimodal dead ends: no bimodal
  // embedding exists. Otherwise a bimodal-only search, capped at about the same effort, may tell; when it
  // cannot, the weaker reason is still true. Only the node cap may pick the weaker reason: the clock
  // running out here gives 'budget', so a loaded machine never turns one reason into the other.
  let reason: 'not-bimodal' | 'no-upward-embedding' = 'not-bimodal'
  let nodes = spent
  if (out.assignmentPruned) {
    let left = out.nodes + 256
    const bimodal = searchUpwardEmbedding(k, tail, head, 'bimodal', () => --left < 0 || expired())
    if (bimodal.found === 'budget' && left >= 0) return {kind: 'budget', nodes: nodes + bimodal.nodes}
    nodes += bimodal.nodes
    reason = bimodal.found === false ? 'not-bimodal' : 'no-upward-embedding'
  }
  return {kind: 'no', method: 'search', reason, nodes}
}

/** Vertex lists of the weakly connected components, each sorted, in order of lowest vertex. */
export function weakComponents(g: Digraph): number[][] {
  const n = g.vertexCount
  const seen = new Uint8Array(n)
  const out: number[][] = []
  for (let r = 0; r < n; r++) {
    if (seen[r]) continue
    seen[r] = 1
    const comp = [r]
    for (let i = 0; i < comp.length; i++) {
      const v = comp[i]!
      for (let j = g.outStart[v]!; j < g.outStart[v + 1]!; j++) {
        const w = g.head[g.outEdges[j]!]!
        if (!seen[w]) {
          seen[w] = 1
          comp.push(w)
        }
      }
      for (let j = g.inStart[v]!; j < g.inStart[v + 1]!; j++) {
        const w = g.tail[g.inEdges[j]!]!
        if (!seen[w]) {
          seen[w] = 1
          comp.push(w)
        }
      }
    }
    out.push(comp.sort((x, y) => x - y))
  }
  return out
}
