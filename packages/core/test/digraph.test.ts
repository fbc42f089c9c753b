import {describe, expect, it} from 'vitest'
import {createDigraph, edgePairs, inDegree, outDegree, traceFaces} from '@upright/core'

describe('createDigraph', () => {
  it('keeps edge order in adjacency lists', () => {
    const g = createDigraph(3, [[0, 1], [0, 2], [1, 2]])
    expect(outDegree(g, 0)).toBe(2)
    expect(inDegree(g, 2)).toBe(2)
    expect([...g.outEdges.subarray(g.outStart[0], g.outStart[1])]).toEqual([0, 1])
    expect(edgePairs(g)).toEqual([[0, 1], [0, 2], [1, 2]])
  })

  it('rejects an endpoint out of range', () => {
    expect(() => createDigraph(2, [[0, 2]])).toThrow(RangeError)
  })
})

describe('traceFaces', () => {
  it('finds V - E + F = 2 faces on a triangle and 1 on a path (Euler)', () => {
    const tri = createDigraph(3, [[0, 1], [1, 2], [0, 2]])
    const rotation = [Int32Array.of(0, 2), Int32Array.of(1, 0), Int32Array.of(2, 1)]
    expect(traceFaces({graph: tri, rotation}).darts.length).toBe(2)
    const path = createDigraph(3, [[0, 1], [1, 2]])
    const faces = traceFaces({graph: path, rotation: [Int32Array.of(0), Int32Array.of(0, 1), Int32Array.of(1)]})
    expect(faces.darts.length).toBe(1)
    expect(faces.darts[0]!.length).toBe(4)
  })
})
