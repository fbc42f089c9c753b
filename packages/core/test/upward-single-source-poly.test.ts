import {describe, expect, it} from 'vitest'
import {createDigraph} from '../src/index.ts'
import {testPlanarity} from '../src/planarity/index.ts'
import {testUpwardEmbedded, testUpwardPlanarity} from '../src/upward/index.ts'
import {expansionGraph, isUpwardPlanarSingleSource, upwardRotationSingleSource} from '../src/upward/single-source.ts'
import {stAugment, verifyStGraph} from '../src/augment/index.ts'
import {singleSourceNorthDags} from './support/north-dags.ts'
import {mulberry32} from './support/random-st.ts'
import {randomDag} from './support/upward-families.ts'
import {checkUpwardWitness, isUpwardPlanarBruteForce, type Edge} from './support/upward-oracle.ts'
import {searchUpwardEmbedding} from '../src/upward/embedding-search.ts'

/**
 * The exact answer by the other route: planarity, then the branch and bound over all planar
 * embeddings (embedding-search.ts), which testUpwardPlanarity no longer uses for one source.
 * 'budget' when it takes more than 2·10^6 nodes.
 */
function bySearch(n: number, edges: readonly Edge[]): boolean | 'budget' {
  if (!testPlanarity(createDigraph(n, edges)).planar) return false
  let left = 2e6
  const r = searchUpwardEmbedding(n, edges.map((e) => e[0]), edges.map((e) => e[1]), 'upward', () => --left < 0)
  return r.found
}

// The polynomial single-source test (upward/single-source.ts, after Bertolazzi, Di Battista, Mannino
// & Tamassia, SIAM J. Comput. 27, 1998) against the brute-force oracle (test/support/upward-oracle.ts)
// and the general exact test; every "yes" rotation is turned into an upward embedding by the
// fixed-embedding test, checked by the oracle's independent witness checker, and st-augmented.

/** The single-source answer, with its witness checked; true for "yes". */
function singleSource(n: number, edges: readonly Edge[]): boolean {
  const g = createDigraph(n, edges)
  const rot = upwardRotationSingleSource(g)
  if (rot === null) return false
  const emb = {graph: g, rotation: rot.map((r) => Int32Array.from(r))}
  const fixed = testUpwardEmbedded(emb)
  expect(fixed.ok, JSON.stringify(edges)).toBe(true)
  if (!fixed.ok) return true
  const up = fixed.upward
  const outerDarts = Array.from(up.outerFaces, (f) => up.faces.darts[f]![0]!)
  expect(checkUpwardWitness(n, edges, up.embedding.rotation, outerDarts, up.largeAngle)).toBe(null)
  expect(verifyStGraph(g, stAugment(up), up.embedding)).toEqual({ok: true})
  return true
}

/** Vertices 0..n-1 all reached: randomDag's single-source family has every vertex on an edge. */
function sourcesOf(n: number, edges: readonly Edge[]): number {
  const hasIn = new Uint8Array(n)
  for (const [, b] of edges) hasIn[b] = 1
  return hasIn.reduce((c, x) => c + (x ? 0 : 1), 0)
}

