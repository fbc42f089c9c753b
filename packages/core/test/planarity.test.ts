import {describe, expect, it} from 'vitest'
import {createDigraph, nextDarts, testPlanarity, traceFaces, verifyKuratowski, verifyPlanarEmbedding, type Digraph, type KuratowskiSubgraph, type RotationSystem} from '@upright/core'
import {prng, randomMaximalPlanar, randomNonEdge, scramble, type Edges} from './support/planarity-generators.ts'

function complete(n: number): Edges {
  const e: Edges = []
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) e.push([i, j])
  return e
}
function completeBipartite(p: number, q: number): Edges {
  const e: Edges = []
  for (let i = 0; i < p; i++) for (let j = 0; j < q; j++) e.push([i, p + j])
  return e
}
function wheel(k: number): Edges { // hub 0, rim 1..k
  const e: Edges = []
  for (let i = 1; i <= k; i++) e.push([0, i], [i, (i % k) + 1])
  return e
}
function grid(w: number, h: number): Edges {
  const e: Edges = []
  for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) {
    if (x + 1 < w) e.push([y * w + x, y * w + x + 1])
    if (y + 1 < h) e.push([y * w + x, (y + 1) * w + x])
  }
  return e
}
// Petersen graph: outer 5-cycle 0..4, spokes i -> i+5, inner pentagram 5..9.
const petersen: Edges = [
  [0, 1], [1, 2], [2, 3], [3, 4], [4, 0],
  [0, 5], [1, 6], [2, 7], [3, 8], [4, 9],
  [5, 7], [7, 9], [9, 6], [6, 8], [8, 5],
]

/** Certified answer: the certificate always goes through the independent checker. */
function run(n: number, edges: Edges): {g: Digraph; r: ReturnType<typeof testPlanarity>} {
  const g = createDigraph(n, edges)
  const r = testPlanarity(g)
  const check = r.planar ? verifyPlanarEmbedding(r.embedding) : verifyKuratowski(g, r.kuratowski)
  if (!check.ok) throw new Error(`certificate rejected: ${check.reason}`)
  return {g, r}
}
function embedding(n: number, edges: Edges): RotationSystem {
  const {r} = run(n, edges)
  if (!r.planar) throw new Error('expected planar')
  return r.embedding
}
function kuratowski(n: number, edges: Edges): KuratowskiSubgraph {
  const {r} = run(n, edges)
  if (r.planar) throw new Error('expected non-planar')
  return r.kuratowski
}

describe('OEIS A066537: labeled planar graphs on n nodes, 1, 1, 2, 8, 64, 1023, 32071 (n = 0..6)', () => {
  it('counts planar graphs over all 2^C(n,2) labeled graphs, every certificate checked', () => {
    const counts: number[] = []
    for (let n = 0; n <= 6; n++) {
      const all = complete(n)
      let planar = 0
      for (let mask = 0; mask < 2 ** all.length; mask++) {
        const edges = all.filter((_, i) => (mask >> i) & 1)
        if (run(n, edges).r.planar) planar++
      }
      counts.push(planar)
    }
    expect(counts).toEqual([1, 1, 2, 8, 64, 1023, 32071])
  })
})

