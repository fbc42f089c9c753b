/**
 * Level planarity with forced pairs (src/level/level-planarity.ts, `forced`) against brute force:
 * every combination of left-to-right orders of every level of small random level graphs (long edges
 * through one point per level) is enumerated here, with this file's own crossing test; the orders
 * that draw no crossing and keep every forced pair decide the expected answer. Whenever the test does
 * not answer `undecided` it must agree; each witness is re-checked (this file's crossing test, the
 * forced pairs, and checkLevelDrawing), and each `equations` certificate is re-checked by the same
 * enumeration on its edges alone with its two pairs. The written-order repair built on it
 * (forcedWrittenOrder, smallest-layout.ts) against the same enumeration: it finds orders exactly when
 * some crossing-free drawing keeps the vertices already in written order and one more.
 */
import {describe, expect, it} from 'vitest'
import {checkLevelDrawing, createDigraph} from '@upright/core'
import {testLevelPlanarity, type ForcedPair, type LevelItem} from '../src/level/level-planarity.ts'
import {forcedWrittenOrder} from '../src/layout/smallest-layout.ts'

function prng(seed: number): () => number {
  let s = seed >>> 0
  return () => {
    s = (s + 0x9e3779b9) >>> 0
    let t = s ^ (s >>> 16)
    t = Math.imul(t, 0x21f0aaad)
    t ^= t >>> 15
    t = Math.imul(t, 0x735a2d97)
    return ((t ^ (t >>> 15)) >>> 0) / 4294967296
  }
}

type Edge = [number, number]
const key = (item: LevelItem): string => (item.kind === 'vertex' ? `v${item.vertex}` : `e${item.edge}`)

/** Per level, its items: the vertices on it and the edges passing it. */
function itemsPerLevel(edges: Edge[], level: number[]): LevelItem[][] {
  const top = Math.max(0, ...level)
  const out: LevelItem[][] = Array.from({length: top + 1}, () => [])
  level.forEach((l, v) => out[l]!.push({kind: 'vertex', vertex: v}))
  edges.forEach(([u, w], e) => {
    for (let l = level[u]! + 1; l < level[w]!; l++) out[l]!.push({kind: 'edge', edge: e})
  })
  return out
}

/** No two segments between consecutive levels swap their ends' order (shared ends never cross). */
function drawsNoCrossing(edges: Edge[], level: number[], orders: LevelItem[][]): boolean {
  const at = new Map<string, number>()
  orders.forEach((items, l) => items.forEach((item, i) => at.set(`${l}:${key(item)}`, i)))
  /** Segments as [band, lower key, upper key]. */
  const segments: Array<[number, string, string]> = []
  edges.forEach(([u, w], e) => {
    for (let l = level[u]!; l < level[w]!; l++) {
      const lower = l === level[u] ? `v${u}` : `e${e}`
      const upper = l + 1 === level[w] ? `v${w}` : `e${e}`
      segments.push([l, lower, upper])
    }
  })
  for (let i = 0; i < segments.length; i++) {
    for (let j = i + 1; j < segments.length; j++) {
      const [l, a, c] = segments[i]!
      const [m, b, d] = segments[j]!
      if (l !== m || a === b || c === d) continue
      const below = at.get(`${l}:${a}`)! - at.get(`${l}:${b}`)!
      const above = at.get(`${l + 1}:${c}`)! - at.get(`${l + 1}:${d}`)!
      if (below * above < 0) return false
    }
  }
  return true
}

function keeps(orders: LevelItem[][], forced: readonly ForcedPair[]): boolean {
  return forced.every(({level, left, right}) => {
    const order = orders[level]!.map(key)
    return order.indexOf(key(left)) < order.indexOf(key(right))
  })
}

function permutations<T>(items: T[]): T[][] {
  if (items.length <= 1) return [items]
  return items.flatMap((item, i) => permutations([...items.slice(0, i), ...items.slice(i + 1)]).map((rest) => [item, ...rest]))
}

/** Every crossing-free drawing's orders (brute force over all orders of all levels). */
function crossingFreeOrders(edges: Edge[], level: number[]): LevelItem[][][] {
  const choices = itemsPerLevel(edges, level).map((items) => permutations(items))
  const out: LevelItem[][][] = []
  const chosen: LevelItem[][] = []
  const walk = (l: number): void => {
    if (l === choices.length) {
      if (drawsNoCrossing(edges, level, chosen)) out.push(chosen.slice())
      return
    }
    for (const order of choices[l]!) {
      chosen[l] = order
      walk(l + 1)
    }
  }
  walk(0)
  return out
}

function orderSpace(edges: Edge[], level: number[]): number {
  let product = 1
  for (const items of itemsPerLevel(edges, level)) for (let k = 2; k <= items.length; k++) product *= k
  return product
}

function randomLevelGraph(random: () => number): {edges: Edge[]; level: number[]} {
  const n = 3 + Math.floor(random() * 6)
  const top = 1 + Math.floor(random() * 3)
  const level = Array.from({length: n}, () => Math.floor(random() * (top + 1)))
  const density = 0.15 + random() * 0.5
  const edges: Edge[] = []
  for (let u = 0; u < n; u++) for (let w = 0; w < n; w++) if (level[u]! < level[w]! && random() < density) edges.push([u, w])
  return {edges, level}
}

