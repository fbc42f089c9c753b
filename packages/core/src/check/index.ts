export type {Certificate, DiagramStatus, UserEdge} from './certificate.ts'
export type {CheckSettings, DiagramCheck} from './check-diagram.ts'
export {checkDiagram, defaultBudgetMillis} from './check-diagram.ts'
