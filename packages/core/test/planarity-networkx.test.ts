import {describe, expect, it} from 'vitest'
import {certifiedAnswer, compare, type Case} from './support/planarity-compare.ts'
import {prng, randomGraph, randomMaximalPlanar, randomNonEdge, scramble, shuffle, type Edges} from './support/planarity-generators.ts'

describe('testPlanarity agrees with networkx check_planarity (networkx 3.6, reference library)', () => {
  it('on 6,000 seeded random graphs: G(n, m) around the thresholds, maximal planar +- edges, multigraphs', () => {
    const rand = prng(20261202)
    const cases: Case[] = []
    // Random G(n, m), n <= 60, m from 0.3n (sparse) to 3.2n (past Euler's 3n - 6).
    for (let i = 0; i < 3000; i++) {
      const n = 1 + Math.floor(rand() * 60)
      const m = Math.floor((0.3 + 2.9 * rand()) * n)
      cases.push({name: `gnm#${i}`, vertexCount: n, edges: randomGraph(n, m, rand)})
    }
    // Random maximal planar graphs, and the same plus one edge (then 3n - 5 edges: never planar).
    for (let i = 0; i < 600; i++) {
      const n = 3 + Math.floor(rand() * 58)
      const edges = randomMaximalPlanar(n, rand)
      cases.push({name: `maxplanar#${i}`, vertexCount: n, edges: scramble(n, edges, rand)})
      if (n >= 5) {
        const plus = [...edges, randomNonEdge(n, edges, rand)]
        cases.push({name: `maxplanar+1#${i}`, vertexCount: n, edges: scramble(n, plus, rand)})
      }
    }
    // Near-planar: a maximal planar graph with 15% of its edges removed and 1-3 random edges added,
    // so the edge count does not decide and the full test has to run.
    for (let i = 0; i < 1200; i++) {
      const n = 6 + Math.floor(rand() * 55)
      const edges = randomMaximalPlanar(n, rand)
      edges.length = Math.floor(edges.length * 0.85)
      const extra = 1 + Math.floor(rand() * 3)
      for (let k = 0; k < extra; k++) edges.push(randomNonEdge(n, edges, rand))
      cases.push({name: `nearplanar#${i}`, vertexCount: n, edges: scramble(n, edges, rand)})
    }
    // Multigraphs: copies of edges (same or reversed direction) and self-loops added.
    for (let i = 0; i < 600; i++) {
      const n = 2 + Math.floor(rand() * 40)
      const edges = rand() < 0.5 ? randomMaximalPlanar(Math.max(3, n), rand) : randomGraph(n, Math.floor(1.5 * n), rand)
      const vn = Math.max(3, n)
      const extra = Math.floor(rand() * 6)
      for (let k = 0; k < extra && edges.length > 0; k++) {
        const [u, v] = edges[Math.floor(rand() * edges.length)]!
        edges.push(rand() < 0.5 ? [u, v] : [v, u])
        const w = Math.floor(rand() * vn)
        if (rand() < 0.5) edges.push([w, w])
      }
      cases.push({name: `multi#${i}`, vertexCount: vn, edges: shuffle(edges, rand)})
    }
    expect(cases.length).toBeGreaterThanOrEqual(5000)
    const {planar, disagreements} = compare(cases)
    expect(disagreements).toEqual([])
    // Both answers must be well represented, or the comparison proves little.
    expect(planar).toBeGreaterThan(1000)
    expect(cases.length - planar).toBeGreaterThan(1000)
  })

  it('answers the same after relabelling, reordering and reversing edges (adjacency order shuffled)', () => {
    const rand = prng(7)
    for (let i = 0; i < 600; i++) {
      const n = 5 + Math.floor(rand() * 40)
      const edges = randomGraph(n, Math.floor((0.8 + 2 * rand()) * n), rand)
      const a = certifiedAnswer({name: `base#${i}`, vertexCount: n, edges})
      for (let k = 0; k < 3; k++) {
        expect(certifiedAnswer({name: `scrambled#${i}.${k}`, vertexCount: n, edges: scramble(n, edges, rand)})).toBe(a)
      }
    }
  })
})
