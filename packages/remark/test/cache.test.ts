/**
 * The diagram cache: a warm build gives exactly the cold build's output, a moved diagram reuses its
 * entry at its new place, `undecided` is never stored, and a damaged or foreign entry is recomputed
 * (never trusted). Disk store: atomic writes from several processes at once, and the size bound.
 */
import {mkdtempSync, readdirSync, readFileSync, statSync, utimesSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {spawn} from 'node:child_process'
import {fileURLToPath} from 'node:url'
import {describe, expect, it} from 'vitest'
import {unified} from 'unified'
import remarkParse from 'remark-parse'
import remarkDirective from 'remark-directive'
import remarkRehype from 'remark-rehype'
import rehypeStringify from 'rehype-stringify'
import {VFile} from 'vfile'
import {cacheKey, canonicalJson, createResultCache, findCacheDir, openDiskStore} from '@upright/cache'
import {checkDiagram, drawDiagram} from '@upright/core'
import {renderSvg} from '@upright/svg'
import {toHtml} from 'hast-util-to-html'
import remarkUpright, {openOutcomeCache, type Options} from 'remark-upright'
import {decodeOutcome} from '../src/lib/cache.ts'
import {svgTree} from '../src/lib/render-block.ts'

const root = fileURLToPath(new URL('../../../', import.meta.url))
const tempDir = () => mkdtempSync(path.join(tmpdir(), 'upright-cache-'))

async function build(markdown: string, options: Options) {
  const file = new VFile({value: markdown, path: 'doc.md', cwd: root})
  let error: unknown
  try {
    await unified().use(remarkParse).use(remarkDirective).use(remarkUpright, options).use(remarkRehype).use(rehypeStringify).process(file)
  } catch (e) {
    error = e
  }
  const messages = file.messages.map((m) => ({line: m.line, column: m.column, ruleId: m.ruleId, reason: m.reason, note: m.note, fatal: m.fatal}))
  return {html: String(file), messages, failed: error !== undefined}
}

const layered = '```upright title="Layers"\nui "User interface" -> api -> store\napi -> cache\n```\n'
const cycle = '```upright\nbuild -> test -> ship\nship -> build\n```\n'
/** An 8×8 grid oriented by a potential with many local extremes: upward, but not fast to prove. */
const grid = (() => {
  const lines: string[] = []
  const n = 8
  const f = (a: number, b: number) => ((a * 7 + b * 13) % 11) * 1000 + a * n + b
  const id = (a: number, b: number) => `v${a}_${b}`
  const edge = (a: number, b: number, c: number, d: number) => lines.push(f(a, b) < f(c, d) ? `${id(a, b)} -> ${id(c, d)}` : `${id(c, d)} -> ${id(a, b)}`)
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    if (i + 1 < n) edge(i, j, i + 1, j)
    if (j + 1 < n) edge(i, j, i, j + 1)
  }
  return lines.join('\n')
})()

