/**
 * Random planar st-graphs with an embedding, and random spanning subgraphs of them, for the layout
 * tests (tests only; seeded, deterministic).
 *
 * Construction: start from the triangle s -> a -> t, s -> t and repeat two operations that keep a
 * planar st-graph with a known bimodal embedding:
 * - subdivide an edge u -> w into u -> z -> w;
 * - add a chord x -> y inside an inner face f between two of its boundary vertices with no path from y
 *   to x: both on one side of f with x below y, or x = source of f, or y = sink of f, or x strictly
 *   inside one side and y strictly inside the other. The last case cannot close a cycle because the two
 *   sides' inner vertices are incomparable (a face of a planar st-graph lies right of its left side's
 *   vertices and left of its right side's; Tamassia & Tollis 1986, lemma on the dual).
 * The embedding is kept per vertex as out-edges left to right and in-edges left to right; the
 * rotation (clockwise, y up) is out-edges left to right followed by in-edges right to left.
 *
 * A graph G is then taken as a spanning subgraph (some vertices and edges dropped, which become the
 * augmentation), relabelled so G's vertices and edges come first, as the layout expects.
 */
import {createDigraph, type Digraph} from '../../src/graph/digraph.ts'
import {traceFaces, type RotationSystem} from '../../src/embedding/rotation-system.ts'
import type {StAugmentation} from '../../src/augment/index.ts'
import type {RandomUpwardPlanar} from './random-st.ts'
import {mulberry32 as prng} from '../../../../test/support/random.ts'

export {mulberry32 as prng} from '../../../../test/support/random.ts'

export interface EmbeddedSt {
  vertexCount: number
  tail: number[]
  head: number[]
  /** Per vertex: out-edges left to right, in-edges left to right. */
  out: number[][]
  inn: number[][]
  source: number
  sink: number
}

interface Face {
  /** Left side bottom to top (vertices), right side bottom to top; both start at the face's source and end at its sink. */
  left: number[]
  right: number[]
  /** Bottom edges of the two sides at the source, and top edges at the sink. */
  leftBottom: number
  leftTop: number
  rightBottom: number
  rightTop: number
}

/** The face on the right of edge e, or undefined for the outer face. */
function faceRightOf(g: EmbeddedSt, e: number): Face | undefined {
  // Down the left side.
  let bottom = e
  for (;;) {
    const u = g.tail[bottom]!
    const outs = g.out[u]!
    if (outs[outs.length - 1] !== bottom) break
    if (g.inn[u]!.length === 0) return undefined
    bottom = g.inn[u]![g.inn[u]!.length - 1]!
  }
  const src = g.tail[bottom]!
  const k = g.out[src]!.indexOf(bottom)
  if (k + 1 >= g.out[src]!.length) return undefined
  // Up the left side.
  const left = [src]
  let top = bottom
  for (;;) {
    const w = g.head[top]!
    left.push(w)
    const ins = g.inn[w]!
    if (ins[ins.length - 1] !== top) break
    if (g.out[w]!.length === 0) return undefined
    top = g.out[w]![g.out[w]!.length - 1]!
  }
  // Up the right side.
  const rightBottom = g.out[src]![k + 1]!
  const right = [src]
  let r = rightBottom
  for (;;) {
    const y = g.head[r]!
    right.push(y)
    if (g.inn[y]![0] !== r || g.out[y]!.length === 0) break
    r = g.out[y]![0]!
  }
  if (right[right.length - 1] !== left[left.length - 1]) throw new Error('generator: face sides do not meet')
  return {left, right, leftBottom: bottom, leftTop: top, rightBottom, rightTop: r}
}

function addEdge(g: EmbeddedSt, x: number, y: number): number {
  g.tail.push(x)
  g.head.push(y)
  return g.tail.length - 1
}

