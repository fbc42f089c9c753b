export type {DrawSettings, Drawing, DrawResult, DrawnEdgeLabel, DrawnTier} from './draw-diagram.ts'
export {drawDiagram, EDGE_LABEL_BOX, TIER_CAPTION_BOX} from './draw-diagram.ts'
