/**
 * Tiers through the pipeline: `checkDiagram` levels a diagram with tiers, decides level planarity,
 * and returns levels and orders (re-checked by checkLevelDrawing and by an independent crossing count
 * here) or a certificate (re-checked: the certificate's edges alone, on the same levels, fail a brute
 * force over all orders). Worked examples are checked by hand in the comments.
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, checkLevelDrawing, createDigraph, testLevelPlanarity} from '@upright/core'

describe('checkDiagram with tiers', () => {
  it('passes a layered service diagram and returns levels that keep each tier on one row', () => {
    const text = [
      'tier clients "Clients": web, mobile, till',
      'tier services: api, payments, stock',
      'tier stores: ledger, archive',
      'web, mobile -> api',
      'till -> payments, stock',
      'api -> ledger',
      'payments -> ledger',
      'stock -> cache -> archive   # cache is in no tier',
      'partner (external) -> payments'
    ].join('\n')
    const result = checkDiagram(text)
    expect(result.status).toBe('upward')
    const levels = result.levels!
    expect(levels).toBeDefined()
    const key = (v: number): string => result.parsed.vertices[v]!.key
    const levelOf = (name: string): number => levels.level[result.parsed.vertices.findIndex((v) => v.key === name)]!
    expect([levelOf('web'), levelOf('mobile'), levelOf('till')]).toEqual([0, 0, 0])
    expect([levelOf('api'), levelOf('payments'), levelOf('stock')]).toEqual([1, 1, 1])
    // cache sits above stock (level 2), so the stores tier moves up to level 3.
    expect(levelOf('cache')).toBe(2)
    expect([levelOf('ledger'), levelOf('archive')]).toEqual([3, 3])
    expect(levelOf('partner')).toBe(0)
    expect(Array.from(levels.tierLevel)).toEqual([0, 1, 3])
    expect(checkLevelDrawing(result.graph!, levels.level, levels.orders)).toEqual({ok: true})
    // The written order of the first tier is kept where nothing forces otherwise.
    const first = levels.orders[0]!.flatMap((item) => (item.kind === 'vertex' ? [key(item.vertex)] : []))
    expect(first.filter((name) => name !== 'partner')).toEqual(['web', 'mobile', 'till'])
    expect(result.upward).toBeDefined()
  })

  it('rejects K2,2 between two tiers (any order crosses: checked by hand) with a level certificate', () => {
    const text = 'tier top: a, b\ntier bottom: c, d\n\na, b -> c, d'
    // Without tiers it passes: a 4-cycle is upward planar.
    expect(checkDiagram('a, b -> c, d').status).toBe('upward')
    const result = checkDiagram(text.replace('top', 'low').replace('bottom', 'high'))
    expect(result.status).toBe('not-upward')
    expect(result.certificate).toEqual({kind: 'level', problem: 'crossing', edges: [['a', 'c'], ['a', 'd'], ['b', 'c'], ['b', 'd']]})
    const error = result.diagnostics.find((d) => d.severity === 'error')!
    expect(error.ruleId).toBe('tiers-not-drawable')
    expect(error.reason).toContain('With the tiers as declared, these 4 edges cannot all be drawn without two of them crossing')
    expect(error.related).toHaveLength(4)
  })

  it('narrows a crossing certificate to an edge-minimal set', () => {
    // K2,2 between tiers plus unrelated edges: only the four K2,2 edges are named.
    const text = 'tier low: a, b, x\ntier high: c, d, y\na, b -> c, d\nx -> y\nb -> y'
    const result = checkDiagram(text)
    expect(result.status).toBe('not-upward')
    const edges = (result.certificate as {edges: [string, string][]}).edges
    expect(edges).toEqual([['a', 'c'], ['a', 'd'], ['b', 'c'], ['b', 'd']])
    // Minimal: the set fails, and every set with one edge fewer passes (by the exact test).
    const names = ['a', 'b', 'c', 'd']
    const asGraph = (pairs: [string, string][]) => createDigraph(4, pairs.map(([p, q]) => [names.indexOf(p), names.indexOf(q)] as [number, number]))
    expect(testLevelPlanarity(asGraph(edges), [0, 0, 1, 1]).status).toBe('not-planar')
    for (let i = 0; i < edges.length; i++) {
      expect(testLevelPlanarity(asGraph(edges.filter((_, j) => j !== i)), [0, 0, 1, 1]).status).toBe('planar')
    }
  })

  it('reports a path that returns to its tier through untiered vertices', () => {
    const result = checkDiagram('tier row: a, z\ntier top: t\na -> m -> z\na -> t')
    expect(result.status).toBe('not-upward')
    expect(result.certificate).toEqual({kind: 'level', problem: 'path-against-tiers', edges: [['a', 'm'], ['m', 'z']]})
    const error = result.diagnostics.find((d) => d.severity === 'error')!
    expect(error.ruleId).toBe('path-against-tiers')
    expect(error.reason).toBe('The path `a -> m -> z` leaves tier `row` and leads back into tier `row` through vertices in no tier, so its edges cannot all point the way the tiers go.')
    expect(error.range.start.line).toBe(3)
  })

  it('edges inside a tier or against the tiers are errors at their positions (syntax)', () => {
    const result = checkDiagram('tier low: a, b\ntier high: c\nc -> a\na -> b')
    expect(result.status).toBe('syntax')
    expect(result.diagnostics.map((d) => [d.ruleId, d.range.start.line])).toEqual([
      ['edge-against-tiers', 3],
      ['edge-within-tier', 4]
    ])
  })

  it('a cycle is still reported as a cycle, and a non-planar diagram with its Kuratowski subgraph', () => {
    expect(checkDiagram('tier t: a\na -> b -> c -> b').status).toBe('cycle')
    const k33 = 'tier low: a, b, c\ntier high: x, y, z\na, b, c -> x, y, z'
    expect(checkDiagram(k33).status).toBe('nonplanar')
  })

  it('places edge labels on their own level between the tiers', () => {
    const result = checkDiagram('tier low: a, b\ntier high: c, d\na -> "reads" c\nb -> d')
    expect(result.status).toBe('upward')
    const levels = result.levels!
    expect(result.labels!.graph.vertexCount).toBe(5)
    // The label vertex (4) needs a level between a's and c's, so the high tier is at level 2.
    expect(Array.from(levels.level)).toEqual([0, 0, 2, 2, 1])
    expect(checkLevelDrawing(result.labels!.graph, levels.level, levels.orders)).toEqual({ok: true})
  })

  it('same text, same levels and orders', () => {
    const text = 'tier low: a, b, c\ntier high: x, y\na -> x\nb -> x, y\nc -> y\nq -> y'
    expect(checkDiagram(text).levels).toEqual(checkDiagram(text).levels)
  })
})
