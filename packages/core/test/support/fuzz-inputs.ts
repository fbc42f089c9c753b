/**
 * fast-check arbitraries for fuzzing the pipeline: raw bytes and UTF-16 units, random graphs printed
 * in the diagram language (with every formatting freedom the language allows), and those printed
 * graphs mutated a few characters at a time ("near-valid" text).
 */
import fc from 'fast-check'
import type {Limits} from '../../src/check/limits.ts'
import type {Flow} from '../../src/parse/index.ts'

export interface FuzzInput {
  kind: 'bytes' | 'units' | 'graph' | 'mutated'
  text: string
  budgetTicks: number
  flow: Flow
  limits?: Partial<Limits>
}

const flowArb = fc.constantFrom<Flow>('up', 'down', 'left', 'right')

/** Mostly a generous budget (decided), sometimes a tiny one (undecided or decided early). */
const budgetArb = fc.oneof({weight: 6, arbitrary: fc.constant(1_000_000)}, {weight: 1, arbitrary: fc.integer({min: 1, max: 60})})

/** Sometimes small limits, so every limit rule fires now and then. */
const limitsArb: fc.Arbitrary<Partial<Limits> | undefined> = fc.oneof(
  {weight: 8, arbitrary: fc.constant(undefined)},
  {
    weight: 1,
    arbitrary: fc.record(
      {
        maxVertices: fc.integer({min: 1, max: 8}),
        maxEdges: fc.integer({min: 1, max: 12}),
        maxLabelLength: fc.integer({min: 1, max: 6}),
        maxLineLength: fc.integer({min: 4, max: 40}),
        maxTextBytes: fc.integer({min: 8, max: 200})
      },
      {requiredKeys: []}
    )
  }
)

const decoder = new TextDecoder('utf-8', {fatal: false})

export const bytesArb: fc.Arbitrary<FuzzInput> = fc
  .record({bytes: fc.uint8Array({maxLength: 160}), budgetTicks: budgetArb, flow: flowArb, limits: limitsArb})
  .map(({bytes, limits, ...rest}) => ({kind: 'bytes' as const, text: decoder.decode(bytes), ...rest, ...(limits ? {limits} : {})}))

/** Any UTF-16 code units, lone surrogates included, weighted toward the language's own characters. */
const unitArb = fc.oneof(
  {weight: 3, arbitrary: fc.integer({min: 0, max: 0xffff}).map((c) => String.fromCharCode(c))},
  {weight: 4, arbitrary: fc.constantFrom('a', 'b', 'c', '1', '_', '-', '>', '->', ',', '"', '\\', '#', ' ', '\t', '\n', '\r', '\r\n', '.', 'é', '\u0301', '東', '🍞', '\ufeff', '\u00a0')}
)

export const unitsArb: fc.Arbitrary<FuzzInput> = fc
  .record({parts: fc.array(unitArb, {maxLength: 120}), budgetTicks: budgetArb, flow: flowArb, limits: limitsArb})
  .map(({parts, limits, ...rest}) => ({kind: 'units' as const, text: parts.join(''), ...rest, ...(limits ? {limits} : {})}))

export interface GraphSpec {
  n: number
  edges: Array<[number, number]>
  labels: Array<string | undefined>
}

const labelChar = fc.constantFrom(
  'a', 'Z', '7', ' ', '  ', '\t', '#', '->', ',', '<', '>', '&', "'", '"', '\\', '/', '=', '&amp;', '<b>', ']]>', '</text>',
  'é', 'e\u0301', '東', '京', '한', '🍞', '👩‍🍳', '\u200d', '\u202e', '\u00a0', 'ß'
)
const labelArb = fc.array(labelChar, {maxLength: 8}).map((xs) => xs.join(''))