/** 1–4 random pairs of distinct items on levels with two or more. */
function randomForced(random: () => number, edges: Edge[], level: number[]): ForcedPair[] {
  const levels = itemsPerLevel(edges, level)
    .map((items, l) => ({items, l}))
    .filter(({items}) => items.length >= 2)
  const forced: ForcedPair[] = []
  const count = 1 + Math.floor(random() * 4)
  for (let k = 0; k < count && levels.length > 0; k++) {
    const {items, l} = levels[Math.floor(random() * levels.length)]!
    const i = Math.floor(random() * items.length)
    let j = Math.floor(random() * (items.length - 1))
    if (j >= i) j++
    forced.push({level: l, left: items[i]!, right: items[j]!})
  }
  return forced
}

/** The next random level graph small enough to enumerate (at most 20,000 order tuples) that got forced pairs. */
function forcedCase(random: () => number): {edges: Edge[]; level: number[]; forced: ForcedPair[]} {
  for (;;) {
    const {edges, level} = randomLevelGraph(random)
    if (orderSpace(edges, level) > 20_000) continue
    const forced = randomForced(random, edges, level)
    if (forced.length > 0) return {edges, level, forced}
  }
}

describe('testLevelPlanarity with forced pairs against brute force', () => {
  it('agrees on 1,500 random level graphs with 1–4 random forced pairs; witnesses keep the pairs and draw no crossing; certificates re-checked', () => {
    const random = prng(20261202)
    const seen = {planar: 0, notPlanar: 0, equations: 0, search: 0}
    let cases = 0
    while (cases < 1500) {
      const {edges, level, forced} = forcedCase(random)
      cases++
      const graph = createDigraph(level.length, edges)
      const drawings = crossingFreeOrders(edges, level)
      const keeping = drawings.filter((orders) => keeps(orders, forced))
      const rank = level.map(() => Math.floor(random() * 5))
      const result = testLevelPlanarity(graph, level, {forced, rank, majority: random() < 0.5})
      const context = JSON.stringify({edges, level, forced})
      if (drawings.length === 0) {
        expect(result.status, context).toBe('not-planar')
        seen.notPlanar++
      } else if (keeping.length > 0) {
        expect(result.status, context).toBe('planar')
        seen.planar++
      } else {
        expect(result.status, context).toBe('forced-infeasible')
      }
      if (result.status === 'planar') {
        expect(drawsNoCrossing(edges, level, result.orders), context).toBe(true)
        expect(keeps(result.orders, forced), context).toBe(true)
        expect(checkLevelDrawing(graph, level, result.orders)).toEqual({ok: true})
      }
      if (result.status === 'forced-infeasible' && result.proof === 'equations') {
        seen.equations++
        const pairs = result.pairs.map((p) => forced[p]!)
        expect(pairs.length).toBe(2)
        const [first, second] = pairs as [ForcedPair, ForcedPair]
        if (result.edges.length === 0) {
          // No equation between them: the same two points asked in both orders.
          expect(first.level === second.level && key(first.left) === key(second.right) && key(first.right) === key(second.left), context).toBe(true)
        } else {
          // The two pairs alone, on the certificate's edges alone, already have no drawing.
          const sub = result.edges.map((e) => edges[e]!)
          const renumber = new Map(result.edges.map((e, i) => [e, i]))
          const item = (x: LevelItem): LevelItem => {
            if (x.kind === 'vertex') return x
            expect(renumber.has(x.edge), context).toBe(true)
            return {kind: 'edge', edge: renumber.get(x.edge)!}
          }
          const subPairs = pairs.map(({level: l, left, right}) => ({level: l, left: item(left), right: item(right)}))
          expect(crossingFreeOrders(sub, level).some((orders) => keeps(orders, subPairs)), context).toBe(false)
        }
      }
      if (result.status === 'forced-infeasible' && result.proof === 'search') seen.search++
    }
    // Every kind of answer occurs.
    expect(seen.planar).toBeGreaterThan(300)
    expect(seen.notPlanar).toBeGreaterThan(50)
    expect(seen.equations).toBeGreaterThan(50)
    expect(seen.search).toBeGreaterThan(10)
  })

  it('with a tiny step budget: undecided or the brute-force answer, never a wrong witness (1,000 graphs)', () => {
    const random = prng(7)
    let cases = 0
    let undecided = 0
    while (cases < 1000) {
      const {edges, level, forced} = forcedCase(random)
      cases++
      const graph = createDigraph(level.length, edges)
      const keeping = crossingFreeOrders(edges, level).filter((orders) => keeps(orders, forced))
      const result = testLevelPlanarity(graph, level, {forced, maxSteps: 12})
      if (result.status === 'undecided') {
        undecided++
        continue
      }
      const context = JSON.stringify({edges, level, forced})
      expect(result.status === 'planar', context).toBe(keeping.length > 0)
      if (result.status === 'planar') {
        expect(keeps(result.orders, forced)).toBe(true)
        expect(checkLevelDrawing(graph, level, result.orders)).toEqual({ok: true})
      }
    }
    expect(undecided).toBeGreaterThan(20)
    expect(undecided).toBeLessThan(1000)
  })

  it('every consecutive pair of a crossing-free drawing forced gives back exactly that drawing (600 graphs)', () => {
    const random = prng(99)
    let cases = 0
    while (cases < 600) {
      const {edges, level} = randomLevelGraph(random)
      if (orderSpace(edges, level) > 20_000) continue
      const drawings = crossingFreeOrders(edges, level)
      if (drawings.length === 0) continue
      cases++
      const target = drawings[Math.floor(random() * drawings.length)]!
      const forced = target.flatMap((items, l) => items.slice(1).map((right, i) => ({level: l, left: items[i]!, right})))
      const graph = createDigraph(level.length, edges)
      // The preference points the other way: the forced pairs must win.
      const rank = level.map((_, v) => -v)
      const result = testLevelPlanarity(graph, level, {forced, rank, decideOnly: random() < 0.3})
      expect(result.status).toBe('planar')
      if (result.status === 'planar' && result.orders.length > 0) expect(result.orders.map((o) => o.map(key))).toEqual(target.map((o) => o.map(key)))
    }
  })

  it('rejects a forced pair whose items are not on its level', () => {
    const graph = createDigraph(3, [[0, 2], [1, 2]])
    expect(() => testLevelPlanarity(graph, [0, 0, 2], {forced: [{level: 1, left: {kind: 'vertex', vertex: 0}, right: {kind: 'edge', edge: 1}}]})).toThrow(RangeError)
    expect(() => testLevelPlanarity(graph, [0, 0, 2], {forced: [{level: 2, left: {kind: 'edge', edge: 0}, right: {kind: 'vertex', vertex: 2}}]})).toThrow(RangeError)
    expect(() => testLevelPlanarity(graph, [0, 0, 2], {forced: [{level: 0, left: {kind: 'vertex', vertex: 0}, right: {kind: 'vertex', vertex: 0}}]})).toThrow(RangeError)
  })
})

