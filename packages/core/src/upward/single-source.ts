/**
 * Upward planarity of a single-source digraph in polynomial time, after Bertolazzi, Di Battista,
 * Mannino & Tamassia, "Optimal upward planarity testing of single-source digraphs", SIAM J.
 * Comput. 27(1), 1998 (their test is linear; this one is O(n²), see below). Also Hutton & Lubiw,
 * "Upward planar drawing of single-source acyclic digraphs", SIAM J. Comput. 25(2), 1996.
 *
 * Steps, each a fact from the 1998 paper (and each checked against a brute-force oracle in the tests):
 * 1. Expansion graph X: every vertex v with both in- and out-edges is split into v (keeping the
 *    in-edges) and v' (taking the out-edges) joined by v -> v'. Planar embeddings of X are exactly
 *    the bimodal embeddings of G, and X is upward planar iff G is. X has G's single source s.
 * 2. X is upward planar iff each of its blocks is; each block is single-source (its source is the
 *    cut vertex toward s, or s).
 * 3. For a block B, take its SPQR tree (decompose/triconnected.ts). For every virtual edge (u, v)
 *    of a skeleton, let K be the part of B it stands for; replace the virtual edge, by the degrees
 *    of u and v in K and in B − K and whether s lies inside K, by a directed edge or by a "peak"
 *    u -> p <- v (the rules of the paper's sT-skeleton, in `standIn` below). B is upward planar iff
 *    every such sT-skeleton is acyclic, every R-skeleton's sT-skeleton (whose embedding is fixed up
 *    to a mirror image) is upward planar for some outer face, and the tree can be rooted at a real
 *    edge so that (a) the part holding s lies toward the root from every skeleton without s, and
 *    (b) every skeleton edge that lies on no possible outer face of its R-skeleton points away from
 *    the root.
 * Complexity: the triconnected components take O(m²) here (not the linear Hopcroft–Tarjan path
 * search), and each R-skeleton tries each face as the outer one with the fixed-embedding flow
 * test (O(F·m) for that skeleton), so O(n²) in all on planar inputs; the rooting is linear.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {findCycle} from '../acyclic/find-cycle.ts'
import {blocksOf} from '../decompose/blocks.ts'
import {DecompositionStopped, triconnectedComponents, type ComponentKind, type TriconnectedComponents} from '../decompose/triconnected.ts'
import {testPlanarity} from '../planarity/test-planarity.ts'
import {dartHead, nextDarts, traceFaces, type Faces, type RotationSystem} from '../embedding/rotation-system.ts'
import {isBimodal} from './bimodal.ts'
import {testUpwardEmbedded} from './fixed-embedding.ts'
import {int32Rows} from './int32-rows.ts'

/** The source of g when g is acyclic with exactly one source and every vertex has an edge, else -1. */
export function singleSourceOf(g: Digraph): number {
  let s = -1
  for (let v = 0; v < g.vertexCount; v++) {
    if (g.inStart[v + 1] !== g.inStart[v]) continue
    if (s !== -1 || g.outStart[v + 1] === g.outStart[v]) return -1
    s = v
  }
  return s
}

/** Expansion graph of step 1: edge list on n + (number of split vertices) vertices; edge e < m is G's edge e. */
export function expansionGraph(g: Digraph): {vertexCount: number; edges: Array<[number, number]>; outCopy: Int32Array} {
  const n = g.vertexCount
  const outCopy = new Int32Array(n).fill(-1)
  let count = n
  for (let v = 0; v < n; v++) {
    if (g.inStart[v + 1] !== g.inStart[v] && g.outStart[v + 1] !== g.outStart[v]) outCopy[v] = count++
  }
  const edges: Array<[number, number]> = []
  for (let e = 0; e < g.edgeCount; e++) {
    const t = g.tail[e]!
    edges.push([outCopy[t]! >= 0 ? outCopy[t]! : t, g.head[e]!])
  }
  for (let v = 0; v < n; v++) if (outCopy[v]! >= 0) edges.push([v, outCopy[v]!])
  return {vertexCount: count, edges, outCopy}
}

/**
 * Decides upward planarity of an acyclic digraph whose vertices with edges form one weakly
 * connected piece with exactly one source. Throws RangeError otherwise (a caller's bug).
 */
export function isUpwardPlanarSingleSource(g: Digraph): boolean {
  return upwardRotationSingleSource(g) !== null
}

/**
 * As isUpwardPlanarSingleSource, and for "yes" a bimodal planar rotation system of g (edge ids of g
 * per vertex, clockwise) that has an upward drawing; null for "no". The large angles and outer face
 * are left to the fixed-embedding test (fixed-embedding.ts), which the tests run on every answer.
 * With `expired` (a time budget) it may answer 'budget' instead: it asks between blocks, between
 * skeletons and inside the decomposition.
 */
