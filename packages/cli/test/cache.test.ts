/**
 * `upright check` and the cache folder: a warm run prints exactly what a cold run printed, a damaged
 * folder costs only time, `--no-cache` leaves no trace, the default folder sits under the nearest
 * package.json, and the plugin reads what the CLI wrote.
 */
import {existsSync, mkdtempSync, readdirSync, readFileSync, utimesSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {describe, expect, it} from 'vitest'
import {unified} from 'unified'
import remarkParse from 'remark-parse'
import remarkDirective from 'remark-directive'
import remarkRehype from 'remark-rehype'
import rehypeStringify from 'rehype-stringify'
import remarkUpright, {openOutcomeCache} from 'remark-upright'
import {cli} from './support/run-cli.ts'
import {writeDocsTree} from './support/docs-tree.ts'

const temp = (name: string) => mkdtempSync(path.join(tmpdir(), `upright-${name}-`))

function entries(dir: string): string[] {
  if (!existsSync(dir)) return []
  return readdirSync(dir).flatMap((sub) => readdirSync(path.join(dir, sub)).filter((f) => f.endsWith('.entry')).map((f) => path.join(dir, sub, f)))
}

describe('upright check with a cache folder', () => {
  const docs = temp('cached-docs')
  const tree = writeDocsTree(docs, {files: 12, diagrams: 24, seed: 11, maxVertices: 30, failing: 0.15})

  it('prints the same report warm as cold, and as without a cache', async () => {
    const dir = temp('cache')
    const fresh = await cli(['check', '--no-cache', '--format', 'json', '.'], docs)
    const cold = await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)
    // One entry per diagram, and one per Markdown file (its whole report).
    expect(entries(dir)).toHaveLength(tree.diagrams + tree.files.length)
    const warm = await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)
    expect(cold).toEqual(fresh)
    expect(warm).toEqual(fresh)
    const text = await cli(['check', '--no-cache', '.'], docs)
    expect(await cli(['check', '--cache-dir', dir, '.'], docs)).toEqual(text)
    expect(fresh.code).toBe(1)
  })

  it('recomputes when every entry is damaged, and rewrites them', async () => {
    const dir = temp('cache')
    const fresh = await cli(['check', '--no-cache', '--format', 'json', '.'], docs)
    await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)
    const files = entries(dir)
    files.forEach((file, i) => {
      const text = readFileSync(file, 'utf8')
      // Alternate damages: cut short, or a status changed inside an otherwise whole entry.
      const flipped = text.replace(/"status":"([a-z-]+)"/, (_, s: string) => `"status":"${s === 'cycle' ? 'upward' : 'cycle'}"`)
      expect(flipped).not.toBe(text)
      writeFileSync(file, i % 2 ? text.slice(0, text.length - 5) : flipped)
    })
    const again = await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)
    expect(again).toEqual(fresh)
    for (const file of entries(dir)) expect(readFileSync(file, 'utf8')).not.toBe('')
    expect(entries(dir)).toHaveLength(tree.diagrams + tree.files.length)
  })

  it('writes nothing with --no-cache', async () => {
    const dir = temp('cache')
    await cli(['check', '--no-cache', '--cache-dir', dir, '.'], docs)
    expect(entries(dir)).toEqual([])
  })

  it('defaults to node_modules/.cache/upright under the nearest package.json, and to none without one', async () => {
    const project = temp('project')
    writeFileSync(path.join(project, 'package.json'), '{"name": "docs-site", "private": true}\n')
    const pages = path.join(project, 'docs')
    writeDocsTree(pages, {files: 3, diagrams: 4, seed: 5, maxVertices: 12, failing: 0})
    expect((await cli(['check', '.'], pages)).code).toBe(0)
    expect(entries(path.join(project, 'node_modules', '.cache', 'upright'))).toHaveLength(4 + 3)
    // No package.json above: nothing is written anywhere in the tree (tmpdir has none above it).
    const loose = temp('loose')
    writeDocsTree(loose, {files: 2, diagrams: 2, seed: 6, maxVertices: 12, failing: 0})
    expect((await cli(['check', '.'], loose)).code).toBe(0)
    expect(readdirSync(loose).sort()).toEqual(['section-000'])
  })

  it('is shared with the plugin: a site build reads what the CLI stored and draws the same figures', async () => {
    const dir = temp('cache')
    const page = tree.files[1]!
    await cli(['check', '--cache-dir', dir, page], docs)
    const markdown = readFileSync(page, 'utf8')
    const build = async (cache: false | {dir: string; maxBytes: number}) => {
      const file = await unified().use(remarkParse).use(remarkDirective).use(remarkUpright, {cache, onFailure: 'warn'}).use(remarkRehype).use(rehypeStringify).process({value: markdown, path: page})
      return {html: String(file), messages: file.messages.map((m) => [m.line, m.column, m.ruleId, m.reason])}
    }
    // A bound of its own makes this a cache object of its own, as in another process.
    const setting = {dir, maxBytes: 49 * 1024 * 1024}
    const shared = await build(setting)
    const stats = openOutcomeCache(setting, docs)!.stats()
    expect(stats.diskHits).toBe(readFileSync(page, 'utf8').split('```upright').length - 1 + readFileSync(page, 'utf8').split(':::upright').length - 1)
    expect(shared).toEqual(await build(false))
    expect(shared.html).toContain('<svg')
  })
})

