export type {Cycle, AcyclicityResult} from './find-cycle.ts'
export {findCycle} from './find-cycle.ts'
export {verifyCycle} from './verify-cycle.ts'
