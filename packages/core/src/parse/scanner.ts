/**
 * Scanner for the diagram language: turns a body into tokens one line at a time, on demand.
 *
 * Linear time: every code unit is looked at a bounded number of times. Tokens never span a line, so a
 * token's position is its offset minus the offset where its line starts. The parser pulls tokens with
 * `next()` and, after an error, calls `skipLine()` to resume at the next line.
 *
 * Line endings are `\n`, `\r\n` and a lone `\r` (as in unist/vfile). A byte order mark (U+FEFF) at
 * offset 0 is skipped and not counted in columns, so column 1 is the first character an editor shows;
 * offsets still index the text as given.
 */
import type {Diagnostic, Point, SourceRange} from '../source-range.ts'

export type Token =
  | {kind: 'id'; text: string; range: SourceRange}
  | {kind: 'label'; value: string; range: SourceRange}
  | {kind: 'arrow'; range: SourceRange}
  | {kind: 'comma'; range: SourceRange}
  /** `:` (only meaningful after a tier's name). */
  | {kind: 'colon'; range: SourceRange}
  /** `(name)`: a tone; `value` is the text between the parentheses, spaces and tabs trimmed. */
  | {kind: 'tone'; value: string; range: SourceRange}
  /** `<target>`: a link; `value` is the text between the angle brackets, exactly as written. */
  | {kind: 'link'; value: string; range: SourceRange}
  /** End of a line (after any comment) or of the text; `range` is empty, at the line ending. */
  | {kind: 'end'; last: boolean; range: SourceRange}
  | {kind: 'error'; diagnostic: Diagnostic}

/**
 * An id starts with a letter, a digit or `_` and goes on with letters, combining marks, digits, `_`,
 * `.` and `-`, except that a `-` directly followed by `>` is left for the arrow (so `a->b` is a → b).
 */
const identifier = /[\p{L}\p{N}_](?:[\p{L}\p{M}\p{N}_.]|-(?!>))*/uy

const space = 0x20
const tab = 0x09
const lineFeed = 0x0a
const carriageReturn = 0x0d
const quote = 0x22
const backslash = 0x5c
const letterN = 0x6e
const hash = 0x23
const comma = 0x2c
const dash = 0x2d
const greaterThan = 0x3e
const lessThan = 0x3c
const colon = 0x3a
const openParen = 0x28
const closeParen = 0x29
const byteOrderMark = 0xfeff

export interface Scanner {
  next(): Token
  /** Drop the rest of the current line; the next token is the first of the following line. */
  skipLine(): void
  /** An empty range where the next line starts, once the current one is done (else where the scanner is). */
  here(): SourceRange
}