/** Sparse: up to 3n + 2 random pairs. Dense: each of the n(n-1)/2 pairs with one probability. */
function pairsArb(n: number): fc.Arbitrary<Array<[number, number]>> {
  const sparse = fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), {maxLength: 3 * n + 2})
  const all: Array<[number, number]> = []
  for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) all.push([a, b])
  const dense = fc
    .record({p: fc.integer({min: 35, max: 95}), coins: fc.array(fc.nat(99), {minLength: all.length, maxLength: all.length})})
    .map(({p, coins}) => all.filter((_, i) => coins[i]! < p))
  return n >= 4 ? fc.oneof(sparse, dense) : sparse
}

/** Random digraphs on up to 9 vertices: mostly acyclic (edges follow a random order), any density. */
export const graphSpecArb: fc.Arbitrary<GraphSpec> = fc
  .integer({min: 1, max: 9})
  .chain((n) =>
    fc.record({
      n: fc.constant(n),
      order: fc.shuffledSubarray([...Array(n).keys()], {minLength: n, maxLength: n}),
      pairs: pairsArb(n),
      acyclic: fc.nat(4).map((x) => x > 0),
      labels: fc.array(fc.option(labelArb, {nil: undefined, freq: 2}), {minLength: n, maxLength: n})
    })
  )
  .map(({n, order, pairs, acyclic, labels}) => {
    const rank = new Array<number>(n)
    order.forEach((v, i) => (rank[v] = i))
    const edges: Array<[number, number]> = []
    for (const [a, b] of pairs) {
      if (a === b && acyclic) continue
      edges.push(acyclic && rank[a]! > rank[b]! ? [b, a] : [a, b])
    }
    return {n, edges, labels}
  })

const idStyles = [
  (i: number) => `v${i}`,
  (i: number) => `東京${i}`,
  (i: number) => `cafe\u0301_${i}`,
  (i: number) => `${i}`,
  (i: number) => `a-b.${i}`,
  (i: number) => `Ελλάδα${i}`
]

