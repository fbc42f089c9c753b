/**
 * Written order as a tie-break (check/written-order.ts): the mirror image of an upward embedding is
 * again one (reflecting a drawing keeps it upward and crossing-free — common practice), checked by
 * drawing both with the layout and the independent geometric checker; `preferWrittenOrder` never
 * scores worse than the embedding found, and keeps `a -> b, c` with b left of c.
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, type Digraph, type UpwardEmbedding} from '@upright/core'
import {stAugment} from '../src/augment/index.ts'
import {mirrorUpwardEmbedding, outEdgesLeftToRight, writtenOrderScore} from '../src/check/written-order.ts'
import {layoutUpward} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {prng} from './support/layout-st-generator.ts'

function drawable(graph: Digraph, upward: UpwardEmbedding): string[] {
  const boxes = Array.from({length: graph.vertexCount}, () => ({width: 40, height: 20}))
  const layout = layoutUpward({graph, st: stAugment(upward), boxes, flow: 'up'})
  const check = checkDrawing(graph, layout, {boxes})
  return check.ok ? [] : check.problems
}

/** Left-to-right x order of each vertex's out-edge heads in an actual layout. */
function drawnOrder(graph: Digraph, upward: UpwardEmbedding, v: number): number[] {
  const boxes = Array.from({length: graph.vertexCount}, () => ({width: 40, height: 20}))
  const layout = layoutUpward({graph, st: stAugment(upward), boxes, flow: 'up'})
  const out: number[] = []
  for (let e = 0; e < graph.edgeCount; e++) if (graph.tail[e] === v) out.push(e)
  // The first bend (or end) of each edge after leaving v orders them left to right.
  return out.sort((a, b) => layout.edges[a]!.points[1]![0] - layout.edges[b]!.points[1]![0])
}

describe('written order', () => {
  it('mirror images draw cleanly, and score the negative', () => {
    const random = prng(2718)
    let tried = 0
    for (let round = 0; round < 120; round++) {
      const n = 2 + Math.floor(random() * 9)
      const lines: string[] = []
      for (let u = 0; u < n; u++) for (let w = u + 1; w < n; w++) if (random() < 0.35) lines.push(`v${u} -> v${w}`)
      if (lines.length === 0) continue
      const result = checkDiagram(lines.join('\n'), {budgetMillis: 20_000})
      if (result.status !== 'upward') continue
      tried++
      const mirrored = mirrorUpwardEmbedding(result.upward!)
      expect(drawable(result.graph!, mirrored)).toEqual([])
      expect(writtenOrderScore(mirrored) + writtenOrderScore(result.upward!)).toBe(0)
      const preferred = checkDiagram(lines.join('\n'), {budgetMillis: 20_000, preferWrittenOrder: true})
      expect(writtenOrderScore(preferred.upward!)).toBeGreaterThanOrEqual(Math.abs(writtenOrderScore(result.upward!)))
      expect(drawable(preferred.graph!, preferred.upward!)).toEqual([])
    }
    expect(tried).toBeGreaterThan(50)
  })

  it('reads the left-to-right order the layout draws', () => {
    const result = checkDiagram('a -> b, c, d\nb, c, d -> e', {preferWrittenOrder: true})
    const up = result.upward!
    const order = outEdgesLeftToRight(up)[0]!
    expect(drawnOrder(result.graph!, up, 0)).toEqual(order)
    expect(order).toEqual([0, 1, 2])
    const mirrored = mirrorUpwardEmbedding(up)
    expect(outEdgesLeftToRight(mirrored)[0]).toEqual([2, 1, 0])
    expect(drawnOrder(result.graph!, mirrored, 0)).toEqual([2, 1, 0])
  })
})
