/**
 * Diagram options: one schema table of known keys, each with a value parser, read either from a code
 * fence's meta string (`flow=down title="Release pipeline"`) or from container-directive attributes
 * that remark-directive has already split into a record. Adding an option is one entry in
 * `optionSchema`: its type, default, parser and summary all live there, and `DiagramOptions`,
 * `defaultDiagramOptions` and the error messages follow from it.
 *
 * The meta scanner is a single left-to-right pass, linear in the length of the meta string.
 */
import type {Diagnostic, SourceRange} from '../source-range.ts'
import {codePointWidth, showCharacter} from './scanner.ts'

export type Flow = 'up' | 'down' | 'left' | 'right'

export const flows: readonly Flow[] = ['up', 'down', 'left', 'right']

export type OptionValue<T> = {ok: true; value: T} | {ok: false; expected: string}

export interface OptionSpec<T> {
  /** One line for docs and `--help`, stating the default. */
  summary: string
  default: T
  /** `null` when the key is written without `=value`; `expected` completes "must be …". */
  parse(value: string | null): OptionValue<T>
}

/** Identity with a type argument, so each schema entry states its value type once. */
function option<T>(spec: OptionSpec<T>): OptionSpec<T> {
  return spec
}

function oneOf<const T extends string>(allowed: readonly T[]): (value: string | null) => OptionValue<T> {
  const expected = `one of ${allowed.map((name) => `\`${name}\``).join(', ')}`
  return (value) => ((allowed as readonly string[]).includes(value ?? '') ? {ok: true, value: value as T} : {ok: false, expected})
}

/** Every known option; keys are the names authors write. */
export const optionSchema = {
  flow: option<Flow>({
    summary: 'Direction every edge points in the drawing, tail to head: up, down, left or right (default up).',
    default: 'up',
    parse: oneOf(flows)
  }),
  title: option<string | undefined>({
    summary: 'Caption and accessible name of the diagram (default none; `title=""` shows none).',
    default: undefined,
    parse: (value) => (value === null ? {ok: false, expected: 'a text, such as `title="Release pipeline"`'} : {ok: true, value})
  })
} as const

/** One field per `optionSchema` entry: `flow` (default `up`) and `title` (default none). */
export type DiagramOptions = {-readonly [K in keyof typeof optionSchema]: (typeof optionSchema)[K] extends OptionSpec<infer T> ? T : never}

export const defaultDiagramOptions: Readonly<DiagramOptions> = Object.freeze(
  Object.fromEntries(Object.entries(optionSchema).map(([name, spec]) => [name, spec.default])) as DiagramOptions
)

export const optionNames = Object.keys(optionSchema) as Array<keyof DiagramOptions>

function isOptionName(key: string): key is keyof DiagramOptions {
  return Object.hasOwn(optionSchema, key)
}

type OptionProblem = Omit<Diagnostic, 'range'> & {target: 'key' | 'value'}

/** Check one `key=value` pair against the schema and store it in `options`, or describe the problem. */
function applyOption(options: Partial<DiagramOptions>, key: string, value: string | null): OptionProblem | undefined {
  if (!isOptionName(key)) {
    const known = optionNames.map((name) => `\`${name}\``).join(', ')
    return {severity: 'error', ruleId: 'unknown-option', reason: `Unknown option \`${key}\`: the options are ${known}.`, target: 'key'}
  }
  const result = optionSchema[key].parse(value)
  if (!result.ok) {
    const reason =
      value === null
        ? `Option \`${key}\` needs a value: ${result.expected}.`
        : `Option \`${key}\` must be ${result.expected}, not ${value === '' ? 'empty' : `\`${value}\``}.`
    return {severity: 'error', ruleId: 'bad-option-value', reason, target: value === null ? 'key' : 'value'}
  }
  ;(options as Record<string, unknown>)[key] = result.value
  return undefined
}

/**
 * Read options from a fence meta string: whitespace-separated `key` or `key=value` pairs, where a value
 * is a run of characters other than whitespace, quotes and `=`, or a double-quoted text with the
 * label escapes `\"` and `\\`. Ranges are relative to the meta string, all on line 1.
 */