export function randomEmbeddedSt(rand: () => number, vertexTarget: number, subdivideShare = 0.45): EmbeddedSt {
  // s = 0, a = 1, t = 2; edges 0: s->a, 1: a->t, 2: s->t; a lies left of s->t.
  const g: EmbeddedSt = {
    vertexCount: 3,
    tail: [0, 1, 0],
    head: [1, 2, 2],
    out: [[0, 2], [1], []],
    inn: [[], [0], [1, 2]],
    source: 0,
    sink: 2,
  }
  let failures = 0
  while (g.vertexCount < vertexTarget && failures < 10000) {
    const e = Math.floor(rand() * g.tail.length)
    if (rand() < subdivideShare) {
      const u = g.tail[e]!
      const w = g.head[e]!
      const z = g.vertexCount++
      g.out.push([])
      g.inn.push([])
      g.head[e] = z
      const e2 = addEdge(g, z, w)
      g.inn[z]!.push(e)
      g.out[z]!.push(e2)
      const ins = g.inn[w]!
      ins[ins.indexOf(e)] = e2
      void u
      continue
    }
    const f = faceRightOf(g, e)
    if (!f) { failures++; continue }
    // Candidate ends: (vertex, side, index); side 0 left, 1 right.
    const p = f.left.length - 1
    const q = f.right.length - 1
    const pick = (): [number, number] => {
      const total = p + q // left[0..p] and right[1..q-1]
      const i = Math.floor(rand() * total)
      return i <= p ? [0, i] : [1, i - p]
    }
    let done = false
    for (let attempt = 0; attempt < 6 && !done; attempt++) {
      const [sx, ix] = pick()
      const [sy, iy] = pick()
      const vx = sx === 0 ? f.left[ix]! : f.right[ix]!
      const vy = sy === 0 ? f.left[iy]! : f.right[iy]!
      const isSrc = (s: number, i: number): boolean => s === 0 && i === 0
      const isSnk = (s: number, i: number): boolean => s === 0 && i === p
      let ok: boolean
      if (isSnk(sx, ix) || isSrc(sy, iy) || vx === vy) ok = false
      else if (isSrc(sx, ix) || isSnk(sy, iy)) ok = true
      else if (sx === sy) ok = ix < iy
      else ok = true
      if (!ok) continue
      if (g.out[vx]!.some((d) => g.head[d] === vy)) continue
      const c = addEdge(g, vx, vy)
      // At x: between the sides at the source, rightmost on the left side, leftmost on the right.
      if (isSrc(sx, ix)) g.out[vx]!.splice(g.out[vx]!.indexOf(f.leftBottom) + 1, 0, c)
      else if (sx === 0) g.out[vx]!.push(c)
      else g.out[vx]!.unshift(c)
      if (isSnk(sy, iy)) g.inn[vy]!.splice(g.inn[vy]!.indexOf(f.leftTop) + 1, 0, c)
      else if (sy === 0) g.inn[vy]!.push(c)
      else g.inn[vy]!.unshift(c)
      done = true
    }
    if (!done) failures++
  }
  return g
}

export interface LayoutCase {
  graph: Digraph
  st: StAugmentation
}

/**
 * A spanning subgraph G of a random embedded st-graph H, with H as G's st-augmentation.
 * keepVertex / keepEdge: probabilities for H's vertices (source and sink use half of it) and edges.
 */
export function randomLayoutCase(
  seed: number,
  vertexTarget: number,
  keepVertex = 0.9,
  keepEdge = 0.8
): LayoutCase {
  const rand = prng(seed)
  const h = randomEmbeddedSt(rand, vertexTarget, 0.3 + 0.4 * rand())
  return subgraphCase(h, rand, keepVertex, keepEdge)
}

export function subgraphCase(h: EmbeddedSt, rand: () => number, keepVertex: number, keepEdge: number): LayoutCase {
  const nh = h.vertexCount
  const keepV: boolean[] = []
  for (let v = 0; v < nh; v++) {
    const pr = v === h.source || v === h.sink ? keepVertex / 2 : keepVertex
    keepV.push(rand() < pr)
  }
  if (!keepV.some(Boolean)) keepV[nh > 1 ? 1 : 0] = true
  const keepE = h.tail.map((_, e) => keepV[h.tail[e]!]! && keepV[h.head[e]!]! && rand() < keepEdge)
  return caseFromEmbedded(h, keepV, keepE)
}

/**
 * G = the kept vertices and kept edges (an edge is kept only with both ends), relabelled in order so
 * that they come first; H = the whole embedded st-graph.
 */
