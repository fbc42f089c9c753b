/**
 * Check one diagram block: its options (meta string or directive attributes, over the plugin's
 * defaults) and its body, with every message mapped to file positions.
 */
import {
  checkDiagram,
  parseAttributeOptions,
  parseMetaOptions,
  resolveOptions,
  type CheckSettings,
  type Diagnostic,
  type DiagramCheck,
  type DiagramOptions,
  type Point,
  type SourceRange
} from '@upright/core'
import type {DiagramBlock} from './blocks.ts'

/** A message in file coordinates. */
export interface BlockMessage extends Omit<Diagnostic, 'range' | 'related'> {
  place: {start: Point; end: Point}
  related?: Array<{place: {start: Point; end: Point}; reason: string}>
}

export interface BlockResult {
  block: DiagramBlock
  options: DiagramOptions
  /** `undefined` when the options themselves were bad (status `syntax`). */
  check: DiagramCheck | undefined
  status: DiagramCheck['status']
  messages: BlockMessage[]
}

export function checkBlock(
  block: DiagramBlock,
  defaults: Partial<DiagramOptions>,
  settings: Readonly<CheckSettings>
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
  const check = checkDiagram(block.body, settings)
  for (const d of check.diagnostics) messages.push(toFile(block, d))
  if (check.status === 'syntax' && block.body.trim() === '') {
    // An empty body has no line of its own: point at the block's opening line instead.
    for (const m of messages) if (m.ruleId === 'empty-diagram') m.place = {start: block.start, end: block.end}
  }
  return {block, options, check, status: check.status, messages}
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
