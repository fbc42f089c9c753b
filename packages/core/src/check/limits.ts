/**
 * Size limits for one diagram, so a docs build given a huge or hostile body answers with a message
 * instead of running out of memory or time. Reference: the "Limits" section of docs/language.md.
 *
 * Checked in two passes, both linear in the text:
 * - before parsing (`checkTextLimits`): the body's size in UTF-8 bytes and each line's length, so the
 *   parser only ever sees bounded lines (a line bounds the edges one list-to-list arrow can make);
 * - while and after parsing: edges as written (the parser stops making edges past the limit, since
 *   `a, b, … -> c, d, …` makes the product of two lists), vertices and label lengths
 *   (`checkParsedLimits`).
 */
import type {ParsedDiagram} from '../parse/index.ts'
import type {Diagnostic, Point, SourceRange} from '../source-range.ts'

export interface Limits {
  /** Most vertices a diagram may have. */
  maxVertices: number
  /** Most edges a diagram may write, repeats included (a repeated edge is counted each time). */
  maxEdges: number
  /** Longest label, in Unicode code points. */
  maxLabelLength: number
  /** Longest line of the body, in UTF-16 code units (what columns count). */
  maxLineLength: number
  /** Largest body, in bytes of its UTF-8 encoding. */
  maxTextBytes: number
}

export const defaultLimits: Readonly<Limits> = Object.freeze({
  maxVertices: 2000,
  maxEdges: 6000,
  maxLabelLength: 200,
  maxLineLength: 1000,
  maxTextBytes: 256 * 1024
})

/** Every rule id a limit reports, each with a section of the same name in docs/rules.md. */
export const limitRuleIds = ['diagram-too-large', 'line-too-long', 'too-many-vertices', 'too-many-edges', 'label-too-long'] as const

export type ResolvedLimits = Readonly<Limits>

/**
 * Defaults overridden field by field. A limit must be a whole number ≥ 1 (`Infinity` turns it off);
 * anything else is a programming error and throws a RangeError naming the field.
 */
export function resolveLimits(limits?: Readonly<Partial<Limits>> | null): ResolvedLimits {
  const resolved: Limits = {...defaultLimits}
  for (const key of Object.keys(defaultLimits) as Array<keyof Limits>) {
    const value = limits?.[key]
    if (value === undefined) continue
    if (!(value === Infinity || (Number.isInteger(value) && value >= 1))) {
      throw new RangeError(`limits.${key} must be a whole number ≥ 1 or Infinity, got ${String(value)}`)
    }
    resolved[key] = value
  }
  return resolved
}

const group = (n: number): string => (Number.isFinite(n) ? String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',') : String(n))

/** UTF-8 length of a UTF-16 string; a lone surrogate counts 3 bytes, as U+FFFD would. */
function utf8Bytes(code: number, next: number): number {
  if (code < 0x80) return 1
  if (code < 0x800) return 2
  if (code >= 0xd800 && code <= 0xdbff && next >= 0xdc00 && next <= 0xdfff) return 4
  return 3
}

/**
 * Limits on the raw text. A body over the byte limit gets one message and nothing else is looked at;
 * otherwise every over-long line gets one, from its first character past the limit to its end.
 * Positions follow the scanner's conventions (a BOM at offset 0 is not counted in columns).
 */