export function caseFromEmbedded(h: EmbeddedSt, keepV: ReadonlyArray<boolean>, keepE: ReadonlyArray<boolean>): LayoutCase {
  const nh = h.vertexCount
  const newId = new Int32Array(nh)
  let n = 0
  for (let v = 0; v < nh; v++) if (keepV[v]) newId[v] = n++
  let extra = n
  for (let v = 0; v < nh; v++) if (!keepV[v]) newId[v] = extra++
  const gEdges: number[] = []
  const others: number[] = []
  for (let e = 0; e < h.tail.length; e++) {
    if (keepV[h.tail[e]!] && keepV[h.head[e]!] && keepE[e]) gEdges.push(e)
    else others.push(e)
  }
  const order = gEdges.concat(others)
  const newEdge = new Int32Array(order.length)
  order.forEach((e, i) => (newEdge[e] = i))
  const pairs = order.map((e): [number, number] => [newId[h.tail[e]!]!, newId[h.head[e]!]!])
  const hg = createDigraph(nh, pairs)
  const rotation: Int32Array[] = new Array(nh)
  for (let v = 0; v < nh; v++) {
    const cw = h.out[v]!.concat(h.inn[v]!.slice().reverse())
    rotation[newId[v]!] = Int32Array.from(cw, (e) => newEdge[e]!)
  }
  const embedding: RotationSystem = {graph: hg, rotation}
  const graph = createDigraph(n, pairs.slice(0, gEdges.length))
  const faces = traceFaces(embedding)
  // The outer face lies left of the source's leftmost out-edge.
  const leftmost = h.out[h.source]![0]
  const outerFace = leftmost === undefined ? -1 : faces.faceOfDart[2 * newEdge[leftmost]!]!
  return {
    graph,
    st: {
      graph: hg,
      embedding,
      faces,
      outerFace,
      source: newId[h.source]!,
      sink: newId[h.sink]!,
      addedEdges: Array.from({length: others.length}, (_, i) => gEdges.length + i),
      addedVertices: Array.from({length: nh - n}, (_, i) => n + i),
    },
  }
}

/**
 * An embedded st-graph from edge lists: `out[v]` and `inn[v]` name v's out- and in-edges (indices
 * into `edges`) left to right. For the hand-drawn catalogue.
 */
export function embeddedSt(
  vertexCount: number,
  edges: ReadonlyArray<readonly [number, number]>,
  out: number[][],
  inn: number[][],
  source: number,
  sink: number
): EmbeddedSt {
  return {vertexCount, tail: edges.map((e) => e[0]), head: edges.map((e) => e[1]), out, inn, source, sink}
}

/** Box sizes: widths from a small set of label lengths, heights one or two text lines. */
export function randomBoxes(rand: () => number, n: number): Array<{width: number; height: number}> {
  const out: Array<{width: number; height: number}> = []
  for (let v = 0; v < n; v++) {
    out.push({width: 30 + Math.round(rand() * 90), height: rand() < 0.85 ? 28 : 46})
  }
  return out
}

/**
 * The planar st-graph that randomUpwardPlanar (the upward tests' generator) spans, as an
 * st-augmentation of the graph it returns: G's edges first, the st-graph's other edges after, its
 * rotation system and outer face as given. No upward test needed, so it scales to any size.
 */
export function augmentationOfRandomUpward(r: RandomUpwardPlanar): LayoutCase {
  const st = r.st
  const order = r.stEdge.slice()
  const inG = new Set(order)
  for (let e = 0; e < st.edges.length; e++) if (!inG.has(e)) order.push(e)
  const newId = new Int32Array(st.edges.length)
  order.forEach((e, i) => (newId[e] = i))
  const hg = createDigraph(st.vertexCount, order.map((e) => st.edges[e]!))
  const embedding: RotationSystem = {graph: hg, rotation: st.rotation.map((rot) => Int32Array.from(rot, (e) => newId[e]!))}
  const faces = traceFaces(embedding)
  const outerFace = faces.faceOfDart[2 * newId[st.outerDart >> 1]! + (st.outerDart & 1)]!
  return {
    graph: createDigraph(r.vertexCount, r.edges),
    st: {
      graph: hg,
      embedding,
      faces,
      outerFace,
      source: st.source,
      sink: st.sink,
      addedEdges: order.slice(r.stEdge.length).map((_, i) => r.stEdge.length + i),
      addedVertices: [],
    },
  }
}
