/**
 * Positions through the plugin, in the Markdown file: CRLF and lone-CR line endings, a BOM, tabs,
 * combining characters, CJK and emoji labels. The expected place of each message is computed here
 * from the file text alone, as unist counts (lines split at CRLF, CR and LF; columns in UTF-16 code
 * units from 1; a BOM at the start of the file not counted, docs/language.md "Positions in
 * messages"), and compared with the vfile message the plugin reports.
 */
import remarkDirective from 'remark-directive'
import rehypeStringify from 'rehype-stringify'
import remarkParse from 'remark-parse'
import remarkRehype from 'remark-rehype'
import remarkUpright from 'remark-upright'
import {unified} from 'unified'
import {describe, expect, it} from 'vitest'

interface Place {
  line: number
  column: number
}

/** Line and column of a UTF-16 offset in a file, as unist counts them. */
function placeOf(text: string, offset: number): Place {
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0
  const lines = text.slice(bom, offset).split(/\r\n|\r|\n/)
  return {line: lines.length, column: lines.at(-1)!.length + 1}
}

async function messagesOf(markdown: string): Promise<Array<{ruleId?: string | undefined; place?: unknown}>> {
  const processor = unified().use(remarkParse).use(remarkDirective).use(remarkUpright, {onFailure: 'warn', draw: false}).use(remarkRehype).use(rehypeStringify)
  const file = await processor.process({value: markdown})
  return file.messages
}

const placed = (m: {place?: unknown}) => m.place as {start: Place; end: Place}

/** A Markdown file with one diagram whose second line holds one `;` (an unexpected character). */
interface Variant {
  name: string
  markdown: string
}

function variants(): Variant[] {
  const body = (eol: string, labelLine: string) => [`a -> b`, `${labelLine} ;`, `c -> d`].join(eol)
  const fence = (eol: string, labelLine: string, bom = '') =>
    `${bom}# Title${eol}${eol}Some text with ü and 東京.${eol}${eol}\`\`\`upright${eol}${body(eol, labelLine)}${eol}\`\`\`${eol}${eol}after${eol}`
  return [
    {name: 'LF', markdown: fence('\n', 'x "plain" -> y')},
    {name: 'CRLF', markdown: fence('\r\n', 'x "plain" -> y')},
    {name: 'CR', markdown: fence('\r', 'x "plain" -> y')},
    {name: 'BOM', markdown: fence('\n', 'x "plain" -> y', '\ufeff')},
    {name: 'BOM and CRLF', markdown: fence('\r\n', 'x "plain" -> y', '\ufeff')},
    {name: 'tabs', markdown: fence('\n', '\tx\t"a\tb"\t->\ty')},
    {name: 'combining', markdown: fence('\n', 'cafe\u0301 "e\u0301\u0301 n\u0303" -> y')},
    {name: 'CJK', markdown: fence('\r\n', '東京 "東京の店 한국어" -> 大阪')},
    {name: 'emoji', markdown: fence('\n', 'x "🍞👩‍🍳🇫🇷" -> y "𝒜"')},
    {name: 'blockquote, CRLF', markdown: `> intro\r\n>\r\n> \`\`\`upright\r\n> a -> b\r\n> x "🍞 東京" -> y ;\r\n> \`\`\`\r\n`},
    {name: 'list item, CR', markdown: `- item\r\r  \`\`\`upright\r  a -> b\r  x "e\u0301" -> y ;\r  \`\`\`\r`},
    {name: 'directive, CRLF', markdown: `:::upright{flow=down}\r\na -> b\r\nx "東京🍞" -> y ;\r\n:::\r\n`},
    {name: 'directive, tabs and CR', markdown: `text\r\r:::upright\r\tx\t"\t🍞"\t->\ty\t;\r:::\r`}
  ]
}

describe('message positions in the Markdown file', () => {
  for (const variant of variants()) {
    it(variant.name, async () => {
      const messages = await messagesOf(variant.markdown)
      const offset = variant.markdown.indexOf(';')
      expect(offset).toBeGreaterThan(0)
      const unexpected = messages.filter((m) => m.ruleId === 'unexpected-character')
      expect(unexpected).toHaveLength(1)
      expect(placed(unexpected[0]!).start).toMatchObject(placeOf(variant.markdown, offset))
      expect(placed(unexpected[0]!).end).toMatchObject(placeOf(variant.markdown, offset + 1))
    })
  }

  it('an edge on a cycle after emoji and CJK labels is placed from tail id to head id', async () => {
    const markdown = '\ufeffIntro 🍞\r\n\r\n```upright\r\n東京 "🍞👩‍🍳" -> 大阪 "e\u0301"\r\n大阪 -> 東京\r\n```\r\n'
    const messages = await messagesOf(markdown)
    const cycle = messages.find((m) => m.ruleId === 'cycle')!
    const start = markdown.indexOf('大阪 -> 東京')
    expect(placed(cycle).start).toMatchObject(placeOf(markdown, start))
    expect(placed(cycle).end).toMatchObject(placeOf(markdown, start + '大阪 -> 東京'.length))
  })
})
