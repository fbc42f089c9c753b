import {describe, expect, it} from 'vitest'
import fc from 'fast-check'
import {createDigraph, findCycle, verifyCycle} from '@upright/core'
import {networkxAcyclic} from './support/acyclic-networkx.ts'
import {mulberry32, randomInt} from '../../../test/support/random.ts'

/** A random DAG: edges only from lower to higher index in a random permutation. */
const dagArb = fc
  .integer({min: 1, max: 30})
  .chain((n) =>
    fc.record({
      n: fc.constant(n),
      perm: fc.shuffledSubarray([...Array(n).keys()], {minLength: n, maxLength: n}),
      pairs: fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), {maxLength: 3 * n})
    })
  )
  .map(({n, perm, pairs}) => {
    const edges: Array<[number, number]> = []
    for (const [a, b] of pairs) if (a !== b) edges.push(a < b ? [perm[a]!, perm[b]!] : [perm[b]!, perm[a]!])
    return {n, edges}
  })

function isTopological(n: number, edges: Array<[number, number]>, order: Int32Array): boolean {
  const pos = new Int32Array(n)
  order.forEach((v, i) => (pos[v] = i))
  return order.length === n && edges.every(([u, v]) => pos[u]! < pos[v]!)
}

describe('findCycle', () => {
  it('finds a self-loop as a cycle of length 1', () => {
    const g = createDigraph(2, [[0, 1], [1, 1]])
    const r = findCycle(g)
    expect(r).toEqual({acyclic: false, cycle: {vertices: [1], edges: [1]}})
  })

  it('lists the cycle in order with the closing edge last', () => {
    // a→b→c→a plus a tail d→a
    const g = createDigraph(4, [[3, 0], [0, 1], [1, 2], [2, 0]])
    const r = findCycle(g)
    expect(r.acyclic).toBe(false)
    if (!r.acyclic) {
      expect(r.cycle).toEqual({vertices: [0, 1, 2], edges: [1, 2, 3]})
      expect(verifyCycle(g, r.cycle)).toEqual({ok: true})
    }
  })

  it('handles a 100,000-vertex chain without recursion', () => {
    const n = 100_000
    const edges: Array<[number, number]> = []
    for (let i = 0; i + 1 < n; i++) edges.push([i, i + 1])
    const r = findCycle(createDigraph(n, edges))
    expect(r.acyclic).toBe(true)
    edges.push([n - 1, 0])
    const r2 = findCycle(createDigraph(n, edges))
    expect(!r2.acyclic && r2.cycle.vertices.length).toBe(n)
  })

  it('property: a random DAG has a topological order and no cycle', () => {
    fc.assert(
      fc.property(dagArb, ({n, edges}) => {
        const r = findCycle(createDigraph(n, edges))
        return r.acyclic && isTopological(n, edges, r.order)
      }),
      {numRuns: 500, seed: 7}
    )
  })

  it('property: a random DAG plus one back edge has a verified cycle', () => {
    fc.assert(
      fc.property(dagArb, fc.nat(), ({n, edges}, pick) => {
        if (edges.length === 0) return true
        const [u, v] = edges[pick % edges.length]!
        const withBack = [...edges, [v, u] as [number, number]]
        const g = createDigraph(n, withBack)
        const r = findCycle(g)
        return !r.acyclic && verifyCycle(g, r.cycle).ok
      }),
      {numRuns: 500, seed: 11}
    )
  })
})

describe('verifyCycle', () => {
  const g = createDigraph(3, [[0, 1], [1, 2], [2, 0]])
  it('accepts a real cycle and rejects broken ones', () => {
    expect(verifyCycle(g, {vertices: [0, 1, 2], edges: [0, 1, 2]}).ok).toBe(true)
    expect(verifyCycle(g, {vertices: [0, 1, 2], edges: [0, 2, 1]}).ok).toBe(false)
    expect(verifyCycle(g, {vertices: [0, 1], edges: [0, 1]}).ok).toBe(false)
    expect(verifyCycle(g, {vertices: [], edges: []}).ok).toBe(false)
    expect(verifyCycle(g, {vertices: [0, 1, 2, 0], edges: [0, 1, 2, 0]}).ok).toBe(false)
  })
})

describe('agreement with networkx is_directed_acyclic_graph (reference library, networkx 3.x)', () => {
  it('agrees on 1,500 random digraphs', () => {
    const rand = mulberry32(2026)
    const graphs: Array<{n: number; edges: Array<[number, number]>}> = []
    for (let i = 0; i < 1500; i++) {
      const n = randomInt(rand, 1, 25)
      const m = randomInt(rand, 0, 2 * n)
      const edges: Array<[number, number]> = []
      // Mostly forward edges so both answers occur often.
      for (let j = 0; j < m; j++) {
        const a = randomInt(rand, 0, n - 1)
        const b = randomInt(rand, 0, n - 1)
        edges.push(rand() < 0.93 ? [Math.min(a, b), Math.max(a, b)] : [Math.max(a, b), Math.min(a, b)])
      }
      graphs.push({n, edges})
    }
    const reference = networkxAcyclic(graphs.map(({n, edges}) => ({vertexCount: n, edges})))
    let cyclic = 0
    graphs.forEach(({n, edges}, i) => {
      const g = createDigraph(n, edges)
      const r = findCycle(g)
      expect(r.acyclic, `graph ${i}`).toBe(reference[i])
      if (!r.acyclic) {
        cyclic++
        expect(verifyCycle(g, r.cycle)).toEqual({ok: true})
      }
    })
    // Both outcomes must be well represented, or the comparison proves little.
    expect(cyclic).toBeGreaterThan(200)
    expect(graphs.length - cyclic).toBeGreaterThan(200)
  })
})
