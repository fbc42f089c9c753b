/**
 * The diagram language: text → vertices, edges and diagnostics with exact source ranges, plus the
 * options a diagram takes from its fence meta string or directive attributes. Reference:
 * docs/language.md.
 */
import type {Diagnostic, SourceRange} from '../source-range.ts'
import type {Tone} from './tones.ts'

export interface ParsedVertex {
  /** The id as written, NFC-normalised (so precomposed and decomposed `é` name one vertex). */
  key: string
  /** Unescaped label text; `undefined` when none was given (the id is shown instead). */
  label: string | undefined
  /** The id token at the vertex's first appearance. */
  range: SourceRange
  /** The quoted label (quotes included) where it was first given. */
  labelRange?: SourceRange
  /** Its tone, `(external)` and the like; absent when none was given. */
  tone?: Tone
  /** The `(…)` token where the tone was first given. */
  toneRange?: SourceRange
  /** Its link target as written between `<` and `>`, already checked by `checkLinkTarget`. */
  href?: string
  /** The `<…>` token where the link was first given. */
  hrefRange?: SourceRange
  /** Index into `ParsedDiagram.tiers` of the tier it is listed in; absent for a vertex in no tier. */
  tier?: number
}

/** A tier: `tier services "Services": api, billing`. */
export interface ParsedTier {
  /** The name, NFC-normalised; unique within a diagram. */
  name: string
  /** The tier's own label, for a caption beside its row; absent when none was given. */
  label?: string
  labelRange?: SourceRange
  /** The name token on its tier line. */
  range: SourceRange
  /** Its vertices in the order listed (the written left-to-right order, for a tie-break). */
  vertices: number[]
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
  /** The edge's label: `a -> "reads" b`. Absent when none was given. */
  label?: string
  /** The quoted edge label where it was first given. */
  labelRange?: SourceRange
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
  /**
   * Set when parsing with `expired` and the budget ran out: where the first unread line starts.
   * Everything above holds only the lines before it, and the whole-diagram checks (an empty
   * diagram, edges against tiers) were not made.
   */
  outOfTime?: SourceRange
  /**
   * The tiers, in the order declared: tier 0 is where edges start (the bottom with `flow=up`), each
   * later tier further along the flow. Absent when the diagram declares none.
   */
  tiers?: ParsedTier[]
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
  'conflicting-edge-label',
  'unclosed-bracket',
  'unknown-tone',
  'misplaced-tone',
  'conflicting-tone',
  'unsafe-link',
  'misplaced-link',
  'conflicting-link',
  'bad-tier-line',
  'duplicate-tier',
  'vertex-in-two-tiers',
  'edge-within-tier',
  'edge-against-tiers',
  'unknown-option',
  'bad-option-value',
  'duplicate-option'
] as const

export type ParseRuleId = (typeof parseRuleIds)[number]

export {parseDiagram} from './parser.ts'
export {tones, toneDescriptions, type Tone} from './tones.ts'
export {checkLinkTarget, type LinkCheck} from './link.ts'
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
