/**
 * Text metrics against the font itself: the test reads DejaVuSans.ttf from the npm package
 * dejavu-fonts-ttf with opentype.js (an independent reader of the same file the generator used) and
 * checks that the committed table and measureText agree with it.
 */
import {readFileSync} from 'node:fs'
import {createRequire} from 'node:module'
import {dirname, join} from 'node:path'
import opentype from 'opentype.js'
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {FONT_FAMILY, FONT_STACK, UNITS_PER_EM, advanceUnits, labelBox, labelLines, measureText} from '@upright/core'

const require = createRequire(import.meta.url)
const fontFile = join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf', 'DejaVuSans.ttf')
const bytes = readFileSync(fontFile)
const font = opentype.parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength))

/** Sum of hmtx advances as opentype.js reads them, px; null when a glyph is missing. */
function fontWidth(text: string, size: number): number | null {
  let units = 0
  for (const ch of text) {
    const index = font.charToGlyphIndex(ch)
    if (index === 0) return null
    units += font.glyphs.get(index).advanceWidth ?? Number.NaN
  }
  return (units * size) / font.unitsPerEm
}

describe('measureText against DejaVu Sans read by opentype.js', () => {
  it('is the font that the table names', () => {
    expect(FONT_FAMILY).toBe('DejaVu Sans')
    expect(UNITS_PER_EM).toBe(font.unitsPerEm)
    expect(FONT_STACK.startsWith(`${FONT_FAMILY},`)).toBe(true)
    expect(FONT_STACK.endsWith('sans-serif')).toBe(true)
  })

  it('agrees on a few strings in Latin, Greek, Cyrillic and punctuation', () => {
    const samples = [
      'Hello, world',
      'Supply depot → north gate',
      'Ärger über Ōsaka — “quoted” … 12 % & <tag>',
      'Ωμέγα λόγος',
      'Съезд и выезд',
      'ŁÓDŹ Ærøskøbing ĳ',
      '∀x ∈ S: x ≤ 3 ± 1'
    ]
    for (const s of samples) {
      const expected = fontWidth(s, 14)
      expect(expected, s).not.toBeNull()
      expect(measureText(s, 14).width, s).toBeCloseTo(expected!, 9)
    }
  })

  it('has the advance of every glyph the font has in the tabulated blocks', () => {
    const blocks = [[0x20, 0x7e], [0xa0, 0xff], [0x100, 0x17f], [0x370, 0x3ff], [0x400, 0x4ff], [0x2010, 0x2027]]
    let checked = 0
    for (const [first, last] of blocks) {
      for (let cp = first!; cp <= last!; cp++) {
        // Marks and format characters (Unicode categories M, Cf) and the soft hyphen are measured 0
        // on purpose: shaping zeroes marks' advances and format characters are not drawn.
        if (/[\p{M}\p{Cf}]/u.test(String.fromCodePoint(cp))) continue
        const w = fontWidth(String.fromCodePoint(cp), UNITS_PER_EM)
        if (w === null) continue
        expect(advanceUnits(cp), `U+${cp.toString(16)}`).toBe(w)
        checked++
      }
    }
    expect(checked).toBeGreaterThan(700)
  })

  it('reports the hhea ascent and descent', () => {
    const m = measureText('x', 2048)
    expect(m.ascent).toBe(font.ascender)
    expect(m.descent).toBe(-font.descender)
  })
})

describe('fallbacks', () => {
  it('CJK ideographs, kana, Hangul and fullwidth forms are 1 em (common practice)', () => {
    expect(measureText('中文', 10).width).toBe(20)
    expect(measureText('かな', 10).width).toBe(20)
    expect(measureText('한국', 10).width).toBe(20)
    expect(measureText('ＡＢ', 10).width).toBe(20)
  })

  it('emoji are 1.25 em; joiners, variation selectors and skin tones add nothing', () => {
    expect(measureText('😀', 16).width).toBe(20)
    expect(measureText('❤\uFE0F', 16).width).toBe(20)
    expect(measureText('👍🏽', 16).width).toBe(20)
    // ZWJ sequence counted part by part (wide side): three people, two joiners.
    expect(measureText('👩\u200D👩\u200D👧', 16).width).toBe(60)
  })

  it('combining marks take no width, so decomposed text measures like composed', () => {
    expect(measureText('e\u0301', 14).width).toBe(measureText('e', 14).width)
    expect(measureText('Cafe\u0301', 14).width).toBeCloseTo(fontWidth('Café', 14)!, 9)
  })

  it('other scripts get the mean ASCII advance, and controls nothing', () => {
    const thai = measureText('ก', UNITS_PER_EM).width
    const mean = [...'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789']
      .reduce((s, ch) => s + fontWidth(ch, UNITS_PER_EM)!, 0) / 62
    expect(thai).toBe(Math.round(mean))
    expect(measureText('\u0007', 14).width).toBe(0)
  })
})

