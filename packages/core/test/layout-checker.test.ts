import {describe, expect, it} from 'vitest'
import {createDigraph} from '../src/graph/digraph.ts'
import {layoutUpward, type Layout} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {prng, randomBoxes, randomLayoutCase} from './support/layout-st-generator.ts'

/** The checker must reject broken drawings, or a passing layout test would mean nothing. */

const clone = (l: Layout): Layout => JSON.parse(JSON.stringify(l)) as Layout
const problemsOf = (r: ReturnType<typeof checkDrawing>): string[] => (r.ok ? [] : r.problems)

// Two boxes at the bottom (0 left, 1 right) and two at the top (2 left, 3 right), flow up.
function square(edges: Array<[number, number]>, points: Array<Array<[number, number]>>): Layout {
  return {
    flow: 'up',
    width: 100,
    height: 120,
    nodes: [
      {vertex: 0, x: 20, y: 110, width: 40, height: 20},
      {vertex: 1, x: 80, y: 110, width: 40, height: 20},
      {vertex: 2, x: 20, y: 10, width: 40, height: 20},
      {vertex: 3, x: 80, y: 10, width: 40, height: 20},
    ],
    edges: edges.map((_, e) => ({edge: e, points: points[e]!})),
  }
}

describe('hand-made drawings', () => {
  it('accepts two parallel edges and rejects the same edges crossed', () => {
    const straight = createDigraph(4, [[0, 2], [1, 3]])
    const ok = square([[0, 2], [1, 3]], [[[20, 100], [20, 20]], [[80, 100], [80, 20]]])
    expect(checkDrawing(straight, ok)).toEqual({ok: true})
    const crossed = createDigraph(4, [[0, 3], [1, 2]])
    const bad = square([[0, 3], [1, 2]], [[[20, 100], [80, 20]], [[80, 100], [20, 20]]])
    expect(problemsOf(checkDrawing(crossed, bad)).join('\n')).toMatch(/edges 0 and 1 meet/)
  })

  it('rejects two edges that touch without crossing', () => {
    const g = createDigraph(4, [[0, 2], [1, 3]])
    // Edge 1 bends left until it touches edge 0's vertical segment at (20, 60).
    const touch = square([[0, 2], [1, 3]], [[[20, 100], [20, 20]], [[80, 100], [20, 60], [80, 20]]])
    expect(problemsOf(checkDrawing(g, touch)).join('\n')).toMatch(/edges 0 and 1 meet/)
  })

  it('allows a port shared by two edges into the same vertex, but not a shared segment', () => {
    const g = createDigraph(4, [[0, 2], [1, 2]])
    const shared = square([[0, 2], [1, 2]], [[[20, 100], [20, 20]], [[80, 100], [20, 20]]])
    expect(checkDrawing(g, shared)).toEqual({ok: true})
    const overlapping = square([[0, 2], [1, 2]], [[[20, 100], [20, 20]], [[80, 100], [20, 40], [20, 20]]])
    expect(problemsOf(checkDrawing(g, overlapping)).join('\n')).toMatch(/edges 0 and 1 meet/)
  })

  it('rejects a downward segment', () => {
    const g = createDigraph(4, [[0, 2]])
    const zigzag = square([[0, 2]], [[[20, 100], [10, 50], [10, 60], [20, 20]]])
    expect(problemsOf(checkDrawing(g, zigzag)).join('\n')).toMatch(/segment 1 does not point up/)
    // A horizontal segment is not upward either.
    const flat = square([[0, 2]], [[[20, 100], [10, 50], [12, 50], [20, 20]]])
    expect(problemsOf(checkDrawing(g, flat)).join('\n')).toMatch(/does not point up/)
  })

  it('rejects an edge drawn against the flow as a whole', () => {
    const g = createDigraph(4, [[2, 0]])
    const down = square([[2, 0]], [[[20, 20], [20, 100]]])
    const problems = problemsOf(checkDrawing(g, down)).join('\n')
    expect(problems).toMatch(/does not point up/)
    expect(problems).toMatch(/first point .* not on the top side/)
  })

  it('rejects overlapping and touching boxes', () => {
    const g = createDigraph(4, [])
    const l = square([], [])
    expect(checkDrawing(g, l)).toEqual({ok: true})
    l.nodes[1]!.x = 55 // 0 spans 0..40, 1 now 35..75
    expect(problemsOf(checkDrawing(g, l)).join('\n')).toMatch(/boxes of vertices 0 and 1 overlap/)
    l.nodes[1]!.x = 60 // touching at x = 40
    expect(problemsOf(checkDrawing(g, l)).join('\n')).toMatch(/boxes of vertices 0 and 1 overlap or touch/)
  })

  it('rejects an edge through a third box, and an edge re-entering its own box', () => {
    const g = createDigraph(5, [[0, 2]])
    const l = square([[0, 2]], [[[20, 100], [20, 20]]])
    l.nodes.push({vertex: 4, x: 20, y: 60, width: 10, height: 10})
    expect(problemsOf(checkDrawing(g, l)).join('\n')).toMatch(/edge 0 \(segment 0\) meets the box of vertex 4/)
    const g2 = createDigraph(4, [[0, 3]])
    const hook = square([[0, 3]], [[[20, 100], [30, 90], [90, 95 - 10], [80, 20]]])
    // (30, 90) is above box 0 (y 100..120), fine; make the edge dip into box 1 (70..90 x, 100..120 y)
    hook.edges[0]!.points = [[20, 100], [75, 99], [80, 20]]
    expect(checkDrawing(g2, hook)).toEqual({ok: true})
    hook.edges[0]!.points = [[20, 100], [40, 100], [80, 20]] // runs along its own box's top side
    expect(problemsOf(checkDrawing(g2, hook)).join('\n')).toMatch(/does not point up/)
  })

  it('rejects ends off their sides, a missing edge and a box smaller than its label', () => {
    const g = createDigraph(4, [[0, 2], [1, 3]])
    const l = square([[0, 2], [1, 3]], [[[20, 101], [20, 20]], [[80, 100], [80, 20]]])
    expect(problemsOf(checkDrawing(g, l)).join('\n')).toMatch(/edge 0: first point .* not on the top side/)
    const missing = square([[0, 2]], [[[20, 100], [20, 20]]])
    expect(problemsOf(checkDrawing(g, missing)).join('\n')).toMatch(/edge 1 is not drawn/)
    const ok = square([[0, 2], [1, 3]], [[[20, 100], [20, 20]], [[80, 100], [80, 20]]])
    const boxes = [{width: 41, height: 20}, {width: 40, height: 20}, {width: 40, height: 20}, {width: 40, height: 20}]
    expect(problemsOf(checkDrawing(g, ok, {boxes})).join('\n')).toMatch(/vertex 0: box 40x20 smaller than its label box 41x20/)
  })
})

