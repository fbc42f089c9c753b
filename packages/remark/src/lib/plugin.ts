/**
 * remark-upright: check every `upright` diagram in a Markdown document and report problems as vfile
 * messages at their place in the file. Thin glue: finding blocks (blocks.ts), checking one
 * (check-block.ts) and reporting (here).
 */
import type {Root} from 'mdast'
import type {VFile} from 'vfile'
import type {VFileMessage} from 'vfile-message'
import type {Flow, Limits} from '@upright/core'
import type {Root as HastRoot} from 'hast'
import type {RootContent} from 'mdast'
import {defaultBudgetMillis, resolveLimits} from '@upright/core'
import {openOutcomeCache, type CacheSetting} from './cache.ts'
import {checkBlock, rememberResult, type BlockMessage} from './check-block.ts'
import {checkSettings, checkTree, type TreeSettings} from './check-tree.ts'
import {drawBlock, fallbackStatuses, figureNode, renderFallbackBlock, replaceBlock, type Output} from './render-block.ts'

export interface Options {
  /** Direction every edge points in diagrams that do not set `flow` (default: `'up'`). */
  flow?: Flow | null | undefined
  /**
   * What a diagram that fails its check does (default: `'fail'`): `'fail'` reports an error and fails
   * the build after every diagram of the file has been checked; `'warn'` reports a warning and, when
   * drawing, replaces a diagram with a cycle, a crossing or no upward drawing by a marked fallback
   * drawing (edges drawn out of place dashed in the warning colour, `--upright-marked-stroke`, and a
   * note under it that it is not a valid hierarchy drawing; figure class `upright-fallback`); any other
   * failing block is left as written.
   */
  onFailure?: 'fail' | 'warn' | null | undefined
  /** Milliseconds the upward test may spend per diagram before it answers `undecided` (default: 3000). */
  budget?: number | null | undefined
  /**
   * Size limits per diagram, any subset of `maxVertices`, `maxEdges`, `maxLabelLength`,
   * `maxLineLength`, `maxTextBytes` (defaults: `defaultLimits` of @upright/core; docs/language.md#limits).
   */
  limits?: Readonly<Partial<Limits>> | null | undefined
  /** Where rule documentation lives; a message links to `${rulesUrl}#${ruleId}` (default: `'docs/rules.md'`). */
  rulesUrl?: string | null | undefined
  /**
   * How a drawing enters the tree (default: `'hast'`): `'hast'` puts a `<figure>` with the inline SVG
   * in the node's `data`, for remark-rehype without raw HTML; `'html'` puts an `html` node, for
   * pipelines that write Markdown back out or pass raw HTML through.
   */
  output?: Output | null | undefined
  /** Replace passing blocks by their drawing (default: `true`); `false` only checks. */
  draw?: boolean | null | undefined
  /**
   * Reuse results of diagrams seen before, by a hash of their text, options, budget, limits and the
   * Upright version (default: `true`). `true` keeps them in memory for the life of the process;
   * `{dir, maxBytes}` also on disk, in `dir` (default: `node_modules/.cache/upright` of the nearest
   * package.json above the file's `cwd`), shared with `upright check` and bounded to `maxBytes`
   * (default: 50 MiB); `false` checks and draws every diagram afresh.
   */
  cache?: CacheSetting | null | undefined
}

export const messageSource = 'upright'

export default function remarkUpright(options?: Readonly<Options> | null | undefined) {
  const settings = {
    flow: options?.flow ?? undefined,
    onFailure: options?.onFailure ?? 'fail',
    budget: options?.budget ?? defaultBudgetMillis,
    // Resolved here so a bad limit is a configuration error at once, not at the first diagram.
    limits: options?.limits ? resolveLimits(options.limits) : undefined,
    rulesUrl: options?.rulesUrl ?? 'docs/rules.md',
    output: options?.output ?? 'hast',
    draw: options?.draw ?? true
  }
  return function transform(tree: Root, file: VFile): void {
    const cache = openOutcomeCache(options?.cache, file.cwd)
    const results = checkTree(tree, String(file.value ?? ''), {...settings, cache, drawLater: settings.draw})
    let lastFatal: {message: BlockMessage} | undefined
    const fatal: VFileMessage[] = []
    const usedPrefixes = new Map<string, number>()
    for (let result of results) {
      if (result.status === 'upward' && settings.draw && result.svg === undefined && !result.check) {
        // Cached as passing but without a drawing (`upright check` does not draw): check again to draw.
        const fresh = checkBlock(result.block, settings.flow ? {flow: settings.flow} : {}, checkSettings(settings))
        result = {...fresh, key: result.key}
      }
      if (result.status !== 'upward' || !settings.draw) {
        rememberResult(cache, result)
        if (settings.draw && settings.onFailure === 'warn' && fallbackStatuses.has(result.status)) {
          // Warn mode still publishes a picture: the marked fallback drawing (cached outcomes keep no
          // graph, so check again to draw).
          const checked = result.check ? result : checkBlock(result.block, settings.flow ? {flow: settings.flow} : {}, checkSettings(settings))
          try {
            const drawn = renderFallbackBlock(checked, settings.output, usedPrefixes)
            if (drawn.ok) replaceBlock(result, drawn.node)
          } catch {
            // No picture rather than a broken build: the warning below still says what is wrong.
          }
        }
      } else {
        let outcome: {ok: true; node: RootContent} | {ok: false; reason: string}
        try {
          let svg = result.svg
          let hast: HastRoot | undefined
          if (svg === undefined) {
            const drawn = drawBlock(result)
            if (drawn.ok) {
              svg = drawn.svg
              hast = drawn.hast
              rememberResult(cache, result, svg)
            } else throw new Error(drawn.reason)
          }
          outcome = {ok: true, node: figureNode(result, svg, hast, settings.output, usedPrefixes)}
        } catch (error) {
          outcome = {ok: false, reason: error instanceof Error ? error.message : String(error)}
        }
        if (outcome.ok) replaceBlock(result, outcome.node)
        else {
          // A passing diagram that cannot be drawn is our bug, never the writer's: say so plainly.
          result.messages.push({
            severity: 'error',
            ruleId: 'internal-error',
            reason: `Upright could not draw this diagram although it passed its check (${outcome.reason}); please report it.`,
            place: {start: result.block.start, end: result.block.end}
          })
        }
      }
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

export {checkTree}
export type {TreeSettings}

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
