import {spawnSync} from 'node:child_process'
import {describe, expect, it} from 'vitest'
import {createDigraph, type RotationSystem} from '../src/index.ts'
import {testUpwardEmbedded} from '../src/upward/fixed-embedding.ts'
import {stAugment, verifyStGraph, type StAugmentation} from '../src/augment/index.ts'
import {bimodalRotationSystems, isAcyclic, isPlanarRotation, labeledDags, type Edge} from './support/upward-oracle.ts'
import {mulberry32, randomUpwardPlanar, toRotationSystem, type EmbeddedGraphData} from './support/random-st.ts'

const rs = (n: number, edges: readonly Edge[], rotation: ReadonlyArray<ArrayLike<number>>): RotationSystem => ({
  graph: createDigraph(n, edges),
  rotation: rotation.map((r) => Int32Array.from(r))
})

/** Augments an embedded graph (upward by construction), checks the result, returns it. */
function augmentChecked(emb: RotationSystem, outerFace?: number): StAugmentation {
  const res = testUpwardEmbedded(emb, outerFace === undefined ? null : {outerFace})
  expect(res.ok).toBe(true)
  if (!res.ok) throw new Error('not upward')
  const before = {tail: emb.graph.tail.slice(), head: emb.graph.head.slice(), rot: emb.rotation.map((r) => r.slice())}
  const aug = stAugment(res.upward)
  expect(verifyStGraph(emb.graph, aug, emb)).toEqual({ok: true})
  // Never mutates G or its embedding.
  const same = (a: ArrayLike<number>, b: ArrayLike<number>) => a.length === b.length && Array.prototype.every.call(a, (x, i) => x === b[i])
  expect(same(emb.graph.tail, before.tail) && same(emb.graph.head, before.head)).toBe(true)
  expect(emb.rotation.every((r, v) => same(r, before.rot[v]!))).toBe(true)
  return aug
}

/** networkx 3.6 (python3): H is a DAG with one source and one sink, and H + (s, t) is planar. */
function networkxStCheck(hs: StAugmentation[]): boolean[] {
  const script = [
    'import sys, json, networkx as nx',
    'out = []',
    'for n, edges, s, t in json.load(sys.stdin):',
    '    d = nx.MultiDiGraph()',
    '    d.add_nodes_from(range(n))',
    '    d.add_edges_from(edges)',
    '    ok = nx.is_directed_acyclic_graph(d)',
    '    ok = ok and [v for v in d if d.in_degree(v) == 0] == [s] and [v for v in d if d.out_degree(v) == 0] == [t]',
    '    u = nx.Graph(d.to_undirected())',
    '    if s != t: u.add_edge(s, t)',
    '    out.append(bool(ok and nx.check_planarity(u)[0]))',
    'json.dump(out, sys.stdout)'
  ].join('\n')
  const input = JSON.stringify(
    hs.map((a) => [a.graph.vertexCount, Array.from({length: a.graph.edgeCount}, (_, e) => [a.graph.tail[e], a.graph.head[e]]), a.source, a.sink])
  )
  const r = spawnSync('python3', ['-c', script], {input, encoding: 'utf8', maxBuffer: 1 << 28})
  if (r.status !== 0) throw new Error(`python3/networkx failed: ${r.stderr}`)
  return JSON.parse(r.stdout) as boolean[]
}

