/**
 * Evening out rows (layout/balance-rows.ts: evenRows), with and without a spare level.
 *
 * What evenRows promises, checked from outside the module: every edge still rises, every vertex stays
 * within the levels offered, and the widest row by its own estimate (rowWidths, recomputed here from
 * the definition: each box plus a box gap, an edge gap per edge passing the row) never grows; a
 * "no move helps" answer leaves nothing narrower to find by one move (checked by trying every single
 * move, brute force). The spare level: a vertex whose out-edges fan out to many sinks on the top row
 * (common practice in layered drawing: a wide fan is split over two rows) can only narrow that row
 * when a level above it is offered.
 *
 * With the rows' heights (evenRows's `heights`): the same checks with the area as the measure,
 * recomputed here from its definition (the widest row times the rows that hold boxes, each as tall as
 * its tallest box, plus a layer gap between them), and a tall box moved onto a row that already has
 * one when that lowers the area.
 */
import {describe, expect, it} from 'vitest'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {dropEmptyLevels, evenRows, evenRowsWithSpare} from '../src/layout/balance-rows.ts'
import {longestPathUp} from '../src/layout/layering.ts'
import {prng} from './support/layout-st-generator.ts'

const NODE_GAP = 24
const EDGE_GAP = 14

/** Per row: boxes plus a box gap each, an edge gap per edge passing through. */
function widths(g: Digraph, level: ArrayLike<number>, across: ArrayLike<number>, rows: number): number[] {
  const w = new Array<number>(rows).fill(0)
  for (let v = 0; v < g.vertexCount; v++) w[level[v]!]! += across[v]! + NODE_GAP
  for (let e = 0; e < g.edgeCount; e++) for (let r = level[g.tail[e]!]! + 1; r < level[g.head[e]!]!; r++) w[r]! += EDGE_GAP
  return w
}

function randomDag(rand: () => number, n: number, p: number): Digraph {
  const edges: Array<[number, number]> = []
  for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if (rand() < p) edges.push([a, b])
  return createDigraph(n, edges)
}

/** A random DAG with boxes across the flow, and its longest-path levels (draws in this order). */
function randomCase(rand: () => number, sizes: number, density: number): {n: number; g: Digraph; across: number[]; level: Int32Array} {
  const n = 3 + Math.floor(rand() * sizes)
  const g = randomDag(rand, n, density + rand() * 0.3)
  const across = Array.from({length: n}, () => 40 + Math.floor(rand() * 80))
  return {n, g, across, level: longestPathUp(g)}
}

/** Every level in 0..levels − 1 and every edge rising. */
function expectValidLevels(g: Digraph, out: Int32Array, levels: number): void {
  for (let v = 0; v < g.vertexCount; v++) expect(out[v]).toBeGreaterThanOrEqual(0)
  for (let v = 0; v < g.vertexCount; v++) expect(out[v]).toBeLessThan(levels)
  for (let e = 0; e < g.edgeCount; e++) expect(out[g.tail[e]!]!).toBeLessThan(out[g.head[e]!]!)
}

/** Every assignment one vertex away from `level` (within 0..levels − 1) whose edges all rise. */
function* singleMoves(g: Digraph, level: Int32Array, levels: number): Generator<Int32Array> {
  for (let v = 0; v < g.vertexCount; v++) {
    for (let l = 0; l < levels; l++) {
      const next = level.slice()
      next[v] = l
      let rises = true
      for (let e = 0; e < g.edgeCount; e++) if (next[g.tail[e]!]! >= next[g.head[e]!]!) rises = false
      if (rises) yield next
    }
  }
}

describe('evenRows', () => {
  it('keeps edges rising and levels in range, and never widens the widest row (random DAGs, with and without a spare level)', () => {
    const rand = prng(20261203)
    let moved = 0
    for (let t = 0; t < 300; t++) {
      const {n, g, across, level} = randomCase(rand, 12, 0.15)
      const height = Math.max(...level) + 1
      for (const spare of [0, 1]) {
        const levels = height + spare
        const out = evenRows(g, level, across, NODE_GAP, EDGE_GAP, levels)
        if (!out) continue
        moved++
        expectValidLevels(g, out, levels)
        expect(Math.max(...widths(g, out, across, levels))).toBeLessThanOrEqual(Math.max(...widths(g, level, across, levels)) + 1e-9)
      }
    }
    expect(moved).toBeGreaterThan(50)
  })

  it('answers "no move" only when no single move narrows the widest row (brute force)', () => {
    const rand = prng(7)
    let settled = 0
    for (let t = 0; t < 200; t++) {
      const {n, g, across, level} = randomCase(rand, 9, 0.2)
      const levels = Math.max(...level) + 2
      if (evenRows(g, level, across, NODE_GAP, EDGE_GAP, levels)) continue
      settled++
      const widest = Math.max(...widths(g, level, across, levels))
      for (const next of singleMoves(g, level, levels)) expect(Math.max(...widths(g, next, across, levels))).toBeGreaterThanOrEqual(widest - 1e-9)
    }
    expect(settled).toBeGreaterThan(10)
  })

  it('splits a fan of sinks over a spare level on top, and cannot without it', () => {
    // 0 -> 1 -> 2, and 2 fans out to the sinks 3..7 on the top row, the widest by far.
    const g = createDigraph(8, [[0, 1], [1, 2], [2, 3], [2, 4], [2, 5], [2, 6], [2, 7]])
    const across = new Array(8).fill(60)
    const level = longestPathUp(g)
    expect(Array.from(level)).toEqual([0, 1, 2, 3, 3, 3, 3, 3])
    expect(evenRows(g, level, across, NODE_GAP, EDGE_GAP)).toBeUndefined()
    const out = evenRows(g, level, across, NODE_GAP, EDGE_GAP, 5)
    expect(out).toBeDefined()
    const top = dropEmptyLevels(out!)
    expect(Math.max(...top)).toBe(4)
    const before = Math.max(...widths(g, level, across, 4))
    expect(Math.max(...widths(g, top, across, 5))).toBeLessThan(before)
  })
})

