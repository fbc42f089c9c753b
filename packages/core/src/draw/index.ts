export type {DrawSettings, Drawing, DrawResult} from './draw-diagram.ts'
export {drawDiagram} from './draw-diagram.ts'
