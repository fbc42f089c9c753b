/**
 * The suggested fixes, checked independently of the code that finds them:
 * - feedback arc sets: removing them leaves an acyclic graph (networkx is_directed_acyclic_graph,
 *   networkx 3.6), exact ones are as small as a brute force over all edge subsets finds, heuristic ones
 *   are minimal (putting back any edge closes a cycle, again by networkx);
 * - planarizing sets: removing them leaves a planar graph and putting back any one edge does not
 *   (networkx check_planarity); K5 and K3,3 need one edge, K6 three (skewness of K_n is
 *   C(n,2) − (3n − 6) for n ≥ 3 since a maximal planar graph has 3n − 6 edges, Euler's formula);
 * - maximal upward planar subgraphs: what is kept is upward planar and adding back any dropped edge is
 *   not, by the brute-force oracle (test/support/upward-oracle.ts, shares no code with src).
 */
import {readdirSync, readFileSync} from 'node:fs'
import {describe, expect, it} from 'vitest'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {feedbackArcSet, maximalUpwardSubgraph, planarizingSet} from '../src/explain/index.ts'
import {checkDiagram} from '../src/check/index.ts'
import {isUpwardPlanarBruteForce} from './support/upward-oracle.ts'
import {networkxPlanar} from './support/planarity-networkx.ts'
import {networkxAcyclic} from './support/acyclic-networkx.ts'
import {prng} from './support/planarity-generators.ts'
import {readGraphml} from './support/graphml.ts'

type Edges = Array<[number, number]>

const without = (edges: Edges, drop: readonly number[]): Edges => edges.filter((_, e) => !drop.includes(e))

function randomDigraph(rand: () => number, n: number, m: number, loops: boolean): Edges {
  const edges: Edges = []
  while (edges.length < m) {
    const u = Math.floor(rand() * n)
    const v = Math.floor(rand() * n)
    if (u === v && !loops) continue
    edges.push([u, v])
  }
  return edges
}

/** Smallest number of edges whose removal leaves no cycle, by trying every subset (small m only). */
function bruteForceFasSize(n: number, edges: Edges): number {
  const m = edges.length
  let best = m
  for (let mask = 0; mask < 1 << m; mask++) {
    let size = 0
    for (let b = mask; b; b &= b - 1) size++
    if (size >= best) continue
    if (acyclicByPeeling(n, edges.filter((_, e) => !(mask & (1 << e))))) best = size
  }
  return best
}

/** Acyclic iff repeatedly removing vertices with no incoming edge removes them all (common practice). */
function acyclicByPeeling(n: number, edges: Edges): boolean {
  const indegree = new Array<number>(n).fill(0)
  for (const [, v] of edges) indegree[v]!++
  const queue = indegree.flatMap((d, v) => (d === 0 ? [v] : []))
  let seen = 0
  while (queue.length > 0) {
    const u = queue.pop()!
    seen++
    for (const [a, b] of edges) if (a === u && --indegree[b]! === 0) queue.push(b)
  }
  return seen === n
}

