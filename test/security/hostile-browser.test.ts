/**
 * Hostile labels, titles and ids are inert in a real browser. The page is built from the vectors of
 * the OWASP XSS Filter Evasion Cheat Sheet (fixtures/hostile/xss-vectors.json, see its README) through
 * the site pipeline, once with drawings as hast (the default) and once as raw HTML strings passed
 * through with allowDangerousHtml, then opened in Chromium. Checked: no dialog, no page error, no
 * console error, no request that is not a file: or data: URL, no <script>, no element outside the
 * short list our pages use, no `on*` attribute, no javascript:/vbscript:/data: in any attribute; and
 * each vector arrives as text, once per diagram title.
 */
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {pathToFileURL} from 'node:url'
import type {Browser} from 'playwright-core'
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import {launchChromium} from '../support/chromium.ts'
import {buildHostilePage, corpus} from './hostile-pages.ts'

/** Every element a built page may hold: the page shell, Markdown's output, and our SVG. */
const allowedElements = new Set([
  'html', 'head', 'meta', 'title', 'body', 'h1', 'p', 'pre', 'code', 'figure', 'figcaption',
  'svg', 'desc', 'style', 'rect', 'path', 'g', 'text', 'tspan',
  // Vertex links, once drawings carry them: every href is checked below.
  'a'
])

interface DomFacts {
  elements: string[]
  onAttributes: string[]
  badUrls: string[]
  scripts: number
  svgs: number
  titles: string[]
  captions: string[]
}

let browser: Browser
const dir = mkdtempSync(path.join(tmpdir(), 'upright-hostile-'))

beforeAll(async () => {
  // Fails (never skips) with a clear message when Chromium is missing: see test/support/chromium.ts.
  browser = await launchChromium()
})

afterAll(async () => {
  await browser?.close()
})

const collapse = (s: string): string => s.replace(/\s+/g, ' ').trim()

interface Observed extends DomFacts {
  dialogs: string[]
  errors: string[]
  requests: string[]
}

/** Open one HTML page in a fresh context and record everything that could mean script or network. */
async function inspect(html: string, name: string): Promise<Observed> {
  const file = path.join(dir, `${name}.html`)
  writeFileSync(file, html)
  const context = await browser.newContext({viewport: {width: 1200, height: 900}})
  const page = await context.newPage()
  const dialogs: string[] = []
  const errors: string[] = []
  const requests: string[] = []
  page.on('dialog', (dialog) => {
    dialogs.push(`${dialog.type()}: ${dialog.message()}`)
    void dialog.dismiss()
  })
  page.on('pageerror', (error) => errors.push(`pageerror: ${error.message}`))
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(`console: ${message.text()}`)
  })
  await page.route('**/*', (route) => {
    const url = route.request().url()
    if (url.startsWith('file:') || url.startsWith('data:')) return route.continue()
    requests.push(url)
    return route.abort()
  })
  await page.goto(pathToFileURL(file).href, {waitUntil: 'load'})
  // Sweep the pointer over the page (mouseover vectors) and give timers a moment.
  for (let y = 0; y < 900; y += 120) for (let x = 0; x < 1200; x += 200) await page.mouse.move(x, y, {steps: 2})
  await page.waitForTimeout(300)
  const facts: DomFacts = await page.evaluate(() => {
    const all = Array.from(document.querySelectorAll('*'))
    const onAttributes: string[] = []
    const badUrls: string[] = []
    for (const element of all) {
      for (const attribute of Array.from(element.attributes)) {
        if (/^on/i.test(attribute.name)) onAttributes.push(`${element.localName} ${attribute.name}`)
        // Control characters and spaces are ignored by URL parsers, so strip them before looking.
        const squeezed = attribute.value.replace(/[\u0000-\u0020\u007f-\u009f]/g, '')
        if (/^(?:(?:java|vb|live)script|data):/i.test(squeezed)) badUrls.push(`${element.localName} ${attribute.name}=${attribute.value}`)
        // Anything used as a URL must resolve to a web page or, relative to this file, a file.
        if (/^(?:href|xlink:href|src|action|formaction|data|poster)$/i.test(attribute.name)) {
          let protocol = 'unparsable'
          try {
            protocol = new URL(attribute.value, document.baseURI).protocol
          } catch {
            // keep 'unparsable'
          }
          const relative = !/^[a-z][a-z0-9+.-]*:/i.test(squeezed) && !squeezed.startsWith('//') && !squeezed.includes('\\')
          const ok = protocol === 'http:' || protocol === 'https:' || (protocol === 'file:' && relative)
          if (!ok) badUrls.push(`${element.localName} ${attribute.name}=${attribute.value} (${protocol})`)
        }
      }
    }
    return {
      elements: [...new Set(all.map((e) => e.localName))],
      onAttributes,
      badUrls,
      scripts: document.scripts.length,
      svgs: document.querySelectorAll('figure.upright > svg').length,
      titles: Array.from(document.querySelectorAll('figure.upright > svg > title')).map((t) => t.textContent ?? ''),
      captions: Array.from(document.querySelectorAll('figure.upright > figcaption')).map((t) => t.textContent ?? '')
    }
  })
  await context.close()
  return {...facts, dialogs, errors, requests}
}

