/**
 * Parser fixtures: each folder in fixtures/parse/ holds `input.upright` (a diagram body, read as bytes
 * so CRLF, CR and a BOM reach the parser untouched) and `expected.json`. Ranges are written
 * `line:column-line:column` with the source text they cover beside them, so a reviewer can check an
 * expectation by eye. `UPDATE=1 npx vitest run packages/core/test/parse-fixtures.test.ts` rewrites the
 * expectations; read the diff before committing.
 *
 * Independently of the expectations, every range is checked against a reference line/column
 * computation (split on `\r\n`, `\r`, `\n`, as unist does) so offsets and columns cannot drift apart.
 */
import {readdirSync, readFileSync, writeFileSync, existsSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {parseDiagram, parseRuleIds, type ParsedDiagram, type SourceRange} from '@upright/core'

const root = new URL('../../../fixtures/parse/', import.meta.url).pathname
const update = process.env['UPDATE'] === '1'

function compact(range: SourceRange): string {
  return `${range.start.line}:${range.start.column}-${range.end.line}:${range.end.column}`
}

/** Reference positions: 1-based line and column of every offset, a leading BOM not counted. */
function referencePoint(text: string, offset: number): {line: number; column: number} {
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0
  const before = text.slice(bom, offset)
  const lines = before.split(/\r\n|\r|\n/)
  return {line: lines.length, column: lines.at(-1)!.length + 1}
}

function checkRange(text: string, range: SourceRange): void {
  expect(range.start.offset).toBeLessThanOrEqual(range.end.offset)
  expect(range.end.offset).toBeLessThanOrEqual(text.length)
  for (const point of [range.start, range.end]) {
    expect({line: point.line, column: point.column}).toEqual(referencePoint(text, point.offset))
  }
}

function describeResult(text: string, result: ParsedDiagram): unknown {
  const slice = (range: SourceRange): string => text.slice(range.start.offset, range.end.offset)
  return {
    vertices: result.vertices.map((vertex) => ({
      key: vertex.key,
      ...(vertex.label === undefined ? {} : {label: vertex.label}),
      range: compact(vertex.range),
      text: slice(vertex.range),
      ...(vertex.labelRange ? {labelRange: compact(vertex.labelRange), labelText: slice(vertex.labelRange)} : {}),
      ...(vertex.tone === undefined ? {} : {tone: vertex.tone, toneText: slice(vertex.toneRange!)}),
      ...(vertex.href === undefined ? {} : {href: vertex.href, hrefText: slice(vertex.hrefRange!)}),
      ...(vertex.tier === undefined ? {} : {tier: result.tiers![vertex.tier]!.name})
    })),
    ...(result.tiers
      ? {
          tiers: result.tiers.map((tier) => ({
            name: tier.name,
            range: compact(tier.range),
            ...(tier.label === undefined ? {} : {label: tier.label, labelText: slice(tier.labelRange!)}),
            vertices: tier.vertices.map((v) => result.vertices[v]!.key)
          }))
        }
      : {}),
    edges: result.edges.map((edge) => ({
      edge: `${result.vertices[edge.from]!.key} -> ${result.vertices[edge.to]!.key}`,
      range: compact(edge.range),
      text: slice(edge.range),
      arrow: compact(edge.arrowRange),
      tail: compact(edge.tailRange),
      head: compact(edge.headRange),
      ...(edge.label === undefined ? {} : {label: edge.label, labelText: slice(edge.labelRange!)})
    })),
    diagnostics: result.diagnostics.map((diagnostic) => ({
      severity: diagnostic.severity,
      ruleId: diagnostic.ruleId,
      reason: diagnostic.reason,
      range: compact(diagnostic.range),
      text: slice(diagnostic.range),
      ...(diagnostic.related ? {related: diagnostic.related.map((item) => `${compact(item.range)} ${item.reason}`)} : {})
    }))
  }
}

const cases = readdirSync(root, {withFileTypes: true})
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name)
  .sort()

describe('parse fixtures', () => {
  it('has at least 25 cases', () => {
    expect(cases.length).toBeGreaterThanOrEqual(25)
  })

  it('covers every diagram rule id, and reports no other', () => {
    const seen = new Set<string>()
    for (const name of cases) {
      for (const diagnostic of parseDiagram(readFileSync(join(root, name, 'input.upright'), 'utf8')).diagnostics) seen.add(diagnostic.ruleId)
    }
    const optionRules = new Set(['unknown-option', 'bad-option-value', 'duplicate-option'])
    expect([...seen].sort()).toEqual(parseRuleIds.filter((ruleId) => !optionRules.has(ruleId)).sort())
  })

  for (const name of cases) {
    it(name, () => {
      const text = readFileSync(join(root, name, 'input.upright'), 'utf8')
      const result = parseDiagram(text)
      for (const vertex of result.vertices) {
        checkRange(text, vertex.range)
        for (const range of [vertex.labelRange, vertex.toneRange, vertex.hrefRange]) if (range) checkRange(text, range)
      }
      for (const edge of result.edges) {
        for (const range of [edge.range, edge.arrowRange, edge.tailRange, edge.headRange, edge.labelRange]) if (range) checkRange(text, range)
      }
      for (const diagnostic of result.diagnostics) checkRange(text, diagnostic.range)

      const actual = describeResult(text, result)
      const expectedPath = join(root, name, 'expected.json')
      if (update) writeFileSync(expectedPath, JSON.stringify(actual, null, 2) + '\n')
      expect(existsSync(expectedPath), `${expectedPath} is missing; run with UPDATE=1 and review it`).toBe(true)
      expect(actual).toEqual(JSON.parse(readFileSync(expectedPath, 'utf8')))
      // Same input, same output.
      expect(parseDiagram(text)).toEqual(result)
    })
  }
})
