/**
 * Vertex tones: the three names, how they attach, and that each has words for accessible text (a tone
 * is never carried by colour alone).
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, parseDiagram, toneDescriptions, tones} from '@upright/core'

describe('tones', () => {
  it('are external, new and retiring, each with words', () => {
    expect([...tones]).toEqual(['external', 'new', 'retiring'])
    for (const tone of tones) expect(toneDescriptions[tone]).toMatch(new RegExp(`^${tone}: \\w`))
  })

  it('attach after the id and label, in any order with a link, at any mention', () => {
    const result = parseDiagram('partner (external) -> orders\norders "Orders" <orders.md> (new)\nledger(retiring)')
    expect(result.diagnostics).toEqual([])
    expect(result.vertices.map((v) => [v.key, v.tone, v.href])).toEqual([
      ['partner', 'external', undefined],
      ['orders', 'new', 'orders.md'],
      ['ledger', 'retiring', undefined]
    ])
  })

  it('do not change the check', () => {
    expect(checkDiagram('a (new) -> b (retiring)').status).toBe('upward')
  })

  it('an unknown tone lists the known ones', () => {
    const [first] = parseDiagram('mail (urgent)').diagnostics
    expect(first!.reason).toBe('Unknown tone `(urgent)`: the tones are `(external)`, `(new)`, `(retiring)`.')
  })
})
