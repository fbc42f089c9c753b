import {describe, expect, it} from 'vitest'
import {createDigraph, testPlanarity, verifyPlanarEmbedding} from '@upright/core'
import {incidenceForDecision, incidenceOfDigraph, incidenceOfSimple} from '../src/planarity/incidence.ts'
import {isPlanar} from '../src/planarity/test-planarity.ts'
import {simplify} from '../src/planarity/simplify.ts'
import {prng, randomMaximalPlanar, shuffle, type Edges} from './support/planarity-generators.ts'

/** Random directions, so both out- and in-lists carry edges to larger and smaller ends. */
function directed(edges: Edges, rand: () => number): Edges {
  return edges.map(([u, v]) => (rand() < 0.5 ? [v, u] : [u, v]) as [number, number])
}

/** Draw t of a run: n vertices (up to 40 for the first 150 draws, then up to 2,000) and a random share of a random maximal planar graph's edges, randomly directed. */
function planarSample(t: number, rand: () => number): {n: number; edges: Edges} {
  const n = 3 + Math.floor(rand() * (t < 150 ? 40 : 2000))
  const all = directed(randomMaximalPlanar(n, rand), rand)
  return {n, edges: shuffle(all, rand).slice(0, Math.max(1, Math.floor(all.length * (0.3 + 0.7 * rand()))))}
}

/** The same repeats and loops every builder must decline (they go through simplify). */
function declinedByBoth(build: (g: ReturnType<typeof createDigraph>) => unknown): void {
  expect(build(createDigraph(3, [[0, 1], [1, 1]]))).toBeNull()
  expect(build(createDigraph(3, [[0, 1], [1, 2], [0, 1]]))).toBeNull()
  expect(build(createDigraph(3, [[0, 1], [1, 2], [1, 0]]))).toBeNull()
  // A vertex of degree > 16 finds repeats through its stamp array.
  const star: Edges = Array.from({length: 20}, (_, i) => [0, i + 1] as [number, number])
  expect(build(createDigraph(21, star))).not.toBeNull()
  expect(build(createDigraph(21, [...star, [7, 0]]))).toBeNull()
}

describe('incidence lists straight from a digraph', () => {
  it('are the slots the simple graph gives (same order, labelled by the digraph edge ids)', () => {
    const rand = prng(31)
    for (let t = 0; t < 200; t++) {
      const {n, edges} = planarSample(t, rand)
      const g = createDigraph(n + Math.floor(rand() * 3), edges)
      const s = simplify(g)
      const direct = incidenceOfDigraph(g)
      expect(direct).not.toBeNull()
      const viaSimple = incidenceOfSimple(s.simple, s.original)
      expect(Array.from(direct!.adjStart)).toEqual(Array.from(viaSimple.adjStart))
      expect(Array.from(direct!.other)).toEqual(Array.from(viaSimple.other))
      expect(Array.from(direct!.label)).toEqual(Array.from(viaSimple.label))
      // Without labels (the decision): the same other ends, no labels.
      const bare = incidenceOfDigraph(g, false)
      expect(Array.from(bare!.other)).toEqual(Array.from(viaSimple.other))
      expect(bare!.label.length).toBe(0)
      expect(isPlanar(g)).toBe(testPlanarity(g).planar)
    }
  })

  it('decline loops, parallel and antiparallel edges (those go through simplify)', () => {
    declinedByBoth((g) => incidenceOfDigraph(g))
  })
})

