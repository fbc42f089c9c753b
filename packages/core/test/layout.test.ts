import {describe, expect, it} from 'vitest'
import {createDigraph} from '../src/graph/digraph.ts'
import {traceFaces} from '../src/embedding/rotation-system.ts'
import {layoutUpward, layoutStats, type Flow, type Layout} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {
  caseFromEmbedded,
  embeddedSt,
  prng,
  randomBoxes,
  randomLayoutCase,
  type EmbeddedSt,
  type LayoutCase,
} from './support/layout-st-generator.ts'

const flows: Flow[] = ['up', 'down', 'left', 'right']

/**
 * Named small graphs, each drawn by hand as an embedded planar st-graph H (out- and in-edges per
 * vertex, left to right) with the vertices and edges of G marked; the rest is augmentation.
 */
interface Named {
  name: string
  h: EmbeddedSt
  gVertices: number
  gEdges: number[]
}

const catalogue: Named[] = [
  // a
  {name: 'single vertex', h: embeddedSt(1, [], [[]], [[]], 0, 0), gVertices: 1, gEdges: []},
  // a b c, joined by s (3) below and t (4) above
  {
    name: 'three isolated vertices',
    h: embeddedSt(5, [[3, 0], [3, 1], [3, 2], [0, 4], [1, 4], [2, 4]], [[3], [4], [5], [0, 1, 2], []], [[0], [1], [2], [], [3, 4, 5]], 3, 4),
    gVertices: 3,
    gEdges: [],
  },
  // 0 -> 1 -> 2
  {name: 'path', h: embeddedSt(3, [[0, 1], [1, 2]], [[0], [1], []], [[], [0], [1]], 0, 2), gVertices: 3, gEdges: [0, 1]},
  //   3
  //  1 2
  //   0
  {
    name: 'diamond',
    h: embeddedSt(4, [[0, 1], [0, 2], [1, 3], [2, 3]], [[0, 1], [2], [3], []], [[], [0], [1], [2, 3]], 0, 3),
    gVertices: 4,
    gEdges: [0, 1, 2, 3],
  },
  // out-tree 0 -> {1, 2}, 1 -> {3, 4}; t = 5 added above the leaves
  {
    name: 'out-tree',
    h: embeddedSt(6, [[0, 1], [0, 2], [1, 3], [1, 4], [3, 5], [4, 5], [2, 5]], [[0, 1], [2, 3], [6], [4], [5], []], [[], [0], [1], [2], [3], [4, 5, 6]], 0, 5),
    gVertices: 5,
    gEdges: [0, 1, 2, 3],
  },
  // in-tree {0, 1, 2} -> 3 -> 4; s = 5 added below the leaves
  {
    name: 'in-tree',
    h: embeddedSt(6, [[0, 3], [1, 3], [2, 3], [3, 4], [5, 0], [5, 1], [5, 2]], [[0], [1], [2], [3], [], [4, 5, 6]], [[4], [5], [6], [0, 1, 2], [3], []], 5, 4),
    gVertices: 5,
    gEdges: [0, 1, 2, 3],
  },
  // K_{2,3}: 0 -> {1, 2, 3} -> 4
  {
    name: 'K2,3 st-graph',
    h: embeddedSt(5, [[0, 1], [0, 2], [0, 3], [1, 4], [2, 4], [3, 4]], [[0, 1, 2], [3], [4], [5], []], [[], [0], [1], [2], [3, 4, 5]], 0, 4),
    gVertices: 5,
    gEdges: [0, 1, 2, 3, 4, 5],
  },
  // K_{2,3} plus the edge 0 -> 4 on the right
  {
    name: 'K2,3 with source-sink edge',
    h: embeddedSt(5, [[0, 1], [0, 2], [0, 3], [1, 4], [2, 4], [3, 4], [0, 4]], [[0, 1, 2, 6], [3], [4], [5], []], [[], [0], [1], [2], [3, 4, 5, 6]], 0, 4),
    gVertices: 5,
    gEdges: [0, 1, 2, 3, 4, 5, 6],
  },
  // two diamonds 0..3 and 4..7 side by side, s = 8, t = 9 added
  {
    name: 'two diamonds',
    h: embeddedSt(
      10,
      [[0, 1], [0, 2], [1, 3], [2, 3], [4, 5], [4, 6], [5, 7], [6, 7], [8, 0], [8, 4], [3, 9], [7, 9]],
      [[0, 1], [2], [3], [10], [4, 5], [6], [7], [11], [8, 9], []],
      [[8], [0], [1], [2, 3], [9], [4], [5], [6, 7], [], [10, 11]],
      8,
      9
    ),
    gVertices: 8,
    gEdges: [0, 1, 2, 3, 4, 5, 6, 7],
  },
  // 0 -> 1 -> 2 -> 3 -> 4 and a long edge 0 -> 4 on the right
  {
    name: 'long edge',
    h: embeddedSt(5, [[0, 1], [1, 2], [2, 3], [3, 4], [0, 4]], [[0, 4], [1], [2], [3], []], [[], [0], [1], [2], [3, 4]], 0, 4),
    gVertices: 5,
    gEdges: [0, 1, 2, 3, 4],
  },
  // a -> b and an isolated c; s = 3, t = 4 added
  {
    name: 'edge and isolated vertex',
    h: embeddedSt(5, [[0, 1], [3, 0], [3, 2], [1, 4], [2, 4]], [[0], [3], [4], [1, 2], []], [[1], [0], [2], [], [3, 4]], 3, 4),
    gVertices: 3,
    gEdges: [0],
  },
  // transitive tournament on 4 vertices: 0 bottom, 1 left, 2 above 1, 3 top, 0 -> 3 round the right
  {
    name: 'transitive tournament 4',
    h: embeddedSt(4, [[0, 1], [0, 2], [0, 3], [1, 2], [1, 3], [2, 3]], [[0, 1, 2], [4, 3], [5], []], [[], [0], [3, 1], [4, 5, 2]], 0, 3),
    gVertices: 4,
    gEdges: [0, 1, 2, 3, 4, 5],
  },
  // two parallel edges 0 -> 1 and a third edge 0 -> 1 -> 2 beside them
  {
    name: 'parallel edges',
    h: embeddedSt(3, [[0, 1], [0, 1], [1, 2], [0, 2]], [[0, 1, 3], [2], []], [[], [0, 1], [2, 3]], 0, 2),
    gVertices: 3,
    gEdges: [0, 1, 2, 3],
  },
  // a wide fan 0 -> {1..8} -> 9
  {
    name: 'fan of eight',
    h: embeddedSt(
      10,
      [...Array.from({length: 8}, (_, i): [number, number] => [0, i + 1]), ...Array.from({length: 8}, (_, i): [number, number] => [i + 1, 9])],
      [[0, 1, 2, 3, 4, 5, 6, 7], ...Array.from({length: 8}, (_, i) => [8 + i]), []],
      [[], ...Array.from({length: 8}, (_, i) => [i]), [8, 9, 10, 11, 12, 13, 14, 15]],
      0,
      9
    ),
    gVertices: 10,
    gEdges: Array.from({length: 16}, (_, i) => i),
  },
]

