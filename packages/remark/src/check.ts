/** The checking half of remark-upright, without the drawing code (no SVG renderer is loaded). */
export type {TreeSettings} from './lib/check-tree.ts'
export {checkTree} from './lib/check-tree.ts'
export type {DiagramBlock} from './lib/blocks.ts'
export type {BlockMessage, BlockResult} from './lib/check-block.ts'
export {parseMarkdown} from './lib/parse-markdown.ts'
export type {DiagramOutcome, OutcomeCache, CacheSetting} from './lib/cache.ts'
export {openOutcomeCache} from './lib/cache.ts'
