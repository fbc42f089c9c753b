/**
 * The diagram language: text → vertices, edges and diagnostics with exact source ranges, plus the
 * options a diagram takes from its fence meta string or directive attributes. Reference:
 * docs/language.md.
 */
import type {Diagnostic, SourceRange} from '../source-range.ts'

export interface ParsedVertex {
  /** The id as written, NFC-normalised (so precomposed and decomposed `é` name one vertex). */
  key: string
  /** Unescaped label text; `undefined` when none was given (the id is shown instead). */
  label: string | undefined
  /** The id token at the vertex's first appearance. */
  range: SourceRange
  /** The quoted label (quotes included) where it was first given. */
  labelRange?: SourceRange
}

export interface ParsedEdge {
  /** Indices into `ParsedDiagram.vertices`. */
  from: number
  to: number
  /**
   * From the start of the tail's id token to the end of the head's id token. Always one contiguous
   * span on one line; in a list (`a, b -> c`) it may cover other items, so `tailRange` and `headRange`
   * pin the two ends exactly.
   */
  range: SourceRange
  /** The `->` token this edge was written with. */
  arrowRange: SourceRange
  tailRange: SourceRange
  headRange: SourceRange
}

export interface ParsedDiagram {
  /** In order of first appearance. */
  vertices: ParsedVertex[]
  /** In written order, each (tail, head) pair once; a repeat is warned about (`duplicate-edge`). */
  edges: ParsedEdge[]
  /** Errors and warnings, in source order. */
  diagnostics: Diagnostic[]
  /**
   * Set when parsing with `maxEdges` and the text writes more edges: the first edge past the cap.
   * Edges (and vertices) from that statement on are then missing.
   */
  edgeLimitReached?: SourceRange
}

/**
 * Every rule id the parser and the option readers report, each with a section of the same name in
 * docs/language.md.
 */
export const parseRuleIds = [
  'unterminated-string',
  'bad-escape',
  'unexpected-character',
  'missing-vertex',
  'empty-list-item',
  'missing-separator',
  'misplaced-label',
  'conflicting-label',
  'empty-diagram',
  'duplicate-edge',
  'unknown-option',
  'bad-option-value',
  'duplicate-option'
] as const

export type ParseRuleId = (typeof parseRuleIds)[number]

export {parseDiagram} from './parser.ts'
export type {ParseSettings} from './parser.ts'
export type {Flow, DiagramOptions, OptionSpec, OptionValue} from './options.ts'
export {
  defaultDiagramOptions,
  flows,
  optionSchema,
  optionNames,
  parseMetaOptions,
  parseAttributeOptions,
  resolveOptions
} from './options.ts'
