/**
 * Edge labels through the pipeline. Subdividing an edge never changes upward planarity (an upward
 * drawing of one graph gives one of the other: put the new vertex on the curve, or forget it — common
 * practice), so on random diagrams the status with labels must equal the status without. For passing
 * diagrams both embeddings checkDiagram returns (with label vertices, and joined back without them) are
 * drawn by the layout and checked by the independent geometric checker (test/support/geometry-check.ts).
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, type UpwardEmbedding, type Digraph} from '@upright/core'
import {stAugment} from '../src/augment/index.ts'
import {layoutUpward} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {prng} from './support/layout-st-generator.ts'

function drawable(graph: Digraph, upward: UpwardEmbedding): string[] {
  const boxes = Array.from({length: graph.vertexCount}, () => ({width: 40, height: 20}))
  const layout = layoutUpward({graph, st: stAugment(upward), boxes, flow: 'up'})
  const check = checkDrawing(graph, layout, {boxes})
  return check.ok ? [] : check.problems
}

describe('edge labels', () => {
  it('parses `a -> "reads" b` as a labelled edge and splits it at a label vertex', () => {
    const result = checkDiagram('api "Public API" -> "reads" ledger -> "archives" cold\napi -> cold')
    expect(result.status).toBe('upward')
    expect(result.parsed.edges.map((e) => e.label)).toEqual(['reads', 'archives', undefined])
    expect(result.parsed.vertices[0]!.label).toBe('Public API')
    const labels = result.labels!
    expect(labels.labelledEdges).toEqual([0, 1])
    // Vertices 3 and 4 are the label vertices of edges 0 and 1; edge 3 and 4 are their second halves.
    expect(labels.graph.vertexCount).toBe(5)
    expect(Array.from(labels.graph.tail)).toEqual([0, 1, 0, 3, 4])
    expect(Array.from(labels.graph.head)).toEqual([3, 4, 2, 1, 2])
    expect(drawable(labels.graph, labels.upward!)).toEqual([])
    expect(drawable(result.graph!, result.upward!)).toEqual([])
  })

  it('a label on a list arrow labels every edge of it', () => {
    const result = checkDiagram('till, kiosk -> "posts" orders, returns')
    expect(result.parsed.edges.map((e) => e.label)).toEqual(['posts', 'posts', 'posts', 'posts'])
    expect(result.labels!.labelledEdges).toEqual([0, 1, 2, 3])
  })

  it('random diagrams: same status with and without labels; both embeddings draw cleanly', () => {
    const random = prng(31337)
    let upward = 0
    for (let round = 0; round < 150; round++) {
      const n = 2 + Math.floor(random() * 9)
      const lines: string[] = []
      const plain: string[] = []
      for (let u = 0; u < n; u++) {
        for (let w = u + 1; w < n; w++) {
          if (random() > 0.35) continue
          const label = random() < 0.5 ? ` "e${u}${w}"` : ''
          lines.push(`v${u} ->${label} v${w}`)
          plain.push(`v${u} -> v${w}`)
        }
      }
      if (lines.length === 0) continue
      const withLabels = checkDiagram(lines.join('\n'), {budgetMillis: 20_000})
      const without = checkDiagram(plain.join('\n'), {budgetMillis: 20_000})
      expect(withLabels.status, lines.join('; ')).toBe(without.status)
      if (withLabels.status !== 'upward') continue
      upward++
      if (withLabels.labels) expect(drawable(withLabels.labels.graph, withLabels.labels.upward!)).toEqual([])
      expect(drawable(withLabels.graph!, withLabels.upward!)).toEqual([])
    }
    expect(upward).toBeGreaterThan(50)
  })
})
