/**
 * docs/language.md against the parser: every `upright` example in it parses without an error, every
 * rule example (a `text` block followed by a `> line:column–line:column reason` quote) gives exactly
 * that first message (the parser's, or for tier rules found after parsing the check's first error), and every rule id has a section of the same name. Keeps the reference from
 * drifting away from the code.
 */
import {readFileSync} from 'node:fs'
import {describe, expect, it} from 'vitest'
import {checkDiagram, parseDiagram, parseRuleIds, tierRuleIds} from '@upright/core'

const docs = readFileSync(new URL('../../../docs/language.md', import.meta.url), 'utf8')

describe('docs/language.md', () => {
  const blocks = [...docs.matchAll(/^```(upright|text)\n([\s\S]*?)^```\n(?:\n> (.*)\n)?/gm)]

  it('has diagram examples and rule examples', () => {
    expect(blocks.filter((block) => block[1] === 'upright').length).toBeGreaterThanOrEqual(5)
    expect(blocks.filter((block) => block[1] === 'text' && block[3] !== undefined).length).toBeGreaterThanOrEqual(10)
  })

  for (const [, kind, body, quoted] of blocks) {
    if (kind === 'upright') {
      it(`example parses cleanly: ${JSON.stringify(body!.split('\n')[0])}`, () => {
        const result = parseDiagram(body!)
        expect(result.diagnostics).toEqual([])
        expect(result.vertices.length).toBeGreaterThan(0)
      })
    } else if (quoted !== undefined) {
      it(`rule example gives its documented message: ${JSON.stringify(body!.split('\n')[0])}`, () => {
        // The parser's first message, or for the rules the check reports after parsing (tiers), its first error.
        const first = parseDiagram(body!).diagnostics[0] ?? checkDiagram(body!).diagnostics.find((d) => d.severity === 'error')
        expect(first).toBeDefined()
        const {start, end} = first!.range
        expect(`${start.line}:${start.column}–${end.line}:${end.column} ${first!.reason}`).toBe(quoted)
      })
    }
  }

  it('has a section for every rule id', () => {
    const headings = new Set([...docs.matchAll(/^### (\S+)$/gm)].map((match) => match[1]))
    for (const ruleId of [...parseRuleIds, ...tierRuleIds]) expect(headings.has(ruleId), ruleId).toBe(true)
  })
})