const LAYER_GAP = 40

/** Widest row times the height of the rows holding boxes (tallest box each, a layer gap between). */
function areaOf(g: Digraph, level: ArrayLike<number>, across: ArrayLike<number>, along: ArrayLike<number>, rows: number): number {
  const tallest = new Array<number>(rows).fill(-1)
  for (let v = 0; v < g.vertexCount; v++) tallest[level[v]!] = Math.max(tallest[level[v]!]!, along[v]!)
  const used = tallest.filter((t) => t >= 0)
  return Math.max(...widths(g, level, across, rows)) * (used.reduce((a, b) => a + b, 0) + (used.length - 1) * LAYER_GAP)
}

describe('evenRows by area (with the rows\' heights)', () => {
  const randomHeights = (rand: () => number, n: number): number[] => Array.from({length: n}, () => (rand() < 0.3 ? 51 : 34))

  it('keeps edges rising and levels in range, and never grows the area (random DAGs)', () => {
    const rand = prng(20261204)
    let moved = 0
    for (let t = 0; t < 300; t++) {
      const {n, g, across, level} = randomCase(rand, 12, 0.15)
      const along = randomHeights(rand, n)
      const levels = Math.max(...level) + 1
      const out = evenRows(g, level, across, NODE_GAP, EDGE_GAP, 0, {along, layerGap: LAYER_GAP})
      if (!out) continue
      moved++
      expectValidLevels(g, out, levels)
      expect(areaOf(g, out, across, along, levels)).toBeLessThanOrEqual(areaOf(g, level, across, along, levels) + 1e-6)
    }
    expect(moved).toBeGreaterThan(50)
  })

  it('answers "no move" only when no single move lowers the area (brute force)', () => {
    const rand = prng(11)
    let settled = 0
    for (let t = 0; t < 200; t++) {
      const {n, g, across, level} = randomCase(rand, 9, 0.2)
      const along = randomHeights(rand, n)
      const levels = Math.max(...level) + 1
      if (evenRows(g, level, across, NODE_GAP, EDGE_GAP, 0, {along, layerGap: LAYER_GAP})) continue
      settled++
      const area = areaOf(g, level, across, along, levels)
      for (const next of singleMoves(g, level, levels)) expect(areaOf(g, next, across, along, levels)).toBeGreaterThanOrEqual(area - 1e-6)
    }
    expect(settled).toBeGreaterThan(10)
  })

  it('puts a tall box on the row of another tall box, where the widths alone see no gain', () => {
    // The path 0 -> 1 -> 3 -> 4 with 3 tall, and 2 tall on its own: longest path puts 2 beside 0 on
    // row 0. Moved beside 3 on row 2, the widest row is as wide as before (two boxes) and row 0 is
    // short; by widths alone (with the sum of squares as the tie-break) nothing changes.
    const g = createDigraph(5, [[0, 1], [1, 3], [3, 4]])
    const across = [60, 60, 60, 60, 60]
    const along = [34, 34, 51, 51, 34]
    const level = longestPathUp(g)
    expect(Array.from(level)).toEqual([0, 1, 0, 2, 3])
    expect(evenRows(g, level, across, NODE_GAP, EDGE_GAP)).toBeUndefined()
    const out = evenRows(g, level, across, NODE_GAP, EDGE_GAP, 0, {along, layerGap: LAYER_GAP})
    expect(out && Array.from(out)).toEqual([0, 1, 2, 2, 3])
    expect(areaOf(g, out!, across, along, 4)).toBeLessThan(areaOf(g, level, across, along, 4))
  })
})

describe('evenRowsWithSpare', () => {
  it('gives each result one level more at most, edges rising, no empty level, none equal to the input', () => {
    const rand = prng(99)
    let found = 0
    for (let t = 0; t < 200; t++) {
      const {g, across, level} = randomCase(rand, 12, 0.15)
      const height = Math.max(...level) + 1
      const results = evenRowsWithSpare(g, level, across, NODE_GAP, EDGE_GAP)
      for (const r of results) {
        found++
        const h = Math.max(...r) + 1
        expect(h).toBeLessThanOrEqual(height + 1)
        expect(new Set(r).size).toBe(h)
        expect(Array.from(r)).not.toEqual(Array.from(level))
        for (let e = 0; e < g.edgeCount; e++) expect(r[g.tail[e]!]!).toBeLessThan(r[g.head[e]!]!)
      }
      expect(new Set(results.map((r) => r.join())).size).toBe(results.length)
    }
    expect(found).toBeGreaterThan(50)
  })

  it('moves a fan of sources below the bottom row', () => {
    // Sources 0..4 all point to 5, which points to 6: the bottom row is the widest.
    const g = createDigraph(7, [[0, 5], [1, 5], [2, 5], [3, 5], [4, 5], [5, 6]])
    const across = new Array(7).fill(60)
    const level = longestPathUp(g)
    const results = evenRowsWithSpare(g, level, across, NODE_GAP, EDGE_GAP)
    expect(results.some((r) => Math.max(...r) === 3 && Math.max(...widths(g, r, across, 4)) < Math.max(...widths(g, level, across, 3)))).toBe(true)
  })
})
