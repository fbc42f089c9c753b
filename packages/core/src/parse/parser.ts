/**
 * Parser for the diagram language (grammar and rules in docs/language.md).
 *
 *   body      = { line }
 *   line      = [ statement | tier-line ] [ comment ] line-ending
 *   statement = group { "->" [ label ] group }
 *   tier-line = "tier" id [ label ] ":" group
 *   group     = item { "," item }
 *   item      = id [ label ] { tone | link }
 *
 * Hand-written recursive descent over a pull scanner, linear in the length of the text (plus the
 * product edges a list-to-list arrow asks for). Each line is parsed completely before any of it is
 * applied, so a line with a syntax error adds nothing and the parser resumes on the next line: one bad
 * line never hides the errors of the others.
 */
import type {Diagnostic, SourceRange} from '../source-range.ts'
import type {ParsedDiagram, ParsedEdge, ParsedTier, ParsedVertex} from './index.ts'
import {checkLinkTarget} from './link.ts'
import {createScanner, type Scanner, type Token} from './scanner.ts'
import {tones, type Tone} from './tones.ts'

type IdToken = Extract<Token, {kind: 'id'}>
type LabelToken = Extract<Token, {kind: 'label'}>
type ArrowToken = Extract<Token, {kind: 'arrow'}>
type CommaToken = Extract<Token, {kind: 'comma'}>
type ToneToken = Extract<Token, {kind: 'tone'}>
type LinkToken = Extract<Token, {kind: 'link'}>

interface Item {
  id: IdToken
  label: LabelToken | undefined
  tone: ToneToken | undefined
  link: LinkToken | undefined
}

type Statement =
  | {kind: 'chain'; groups: Item[][]; arrows: ArrowToken[]; arrowLabels: Array<LabelToken | undefined>}
  | {kind: 'tier'; name: IdToken; label: LabelToken | undefined; items: Item[]}

type LineResult = {ok: true; statement: Statement | undefined; last: boolean} | {ok: false; diagnostic: Diagnostic}

export interface ParseSettings {
  /**
   * Stop making edges once this many have been written (repeats included), and report where in
   * `edgeLimitReached`: one list-to-list arrow makes the product of its lists, so without a cap a
   * short text could ask for millions of edges. Default: no cap.
   */
  maxEdges?: number
  /**
   * The caller's time budget: asked once every 256 lines (coarse, so a short diagram never reads
   * the clock); when it says yes, parsing stops there and `outOfTime` says where. Default: never.
   */
  expired?: () => boolean
}