describe('labelBox', () => {
  it('pads the widest line and rounds up to whole pixels', () => {
    const box = labelBox('Supply depot')
    const text = fontWidth('Supply depot', 14)!
    expect(box.width).toBe(Math.ceil(text + 24))
    expect(box.height).toBe(Math.ceil(1.25 * 14 + 16))
    expect(box.lines).toEqual(['Supply depot'])
  })

  it('stacks explicit line breaks of every kind', () => {
    expect(labelLines('a\nb\r\nc\rd\u2028e')).toEqual(['a', 'b', 'c', 'd', 'e'])
    const box = labelBox('North gate\nand the long causeway\nbeyond')
    expect(box.lines).toHaveLength(3)
    const widest = fontWidth('and the long causeway', 14)!
    expect(box.width).toBe(Math.ceil(widest + 24))
    expect(box.height).toBe(Math.ceil(3 * 1.25 * 14 + 16))
    // baselines one line height apart, symmetric about the centre
    expect(box.baselines[1]! - box.baselines[0]!).toBeCloseTo(17.5, 9)
    expect(box.baselines[2]! - box.baselines[1]!).toBeCloseTo(17.5, 9)
    const m = measureText('x', 14)
    expect(box.baselines[0]! - m.ascent).toBeGreaterThanOrEqual(-box.height / 2 + 8 - 1e-9)
    expect(box.baselines[2]! + m.descent).toBeLessThanOrEqual(box.height / 2 - 8 + 1e-9)
  })

  it('normalises whitespace as SVG draws it', () => {
    expect(labelLines('  a \t b  ')).toEqual(['a b'])
    expect(labelBox('a   b').lineWidths[0]).toBe(measureText('a b', 14).width)
  })

  it('keeps a minimum width and honours options', () => {
    expect(labelBox('').width).toBe(42)
    expect(labelBox('', {minWidth: 0, paddingX: 5}).width).toBe(10)
    const big = labelBox('Depot', {fontSize: 20, lineHeight: 1.5, paddingX: 4, paddingY: 2})
    expect(big.width).toBe(Math.max(60, Math.ceil(fontWidth('Depot', 20)! + 8)))
    expect(big.height).toBe(34)
    expect(() => labelBox('x', {fontSize: 0})).toThrow(RangeError)
  })

  it('always holds its widest line plus padding, one line per break (fast-check, seeded)', () => {
    const text = fc.string({unit: fc.oneof(fc.constantFrom('\n', '\r\n', ' ', '\t', 'é', '中', '😀', '\u0301'), fc.string({unit: 'binary', minLength: 1, maxLength: 1}))})
    fc.assert(
      fc.property(text, fc.integer({min: 8, max: 32}), (label, fontSize) => {
        const box = labelBox(label, {fontSize})
        const breaks = label.split(/\r\n|[\n\r\u0085\u2028\u2029]/).length
        expect(box.lines).toHaveLength(breaks)
        expect(box.lineWidths).toEqual(box.lines.map((line) => measureText(line, fontSize).width))
        expect(box.width).toBeGreaterThanOrEqual(Math.max(...box.lineWidths) + 24)
        expect(box.width).toBeGreaterThanOrEqual(3 * fontSize)
        expect(box.width).toBe(Math.ceil(box.width))
        expect(box.height).toBe(Math.ceil(breaks * 1.25 * fontSize + 16))
        for (const line of box.lines) expect(line).toBe(line.trim())
      }),
      {seed: 7, numRuns: 400}
    )
  })
})
