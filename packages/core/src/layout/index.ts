export type {
  Flow,
  BoxSize,
  LayoutInput,
  Layout,
  LayoutNode,
  LayoutEdge,
  Spacing,
} from './types.ts'
export {defaultSpacing} from './types.ts'
export {layoutUpward} from './layout-upward.ts'
export {layoutCandidates, layoutSmallest, writtenOrderKept, type SmallestLayout, type SmallestLayoutOptions} from './smallest-layout.ts'
export {levelCandidates, type LevelCandidate, type LevelCandidateKind, type LevelCandidateOptions, type OrderPreference} from './level-candidates.ts'
export {layoutStats, countCrossings, type LayoutStats} from './stats.ts'
export {layoutLevels, type LevelLayout, type LevelLayoutInput} from './level-layout.ts'
export {layoutTiers, type PlacedRect, type TierBand, type TierLayout, type TierLayoutInput} from './tier-layout.ts'
export {joinEdgeLabels, type EdgeLabelBox, type JoinedLayout} from './edge-labels.ts'
