/**
 * Vertex links: `checkLinkTarget` against the WHATWG URL parser built into Node (the parser browsers
 * follow). Every accepted target, resolved against a page of the site, must be an http(s) URL, and
 * every accepted target that is not written as an absolute http(s) URL must stay on the page's own
 * origin. Fuzzed with fast-check over an alphabet rich in the characters that make URL tricks.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {checkLinkTarget, parseDiagram} from '@upright/core'

const base = 'https://docs.example/guide/page.html'

function safeByWhatwg(target: string): boolean {
  let url: URL
  try {
    url = new URL(target, base)
  } catch {
    return false
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') return false
  if (/^https?:\/\//i.test(target)) return true
  return url.origin === new URL(base).origin
}

describe('checkLinkTarget', () => {
  const accepted = ['https://docs.example/ledger', 'HTTP://stock.example/', 'http://a.example:8080/x?y#z', '#orders', '../reports/monthly.md#totals', 'ledger.html', './a:b', '?tab=2', '/stores/ledger', 'a%20b', 'café.md']
  const refused = [
    'javascript:alert(1)',
    'JavaScript:alert(1)',
    ' javascript:alert(1)',
    'java\tscript:alert(1)',
    'java\nscript:alert(1)',
    '\u0000javascript:alert(1)',
    'data:text/html,<b>',
    'vbscript:msgbox',
    'file:///etc/passwd',
    'mailto:desk@example.org',
    '//evil.example/',
    '/\\evil.example',
    '\\\\evil.example',
    'https:evil.example',
    'https:/evil.example',
    'a b',
    'https://docs.example/\u200bx',
    'https://docs.example/\u202ex',
    '',
    'a:b',
    'x"onmouseover="y'
  ]
  for (const target of accepted) {
    it(`accepts ${JSON.stringify(target)}`, () => {
      expect(checkLinkTarget(target)).toEqual({ok: true})
      expect(safeByWhatwg(target)).toBe(true)
    })
  }
  for (const target of refused) {
    it(`refuses ${JSON.stringify(target)}`, () => {
      const result = checkLinkTarget(target)
      expect(result.ok).toBe(false)
    })
  }

  it('every accepted target is safe by the WHATWG parser (fuzzed)', () => {
    const pieces = ['h', 't', 'p', 's', 'j', 'a', 'v', 'c', 'r', 'i', ':', '/', '\\', '#', '?', '.', '%', '0', 'A', ' ', '\t', '\n', '\u0000', '\u00a0', '\u200b', '@', 'http', 'https', 'javascript', 'data', '//', 'x.example', '\u2028', '&', '=']
    const target = fc.array(fc.constantFrom(...pieces), {maxLength: 12}).map((parts) => parts.join(''))
    fc.assert(
      fc.property(target, (t) => {
        if (checkLinkTarget(t).ok) expect(safeByWhatwg(t), JSON.stringify(t)).toBe(true)
      }),
      {numRuns: 20_000, seed: 4242}
    )
  })

  it('reports an unsafe link at its position in the text, and keeps a safe one on the vertex', () => {
    const result = parseDiagram('ledger <https://docs.example/ledger> -> report <javascript:void(0)>\nreport <reports.md>')
    expect(result.diagnostics.map((d) => [d.ruleId, d.range.start.column, d.range.end.column])).toEqual([['unsafe-link', 48, 68]])
    // The bad line adds nothing; the next line's link is kept.
    expect(result.vertices.map((v) => [v.key, v.href])).toEqual([['report', 'reports.md']])
  })
})
