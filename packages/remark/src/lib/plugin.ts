/**
 * remark-upright: check every `upright` diagram in a Markdown document and report problems as vfile
 * messages at their place in the file. Thin glue: finding blocks (blocks.ts), checking one
 * (check-block.ts) and reporting (here).
 */
import type {Root} from 'mdast'
import type {VFile} from 'vfile'
import type {VFileMessage} from 'vfile-message'
import type {Flow} from '@upright/core'
import {defaultBudgetMillis} from '@upright/core'
import {findDiagramBlocks} from './blocks.ts'
import {checkBlock, type BlockMessage, type BlockResult} from './check-block.ts'
import {indexLines} from './source-lines.ts'

export interface Options {
  /** Direction every edge points in diagrams that do not set `flow` (default: `'up'`). */
  flow?: Flow | null | undefined
  /**
   * What a diagram that fails its check does (default: `'fail'`): `'fail'` reports an error and fails
   * the build after every diagram of the file has been checked; `'warn'` reports a warning and leaves
   * the block as written.
   */
  onFailure?: 'fail' | 'warn' | null | undefined
  /** Milliseconds the upward test may spend per diagram before it answers `undecided` (default: 3000). */
  budget?: number | null | undefined
  /** Where rule documentation lives; a message links to `${rulesUrl}#${ruleId}` (default: `'docs/rules.md'`). */
  rulesUrl?: string | null | undefined
}

export const messageSource = 'upright'

export default function remarkUpright(options?: Readonly<Options> | null | undefined) {
  const settings = {
    flow: options?.flow ?? undefined,
    onFailure: options?.onFailure ?? 'fail',
    budget: options?.budget ?? defaultBudgetMillis,
    rulesUrl: options?.rulesUrl ?? 'docs/rules.md'
  }
  return function transform(tree: Root, file: VFile): void {
    const results = checkTree(tree, String(file.value ?? ''), settings)
    let lastFatal: {message: BlockMessage} | undefined
    const fatal: VFileMessage[] = []
    for (const result of results) {
      for (const message of result.messages) {
        const asError = message.severity === 'error' && settings.onFailure === 'fail'
        if (asError) lastFatal = {message}
        fatal.push(...report(file, message, asError, settings.rulesUrl))
      }
    }
    if (lastFatal) {
      // Every message is on the file already; stop the build with the last one, as `file.fail` does.
      throw fatal[fatal.length - 1]
    }
  }
}

/** Check every diagram in a parsed document. Exported for the CLI, which reports on its own. */
export function checkTree(
  tree: Root,
  text: string,
  settings: {flow?: Flow | undefined; budget?: number | undefined}
): BlockResult[] {
  const lines = indexLines(text)
  const defaults = settings.flow ? {flow: settings.flow} : {}
  return findDiagramBlocks(tree, lines).map((block) =>
    checkBlock(block, defaults, {budgetMillis: settings.budget ?? defaultBudgetMillis})
  )
}

function report(file: VFile, message: BlockMessage, asError: boolean, rulesUrl: string): VFileMessage[] {
  const m = file.message(message.reason, {
    place: message.place,
    ruleId: message.ruleId,
    source: messageSource
  })
  m.url = `${rulesUrl}#${message.ruleId}`
  const involved = message.related?.map((r) => `${r.place.start.line}:${r.place.start.column} ${r.reason}`)
  const note = [message.note, involved && involved.length > 0 ? `Involved: ${involved.join('; ')}.` : undefined]
    .filter(Boolean)
    .join('\n')
  if (note) m.note = note
  if (asError) {
    m.fatal = true
    return [m]
  }
  m.fatal = false
  return []
}
