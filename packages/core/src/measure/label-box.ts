/**
 * The box a vertex needs for its label: lines split at explicit breaks, measured with measureText,
 * plus padding. Line placement follows the CSS inline model: each line box is `lineHeight` tall and
 * the font's ascent + descent sit centred in it (half-leading above and below).
 *
 * Line breaks: U+000A, U+000D, CR LF, U+0085, U+2028 and U+2029 each start a new line. There is no
 * automatic wrapping. A parser that offers an escape for a break (such as `\n` inside a quoted label)
 * turns it into U+000A before the label gets here.
 *
 * Whitespace: each line is normalised the way SVG draws text by default (tabs become spaces, runs of
 * spaces collapse to one, leading and trailing spaces go), so what is measured is what is drawn.
 */
import {measureText} from './measure-text.ts'

export interface LabelBoxOptions {
  /** Font size, px (SVG user units). Default 14. */
  fontSize?: number
  /** Distance between consecutive baselines, as a multiple of fontSize. Default 1.25. */
  lineHeight?: number
  /** Space between the widest line and the box's left and right sides, px. Default 12. */
  paddingX?: number
  /** Space between the text block and the box's top and bottom, px. Default 8. */
  paddingY?: number
  /** Smallest box width, px. Default 3 × fontSize (42 at 14 px), so short labels are not slivers. */
  minWidth?: number
}

export interface LabelBox {
  /** Box width, px, rounded up to a whole pixel. */
  width: number
  /** Box height, px, rounded up to a whole pixel. */
  height: number
  /** The label's lines after splitting and whitespace normalisation (at least one, maybe empty). */
  lines: string[]
  /** Advance width of each line, px. */
  lineWidths: number[]
  /** Baseline of each line relative to the box's vertical centre, px (y grows downward). */
  baselines: number[]
  /** The font size used, px. */
  fontSize: number
}

export const LABEL_DEFAULTS = {fontSize: 14, lineHeight: 1.25, paddingX: 12, paddingY: 8} as const

/** Split a label at explicit line breaks and normalise whitespace as SVG renders it. */
export function labelLines(label: string): string[] {
  return label.split(/\r\n|[\n\r\u0085\u2028\u2029]/).map((line) => line.replace(/[\t ]+/g, ' ').trim())
}

/** The size of the box for `label`, and where its lines' baselines go. */
export function labelBox(label: string, options?: Readonly<LabelBoxOptions> | null): LabelBox {
  const fontSize = options?.fontSize ?? LABEL_DEFAULTS.fontSize
  const lineHeight = (options?.lineHeight ?? LABEL_DEFAULTS.lineHeight) * fontSize
  const paddingX = options?.paddingX ?? LABEL_DEFAULTS.paddingX
  const paddingY = options?.paddingY ?? LABEL_DEFAULTS.paddingY
  const minWidth = options?.minWidth ?? 3 * fontSize
  if (!(fontSize > 0) || !(lineHeight > 0) || !(paddingX >= 0) || !(paddingY >= 0) || !(minWidth >= 0)) {
    throw new RangeError('labelBox: fontSize and lineHeight must be positive, paddings and minWidth non-negative')
  }

  const lines = labelLines(label)
  let ascent = 0
  let descent = 0
  const lineWidths = lines.map((line) => {
    const m = measureText(line, fontSize)
    ascent = m.ascent
    descent = m.descent
    return m.width
  })
  const textWidth = Math.max(...lineWidths)
  const textHeight = lines.length * lineHeight
  const halfLeading = (lineHeight - ascent - descent) / 2
  const top = -textHeight / 2
  const baselines = lines.map((_, i) => top + i * lineHeight + halfLeading + ascent)

  return {
    width: Math.ceil(Math.max(minWidth, textWidth + 2 * paddingX)),
    height: Math.ceil(textHeight + 2 * paddingY),
    lines,
    lineWidths,
    baselines,
    fontSize
  }
}