describe('named families (Kuratowski 1930; Petersen graph non-planar, e.g. West, "Introduction to Graph Theory")', () => {
  it('K5 and K3,3 are their own Kuratowski subgraphs', () => {
    const k5 = kuratowski(5, complete(5))
    expect(k5).toEqual({type: 'K5', branch: [0, 1, 2, 3, 4], edges: [0, 1, 2, 3, 4, 5, 6, 7, 8, 9]})
    const k33 = kuratowski(6, completeBipartite(3, 3))
    expect(k33.type).toBe('K3,3')
    expect([...k33.branch.slice(0, 3)].sort()).toEqual([0, 1, 2])
    expect([...k33.branch.slice(3)].sort()).toEqual([3, 4, 5])
    expect(k33.edges).toHaveLength(9)
  })

  it('K5 and K3,3 minus any one edge are planar; K6, K7, K4,4 are not', () => {
    for (const edges of [complete(5), completeBipartite(3, 3)]) {
      for (let i = 0; i < edges.length; i++) {
        expect(run(6, edges.filter((_, j) => j !== i)).r.planar).toBe(true)
      }
    }
    // (certificates checked inside kuratowski(); K4,4 holds both a K3,3 and a subdivided K5)
    expect(['K5', 'K3,3']).toContain(kuratowski(6, complete(6)).type)
    expect(['K5', 'K3,3']).toContain(kuratowski(7, complete(7)).type)
    expect(['K5', 'K3,3']).toContain(kuratowski(8, completeBipartite(4, 4)).type)
  })

  it('Petersen graph: non-planar, and being cubic its Kuratowski subgraph is a subdivided K3,3', () => {
    const k = kuratowski(10, petersen)
    expect(k.type).toBe('K3,3')
    expect(k.edges.length).toBeGreaterThan(9)
  })

  it('wheels, grids and trees are planar, with F = E - V + 2 faces', () => {
    for (let k = 3; k <= 30; k++) {
      const emb = embedding(k + 1, wheel(k))
      expect(traceFaces(emb).darts.length).toBe(2 * k - (k + 1) + 2) // W_k: k + 1 faces
    }
    for (const [w, h] of [[2, 2], [3, 7], [10, 10], [25, 40]] as const) {
      const e = grid(w, h)
      const emb = embedding(w * h, e)
      const faces = traceFaces(emb).darts
      expect(faces.length).toBe(e.length - w * h + 2)
      // (w-1)(h-1) square faces and one outer face of length 2(w-1) + 2(h-1).
      expect(faces.filter((f) => f.length === 4).length).toBe((w - 1) * (h - 1) + (w === 2 && h === 2 ? 1 : 0))
    }
    const star: Edges = Array.from({length: 20}, (_, i) => [0, i + 1])
    expect(traceFaces(embedding(21, star)).darts).toHaveLength(1)
  })

  it('random maximal planar graphs: planar, every face a triangle; with one more edge: non-planar', () => {
    const rand = prng(42)
    for (let i = 0; i < 60; i++) {
      const n = 4 + Math.floor(rand() * 200)
      const edges = randomMaximalPlanar(n, rand)
      expect(edges).toHaveLength(3 * n - 6)
      const faces = traceFaces(embedding(n, scramble(n, edges, rand))).darts
      expect(faces).toHaveLength(2 * n - 4)
      expect(faces.every((f) => f.length === 3)).toBe(true)
      if (n >= 5) {
        const k = kuratowski(n, [...edges, randomNonEdge(n, edges, rand)])
        expect(['K5', 'K3,3']).toContain(k.type)
      }
    }
  })
})

describe('graph shapes', () => {
  it('handles the empty graph, isolated vertices, and several components (V - E + F = 1 + C)', () => {
    expect(run(0, []).r.planar).toBe(true)
    expect(embedding(4, []).rotation.map((r) => r.length)).toEqual([0, 0, 0, 0])
    // two triangles, a K4, an isolated vertex and a bridge between blocks: C = 3 components
    const edges: Edges = [[0, 1], [1, 2], [2, 0], [2, 3], [3, 4], [4, 5], [5, 3], [6, 7], [6, 8], [6, 9], [7, 8], [7, 9], [8, 9]]
    const emb = embedding(11, edges)
    const faces = traceFaces(emb).darts.length // outer faces counted once per component with edges
    const withEdges = 2
    const isolated = 1
    // Euler per component with edges: V_i - E_i + F_i = 2; the outer faces of all components are one face.
    expect(11 - edges.length + (faces - withEdges + 1)).toBe(1 + withEdges + isolated)
  })

  it('handles a K5 and a K3,3 in separate components, reporting one of them', () => {
    const edges: Edges = [...complete(5), ...completeBipartite(3, 3).map(([u, v]) => [u + 5, v + 5] as [number, number])]
    const k = kuratowski(11, edges)
    expect(k.edges.length).toBeGreaterThanOrEqual(9)
  })

  it('handles parallel edges and self-loops: every edge is in the rotation; planarity is that of the simple graph', () => {
    const edges: Edges = [[0, 1], [1, 0], [0, 1], [1, 2], [2, 0], [2, 2], [2, 2], [0, 2]]
    const emb = embedding(3, edges)
    expect(emb.rotation.map((r) => r.length)).toEqual([5, 4, 7]) // degrees, a loop counted twice
    // K5 with every edge doubled in reverse is still non-planar; the certificate uses one copy of each.
    const k5 = complete(5)
    const k = kuratowski(5, [...k5, ...k5.map(([u, v]) => [v, u] as [number, number]), [3, 3]])
    expect(k.type).toBe('K5')
  })

  it('runs without recursion on a path of 300,000 vertices and a 30,000-vertex maximal planar graph', () => {
    const n = 300_000
    const path: Edges = Array.from({length: n - 1}, (_, i) => [i, i + 1])
    expect(embedding(n, path).rotation[n - 1]).toHaveLength(1)
    const rand = prng(3)
    const big = randomMaximalPlanar(30_000, rand)
    expect(traceFaces(embedding(30_000, big)).darts).toHaveLength(2 * 30_000 - 4)
  })

  it('is deterministic: the same input gives the same output', () => {
    const rand = prng(9)
    const edges = randomMaximalPlanar(50, rand)
    const a = embedding(50, edges).rotation.map((r) => [...r])
    const b = embedding(50, edges).rotation.map((r) => [...r])
    expect(a).toEqual(b)
    const k1 = kuratowski(10, petersen)
    expect(kuratowski(10, petersen)).toEqual(k1)
  })

  it('its flat rotation (one buffer plus offsets) lists the same rotations as the per-vertex views, and faces agree', () => {
    const rand = prng(21)
    const simple = randomMaximalPlanar(200, rand)
    const multi: Edges = [...simple, [simple[0]![1], simple[0]![0]], simple[5]!] // parallel copies
    for (const edges of [simple, multi]) {
      const emb = embedding(200, edges)
      const {rotationStart: start, rotationOrder: order} = emb
      expect(start && order).toBeTruthy()
      for (let v = 0; v < 200; v++) expect([...emb.rotation[v]!]).toEqual([...order!.subarray(start![v], start![v + 1])])
      // nextDarts reads the flat form when present; the same system given as views only must agree.
      expect(nextDarts(emb)).toEqual(nextDarts({graph: emb.graph, rotation: emb.rotation}))
    }
  })
})