export function upwardRotationSingleSource(g: Digraph): number[][] | null
export function upwardRotationSingleSource(g: Digraph, expired: () => boolean): number[][] | null | 'budget'
export function upwardRotationSingleSource(g: Digraph, expired?: () => boolean): number[][] | null | 'budget' {
  try {
    return rotationOrNull(g, expired ?? (() => false))
  } catch (e) {
    if (e instanceof DecompositionStopped) return 'budget'
    throw e
  }
}

function rotationOrNull(g: Digraph, expired: () => boolean): number[][] | null {
  if (!findCycle(g).acyclic) throw new RangeError('upwardRotationSingleSource needs an acyclic digraph')
  let s = -1
  for (let v = 0; v < g.vertexCount; v++) {
    if (g.inStart[v + 1] === g.inStart[v] && g.outStart[v + 1] !== g.outStart[v]) {
      if (s !== -1) throw new RangeError('upwardRotationSingleSource needs a single source')
      s = v
    }
  }
  const rotation: number[][] = Array.from({length: g.vertexCount}, () => [])
  if (g.edgeCount === 0) return rotation
  const x = expansionGraph(g)
  const blocks = blocksOf(x.vertexCount, x.edges)
  const embedded: Array<{edges: number[]; rot: Map<number, number[]>; largeAt: Map<number, number>; source: number}> = []
  for (const block of blocks) {
    const pairs = block.map((e) => x.edges[e]!)
    if (expired()) throw new DecompositionStopped()
    const r = block.length === 1 ? singleEdgeBlock(pairs[0]!) : embedBlock(pairs, expired)
    if (r === null) return null
    // block-local edge ids -> X edge ids
    const rot = new Map<number, number[]>()
    for (const [v, seq] of r.rot) rot.set(v, seq.map((i) => block[i]!))
    const largeAt = new Map<number, number>()
    for (const [v, i] of r.largeAt) largeAt.set(v, block[i]!)
    embedded.push({edges: block, rot, largeAt, source: r.source})
  }
  // Glue the blocks at cut vertices, from s outward. A block hangs from its source w; it goes into
  // w's angle between its last in-edge and first out-edge in the block above (a non-switch angle),
  // or into w's large angle there when w has no out-edge in it; the hung block is cut open at w's
  // large angle, which lies in its outer face. Either way the face counts of the fixed-embedding
  // condition still balance (the hung block's outer face joins one face of the block above).
  const blocksAt = new Map<number, number[]>()
  embedded.forEach((b, i) => {
    for (const v of b.rot.keys()) {
      const l = blocksAt.get(v)
      if (l === undefined) blocksAt.set(v, [i])
      else l.push(i)
    }
  })
  const xTail = (e: number) => x.edges[e]![0]
  const xRot = new Map<number, number[]>()
  const placed = new Uint8Array(embedded.length)
  const queue: number[] = []
  for (const i of blocksAt.get(s)!) {
    placed[i] = 1
    queue.push(i)
  }
  // s itself: its blocks one after another, each cut at s's large angle
  xRot.set(s, queue.flatMap((i) => cutAtLarge(embedded[i]!, s)))
  for (let qi = 0; qi < queue.length; qi++) {
    const b = embedded[queue[qi]!]!
    for (const [v, seq] of b.rot) {
      if (v === b.source) continue
      let here = xRot.get(v) ?? seq.slice()
      if (!xRot.has(v)) xRot.set(v, here)
      for (const j of blocksAt.get(v)!) {
        if (placed[j]) continue
        placed[j] = 1
        queue.push(j)
        const child = cutAtLarge(embedded[j]!, v)
        // insertion point in v's rotation within block b
        let at = -1
        for (let k = 0; k < here.length && at === -1; k++) {
          const e = here[k]!, f = here[(k + 1) % here.length]!
          if (xTail(e) !== v && xTail(f) === v) at = k + 1
        }
        if (at === -1) at = here.indexOf(b.largeAt.get(v)!) + 1
        here = [...here.slice(0, at), ...child, ...here.slice(at)]
        xRot.set(v, here)
      }
    }
  }
  // contract every expansion edge v -> v'
  const m = g.edgeCount
  for (let v = 0; v < g.vertexCount; v++) {
    const r = xRot.get(v)
    if (r === undefined) continue
    const c = x.outCopy[v]!
    if (c === -1) {
      // a copy built by push: r may be holey, and assignLargeAngles, fed holey and packed rows, deoptimized
      const row: number[] = []
      for (const e of r) row.push(e)
      rotation[v] = row
      continue
    }
    const rc = xRot.get(c)!
    const i = r.findIndex((e) => e >= m), j = rc.findIndex((e) => e >= m)
    rotation[v] = [...r.slice(0, i), ...rc.slice(j + 1), ...rc.slice(0, j), ...r.slice(i + 1)]
  }
  return rotation
}