export function parseMetaOptions(meta: string): {options: Partial<DiagramOptions>; diagnostics: Diagnostic[]} {
  const options: Partial<DiagramOptions> = {}
  const diagnostics: Diagnostic[] = []
  const seen = new Set<string>()
  const range = (from: number, to: number): SourceRange => ({
    start: {line: 1, column: from + 1, offset: from},
    end: {line: 1, column: to + 1, offset: to}
  })
  const error = (ruleId: string, reason: string, from: number, to: number): void => {
    diagnostics.push({severity: 'error', ruleId, reason, range: range(from, to)})
  }
  const isSpace = (at: number): boolean => /\s/.test(meta[at] ?? '')
  const keyPattern = /[\p{L}\p{N}_](?:[\p{L}\p{M}\p{N}_.]|-)*/uy
  const barePattern = /[^\s"'=]+/y

  let at = 0
  while (at < meta.length) {
    if (isSpace(at)) {
      at++
      continue
    }
    keyPattern.lastIndex = at
    const keyMatch = keyPattern.exec(meta)
    if (!keyMatch) {
      const width = codePointWidth(meta, at)
      error('unexpected-character', `Unexpected character ${showCharacter(meta.slice(at, at + width))}: options are written \`key=value\`.`, at, at + width)
      at = skipWord(meta, at)
      continue
    }
    const key = keyMatch[0]
    const keyFrom = at
    at += key.length
    let value: string | null = null
    let valueFrom = at
    if (meta[at] === '=') {
      at++
      valueFrom = at
      if (meta[at] === '"') {
        const quoted = readQuoted(meta, at)
        if (!quoted.ok) {
          error(quoted.ruleId, quoted.reason, quoted.from, quoted.to)
          at = quoted.resume
          continue
        }
        value = quoted.value
        at = quoted.end
      } else if (meta[at] === "'") {
        error('unexpected-character', 'Unexpected character `\'` (U+0027): quote an option value with double quotes.', at, at + 1)
        at = skipWord(meta, at)
        continue
      } else {
        barePattern.lastIndex = at
        const bare = barePattern.exec(meta)
        value = bare ? bare[0] : ''
        at += value.length
      }
      if (at < meta.length && !isSpace(at)) {
        const width = codePointWidth(meta, at)
        error('unexpected-character', `Unexpected character ${showCharacter(meta.slice(at, at + width))} after the value of \`${key}\`: separate options with spaces.`, at, at + width)
        at = skipWord(meta, at)
        continue
      }
    } else if (at < meta.length && !isSpace(at)) {
      const width = codePointWidth(meta, at)
      error('unexpected-character', `Unexpected character ${showCharacter(meta.slice(at, at + width))} after \`${key}\`: options are written \`key=value\`.`, at, at + width)
      at = skipWord(meta, at)
      continue
    }
    if (seen.has(key)) {
      error('duplicate-option', `Option \`${key}\` is given twice; give it once.`, keyFrom, keyFrom + key.length)
      continue
    }
    seen.add(key)
    const problem = applyOption(options, key, value)
    if (problem) {
      const {target, ...diagnostic} = problem
      diagnostics.push({...diagnostic, range: target === 'key' ? range(keyFrom, keyFrom + key.length) : range(valueFrom, at)})
    }
  }
  return {options, diagnostics}
}

/**
 * Read options from directive attributes (`:::upright{flow=down title="…"}`). A key without a value
 * arrives as `''` or `null` from remark-directive. Diagnostics carry no range: the caller points them at
 * the directive.
 */
export function parseAttributeOptions(
  attributes: Readonly<Record<string, string | null | undefined>>
): {options: Partial<DiagramOptions>; diagnostics: Array<Omit<Diagnostic, 'range'>>} {
  const options: Partial<DiagramOptions> = {}
  const diagnostics: Array<Omit<Diagnostic, 'range'>> = []
  for (const [key, value] of Object.entries(attributes)) {
    const problem = applyOption(options, key, value ?? null)
    if (problem) {
      const {target: _target, ...diagnostic} = problem
      diagnostics.push(diagnostic)
    }
  }
  return {options, diagnostics}
}

/** Merge option layers over the defaults; later layers win, and an `undefined` field is no opinion. */
export function resolveOptions(...layers: Array<Partial<DiagramOptions>>): DiagramOptions {
  const resolved: DiagramOptions = {...defaultDiagramOptions}
  for (const layer of layers) {
    for (const name of optionNames) {
      const value = layer[name]
      if (value !== undefined) (resolved as unknown as Record<string, unknown>)[name] = value
    }
  }
  return resolved
}

function skipWord(meta: string, from: number): number {
  let at = from
  while (at < meta.length && !/\s/.test(meta[at]!)) at++
  return at
}

type Quoted =
  | {ok: true; value: string; end: number}
  | {ok: false; ruleId: string; reason: string; from: number; to: number; resume: number}

/** A double-quoted value starting at `open`, with the escapes `\"` and `\\`. */
function readQuoted(meta: string, open: number): Quoted {
  let value = ''
  let at = open + 1
  while (at < meta.length) {
    const character = meta[at]!
    if (character === '"') return {ok: true, value, end: at + 1}
    if (character === '\\') {
      const escaped = meta[at + 1]
      if (escaped === '"' || escaped === '\\') {
        value += escaped
        at += 2
        continue
      }
      if (escaped !== undefined) {
        const width = codePointWidth(meta, at + 1)
        const shown = meta.slice(at, at + 1 + width)
        return {
          ok: false,
          ruleId: 'bad-escape',
          reason: `Unknown escape \`${shown}\` in a quoted value: only \`\\"\` and \`\\\\\` are escapes, so write \`\\\\\` for a backslash.`,
          from: at,
          to: at + 1 + width,
          resume: skipQuoted(meta, at + 1 + width)
        }
      }
    }
    value += character
    at++
  }
  return {ok: false, ruleId: 'unterminated-string', reason: 'This quoted value has no closing `"`.', from: open, to: meta.length, resume: meta.length}
}

/** After a bad escape, continue past the closing quote (or to the end). */
function skipQuoted(meta: string, from: number): number {
  let at = from
  while (at < meta.length) {
    if (meta[at] === '\\') at += 2
    else if (meta[at] === '"') return at + 1
    else at++
  }
  return meta.length
}
