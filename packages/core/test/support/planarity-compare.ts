import {createDigraph, testPlanarity, verifyKuratowski, verifyPlanarEmbedding} from '@upright/core'
import {networkxPlanar} from './planarity-networkx.ts'
import type {Edges} from './planarity-generators.ts'

export interface Case {
  name: string
  vertexCount: number
  edges: Edges
}

/** Our answer, with its certificate checked by the independent checkers; returns planar or not. */
export function certifiedAnswer(c: Case): boolean {
  const g = createDigraph(c.vertexCount, c.edges)
  const r = testPlanarity(g)
  const check = r.planar ? verifyPlanarEmbedding(r.embedding) : verifyKuratowski(g, r.kuratowski)
  if (!check.ok) throw new Error(`${c.name}: certificate rejected: ${check.reason}`)
  return r.planar
}

export function compare(cases: Case[]): {planar: number; disagreements: string[]} {
  const reference = networkxPlanar(cases)
  const disagreements: string[] = []
  let planar = 0
  for (const [i, c] of cases.entries()) {
    const ours = certifiedAnswer(c)
    if (ours) planar++
    if (ours !== reference[i]) disagreements.push(`${c.name}: ours ${ours}, networkx ${reference[i]}`)
  }
  return {planar, disagreements}
}
