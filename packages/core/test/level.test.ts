/**
 * Level planarity (src/level) against outside facts:
 * - a brute-force oracle: every combination of left-to-right orders of every level of the proper
 *   graph (long edges split at one point per level), on 2,400 random small level graphs; each "yes"
 *   witness is re-checked by the oracle's own crossing test, and each "no" certificate is shown
 *   non-level-planar by the oracle on its edges alone;
 * - two-level graphs: a forest is drawable on two levels without crossings exactly when each of its
 *   trees is a caterpillar (Harary & Schwenk 1972; Eades, McKay & Wormald 1986 — recalled from memory),
 *   checked on random trees against an independent caterpillar test;
 * - worked examples checked by hand: the 4-cycle on two levels (K2,2) and the three-legged spider.
 */
import {describe, expect, it} from 'vitest'
import {assignLevels, checkLevelDrawing, createDigraph, testLevelPlanarity, type Digraph, type LevelItem} from '@upright/core'
import {ordersByRank} from '../src/layout/level-candidates.ts'

function prng(seed: number): () => number {
  let s = seed >>> 0
  return () => {
    s = (s + 0x6d2b79f5) >>> 0
    let t = s
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

interface Proper {
  /** Per level, node ids. */
  levels: number[][]
  /** Segments [tail node, head node]. */
  segments: Array<[number, number]>
}

/** The oracle's own subdivision: node v for vertex v, then a dummy per edge per inner level. */
function proper(edges: Array<[number, number]>, level: number[]): Proper {
  const nodeLevel = [...level]
  const segments: Array<[number, number]> = []
  for (const [u, w] of edges) {
    let prev = u
    for (let l = level[u]! + 1; l < level[w]!; l++) {
      nodeLevel.push(l)
      segments.push([prev, nodeLevel.length - 1])
      prev = nodeLevel.length - 1
    }
    segments.push([prev, w])
  }
  const top = Math.max(0, ...nodeLevel)
  const levels: number[][] = Array.from({length: top + 1}, () => [])
  nodeLevel.forEach((l, node) => levels[l]!.push(node))
  return {levels, segments}
}

function permutations<T>(items: T[]): T[][] {
  if (items.length <= 1) return [items]
  const out: T[][] = []
  items.forEach((item, i) => {
    for (const rest of permutations([...items.slice(0, i), ...items.slice(i + 1)])) out.push([item, ...rest])
  })
  return out
}

function crossingFree(p: Proper, position: Map<number, number>): boolean {
  for (let i = 0; i < p.segments.length; i++) {
    for (let j = i + 1; j < p.segments.length; j++) {
      const [a, c] = p.segments[i]!
      const [b, d] = p.segments[j]!
      if (!p.levels.some((nodes) => nodes.includes(a) && nodes.includes(b))) continue
      if ((position.get(a)! - position.get(b)!) * (position.get(c)! - position.get(d)!) < 0) return false
    }
  }
  return true
}

/** Brute force over every order of every level. */
function oracle(edges: Array<[number, number]>, level: number[]): boolean {
  const p = proper(edges, level)
  const choices = p.levels.map((nodes) => permutations(nodes))
  const position = new Map<number, number>()
  const search = (l: number): boolean => {
    if (l === choices.length) return crossingFree(p, position)
    for (const order of choices[l]!) {
      order.forEach((node, i) => position.set(node, i))
      if (search(l + 1)) return true
    }
    return false
  }
  return search(0)
}

function orderSpace(edges: Array<[number, number]>, level: number[]): number {
  let product = 1
  for (const nodes of proper(edges, level).levels) for (let k = 2; k <= nodes.length; k++) product *= k
  return product
}

/** The witness in the oracle's node numbering, then its crossing test. */
function witnessIsCrossingFree(edges: Array<[number, number]>, level: number[], orders: LevelItem[][]): boolean {
  const p = proper(edges, level)
  // Dummies of edge e are numbered in edge order, level by level, exactly as proper() made them.
  const dummy = new Map<string, number>()
  let next = level.length
  edges.forEach(([u, w], e) => {
    for (let l = level[u]! + 1; l < level[w]!; l++) dummy.set(`${e},${l}`, next++)
  })
  const position = new Map<number, number>()
  orders.forEach((order, l) => order.forEach((item, i) => position.set(item.kind === 'vertex' ? item.vertex : dummy.get(`${item.edge},${l}`)!, i)))
  if (position.size !== next) return false
  return crossingFree(p, position)
}

function randomLevelGraph(random: () => number): {edges: Array<[number, number]>; level: number[]} {
  const n = 2 + Math.floor(random() * 7)
  const top = 1 + Math.floor(random() * 3)
  const level = Array.from({length: n}, () => Math.floor(random() * (top + 1)))
  const density = 0.2 + random() * 0.6
  const edges: Array<[number, number]> = []
  for (let u = 0; u < n; u++) for (let w = 0; w < n; w++) if (level[u]! < level[w]! && random() < density) edges.push([u, w])
  return {edges, level}
}

describe('testLevelPlanarity against a brute-force oracle', () => {
  it('agrees on 2,400 random level graphs, with witnesses and certificates re-checked', () => {
    const random = prng(20260101)
    let cases = 0
    let planar = 0
    while (cases < 2400) {
      const {edges, level} = randomLevelGraph(random)
      if (orderSpace(edges, level) > 40_000) continue
      cases++
      const graph = createDigraph(level.length, edges)
      const expected = oracle(edges, level)
      const result = testLevelPlanarity(graph, level)
      expect(result.status, JSON.stringify({edges, level})).toBe(expected ? 'planar' : 'not-planar')
      if (result.status === 'planar') {
        planar++
        expect(witnessIsCrossingFree(edges, level, result.orders)).toBe(true)
        expect(checkLevelDrawing(graph, level, result.orders)).toEqual({ok: true})
      } else if (result.status === 'not-planar') {
        expect(result.edges.length).toBeGreaterThan(0)
        expect(oracle(result.edges.map((e) => edges[e]!), level), 'the certificate alone is not level planar').toBe(false)
      }
    }
    // Both answers are well represented.
    expect(planar).toBeGreaterThan(300)
    expect(cases - planar).toBeGreaterThan(300)
  })

  it('with majority flips and edge places: the same answers on 1,200 random level graphs, witnesses re-checked; orders by rank are used only when crossing-free', () => {
    const random = prng(20261202)
    let cases = 0
    let planar = 0
    let byRank = 0
    while (cases < 1200) {
      const {edges, level} = randomLevelGraph(random)
      if (orderSpace(edges, level) > 40_000) continue
      cases++
      const graph = createDigraph(level.length, edges)
      const rank = level.map(() => Math.floor(random() * 8))
      const edgeRank = edges.map(() => Math.floor(random() * 8))
      const expected = oracle(edges, level)
      const result = testLevelPlanarity(graph, level, {rank, edgeRank, majority: true})
      expect(result.status, JSON.stringify({edges, level})).toBe(expected ? 'planar' : 'not-planar')
      if (result.status === 'planar') {
        planar++
        expect(witnessIsCrossingFree(edges, level, result.orders)).toBe(true)
        expect(checkLevelDrawing(graph, level, result.orders)).toEqual({ok: true})
      }
      const sorted = ordersByRank(graph, Int32Array.from(level), rank, edgeRank)
      if (sorted) {
        byRank++
        expect(expected).toBe(true)
        expect(checkLevelDrawing(graph, level, sorted)).toEqual({ok: true})
      }
    }
    expect(planar).toBeGreaterThan(200)
    expect(byRank).toBeGreaterThan(50)
  })
})

/** A tree is a caterpillar when the vertices of degree ≥ 2 form a path (independent of the code above). */
function isCaterpillar(n: number, edges: Array<[number, number]>): boolean {
  const degree = new Array<number>(n).fill(0)
  for (const [u, w] of edges) {
    degree[u]!++
    degree[w]!++
  }
  const spine = new Set([...Array(n).keys()].filter((v) => degree[v]! >= 2))
  const spineDegree = new Map<number, number>()
  for (const [u, w] of edges) {
    if (spine.has(u) && spine.has(w)) {
      spineDegree.set(u, (spineDegree.get(u) ?? 0) + 1)
      spineDegree.set(w, (spineDegree.get(w) ?? 0) + 1)
    }
  }
  // The spine of a tree is a subtree; it is a path when no spine vertex has three spine neighbours.
  return [...spine].every((v) => (spineDegree.get(v) ?? 0) <= 2)
}

describe('two levels: caterpillars (Harary & Schwenk 1972)', () => {
  it('a random tree on its two colour classes is level planar exactly when it is a caterpillar', () => {
    const random = prng(7)
    let caterpillars = 0
    for (let round = 0; round < 600; round++) {
      const n = 2 + Math.floor(random() * 30)
      const parent = Array.from({length: n}, (_, v) => (v === 0 ? -1 : Math.floor(random() * v)))
      const side = new Array<number>(n).fill(0)
      for (let v = 1; v < n; v++) side[v] = 1 - side[parent[v]!]!
      const undirected: Array<[number, number]> = []
      const edges: Array<[number, number]> = []
      for (let v = 1; v < n; v++) {
        undirected.push([parent[v]!, v])
        edges.push(side[v] === 0 ? [v, parent[v]!] : [parent[v]!, v])
      }
      const expected = isCaterpillar(n, undirected)
      if (expected) caterpillars++
      const result = testLevelPlanarity(createDigraph(n, edges), side)
      expect(result.status).toBe(expected ? 'planar' : 'not-planar')
    }
    expect(caterpillars).toBeGreaterThan(100)
    expect(caterpillars).toBeLessThan(600)
  })
})

describe('worked examples', () => {
  it('K2,2 on two levels (a 4-cycle) is not level planar; every edge is in the certificate', () => {
    const graph = createDigraph(4, [[0, 2], [0, 3], [1, 2], [1, 3]])
    const result = testLevelPlanarity(graph, [0, 0, 1, 1])
    expect(result).toEqual({status: 'not-planar', edges: [0, 1, 2, 3]})
  })

  it('the same 4-cycle on three levels is level planar', () => {
    const graph = createDigraph(4, [[0, 1], [0, 2], [1, 3], [2, 3]])
    const result = testLevelPlanarity(graph, [0, 1, 1, 2])
    expect(result.status).toBe('planar')
  })

  it('the three-legged spider with legs of two edges is not drawable on two levels', () => {
    // centre 0 on level 0; 1, 2, 3 on level 1; their far ends 4, 5, 6 on level 0.
    const graph = createDigraph(7, [[0, 1], [0, 2], [0, 3], [4, 1], [5, 2], [6, 3]])
    expect(testLevelPlanarity(graph, [0, 1, 1, 1, 0, 0, 0]).status).toBe('not-planar')
    // With one leg shortened it is a caterpillar.
    const shorter = createDigraph(6, [[0, 1], [0, 2], [0, 3], [4, 1], [5, 2]])
    expect(testLevelPlanarity(shorter, [0, 1, 1, 1, 0, 0]).status).toBe('planar')
  })

  it('prefers the written order when several orders work', () => {
    const graph = createDigraph(4, [[0, 2], [1, 3]])
    const keep = testLevelPlanarity(graph, [0, 0, 1, 1])
    expect(keep).toEqual({status: 'planar', orders: [[{kind: 'vertex', vertex: 0}, {kind: 'vertex', vertex: 1}], [{kind: 'vertex', vertex: 2}, {kind: 'vertex', vertex: 3}]]})
    const swapped = testLevelPlanarity(graph, [0, 0, 1, 1], {rank: [1, 0, 3, 2]})
    expect(swapped.status === 'planar' && swapped.orders[0]!.map((item) => (item.kind === 'vertex' ? item.vertex : -1))).toEqual([1, 0])
  })

  it('rejects levels that do not go up', () => {
    expect(() => testLevelPlanarity(createDigraph(2, [[0, 1]]), [1, 1])).toThrow(RangeError)
  })
})

describe('assignLevels', () => {
  const graphOf = (n: number, edges: Array<[number, number]>): Digraph => createDigraph(n, edges)

  it('puts each tier on one level, free vertices just above their predecessors, and makes room between tiers', () => {
    // tiers: 0 = {0, 1}, 1 = {3}; 2 is free between them: 0 -> 2 -> 3, 1 -> 3; 4 free below 0.
    const result = assignLevels(graphOf(5, [[0, 2], [2, 3], [1, 3], [4, 0]]), [0, 0, -1, 1, -1], 2)
    expect(result).toEqual({ok: true, level: Int32Array.from([1, 1, 2, 3, 0]), tierLevel: Int32Array.from([1, 3])})
  })

  it('reports a path that leaves a tier and comes back to it through free vertices', () => {
    // 0 and 2 in tier 0; 0 -> 1 -> 2 with 1 free.
    const result = assignLevels(graphOf(3, [[0, 1], [1, 2]]), [0, -1, 0], 1)
    expect(result).toEqual({ok: false, path: [0, 1]})
  })

  it('the levels always go up along every edge (random tiers consistent with a random order)', () => {
    const random = prng(99)
    for (let round = 0; round < 300; round++) {
      const n = 1 + Math.floor(random() * 12)
      const edges: Array<[number, number]> = []
      for (let u = 0; u < n; u++) for (let w = u + 1; w < n; w++) if (random() < 0.3) edges.push([u, w])
      // Tiers along the vertex order, some vertices left free.
      const tierOf = new Array<number>(n).fill(-1)
      let tier = -1
      for (let v = 0; v < n; v++) {
        if (random() < 0.3) tier++
        if (tier >= 0 && random() < 0.6) tierOf[v] = tier
      }
      const used = [...new Set(tierOf.filter((t) => t >= 0))].sort((a, b) => a - b)
      const renumber = tierOf.map((t) => (t < 0 ? -1 : used.indexOf(t)))
      const consistent = edges.every(([u, w]) => renumber[u]! < 0 || renumber[w]! < 0 || renumber[u]! < renumber[w]!)
      if (!consistent) continue
      const result = assignLevels(graphOf(n, edges), renumber, used.length)
      if (!result.ok) continue
      for (const [u, w] of edges) expect(result.level[u]!).toBeLessThan(result.level[w]!)
      for (let v = 0; v < n; v++) if (renumber[v]! >= 0) expect(result.level[v]).toBe(result.tierLevel[renumber[v]!])
      for (let t = 1; t < used.length; t++) expect(result.tierLevel[t]!).toBeGreaterThan(result.tierLevel[t - 1]!)
    }
  })
})

describe('size bound', () => {
  it('answers undecided rather than building a huge system', () => {
    // 3,000 vertices on one level above one vertex: 4.5 million pairs, over the default bound.
    const star = (n: number) => createDigraph(n, Array.from({length: n - 1}, (_, i) => [0, i + 1] as [number, number]))
    const levels = (n: number) => [0, ...new Array<number>(n - 1).fill(1)]
    expect(testLevelPlanarity(star(3001), levels(3001)).status).toBe('undecided')
    // 600 leaves (180,000 pairs) are decided; nothing constrains them, so they keep their written order.
    const big = testLevelPlanarity(star(601), levels(601))
    expect(big.status).toBe('planar')
    expect(big.status === 'planar' && big.orders[1]!.every((item, i) => item.kind === 'vertex' && item.vertex === i + 1)).toBe(true)
  })
})