export function parseDiagram(text: string, settings: Readonly<ParseSettings> = {}): ParsedDiagram {
  const scanner = createScanner(text)
  const maxEdges = settings.maxEdges ?? Infinity
  let written = 0
  let edgeLimitReached: SourceRange | undefined
  const vertices: ParsedVertex[] = []
  const edges: ParsedEdge[] = []
  const tiers: ParsedTier[] = []
  const diagnostics: Diagnostic[] = []
  const vertexIndex = new Map<string, number>()
  const tierIndex = new Map<string, number>()
  /** Per vertex in a tier: the id token that put it there. */
  const tierMention = new Map<number, SourceRange>()
  /** `tail,head` → index into `edges`, to find duplicates. */
  const edgeIndex = new Map<string, number>()
  let hadError = false

  function conflict(ruleId: string, reason: string, range: SourceRange, first: SourceRange, firstReason: string): void {
    hadError = true
    diagnostics.push({severity: 'error', ruleId, reason, range, related: [{range: first, reason: firstReason}]})
  }

  function vertexFor(item: Item): number {
    const key = item.id.text.normalize('NFC')
    let index = vertexIndex.get(key)
    if (index === undefined) {
      index = vertices.length
      vertexIndex.set(key, index)
      vertices.push({key, label: undefined, range: item.id.range})
    }
    const vertex = vertices[index]!
    const label = item.label
    if (label) {
      if (vertex.label === undefined) {
        vertex.label = label.value
        vertex.labelRange = label.range
      } else if (vertex.label.normalize('NFC') !== label.value.normalize('NFC')) {
        const reason = `Vertex \`${key}\` already has the label ${JSON.stringify(vertex.label)}, so it cannot also be labelled ${JSON.stringify(label.value)}.`
        conflict('conflicting-label', reason, label.range, vertex.labelRange!, 'The first label.')
      }
    }
    const tone = item.tone
    if (tone) {
      if (vertex.tone === undefined) {
        vertex.tone = tone.value as Tone
        vertex.toneRange = tone.range
      } else if (vertex.tone !== tone.value) {
        const reason = `Vertex \`${key}\` is already marked \`(${vertex.tone})\`, so it cannot also be \`(${tone.value})\`: a vertex has one tone.`
        conflict('conflicting-tone', reason, tone.range, vertex.toneRange!, 'The first tone.')
      }
    }
    const link = item.link
    if (link) {
      if (vertex.href === undefined) {
        vertex.href = link.value
        vertex.hrefRange = link.range
      } else if (vertex.href !== link.value) {
        const reason = `Vertex \`${key}\` already links to <${vertex.href}>, so it cannot also link to <${link.value}>: a vertex has one link.`
        conflict('conflicting-link', reason, link.range, vertex.hrefRange!, 'The first link.')
      }
    }
    return index
  }

  function applyTier(statement: Extract<Statement, {kind: 'tier'}>): void {
    const name = statement.name.text.normalize('NFC')
    const earlier = tierIndex.get(name)
    if (earlier !== undefined) {
      const reason = `Tier \`${name}\` is already declared above; list all of its vertices on that one line.`
      conflict('duplicate-tier', reason, statement.name.range, tiers[earlier]!.range, 'The tier is declared here.')
      return
    }
    const tier = tiers.length
    const parsedTier: ParsedTier = {name, range: statement.name.range, vertices: []}
    if (statement.label) {
      parsedTier.label = statement.label.value
      parsedTier.labelRange = statement.label.range
    }
    tierIndex.set(name, tier)
    tiers.push(parsedTier)
    for (const item of statement.items) {
      const v = vertexFor(item)
      const vertex = vertices[v]!
      if (vertex.tier !== undefined) {
        const other = tiers[vertex.tier]!.name
        const reason =
          vertex.tier === tier
            ? `Vertex \`${vertex.key}\` is already listed in tier \`${other}\`; list it once.`
            : `Vertex \`${vertex.key}\` is already in tier \`${other}\`, so it cannot also be in tier \`${name}\`: a vertex sits on one tier.`
        conflict('vertex-in-two-tiers', reason, item.id.range, tierMention.get(v)!, `\`${vertex.key}\` is put in tier \`${other}\` here.`)
        continue
      }
      vertex.tier = tier
      tierMention.set(v, item.id.range)
      parsedTier.vertices.push(v)
    }
  }

  function apply(statement: Statement): void {
    if (edgeLimitReached) return
    if (statement.kind === 'tier') return applyTier(statement)
    // built by push, not Array#map, whose result is holey or packed depending on the tier running it
    // (apply deoptimized on "wrong map" when it met the other kind)
    const groups: Array<Array<{item: Item; vertex: number}>> = []
    for (const group of statement.groups) {
      const placed: (typeof groups)[number] = []
      for (const item of group) placed.push({item, vertex: vertexFor(item)})
      groups.push(placed)
    }
    for (let g = 0; g + 1 < groups.length; g++) {
      const arrow = statement.arrows[g]!
      const label = statement.arrowLabels[g]
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
          if (label) {
            edge.label = label.value
            edge.labelRange = label.range
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
          const name = `${vertices[edge.from]!.key} -> ${vertices[edge.to]!.key}`
          if (label && first.label !== undefined && first.label.normalize('NFC') !== label.value.normalize('NFC')) {
            const reason = `The edge \`${name}\` already has the label ${JSON.stringify(first.label)}, so it cannot also be labelled ${JSON.stringify(label.value)}.`
            conflict('conflicting-edge-label', reason, label.range, first.labelRange!, 'The first label of this edge.')
            continue
          }
          if (label && first.label === undefined) {
            first.label = label.value
            first.labelRange = label.range
          }
          diagnostics.push({
            severity: 'warning',
            ruleId: 'duplicate-edge',
            reason: `The edge \`${name}\` is already given above; it is kept once.`,
            range: edge.range,
            related: [{range: first.range, reason: 'The first time this edge is given.'}]
          })
        }
      }
    }
  }

  let lines = 0
  let outOfTime: SourceRange | undefined
  for (;;) {
    if ((++lines & 255) === 0 && settings.expired?.() === true) {
      outOfTime = scanner.here()
      break
    }
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

  // Checks over the whole diagram; when parsing ran out of time the rest of the text is unread, so
  // they would mislead.
  if (!outOfTime) {
    if (vertices.length === 0 && !hadError) {
      const start = text.charCodeAt(0) === 0xfeff ? 1 : 0
      diagnostics.push({
        severity: 'error',
        ruleId: 'empty-diagram',
        reason: 'This diagram has no vertices: write at least one id, or an edge such as `a -> b`.',
        range: wholeRange(text, start)
      })
    }

    // Edges against the tiers, once every tier is known (a tier line may come after the edges).
    for (const edge of edges) {
      const from = vertices[edge.from]!.tier
      const to = vertices[edge.to]!.tier
      if (from === undefined || to === undefined || from < to) continue
      const name = `${vertices[edge.from]!.key} -> ${vertices[edge.to]!.key}`
      const related = [{range: tiers[from]!.range, reason: `Tier \`${tiers[from]!.name}\` is declared here.`}]
      if (from !== to) related.push({range: tiers[to]!.range, reason: `Tier \`${tiers[to]!.name}\` is declared here, before it.`})
      diagnostics.push({
        severity: 'error',
        ruleId: from === to ? 'edge-within-tier' : 'edge-against-tiers',
        reason:
          from === to
            ? `The edge \`${name}\` joins two vertices of tier \`${tiers[from]!.name}\`; a tier's vertices sit side by side, so an edge between them cannot point the way the others do.`
            : `The edge \`${name}\` points from tier \`${tiers[from]!.name}\` back to the earlier tier \`${tiers[to]!.name}\`; every edge must go from an earlier tier to a later one.`,
        range: edge.range,
        related
      })
    }
  }

  // Errors of one line come before the warnings and label errors found when it is applied, but the
  // latter can point further left; a stable sort by position restores source order.
  diagnostics.sort((a, b) => a.range.start.offset - b.range.start.offset)
  const parsed: ParsedDiagram = {vertices, edges, diagnostics}
  if (tiers.length > 0) parsed.tiers = tiers
  if (edgeLimitReached) parsed.edgeLimitReached = edgeLimitReached
  if (outOfTime) parsed.outOfTime = outOfTime
  return parsed
}

