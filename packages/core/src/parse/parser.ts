/**
 * Parser for the diagram language (grammar and rules in docs/language.md).
 *
 *   body      = { line }
 *   line      = [ statement ] [ comment ] line-ending
 *   statement = group { "->" group }
 *   group     = item { "," item }
 *   item      = id [ label ]
 *
 * Hand-written recursive descent over a pull scanner, linear in the length of the text (plus the
 * product edges a list-to-list arrow asks for). Each line is parsed completely before any of it is
 * applied, so a line with a syntax error adds nothing and the parser resumes on the next line: one bad
 * line never hides the errors of the others.
 */
import type {Diagnostic, SourceRange} from '../source-range.ts'
import type {ParsedDiagram, ParsedEdge, ParsedVertex} from './index.ts'
import {createScanner, type Scanner, type Token} from './scanner.ts'

type IdToken = Extract<Token, {kind: 'id'}>
type LabelToken = Extract<Token, {kind: 'label'}>
type ArrowToken = Extract<Token, {kind: 'arrow'}>
type CommaToken = Extract<Token, {kind: 'comma'}>

interface Item {
  id: IdToken
  label: LabelToken | undefined
}

interface Statement {
  groups: Item[][]
  arrows: ArrowToken[]
}

type LineResult = {ok: true; statement: Statement | undefined; last: boolean} | {ok: false; diagnostic: Diagnostic}

export interface ParseSettings {
  /**
   * Stop making edges once this many have been written (repeats included), and report where in
   * `edgeLimitReached`: one list-to-list arrow makes the product of its lists, so without a cap a
   * short text could ask for millions of edges. Default: no cap.
   */
  maxEdges?: number
}

export function parseDiagram(text: string, settings: Readonly<ParseSettings> = {}): ParsedDiagram {
  const scanner = createScanner(text)
  const maxEdges = settings.maxEdges ?? Infinity
  let written = 0
  let edgeLimitReached: SourceRange | undefined
  const vertices: ParsedVertex[] = []
  const edges: ParsedEdge[] = []
  const diagnostics: Diagnostic[] = []
  const vertexIndex = new Map<string, number>()
  /** `tail,head` → index into `edges`, to find duplicates. */
  const edgeIndex = new Map<string, number>()
  let hadError = false

  function vertexFor(item: Item): number {
    const key = item.id.text.normalize('NFC')
    let index = vertexIndex.get(key)
    if (index === undefined) {
      index = vertices.length
      vertexIndex.set(key, index)
      vertices.push({key, label: undefined, range: item.id.range})
    }
    const label = item.label
    if (label) {
      const vertex = vertices[index]!
      if (vertex.label === undefined) {
        vertex.label = label.value
        vertex.labelRange = label.range
      } else if (vertex.label.normalize('NFC') !== label.value.normalize('NFC')) {
        hadError = true
        const first = vertex.labelRange!
        diagnostics.push({
          severity: 'error',
          ruleId: 'conflicting-label',
          reason: `Vertex \`${key}\` already has the label ${JSON.stringify(vertex.label)}, so it cannot also be labelled ${JSON.stringify(label.value)}.`,
          range: label.range,
          related: [{range: first, reason: 'The first label.'}]
        })
      }
    }
    return index
  }

  function apply(statement: Statement): void {
    if (edgeLimitReached) return
    const groups = statement.groups.map((group) => group.map((item) => ({item, vertex: vertexFor(item)})))
    for (let g = 0; g + 1 < groups.length; g++) {
      const arrow = statement.arrows[g]!
      for (const tail of groups[g]!) {
        for (const head of groups[g + 1]!) {
          const edge: ParsedEdge = {
            from: tail.vertex,
            to: head.vertex,
            range: {start: tail.item.id.range.start, end: head.item.id.range.end},
            arrowRange: arrow.range,
            tailRange: tail.item.id.range,
            headRange: head.item.id.range
          }
          if (++written > maxEdges) {
            edgeLimitReached = edge.range
            return
          }
          const pair = `${edge.from},${edge.to}`
          const earlier = edgeIndex.get(pair)
          if (earlier === undefined) {
            edgeIndex.set(pair, edges.length)
            edges.push(edge)
            continue
          }
          const first = edges[earlier]!
          diagnostics.push({
            severity: 'warning',
            ruleId: 'duplicate-edge',
            reason: `The edge \`${vertices[edge.from]!.key} -> ${vertices[edge.to]!.key}\` is already given above; it is kept once.`,
            range: edge.range,
            related: [{range: first.range, reason: 'The first time this edge is given.'}]
          })
        }
      }
    }
  }

  for (;;) {
    const result = parseLine(scanner)
    if (!result.ok) {
      hadError = true
      diagnostics.push(result.diagnostic)
      scanner.skipLine()
      continue
    }
    if (result.statement) apply(result.statement)
    if (result.last) break
  }

  if (vertices.length === 0 && !hadError) {
    const start = text.charCodeAt(0) === 0xfeff ? 1 : 0
    diagnostics.push({
      severity: 'error',
      ruleId: 'empty-diagram',
      reason: 'This diagram has no vertices: write at least one id, or an edge such as `a -> b`.',
      range: wholeRange(text, start)
    })
  }

  // Errors of one line come before the warnings and label errors found when it is applied, but the
  // latter can point further left; a stable sort by position restores source order.
  diagnostics.sort((a, b) => a.range.start.offset - b.range.start.offset)
  return edgeLimitReached ? {vertices, edges, diagnostics, edgeLimitReached} : {vertices, edges, diagnostics}
}

