/**
 * Upward planarity: bimodality and the fixed-embedding test (Bertolazzi, Di Battista, Liotta &
 * Mannino 1994), and the exact test for any acyclic digraph with a budget and a minimal obstruction.
 *
 * Choice of the general method (measured with `pnpm bench upward`, figures in bench/README.md):
 * answer-preserving reductions (reduce.ts) shrink most real diagrams to nothing or to a small core;
 * st cores and source/sink-only cores are settled by planarity alone, and two cheap sufficient
 * checks (the planarity embedding as is; all sources and sinks on the outer face) settle many more;
 * the rest goes to a branch and bound over planar embeddings grown path by path (in the manner of
 * Demoucron, Malgrange & Pertuiset), pruned by bimodality and bounded by the fixed-embedding
 * condition over all outer faces, with restarts (embedding-search.ts). On the North DAGs the search
 * cores have at most 33 vertices and need a few hundred nodes at most, so a SAT encoding
 * (Chimani & Zeranski, GD 2012) was not needed and no solver dependency is taken.
 * Cores with one source (and several sinks) never reach the search: they go to the single-source
 * test after Bertolazzi, Di Battista, Mannino & Tamassia (SIAM J. Comput. 27, 1998) in
 * single-source.ts, polynomial (O(n²) here; theirs is linear), also bounded by the budget.
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
export {isUpwardPlanarSingleSource, upwardRotationSingleSource} from './single-source.ts'