describe('stAugment: small and degenerate graphs', () => {
  it('empty graph, one vertex, isolated vertices', () => {
    const empty = augmentChecked(rs(0, [], []))
    expect([empty.source, empty.sink, empty.graph.vertexCount]).toEqual([-1, -1, 0])
    const one = augmentChecked(rs(1, [], [[]]))
    expect([one.source, one.sink, one.addedEdges.length, one.outerFace]).toEqual([0, 0, 0, -1])
    const three = augmentChecked(rs(3, [], [[], [], []]))
    expect(three.addedVertices).toEqual([3, 4])
    expect(three.addedEdges.length).toBe(6) // s -> v -> t for each
  })

  it('a single edge is its own st-graph; a path too', () => {
    const edge = augmentChecked(rs(2, [[0, 1]], [[0], [0]]))
    expect([edge.source, edge.sink, edge.addedEdges, edge.addedVertices]).toEqual([0, 1, [], []])
    const path = augmentChecked(rs(3, [[2, 0], [0, 1]], [[0, 1], [1], [0]]))
    expect([path.source, path.sink, path.addedEdges]).toEqual([2, 1, []])
  })

  it('a vertex with two sinks above it gets one super sink', () => {
    const aug = augmentChecked(rs(3, [[0, 1], [0, 2]], [[0, 1], [0], [1]]))
    expect(aug.source).toBe(0)
    expect(aug.addedVertices).toEqual([3])
    expect(aug.sink).toBe(3)
  })

  it('directed trees and forests, in every bimodal embedding and every outer face', () => {
    const rnd = mulberry32(11)
    let count = 0
    for (let i = 0; i < 200; i++) {
      const n = 1 + Math.floor(rnd() * 7)
      const edges: Edge[] = []
      for (let v = 1; v < n; v++) {
        if (rnd() < 0.2) continue
        const u = Math.floor(rnd() * v)
        edges.push(rnd() < 0.5 ? [u, v] : [v, u])
      }
      for (const rotation of bimodalRotationSystems(n, edges, 500)) {
        augmentChecked(rs(n, edges, rotation))
        count++
      }
    }
    expect(count).toBeGreaterThan(250)
  })
})

describe('stAugment against exhaustive embeddings', () => {
  it('every labeled DAG on <= 4 vertices (543 on 4, OEIS A003024), every bimodal planar embedding and outer face', () => {
    let augmented = 0
    for (const n of [1, 2, 3, 4]) {
      for (const edges of labeledDags(n)) {
        for (const rotation of bimodalRotationSystems(n, edges)) {
          if (!isPlanarRotation(n, edges, rotation)) continue
          const emb = rs(n, edges, rotation)
          const base = testUpwardEmbedded(emb)
          if (!base.ok) continue
          for (let f = 0; f < base.upward.faces.darts.length; f++) {
            if (!testUpwardEmbedded(emb, {outerFace: f}).ok) continue
            augmentChecked(emb, f)
            augmented++
          }
        }
      }
    }
    expect(augmented).toBeGreaterThan(1000)
  })

  it('dense planar DAGs on 5-7 vertices (flipped st-graphs), every upward embedding and outer face', () => {
    const rnd = mulberry32(3)
    let augmented = 0
    for (let i = 0; i < 500; i++) {
      const st = randomUpwardPlanar(i, 5 + Math.floor(rnd() * 3)).st
      let edges: Edge[] = st.edges.map(([u, v]) => [u, v] as Edge)
      for (let e = 0; e < edges.length; e++) {
        if (rnd() < 0.35) {
          const [u, v] = edges[e]!
          edges[e] = [v, u]
          if (!isAcyclic(st.vertexCount, edges)) edges[e] = [u, v]
        }
      }
      edges = edges.filter(() => rnd() < 0.8)
      let rotations: number[][][]
      try {
        rotations = [...bimodalRotationSystems(st.vertexCount, edges, 3000)]
      } catch {
        continue
      }
      for (const rotation of rotations) {
        if (!isPlanarRotation(st.vertexCount, edges, rotation)) continue
        const emb = rs(st.vertexCount, edges, rotation)
        const base = testUpwardEmbedded(emb)
        if (!base.ok) continue
        for (let f = 0; f < base.upward.faces.darts.length; f++) {
          if (!testUpwardEmbedded(emb, {outerFace: f}).ok) continue
          augmentChecked(emb, f)
          augmented++
        }
      }
    }
    expect(augmented).toBeGreaterThan(2000)
  })
})