/** v's rotation in block b, starting just after v's large angle (which ends the sequence). */
function cutAtLarge(b: {rot: Map<number, number[]>; largeAt: Map<number, number>}, v: number): number[] {
  const seq = b.rot.get(v)!
  const i = seq.indexOf(b.largeAt.get(v)!)
  return [...seq.slice(i + 1), ...seq.slice(0, i + 1)]
}

interface BlockEmbedding {
  /** Rotation per vertex (block-local edge ids, clockwise). */
  rot: Map<number, number[]>
  /** For the block's source and each vertex with only in-edges in it: the edge after which its large angle lies. */
  largeAt: Map<number, number>
  source: number
}

function singleEdgeBlock([a, b]: readonly [number, number]): BlockEmbedding {
  return {rot: new Map([[a, [0]], [b, [0]]]), largeAt: new Map([[a, 0], [b, 0]]), source: a}
}

interface PoleDegrees {
  /** In- and out-degree of the poles a and b (the link's endpoints) in the part. */
  inA: number
  outA: number
  inB: number
  outB: number
  /** The block's source lies in the part and is not a pole. */
  hasSource: boolean
}

/** How a skeleton edge appears in its sT-skeleton: sT edge ids (j1 = a -> p, j2 = b -> p for a peak p). */
interface StandIn {
  kind: 'real' | 'directed' | 'peak'
  j1: number
  j2: number
  peak: number
}

interface SkeletonInfo {
  local: Map<number, number>
  verts: number[]
  /** Vertex count of the sT-skeleton (skeleton vertices, then peaks). */
  size: number
  st: Array<[number, number]>
  stOwner: number[]
  stand: StandIn[]
  /** For R-skeletons: the (unique up to mirror image) planar rotation of the sT-skeleton. */
  rotation: Int32Array[] | null
}

/**
 * Step 3 for one block (a single-source biconnected digraph given by its edges, at least two):
 * null when it is not upward planar, else an upward embedding built top-down from a root edge
 * allowed by the constraints: each skeleton's sT-skeleton is embedded with an outer face beside its
 * reference edge, mirrored so that the part it stands for opens toward the face that its peak's
 * large angle took in the skeleton above (the paper's embedding step), and the skeletons are
 * spliced along their virtual edges.
 */