describe('single-source upward planarity in polynomial time', () => {
  it('agrees with the brute-force oracle and the exact test on 3,000 random single-source DAGs with 3 to 9 vertices', () => {
    const rnd = mulberry32(1998)
    let yes = 0, noPlanar = 0, k = 0
    while (k < 3000) {
      const n = 3 + Math.floor(rnd() * 7)
      const edges = randomDag(rnd, n, 0.25 + 0.45 * rnd(), 'single-source')
      if (edges.length > 12) continue
      k++
      expect(sourcesOf(n, edges)).toBe(1)
      const got = singleSource(n, edges)
      expect(got, JSON.stringify(edges)).toBe(isUpwardPlanarBruteForce(n, edges))
      expect(got).toBe(testUpwardPlanarity(createDigraph(n, edges)).status === 'upward')
      expect(got).toBe(bySearch(n, edges))
      if (got) yes++
      else if (testPlanarity(createDigraph(n, edges)).planar) noPlanar++
    }
    expect(yes).toBeGreaterThan(2000)
    expect(noPlanar).toBeGreaterThan(30)
  })

  it('agrees with the embedding search on 1,500 random single-source DAGs with 10 to 40 vertices', () => {
    const rnd = mulberry32(1996)
    let yes = 0, noPlanar = 0, skipped = 0
    for (let k = 0; k < 1500; k++) {
      const n = 10 + Math.floor(rnd() * 31)
      // about where planarity and upward planarity are lost (measured: half the graphs upward)
      const edges = randomDag(rnd, n, (1.2 + 1.2 * rnd()) / n, 'single-source')
      const want = bySearch(n, edges)
      const got = singleSource(n, edges)
      expect(testUpwardPlanarity(createDigraph(n, edges)).status === 'upward').toBe(got)
      if (want === 'budget') {
        skipped++
        continue
      }
      expect(got, JSON.stringify(edges)).toBe(want)
      if (got) yes++
      else if (testPlanarity(createDigraph(n, edges)).planar) noPlanar++
    }
    expect(skipped).toBeLessThan(15)
    expect(yes).toBeGreaterThan(500)
    expect(noPlanar).toBeGreaterThan(30)
  })

  it('named facts', () => {
    // UPWARD-FACTS.md (checked by brute force): the transitive tournament on 5 vertices minus the edge
    // (first, last) is planar with one source and one sink, and is not upward planar.
    const t5: Edge[] = []
    for (let i = 0; i < 5; i++) for (let j = i + 1; j < 5; j++) if (!(i === 0 && j === 4)) t5.push([i, j])
    expect(testPlanarity(createDigraph(5, t5)).planar).toBe(true)
    expect(singleSource(5, t5)).toBe(false)
    // the transitive tournament on 4 vertices is a planar st-graph with s, t on one face, so upward
    // (Di Battista & Tamassia, TCS 61, 1988; UPWARD-FACTS.md, small cases)
    expect(singleSource(4, [[0, 1], [0, 2], [0, 3], [1, 2], [1, 3], [2, 3]])).toBe(true)
    // every directed forest is upward planar (issue 4; a tree has one face): random out-trees
    const rnd = mulberry32(7)
    for (let k = 0; k < 200; k++) {
      const n = 2 + Math.floor(rnd() * 30)
      const edges: Edge[] = []
      for (let v = 1; v < n; v++) edges.push([Math.floor(rnd() * v), v])
      expect(singleSource(n, edges)).toBe(true)
    }
    // one source s and one sink t: upward iff G + (s, t) is planar (Di Battista & Tamassia 1988;
    // UPWARD-FACTS.md): random st-DAGs with 6 to 30 vertices
    let stNo = 0
    for (let k = 0; k < 400; k++) {
      const n = 6 + Math.floor(rnd() * 25)
      const edges = randomDag(rnd, n, (2.2 + 1.6 * rnd()) / n, 'st')
      const outs = new Uint8Array(n), ins = new Uint8Array(n)
      for (const [a, b] of edges) {
        outs[a] = 1
        ins[b] = 1
      }
      const s = ins.indexOf(0), t = outs.indexOf(0)
      const want = testPlanarity(createDigraph(n, [...edges, [s, t]])).planar
      expect(singleSource(n, edges), JSON.stringify(edges)).toBe(want)
      if (!want && testPlanarity(createDigraph(n, edges)).planar) stNo++
    }
    expect(stNo).toBeGreaterThan(5)
  })

  it('the expansion graph (split v into v -> v\', in-edges at v, out-edges at v\') keeps the answer (1998 paper; brute force)', () => {
    const rnd = mulberry32(27)
    let k = 0, no = 0
    while (k < 300) {
      const n = 5 + Math.floor(rnd() * 2)
      const edges = randomDag(rnd, n, 0.5 + 0.3 * rnd(), 'single-source')
      if (edges.length > 11) continue
      k++
      const x = expansionGraph(createDigraph(n, edges))
      if (x.vertexCount + x.edges.length > 30) continue
      const want = isUpwardPlanarBruteForce(n, edges)
      expect(isUpwardPlanarBruteForce(x.vertexCount, x.edges), JSON.stringify(edges)).toBe(want)
      if (!want) no++
    }
    expect(no).toBeGreaterThan(3)
  })

  it('agrees with the exact test on the 610 single-source North DAGs (SOURCE.md: 610 have one source)', () => {
    let single = 0, yes = 0, skipped = 0
    for (const {file, vertexCount, edges, graph: g} of singleSourceNorthDags()) {
      single++
      const exact = testUpwardPlanarity(g)
      expect(exact.status, file).not.toBe('undecided')
      const got = singleSource(vertexCount, edges)
      expect(got, file).toBe(exact.status === 'upward')
      const search = bySearch(vertexCount, edges)
      if (search !== 'budget') expect(got, file).toBe(search)
      else skipped++
      if (got) yes++
    }
    expect(single).toBe(610)
    expect(yes).toBeGreaterThan(300)
    expect(skipped).toBeLessThan(10)
  })

  it('agrees with the oracle with parallel edges (300 single-source DAGs with one or two edges doubled)', () => {
    const rnd = mulberry32(2)
    let k = 0
    while (k < 300) {
      const n = 3 + Math.floor(rnd() * 5)
      const edges: Edge[] = randomDag(rnd, n, 0.3 + 0.4 * rnd(), 'single-source')
      const doubled = 1 + Math.floor(rnd() * 2)
      for (let i = 0; i < doubled; i++) edges.push(edges[Math.floor(rnd() * edges.length)]!)
      if (edges.length > 11) continue
      k++
      expect(singleSource(n, edges), JSON.stringify(edges)).toBe(isUpwardPlanarBruteForce(n, edges))
    }
  })

  it('refuses what it does not decide: several sources, or a cycle', () => {
    expect(() => isUpwardPlanarSingleSource(createDigraph(3, [[0, 2], [1, 2]]))).toThrow(RangeError)
    expect(() => isUpwardPlanarSingleSource(createDigraph(3, [[0, 1], [1, 2], [2, 1]]))).toThrow(RangeError)
  })
})
