import {toHtml} from 'hast-util-to-html'
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {labelBox} from '@upright/core'
import {DARK_PALETTE, LIGHT_PALETTE, renderSvg, toHast} from '@upright/svg'
import {fnv1a64, hashText} from '../src/hash.ts'
import {elements, handLayout, islandRoutes, parseManyWithPython, parseWithPython} from './support.ts'

describe('public API', () => {
  it('exports exactly these names', async () => {
    expect(Object.keys(await import('@upright/svg')).sort()).toEqual([
      'CLASS',
      'DARK_PALETTE',
      'DECORATION_CLASS',
      'DEFAULT_EDGE_STYLE',
      'DEFAULT_PRECISION',
      'LIGHT_PALETTE',
      'renderSvg',
      'toHast'
    ])
  })
})

describe('determinism', () => {
  it('gives the same bytes and the same tree for the same input', () => {
    const a = islandRoutes()
    const b = islandRoutes()
    const first = renderSvg({...a, title: 'Island supply routes'})
    const second = renderSvg({...b, title: 'Island supply routes'})
    expect(second.svg).toBe(first.svg)
    expect(second.hast).toEqual(first.hast)
  })

  it('the tree is the string: serializing the hast gives the svg text back', () => {
    const r = renderSvg(islandRoutes())
    expect(toHtml(r.hast, {closeEmptyElements: true})).toBe(r.svg)
    expect(toHast(islandRoutes())).toEqual(r.hast)
    expect(JSON.stringify(r.hast)).not.toContain('"position"')
  })

  it('writes every number with at most `precision` decimals', () => {
    const r = renderSvg(islandRoutes(), {precision: 1})
    const numbers = r.svg.replace(/<style>.*<\/style>/s, '').match(/-?\d+\.\d+/g) ?? []
    expect(numbers.length).toBeGreaterThan(0)
    for (const n of numbers) expect(n.split('.')[1]!.length).toBeLessThanOrEqual(1)
    expect(() => renderSvg(islandRoutes(), {precision: 1.5})).toThrow(RangeError)
  })
})

describe('escaping', () => {
  it('keeps markup in labels as text', () => {
    const hostile = ['<script>alert(1)</script>', 'Say "hi" & \'bye\'', '</text><rect/>', 'x']
    const h = handLayout(['a', 'b', 'c', 'd'], hostile, [[0, 1], [1, 2], [2, 3]], [0, 1, 2, 3], [0, 0, 0, 0])
    const r = renderSvg({...h, title: '<b>title</b> & co', description: '"quoted" <i>'})
    expect(r.svg).not.toMatch(/<script|<b>|<i>|<\/text><rect/)
    const seen = parseWithPython(r.svg)
    expect(seen.texts).toEqual(hostile)
    expect(seen.title).toBe('<b>title</b> & co')
    expect(seen.desc.startsWith('"quoted" <i>. ')).toBe(true)
  })
})

describe('accessibility after svgo', () => {
  const r = renderSvg({...islandRoutes(), title: 'Island supply routes', description: 'How supplies reach the tower'})
  const seen = parseWithPython(r.svg)

  it('is a standalone SVG with role, viewBox and aria references that resolve', () => {
    expect(seen.tag).toBe('{http://www.w3.org/2000/svg}svg')
    expect(seen.attrs['role']).toBe('img')
    const {layout} = islandRoutes()
    expect(seen.attrs['viewBox']).toBe(`-12 -12 ${layout.width + 24} ${layout.height + 24}`)
    const labelledBy = seen.attrs['aria-labelledby']!
    const describedBy = seen.attrs['aria-describedby']!
    expect(seen.ids).toContain(labelledBy)
    expect(seen.ids).toContain(describedBy)
    expect(labelledBy.endsWith('-title')).toBe(true)
    expect(describedBy.endsWith('-desc')).toBe(true)
    expect(seen.title).toBe('Island supply routes')
  })

  it('describes every vertex and what it points to', () => {
    expect(seen.desc).toBe(
      'How supplies reach the tower. 4 vertices and 5 edges. Arrows point upward. ' +
        'Supply depot points to North gate, Causeway to the isle and Watchtower. ' +
        'North gate points to Watchtower. Causeway to the isle points to Watchtower. Watchtower points to nothing.'
    )
  })

  it('names vertices that share a label by their ids, and gives a default title', () => {
    const h = handLayout(['east', 'west', 'hub'], ['Dock', 'Dock', 'Hub'], [[0, 2], [1, 2]], [0, 0, 1], [0, 1, 0])
    const view = parseWithPython(renderSvg(h).svg)
    expect(view.title).toBe('Diagram of 3 vertices and 2 edges')
    expect(view.desc).toContain('Dock (east) points to Hub. Dock (west) points to Hub. Hub points to nothing.')
  })

  it('speaks the flow', () => {
    const h = islandRoutes()
    const view = parseWithPython(renderSvg({...h, layout: {...h.layout, flow: 'right'}}).svg)
    expect(view.desc).toContain('Arrows point to the right.')
  })
})

