/**
 * In a real browser: Chromium (Debian's build, driven by playwright-core) draws the SVG with DejaVu
 * Sans loaded from the npm font file, and its own text shaping decides how wide each label is. That
 * width must match measureText (kerning aside) and every label must sit inside its box. Chromium is
 * an outside reference: it shares no code with the width table.
 */
import {existsSync, mkdtempSync, rmSync, writeFileSync} from 'node:fs'
import {createRequire} from 'node:module'
import {tmpdir} from 'node:os'
import {dirname, join} from 'node:path'
import {pathToFileURL} from 'node:url'
import {chromium, type Browser} from 'playwright-core'
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import {measureText} from '@upright/core'
import {DARK_PALETTE, LIGHT_PALETTE, renderSvg} from '@upright/svg'
import {handLayout, islandRoutes} from './support.ts'

const executable = ['/usr/bin/chromium', '/usr/bin/chromium-browser'].find((p) => existsSync(p))
const require = createRequire(import.meta.url)
const fontFile = join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf', 'DejaVuSans.ttf')

const labels = [
  'Supply depot',
  'Ærøskøbing ferry — “north” quay',
  'Ωμέγα λόγος',
  'Съезд и выезд',
  'Two lines:\nharbour & pier',
  'AVATAR Type LT',
  'Quartermaster’s office'
]