function escapeLabel(label: string): string {
  return label.replace(/[\\"]/g, (c) => `\\${c}`)
}

/** Print a graph spec with random formatting; choices come from a list of small integers. */
export function printGraph(spec: GraphSpec, choices: readonly number[], bom: boolean): string {
  let k = 0
  const pick = (m: number): number => (choices.length === 0 ? 0 : choices[k++ % choices.length]! % m)
  const idStyle = idStyles[pick(idStyles.length)]!
  const id = (v: number): string => idStyle(v)
  const labelled = new Set<number>()
  const toned = new Set<number>()
  const linked = new Set<number>()
  /** A tone or a link now and then (each given at most once per vertex: a second is an error). */
  const extras = (v: number): string => {
    let out = ''
    if (!toned.has(v) && pick(7) === 0) {
      toned.add(v)
      out += ` (${['external', 'new', 'retiring'][pick(3)]})`
    }
    if (!linked.has(v) && pick(7) === 0) {
      linked.add(v)
      out += ` <${['#v' + v, 'page.md', 'https://docs.example/p?q=1', '../up/' + v + '.md'][pick(4)]}>`
    }
    return out
  }
  const mention = (v: number): string => {
    const label = spec.labels[v]
    if (label === undefined || labelled.has(v) || pick(3) === 0) return id(v) + extras(v)
    labelled.add(v)
    return `${id(v)}${pick(2) ? ' ' : ''}"${escapeLabel(label)}"${extras(v)}`
  }
  /** An edge label after an arrow now and then. */
  const arrow = (): string => (pick(6) === 0 ? `->${space()}"${['calls', 'reads', '<b>', 'a "q"'][pick(4)]!.replace(/"/g, '\\"')}"` : '->')
  const space = (): string => [' ', '', '  ', '\t'][pick(4)]!
  const ending = (): string => ['\n', '\r\n', '\r', '\n'][pick(4)]!
  const lines: string[] = []
  const used = new Set<number>()
  for (let i = 0; i < spec.edges.length; i++) {
    const [a, b] = spec.edges[i]!
    used.add(a).add(b)
    let line = `${space()}${mention(a)}${space()}${arrow()}${space()}${mention(b)}`
    // Continue as a chain when the next edge starts where this one ends.
    while (i + 1 < spec.edges.length && spec.edges[i + 1]![0] === spec.edges[i]![1] && pick(2) === 1) {
      i++
      const c = spec.edges[i]![1]
      used.add(c)
      line += `${space()}${arrow()}${space()}${mention(c)}`
    }
    if (pick(6) === 0) line += `${space()}# note -> ${i}`
    lines.push(line)
    if (pick(8) === 0) lines.push(pick(2) ? '' : '# comment')
  }
  for (let v = 0; v < spec.n; v++) {
    if (!used.has(v) || (spec.labels[v] !== undefined && !labelled.has(v))) lines.push(mention(v))
  }
  // Tiers now and then: a few vertices on named rows, in a random order (often against the edges).
  if (spec.n >= 2 && pick(6) === 0) {
    const tiers = 1 + pick(3)
    const rows: number[][] = Array.from({length: tiers}, () => [])
    for (let v = 0; v < spec.n; v++) if (pick(3) > 0) rows[pick(tiers)]!.push(v)
    rows.forEach((row, t) => {
      if (row.length > 0) lines.unshift(`tier t${t}${pick(2) ? ' "Row ' + t + '"' : ''}: ${row.map(id).join(', ')}`)
    })
  }
  let text = ''
  for (const line of lines) text += line + ending()
  if (pick(3) === 0) text = text.replace(/(\r\n|\r|\n)$/, '')
  return (bom ? '\ufeff' : '') + text
}

export const graphArb: fc.Arbitrary<FuzzInput & {spec: GraphSpec}> = fc
  .record({
    spec: graphSpecArb,
    choices: fc.array(fc.nat(1000), {minLength: 1, maxLength: 40}),
    bom: fc.boolean(),
    budgetTicks: budgetArb,
    flow: flowArb,
    limits: limitsArb
  })
  .map(({spec, choices, bom, limits, ...rest}) => ({kind: 'graph' as const, spec, text: printGraph(spec, choices, bom), ...rest, ...(limits ? {limits} : {})}))

const insertions = ['-', '>', '->', ',', '"', '\\', '#', '\n', '\r', ' ', '\t', 'x', 'é', '\u0301', '🍞', '\ud83c', '\ufeff', '\u00a0', '""', 'a -> b', '(', ')', '<', ':', '(new)', '<#x>', '<javascript:x>', 'tier t: ', '-> "e" ']

type Mutation = {at: number; kind: number; what: number; length: number}

export function mutate(text: string, mutations: readonly Mutation[]): string {
  let out = text
  for (const m of mutations) {
    const at = out.length === 0 ? 0 : m.at % (out.length + 1)
    switch (m.kind % 4) {
      case 0:
        out = out.slice(0, at) + insertions[m.what % insertions.length] + out.slice(at)
        break
      case 1:
        out = out.slice(0, at) + out.slice(at + 1 + (m.length % 4))
        break
      case 2:
        out = out.slice(0, at) + insertions[m.what % insertions.length] + out.slice(at + 1)
        break
      default: {
        const piece = out.slice(at, at + 1 + (m.length % 12))
        out = out.slice(0, at) + piece + piece + out.slice(at + piece.length)
      }
    }
  }
  return out
}

const mutationArb = fc.record({at: fc.nat(10_000), kind: fc.nat(3), what: fc.nat(100), length: fc.nat(20)})

export const mutatedArb: fc.Arbitrary<FuzzInput> = fc
  .record({base: graphArb, mutations: fc.array(mutationArb, {minLength: 1, maxLength: 4})})
  .map(({base, mutations}) => {
    const {spec: _spec, ...rest} = base
    return {...rest, kind: 'mutated' as const, text: mutate(base.text, mutations)}
  })
