/**
 * Size limits (check/limits.ts): each limit reports its rule at the exact place, the defaults are the
 * documented ones, a diagram exactly at a limit passes, and a product of two long lists cannot make
 * the parser build millions of edges.
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, defaultLimits, parseDiagram, resolveLimits} from '../src/index.ts'

const ids = (n: number, prefix = 'v'): string[] => Array.from({length: n}, (_, i) => `${prefix}${i}`)

describe('limits', () => {
  it('has the documented defaults', () => {
    expect(defaultLimits).toEqual({maxVertices: 2000, maxEdges: 6000, maxLabelLength: 200, maxLineLength: 1000, maxTextBytes: 262144})
    expect(() => resolveLimits({maxVertices: 0})).toThrow(/maxVertices/)
    expect(() => resolveLimits({maxEdges: 1.5})).toThrow(/maxEdges/)
    expect(resolveLimits({maxEdges: Infinity}).maxEdges).toBe(Infinity)
  })

  it('too-many-vertices points at the first vertex past the limit', () => {
    const text = ids(6).join('\n')
    const at = checkDiagram(text, {limits: {maxVertices: 6}})
    expect(at.status).toBe('upward')
    const over = checkDiagram(text, {limits: {maxVertices: 5}})
    expect(over.status).toBe('too-large')
    const d = over.diagnostics.find((x) => x.ruleId === 'too-many-vertices')!
    expect(d.severity).toBe('error')
    expect(d.range.start).toEqual({line: 6, column: 1, offset: text.indexOf('v5')})
    expect(d.reason).toContain('6 vertices; the limit is 5')
    expect(d.reason).toContain('`v5`')
  })

  it('too-many-edges counts edges as written and stops the parser at the limit', () => {
    // a -> b twice (a repeat counts), then c -> d: the third written edge is past a limit of 2.
    const text = 'a -> b\na -> b\nc -> d'
    const over = checkDiagram(text, {limits: {maxEdges: 2}})
    expect(over.status).toBe('too-large')
    const d = over.diagnostics.find((x) => x.ruleId === 'too-many-edges')!
    expect(d.range.start).toMatchObject({line: 3, column: 1})
    expect(d.range.end).toMatchObject({line: 3, column: 7})
    expect(checkDiagram(text, {limits: {maxEdges: 3}}).status).toBe('upward')

    // 500 × 500 product on two lines of ~2,900 characters: without a cap, 250,000 edge objects.
    const left = ids(500, 'a').join(',')
    const right = ids(500, 'b').join(',')
    const big = `${left} -> ${right}`
    const parsed = parseDiagram(big, {maxEdges: 6000})
    expect(parsed.edges.length).toBe(6000)
    expect(parsed.edgeLimitReached).toBeDefined()
    const checked = checkDiagram(big, {limits: {maxLineLength: 10_000}})
    expect(checked.status).toBe('too-large')
    expect(checked.diagnostics.map((x) => x.ruleId)).toEqual(['too-many-edges'])
  })

  it('label-too-long counts code points and points at the label', () => {
    const label = '🍞'.repeat(10) // 10 code points, 20 UTF-16 units
    const text = `a "${label}" -> b`
    expect(checkDiagram(text, {limits: {maxLabelLength: 10}}).status).toBe('upward')
    const over = checkDiagram(text, {limits: {maxLabelLength: 9}})
    expect(over.status).toBe('too-large')
    const d = over.diagnostics[0]!
    expect(d.ruleId).toBe('label-too-long')
    expect(text.slice(d.range.start.offset, d.range.end.offset)).toBe(`"${label}"`)
    expect(d.reason).toContain('10 characters long; the limit is 9')
  })

  it('line-too-long points from the first character past the limit to the line end, on every long line', () => {
    const long = 'a -> ' + 'b'.repeat(20)
    const text = `x -> y\r\n${long}\r${long}\nz`
    const over = checkDiagram(text, {limits: {maxLineLength: 10}})
    expect(over.status).toBe('too-large')
    expect(over.diagnostics.map((d) => [d.ruleId, d.range.start.line, d.range.start.column, d.range.end.column])).toEqual([
      ['line-too-long', 2, 11, 26],
      ['line-too-long', 3, 11, 26]
    ])
    for (const d of over.diagnostics) expect(text.slice(d.range.start.offset, d.range.end.offset)).toBe('b'.repeat(15))
    expect(checkDiagram(text, {limits: {maxLineLength: 25}}).status).toBe('upward')
  })

  it('a BOM does not count in line length or columns', () => {
    const text = '\ufeffab -> cd'
    expect(checkDiagram(text, {limits: {maxLineLength: 8}}).status).toBe('upward')
    const d = checkDiagram(text, {limits: {maxLineLength: 7}}).diagnostics[0]!
    expect(d.range.start).toEqual({line: 1, column: 8, offset: 8})
  })

  it('diagram-too-large counts UTF-8 bytes and points where the limit is reached', () => {
    // "é" is 2 bytes, "🍞" 4, "東" 3: 1 + 2 + 3 + 4 = 10 bytes on line 1.
    const text = 'aé東🍞\nb'
    expect(checkDiagram('a\n' + 'é'.repeat(4), {limits: {maxTextBytes: 10}}).status).toBe('upward')
    const over = checkDiagram(text, {limits: {maxTextBytes: 9}})
    expect(over.status).toBe('too-large')
    expect(over.diagnostics).toHaveLength(1)
    const d = over.diagnostics[0]!
    expect(d.ruleId).toBe('diagram-too-large')
    expect(d.range.start).toEqual({line: 1, column: 4, offset: 3})
    expect(d.range.end).toEqual({line: 2, column: 2, offset: text.length})
    expect(d.reason).toContain('12 bytes long; the limit is 9 bytes')
  })

  it('the default limits stop an oversized body before parsing', () => {
    const text = 'a -> b\n'.repeat(40_000) // 280,000 bytes
    const over = checkDiagram(text)
    expect(over.status).toBe('too-large')
    expect(over.diagnostics.map((d) => d.ruleId)).toEqual(['diagram-too-large'])
    expect(over.diagnostics[0]!.reason).toContain('280,000 bytes long; the limit is 262,144')
  })

  it('limits are reported together with syntax errors, in source order', () => {
    const text = 'a -> b ;\nc "' + 'x'.repeat(5) + '"'
    const r = checkDiagram(text, {limits: {maxLabelLength: 3}})
    expect(r.status).toBe('too-large')
    expect(r.diagnostics.map((d) => d.ruleId)).toEqual(['unexpected-character', 'label-too-long'])
  })
})