describe('feedback arc set', () => {
  it('exact sets are as small as the brute force finds, and leave the graph acyclic (networkx)', () => {
    const rand = prng(7)
    const cases: Array<{n: number; edges: Edges; fas: number[]}> = []
    for (let i = 0; i < 200; i++) {
      const n = 2 + Math.floor(rand() * 6)
      const edges = randomDigraph(rand, n, 1 + Math.floor(rand() * 11), rand() < 0.2)
      const fas = feedbackArcSet(createDigraph(n, edges))
      expect(fas.exact).toBe(true)
      expect(fas.edges.length).toBe(bruteForceFasSize(n, edges))
      cases.push({n, edges, fas: fas.edges})
    }
    expect(networkxAcyclic(cases.map((c) => ({vertexCount: c.n, edges: without(c.edges, c.fas)}))).every(Boolean)).toBe(true)
  })

  it('the Eades-Lin-Smyth heuristic gives a minimal set (any edge put back closes a cycle, networkx)', () => {
    const rand = prng(11)
    const graphs: Array<{vertexCount: number; edges: Edges}> = []
    const putBack: Array<{vertexCount: number; edges: Edges}> = []
    let exactSizes = 0
    let heuristicSizes = 0
    for (let i = 0; i < 40; i++) {
      const n = 4 + Math.floor(rand() * 8)
      const edges = randomDigraph(rand, n, n + Math.floor(rand() * 2 * n), false)
      const g = createDigraph(n, edges)
      const fas = feedbackArcSet(g, {exactVertexLimit: 0})
      const exact = feedbackArcSet(g)
      const hasCycle = !acyclicByPeeling(n, edges)
      expect(fas.exact).toBe(!hasCycle)
      exactSizes += exact.edges.length
      heuristicSizes += fas.edges.length
      expect(fas.edges.length).toBeGreaterThanOrEqual(exact.edges.length)
      graphs.push({vertexCount: n, edges: without(edges, fas.edges)})
      for (const e of fas.edges) putBack.push({vertexCount: n, edges: without(edges, fas.edges.filter((f) => f !== e))})
    }
    expect(networkxAcyclic(graphs).every(Boolean)).toBe(true)
    expect(networkxAcyclic(putBack).some(Boolean)).toBe(false)
    // The heuristic is close on these small graphs (measured: within a third more edges in total).
    expect(heuristicSizes).toBeLessThanOrEqual(Math.ceil(exactSizes * 1.34))
  })

  it('solves a 20-vertex strongly connected component exactly', () => {
    // A directed cycle of 20 vertices with chords; brute force is out of reach, so check the lower
    // bound instead: edge-disjoint cycles each need their own edge (common practice).
    const n = 20
    const edges: Edges = Array.from({length: n}, (_, i) => [i, (i + 1) % n])
    for (let i = 0; i < n; i += 4) edges.push([(i + 2) % n, i])
    const fas = feedbackArcSet(createDigraph(n, edges))
    expect(fas.exact).toBe(true)
    // Cycles i -> i+1 -> i+2 -> i for i = 0, 4, 8, …: five edge-disjoint ones, so at least 5.
    expect(fas.edges.length).toBe(5)
    expect(acyclicByPeeling(n, without(edges, fas.edges))).toBe(true)
  })
})

describe('planarizing set', () => {
  const complete = (n: number): Edges => Array.from({length: n}, (_, i) => Array.from({length: n - i - 1}, (_, j): [number, number] => [i, i + j + 1])).flat()
  it('removes one edge of K5 and K3,3 and three of K6 (skewness, Euler formula)', () => {
    expect(planarizingSet(createDigraph(5, complete(5)))).toMatchObject({exact: true})
    expect(planarizingSet(createDigraph(5, complete(5))).edges).toHaveLength(1)
    const k33: Edges = [0, 1, 2].flatMap((a) => [3, 4, 5].map((b): [number, number] => [a, b]))
    expect(planarizingSet(createDigraph(6, k33)).edges).toHaveLength(1)
    expect(planarizingSet(createDigraph(6, complete(6))).edges).toHaveLength(3)
  })

  it('leaves Rome graphs planar and minimal: putting back any removed edge is nonplanar (networkx)', () => {
    const rome = '/work/shared/data/rome' // Rome graphs, see SOURCE.md there
    const files = readdirSync(rome).filter((f) => f.endsWith('.graphml')).sort()
    const checks: Array<{vertexCount: number; edges: Edges}> = []
    const expected: boolean[] = []
    let nonplanar = 0
    for (let i = 0; nonplanar < 25 && i < files.length; i += 7) {
      const {vertexCount, edges} = readGraphml(`${rome}/${files[i]}`)
      const ids = {size: vertexCount}
      const set = planarizingSet(createDigraph(ids.size, edges))
      if (set.edges.length === 0) continue
      nonplanar++
      checks.push({vertexCount: ids.size, edges: without(edges, set.edges)})
      expected.push(true)
      for (const e of set.edges) {
        checks.push({vertexCount: ids.size, edges: without(edges, set.edges.filter((f) => f !== e))})
        expected.push(false)
      }
    }
    expect(nonplanar).toBeGreaterThan(5)
    expect(networkxPlanar(checks)).toEqual(expected)
  })
})