describe('left-right memory layout', () => {
  it('hubs of high degree (out-lists sorted by radix, not insertion) embed correctly: F = E - V + 2 (Euler)', () => {
    const rand = prng(77)
    for (const k of [33, 200, 1500]) {
      const wheel: Edges = []
      for (let i = 1; i <= k; i++) wheel.push([0, i], [i, (i % k) + 1])
      const r = testPlanarity(createDigraph(k + 1, directed(shuffle(wheel, rand), rand)))
      expect(r.planar).toBe(true)
      if (r.planar) expect(verifyPlanarEmbedding(r.embedding)).toEqual({ok: true})
    }
  })

  it('gives the same rotations as before the layout changes (a hash of every rotation)', () => {
    // The value was printed by the implementation at commit 4923565, before phase 1 wrote preorder
    // records, before the local out-list sort and before incidence lists came straight from the
    // digraph; drawings depend on these rotations, so a change here changes drawings.
    const rand = prng(20261202)
    let h = 0x811c9dc5
    const mix = (x: number): void => {
      h = Math.imul(h ^ (x & 0xffff), 16777619) >>> 0
      h = Math.imul(h ^ (x >>> 16), 16777619) >>> 0
    }
    const cases: Array<{n: number; edges: Edges}> = []
    for (const n of [5, 12, 50, 300, 3000]) {
      const mp = directed(randomMaximalPlanar(n, rand), rand)
      cases.push({n, edges: mp})
      cases.push({n, edges: shuffle([...mp], rand).slice(0, Math.floor(mp.length * 0.6))})
      const multi = [...mp.slice(0, Math.floor(mp.length * 0.8))]
      for (let k = 0; k < 4; k++) { const e = mp[Math.floor(rand() * mp.length)]!; multi.push([e[1], e[0]]) }
      multi.push([1, 1])
      cases.push({n, edges: shuffle(multi, rand)})
    }
    const wheel: Edges = []
    for (let i = 1; i <= 500; i++) wheel.push([0, i], [i, (i % 500) + 1])
    cases.push({n: 501, edges: shuffle(wheel, rand)})
    for (const c of cases) {
      const r = testPlanarity(createDigraph(c.n, c.edges))
      mix(r.planar ? 1 : 0)
      if (r.planar) for (const rot of r.embedding.rotation) { mix(rot.length); for (const e of rot) mix(e) }
    }
    expect(h.toString(16)).toBe('112dad77')
  })
})

describe('incidence lists for the decision alone', () => {
  it('hold each vertex its neighbours in its own order, and the decision agrees with the embedding test', () => {
    const rand = prng(37)
    for (let t = 0; t < 200; t++) {
      const {n, edges} = planarSample(t, rand)
      // A few extra random edges make some graphs non-planar (skipped when they would repeat a pair).
      const extra = t % 3 === 0 ? 6 : 0
      for (let k = 0; k < extra; k++) {
        const u = Math.floor(rand() * n), v = Math.floor(rand() * n)
        if (u !== v && !edges.some(([a, b]) => (a === u && b === v) || (a === v && b === u))) edges.push([u, v])
      }
      const g = createDigraph(n, edges)
      const inc = incidenceForDecision(g)
      expect(inc).not.toBeNull()
      for (let v = 0; v < n; v++) {
        const own = [...g.outEdges.slice(g.outStart[v], g.outStart[v + 1]).map((e) => g.head[e]!),
          ...g.inEdges.slice(g.inStart[v], g.inStart[v + 1]).map((e) => g.tail[e]!)]
        expect(Array.from(inc!.other.subarray(inc!.adjStart[v], inc!.adjStart[v + 1]))).toEqual(own)
      }
      expect(isPlanar(g)).toBe(testPlanarity(g).planar)
    }
  })

  it('decline loops, parallel and antiparallel edges, at small and large degree', () => {
    declinedByBoth(incidenceForDecision)
    // A loop at a vertex of large degree, found by its stamp array.
    const star: Edges = Array.from({length: 20}, (_, i) => [0, i + 1] as [number, number])
    expect(incidenceForDecision(createDigraph(21, [...star, [0, 0]]))).toBeNull()
    // Loops and repeats still get their answer, through simplify: K5 with a doubled edge is not planar.
    const k5: Edges = []
    for (let u = 0; u < 5; u++) for (let v = u + 1; v < 5; v++) k5.push([u, v])
    expect(isPlanar(createDigraph(5, [...k5, [1, 0]]))).toBe(false)
    expect(isPlanar(createDigraph(5, [...k5.slice(1), [2, 1], [2, 2]]))).toBe(true) // K5 less an edge
  })
})
