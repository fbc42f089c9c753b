/**
 * Check one diagram block: its options (meta string or directive attributes, over the plugin's
 * defaults) and its body, with every message mapped to file positions. The body's outcome comes from
 * the cache when it holds one (cache.ts); options are parsed every time, as they are cheap and their
 * messages sit on the fence line rather than in the body.
 */
import {
  checkDiagram,
  defaultBudgetMillis,
  parseAttributeOptions,
  parseMetaOptions,
  resolveLimits,
  resolveOptions,
  type Certificate,
  type CheckSettings,
  type Diagnostic,
  type DiagramCheck,
  type DiagramOptions,
  type Point,
  type SourceRange
} from '@upright/core'
import type {DiagramBlock} from './blocks.ts'
import {outcomeKey, type DiagramOutcome, type OutcomeCache} from './cache.ts'

/** A message in file coordinates. */
export interface BlockMessage extends Omit<Diagnostic, 'range' | 'related'> {
  place: {start: Point; end: Point}
  related?: Array<{place: {start: Point; end: Point}; reason: string}>
}

export interface BlockResult {
  block: DiagramBlock
  options: DiagramOptions
  /**
   * The check as computed in this run; `undefined` when the options themselves were bad (status
   * `syntax`) or when the outcome came from the cache.
   */
  check: DiagramCheck | undefined
  status: DiagramCheck['status']
  messages: BlockMessage[]
  /** The certificate of a failing check, whether computed now or cached. */
  certificate?: Certificate | undefined
  /** Cache address of this body and options, when a cache was given. */
  key?: string | undefined
  /** The drawing the cache held for this diagram (default id prefix). */
  svg?: string | undefined
}

export function checkBlock(
  block: DiagramBlock,
  defaults: Partial<DiagramOptions>,
  settings: Readonly<CheckSettings>,
  cache?: OutcomeCache | undefined
): BlockResult {
  const messages: BlockMessage[] = []
  let layer: Partial<DiagramOptions> = {}
  const meta = block.meta
  if (meta?.kind === 'meta') {
    const parsed = parseMetaOptions(meta.value)
    layer = parsed.options
    for (const d of parsed.diagnostics) {
      messages.push({...strip(d), place: shiftMeta(d.range, meta.start)})
    }
  } else if (meta?.kind === 'attributes') {
    const parsed = parseAttributeOptions(meta.value)
    layer = parsed.options
    for (const {related: _related, ...d} of parsed.diagnostics) {
      messages.push({...d, place: {start: meta.start, end: meta.end}})
    }
  }
  const options = resolveOptions(defaults, layer)
  if (messages.some((m) => m.severity === 'error')) {
    return {block, options, check: undefined, status: 'syntax', messages}
  }
  const key = cache ? outcomeKey(cache, block.body, options, settings.budgetMillis ?? defaultBudgetMillis, resolveLimits(settings.limits)) : undefined
  const held: DiagramOutcome | undefined = key === undefined ? undefined : cache!.get(key)
  const check = held ? undefined : checkDiagram(block.body, settings)
  const outcome = held ?? check!
  for (const d of outcome.diagnostics) messages.push(toFile(block, d))
  if (outcome.status === 'syntax' && block.body.trim() === '') {
    // An empty body has no line of its own: point at the block's opening line instead.
    for (const m of messages) if (m.ruleId === 'empty-diagram') m.place = {start: block.start, end: block.end}
  }
  const result: BlockResult = {block, options, check, status: outcome.status, messages, certificate: outcome.certificate, key}
  if (held?.svg !== undefined) result.svg = held.svg
  return result
}

/**
 * Store a result computed in this run (with its drawing, when it has one). Cached results, bad
 * options and `undecided` are not stored.
 */
export function rememberResult(cache: OutcomeCache | undefined, result: BlockResult, svg?: string): void {
  const check = result.check
  if (!cache || result.key === undefined || !check || check.status === 'undecided') return
  const outcome: DiagramOutcome = {status: check.status, diagnostics: check.diagnostics}
  if (check.certificate) outcome.certificate = check.certificate
  if (svg !== undefined) outcome.svg = svg
  cache.set(result.key, outcome)
}

function strip(d: Diagnostic): Omit<Diagnostic, 'range' | 'related'> {
  const {range: _range, related: _related, ...rest} = d
  return rest
}

function toFile(block: DiagramBlock, d: Diagnostic): BlockMessage {
  const message: BlockMessage = {...strip(d), place: mapRange(block, d.range)}
  if (d.related) message.related = d.related.map((r) => ({place: mapRange(block, r.range), reason: r.reason}))
  return message
}

function mapRange(block: DiagramBlock, range: SourceRange): {start: Point; end: Point} {
  return {start: block.toFile(range.start), end: block.toFile(range.end)}
}

/** Meta-string ranges are on line 1 of the meta string; the meta string sits on the fence line. */
function shiftMeta(range: SourceRange, at: Point): {start: Point; end: Point} {
  const shift = (p: Point): Point => ({line: at.line, column: at.column + p.column - 1, offset: at.offset + p.offset})
  return {start: shift(range.start), end: shift(range.end)}
}