function embedBlock(edges: ReadonlyArray<readonly [number, number]>, expired: () => boolean): BlockEmbedding | null {
  const indeg = new Map<number, number>(), outdeg = new Map<number, number>()
  for (const [a, b] of edges) {
    outdeg.set(a, (outdeg.get(a) ?? 0) + 1)
    indeg.set(b, (indeg.get(b) ?? 0) + 1)
    if (!indeg.has(a)) indeg.set(a, 0)
    if (!outdeg.has(b)) outdeg.set(b, 0)
  }
  let s = -1
  for (const [v, d] of indeg) if (d === 0) s = v
  let maxVertex = 0
  for (const [a, b] of edges) maxVertex = Math.max(maxVertex, a, b)
  const tc = triconnectedComponents(maxVertex + 1, edges, expired)
  const tree = rootTree(tc)
  const down = pertinentDegrees(tc, tree, edges, s)

  const C = tc.components.length
  // rooting constraints: forbidden Euler-tour intervals of components, and forbidden real edges
  const forbidDiff = new Int32Array(C + 1)
  const forbidRange = (from: number, to: number) => {
    forbidDiff[from]!++
    forbidDiff[to]!--
  }
  /** The root must lie on the far side of link l as seen from component c. */
  const rootBeyond = (c: number, l: number) => {
    const [p, q] = tc.links[l]!.node
    const child = tree.parentLink[p] === l ? p : q
    if (child === c) forbidRange(tree.tin[child]!, tree.tout[child]!)
    else {
      forbidRange(0, tree.tin[child]!)
      forbidRange(tree.tout[child]!, C)
    }
  }
  const forbiddenReal = new Set<number>()
  const infos: SkeletonInfo[] = []

  for (let c = 0; c < C; c++) {
    if ((c & 63) === 0 && expired()) throw new DecompositionStopped()
    const comp = tc.components[c]!
    const local = new Map<number, number>()
    const verts: number[] = []
    for (const e of comp.edges) {
      for (const v of [e.a, e.b]) {
        if (!local.has(v)) {
          local.set(v, verts.length)
          verts.push(v)
        }
      }
    }
    let size = verts.length
    const st: Array<[number, number]> = []
    const stOwner: number[] = []
    const stand: StandIn[] = []
    let sideWithSource = -1
    comp.edges.forEach((e, i) => {
      const u = local.get(e.a)!, v = local.get(e.b)!
      if (e.real !== -1) {
        const [t] = edges[e.real]!
        stand.push({kind: 'real', j1: st.length, j2: -1, peak: -1})
        st.push(t === e.a ? [u, v] : [v, u])
        stOwner.push(i)
        return
      }
      const k = farSide(tc, tree, down, indeg, outdeg, s, c, i)
      if (k.hasSource) sideWithSource = e.virtual
      const shape = standIn(k)
      if (shape === 'peak') {
        const p = size++
        stand.push({kind: 'peak', j1: st.length, j2: st.length + 1, peak: p})
        st.push([u, p], [v, p])
        stOwner.push(i, i)
      } else {
        stand.push({kind: 'directed', j1: st.length, j2: -1, peak: -1})
        st.push(shape === 'a->b' ? [u, v] : [v, u])
        stOwner.push(i)
      }
    })
    const info: SkeletonInfo = {local, verts, size, st, stOwner, stand, rotation: null}
    infos.push(info)
    if (!local.has(s)) {
      if (sideWithSource === -1) throw new Error('internal: the source is in no part of a skeleton without it')
      rootBeyond(c, sideWithSource)
    }
    const sk = createDigraph(size, st)
    if (!findCycle(sk).acyclic) return null
    if (comp.kind !== 'R') continue
    const planar = testPlanarity(sk)
    if (!planar.planar) return null
    info.rotation = int32Rows(planar.embedding.rotation, (r) => r)
    const emb = {graph: sk, rotation: info.rotation}
    const faces = traceFaces(emb)
    const possible = possibleOuterFaces(emb, faces)
    const marked = new Uint8Array(comp.edges.length)
    let any = false
    for (let f = 0; f < faces.darts.length; f++) {
      if (!possible[f]) continue
      any = true
      for (const d of faces.darts[f]!) marked[stOwner[d >> 1]!] = 1
    }
    if (!any) return null
    comp.edges.forEach((e, i) => {
      if (marked[i]) return
      if (e.real !== -1) forbiddenReal.add(e.real)
      else {
        const l = tc.links[e.virtual]!
        rootBeyond(l.node[0] === c ? l.node[1] : l.node[0], e.virtual)
      }
    })
  }

  // a real edge whose component is not forbidden and which is not itself forbidden can be the root
  const forbiddenAt = new Int32Array(C)
  let run = 0
  for (let i = 0; i < C; i++) {
    run += forbidDiff[i]!
    forbiddenAt[i] = run
  }
  let rootComp = -1, rootEdge = -1
  for (let c = 0; c < C && rootComp === -1; c++) {
    if (forbiddenAt[tree.tin[c]!]! > 0) continue
    const e = tc.components[c]!.edges.findIndex((f) => f.real !== -1 && !forbiddenReal.has(f.real))
    if (e !== -1) {
      rootComp = c
      rootEdge = e
    }
  }
  if (rootComp === -1) return null
  return assemble(tc, infos, edges, s, rootComp, rootEdge, tree.linksOf)
}

/**
 * The faces that can be the outer face of an upward drawing of an embedded single-source digraph
 * (connected, acyclic), in O(m α(m)): the face-sink characterization of the 1998 paper (their
 * "face-sink graph"), in this form: with every vertex bimodal, join each face to every sink with an
 * angle in it, and count in each face its sink-switch angles at vertices that are not sinks (each
 * must be that face's one small top). The embedding is upward with outer face h iff these joins make
 * a forest, h's tree holds no such top, every other tree exactly one, and the source is on h.
 * (Every inner face has exactly one small sink-switch angle and the outer face none; a sink has one
 * large angle; the counts balance by Euler's formula.) With several sources it falls back to the
 * flow test per face.
 */
