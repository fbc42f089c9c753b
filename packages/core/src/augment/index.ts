/**
 * st-augmentation: from an upward embedding, a planar st-digraph H ⊇ G that keeps G's embedding,
 * with s and t on the outer face; and an independent checker for it.
 */
export type {StAugmentation} from './st-augment.ts'
export {stAugment} from './st-augment.ts'
export type {VerifyStResult} from './verify-st-graph.ts'
export {verifyStGraph} from './verify-st-graph.ts'
