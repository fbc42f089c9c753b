import {describe, expect, it} from 'vitest'
import {unified} from 'unified'
import remarkParse from 'remark-parse'
import remarkDirective from 'remark-directive'
import remarkRehype from 'remark-rehype'
import rehypeStringify from 'rehype-stringify'
import type {Root} from 'mdast'
import remarkUpright, {type Options} from 'remark-upright'

async function toHtml(markdown: string, options: Options = {}) {
  const file = await unified()
    .use(remarkParse)
    .use(remarkDirective)
    .use(remarkUpright, options)
    .use(remarkRehype)
    .use(rehypeStringify)
    .process(markdown)
  return {html: String(file), messages: file.messages}
}

const diagram = '```upright title="Layers"\nui "User interface" -> api -> store\n```\n'

describe('inlining drawings', () => {
  it('replaces a passing fence by a figure with inline SVG and a caption, without raw HTML', async () => {
    const {html, messages} = await toHtml(`Before.\n\n${diagram}\nAfter.\n`)
    expect(messages).toEqual([])
    expect(html).toMatch(/^<p>Before\.<\/p>\n<figure class="upright" data-flow="up"><svg [^>]*role="img"/)
    expect(html).toContain('<figcaption>Layers</figcaption></figure>\n<p>After.</p>')
    expect(html).toContain('>User interface</text>')
    expect(html).not.toContain('<code')
  })

  it('draws directives too, with their flow', async () => {
    const {html} = await toHtml(':::upright{flow=right}\na -> b\n:::\n')
    expect(html).toMatch(/^<figure class="upright" data-flow="right"><svg /)
  })

  it('gives two copies of one diagram on a page different ids', async () => {
    const {html} = await toHtml(`${diagram}\n${diagram}`)
    const ids = [...html.matchAll(/<svg [^>]*\bid="([^"]+)"/g)].map((m) => m[1])
    expect(ids).toHaveLength(2)
    expect(new Set(ids).size).toBe(2)
    const allIds = [...html.matchAll(/\bid="([^"]+)"/g)].map((m) => m[1])
    expect(new Set(allIds).size).toBe(allIds.length)
  })

  it('emits an html node when asked', async () => {
    const processor = unified().use(remarkParse).use(remarkUpright, {output: 'html'})
    const tree = (await processor.run(processor.parse(diagram))) as Root
    expect(tree.children.map((c) => c.type)).toEqual(['html'])
    expect((tree.children[0] as {value: string}).value).toMatch(/^<figure class="upright" data-flow="up"><svg /)
  })

  it('is deterministic: the same document gives byte-identical HTML', async () => {
    const a = await toHtml(diagram)
    const b = await toHtml(diagram)
    expect(a.html).toBe(b.html)
  })

  it('leaves every other node untouched and draws a failing block as a marked fallback in warn mode', async () => {
    const md = `# Title\n\n${diagram}\n\`\`\`upright\nx -> y -> x\n\`\`\`\n\n- a list\n`
    const processor = unified().use(remarkParse).use(remarkUpright, {onFailure: 'warn'})
    const before = processor.parse(md)
    const tree = (await processor.run(structuredClone(before))) as Root
    expect(tree.children.map((c) => c.type)).toEqual(['heading', 'uprightFigure', 'uprightFigure', 'list'])
    expect(tree.children[0]).toEqual(before.children[0])
    expect(JSON.stringify(tree.children[2])).toContain('upright-fallback')
    expect(tree.children[3]).toEqual(before.children[3])
  })

  it('only checks when draw is false', async () => {
    const processor = unified().use(remarkParse).use(remarkUpright, {draw: false})
    const tree = (await processor.run(processor.parse(diagram))) as Root
    expect(tree.children.map((c) => c.type)).toEqual(['code'])
  })
})

describe('tones and links in the drawing', () => {
  it('links boxes to their pages and marks tones in class and words', async () => {
    const md = '```upright\nweb "Web shop" (external) <https://shop.example/> -> api (new) <#api>\napi -> ledger (retiring) <../ledger.md>\n```\n'
    const {html, messages} = await toHtml(md)
    expect(messages).toEqual([])
    expect([...html.matchAll(/<a [^>]*href="([^"]+)"/g)].map((m) => m[1])).toEqual(['https://shop.example/', '#api', '../ledger.md'])
    for (const tone of ['external', 'new', 'retiring']) expect(html).toContain(`class="upright-tone-${tone}"`)
    // Never colour alone: the description says each tone in words (common practice, WCAG 1.4.1).
    expect(html).toContain('Web shop (external: run outside the team) points to api (new: being added)')
  })

  it('draws no link for a target the renderer is handed directly that is not safe', async () => {
    const {renderSvg} = await import('@upright/svg')
    const layout = {flow: 'up' as const, width: 60, height: 34, nodes: [{vertex: 0, x: 30, y: 17, width: 60, height: 34}], edges: []}
    const {svg} = renderSvg({layout, graph: {tail: [], head: []}, labels: ['x'], links: ['javascript:alert(1)']})
    expect(svg).not.toContain('<a')
    expect(svg).not.toContain('javascript')
  })
})