function possibleOuterFaces(emb: RotationSystem, faces: Faces): Uint8Array {
  const g = emb.graph
  const F = faces.darts.length
  const out = new Uint8Array(F)
  let source = -1, sources = 0
  for (let v = 0; v < g.vertexCount; v++) {
    if (g.inStart[v + 1] === g.inStart[v] && g.outStart[v + 1] !== g.outStart[v]) {
      source = v
      sources++
    }
  }
  if (sources !== 1) {
    for (let f = 0; f < F; f++) out[f] = testUpwardEmbedded(emb, {outerFace: f}).ok ? 1 : 0
    return out
  }
  if (!isBimodal(emb).ok) return out
  const next = nextDarts(emb)
  // union-find over faces 0..F-1 and sinks F + v
  const parent = new Int32Array(F + g.vertexCount)
  for (let i = 0; i < parent.length; i++) parent[i] = i
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]!]!
      i = parent[i]!
    }
    return i
  }
  const tops = new Int32Array(F + g.vertexCount)
  for (let d = 0; d < 2 * g.edgeCount; d++) {
    // the angle named by d at v = head of d: a sink switch when d's edge and next[d]'s edge both enter v
    if ((d & 1) !== 0 || (next[d]! & 1) !== 1) continue
    const v = g.head[d >> 1]!
    const f = faces.faceOfDart[d]!
    if (g.outStart[v + 1] === g.outStart[v]) {
      const a = find(f), b = find(F + v)
      if (a === b) return out // a cycle: no outer face works
      parent[a] = b
      tops[b]! += tops[a]!
    } else {
      tops[find(f)]!++
    }
  }
  let free = -1
  for (let f = 0; f < F; f++) {
    const r = find(f)
    if (tops[r]! > 1) return out
    if (tops[r] === 0) {
      if (free !== -1 && free !== r) return out
      free = r
    }
  }
  if (free === -1) return out
  for (let d = 0; d < 2 * g.edgeCount; d++) {
    if (dartHead(g, d) === source && find(faces.faceOfDart[d]!) === free) out[faces.faceOfDart[d]!] = 1
  }
  return out
}

type Side = 'left' | 'right'

/** Top-down embedding of the block from the root edge (index rootEdge in component rootComp). */
function assemble(
  tc: TriconnectedComponents,
  infos: readonly SkeletonInfo[],
  edges: ReadonlyArray<readonly [number, number]>,
  s: number,
  rootComp: number,
  rootEdge: number,
  linksOf: readonly (readonly number[])[]
): BlockEmbedding {
  const C = tc.components.length
  const ref = new Int32Array(C).fill(-1)
  const required: Array<Side | null> = new Array<Side | null>(C).fill(null)
  const order = [rootComp]
  const seen = new Uint8Array(C)
  seen[rootComp] = 1
  ref[rootComp] = rootEdge
  const solvedSkeletons = new Map<string, SolvedSkeleton>()
  /** Final rotation per component, as skeleton edge indices per skeleton vertex (global id). */
  const skRot: Array<Map<number, number[]>> = new Array<Map<number, number[]>>(C)
  let rootOuterDart = -1

  for (let qi = 0; qi < order.length; qi++) {
    const c = order[qi]!
    const comp = tc.components[c]!
    const info = infos[c]!
    const r = ref[c]!
    const base = info.rotation ?? simpleRotation(comp.kind, info, r)
    const leftDart = (i: number) => {
      const sd = info.stand[i]!
      if (sd.kind === 'peak') return 2 * sd.j1
      return info.st[sd.j1]![0] === info.local.get(comp.edges[i]!.a) ? 2 * sd.j1 : 2 * sd.j1 + 1
    }
    const rightDart = (i: number) => {
      const sd = info.stand[i]!
      if (sd.kind === 'peak') return 2 * sd.j2
      return leftDart(i) ^ 1
    }
    const dartOn = (side: Side, i: number) => (side === 'left' ? leftDart(i) : rightDart(i))
    // outer face beside the reference edge, on the required side if that works without a mirror.
    // Small S- and P-skeletons repeat (the same sT-skeleton, rotation, reference darts and wanted
    // side), and so do their tests: those are solved once per block, keyed by all of these inputs.
    const want = required[c]
    const key = info.rotation === null && info.st.length <= 24 ? skeletonKey(info, base, dartOn('left', r), dartOn('right', r), want) : null
    let solved = key === null ? undefined : solvedSkeletons.get(key)
    if (solved === undefined) {
      solved = outerBeside(createDigraph(info.size, info.st), base, want, (side) => dartOn(side, r), comp.kind)
      if (key !== null) solvedSkeletons.set(key, solved)
    }
    const {rotation, faces, res, side: finalSide} = solved
    if (c === rootComp) rootOuterDart = 2 * comp.edges[r]!.real + (finalSide === 'left' ? 0 : 1)
    // children
    for (const l of linksOf[c]!) {
      const link = tc.links[l]!
      const d = link.node[0] === c ? link.node[1] : link.node[0]
      if (seen[d]) continue
      seen[d] = 1
      order.push(d)
      const i = link.node[0] === c ? link.index[0] : link.index[1]
      const j = link.node[0] === c ? link.index[1] : link.index[0]
      ref[d] = j
      const sd = info.stand[i]!
      if (sd.kind !== 'peak') continue
      const face = faces.faceOfDart[res.upward.largeAngle[sd.peak]!]!
      const inParent: Side = face === faces.faceOfDart[leftDart(i)] ? 'left' : 'right'
      // splicing joins the parent's face left of a -> b with the child's face right of a -> b
      const sameNames = tc.components[d]!.edges[j]!.a === comp.edges[i]!.a
      required[d] = sameNames === (inParent === 'left') ? 'right' : 'left'
    }
    const byVertex = new Map<number, number[]>()
    info.verts.forEach((v, lv) => byVertex.set(v, Array.from(rotation[lv]!, (j) => info.stOwner[j]!)))
    skRot[c] = byVertex
  }

  // splice: each vertex starts in the first component (from the root) holding it
  const rot = new Map<number, number[]>()
  for (const c of order) {
    for (const [v, seq] of skRot[c]!) {
      if (rot.has(v)) continue
      const out: number[] = []
      // explicit stack of (component, sequence, position)
      const stack: Array<{c: number; seq: number[]; i: number}> = [{c, seq, i: 0}]
      while (stack.length > 0) {
        const top = stack[stack.length - 1]!
        if (top.i >= top.seq.length) {
          stack.pop()
          continue
        }
        const k = top.seq[top.i++]!
        const e = tc.components[top.c]!.edges[k]!
        if (e.real !== -1) {
          out.push(e.real)
          continue
        }
        const link = tc.links[e.virtual]!
        const d = link.node[0] === top.c ? link.node[1] : link.node[0]
        const childSeq = skRot[d]!.get(v)!
        const at = childSeq.indexOf(ref[d]!)
        stack.push({c: d, seq: [...childSeq.slice(at + 1), ...childSeq.slice(0, at)], i: 0})
      }
      rot.set(v, out)
    }
  }

  // large angles of the assembled block, from the fixed-embedding test with the root's outer face
  const local = new Map<number, number>()
  const verts: number[] = []
  for (const v of rot.keys()) {
    local.set(v, verts.length)
    verts.push(v)
  }
  const bg = createDigraph(verts.length, edges.map(([a, b]) => [local.get(a)!, local.get(b)!] as [number, number]))
  const emb = {graph: bg, rotation: int32Rows(verts, (v) => rot.get(v)!)}
  const faces = traceFaces(emb)
  const res = testUpwardEmbedded(emb, {outerFace: faces.faceOfDart[rootOuterDart]!})
  if (!res.ok) throw new Error(`internal: assembled block embedding is not upward (${res.reason})`)
  const largeAt = new Map<number, number>()
  verts.forEach((v, lv) => {
    const d = res.upward.largeAngle[lv]!
    if (d !== -1) largeAt.set(v, d >> 1)
  })
  return {rot, largeAt, source: s}
}

