/**
 * Advice for a failing diagram: which edges to remove (a feedback arc set, a planarizing set, or the
 * complement of a maximal upward planar subgraph), in words the writer can act on.
 */
export {feedbackArcSet, stronglyConnectedComponents, exactVertexLimit, type FeedbackArcSet} from './feedback-arc-set.ts'
export {planarizingSet, type PlanarizingSet} from './planarizing-set.ts'
export {maximalUpwardSubgraph, type UpwardSubgraph} from './upward-subgraph.ts'
export {attachFix} from './attach-fix.ts'
export {suggestFix, userFix, fixSentence, fixNote, withFixMessage, withoutEdges, type Fix, type UserFix} from './suggest-fix.ts'