describe('maximal upward planar subgraph', () => {
  it('keeps an upward planar subgraph to which no dropped edge can return (brute-force oracle)', () => {
    const rand = prng(5)
    let found = 0
    // The 5-vertex wheel of fixtures/broken/not-upward.md (sources 0, 1; hub 2; sinks 3, 4), the
    // smallest planar DAG with no upward planar drawing (shared/UPWARD-FACTS.md), relabelled at random,
    // plus a sixth vertex and random edges that follow the topological order 0 < 1 < … < 5.
    const wheel: Edges = [[0, 2], [0, 3], [0, 4], [1, 2], [1, 3], [1, 4], [2, 3], [2, 4]]
    for (let i = 0; i < 200 && found < 25; i++) {
      const n = 6
      const rank = [0, 1, 2, 3, 4, 5].sort(() => rand() - 0.5)
      const extra = randomDigraph(rand, n, 1 + Math.floor(rand() * 3), false).map(([u, v]): [number, number] => (u < v ? [u, v] : [v, u]))
      const edges: Edges = [...wheel, ...extra].map(([u, v]): [number, number] => [rank[u]!, rank[v]!]).sort(() => rand() - 0.5)
      const g: Digraph = createDigraph(n, edges)
      const sub = maximalUpwardSubgraph(g, {maxMillis: 10000})
      if (sub.dropped.length === 0) {
        expect(isUpwardPlanarBruteForce(n, edges)).toBe(true)
        continue
      }
      found++
      expect(sub.maximal).toBe(true)
      const kept = without(edges, sub.dropped)
      let upward: boolean
      try {
        upward = isUpwardPlanarBruteForce(n, kept, {cap: 4e5})
      } catch {
        continue // the oracle's cap: too many rotation systems to try here
      }
      expect(upward).toBe(true)
      for (const e of sub.dropped) expect(isUpwardPlanarBruteForce(n, [...kept, edges[e]!], {cap: 4e6})).toBe(false)
    }
    expect(found).toBeGreaterThan(10)
  })
})

describe('messages', () => {
  const body = (file: string): string => {
    const text = readFileSync(new URL(`../../../fixtures/broken/${file}`, import.meta.url), 'utf8')
    return /```upright[^\n]*\n([\s\S]*?)```/.exec(text)![1]!
  }
  it.each([
    ['cycle.md', 'cycle', 'removes every cycle'],
    ['nonplanar.md', 'nonplanar', 'without crossings'],
    ['not-upward.md', 'not-upward', 'makes the diagram drawable']
  ])('%s: the failure suggests a fix that works, with its positions', (file, status, words) => {
    const check = checkDiagram(body(file))
    expect(check.status).toBe(status)
    const failure = check.diagnostics.find((d) => d.ruleId === status)!
    expect(failure.reason).toContain('Suggested fix: dropping')
    expect(failure.reason).toContain(words)
    expect(check.fix!.edges.length).toBeGreaterThan(0)
    expect(check.certificate!.fix!.remove).toHaveLength(check.fix!.edges.length)
    // Every suggested edge's position is among the related places.
    for (const e of check.fix!.edges) expect(failure.related!.some((r) => r.range.start.offset === check.parsed.edges[e]!.range.start.offset && r.reason.startsWith('suggested'))).toBe(true)
    // The fix does what it says: check the diagram without those edges (the same pipeline, one stage on).
    const g = check.graph!
    const kept = without(Array.from({length: g.edgeCount}, (_, e): [number, number] => [g.tail[e]!, g.head[e]!]), check.fix!.edges)
    if (status === 'cycle') expect(acyclicByPeeling(g.vertexCount, kept)).toBe(true)
    if (status === 'nonplanar') expect(networkxPlanar([{vertexCount: g.vertexCount, edges: kept}])).toEqual([true])
    if (status === 'not-upward') expect(isUpwardPlanarBruteForce(g.vertexCount, kept)).toBe(true)
  })
})
