/**
 * The demo pages built by a real static-site builder that takes remark plugins (Astro 5.18), with
 * remark-directive and remark-upright added to `markdown.remarkPlugins` and nothing else: the plugin
 * must work there unchanged. The site lives in test/astro (its pages are links to site-demo/pages).
 *
 * Astro writes an intermediate server build under the working directory when the output folder is
 * outside it, so each build goes to a fresh folder under test/astro/dist (git-ignored), removed after.
 */
import {existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {afterAll, beforeAll, describe, expect, it} from 'vitest'
import {checkDiagram} from '../../packages/core/src/index.ts'
import {demoGraphs} from '../demo/demo-graphs.ts'
import {buildSite} from '../../site-demo/lib/build-site.ts'

const here = path.dirname(fileURLToPath(import.meta.url))
const repo = path.resolve(here, '../..')
const pagesDir = path.join(repo, 'site-demo/pages')
const pageNames = readdirSync(pagesDir)
  .filter((f) => f.endsWith('.md'))
  .map((f) => f.slice(0, -3))
  .sort()

/** Whether the upward test is part of the build yet (until then every diagram is `undecided`). */
const upwardAvailable = checkDiagram('a -> b').status === 'upward'

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

async function astroBuild(name: string, options: {onFailure?: 'fail' | 'warn'; srcDir?: string}): Promise<{outDir: string; error: unknown}> {
  const outDir = path.join(runs, name)
  try {
    await build({...siteConfig(options), root: here + path.sep, outDir, configFile: false, logLevel: 'silent'})
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

  it('runs the plugin over every demo page (fail mode)', async () => {
    const {outDir, error} = await astroBuild('demo-fail', {onFailure: 'fail'})
    if (upwardAvailable) {
      expect(error).toBeUndefined()
      for (const name of pageNames) expect(existsSync(path.join(outDir, name, 'index.html')), name).toBe(true)
    } else {
      // Until the upward test lands, every demo diagram is `undecided`, which fails the build: proof
      // that Astro handed the demo's blocks to the plugin.
      expect((error as ThrownMessage).ruleId).toBe('check-unavailable')
      expect((error as ThrownMessage).source).toBe('upright')
    }
  })

  it('writes every demo page; each diagram is inlined when the plugin draws, or kept as written', async () => {
    const {outDir, error} = await astroBuild('demo-warn', {onFailure: 'warn'})
    expect(error).toBeUndefined()
    const graphs = demoGraphs(pagesDir)
    const draws = await pluginDraws()
    for (const name of pageNames) {
      const file = path.join(outDir, name, 'index.html')
      expect(existsSync(file), `${name}/index.html`).toBe(true)
      const html = readFileSync(file, 'utf8')
      const expected = graphs.filter((g) => g.page === `${name}.md`).length
      expect(expected).toBeGreaterThan(0)
      if (draws) {
        expect(count(html, '<svg'), `${name}: one inline SVG per diagram`).toBe(expected)
      } else {
        // Kept as written: Shiki renders each fence as a <pre>; directives stay as paragraphs.
        expect(html).not.toContain('<svg')
        for (const g of graphs.filter((g) => g.page === `${name}.md`)) {
          expect(html, `${name}: the text of the diagram at line ${g.line}`).toContain(g.vertices[0]!)
        }
      }
    }
  })
})

/** Whether remark-upright replaces a passing block with a drawing yet (probed with the plain build). */
async function pluginDraws(): Promise<boolean> {
  if (!upwardAvailable) return false
  const probe = path.join(runs, 'probe')
  mkdirSync(path.join(probe, 'pages'), {recursive: true})
  writeFileSync(path.join(probe, 'pages', 'probe.md'), '```upright\na -> b\n```\n')
  const result = await buildSite({pagesDir: path.join(probe, 'pages'), outDir: path.join(probe, 'out')})
  return result.ok && readFileSync(path.join(probe, 'out', 'probe.html'), 'utf8').includes('<svg')
}

function count(text: string, needle: string): number {
  return text.split(needle).length - 1
}