describe.skipIf(!executable && !process.env['CI'])('in Chromium with DejaVu Sans', () => {
  let browser: Browser
  let dir: string

  beforeAll(async () => {
    if (!executable) throw new Error('Chromium is not installed (CI installs it from Debian in .ci/run)')
    browser = await chromium.launch({executablePath: executable, args: ['--no-sandbox']})
    dir = mkdtempSync(join(tmpdir(), 'upright-svg-'))
  })

  afterAll(async () => {
    await browser?.close()
    if (dir) rmSync(dir, {recursive: true, force: true})
  })

  it('draws each label as wide as measured and inside its box', async () => {
    const ids = labels.map((_, i) => `v${i}`)
    const edges: Array<[number, number]> = labels.slice(1).map((_, i) => [i, i + 1])
    const h = handLayout(ids, labels, edges, labels.map((_, i) => i), labels.map(() => 0))
    const {svg} = renderSvg(h)
    const page = join(dir, 'page.html')
    writeFileSync(
      page,
      `<!doctype html><html><head><style>@font-face{font-family:"DejaVu Sans";src:url("${pathToFileURL(fontFile).href}")}</style></head>` +
        `<body style="margin:0">${svg}</body></html>`
    )
    const tab = await browser.newPage()
    await tab.goto(pathToFileURL(page).href)
    await tab.evaluate(async () => {
      await document.fonts.load('14px "DejaVu Sans"')
      await document.fonts.ready
    })
    const seen = await tab.evaluate(() => {
      const svgEl = document.querySelector('svg')!
      const rects = Array.from(svgEl.querySelectorAll('.upright-boxes rect')).map((r) => {
        const b = (r as SVGGraphicsElement).getBBox()
        return {x: b.x, y: b.y, width: b.width, height: b.height}
      })
      const lines = Array.from(svgEl.querySelectorAll('.upright-labels text')).flatMap((t) => {
        const spans = t.querySelectorAll('tspan')
        const parts = spans.length ? Array.from(spans) : [t]
        return parts.map((p) => {
          const box = (p as SVGGraphicsElement).getBBox()
          return {text: p.textContent ?? '', width: (p as SVGTextContentElement).getComputedTextLength(), box: {x: box.x, y: box.y, width: box.width, height: box.height}}
        })
      })
      return {rects, lines, fontOk: document.fonts.check('14px "DejaVu Sans"')}
    })
    await tab.close()

    expect(seen.fontOk).toBe(true)
    expect(seen.lines.map((l) => l.text)).toEqual(labels.flatMap((l) => l.split('\n')))
    for (const line of seen.lines) {
      const measured = measureText(line.text, 14).width
      // Never wider than measured (half a pixel for the browser's 1/64 px rounding); kerning, which the
      // table ignores, may make it narrower ("Tw" pulls in by 0.16 em; "AVATAR Type LT", a worst case
      // made of kerning pairs, by 7%), so allow 10% below.
      expect(line.width, line.text).toBeLessThanOrEqual(measured + 0.5)
      expect(line.width, line.text).toBeGreaterThanOrEqual(0.9 * measured)
      const inside = seen.rects.some(
        (r) => line.box.x >= r.x && line.box.x + line.box.width <= r.x + r.width && line.box.y >= r.y && line.box.y + line.box.height <= r.y + r.height
      )
      expect(inside, `${line.text} inside its box`).toBe(true)
    }
  }, 60_000)

  it('switches palette with the colour scheme, yields to site properties, and prints black on white', async () => {
    const {svg} = renderSvg(islandRoutes())
    const hex = (rgb: string): string =>
      '#' + rgb.match(/\d+/g)!.slice(0, 3).map((n) => Number(n).toString(16).padStart(2, '0')).join('')
    const paints = async (scheme: 'light' | 'dark', media: 'screen' | 'print', siteCss: string) => {
      const tab = await browser.newPage({colorScheme: scheme})
      await tab.setContent(`<!doctype html><html><head><style>${siteCss}</style></head><body>${svg}</body></html>`)
      await tab.emulateMedia({media, colorScheme: scheme})
      const out = await tab.evaluate(() => {
        const style = (sel: string) => getComputedStyle(document.querySelector(sel)!)
        return {
          box: style('.upright-boxes rect').fill,
          stroke: style('.upright-boxes rect').stroke,
          text: style('.upright-labels text').fill,
          line: style('path.upright-lines').stroke,
          arrow: style('path.upright-arrows').fill,
          card: style('.upright-background').fill
        }
      })
      await tab.close()
      return Object.fromEntries(Object.entries(out).map(([k, v]) => [k, hex(v)]))
    }
    expect(await paints('light', 'screen', '')).toEqual({
      box: LIGHT_PALETTE.nodeFill, stroke: LIGHT_PALETTE.nodeStroke, text: LIGHT_PALETTE.nodeText,
      line: LIGHT_PALETTE.edgeStroke, arrow: LIGHT_PALETTE.arrowFill, card: LIGHT_PALETTE.background
    })
    expect(await paints('dark', 'screen', '')).toEqual({
      box: DARK_PALETTE.nodeFill, stroke: DARK_PALETTE.nodeStroke, text: DARK_PALETTE.nodeText,
      line: DARK_PALETTE.edgeStroke, arrow: DARK_PALETTE.arrowFill, card: DARK_PALETTE.background
    })
    const site = ':root{--upright-node-fill:#ffeedd;--upright-edge-stroke:#112233}'
    const custom = await paints('dark', 'screen', site)
    expect(custom['box']).toBe('#ffeedd')
    expect(custom['line']).toBe('#112233')
    expect(custom['arrow']).toBe('#112233') // arrows follow the edge colour unless set apart
    // The measured font stays on the labels whatever generic rules the site has.
    const fontTab = await browser.newPage()
    await fontTab.setContent(`<style>svg text{font-size:30px;font-family:serif}</style>${svg}`)
    expect(await fontTab.evaluate(() => {
      const cs = getComputedStyle(document.querySelector('.upright-labels text')!)
      return [cs.fontSize, cs.fontFamily]
    })).toEqual(['14px', '"DejaVu Sans", "Bitstream Vera Sans", Verdana, sans-serif'])
    await fontTab.close()
    // Sizing yields to any site rule; paints yield to the custom properties only.
    const tab = await browser.newPage()
    await tab.setContent(`<style>.upright{max-width:none}</style><div style="width:100px">${svg}</div>`)
    expect(await tab.evaluate(() => getComputedStyle(document.querySelector('svg')!).maxWidth)).toBe('none')
    await tab.setContent(`<div style="width:100px">${svg}</div>`)
    expect(await tab.evaluate(() => document.querySelector('svg')!.getBoundingClientRect().width)).toBe(100)
    await tab.close()
    expect(await paints('dark', 'print', site)).toEqual({
      box: '#ffffff', stroke: '#000000', text: '#000000', line: '#000000', arrow: '#000000', card: '#ffffff'
    })
  }, 60_000)
})
