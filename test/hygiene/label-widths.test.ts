/**
 * Box widths for labels with tabs, combining characters, CJK and emoji, through the pipeline
 * (parse → check → drawDiagram): every box is the size labelBox gives for the label as written, and
 * labelBox agrees with the font read independently (DejaVu Sans from dejavu-fonts-ttf, by
 * opentype.js) where the font has the glyphs; for CJK and emoji, which it lacks, with the documented
 * classes (1 em for East Asian Wide, 1.25 em for emoji: packages/core/src/measure/measure-text.ts).
 */
import {readFileSync} from 'node:fs'
import {createRequire} from 'node:module'
import {dirname, join} from 'node:path'
import opentype from 'opentype.js'
import {describe, expect, it} from 'vitest'
import {checkDiagram, drawDiagram, labelBox} from '../../packages/core/src/index.ts'

const require = createRequire(import.meta.url)
const bytes = readFileSync(join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf', 'DejaVuSans.ttf'))
const font = opentype.parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength))
const size = 14
const padding = 12

/** Sum of the font's advances (no kerning: measureText does not kern), px. */
function fontWidth(text: string): number {
  let units = 0
  for (const ch of text) {
    const index = font.charToGlyphIndex(ch)
    if (index === 0) throw new Error(`DejaVu Sans has no glyph for ${ch}`)
    units += font.glyphs.get(index).advanceWidth ?? Number.NaN
  }
  return (units * size) / font.unitsPerEm
}

const boxWidth = (textWidth: number): number => Math.ceil(Math.max(3 * size, textWidth + 2 * padding))

describe('label box widths', () => {
  it('combining marks add no width, as in the font (the marks have zero advance in DejaVu Sans)', () => {
    expect(fontWidth('\u0301')).toBe(0)
    const decomposed = 'Cafe\u0301 Mu\u0308nchen n\u0303'
    const precomposed = decomposed.normalize('NFC')
    expect(labelBox(decomposed).lineWidths[0]).toBeCloseTo(fontWidth('Cafe Munchen n'), 6)
    expect(labelBox(decomposed).width).toBe(labelBox(precomposed).width)
    expect(labelBox(precomposed).lineWidths[0]).toBeCloseTo(fontWidth(precomposed), 6)
  })

  it('tabs and runs of spaces are drawn (and measured) as one space; a BOM inside a label is invisible', () => {
    expect(labelBox('Rye\t\tflour').lineWidths[0]).toBeCloseTo(fontWidth('Rye flour'), 6)
    expect(labelBox('\tRye   flour\t').width).toBe(boxWidth(fontWidth('Rye flour')))
    expect(labelBox('Rye\ufeffflour').lineWidths[0]).toBeCloseTo(fontWidth('Ryeflour'), 6)
  })

  it('CJK characters are 1 em and emoji 1.25 em each; a ZWJ sequence counts each emoji', () => {
    expect(labelBox('東京の店').lineWidths[0]).toBe(4 * size)
    expect(labelBox('한국어').lineWidths[0]).toBe(3 * size)
    expect(labelBox('🍞').lineWidths[0]).toBe(1.25 * size)
    expect(labelBox('👩‍🍳').lineWidths[0]).toBe(2 * 1.25 * size)
    expect(labelBox('Bake 🍞 東京').lineWidths[0]).toBeCloseTo(fontWidth('Bake  ') + 1.25 * size + 2 * size, 6)
  })

  it('the drawing uses those widths for every box', () => {
    const labels = ['Cafe\u0301', 'Rye\t\tflour', '東京の店 한국어', '🍞👩‍🍳🇫🇷', 'e\u0301\u0301\u0301', '𝒜 ⊗ ∞', 'x']
    const text = labels.map((label, i) => `v${i} "${label}"`).join('\r\n') + '\r\n' + labels.slice(1).map((_, i) => `v${i} -> v${i + 1}`).join('\r\n')
    const check = checkDiagram(text)
    expect(check.status).toBe('upward')
    const drawn = drawDiagram(check, {flow: 'up'})
    if (!drawn.ok) throw new Error('not drawn')
    const nodes = [...drawn.drawing.layout.nodes].sort((a, b) => a.vertex - b.vertex)
    expect(drawn.drawing.labels).toEqual(labels)
    nodes.forEach((node, i) => {
      const box = labelBox(labels[i]!)
      expect(node.width, labels[i]).toBe(box.width)
      expect(node.height, labels[i]).toBe(box.height)
    })
    // Wide labels are not measured as narrow Latin: the CJK box is wider than four Latin letters would be.
    expect(nodes[2]!.width).toBe(boxWidth(7 * size + fontWidth(' ')))
  })
})