describe('the inspection', () => {
  it('sees a dialog, a request, a script, an on* attribute and a javascript: URL when they are there', async () => {
    const seen = await inspect(
      '<!doctype html><html><head><meta charset="utf-8"><title>control</title></head><body>' +
        '<img src="x.png" onerror="alert(1)"><script>fetch("http://xss.example/")</script>' +
        '<a href="javascript:void 0">x</a><a href="//xss.example/">y</a><a href="ok.html#z">z</a></body></html>',
      'control'
    )
    expect(seen.dialogs).toEqual(['alert: 1'])
    expect(seen.requests).toEqual(['http://xss.example/'])
    expect(seen.scripts).toBe(1)
    expect(seen.onAttributes).toEqual(['img onerror'])
    expect(seen.badUrls).toEqual(['a href=javascript:void 0', 'a href=javascript:void 0 (javascript:)', 'a href=//xss.example/ (file:)'])
    expect(seen.elements.filter((name) => !allowedElements.has(name)).sort()).toEqual(['img', 'script'])
  })
})

for (const output of ['hast', 'html'] as const) {
  it(`the hostile corpus with drawings as ${output} is built and inert in Chromium`, async () => {
    const built = await buildHostilePage(output)
    expect(corpus.vectors.length).toBeGreaterThanOrEqual(90)
    // Every vector diagram is drawn (plus the diagram of ids), and the cycle as warn mode's marked
    // fallback drawing; every diagram whose link is refused stays in the page as code. Links with a
    // script or data scheme (after removing what URL parsers ignore) must be among the refused.
    const refused = built.messages.filter((m) => m.endsWith(' unsafe-link')).length
    expect(built.messages.filter((m) => !m.endsWith(' unsafe-link'))).toEqual([expect.stringMatching(/ cycle$/)])
    const scripted = corpus.links.filter((l) => /^(?:(?:java|vb|live)script|data):/i.test(l.replace(/[\u0000-\u0020\u007f-\u009f]/g, '')))
    expect(scripted.length).toBeGreaterThanOrEqual(8)
    expect(refused).toBeGreaterThanOrEqual(scripted.length)
    const linksDrawn = corpus.links.length - refused
    expect(built.drawn).toBe(corpus.vectors.length + 1 + linksDrawn + 1)

    const seen = await inspect(built.html, `hostile-${output}`)
    expect(seen.dialogs).toEqual([])
    expect(seen.errors).toEqual([])
    expect(seen.requests).toEqual([])
    expect(seen.scripts).toBe(0)
    expect(seen.onAttributes).toEqual([])
    expect(seen.badUrls).toEqual([])
    expect(seen.elements.filter((name) => !allowedElements.has(name))).toEqual([])
    expect(seen.svgs).toBe(built.drawn)
    // Each vector arrives as text: as the title of its drawing and as its caption. (Vectors with a
    // NUL are left out of the comparison: HTML parsers drop or replace that character.)
    const titles = seen.titles.map(collapse)
    const captions = seen.captions.map(collapse)
    for (const vector of corpus.vectors.filter((v) => !v.includes('\u0000')).map(collapse)) {
      expect(titles, vector).toContain(vector)
      expect(captions, vector).toContain(vector)
    }
  })
}