function catalogueCase(c: Named): LayoutCase {
  const keepV = Array.from({length: c.h.vertexCount}, (_, v) => v < c.gVertices)
  const keepE = c.h.tail.map((_, e) => c.gEdges.includes(e))
  return caseFromEmbedded(c.h, keepV, keepE)
}

describe('catalogue', () => {
  for (const c of catalogue) {
    it(`${c.name}: the hand-drawn embedding is a planar st-graph (Euler: faces = m - n + 2)`, () => {
      const {st} = catalogueCase(c)
      const faces = traceFaces(st.embedding)
      const h = st.graph
      if (h.edgeCount > 0) expect(faces.darts.length).toBe(h.edgeCount - h.vertexCount + 2)
    })
    for (const flow of flows) {
      it(`${c.name}, flow ${flow}: passes the geometric check`, () => {
        const {graph, st} = catalogueCase(c)
        const boxes = randomBoxes(prng(graph.vertexCount * 31 + 7), graph.vertexCount)
        const layout = layoutUpward({graph, st, boxes, flow})
        expect(checkDrawing(graph, layout, {boxes})).toEqual({ok: true})
        expect(layout.nodes).toHaveLength(graph.vertexCount)
        expect(layout.edges.map((e) => e.edge)).toEqual(Array.from({length: graph.edgeCount}, (_, i) => i))
        expect(layoutStats(layout).crossings).toBe(0)
      })
    }
  }

  it('long edge: drawn straight when its bends line up, so the path and the long edge share no point', () => {
    const c = catalogueCase(catalogue.find((x) => x.name === 'long edge')!)
    const boxes = Array.from({length: 5}, () => ({width: 40, height: 24}))
    const layout = layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up'})
    expect(checkDrawing(c.graph, layout)).toEqual({ok: true})
    // The long edge 0 -> 4 passes three layers on the right of the path.
    const long = layout.edges[4]!
    for (const [x] of long.points.slice(1, -1)) expect(x).toBeGreaterThan(layout.nodes[2]!.x + 20)
  })

  it('diamond, up: source at the bottom, sink at the top, 1 left of 2 as embedded', () => {
    const c = catalogueCase(catalogue.find((x) => x.name === 'diamond')!)
    const boxes = Array.from({length: 4}, () => ({width: 50, height: 20}))
    const up = layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up'})
    const [s, a, b, t] = up.nodes
    expect(s!.y).toBeGreaterThan(a!.y)
    expect(a!.y).toBeGreaterThan(t!.y)
    expect(a!.x).toBeLessThan(b!.x)
    const right = layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'right'})
    expect(right.nodes[0]!.x).toBeLessThan(right.nodes[3]!.x)
    expect(right.nodes[1]!.y).toBeLessThan(right.nodes[2]!.y)
  })

  it('empty graph: empty drawing', () => {
    const g = createDigraph(0, [])
    const layout = layoutUpward({
      graph: g,
      st: {
        graph: g,
        embedding: {graph: g, rotation: []},
        faces: {faceOfDart: new Int32Array(0), darts: []},
        outerFace: -1,
        source: -1,
        sink: -1,
        addedEdges: [],
        addedVertices: [],
      },
      boxes: [],
      flow: 'up',
    })
    expect(layout).toEqual({flow: 'up', width: 0, height: 0, nodes: [], edges: []})
  })
})