describe('stAugment on random upward planar graphs', () => {
  it('spanning subgraphs of random planar st-graphs (many disconnected), checked here and by networkx', () => {
    const results: StAugmentation[] = []
    let disconnected = 0
    for (let seed = 1; seed <= 600; seed++) {
      const r: EmbeddedGraphData = randomUpwardPlanar(seed, 2 + (seed % 40), seed % 3 === 0 ? {keep: 0.25} : {})
      const aug = augmentChecked(toRotationSystem(r))
      if (aug.addedVertices.length > 0 && new Set(r.edges.flat()).size < r.vertexCount) disconnected++
      results.push(aug)
    }
    expect(disconnected).toBeGreaterThan(50)
    const nx = networkxStCheck(results)
    expect(nx.every((x) => x)).toBe(true)
    expect(nx.length).toBe(600)
  })

  it('is deterministic', () => {
    const r = randomUpwardPlanar(77, 80, {keep: 0.5})
    const a = augmentChecked(toRotationSystem(r))
    const b = augmentChecked(toRotationSystem(r))
    expect(a.embedding.rotation).toEqual(b.embedding.rotation)
    expect([a.source, a.sink, a.outerFace]).toEqual([b.source, b.sink, b.outerFace])
  })
})

describe('verifyStGraph rejects broken augmentations', () => {
  const r = randomUpwardPlanar(5, 30, {keep: 0.6})
  const emb = toRotationSystem(r)
  const res = testUpwardEmbedded(emb)
  if (!res.ok) throw new Error('fixture not upward')
  const good = stAugment(res.upward)
  const g = emb.graph
  const h = good.graph
  const withEdges = (edges: Array<[number, number]>): StAugmentation => {
    const graph = createDigraph(h.vertexCount, edges)
    return {...good, graph, embedding: {graph, rotation: good.embedding.rotation}}
  }
  const hEdges = Array.from({length: h.edgeCount}, (_, e): [number, number] => [h.tail[e]!, h.head[e]!])

  it('accepts the real one', () => {
    expect(verifyStGraph(g, good, emb)).toEqual({ok: true})
  })

  it('a reversed added edge (a second source or sink, or a cycle)', () => {
    const e = good.addedEdges[0]!
    const flipped = hEdges.map((p, i): [number, number] => (i === e ? [p[1], p[0]] : p))
    expect(verifyStGraph(g, withEdges(flipped)).ok).toBe(false)
  })

  it('a G edge changed, or an added edge missing from the list', () => {
    const changed = hEdges.map((p, i): [number, number] => (i === 0 ? [p[1], p[0]] : p))
    expect(verifyStGraph(g, withEdges(changed)).ok).toBe(false)
    expect(verifyStGraph(g, {...good, addedEdges: good.addedEdges.slice(1)}).ok).toBe(false)
  })

  it('a rotation swapped at a vertex of degree >= 3 (breaks planarity or bimodality)', () => {
    const v = good.embedding.rotation.findIndex((x) => x.length >= 3)
    const rotation = good.embedding.rotation.map((x, i) => (i === v ? Int32Array.of(x[1]!, x[0]!, ...x.slice(2)) : x))
    const bad = {...good, embedding: {graph: h, rotation}}
    expect(verifyStGraph(g, bad).ok).toBe(false)
  })

  it('a wrong source or sink, or an outer face without them', () => {
    expect(verifyStGraph(g, {...good, source: good.sink}).ok).toBe(false)
    const other = good.faces.darts.findIndex((w, f) => {
      if (f === good.outerFace) return false
      const at = new Set(Array.from(w, (d) => (d & 1 ? h.head[d >> 1] : h.tail[d >> 1])))
      return !(at.has(good.source) && at.has(good.sink))
    })
    expect(other).toBeGreaterThanOrEqual(0)
    expect(verifyStGraph(g, {...good, outerFace: other}).ok).toBe(false)
  })

  it('G embedding not kept', () => {
    const v = emb.rotation.findIndex((x) => x.length >= 3)
    if (v === -1) return
    const swapped = {graph: g, rotation: emb.rotation.map((x, i) => (i === v ? Int32Array.of(x[1]!, x[0]!, ...x.slice(2)) : x))}
    expect(verifyStGraph(g, good, swapped).ok).toBe(false)
  })
})