type GroupResult = {ok: true; group: Item[]; token: Token} | {ok: false; diagnostic: Diagnostic}

/** `item { "," item }` starting at `token`; `after` is the arrow before the group, if any. */
function parseGroup(scanner: Scanner, first: Token, after: ArrowToken | undefined, afterLabel = false): GroupResult {
  let token = first
  const group: Item[] = []
  let lastComma: CommaToken | undefined
  for (;;) {
    if (token.kind === 'error') return {ok: false, diagnostic: token.diagnostic}
    if (token.kind !== 'id') {
      if (token.kind === 'label') return fail('misplaced-label', 'A label must come right after the id of the vertex it names, as in `api "Public API"`.', token.range)
      if (token.kind === 'tone') return fail('misplaced-tone', 'A tone must come right after the vertex it marks, as in `ledger (retiring)`.', token.range)
      if (token.kind === 'link') return fail('misplaced-link', 'A link must come right after the vertex it belongs to, as in `ledger <ledger.md>`.', token.range)
      if (token.kind === 'colon') return misplacedColon(token.range)
      if (lastComma) return fail('empty-list-item', 'A list item is empty: put a vertex after this `,` or remove it.', lastComma.range)
      if (token.kind === 'comma') return fail('empty-list-item', 'A list item is empty: put a vertex before this `,` or remove it.', token.range)
      if (token.kind === 'arrow') {
        if (after) return fail('missing-vertex', 'This arrow has no vertex after it.', after.range)
        return fail('missing-vertex', 'This arrow has no vertex before it.', token.range)
      }
      // An `end` token: only reached after an arrow, since a line that starts with it is blank.
      if (afterLabel) return fail('missing-vertex', 'This arrow has no vertex after it (a label right after `->` names the edge, as in `a -> "reads" b`).', after!.range)
      return fail('missing-vertex', 'This arrow has no vertex after it.', after!.range)
    }
    const item: Item = {id: token, label: undefined, tone: undefined, link: undefined}
    token = scanner.next()
    if (token.kind === 'label') {
      item.label = token
      token = scanner.next()
    }
    // Tone and link, in either order, each once.
    for (;;) {
      if (token.kind === 'tone') {
        if (item.tone) return fail('misplaced-tone', 'A vertex takes one tone: this one follows another.', token.range)
        if (!(tones as readonly string[]).includes(token.value)) {
          return fail('unknown-tone', `Unknown tone \`(${token.value})\`: the tones are ${tones.map((tone) => `\`(${tone})\``).join(', ')}.`, token.range)
        }
        item.tone = token
      } else if (token.kind === 'link') {
        if (item.link) return fail('misplaced-link', 'A vertex takes one link: this one follows another.', token.range)
        const check = checkLinkTarget(token.value)
        if (!check.ok) return fail('unsafe-link', check.reason, token.range)
        item.link = token
      } else {
        break
      }
      token = scanner.next()
    }
    group.push(item)
    if (token.kind === 'comma') {
      lastComma = token
      token = scanner.next()
      continue
    }
    return {ok: true, group, token}
  }
}

function parseLine(scanner: Scanner): LineResult {
  let token = scanner.next()
  if (token.kind === 'end') return {ok: true, statement: undefined, last: token.last}
  const statement: Extract<Statement, {kind: 'chain'}> = {kind: 'chain', groups: [], arrows: [], arrowLabels: []}
  for (;;) {
    const parsed = parseGroup(scanner, token, statement.arrows.at(-1), statement.arrowLabels.at(-1) !== undefined)
    if (!parsed.ok) return parsed
    token = parsed.token
    const [only] = parsed.group
    if (statement.groups.length === 0 && parsed.group.length === 1 && isTierKeyword(only!) && token.kind === 'id') return parseTierLine(scanner, token)
    statement.groups.push(parsed.group)
    switch (token.kind) {
      case 'arrow': {
        statement.arrows.push(token)
        token = scanner.next()
        let label: LabelToken | undefined
        if (token.kind === 'label') {
          label = token
          token = scanner.next()
        }
        statement.arrowLabels.push(label)
        continue
      }
      case 'end':
        return {ok: true, statement, last: token.last}
      case 'error':
        return {ok: false, diagnostic: token.diagnostic}
      case 'id':
        return fail('missing-separator', `Expected \`->\` or \`,\` before \`${token.text}\`.`, token.range)
      case 'label':
        return fail('misplaced-label', 'A label must come right after the id of the vertex it names, and a vertex takes one label.', token.range)
      case 'colon':
        return misplacedColon(token.range)
      // A group stops only before an arrow, the end, an error, an id, a label or a colon.
      case 'comma':
      case 'tone':
      case 'link':
        throw new Error('unreachable: parseGroup consumes commas, tones and links')
    }
  }
}

