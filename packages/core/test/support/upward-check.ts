import {expect} from 'vitest'
import {createDigraph} from '../../src/index.ts'
import {testPlanarity, verifyKuratowski} from '../../src/planarity/index.ts'
import {findMinimalObstruction, testUpwardPlanarity, type UpwardTestResult} from '../../src/upward/index.ts'
import {stAugment, verifyStGraph} from '../../src/augment/index.ts'
import {checkUpwardWitness, isUpwardPlanarBruteForce, type Edge} from './upward-oracle.ts'

/**
 * Runs the exact test and checks its witness independently: the oracle's witness checker, and
 * verifyStGraph on the st-augmentation built from it.
 */
export function decide(n: number, edges: readonly Edge[]): UpwardTestResult {
  const g = createDigraph(n, edges)
  const r = testUpwardPlanarity(g, {maxMillis: 20_000})
  if (r.status === 'upward') {
    const up = r.upward
    expect(up.embedding.graph).toBe(g)
    const outerDarts = Array.from(up.outerFaces, (f) => up.faces.darts[f]![0]!)
    expect(checkUpwardWitness(n, edges, up.embedding.rotation, outerDarts, up.largeAngle)).toBe(null)
    // and through st-augmentation: H ⊇ G a planar st-digraph keeping G's embedding
    expect(verifyStGraph(g, stAugment(up), up.embedding)).toEqual({ok: true})
  } else if (r.status === 'not-upward' && r.reason === 'nonplanar') {
    const p = testPlanarity(g)
    expect(p.planar).toBe(false)
    if (!p.planar) expect(verifyKuratowski(g, p.kuratowski)).toEqual({ok: true})
  }
  return r
}

export const upward = (n: number, edges: readonly Edge[]) => {
  const r = decide(n, edges)
  expect(r.status).not.toBe('undecided')
  return r.status === 'upward'
}

export const parse = (s: string): Edge[] => s.split(',').map((p) => p.trim().split('->').map(Number) as [number, number])

/** Obstruction from the deletion filter, re-checked by the oracle: not upward, each edge needed. */
export function checkObstruction(n: number, edges: readonly Edge[]): number {
  const res = findMinimalObstruction(createDigraph(n, edges), {maxMillis: 20_000})
  expect(res.ok).toBe(true)
  if (!res.ok) return 0
  const sub = res.edges.map((e) => edges[e]!)
  expect(isUpwardPlanarBruteForce(n, sub)).toBe(false)
  for (let i = 0; i < sub.length; i++) {
    expect(isUpwardPlanarBruteForce(n, sub.filter((_, j) => j !== i))).toBe(true)
  }
  return sub.length
}

