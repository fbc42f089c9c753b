/**
 * Check every diagram of a parsed Markdown document (through the cache when one is given). Apart
 * from the plugin so that tools which only check (the CLI, its worker threads) load no drawing code.
 */
import type {Root} from 'mdast'
import type {CheckSettings, Flow, Limits} from '@upright/core'
import {defaultBudgetMillis} from '@upright/core'
import {findDiagramBlocks} from './blocks.ts'
import type {OutcomeCache} from './cache.ts'
import {checkBlock, rememberResult, type BlockResult} from './check-block.ts'
import {indexLines} from './source-lines.ts'

/** Check every diagram in a parsed document. Exported for the CLI, which reports on its own. */
export function checkTree(
  tree: Root,
  text: string,
  settings: TreeSettings
): BlockResult[] {
  const lines = indexLines(text)
  const defaults = settings.flow ? {flow: settings.flow} : {}
  const results = findDiagramBlocks(tree, lines).map((block) => checkBlock(block, defaults, checkSettings(settings), settings.cache))
  // Results about to be drawn are stored with their drawing, by the caller.
  if (!settings.drawLater) for (const result of results) rememberResult(settings.cache, result)
  return results
}

export interface TreeSettings {
  flow?: Flow | undefined
  budget?: number | undefined
  limits?: Readonly<Partial<Limits>> | undefined
  /** Where to look results up and store them (see `openOutcomeCache`). */
  cache?: OutcomeCache | undefined
  /** The caller draws passing diagrams and stores every result itself (the plugin does). */
  drawLater?: boolean | undefined
}

export function checkSettings(settings: TreeSettings): CheckSettings {
  return {budgetMillis: settings.budget ?? defaultBudgetMillis, limits: settings.limits}
}