/** `tier` alone, as the first item of a line: the start of `tier name: a, b` when an id follows. */
function isTierKeyword(item: Item): boolean {
  return item.id.text === 'tier' && !item.label && !item.tone && !item.link
}

/** The rest of `tier name ["label"] ":" group`, from the tier's name. */
function parseTierLine(scanner: Scanner, name: IdToken): LineResult {
  let token = scanner.next()
  let label: LabelToken | undefined
  if (token.kind === 'label') {
    label = token
    token = scanner.next()
  }
  if (token.kind === 'error') return {ok: false, diagnostic: token.diagnostic}
  if (token.kind !== 'colon') {
    return fail('missing-separator', `Expected \`->\` or \`,\` before \`${name.text}\`; a tier is declared as \`tier ${name.text}: a, b\`.`, name.range)
  }
  const colon = token
  token = scanner.next()
  if (token.kind === 'end') return fail('bad-tier-line', `Tier \`${name.text}\` lists no vertex: write its vertices after the \`:\`, as in \`tier ${name.text}: a, b\`.`, colon.range)
  const parsed = parseGroup(scanner, token, undefined)
  if (!parsed.ok) return parsed
  token = parsed.token
  switch (token.kind) {
    case 'end':
      return {ok: true, statement: {kind: 'tier', name, label, items: parsed.group}, last: token.last}
    case 'error':
      return {ok: false, diagnostic: token.diagnostic}
    case 'arrow':
      return fail('bad-tier-line', 'A tier line only lists vertices: write edges on lines of their own.', token.range)
    case 'id':
      return fail('missing-separator', `Expected \`,\` before \`${token.text}\`.`, token.range)
    case 'label':
      return fail('misplaced-label', 'A label must come right after the id of the vertex it names, and a vertex takes one label.', token.range)
    case 'colon':
      return misplacedColon(token.range)
    case 'comma':
    case 'tone':
    case 'link':
      throw new Error('unreachable: parseGroup consumes commas, tones and links')
  }
}

function misplacedColon(range: SourceRange): LineResult & {ok: false} {
  return fail('unexpected-character', 'Unexpected character `:` (U+003A): a `:` only ends the name on a tier line, as in `tier stores: ledger, archive`.', range)
}

function fail(ruleId: string, reason: string, range: SourceRange): {ok: false; diagnostic: Diagnostic} {
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