/** Vertices with two or more out-edges whose out-edges meet the level above left to right in id order (ties: one point). */
function inWrittenOrder(edges: Edge[], level: number[], orders: LevelItem[][]): Set<number> {
  const at = new Map<string, number>()
  orders.forEach((items, l) => items.forEach((item, i) => at.set(`${l}:${key(item)}`, i)))
  const outs = new Map<number, number[]>()
  edges.forEach(([u], e) => outs.set(u, [...(outs.get(u) ?? []), e]))
  const kept = new Set<number>()
  for (const [u, es] of outs) {
    if (es.length < 2) continue
    const place = (e: number): number => at.get(`${level[u]! + 1}:${level[edges[e]![1]] === level[u]! + 1 ? `v${edges[e]![1]}` : `e${e}`}`)!
    if (es.every((e, i) => i === 0 || place(es[i - 1]!) <= place(e))) kept.add(u)
  }
  return kept
}

describe('forcedWrittenOrder (smallest-layout.ts) against brute force', () => {
  it('finds orders with one vertex more in written order exactly when some crossing-free drawing keeps those already in it and one more (400 random level graphs)', () => {
    const random = prng(4711)
    let cases = 0
    let found = 0
    while (cases < 400) {
      const {edges, level} = randomLevelGraph(random)
      if (orderSpace(edges, level) > 20_000) continue
      const graph = createDigraph(level.length, edges)
      const start = testLevelPlanarity(graph, level, {rank: level.map(() => Math.floor(random() * 5))})
      if (start.status !== 'planar') continue
      const kept = inWrittenOrder(edges, level, start.orders)
      const several = [...new Set(edges.map(([u]) => u))].filter((u) => edges.filter(([t]) => t === u).length >= 2)
      const wrong = several.filter((u) => !kept.has(u))
      if (wrong.length === 0) continue
      cases++
      const expected = crossingFreeOrders(edges, level).some((orders) => {
        const now = inWrittenOrder(edges, level, orders)
        return [...kept].every((u) => now.has(u)) && wrong.some((u) => now.has(u))
      })
      const floor = kept.size + 1
      const result = forcedWrittenOrder(graph, Int32Array.from(level), start.orders, floor, {tests: 1000, work: 1e9, failed: new Map()})
      const context = JSON.stringify({edges, level, orders: start.orders})
      expect(result !== undefined, context).toBe(expected)
      if (result) {
        found++
        expect(checkLevelDrawing(graph, level, result)).toEqual({ok: true})
        expect(drawsNoCrossing(edges, level, result)).toBe(true)
        // Possibly mirrored: then the count is read right to left.
        const mirrored = result.map((items) => items.slice().reverse())
        expect(Math.max(inWrittenOrder(edges, level, result).size, inWrittenOrder(edges, level, mirrored).size), context).toBeGreaterThanOrEqual(floor)
      }
    }
    expect(found).toBeGreaterThan(50)
    expect(cases - found).toBeGreaterThan(20)
  })
})
