/**
 * Planarity of a digraph's underlying graph with certificates: a planar rotation system for "yes"
 * (left-right test, de Fraysseix & Rosenstiehl, as described by Brandes 2009), a subdivided K5 or
 * K3,3 for "no", and independent checkers for both.
 */
import type {RotationSystem} from '../embedding/rotation-system.ts'

export interface KuratowskiSubgraph {
  type: 'K5' | 'K3,3'
  /** Branch vertex ids: 5 for K5; 6 for K3,3, the first 3 on one side and the last 3 on the other. */
  branch: number[]
  /** Edge ids of g, ascending. */
  edges: number[]
}

export type PlanarityResult =
  | {planar: true; embedding: RotationSystem}
  | {planar: false; kuratowski: KuratowskiSubgraph}

export {testPlanarity} from './test-planarity.ts'
export {verifyPlanarEmbedding} from './verify-embedding.ts'
export {verifyKuratowski} from './verify-kuratowski.ts'