interface SolvedSkeleton {
  rotation: Int32Array[]
  faces: Faces
  res: Extract<ReturnType<typeof testUpwardEmbedded>, {ok: true}>
  /** The side of the reference edge the outer face lies on. */
  side: Side
}

/**
 * An upward embedding of a skeleton's sT-skeleton with its outer face beside the reference edge
 * (darts refDart('left'), refDart('right')): on the wanted side if the rotation allows it, else on
 * the other side and then mirrored, so that the outer face ends up on the wanted side.
 */
function outerBeside(sk: Digraph, base: Int32Array[], want: Side | null, refDart: (side: Side) => number, kind: ComponentKind): SolvedSkeleton {
  const tries: Side[] = want === 'right' ? ['right', 'left'] : ['left', 'right']
  const faces0 = traceFaces({graph: sk, rotation: base})
  let chosen: Side | null = null
  let res0: ReturnType<typeof testUpwardEmbedded> | null = null
  for (const side of tries) {
    const t = testUpwardEmbedded({graph: sk, rotation: base}, {outerFace: faces0.faceOfDart[refDart(side)]!})
    if (t.ok) {
      chosen = side
      res0 = t
      break
    }
  }
  if (chosen === null || res0 === null) throw new Error(`internal: no outer face beside the reference edge of an ${kind}-skeleton`)
  const mirror = want !== null && chosen !== want
  const rotation = mirror ? int32Rows(base, (x) => x) : base
  if (mirror) for (const r of rotation) r.reverse()
  const side: Side = mirror ? want! : chosen
  const emb = {graph: sk, rotation}
  // unmirrored: the successful try above already is this test (same embedding, same outer face)
  const faces = mirror ? traceFaces(emb) : faces0
  const res = mirror ? testUpwardEmbedded(emb, {outerFace: faces.faceOfDart[refDart(side)]!}) : res0
  if (!res.ok) throw new Error('internal: mirrored skeleton lost its upward embedding')
  return {rotation, faces, res, side}
}