/** Apply (x, y) -> f(x, y) to a layout's nodes and points. */
function mapLayout(layout: Layout, f: (x: number, y: number) => [number, number]): {nodes: number[][]; edges: number[][][]} {
  return {
    nodes: layout.nodes.map((n) => f(n.x, n.y)),
    edges: layout.edges.map((e) => e.points.map(([x, y]) => f(x, y))),
  }
}

function expectClose(a: {nodes: number[][]; edges: number[][][]}, b: {nodes: number[][]; edges: number[][][]}): void {
  const flat = (v: {nodes: number[][]; edges: number[][][]}): number[] => [...v.nodes.flat(), ...v.edges.flat(2)]
  const fa = flat(a)
  const fb = flat(b)
  expect(fa.length).toBe(fb.length)
  for (let i = 0; i < fa.length; i++) expect(Math.abs(fa[i]! - fb[i]!)).toBeLessThan(1e-6)
}

describe('flows are rotations and mirrors of up', () => {
  for (let seed = 1; seed <= 12; seed++) {
    it(`seed ${seed}`, () => {
      const c = randomLayoutCase(seed, 5 + seed * 6)
      const rand = prng(seed)
      // Any boxes for the mirrors; square boxes for the quarter turn (a turn swaps width and height).
      const boxes = randomBoxes(rand, c.graph.vertexCount)
      const squares = boxes.map((b) => ({width: b.width, height: b.width}))
      const at = (flow: Flow, bx = boxes): Layout => layoutUpward({graph: c.graph, st: c.st, boxes: bx, flow})
      const up = at('up')
      const down = at('down')
      expect([down.width, down.height]).toEqual([up.width, up.height])
      // down: mirror top to bottom
      expectClose(mapLayout(down, (x, y) => [x, y]), mapLayout(up, (x, y) => [x, up.height - y]))
      // left: mirror of right, left to right
      const right = at('right')
      const left = at('left')
      expectClose(mapLayout(left, (x, y) => [x, y]), mapLayout(right, (x, y) => [right.width - x, y]))
      // right: up turned a quarter clockwise: (x, y) -> (height - y, x)
      const upSq = at('up', squares)
      const rightSq = at('right', squares)
      expect(rightSq.width).toBeCloseTo(upSq.height, 6)
      expectClose(mapLayout(rightSq, (x, y) => [x, y]), mapLayout(upSq, (x, y) => [upSq.height - y, x]))
    })
  }
})

