/**
 * Property tests for the diagram parser (fast-check, fixed seeds so a failure replays).
 *
 * - Printing a random graph in the language (random layout, comments, line endings, BOM, lists and
 *   chains) and parsing it back gives the same vertices, labels and edge set; the expected edge set is
 *   computed here from the printed statements, not by the parser.
 * - No input makes the parser throw, and every range it returns agrees with a reference line/column
 *   computation (split on `\r\n`, `\r`, `\n`, as unist does).
 * - Error recovery: k bad lines among good ones give exactly k errors, in order, and the good lines
 *   parse to the same graph as they do alone.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {parseDiagram, type ParsedDiagram, type SourceRange} from '@upright/core'

const seed = 20261202

function referencePoint(text: string, offset: number): {line: number; column: number} {
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0
  const lines = text.slice(bom, offset).split(/\r\n|\r|\n/)
  return {line: lines.length, column: lines.at(-1)!.length + 1}
}

function rangesOf(result: ParsedDiagram): SourceRange[] {
  return [
    ...result.vertices.flatMap((vertex) => (vertex.labelRange ? [vertex.range, vertex.labelRange] : [vertex.range])),
    ...result.edges.flatMap((edge) => [edge.range, edge.arrowRange, edge.tailRange, edge.headRange]),
    ...result.diagnostics.map((diagnostic) => diagnostic.range)
  ]
}

function checkInvariants(text: string, result: ParsedDiagram): void {
  for (const range of rangesOf(result)) {
    expect(range.start.offset).toBeGreaterThanOrEqual(0)
    expect(range.start.offset).toBeLessThanOrEqual(range.end.offset)
    expect(range.end.offset).toBeLessThanOrEqual(text.length)
    for (const point of [range.start, range.end]) {
      expect({line: point.line, column: point.column}).toEqual(referencePoint(text, point.offset))
    }
  }
  const offsets = result.diagnostics.map((diagnostic) => diagnostic.range.start.offset)
  expect(offsets).toEqual([...offsets].sort((a, b) => a - b))
  expect(new Set(result.vertices.map((vertex) => vertex.key)).size).toBe(result.vertices.length)
  for (const edge of result.edges) {
    expect(edge.from).toBeLessThan(result.vertices.length)
    expect(edge.to).toBeLessThan(result.vertices.length)
  }
  for (const vertex of result.vertices) {
    expect(text.slice(vertex.range.start.offset, vertex.range.end.offset).normalize('NFC')).toBe(vertex.key)
  }
  for (const edge of result.edges) {
    expect(text.slice(edge.arrowRange.start.offset, edge.arrowRange.end.offset)).toBe('->')
    expect(text.slice(edge.tailRange.start.offset, edge.tailRange.end.offset).normalize('NFC')).toBe(result.vertices[edge.from]!.key)
    expect(text.slice(edge.headRange.start.offset, edge.headRange.end.offset).normalize('NFC')).toBe(result.vertices[edge.to]!.key)
  }
  // The scanner resumes at the next line after an error, so a line holds at most one syntax error.
  const syntaxLines = result.diagnostics
    .filter((diagnostic) => diagnostic.severity === 'error' && diagnostic.ruleId !== 'conflicting-label')
    .map((diagnostic) => diagnostic.range.start.line)
  expect(new Set(syntaxLines).size).toBe(syntaxLines.length)
}

// Ids: a first character that may start an id, then characters that may continue one. The pools mix
// ASCII, Latin with combining marks, CJK, Greek and an astral letter (U+1D49C, two UTF-16 units).
const idStart = fc.constantFrom('a', 'b', 'Z', '_', '7', 'é', '東', 'Ω', '\u{1D49C}', 'n')
const idRest = fc.constantFrom('a', '1', '_', '-', '.', '\u0303', 'ß', '京', '\u{1D49C}')
const id = fc.tuple(idStart, fc.array(idRest, {maxLength: 4})).map(([first, rest]) => first + rest.join(''))
const labelText = fc
  .array(fc.constantFrom('A', ' ', '"', '\\', '#', '->', ',', '🚀', '👩\u200d👧', 'é', '\t'), {maxLength: 6})
  .map((parts) => parts.join(''))
const gap = fc.constantFrom('', ' ', '  ', '\t')
const someGap = fc.constantFrom(' ', '  ', '\t', ' \t')
const lineEnding = fc.constantFrom('\n', '\r\n', '\r')
const comment = fc.constantFrom('# note', '#', '# a -> b', '# "quoted')

function quote(label: string): string {
  return '"' + label.replace(/[\\"]/g, (character) => '\\' + character) + '"'
}

interface Drawn {
  statements: Array<Array<Array<{id: string; labelled: boolean}>>>
  labels: Map<string, string>
  layout: {
    gaps: string[]
    endings: string[]
    comments: Array<string | undefined>
    blankLines: number[]
    bom: boolean
  }
}

const drawn: fc.Arbitrary<Drawn> = fc
  .record({
    pool: fc.uniqueArray(id, {minLength: 1, maxLength: 8, selector: (value) => value.normalize('NFC')}),
    labelPool: fc.array(fc.option(labelText, {nil: undefined}), {minLength: 8, maxLength: 8}),
    shape: fc.array(
      fc.array(fc.array(fc.tuple(fc.nat(), fc.boolean()), {minLength: 1, maxLength: 3}), {minLength: 1, maxLength: 4}),
      {minLength: 1, maxLength: 8}
    ),
    gaps: fc.array(fc.tuple(gap, someGap), {minLength: 200, maxLength: 200}).map((pairs) => pairs.flat()),
    endings: fc.array(lineEnding, {minLength: 20, maxLength: 20}),
    comments: fc.array(fc.option(comment, {nil: undefined}), {minLength: 20, maxLength: 20}),
    blankLines: fc.array(fc.nat(2), {minLength: 20, maxLength: 20}),
    bom: fc.boolean()
  })
  .map(({pool, labelPool, shape, gaps, endings, comments, blankLines, bom}) => {
    const labels = new Map<string, string>()
    pool.forEach((name, index) => {
      const label = labelPool[index]
      if (label !== undefined) labels.set(name.normalize('NFC'), label)
    })
    const statements = shape.map((groups) =>
      groups.map((items) => items.map(([pick, labelled]) => ({id: pool[pick % pool.length]!, labelled})))
    )
    return {statements, labels, layout: {gaps, endings, comments, blankLines, bom}}
  })

/** Print the statements; `gaps` alternates "may be empty" and "must be non-empty" whitespace. */
function print({statements, labels, layout}: Drawn): string {
  let g = 0
  const anyGap = (): string => layout.gaps[(2 * g++) % layout.gaps.length]!
  const lines: string[] = []
  statements.forEach((groups, index) => {
    const printed = groups.map((items) =>
      items
        .map((item) => {
          const label = labels.get(item.id.normalize('NFC'))
          return item.id + (item.labelled && label !== undefined ? anyGap() + quote(label) : '')
        })
        .join(anyGap() + ',' + anyGap())
    )
    const trailing = layout.comments[index % layout.comments.length]
    lines.push(anyGap() + printed.join(anyGap() + '->' + anyGap()) + (trailing ? anyGap() + trailing : anyGap()))
    for (let blank = 0; blank < layout.blankLines[index % layout.blankLines.length]!; blank++) lines.push(anyGap())
  })
  let text = layout.bom ? '\ufeff' : ''
  lines.forEach((line, index) => {
    text += line + (index + 1 < lines.length ? layout.endings[index % layout.endings.length]! : '')
  })
  return text
}

