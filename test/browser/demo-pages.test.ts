/**
 * The demo site in a real browser: every drawing is visible, every label sits inside its box, no two
 * boxes overlap on screen, and the colours follow the reader's colour scheme.
 */
import {mkdirSync, mkdtempSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {fileURLToPath, pathToFileURL} from 'node:url'
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import type {Browser} from 'playwright-core'
import {buildSite, type BuiltPage} from '../../site-demo/lib/build-site.ts'
import {launchChromium} from '../support/chromium.ts'

const root = fileURLToPath(new URL('../../', import.meta.url))
const artifacts = path.join(root, 'test/artifacts')

interface Box {
  left: number
  top: number
  right: number
  bottom: number
}

interface PageFacts {
  svgs: Array<{width: number; height: number; visible: boolean; children: number}>
  /** Per svg: screen boxes of the vertex rectangles and of the label texts. */
  boxes: Box[][]
  labels: Array<Array<Box & {text: string}>>
  fills: string[]
}

let browser: Browser
let pages: BuiltPage[] = []

beforeAll(async () => {
  const outDir = mkdtempSync(path.join(tmpdir(), 'upright-demo-'))
  const built = await buildSite({pagesDir: path.join(root, 'site-demo/pages'), outDir})
  if (!built.ok) throw new Error(`demo build failed: ${JSON.stringify(built.messages, null, 2)}`)
  pages = built.pages
  mkdirSync(artifacts, {recursive: true})
  browser = await launchChromium()
})

afterAll(async () => {
  await browser?.close()
})

async function factsOf(url: string, colorScheme: 'light' | 'dark', screenshot?: string): Promise<PageFacts> {
  const context = await browser.newContext({colorScheme, viewport: {width: 1100, height: 900}})
  const page = await context.newPage()
  // The built pages are self-contained: refuse anything that is not a local file.
  await page.route('**/*', (route) => (route.request().url().startsWith('file:') ? route.continue() : route.abort()))
  await page.goto(url)
  const facts = await page.evaluate(() => {
    const rect = (r: DOMRect) => ({left: r.left, top: r.top, right: r.right, bottom: r.bottom})
    const svgs = Array.from(document.querySelectorAll('figure.upright > svg')) as SVGSVGElement[]
    return {
      svgs: svgs.map((svg) => {
        const r = svg.getBoundingClientRect()
        const style = getComputedStyle(svg)
        return {width: r.width, height: r.height, visible: style.visibility !== 'hidden' && style.display !== 'none', children: svg.childElementCount}
      }),
      boxes: svgs.map((svg) => Array.from(svg.querySelectorAll('.upright-boxes rect, .upright-boxes path')).map((e) => rect(e.getBoundingClientRect()))),
      labels: svgs.map((svg) =>
        Array.from(svg.querySelectorAll('.upright-labels text')).map((e) => ({...rect(e.getBoundingClientRect()), text: e.textContent ?? ''}))
      ),
      fills: svgs.map((svg) => {
        const box = svg.querySelector('.upright-boxes rect, .upright-boxes path')
        return box ? getComputedStyle(box).fill : ''
      })
    }
  })
  if (screenshot) await page.screenshot({path: screenshot, fullPage: true})
  await context.close()
  return facts
}

const inside = (inner: Box, outer: Box, slack = 0.5) =>
  inner.left >= outer.left - slack && inner.right <= outer.right + slack && inner.top >= outer.top - slack && inner.bottom <= outer.bottom + slack

const overlap = (a: Box, b: Box) => a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom

describe('the demo site in Chromium', () => {
  it('shows every drawing with each label inside its box and no boxes overlapping', async () => {
    let drawings = 0
    for (const built of pages) {
      const url = pathToFileURL(built.output).href
      const facts = await factsOf(url, 'light', path.join(artifacts, `${built.name}.png`))
      expect(facts.svgs.length, built.name).toBe(built.diagrams)
      drawings += facts.svgs.length
      facts.svgs.forEach((svg, i) => {
        expect(svg.visible, `${built.name} svg ${i}`).toBe(true)
        expect(svg.width).toBeGreaterThan(20)
        expect(svg.height).toBeGreaterThan(20)
        const boxes = facts.boxes[i]!
        const labels = facts.labels[i]!
        expect(boxes.length).toBeGreaterThan(0)
        // One text element per vertex box (multi-line labels are one text with tspans).
        expect(labels.length, `${built.name} svg ${i}`).toBe(boxes.length)
        for (const label of labels) {
          const holders = boxes.filter((b) => inside(label, b))
          expect(holders.length, `${built.name} svg ${i}: label "${label.text}" inside exactly one box`).toBe(1)
        }
        for (let a = 0; a < boxes.length; a++) {
          for (let b = a + 1; b < boxes.length; b++) {
            expect(overlap(boxes[a]!, boxes[b]!), `${built.name} svg ${i}: boxes ${a} and ${b} overlap`).toBe(false)
          }
        }
      })
    }
    expect(drawings).toBeGreaterThanOrEqual(15)
  })

  it('changes colours in dark mode', async () => {
    const first = pages.find((p) => p.diagrams > 0)!
    const url = pathToFileURL(first.output).href
    const light = await factsOf(url, 'light')
    const dark = await factsOf(url, 'dark', path.join(artifacts, `${first.name}-dark.png`))
    expect(light.fills.length).toBeGreaterThan(0)
    light.fills.forEach((fill, i) => expect(dark.fills[i], `svg ${i}`).not.toBe(fill))
  })
})
