/**
 * Text width from a committed advance table (DejaVu Sans, see font-metrics.generated.ts), so that
 * boxes are sized from the font the SVG asks for first. Linear in the number of code points.
 *
 * Not a shaper: no kerning, no ligatures, no bidi reordering (reordering does not change a line's
 * width). Code points the table lacks fall into classes, checked in this order:
 *  1. invisible: controls, combining marks, zero-width and bidi format characters, variation selectors,
 *     tags, emoji skin-tone modifiers → 0;
 *  2. in the table → the font's advance;
 *  3. East Asian Wide and Fullwidth (CJK ideographs, kana, Hangul, fullwidth forms) → 1 em, the
 *     advance of such fonts by design (common practice);
 *  4. emoji and pictographic symbols → 1.25 em (colour emoji fonts draw wider than 1 em; 1.25 em is
 *     a value recalled from memory, kept on the wide side);
 *  5. anything else (other scripts) → FALLBACK_ADVANCE, the mean advance of DejaVu's ASCII letters and
 *     digits.
 * Emoji joined by U+200D (ZWJ) are counted one by one: where a platform lacks the joined glyph it
 * draws them side by side, so the box errs on the wide side rather than clipping.
 */
import {ADVANCE_RANGES, ASCENDER, DESCENDER, FALLBACK_ADVANCE, FONT_FAMILY, UNITS_PER_EM} from './font-metrics.generated.ts'

/**
 * CSS font stack for rendering: the measured font first, then faces of similar width (Bitstream Vera
 * Sans, which DejaVu Sans grew from, and Verdana; recalled, not measured here), then the generic family. Names are unquoted (valid CSS for names made of identifiers) so the stack can sit in an
 * attribute without escapes.
 */
export const FONT_STACK = `${FONT_FAMILY}, Bitstream Vera Sans, Verdana, sans-serif`

const WIDE_ADVANCE = UNITS_PER_EM
const EMOJI_ADVANCE = (UNITS_PER_EM * 5) / 4

// Direct-indexed table: one lookup per code point below TABLE_END.
const TABLE_END = ADVANCE_RANGES.reduce((end, [first, widths]) => Math.max(end, first + widths.length), 0)
const TABLE = new Int16Array(TABLE_END).fill(-1)
for (const [first, widths] of ADVANCE_RANGES) TABLE.set(widths, first)

/** Inclusive [first, last] pairs, sorted. */
type Ranges = readonly number[]

const INVISIBLE: Ranges = [
  0x0000, 0x001f, 0x007f, 0x009f, // C0 and C1 controls
  0x00ad, 0x00ad, // soft hyphen (drawn only at a line break, and we never break)
  0x0300, 0x036f, // combining diacritical marks
  0x0483, 0x0489, // combining Cyrillic
  0x0591, 0x05bd, // Hebrew points
  0x064b, 0x065f, // Arabic harakat
  0x1ab0, 0x1aff, 0x1dc0, 0x1dff, // combining extended and supplement
  0x200b, 0x200f, // zero-width space, ZWNJ, ZWJ, LRM, RLM
  0x202a, 0x202e, 0x2060, 0x206f, // bidi embeddings, word joiner, invisible operators, isolates
  0x20d0, 0x20ff, // combining marks for symbols
  0xfe00, 0xfe0f, // variation selectors
  0xfe20, 0xfe2f, // combining half marks
  0xfeff, 0xfeff, // zero-width no-break space (BOM)
  0x1f3fb, 0x1f3ff, // emoji skin-tone modifiers
  0xe0000, 0xe007f, // tags
  0xe0100, 0xe01ef // variation selectors supplement
]

// East Asian Wide (W) and Fullwidth (F) blocks, by block rather than by single code point.
const WIDE: Ranges = [
  0x1100, 0x115f, 0x2e80, 0x303e, 0x3041, 0x33ff, 0x3400, 0x4dbf, 0x4e00, 0x9fff, 0xa000, 0xa4cf,
  0xa960, 0xa97f, 0xac00, 0xd7a3, 0xf900, 0xfaff, 0xfe10, 0xfe19, 0xfe30, 0xfe6f, 0xff00, 0xff60,
  0xffe0, 0xffe6, 0x16fe0, 0x18aff, 0x1b000, 0x1b2ff, 0x20000, 0x2fffd, 0x30000, 0x3fffd
]

const EMOJI: Ranges = [
  0x2300, 0x23ff, // miscellaneous technical (watch, hourglass, media controls)
  0x2600, 0x27bf, // miscellaneous symbols, dingbats
  0x2b00, 0x2bff, // arrows and stars drawn as emoji
  0x1f000, 0x1faff // mahjong … symbols and pictographs extended-A
]

function inRanges(ranges: Ranges, cp: number): boolean {
  for (let i = 0; i < ranges.length; i += 2) {
    if (cp < ranges[i]!) return false
    if (cp <= ranges[i + 1]!) return true
  }
  return false
}

/** Advance of one code point in font units (UNITS_PER_EM per em), by the classes above. */
export function advanceUnits(codePoint: number): number {
  if (inRanges(INVISIBLE, codePoint)) return 0
  if (codePoint < TABLE_END) {
    const w = TABLE[codePoint]!
    if (w >= 0) return w
  }
  if (inRanges(WIDE, codePoint)) return WIDE_ADVANCE
  if (inRanges(EMOJI, codePoint)) return EMOJI_ADVANCE
  return FALLBACK_ADVANCE
}

export interface TextMetrics {
  /** Advance width of the text, px. */
  width: number
  /** Font ascent above the baseline (hhea), px. */
  ascent: number
  /** Font descent below the baseline (hhea), px, positive. */
  descent: number
}

/** Width, ascent and descent of one line of text set in the measured font at `fontSize` px. */
export function measureText(text: string, fontSize: number): TextMetrics {
  let units = 0
  for (const ch of text) units += advanceUnits(ch.codePointAt(0)!)
  // Sum in integer font units, scale once: exact and independent of summation order.
  return {
    width: (units * fontSize) / UNITS_PER_EM,
    ascent: (ASCENDER * fontSize) / UNITS_PER_EM,
    descent: (DESCENDER * fontSize) / UNITS_PER_EM
  }
}