/** Every input of outerBeside for a small skeleton, spelt out. */
function skeletonKey(info: SkeletonInfo, base: readonly Int32Array[], left: number, right: number, want: Side | null): string {
  let key = `${info.size} ${left} ${right} ${want ?? '-'}:`
  for (const [a, b] of info.st) key += `${a},${b};`
  for (const seq of base) key += `${seq.join(',')}|`
  return key
}

/** Rotation of an S- or P-skeleton's sT-skeleton (local vertex ids, sT edge ids). */
function simpleRotation(kind: 'S' | 'P' | 'R', info: SkeletonInfo, ref: number): Int32Array[] {
  const at: number[][] = Array.from({length: info.size}, () => [])
  info.st.forEach(([a, b], j) => {
    at[a]!.push(j)
    at[b]!.push(j)
  })
  if (kind === 'S') return int32Rows(at, (x) => x)
  // P: poles x (lower: tail of a directed edge, if any) and y. Around x: the reference edge if it
  // is a peak, the other peaks, the directed edges, the reference edge if directed; reversed at y.
  // A peak between two directed edges would have no angle for its large one.
  let x = 0
  info.stand.forEach((sd) => {
    if (sd.kind !== 'peak') x = info.st[sd.j1]![0]
  })
  const y = 1 - x
  const seq: number[] = []
  const refPeak = info.stand[ref]!.kind === 'peak'
  if (refPeak) seq.push(ref)
  info.stand.forEach((sd, i) => {
    if (i !== ref && sd.kind === 'peak') seq.push(i)
  })
  info.stand.forEach((sd, i) => {
    if (i !== ref && sd.kind !== 'peak') seq.push(i)
  })
  if (!refPeak) seq.push(ref)
  const stAt = (i: number, pole: number) => {
    const sd = info.stand[i]!
    if (sd.kind !== 'peak') return sd.j1
    return info.st[sd.j1]![0] === pole ? sd.j1 : sd.j2
  }
  const rot = int32Rows(at, (l) => l)
  rot[x] = Int32Array.from(seq.map((i) => stAt(i, x)))
  rot[y] = Int32Array.from(seq.map((i) => stAt(i, y)).reverse())
  return rot
}

interface RootedTree {
  /** For each component, the indices of the tree links (tc.links) that touch it. */
  linksOf: number[][]
  parent: Int32Array
  parentLink: Int32Array
  /** Components in BFS order from component 0. */
  order: number[]
  tin: Int32Array
  tout: Int32Array
}

function rootTree(tc: TriconnectedComponents): RootedTree {
  const C = tc.components.length
  const linksOf: number[][] = Array.from({length: C}, () => [])
  tc.links.forEach((l, i) => {
    linksOf[l.node[0]]!.push(i)
    linksOf[l.node[1]]!.push(i)
  })
  const parent = new Int32Array(C).fill(-1)
  const parentLink = new Int32Array(C).fill(-1)
  const order = [0]
  const seen = new Uint8Array(C)
  seen[0] = 1
  for (let i = 0; i < order.length; i++) {
    const c = order[i]!
    for (const l of linksOf[c]!) {
      const [p, q] = tc.links[l]!.node
      const d = p === c ? q : p
      if (seen[d]) continue
      seen[d] = 1
      parent[d] = c
      parentLink[d] = l
      order.push(d)
    }
  }
  // Euler tour (preorder) intervals
  const tin = new Int32Array(C), tout = new Int32Array(C)
  let clock = 0
  const stack: Array<[number, number]> = [[0, 0]]
  tin[0] = clock++
  while (stack.length > 0) {
    const top = stack[stack.length - 1]!
    const [c, i] = top
    if (i < linksOf[c]!.length) {
      top[1]++
      const l = linksOf[c]![i]!
      const [p, q] = tc.links[l]!.node
      const d = p === c ? q : p
      if (parentLink[d] !== l) continue
      tin[d] = clock++
      stack.push([d, 0])
    } else {
      tout[c] = clock
      stack.pop()
    }
  }
  return {linksOf, parent, parentLink, order, tin, tout}
}

/** Adds a child's in- and out-degree at vertex `v` to `deg` where v is its pole a or b. */
function addAtPole(deg: PoleDegrees, v: number, a: number, b: number, inDegree: number, outDegree: number): void {
  if (v === a) {
    deg.inA += inDegree
    deg.outA += outDegree
  }
  if (v === b) {
    deg.inB += inDegree
    deg.outB += outDegree
  }
}

