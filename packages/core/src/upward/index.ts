/**
 * Upward planarity: bimodality and the fixed-embedding test (Bertolazzi, Di Battista, Liotta &
 * Mannino 1994), and the exact test for any acyclic digraph with a budget and a minimal obstruction.
 *
 * Choice of the general method (measured with `pnpm bench upward`, figures in bench/README.md):
 * answer-preserving reductions (reduce.ts) shrink most real diagrams to nothing or to a small core;
 * st cores and source/sink-only cores are settled by planarity alone; the rest by a branch and bound
 * over planar embeddings built ear by ear, bounded by the fixed-embedding condition over all outer
 * faces (embedding-search.ts). A SAT encoding (Chimani & Zeranski, GD 2012) was not needed to meet
 * the time targets on the North DAGs, so no solver dependency is taken.
 */
export type {UpwardEmbedding} from './upward-embedding.ts'
export {isBimodal, isBimodalAt, type BimodalResult} from './bimodal.ts'
export {testUpwardEmbedded, type UpwardEmbeddedOptions, type UpwardEmbeddedResult} from './fixed-embedding.ts'
export {
  testUpwardPlanarity,
  type UpwardBudget,
  type UpwardMethod,
  type UpwardTestResult,
} from './test-upward-planarity.ts'
export {findMinimalObstruction, type MinimalObstructionResult} from './minimal-obstruction.ts'
