/**
 * The marked fallback drawing for warn mode: a maximal upward planar subgraph drawn crossing-free,
 * the rest inserted upward with few crossings and marked.
 */
export {layoutFallback, fallbackBoxes, type FallbackLayout, type FallbackSettings, type EdgeMark} from './fallback-drawing.ts'
export {insertEdge, type EditableEmbedding, type InsertionResult} from './insert-edges.ts'