describe('parser round trip', () => {
  it('gives back the printed vertices, labels and edge set', () => {
    fc.assert(
      fc.property(drawn, (graph) => {
        const text = print(graph)
        const result = parseDiagram(text)
        checkInvariants(text, result)

        const order: string[] = []
        const seen = new Set<string>()
        const labelled = new Set<string>()
        const edges = new Set<string>()
        let pairs = 0
        for (const groups of graph.statements) {
          for (const items of groups) {
            for (const item of items) {
              const key = item.id.normalize('NFC')
              if (!seen.has(key)) {
                seen.add(key)
                order.push(key)
              }
              if (item.labelled && graph.labels.has(key)) labelled.add(key)
            }
          }
          for (let index = 0; index + 1 < groups.length; index++) {
            for (const tail of groups[index]!) {
              for (const head of groups[index + 1]!) {
                edges.add(`${tail.id.normalize('NFC')} ${head.id.normalize('NFC')}`)
                pairs++
              }
            }
          }
        }

        expect(result.diagnostics.filter((diagnostic) => diagnostic.severity === 'error')).toEqual([])
        expect(result.vertices.map((vertex) => vertex.key)).toEqual(order)
        for (const vertex of result.vertices) {
          expect(vertex.label).toBe(labelled.has(vertex.key) ? graph.labels.get(vertex.key) : undefined)
        }
        const parsedEdges = result.edges.map((edge) => `${result.vertices[edge.from]!.key} ${result.vertices[edge.to]!.key}`)
        expect(new Set(parsedEdges)).toEqual(edges)
        expect(parsedEdges.length).toBe(edges.size)
        expect(result.diagnostics.filter((diagnostic) => diagnostic.ruleId === 'duplicate-edge').length).toBe(pairs - edges.size)
      }),
      {seed, numRuns: 300}
    )
  })
})