describe('the checkers reject bad certificates (they must be able to fail)', () => {
  const k4: Edges = complete(4)
  it('verifyPlanarEmbedding', () => {
    const g = createDigraph(4, k4)
    const good = embedding(4, k4)
    expect(verifyPlanarEmbedding(good)).toEqual({ok: true})
    // K4 is 3-connected: its planar rotation is unique up to mirror (Whitney 1932), so reversing one
    // vertex's order makes a torus embedding.
    const flipped = good.rotation.map((r, v) => (v === 0 ? Int32Array.from([...r].reverse()) : r))
    expect(verifyPlanarEmbedding({graph: g, rotation: flipped}).ok).toBe(false)
    const missing = good.rotation.map((r, v) => (v === 1 ? r.subarray(1) : r))
    expect(verifyPlanarEmbedding({graph: g, rotation: missing}).ok).toBe(false)
    const wrongVertex = good.rotation.map((r, v) => (v === 3 ? Int32Array.from([...r, 0]) : r))
    expect(verifyPlanarEmbedding({graph: g, rotation: wrongVertex}).ok).toBe(false)
    expect(verifyPlanarEmbedding({graph: g, rotation: good.rotation.slice(1)}).ok).toBe(false)
    // K5 with any rotation is rejected.
    const k5 = createDigraph(5, complete(5))
    const rot = Array.from({length: 5}, (_, v) => Int32Array.from(complete(5).flatMap(([a, b], e) => (a === v || b === v ? [e] : []))))
    expect(verifyPlanarEmbedding({graph: k5, rotation: rot}).ok).toBe(false)
  })

  it('verifyKuratowski', () => {
    const k33 = createDigraph(6, completeBipartite(3, 3))
    const all = [0, 1, 2, 3, 4, 5, 6, 7, 8]
    expect(verifyKuratowski(k33, {type: 'K3,3', branch: [0, 1, 2, 3, 4, 5], edges: all})).toEqual({ok: true})
    expect(verifyKuratowski(k33, {type: 'K3,3', branch: [0, 3, 2, 1, 4, 5], edges: all}).ok).toBe(false)
    expect(verifyKuratowski(k33, {type: 'K3,3', branch: [0, 1, 2, 3, 4, 5], edges: all.slice(1)}).ok).toBe(false)
    expect(verifyKuratowski(k33, {type: 'K3,3', branch: [0, 1, 2, 3, 4, 5], edges: [...all].reverse()}).ok).toBe(false)
    expect(verifyKuratowski(k33, {type: 'K5', branch: [0, 1, 2, 3, 4], edges: all}).ok).toBe(false)
    const k5 = createDigraph(5, complete(5))
    expect(verifyKuratowski(k5, {type: 'K5', branch: [0, 1, 2, 3, 4], edges: [0, 1, 2, 3, 4, 5, 6, 7, 8]}).ok).toBe(false)
    // A subdivided K3,3 plus a pendant edge, and plus a disjoint triangle.
    const sub = createDigraph(10, [...completeBipartite(3, 3), [0, 6], [7, 8], [8, 9], [9, 7]])
    expect(verifyKuratowski(sub, {type: 'K3,3', branch: [0, 1, 2, 3, 4, 5], edges: [...all, 9]}).ok).toBe(false)
    expect(verifyKuratowski(sub, {type: 'K3,3', branch: [0, 1, 2, 3, 4, 5], edges: [...all, 10, 11, 12]}).ok).toBe(false)
    // Parallel copies are not a subdivision.
    const par = createDigraph(6, [...completeBipartite(3, 3), [3, 0]])
    expect(verifyKuratowski(par, {type: 'K3,3', branch: [0, 1, 2, 3, 4, 5], edges: [...all, 9]}).ok).toBe(false)
  })
})
