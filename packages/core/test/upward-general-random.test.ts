import {describe, expect, it} from 'vitest'
import {createDigraph} from '../src/index.ts'
import {testPlanarity} from '../src/planarity/index.ts'
import {findMinimalObstruction, testUpwardPlanarity} from '../src/upward/index.ts'
import {isUpwardPlanarBruteForce, labeledDags, type Edge} from './support/upward-oracle.ts'
import {mulberry32, randomUpwardPlanar} from './support/random-st.ts'
import {randomDag, type Family} from './support/upward-families.ts'
import {checkObstruction, decide, parse, upward} from './support/upward-check.ts'

describe('random DAGs with at most 8 vertices against the brute-force oracle', () => {
  const families: Family[] = ['dag', 'single-source', 'st', 'bipartite']
  it('agrees on 5,000 DAGs (single-source, st, bipartite and general); every yes and every obstruction re-checked', () => {
    const rnd = mulberry32(2026)
    const tally: Record<string, number> = {}
    let obstructions = 0
    let k = 0
    while (k < 5000) {
      const family = families[k % families.length]!
      const n = 3 + Math.floor(rnd() * 6)
      const edges = randomDag(rnd, n, 0.25 + 0.4 * rnd(), family)
      if (edges.length > 11) continue // keeps the oracle's enumeration small
      k++
      const r = decide(n, edges)
      expect(r.status).not.toBe('undecided')
      const key = `${family}:${r.status === 'not-upward' ? r.reason : r.status}`
      tally[key] = (tally[key] ?? 0) + 1
      if (r.status === 'not-upward' && r.reason === 'nonplanar') continue
      expect(r.status === 'upward', JSON.stringify({n, edges})).toBe(isUpwardPlanarBruteForce(n, edges))
      if (r.status === 'not-upward') {
        checkObstruction(n, edges)
        obstructions++
      }
    }
    for (const f of families) expect(tally[`${f}:upward`] ?? 0).toBeGreaterThan(1000)
    const planarNo = Object.entries(tally).filter(([key]) => /bimodal|no-upward/.test(key)).reduce((s, [, c]) => s + c, 0)
    expect(planarNo).toBeGreaterThan(20)
    expect(obstructions).toBe(planarNo) // every planar no got a re-checked obstruction
  })

  it('agrees on 400 denser planar DAGs with 5 to 7 vertices, where "no" is common', () => {
    const rnd = mulberry32(4242)
    let no = 0, k = 0
    while (k < 400) {
      const n = 5 + Math.floor(rnd() * 3)
      const family = (['dag', 'single-source', 'st'] as const)[k % 3]
      const edges = randomDag(rnd, n, 0.5 + 0.3 * rnd(), family)
      if (edges.length > 12 || !testPlanarity(createDigraph(n, edges)).planar) continue
      k++
      const got = upward(n, edges)
      expect(got, JSON.stringify({n, edges})).toBe(isUpwardPlanarBruteForce(n, edges))
      if (!got) no++
    }
    expect(no).toBeGreaterThan(20)
  })

  it('says yes on random upward planar graphs (subgraphs of random planar st-graphs)', () => {
    for (let seed = 1; seed <= 300; seed++) {
      const g = randomUpwardPlanar(seed, 4 + (seed % 30))
      expect(upward(g.vertexCount, g.edges)).toBe(true)
    }
  })
})

