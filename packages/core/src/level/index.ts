/** Levels for diagrams with tiers, and exact level planarity with a witness or a certificate. */
export {testLevelPlanarity, type LevelItem, type LevelPlanarity, type LevelPlanarityOptions} from './level-planarity.ts'
export {assignLevels, type LevelAssignment} from './level-assignment.ts'
export {checkLevelDrawing, type LevelDrawingCheck} from './check-level-drawing.ts'
export {splitLabelledEdges, joinLabelledEdges, originalEdge, type EdgeLabelGraph} from './edge-label-graph.ts'

/** Rule ids the pipeline reports for tiers beyond the parser's, each with a section in docs/language.md. */
export const tierRuleIds = ['path-against-tiers', 'tiers-not-drawable'] as const
