/** remark-upright's `limits` option reaches the check; a bad limit is refused when the plugin is set up. */
import remarkParse from 'remark-parse'
import remarkUpright from 'remark-upright'
import {unified} from 'unified'
import {describe, expect, it} from 'vitest'

const markdown = 'Intro\n\n```upright\nflour "Rye flour" -> dough -> bread\n```\n'

async function rules(limits?: Record<string, number>) {
  const processor = unified().use(remarkParse).use(remarkUpright, {onFailure: 'warn', draw: false, ...(limits ? {limits} : {})})
  const file = {value: markdown, messages: [] as Array<{ruleId: string; line: number; column: number}>}
  await processor.run(processor.parse(markdown), file as never)
  return file.messages.map((m) => `${m.line}:${m.column} ${m.ruleId}`)
}

describe('remark-upright limits option', () => {
  it('passes with the defaults and fails at the documented places with small limits', async () => {
    expect(await rules()).toEqual([])
    expect(await rules({maxVertices: 2})).toEqual(['4:31 too-many-vertices'])
    expect(await rules({maxEdges: 1})).toEqual(['4:22 too-many-edges'])
    expect(await rules({maxLabelLength: 8})).toEqual(['4:7 label-too-long'])
    expect(await rules({maxLineLength: 20})).toEqual(['4:21 line-too-long'])
    expect(await rules({maxTextBytes: 10})).toEqual(['4:11 diagram-too-large'])
  })

  it('refuses a bad limit when the pipeline is set up', () => {
    expect(() => unified().use(remarkParse).use(remarkUpright, {limits: {maxVertices: -1}}).freeze()).toThrow(/limits\.maxVertices/)
  })
})