describe('the cache folder over runs', () => {
  const docs = temp('bounded-docs')
  const tree = writeDocsTree(docs, {files: 6, diagrams: 10, seed: 13, maxVertices: 20, failing: 0.2})
  // A temporary file left by a writer that died an hour and more ago: any scan of the folder removes it.
  const leftover = (dir: string) => {
    const file = path.join(dir, readdirSync(dir).find((name) => /^[0-9a-f]{2}$/.test(name))!, '.tmp-1-0-0')
    writeFileSync(file, 'half an entry')
    const old = new Date(Date.now() - 2 * 60 * 60 * 1000)
    utimesSync(file, old, old)
    return file
  }

  it('scans the folder after a run that wrote, not after one that only read', async () => {
    const dir = temp('cache')
    const cold = await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)
    const stale = leftover(dir)
    // Warm: every file a hit, nothing written, so the folder is as it was (within its bound).
    expect(await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)).toEqual(cold)
    expect(existsSync(stale)).toBe(true)
    // One file edited: its entry is written, and the end of the run scans (and tidies) the folder.
    const page = tree.files[2]!
    const text = readFileSync(page, 'utf8')
    writeFileSync(page, text + '\nOne more line of prose.\n')
    try {
      expect((await cli(['check', '--cache-dir', dir, '--format', 'json', '.'], docs)).code).toBe(cold.code)
    } finally {
      writeFileSync(page, text)
    }
    expect(existsSync(stale)).toBe(false)
  })

  it('reads a file with a byte order mark, or holding U+FFFD, as the same text without the mark', async () => {
    const dir = temp('marks')
    const body = '# Seed intake\n\n```upright\nsorting -> drying\ndrying -> sorting\n```\n'
    writeFileSync(path.join(dir, 'a-plain.md'), body)
    writeFileSync(path.join(dir, 'b-bom.md'), '\uFEFF' + body)
    writeFileSync(path.join(dir, 'c-replacement.md'), body.replace('Seed intake', 'Seed intake \uFFFD'))
    const report = JSON.parse((await cli(['check', '--no-cache', '--format', 'json', '.'], dir)).stdout) as {diagrams: Array<{file: string}>; errors?: unknown}
    expect(report.errors).toBeUndefined()
    const [plain, bom, replacement] = report.diagrams.map(({file, ...rest}) => rest)
    expect(plain).toMatchObject({line: 3, column: 1, status: 'cycle'})
    expect(bom).toEqual(plain)
    expect(replacement).toEqual(plain)
  })
})
