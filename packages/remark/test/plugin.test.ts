import {readFileSync} from 'node:fs'
import {describe, expect, it} from 'vitest'
import {unified} from 'unified'
import remarkParse from 'remark-parse'
import remarkDirective from 'remark-directive'
import {VFile} from 'vfile'
import type {Root} from 'mdast'
import remarkUpright from 'remark-upright'

const fixture = (name: string) => readFileSync(new URL(`../../../fixtures/markdown/${name}`, import.meta.url), 'utf8')

async function run(markdown: string, options: Parameters<typeof remarkUpright>[0] = {}, directives = true) {
  const file = new VFile({value: markdown, path: 'doc.md'})
  const processor = unified().use(remarkParse)
  if (directives) processor.use(remarkDirective)
  processor.use(remarkUpright, options)
  const tree = processor.parse(file) as Root
  const before = structuredClone(tree)
  let error: unknown
  try {
    await processor.run(tree, file)
  } catch (e) {
    error = e
  }
  return {file, tree, before, error}
}

describe('remark-upright', () => {
  it('pins its public API', async () => {
    expect(Object.keys(await import('remark-upright')).sort()).toEqual(
      ['checkTree', 'default', 'diagramName', 'findDiagramBlocks', 'indexLines', 'messageSource', 'openOutcomeCache', 'parseMarkdown'].sort()
    )
  })

  it('fails the build on a cycle, at the closing edge inside a blockquote', async () => {
    const {file, error} = await run(fixture('cycle-in-blockquote.md'))
    expect(error).toBeDefined()
    expect(file.messages).toHaveLength(1)
    const m = file.messages[0]!
    expect(m.fatal).toBe(true)
    expect(m.ruleId).toBe('cycle')
    expect(m.source).toBe('upright')
    expect(m.url).toBe('docs/rules.md#cycle')
    expect(m.reason).toContain('build -> test -> ship -> build')
    // `> ship -> build` is line 9; the edge starts after the `> ` prefix.
    expect(m.place).toEqual({
      start: {line: 9, column: 3, offset: expect.any(Number)},
      end: {line: 9, column: 16, offset: expect.any(Number)}
    })
    expect(m.note).toContain('8:3')
  })

  it('warns instead in warn mode and draws the marked fallback in place of the block', async () => {
    const {file, tree, before, error} = await run(fixture('cycle-in-blockquote.md'), {onFailure: 'warn'})
    expect(error).toBeUndefined()
    expect(file.messages.map((m) => [m.fatal, m.ruleId])).toEqual([[false, 'cycle']])
    expect(tree).not.toEqual(before)
    const html = JSON.stringify(tree)
    expect(html).toContain('upright-fallback')
    expect(html).toContain('Not a valid hierarchy drawing')
    // With drawing off, warn mode leaves the tree as it was.
    const checkOnly = await run(fixture('cycle-in-blockquote.md'), {onFailure: 'warn', draw: false})
    expect(checkOnly.tree).toEqual(checkOnly.before)
  })

  it('reports every failing diagram of a file before failing', async () => {
    const md = '```upright\na -> a\n```\n\ntext\n\n```upright\nb -> c -> b\n```\n'
    const {file, error} = await run(md)
    expect(error).toBeDefined()
    expect(file.messages.map((m) => [m.line, m.column, m.ruleId])).toEqual([
      [2, 1, 'cycle'],
      [8, 6, 'cycle']
    ])
  })

  it('finds :::upright with and without remark-directive, at the same places', async () => {
    const md = 'Before.\n\n:::upright{flow=down}\np -> q\n\nq -> p\n:::\n\nAfter.\n'
    const withDirective = await run(md, {}, true)
    const without = await run(md, {}, false)
    for (const r of [withDirective, without]) {
      expect(r.file.messages.map((m) => [m.line, m.column, m.ruleId])).toEqual([[6, 1, 'cycle']])
    }
  })

  it('reports a bad option at its place in the fence line', async () => {
    const {file} = await run('```upright flow=sideways\na -> b\n```\n')
    expect(file.messages.map((m) => [m.line, m.column, m.ruleId])).toEqual([[1, 17, 'bad-option-value']])
  })

  it('reports a bad directive attribute', async () => {
    const {file} = await run(':::upright{colour=red}\na -> b\n:::\n')
    expect(file.messages.map((m) => [m.line, m.ruleId])).toEqual([[1, 'unknown-option']])
  })

  it('maps syntax errors inside an indented list item', async () => {
    const {file} = await run('- item\n\n  ```upright\n  a -> \n  ```\n')
    expect(file.messages.map((m) => [m.line, m.column, m.ruleId])).toEqual([[4, 5, 'missing-vertex']])
  })

  it('maps positions on CRLF files', async () => {
    const {file} = await run('# T\r\n\r\n```upright\r\nx -> y\r\ny -> x\r\n```\r\n')
    expect(file.messages.map((m) => [m.line, m.column])).toEqual([[5, 1]])
  })
})

describe('diagrams inside other directives', () => {
  it('checks a fence inside a :::note container at its file position', async () => {
    const md = ':::note\nSome text.\n\n```upright\nx -> y -> x\n```\n:::\n'
    const {file} = await run(md)
    expect(file.messages.map((m) => [m.line, m.column, m.ruleId])).toEqual([[5, 6, 'cycle']])
  })
})