function parseLine(scanner: Scanner): LineResult {
  let token = scanner.next()
  if (token.kind === 'end') return {ok: true, statement: undefined, last: token.last}
  const statement: Statement = {groups: [], arrows: []}
  for (;;) {
    // Parse one group: `item { "," item }`.
    const group: Item[] = []
    let lastComma: CommaToken | undefined
    for (;;) {
      if (token.kind === 'error') return {ok: false, diagnostic: token.diagnostic}
      if (token.kind !== 'id') {
        if (token.kind === 'label') return fail('misplaced-label', 'A label must come right after the id of the vertex it names, as in `api "Public API"`.', token.range)
        if (lastComma) return fail('empty-list-item', 'A list item is empty: put a vertex after this `,` or remove it.', lastComma.range)
        if (token.kind === 'comma') return fail('empty-list-item', 'A list item is empty: put a vertex before this `,` or remove it.', token.range)
        if (token.kind === 'arrow') {
          const previous = statement.arrows.at(-1)
          if (previous) return fail('missing-vertex', 'This arrow has no vertex after it.', previous.range)
          return fail('missing-vertex', 'This arrow has no vertex before it.', token.range)
        }
        // An `end` token: only reached after an arrow, since a line that starts with it is blank.
        return fail('missing-vertex', 'This arrow has no vertex after it.', statement.arrows.at(-1)!.range)
      }
      const id = token
      let label: LabelToken | undefined
      token = scanner.next()
      if (token.kind === 'label') {
        label = token
        token = scanner.next()
      }
      group.push({id, label})
      if (token.kind === 'comma') {
        lastComma = token
        token = scanner.next()
        continue
      }
      break
    }
    statement.groups.push(group)
    switch (token.kind) {
      case 'arrow':
        statement.arrows.push(token)
        token = scanner.next()
        continue
      case 'end':
        return {ok: true, statement, last: token.last}
      case 'error':
        return {ok: false, diagnostic: token.diagnostic}
      case 'id':
        return fail('missing-separator', `Expected \`->\` or \`,\` before \`${token.text}\`.`, token.range)
      case 'label':
        return fail('misplaced-label', 'A label must come right after the id of the vertex it names, and a vertex takes one label.', token.range)
    }
  }
}

function fail(ruleId: string, reason: string, range: SourceRange): LineResult {
  return {ok: false, diagnostic: {severity: 'error', ruleId, reason, range}}
}

/** The range from `start` to the end of the text, in line/column terms. */
function wholeRange(text: string, start: number): SourceRange {
  let line = 1
  let lineStart = start
  for (let at = start; at < text.length; at++) {
    const code = text.charCodeAt(at)
    if (code === 0x0d || code === 0x0a) {
      if (code === 0x0d && text.charCodeAt(at + 1) === 0x0a) at++
      line++
      lineStart = at + 1
    }
  }
  return {
    start: {line: 1, column: 1, offset: start},
    end: {line, column: text.length - lineStart + 1, offset: text.length}
  }
}