describe('ids', () => {
  it('prefixes every id and CSS rule per diagram, and two diagrams share none', () => {
    const one = renderSvg(islandRoutes())
    const h = handLayout(['a', 'b'], ['Ferry', 'Pier'], [[0, 1]], [0, 1], [0, 0])
    const two = renderSvg(h)
    const views = parseManyWithPython([one.svg, two.svg])
    for (const view of views) {
      const prefix = view.attrs['id']!
      expect(prefix).toMatch(/^upright-[0-9a-f]{12}$/)
      for (const id of view.ids) expect(id.startsWith(prefix)).toBe(true)
      const css = view.styles.join('')
      const selectors = css.replace(/@media[^{]*\{/g, '').split('}').map((r) => r.split('{')[0]!.trim()).filter(Boolean)
      expect(selectors.length).toBeGreaterThan(5)
      for (const sel of selectors) {
        for (const part of sel.split(',')) expect(part.startsWith(`#${prefix}`) || part === `:where(#${prefix})`).toBe(true)
      }
    }
    const page = [...views[0]!.ids, ...views[1]!.ids]
    expect(new Set(page).size).toBe(page.length)
  })

  it('changes the prefix with the content and accepts a given one', () => {
    const h = islandRoutes()
    const [viewA, viewB, given] = parseManyWithPython([
      renderSvg(h).svg,
      renderSvg({...h, labels: [...h.labels.slice(0, 3), 'Lighthouse']}).svg,
      renderSvg(h, {idPrefix: 'fig-3'}).svg
    ])
    const a = viewA!.attrs['id']
    const b = viewB!.attrs['id']
    expect(a).not.toBe(b)
    expect(given!.ids).toEqual(['fig-3', 'fig-3-title', 'fig-3-desc'])
    expect(() => renderSvg(h, {idPrefix: '3 bad"'})).toThrow(RangeError)
  })
})

describe('FNV-1a 64', () => {
  it('matches the published test vectors (FNV reference test suite; values recalled from memory)', () => {
    expect(hashText('')).toBe('cbf29ce484222325')
    expect(hashText('a')).toBe('af63dc4c8601ec8c')
    expect(hashText('foobar')).toBe('85944171f73967e8')
  })

  it('agrees with a BigInt implementation on random bytes', () => {
    const reference = (bytes: Uint8Array): string => {
      let h = 0xcbf29ce484222325n
      for (const b of bytes) h = ((h ^ BigInt(b)) * 0x100000001b3n) & 0xffffffffffffffffn
      return h.toString(16).padStart(16, '0')
    }
    fc.assert(fc.property(fc.uint8Array({maxLength: 200}), (bytes) => fnv1a64(bytes) === reference(bytes)), {seed: 5, numRuns: 300})
  })
})

describe('themes', () => {
  const css = (options?: Parameters<typeof renderSvg>[1]): string => {
    const style = elements(renderSvg(islandRoutes(), options).hast).find((e) => e.tagName === 'style')!
    return style.children.map((c) => (c.type === 'text' ? c.value : '')).join('')
  }

  it('carries both palettes by default, the dark one under prefers-color-scheme', () => {
    const text = css()
    const dark = text.match(/@media \(prefers-color-scheme:dark\)\{(.*?)\}\}/)
    expect(dark).not.toBeNull()
    for (const colour of Object.values(DARK_PALETTE)) expect(dark![1]).toContain(colour)
    const outside = text.replace(dark![0], '')
    for (const colour of Object.values(LIGHT_PALETTE)) expect(outside).toContain(colour)
  })

  it('lets the site override every paint through --upright-* properties, and prints dark on white', () => {
    const text = css()
    for (const prop of ['background', 'node-fill', 'node-stroke', 'node-text', 'edge-stroke', 'arrow-fill', 'node-stroke-width', 'edge-stroke-width']) {
      expect(text).toContain(`var(--upright-${prop},`)
    }
    const print = text.match(/@media print\{(.*)\}$/)
    expect(print).not.toBeNull()
    expect(print![1]).toMatch(/fill:#fff/)
    expect(print![1]).toMatch(/stroke:#000/)
  })

  it('pins a scheme and replaces colours on request, and refuses CSS that is not a colour', () => {
    expect(css({theme: {scheme: 'light'}})).not.toContain('prefers-color-scheme')
    expect(css({theme: {scheme: 'dark'}})).toContain(DARK_PALETTE.nodeFill)
    expect(css({theme: {light: {nodeFill: '#abcdef'}}})).toContain('#abcdef')
    expect(() => renderSvg(islandRoutes(), {theme: {light: {nodeFill: 'red;}body{display:none'}}})).toThrow(RangeError)
  })

  it('documents every custom property in the README with its default', async () => {
    const {readFile} = await import('node:fs/promises')
    const readme = await readFile(new URL('../README.md', import.meta.url), 'utf8')
    const used = new Set(css().match(/--upright-[a-z-]+/g))
    expect(used.size).toBe(8)
    for (const prop of used) expect(readme).toMatch(new RegExp('`' + prop + '`[^\\n]*\\|'))
  })
})

describe('labels and boxes', () => {
  it('draws one box per vertex and stacks multi-line labels one line height apart', () => {
    const h = islandRoutes()
    const r = renderSvg(h)
    const all = elements(r.hast)
    const rects = all.filter((e) => e.tagName === 'rect')
    expect(rects).toHaveLength(1 + h.labels.length) // background + boxes
    const multi = all.filter((e) => e.tagName === 'text').find((t) => t.children.length === 2)!
    const ys = multi.children.map((c) => Number((c as {properties: {y: string}}).properties.y))
    const box = labelBox('Causeway\nto the isle')
    expect(ys[1]! - ys[0]!).toBeCloseTo(box.baselines[1]! - box.baselines[0]!, 2)
    const node = h.layout.nodes[2]!
    expect(ys[0]).toBeCloseTo(node.y + box.baselines[0]!, 2)
    expect(parseWithPython(r.svg).texts).toContain('Causeway\nto the isle')
  })

  it('asks for the measured font first in its font stack', () => {
    expect(renderSvg(islandRoutes()).svg).toMatch(/font-family="DejaVu Sans, [^"]*sans-serif"/)
  })
})

describe('palette contrast (WCAG 2.x relative luminance and contrast ratio, W3C definition)', () => {
  const luminance = (hex: string): number => {
    const channel = (i: number): number => {
      const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255
      return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4
    }
    return 0.2126 * channel(0) + 0.7152 * channel(1) + 0.0722 * channel(2)
  }
  const ratio = (a: string, b: string): number => {
    const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number]
    return (hi + 0.05) / (lo + 0.05)
  }

  it('keeps text at 4.5:1 or more and strokes at 3:1 or more (SC 1.4.3, 1.4.11) in both schemes', () => {
    for (const p of [LIGHT_PALETTE, DARK_PALETTE]) {
      expect(ratio(p.nodeText, p.nodeFill)).toBeGreaterThanOrEqual(4.5)
      expect(ratio(p.nodeStroke, p.background)).toBeGreaterThanOrEqual(3)
      expect(ratio(p.edgeStroke, p.background)).toBeGreaterThanOrEqual(3)
      expect(ratio(p.arrowFill, p.background)).toBeGreaterThanOrEqual(3)
    }
  })
})