describe('determinism and inputs', () => {
  it('same input, same output', () => {
    const c = randomLayoutCase(77, 120)
    const boxes = randomBoxes(prng(1), c.graph.vertexCount)
    const a = JSON.stringify(layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up'}))
    const b = JSON.stringify(layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up'}))
    expect(a).toBe(b)
  })

  it('spacing changes the gaps and the check still passes', () => {
    const c = randomLayoutCase(5, 60)
    const boxes = randomBoxes(prng(2), c.graph.vertexCount)
    const tight = layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up', spacing: {layer: 10, node: 4, edge: 2}})
    const loose = layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up', spacing: {layer: 80}})
    expect(checkDrawing(c.graph, tight, {boxes})).toEqual({ok: true})
    expect(checkDrawing(c.graph, loose, {boxes})).toEqual({ok: true})
    expect(loose.height).toBeGreaterThan(tight.height)
    const zero = layoutUpward({graph: c.graph, st: c.st, boxes, flow: 'up', spacing: {layer: 0, node: 0, edge: 0}})
    expect(checkDrawing(c.graph, zero, {boxes})).toEqual({ok: true})
  })

  it('rejects an augmentation whose first edges are not the graph\'s', () => {
    const c = randomLayoutCase(3, 20)
    const other = createDigraph(c.graph.vertexCount, [[1, 0]])
    expect(() => layoutUpward({graph: other, st: c.st, boxes: randomBoxes(prng(1), c.graph.vertexCount), flow: 'up'})).toThrow(/differs/)
  })
})

describe('layoutStats', () => {
  it('counts crossings like a brute-force proper-intersection count on a deliberately broken layout', () => {
    const c = randomLayoutCase(300, 300)
    const layout = layoutUpward({graph: c.graph, st: c.st, boxes: randomBoxes(prng(1), c.graph.vertexCount), flow: 'up'})
    expect(layoutStats(layout).crossings).toBe(0)
    let k = 0
    for (const e of layout.edges) {
      if (e.points.length > 2) e.points[1] = [e.points[1]![0] + (k++ % 2 ? 300 : -300), e.points[1]![1]]
    }
    // All O(S^2) pairs, plain orientation signs, proper crossings only (no touching in this layout).
    const segs: number[][] = []
    layout.edges.forEach((e, ei) => e.points.forEach((p, i) => {
      if (i > 0) segs.push([e.points[i - 1]![0], e.points[i - 1]![1], p[0], p[1], ei])
    }))
    const o = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number =>
      Math.sign((bx - ax) * (cy - ay) - (by - ay) * (cx - ax))
    let brute = 0
    for (let i = 0; i < segs.length; i++) {
      for (let j = i + 1; j < segs.length; j++) {
        const a = segs[i]!
        const b = segs[j]!
        if (a[4] === b[4]) continue
        if (o(a[0]!, a[1]!, a[2]!, a[3]!, b[0]!, b[1]!) * o(a[0]!, a[1]!, a[2]!, a[3]!, b[2]!, b[3]!) < 0 &&
          o(b[0]!, b[1]!, b[2]!, b[3]!, a[0]!, a[1]!) * o(b[0]!, b[1]!, b[2]!, b[3]!, a[2]!, a[3]!) < 0) brute++
      }
    }
    expect(brute).toBeGreaterThan(50)
    expect(layoutStats(layout).crossings).toBe(brute)
  })

  it('area, aspect ratio, bends and length of a hand-made drawing', () => {
    const s = layoutStats({
      flow: 'up', width: 100, height: 50, nodes: [],
      edges: [{edge: 0, points: [[0, 50], [30, 10], [30, 0]]}, {edge: 1, points: [[100, 50], [100, 0]]}],
    })
    expect(s).toEqual({area: 5000, aspectRatio: 2, bends: 1, totalEdgeLength: 50 + 10 + 50, crossings: 0})
  })
})