/** For every component but the root: pole degrees in its pertinent part (below its parent link). */
function pertinentDegrees(
  tc: TriconnectedComponents,
  tree: RootedTree,
  edges: ReadonlyArray<readonly [number, number]>,
  s: number
): Array<PoleDegrees | null> {
  const C = tc.components.length
  const down: Array<PoleDegrees | null> = new Array<PoleDegrees | null>(C).fill(null)
  for (let i = C - 1; i >= 1; i--) {
    const c = tree.order[i]!
    const comp = tc.components[c]!
    const pl = tree.parentLink[c]!
    const ref = comp.edges.find((e) => e.virtual === pl)!
    const a = ref.a, b = ref.b
    const deg: PoleDegrees = {inA: 0, outA: 0, inB: 0, outB: 0, hasSource: false}
    for (const e of comp.edges) {
      if (e === ref) continue
      if (e.real !== -1) {
        const [t, h] = edges[e.real]!
        addAtPole(deg, t, a, b, 0, 1)
        addAtPole(deg, h, a, b, 1, 0)
      } else {
        const l = tc.links[e.virtual]!
        const child = l.node[0] === c ? l.node[1] : l.node[0]
        const sub = down[child]!
        const childRef = tc.components[child]!.edges.find((f) => f.virtual === e.virtual)!
        deg.hasSource ||= sub.hasSource
        // a pole of the child counts where it is a or b (it may be neither)
        addAtPole(deg, childRef.a, a, b, sub.inA, sub.outA)
        addAtPole(deg, childRef.b, a, b, sub.inB, sub.outB)
      }
      if (s !== a && s !== b && (e.a === s || e.b === s)) deg.hasSource = true
    }
    down[c] = deg
  }
  return down
}

interface FarSide extends PoleDegrees {
  a: number
  b: number
  /** u (a) and v (b) are sources of B − K. */
  aSourceOutside: boolean
  bSourceOutside: boolean
}

/** The part K that skeleton edge i of component c stands for, with degrees in K and in B − K. */
function farSide(
  tc: TriconnectedComponents,
  tree: RootedTree,
  down: ReadonlyArray<PoleDegrees | null>,
  indeg: ReadonlyMap<number, number>,
  outdeg: ReadonlyMap<number, number>,
  s: number,
  c: number,
  i: number
): FarSide {
  const e = tc.components[c]!.edges[i]!
  const l = tc.links[e.virtual]!
  const other = l.node[0] === c ? l.node[1] : l.node[0]
  // one object per virtual edge, built in place (no spreads: this runs once per skeleton edge)
  if (tree.parentLink[other] === e.virtual) {
    // K is the pertinent part of the child `other`, with poles named as in that child
    const ref = tc.components[other]!.edges.find((f) => f.virtual === e.virtual)!
    const sub = down[other]!
    const same = ref.a === e.a
    const inA = same ? sub.inA : sub.inB, inB = same ? sub.inB : sub.inA
    return {
      inA,
      outA: same ? sub.outA : sub.outB,
      inB,
      outB: same ? sub.outB : sub.outA,
      hasSource: sub.hasSource,
      a: e.a,
      b: e.b,
      aSourceOutside: indeg.get(e.a)! - inA === 0,
      bSourceOutside: indeg.get(e.b)! - inB === 0
    }
  }
  // K is everything outside c's own pertinent part
  const ref = tc.components[c]!.edges.find((f) => f.virtual === e.virtual)!
  const sub = down[c]!
  const a = ref.a, b = ref.b
  return {
    inA: indeg.get(a)! - sub.inA,
    outA: outdeg.get(a)! - sub.outA,
    inB: indeg.get(b)! - sub.inB,
    outB: outdeg.get(b)! - sub.outB,
    hasSource: s !== a && s !== b && !sub.hasSource,
    a,
    b,
    aSourceOutside: sub.inA === 0,
    bSourceOutside: sub.inB === 0
  }
}

/**
 * The sT-skeleton rules of the 1998 paper for a virtual edge (a, b) standing for K: a peak
 * a -> p <- b, or a directed edge.
 */
function standIn(k: FarSide): 'peak' | 'a->b' | 'b->a' {
  const aSource = k.inA === 0, bSource = k.inB === 0
  if (aSource && bSource) return 'peak'
  if (aSource && k.outB === 0) return k.hasSource ? 'peak' : 'a->b'
  if (bSource && k.outA === 0) return k.hasSource ? 'peak' : 'b->a'
  if (aSource) return k.bSourceOutside && !k.hasSource ? 'a->b' : 'peak'
  if (bSource) return k.aSourceOutside && !k.hasSource ? 'b->a' : 'peak'
  return k.aSourceOutside ? 'a->b' : 'b->a'
}
