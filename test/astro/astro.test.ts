/**
 * The demo pages built by a real static-site builder that takes remark plugins (Astro 5.18), with
 * remark-directive and remark-upright added to `markdown.remarkPlugins` and nothing else: the plugin
 * must work there unchanged. The site lives in test/astro (its pages are links to site-demo/pages).
 *
 * Astro writes an intermediate server build under the working directory when the output folder is
 * outside it, so each build goes to a fresh folder under test/astro/dist (git-ignored), removed after.
 */
import {existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import {demoGraphs} from '../demo/demo-graphs.ts'

const here = path.dirname(fileURLToPath(import.meta.url))
const repo = path.resolve(here, '../..')
const pagesDir = path.join(repo, 'site-demo/pages')
const pageNames = readdirSync(pagesDir)
  .filter((f) => f.endsWith('.md'))
  .map((f) => f.slice(0, -3))
  .sort()

let build: typeof import('astro').build
let siteConfig: typeof import('./site-config.mjs').siteConfig
let runs: string

beforeAll(async () => {
  process.env['ASTRO_TELEMETRY_DISABLED'] = '1'
  // Imported here, after telemetry is switched off: the build must not try the network.
  build = (await import('astro')).build
  siteConfig = (await import('./site-config.mjs')).siteConfig
  mkdirSync(path.join(here, 'dist'), {recursive: true})
  runs = mkdtempSync(path.join(here, 'dist', 'run-'))
})

afterAll(() => {
  if (runs) rmSync(runs, {recursive: true, force: true})
})

/**
 * Build the test site: with `options`, from siteConfig(options) alone; without, from the site's own
 * astro.config.mjs, as `astro build` in test/astro would.
 */
async function astroBuild(name: string, options?: {onFailure?: 'fail' | 'warn'; srcDir?: string}): Promise<{outDir: string; error: unknown}> {
  const outDir = path.join(runs, name)
  const config = options ? {...siteConfig(options), configFile: false as const} : {}
  try {
    await build({...config, root: here + path.sep, outDir, logLevel: 'silent'})
    return {outDir, error: undefined}
  } catch (error) {
    return {outDir, error}
  }
}

/** What a vfile message thrown through Astro still carries. */
interface ThrownMessage {
  source?: string
  ruleId?: string
  line?: number
  column?: number
  file?: string
  message: string
}

describe('Astro 5.18 with remark-directive and remark-upright', () => {
  it('stops the build at a broken diagram with our message, rule and position', async () => {
    // broken-src/pages/cycle.md links to fixtures/broken/cycle.md (documented there: cycle at 9:1).
    const {error} = await astroBuild('broken', {srcDir: './broken-src'})
    expect(error).toBeDefined()
    const thrown = error as ThrownMessage
    expect(thrown.source).toBe('upright')
    expect(thrown.ruleId).toBe('cycle')
    expect([thrown.line, thrown.column]).toEqual([9, 1])
    expect(thrown.file).toBe(path.join(repo, 'fixtures/broken/cycle.md'))
    expect(thrown.message).toContain('form a cycle `proposal -> lab_check -> copy -> publish -> proposal`')
  })

  it('draws a cyclic block as a marked fallback figure in warn mode, and the build goes on', async () => {
    const {outDir, error} = await astroBuild('broken-warn', {srcDir: './broken-src', onFailure: 'warn'})
    expect(error).toBeUndefined()
    const html = readFileSync(path.join(outDir, 'cycle', 'index.html'), 'utf8')
    // Warn mode (issue 7): the reversed feedback edge is dashed and a note says the drawing is not valid.
    expect(count(html, '<svg'), 'one fallback drawing').toBe(1)
    expect(html).toMatch(/<figure class="upright upright-fallback"/)
    expect(count(html, '<pre'), 'no code block left').toBe(0)
    expect(html).toContain('publish')
    expect(html).toContain('proposal')
  })

  it('writes every demo page with each diagram drawn as an inline SVG figure (astro.config.mjs)', async () => {
    const {outDir, error} = await astroBuild('demo')
    expect(error).toBeUndefined()
    const graphs = demoGraphs(pagesDir)
    for (const name of pageNames) {
      const file = path.join(outDir, name, 'index.html')
      expect(existsSync(file), `${name}/index.html`).toBe(true)
      const html = readFileSync(file, 'utf8')
      const expected = graphs.filter((g) => g.page === `${name}.md`).length
      expect(expected, name).toBeGreaterThan(0)
      expect(count(html, '<svg'), `${name}: one inline SVG per diagram`).toBe(expected)
      expect(count(html, '<figure'), `${name}: one figure per diagram`).toBe(expected)
      // Nothing was left for the highlighter: the demo pages have no other code blocks, and no
      // diagram survived as one.
      expect(html, name).not.toContain('<pre')
    }
  })
})

function count(text: string, needle: string): number {
  return text.split(needle).length - 1
}
