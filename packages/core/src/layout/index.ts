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
export {layoutStats, countCrossings, type LayoutStats} from './stats.ts'