export function createScanner(text: string): Scanner {
  let offset = text.charCodeAt(0) === byteOrderMark ? 1 : 0
  let line = 1
  let lineStart = offset
  /** True once the current line's `end` token has been handed out. */
  let atLineEnd = false

  function point(at: number): Point {
    return {line, column: at - lineStart + 1, offset: at}
  }

  function range(from: number, to: number): SourceRange {
    return {start: point(from), end: point(to)}
  }

  function isLineEnding(code: number): boolean {
    return code === lineFeed || code === carriageReturn
  }

  /** Offset of the line ending (or text end) at or after `from`. */
  function lineEndFrom(from: number): number {
    let at = from
    while (at < text.length && !isLineEnding(text.charCodeAt(at))) at++
    return at
  }

  /** Step over the line ending at `offset` (if any) and start the next line. */
  function startNextLine(): void {
    const code = text.charCodeAt(offset)
    if (code === carriageReturn) {
      offset += text.charCodeAt(offset + 1) === lineFeed ? 2 : 1
    } else if (code === lineFeed) {
      offset += 1
    } else {
      return
    }
    line++
    lineStart = offset
  }

  function error(ruleId: string, reason: string, from: number, to: number): Token {
    const diagnostic: Diagnostic = {severity: 'error', ruleId, reason, range: range(from, to)}
    return {kind: 'error', diagnostic}
  }

  function end(): Token {
    atLineEnd = true
    return {kind: 'end', last: offset >= text.length, range: range(offset, offset)}
  }

  /** A quoted label from the `"` at `offset`; it must close on the same line. */
  function scanLabel(): Token {
    const open = offset
    let value = ''
    let chunkStart = open + 1
    let at = open + 1
    while (at < text.length) {
      const code = text.charCodeAt(at)
      if (isLineEnding(code)) break
      if (code === quote) {
        value += text.slice(chunkStart, at)
        offset = at + 1
        return {kind: 'label', value, range: range(open, offset)}
      }
      if (code === backslash) {
        const escaped = text.charCodeAt(at + 1)
        if (escaped === quote || escaped === backslash) {
          value += text.slice(chunkStart, at) + text[at + 1]
          at += 2
          chunkStart = at
          continue
        }
        // `\n` breaks a label onto a new line in its box (the label stays on one source line).
        if (escaped === letterN) {
          value += text.slice(chunkStart, at) + '\n'
          at += 2
          chunkStart = at
          continue
        }
        // A backslash at the end of the line is reported as the missing closing quote.
        if (at + 1 >= text.length || isLineEnding(escaped)) {
          at++
          break
        }
        const width = codePointWidth(text, at + 1)
        const shown = text.slice(at, at + 1 + width)
        return error(
          'bad-escape',
          `Unknown escape \`${shown}\` in a label: only \`\\"\`, \`\\\\\` and \`\\n\` are escapes, so write \`\\\\\` for a backslash.`,
          at,
          at + 1 + width
        )
      }
      at++
    }
    return error('unterminated-string', 'This label has no closing `"` before the end of the line.', open, at)
  }

  /**
   * A bracketed token from the opener at `offset` to the first `close` on the same line: a tone
   * `(…)` or a link `<…>`. Nothing inside is an escape, so the content is taken as written.
   */
  function scanBracketed(kind: 'tone' | 'link', close: number): Token {
    const open = offset
    let at = open + 1
    while (at < text.length && !isLineEnding(text.charCodeAt(at)) && text.charCodeAt(at) !== close) at++
    if (at >= text.length || text.charCodeAt(at) !== close) {
      const what = kind === 'tone' ? 'This tone has no closing `)` before the end of the line.' : 'This link has no closing `>` before the end of the line.'
      return error('unclosed-bracket', what, open, at)
    }
    const inner = text.slice(open + 1, at)
    offset = at + 1
    const value = kind === 'tone' ? inner.replace(/^[ \t]+|[ \t]+$/g, '') : inner
    return {kind, value, range: range(open, offset)}
  }

  function next(): Token {
    if (atLineEnd) {
      atLineEnd = false
      startNextLine()
    }
    while (offset < text.length) {
      const code = text.charCodeAt(offset)
      if (code === space || code === tab) {
        offset++
        continue
      }
      if (isLineEnding(code)) return end()
      if (code === hash) {
        offset = lineEndFrom(offset)
        return end()
      }
      if (code === comma) {
        offset++
        return {kind: 'comma', range: range(offset - 1, offset)}
      }
      if (code === dash && text.charCodeAt(offset + 1) === greaterThan) {
        offset += 2
        return {kind: 'arrow', range: range(offset - 2, offset)}
      }
      if (code === quote) return scanLabel()
      if (code === colon) {
        offset++
        return {kind: 'colon', range: range(offset - 1, offset)}
      }
      if (code === openParen) return scanBracketed('tone', closeParen)
      if (code === lessThan) return scanBracketed('link', greaterThan)
      identifier.lastIndex = offset
      const match = identifier.exec(text)
      if (match) {
        const from = offset
        offset += match[0].length
        return {kind: 'id', text: match[0], range: range(from, offset)}
      }
      const width = codePointWidth(text, offset)
      return error('unexpected-character', unexpectedReason(text.slice(offset, offset + width)), offset, offset + width)
    }
    return end()
  }

  function skipLine(): void {
    offset = lineEndFrom(offset)
    atLineEnd = true
  }

  function here(): SourceRange {
    if (!atLineEnd) return range(offset, offset)
    const code = text.charCodeAt(offset)
    if (code !== carriageReturn && code !== lineFeed) return range(offset, offset)
    const at = offset + (code === carriageReturn && text.charCodeAt(offset + 1) === lineFeed ? 2 : 1)
    const start = {line: line + 1, column: 1, offset: at}
    return {start, end: start}
  }

  return {next, skipLine, here}
}

/** 2 for a well-formed surrogate pair at `at`, else 1: ranges cover whole code points. */
export function codePointWidth(text: string, at: number): number {
  const code = text.charCodeAt(at)
  if (code >= 0xd800 && code <= 0xdbff) {
    const low = text.charCodeAt(at + 1)
    if (low >= 0xdc00 && low <= 0xdfff) return 2
  }
  return 1
}

/** `U+00A0`-style name of a character's code point. */
export function codePointName(character: string): string {
  return 'U+' + (character.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')
}

/** Quote a character for a message unless it is invisible or would be mangled on a terminal. */
export function showCharacter(character: string): string {
  const visible = /^[\p{L}\p{N}\p{P}\p{S}]$/u.test(character) && character !== '`'
  return visible ? `\`${character}\` (${codePointName(character)})` : codePointName(character)
}

function unexpectedReason(character: string): string {
  const shown = showCharacter(character)
  if (character === '-') return `Unexpected character ${shown}: an arrow is written \`->\`, and an id cannot start with \`-\`.`
  if (/^[\p{White_Space}\p{Cf}]$/u.test(character)) return `Unexpected character ${shown}: only spaces and tabs may separate ids, arrows and commas.`
  if (/^\p{M}$/u.test(character)) return `Unexpected character ${shown}: a combining mark may only follow a letter or digit inside an id.`
  if (character === '>') return `Unexpected character ${shown}: an arrow is written \`->\`.`
  return `Unexpected character ${shown}: ids use letters, digits, \`_\`, \`-\` and \`.\`, and labels go in double quotes.`
}
