/**
 * Positions inside a diagram body. Lines and columns are 1-based, offsets 0-based (UTF-16 code units),
 * as in unist. The remark plugin and the CLI map these onto the Markdown file.
 */
export interface Point {
  line: number
  column: number
  offset: number
}

export interface SourceRange {
  start: Point
  end: Point
}

/** A problem in a user's diagram, in diagram-body coordinates. */
export interface Diagnostic {
  severity: 'error' | 'warning'
  /** Stable kebab-case id; the docs have a section of the same name. */
  ruleId: string
  /** One sentence a writer understands without graph theory. */
  reason: string
  /** Where to point first. */
  range: SourceRange
  /** The theory behind the reason, one or two sentences. */
  note?: string
  /** Every other place involved (each edge of a cycle, say). */
  related?: ReadonlyArray<{range: SourceRange; reason: string}>
}