describe('mutations of real layouts', () => {
  const cases = Array.from({length: 20}, (_, i) => {
    const c = randomLayoutCase(500 + i, 40 + 5 * i)
    const boxes = randomBoxes(prng(i), c.graph.vertexCount)
    return {c, boxes, layout: layoutUpward({graph: c.graph, st: c.st, boxes, flow: i % 2 === 0 ? 'up' : 'right'})}
  })

  it('every unmutated layout passes', () => {
    for (const {c, boxes, layout} of cases) expect(checkDrawing(c.graph, layout, {boxes})).toEqual({ok: true})
  })

  it('a crossing: one edge detoured through a point on another edge', () => {
    let caught = 0
    for (const {c, layout} of cases) {
      // Two edges with different tails; detour the first past the middle of the second's first
      // segment.
      const l = clone(layout)
      const [e0, e1] = l.edges.filter((e) => e.points.length >= 2).slice(0, 2)
      if (!e0 || !e1 || c.graph.tail[e0.edge] === c.graph.tail[e1.edge]) continue
      const p = e1.points[0]!
      const q = e1.points[1]!
      const mid: [number, number] = [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2]
      // Aim from e0's start past the middle of e1's first segment, so the detour crosses it properly.
      const s0 = e0.points[0]!
      const beyond: [number, number] = [mid[0] + (mid[0] - s0[0]) * 0.25, mid[1] + (mid[1] - s0[1]) * 0.25]
      e0.points.splice(1, 0, beyond)
      const problems = problemsOf(checkDrawing(c.graph, l, {maxProblems: 10000})).join('\n')
      expect(problems).toMatch(new RegExp(`edges (${e0.edge} and ${e1.edge}|${e1.edge} and ${e0.edge}) meet`))
      caught++
    }
    expect(caught).toBeGreaterThan(5)
  })

  it('a downward edge: an edge reversed', () => {
    for (const {c, layout} of cases) {
      const l = clone(layout)
      if (l.edges.length === 0) continue
      l.edges[0]!.points.reverse()
      expect(problemsOf(checkDrawing(c.graph, l)).join('\n')).toMatch(/edge 0: segment \d+ does not point (up|right)/)
    }
  })

  it('a box overlap: one box moved onto another', () => {
    for (const {c, layout} of cases) {
      if (layout.nodes.length < 2) continue
      const l = clone(layout)
      l.nodes[1]!.x = l.nodes[0]!.x + 1
      l.nodes[1]!.y = l.nodes[0]!.y + 1
      expect(problemsOf(checkDrawing(c.graph, l, {maxProblems: 1000})).join('\n')).toMatch(/boxes of vertices 0 and 1 overlap/)
    }
  })

  it('a box widened over its neighbours is caught', () => {
    let caught = 0
    for (const {c, layout} of cases) {
      const l = clone(layout)
      const node = l.nodes[0]!
      node.width += 2 * l.width // now spans the whole drawing across
      if (c.graph.vertexCount < 2) continue
      const r = checkDrawing(c.graph, l, {maxProblems: 1000})
      expect(r.ok).toBe(false)
      caught++
    }
    expect(caught).toBeGreaterThan(0)
  })
})