export function checkTextLimits(text: string, limits: ResolvedLimits): Diagnostic[] {
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0
  const diagnostics: Diagnostic[] = []
  let bytes = 0
  let crossedAt = -1
  let line = 1
  let lineStart = bom
  let crossedPoint: Point | undefined
  for (let at = bom; at < text.length; at++) {
    const code = text.charCodeAt(at)
    const size = utf8Bytes(code, text.charCodeAt(at + 1))
    if (crossedAt < 0 && bytes + size > limits.maxTextBytes) {
      crossedAt = at
      crossedPoint = {line, column: at - lineStart + 1, offset: at}
    }
    bytes += size
    if (size === 4) at++
    if (code === 0x0a || code === 0x0d) {
      if (code === 0x0d && text.charCodeAt(at + 1) === 0x0a) at++
      line++
      lineStart = at + 1
    }
  }
  if (crossedPoint) {
    const end: Point = {line, column: text.length - lineStart + 1, offset: text.length}
    return [
      {
        severity: 'error',
        ruleId: 'diagram-too-large',
        reason: `This diagram is ${group(bytes)} bytes long; the limit is ${group(limits.maxTextBytes)} bytes, reached here. Split it into smaller diagrams.`,
        range: {start: crossedPoint, end},
        note: 'Diagrams are checked and drawn in every build; a size limit keeps one oversized block from stalling it. The limit can be raised (`limits.maxTextBytes`, `--limits`).'
      }
    ]
  }
  line = 1
  lineStart = bom
  for (let at = bom; at <= text.length; at++) {
    const code = text.charCodeAt(at)
    const ends = at === text.length || code === 0x0a || code === 0x0d
    if (!ends) continue
    const length = at - lineStart
    if (length > limits.maxLineLength) {
      diagnostics.push({
        severity: 'error',
        ruleId: 'line-too-long',
        reason: `This line is ${group(length)} characters long; the limit is ${group(limits.maxLineLength)}. Break the statement into several lines (each line may add edges).`,
        range: {
          start: {line, column: limits.maxLineLength + 1, offset: lineStart + limits.maxLineLength},
          end: {line, column: length + 1, offset: at}
        },
        note: 'A long line can make a very large number of edges (`a, b, … -> c, d, …` joins every pair); the limit keeps that bounded. It can be raised (`limits.maxLineLength`, `--limits`).'
      })
    }
    if (code === 0x0d && text.charCodeAt(at + 1) === 0x0a) at++
    line++
    lineStart = at + 1
  }
  return diagnostics
}

/** Limits on what was parsed: vertices (at the first one past the limit) and every over-long label. */
export function checkParsedLimits(parsed: ParsedDiagram, limits: ResolvedLimits): Diagnostic[] {
  const diagnostics: Diagnostic[] = []
  if (parsed.vertices.length > limits.maxVertices) {
    const first = parsed.vertices[limits.maxVertices]!
    diagnostics.push({
      severity: 'error',
      ruleId: 'too-many-vertices',
      reason: `This diagram has ${group(parsed.vertices.length)} vertices; the limit is ${group(limits.maxVertices)}, and \`${first.key}\` is the first past it. Split it into smaller diagrams.`,
      range: first.range,
      note: 'Large diagrams take long to check and are hard to read; the limit can be raised (`limits.maxVertices`, `--limits`).'
    })
  }
  for (const vertex of parsed.vertices) {
    if (vertex.label === undefined || vertex.labelRange === undefined) continue
    // Count code points without building an array: every unit but the low half of a pair.
    let length = 0
    for (let i = 0; i < vertex.label.length; i++) {
      const code = vertex.label.charCodeAt(i)
      if (!(code >= 0xdc00 && code <= 0xdfff && i > 0 && vertex.label.charCodeAt(i - 1) >= 0xd800 && vertex.label.charCodeAt(i - 1) <= 0xdbff)) length++
    }
    if (length > limits.maxLabelLength) {
      diagnostics.push({
        severity: 'error',
        ruleId: 'label-too-long',
        reason: `The label of \`${vertex.key}\` is ${group(length)} characters long; the limit is ${group(limits.maxLabelLength)}. Shorten it; the diagram's text around it can say more.`,
        range: vertex.labelRange,
        note: 'Labels are drawn on one line each, so a long one makes a very wide box. The limit can be raised (`limits.maxLabelLength`, `--limits`).'
      })
    }
  }
  return diagnostics
}

/** The message the parser gives at the first edge past `maxEdges` (it stops making edges there). */
export function tooManyEdges(range: SourceRange, maxEdges: number): Diagnostic {
  return {
    severity: 'error',
    ruleId: 'too-many-edges',
    reason: `This diagram writes more than ${group(maxEdges)} edges (each pair an arrow joins counts, repeats included); this edge is the first past the limit. Split it into smaller diagrams.`,
    range,
    note: 'Large diagrams take long to check and are hard to read; the limit can be raised (`limits.maxEdges`, `--limits`).'
  }
}