describe('diagram cache in the plugin', () => {
  it('gives a warm build byte-identical HTML and messages, from the disk alone', async () => {
    const dir = tempDir()
    const md = `# Page\n\n${layered}\n> quoted:\n>\n> \`\`\`upright flow=right\n> a -> b -> c\n> \`\`\`\n\n${cycle}`
    const fresh = await build(md, {cache: false, onFailure: 'warn'})
    const cold = await build(md, {cache: {dir}, onFailure: 'warn'})
    const entries = listEntries(dir)
    expect(entries).toHaveLength(3)
    // A second process sees only the folder: open a new cache object on it (same folder, other bound).
    const warm = await build(md, {cache: {dir, maxBytes: 10 * 1024 * 1024}, onFailure: 'warn'})
    const stats = openOutcomeCache({dir, maxBytes: 10 * 1024 * 1024}, root)!.stats()
    expect(stats.diskHits).toBe(3)
    expect(stats.misses).toBe(0)
    for (const run of [cold, warm]) {
      expect(run.html).toBe(fresh.html)
      expect(run.messages).toEqual(fresh.messages)
    }
    expect(fresh.html).toContain('<figcaption>Layers</figcaption>')
    expect(fresh.messages.map((m) => m.ruleId)).toEqual(['cycle'])
  })

  it('reuses an entry for the same diagram elsewhere, with messages at the new place', async () => {
    const dir = tempDir()
    await build(cycle, {cache: {dir}, onFailure: 'warn'})
    const moved = `Intro.\n\n- item\n\n  ${cycle.split('\n').join('\n  ')}`
    const before = openOutcomeCache({dir}, root)!.stats().memoryHits
    const warm = await build(moved, {cache: {dir}, onFailure: 'warn'})
    expect(openOutcomeCache({dir}, root)!.stats().memoryHits).toBe(before + 1)
    const fresh = await build(moved, {cache: false, onFailure: 'warn'})
    expect(warm.messages).toEqual(fresh.messages)
    // `ship -> build` is on line 7 of the moved file, indented two columns.
    expect(warm.messages.map((m) => [m.line, m.column])).toEqual([[7, 3]])
  })

  it('draws two copies of one cached diagram with distinct ids, as renderSvg would with idPrefix', async () => {
    const dir = tempDir()
    const md = `${layered}\n${layered}`
    const cold = await build(md, {cache: {dir}})
    const warm = await build(md, {cache: {dir}})
    expect(warm.html).toBe(cold.html)
    const ids = [...warm.html.matchAll(/\bid="([^"]+)"/g)].map((m) => m[1])
    expect(new Set(ids).size).toBe(ids.length)
    // The renumbered copy is what @upright/svg itself writes for that prefix.
    const check = checkDiagram('ui "User interface" -> api -> store\napi -> cache')
    const drawn = drawDiagram(check, {flow: 'up'})
    if (!drawn.ok) throw new Error('expected a drawing')
    const input = {layout: drawn.drawing.layout, graph: check.graph!, labels: drawn.drawing.labels, ids: drawn.drawing.ids, title: 'Layers'}
    const first = renderSvg(input)
    const prefix = /^<svg[^>]*?\sid="([^"]+)"/.exec(first.svg)![1]!
    const second = renderSvg(input, {idPrefix: `${prefix}-2`})
    expect(warm.html).toContain(toHtml(first.hast))
    expect(warm.html).toContain(toHtml(second.hast))
    // And the hast rebuilt from cached text is the tree the renderer gave.
    expect(svgTree(first.svg)).toEqual(first.hast)
  })

  it('never stores undecided, and keys on the budget', async () => {
    const dir = tempDir()
    const md = '```upright\n' + grid + '\n```\n'
    const tight = await build(md, {cache: {dir}, budget: 1e-9, onFailure: 'warn'})
    expect(tight.messages.map((m) => m.ruleId)).toEqual(['undecided'])
    expect(listEntries(dir)).toHaveLength(0)
    const roomy = await build(md, {cache: {dir}, budget: 60_000})
    expect(roomy.messages).toEqual([])
    expect(listEntries(dir)).toHaveLength(1)
    // The decided entry is not served for the tight budget: it is another key.
    const again = await build(md, {cache: {dir}, budget: 1e-9, onFailure: 'warn'})
    expect(again.messages.map((m) => m.ruleId)).toEqual(['undecided'])
  })

  it('recomputes every kind of damaged entry and never serves it', async () => {
    const md = `${layered}\n${cycle}`
    const fresh = await build(md, {cache: false, onFailure: 'warn'})
    const damages: Array<[string, (text: string) => string]> = [
      ['truncated', (t) => t.slice(0, Math.floor(t.length / 2))],
      ['one character changed in the payload', (t) => t.replace(/"status":"(\w)/, (_, c: string) => `"status":"${c === 'u' ? 'x' : 'u'}`)],
      ['empty', () => ''],
      ['binary garbage', () => '\u0000\u00ff\u0013garbage'],
      ['another key in the header', (t) => t.replace(/^(upright-cache 1\n)([0-9a-f])/, (_, h: string, c: string) => h + (c === '0' ? '1' : '0'))],
      // A checksum-valid entry whose JSON is not an outcome (e.g. written by a future format).
      ['valid checksum, wrong shape', (t) => reseal(t, '{"status":"upward","diagnostics":"none"}')],
      ['valid checksum, not JSON', (t) => reseal(t, '{"status":')]
    ]
    for (const [name, damage] of damages) {
      const dir = tempDir()
      await build(md, {cache: {dir}, onFailure: 'warn'})
      const files = listEntries(dir)
      expect(files, name).toHaveLength(2)
      for (const file of files) writeFileSync(file, damage(readFileSync(file, 'utf8')))
      // A new process: a cache object that has not seen these entries in memory.
      const again = await build(md, {cache: {dir, maxBytes: 1024 * 1024 + damages.indexOf(damages.find((d) => d[0] === name)!)}, onFailure: 'warn'})
      expect(again.html, name).toBe(fresh.html)
      expect(again.messages, name).toEqual(fresh.messages)
      // Rewritten whole.
      for (const file of listEntries(dir)) expect(decodeOutcome(JSON.parse(payloadOf(readFileSync(file, 'utf8')))), name).toBeDefined()
    }
  })
})

describe('cache keys', () => {
  it('do not depend on key order, and change with every input', () => {
    expect(canonicalJson({b: 1, a: {d: [1, undefined], c: undefined}})).toBe('{"a":{"d":[1,null]},"b":1}')
    expect(cacheKey({a: 1, b: 2})).toBe(cacheKey({b: 2, a: 1}))
    expect(cacheKey({a: 1})).toMatch(/^[0-9a-f]{64}$/)
    expect(cacheKey({a: 1})).not.toBe(cacheKey({a: 2}))
  })

  it('hash with SHA-256 (FIPS 180-4 example "abc", recalled from memory)', async () => {
    const {sha256} = await import('../../cache/src/lib/cache-key.ts')
    expect(sha256('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
  })

  it('separate flow, title, budget and limits', async () => {
    const dir = tempDir()
    const body = '```upright\na -> b\n```\n'
    await build(body, {cache: {dir}})
    await build(body, {cache: {dir}, flow: 'right'})
    await build(body.replace('upright', 'upright title="T"'), {cache: {dir}})
    await build(body, {cache: {dir}, budget: 1234})
    await build(body, {cache: {dir}, limits: {maxVertices: 50}})
    await build(body, {cache: {dir}})
    expect(listEntries(dir)).toHaveLength(5)
  })

  it('default folder: node_modules/.cache/upright of the nearest package.json', () => {
    expect(findCacheDir(path.join(root, 'packages', 'remark', 'test'))).toBe(path.join(root, 'packages', 'remark', 'node_modules', '.cache', 'upright'))
    const bare = tempDir()
    expect(findCacheDir(bare)).toBeUndefined()
  })
})

describe('disk store', () => {
  it('keeps the folder within its bound, evicting the least recently used', () => {
    const dir = tempDir()
    const store = openDiskStore({dir, maxBytes: 20_000})
    const keys = Array.from({length: 40}, (_, i) => cacheKey({i}))
    const payload = 'x'.repeat(1000)
    keys.forEach((key, i) => {
      store.write(key, payload)
      // Explicit, increasing ages, so the test does not depend on the clock's resolution.
      const when = new Date(Date.UTC(2020, 0, 1, 0, 0, i))
      utimesSync(path.join(dir, key.slice(0, 2), `${key}.entry`), when, when)
    })
    store.prune()
    const total = listEntries(dir).reduce((sum, f) => sum + statSync(f).size, 0)
    expect(total).toBeLessThanOrEqual(20_000)
    // The newest survive, the oldest are gone.
    expect(store.read(keys[39]!)).toBe(payload)
    expect(store.read(keys[0]!)).toBeUndefined()
    const kept = keys.filter((k) => listEntries(dir).some((f) => f.includes(k)))
    expect(kept).toEqual(keys.slice(keys.length - kept.length))
  })

  it('is consistent when four processes write the same and different keys at once', async () => {
    const dir = tempDir()
    const script = path.join(tempDir(), 'writer.ts')
    writeFileSync(
      script,
      `import {openDiskStore, cacheKey} from ${JSON.stringify(path.join(root, 'packages/cache/src/index.ts'))}
const [dir, who] = process.argv.slice(2)
const store = openDiskStore({dir, maxBytes: 1e9})
for (let round = 0; round < 200; round++) {
  // Shared keys: every writer writes the same value for a key, as real writers of one content address do.
  store.write(cacheKey({shared: round % 50}), JSON.stringify({round: round % 50, body: 'y'.repeat(2000 + (round % 50))}))
  store.write(cacheKey({who, round}), JSON.stringify({who, round}))
  const back = store.read(cacheKey({shared: (round * 7) % 50}))
  if (back !== undefined && JSON.parse(back).round !== (round * 7) % 50) { console.error('wrong entry'); process.exit(3) }
}
`
    )
    const tsx = path.join(root, 'node_modules', '.bin', 'tsx')
    const codes = await Promise.all(
      ['a', 'b', 'c', 'd'].map(
        (who) =>
          new Promise<number>((resolve) => {
            const child = spawn(tsx, [script, dir, who], {stdio: ['ignore', 'ignore', 'inherit']})
            child.on('exit', (code) => resolve(code ?? -1))
          })
      )
    )
    expect(codes).toEqual([0, 0, 0, 0])
    const store = openDiskStore({dir})
    for (let k = 0; k < 50; k++) expect(JSON.parse(store.read(cacheKey({shared: k}))!).round).toBe(k)
    for (const who of ['a', 'b', 'c', 'd']) for (let round = 0; round < 200; round++) expect(store.read(cacheKey({who, round}))).toBe(JSON.stringify({who, round}))
    expect(store.stats.corrupt).toBe(0)
    // No temporary file left behind.
    expect(readdirSync(dir).flatMap((sub) => readdirSync(path.join(dir, sub))).filter((f) => f.startsWith('.tmp-'))).toEqual([])
  }, 60_000)

  it('memory layer: bounded, and a value read back from disk is decoded by the caller', () => {
    const dir = tempDir()
    const seen: unknown[] = []
    const cache = createResultCache<{n: number}>({dir, memoryChars: 30, decode: (json) => (seen.push(json), typeof (json as {n?: unknown}).n === 'number' ? (json as {n: number}) : undefined)})
    for (let n = 0; n < 10; n++) cache.set(cacheKey({n}), {n})
    expect(cache.get(cacheKey({n: 9}))).toEqual({n: 9})
    expect(cache.stats().memoryHits).toBe(1)
    expect(cache.get(cacheKey({n: 0}))).toEqual({n: 0})
    expect(cache.stats().diskHits).toBe(1)
    expect(seen).toEqual([{n: 0}])
  })
})

function listEntries(dir: string): string[] {
  let subs: string[]
  try {
    subs = readdirSync(dir)
  } catch {
    return []
  }
  return subs.flatMap((sub) => readdirSync(path.join(dir, sub)).filter((f) => f.endsWith('.entry')).map((f) => path.join(dir, sub, f)))
}

function payloadOf(text: string): string {
  return text.split('\n').slice(3).join('\n')
}

/** Replace an entry's payload and recompute its checksum, as a well-formed but foreign entry. */
function reseal(text: string, payload: string): string {
  const [magic, key] = text.split('\n')
  return `${magic}\n${key}\n${sha256Hex(payload)}\n${payload}`
}

import {createHash} from 'node:crypto'
function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex')
}
