/**
 * The plugin never crashes a build: random diagram bodies (bytes, near-valid text, hostile labels)
 * placed in Markdown (fences, blockquotes, list items, directives, CRLF files) go through
 * unified + remark-parse + remark-directive + remark-upright + remark-rehype + rehype-stringify.
 * In `warn` mode nothing throws; in `fail` mode the only thing thrown is a fatal vfile message. Every
 * message points inside the block it is about (between its opening and closing lines), and every
 * passing block becomes exactly one figure (and, in warn mode, each cycle, crossing or not-upward
 * block one marked fallback figure). fast-check, fixed seed.
 */
import fc from 'fast-check'
import rehypeStringify from 'rehype-stringify'
import remarkDirective from 'remark-directive'
import remarkParse from 'remark-parse'
import remarkRehype from 'remark-rehype'
import remarkUpright, {checkTree, parseMarkdown} from 'remark-upright'
import {unified} from 'unified'
import {describe, expect, it} from 'vitest'
import {graphArb, mutatedArb, unitsArb} from '../../packages/core/test/support/fuzz-inputs.ts'

interface Place {
  line: number
  column: number
}

const bodyArb = fc.oneof(
  graphArb.map((x) => x.text),
  mutatedArb.map((x) => x.text),
  unitsArb.map((x) => x.text)
)

/** Wrap a body in one of the ways a diagram sits in Markdown; lines of the body get the container's prefix. */
const containerArb = fc.constantFrom('fence', 'tilde', 'quote', 'list', 'directive')
const eolArb = fc.constantFrom('\n', '\r\n', '\r')

function wrap(body: string, container: string, eol: string): string | undefined {
  const lines = body.split(/\r\n|\r|\n/)
  // A body line that would close or break out of its container changes the document, not the diagram.
  if (lines.some((line) => /^\s*(```|~~~|:::)/.test(line))) return undefined
  switch (container) {
    case 'fence':
      return ['```upright', ...lines, '```'].join(eol)
    case 'tilde':
      return ['~~~upright flow=down', ...lines, '~~~'].join(eol)
    case 'quote':
      return ['> ```upright', ...lines.map((l) => `> ${l}`), '> ```'].join(eol)
    case 'list':
      return ['- item', '', '  ```upright', ...lines.map((l) => `  ${l}`), '  ```'].join(eol)
    default:
      return [':::upright{title="T"}', ...lines, ':::'].join(eol)
  }
}

describe('remark-upright on fuzzed diagrams', () => {
  it('never throws in warn mode, and every message points inside its block', async () => {
    const samples = fc.sample(fc.tuple(fc.array(fc.tuple(bodyArb, containerArb), {minLength: 1, maxLength: 3}), eolArb), {seed: 4242, numRuns: 250})
    let documents = 0
    let messages = 0
    for (const [blocks, eol] of samples) {
      const parts = blocks.map(([body, container]) => wrap(body, container, eol)).filter((x): x is string => x !== undefined)
      if (parts.length === 0) continue
      const markdown = ['# Doc', ...parts, 'The end.'].join(eol + eol) + eol
      documents++
      // Where each block is, from the same block finder the plugin uses.
      const blocksFound = checkTree(parseMarkdown(markdown), markdown, {})
      const spans = blocksFound.map((b) => [b.block.start.line, b.block.end.line] as const)
      const processor = unified()
        .use(remarkParse)
        .use(remarkDirective)
        .use(remarkUpright, {onFailure: 'warn'})
        .use(remarkRehype)
        .use(rehypeStringify)
      const file = await processor.process({value: markdown})
      const html = String(file)
      const passing = blocksFound.filter((b) => b.status === 'upward').length
      // Warn mode draws a cycle, a crossing or a not-upward diagram as a marked fallback figure.
      const fallback = blocksFound.filter((b) => ['cycle', 'nonplanar', 'not-upward'].includes(b.status)).length
      expect((html.match(/<figure class="upright"/g) ?? []).length, JSON.stringify(markdown)).toBe(passing)
      expect((html.match(/<figure class="upright upright-fallback"/g) ?? []).length, JSON.stringify(markdown)).toBe(fallback)
      for (const message of file.messages) {
        messages++
        const place = message.place as {start: Place; end: Place} | undefined
        expect(place, message.reason).toBeDefined()
        const inside = spans.some(([from, to]) => place!.start.line >= from && place!.end.line <= to)
        expect(inside, `${message.ruleId} at ${place!.start.line}:${place!.start.column} in ${JSON.stringify(markdown)}`).toBe(true)
        expect(message.fatal).toBe(false)
      }
    }
    expect(documents).toBeGreaterThan(200)
    expect(messages).toBeGreaterThan(100)
  })

  it('in fail mode throws only a fatal vfile message', async () => {
    const samples = fc.sample(bodyArb, {seed: 4343, numRuns: 120})
    let thrown = 0
    for (const body of samples) {
      const markdown = wrap(body, 'fence', '\n')
      if (markdown === undefined) continue
      const processor = unified().use(remarkParse).use(remarkUpright).use(remarkRehype).use(rehypeStringify)
      try {
        await processor.process({value: markdown})
      } catch (error) {
        thrown++
        expect((error as {fatal?: unknown}).fatal, String(error)).toBe(true)
        expect((error as {source?: unknown}).source).toBe('upright')
        expect((error as {place?: unknown}).place).toBeDefined()
      }
    }
    expect(thrown).toBeGreaterThan(20)
  })
})