describe('parser robustness', () => {
  it('never throws on arbitrary text and keeps its ranges consistent', () => {
    fc.assert(
      fc.property(fc.string({unit: 'binary', maxLength: 80}), (text) => {
        checkInvariants(text, parseDiagram(text))
      }),
      {seed, numRuns: 600}
    )
  })

  it('never throws on a soup of the language tokens', () => {
    const token = fc.constantFrom('a', 'b-c', 'é', '->', '-', '>', ',', '"', '"x"', '\\', '\\"', '#', ' ', '\t', '\n', '\r', '\r\n', '\ufeff', '😀', '\u0301', '\ud800')
    fc.assert(
      fc.property(fc.array(token, {maxLength: 40}), (tokens) => {
        const text = tokens.join('')
        checkInvariants(text, parseDiagram(text))
      }),
      {seed, numRuns: 1000}
    )
  })
})

describe('parser recovery', () => {
  const good = ['a -> b', 'b, c -> d', 'x "X" -> y', 'd -> e, f', '# just a comment', '', 'y -> a']
  const bad: Array<[string, string]> = [
    ['a ->', 'missing-vertex'],
    ['-> a', 'missing-vertex'],
    ['a, , b', 'empty-list-item'],
    ['a "open', 'unterminated-string'],
    ['a "x\\y"', 'bad-escape'],
    ['a ! b', 'unexpected-character'],
    ['"stray"', 'misplaced-label'],
    ['a b', 'missing-separator']
  ]

  it('reports each bad line once, in order, and keeps the good lines intact', () => {
    const line = fc.oneof(
      fc.constantFrom(...good).map((text) => ({text, rule: undefined as string | undefined})),
      fc.constantFrom(...bad).map(([text, rule]) => ({text, rule: rule as string | undefined}))
    )
    fc.assert(
      fc.property(fc.array(line, {minLength: 1, maxLength: 12}), lineEnding, (lines, ending) => {
        const text = lines.map((item) => item.text).join(ending)
        const result = parseDiagram(text)
        checkInvariants(text, result)
        const expectedRules = lines.flatMap((item) => (item.rule ? [item.rule] : []))
        const errors = result.diagnostics.filter((diagnostic) => diagnostic.severity === 'error' && diagnostic.ruleId !== 'empty-diagram')
        expect(errors.map((diagnostic) => diagnostic.ruleId)).toEqual(expectedRules)
        const badLines = lines.flatMap((item, index) => (item.rule ? [index + 1] : []))
        expect(errors.map((diagnostic) => diagnostic.range.start.line)).toEqual(badLines)

        const alone = parseDiagram(lines.filter((item) => !item.rule).map((item) => item.text).join(ending))
        const shape = (parsed: ParsedDiagram) => ({
          vertices: parsed.vertices.map((vertex) => [vertex.key, vertex.label]),
          edges: parsed.edges.map((edge) => [edge.from, edge.to])
        })
        expect(shape(result)).toEqual(shape(alone))
      }),
      {seed, numRuns: 300}
    )
  })
})
