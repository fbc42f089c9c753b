/**
 * The words a screen reader speaks for a diagram: how many vertices and edges, which way the arrows
 * point, then each vertex in order with what it points to. A label used by more than one vertex gets
 * the vertex's id in parentheses, so the listener can tell them apart.
 */
import {labelLines} from '@upright/core'

export type FlowWord = 'up' | 'down' | 'left' | 'right'

export interface DescribeInput {
  flow: FlowWord
  /** Vertices drawn, in the order to read them. */
  vertices: ReadonlyArray<number>
  /** Drawn edges as [tail, head], in the order to read them. */
  edges: ReadonlyArray<readonly [number, number]>
  labels: ReadonlyArray<string>
  ids?: ReadonlyArray<string> | undefined
  /** Per entry of `edges`: the edge's label, said after its head. */
  edgeLabels?: ReadonlyArray<string | undefined> | undefined
  /** Tiers in declared order (from where edges start), each with its caption and vertices. */
  tiers?: ReadonlyArray<{text: string; vertices: ReadonlyArray<number>}> | undefined
}

const TIER_START: Record<FlowWord, string> = {
  up: 'from the bottom',
  down: 'from the top',
  left: 'from the right',
  right: 'from the left'
}

const DIRECTION: Record<FlowWord, string> = {
  up: 'Arrows point upward.',
  down: 'Arrows point downward.',
  left: 'Arrows point to the left.',
  right: 'Arrows point to the right.'
}

function plural(count: number, one: string, many: string): string {
  return `${count} ${count === 1 ? one : many}`
}

/** "a", "a and b", "a, b and c". */
function list(items: ReadonlyArray<string>): string {
  if (items.length <= 1) return items.join('')
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`
}

/** A label as one spoken line. */
export function spokenLabel(label: string): string {
  return labelLines(label).filter((line) => line !== '').join(' ')
}

export function describeHierarchy(input: DescribeInput): string {
  const spoken = new Map<number, string>()
  const uses = new Map<string, number>()
  for (const v of input.vertices) {
    const text = spokenLabel(input.labels[v] ?? '') || (input.ids?.[v] ?? `vertex ${v + 1}`)
    spoken.set(v, text)
    uses.set(text, (uses.get(text) ?? 0) + 1)
  }
  const name = (v: number): string => {
    const text = spoken.get(v) ?? `vertex ${v + 1}`
    const id = input.ids?.[v]
    return (uses.get(text) ?? 0) > 1 && id !== undefined && id !== text ? `${text} (${id})` : text
  }

  const targets = new Map<number, string[]>()
  input.edges.forEach(([tail, head], i) => {
    const label = input.edgeLabels?.[i] === undefined ? '' : spokenLabel(input.edgeLabels[i]!)
    const said = label ? `${name(head)} (edge “${label}”)` : name(head)
    const list = targets.get(tail)
    if (list) list.push(said)
    else targets.set(tail, [said])
  })

  const sentences = [
    `${plural(input.vertices.length, 'vertex', 'vertices')} and ${plural(input.edges.length, 'edge', 'edges')}.`,
    DIRECTION[input.flow]
  ]
  if (input.tiers && input.tiers.length > 0) {
    const rows = input.tiers.map((tier) => `${spokenLabel(tier.text)}: ${tier.vertices.length > 0 ? list(tier.vertices.map(name)) : 'nothing'}`)
    sentences.push(`${plural(input.tiers.length, 'tier', 'tiers')}, ${TIER_START[input.flow]}: ${rows.join('; ')}.`)
  }
  for (const v of input.vertices) {
    const heads = targets.get(v)
    sentences.push(heads ? `${name(v)} points to ${list(heads)}.` : `${name(v)} points to nothing.`)
  }
  return sentences.join(' ')
}
