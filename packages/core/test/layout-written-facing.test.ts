/**
 * Written order in level drawings (layout/smallest-layout.ts): the mirror choice, the depth-first
 * order preference and the repair that asks the level test for other orders.
 *
 * - writtenOrderFacing reads, from the level orders alone, whether the mirror shows more vertices'
 *   out-edges in written order. Checked against the drawings themselves: both orientations drawn by
 *   layoutLevels and counted on the drawn ports (writtenOrderKept), on every eighth North DAG
 *   (/work/shared/data/north/, see SOURCE.md there).
 * - depthFirstPlaces on out-trees: the preorder of an ordered tree lists each vertex's children in
 *   their order, and the subtrees of one vertex occupy consecutive, disjoint stretches of it (common
 *   practice; Knuth, TAOCP vol. 1, sec. 2.3.1, recalled from memory). So every level of a layered
 *   tree sorted by it draws no crossing and every branching vertex shows its out-edges as written.
 * - lowerOutNeighbours moves only out-neighbours of vertices not in written order, only down, keeps
 *   every edge upward, and its drawing passes the geometric checker (exact predicates).
 * - narrowerWitness gives other orders of the same levels (same items per level) that pass the
 *   geometric checker, and some of them draw narrower.
 */
import {describe, expect, it} from 'vitest'
import {stAugment} from '../src/augment/index.ts'
import {createDigraph} from '../src/graph/digraph.ts'
import {layoutLevels, levelCandidates, writtenOrderKept} from '../src/layout/index.ts'
import {depthFirstPlaces, lowerOutNeighbours, narrowerWitness, towardsWrittenOrder, writtenOrderFacing} from '../src/layout/smallest-layout.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {testUpwardPlanarity} from '../src/upward/index.ts'
import {prng, randomBoxes} from './support/layout-st-generator.ts'
import {readGraphml} from './support/graphml.ts'
import {northDir, northFiles} from './support/north-dags.ts'

/**
 * Every level candidate of every `step`-th upward planar North DAG (/work/shared/data/north/, see
 * SOURCE.md there), drawn with random boxes seeded by the file's index plus `seed`.
 */
function* northCandidates(step: number, seed: number) {
  const files = northFiles()
  for (let i = 0; i < files.length; i += step) {
    const {vertexCount, edges} = readGraphml(`${northDir}/${files[i]!}`)
    const g = createDigraph(vertexCount, edges)
    const res = testUpwardPlanarity(g)
    if (res.status !== 'upward') continue
    const st = stAugment(res.upward)
    const boxes = randomBoxes(prng(i + seed), g.vertexCount)
    for (const c of levelCandidates(g, st)) yield {file: files[i]!, g, boxes, c}
  }
}

describe('writtenOrderFacing', () => {
  it('picks the orientation whose drawing shows more written order (North DAGs, every eighth)', () => {
    const failures: string[] = []
    let mirrored = 0
    let drawn = 0
    for (const {file, g, boxes, c} of northCandidates(8, 7)) {
      const draw = (orders: typeof c.orders): number => writtenOrderKept(g, layoutLevels({graph: g, level: c.level, orders, boxes, flow: 'up'}).layout)
      const reversed = c.orders.map((items) => items.slice().reverse())
      const facing = writtenOrderFacing(g, c.level, c.orders)
      const best = Math.max(draw(c.orders), draw(reversed))
      if (draw(facing) !== best) failures.push(`${file} ${c.kind}: ${draw(facing)} in written order, the better orientation ${best}`)
      if (facing !== c.orders) mirrored++
      drawn++
    }
    expect(failures).toEqual([])
    expect(drawn).toBeGreaterThan(100)
    // Not a constant choice either way.
    expect(mirrored).toBeGreaterThan(0)
    expect(mirrored).toBeLessThan(drawn)
  })
})

describe('towardsWrittenOrder', () => {
  it('returns only drawings that pass the geometric checker and show more written order (North DAGs, every fourth)', () => {
    const failures: string[] = []
    let repaired = 0
    for (const {file, g, boxes, c} of northCandidates(4, 11)) {
      const draw = (orders: typeof c.orders) => layoutLevels({graph: g, level: c.level, orders, boxes, flow: 'up'}).layout
      const before = writtenOrderFacing(g, c.level, c.orders)
      const after = towardsWrittenOrder(g, c.level, before, {tests: 2, work: 500_000})
      if (!after) continue
      repaired++
      const layout = draw(after)
      const check = checkDrawing(g, layout, {boxes})
      if (!check.ok) failures.push(`${file} ${c.kind}: ${check.problems.slice(0, 3).join('; ')}`)
      if (writtenOrderKept(g, layout) <= writtenOrderKept(g, draw(before))) failures.push(`${file} ${c.kind}: no more written order`)
    }
    expect(failures).toEqual([])
    expect(repaired).toBeGreaterThan(5)
  })
})

describe('lowerOutNeighbours', () => {
  it('lowers only out-neighbours of vertices out of written order and draws them crossing-free (North DAGs, every fourth)', () => {
    const failures: string[] = []
    let lowered = 0
    let moreWritten = 0
    for (const {file, g, boxes, c} of northCandidates(4, 13)) {
      const before = writtenOrderFacing(g, c.level, c.orders)
      const beforeLayout = layoutLevels({graph: g, level: c.level, orders: before, boxes, flow: 'up'}).layout
      // Vertices out of written order in the drawing before, and their out-neighbours.
      const allowed = new Set<number>()
      for (let v = 0; v < g.vertexCount; v++) {
        const out = Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
        const x = (e: number): number => beforeLayout.edges[e]!.points[0]![0]
        if (out.some((e, k) => k > 0 && x(out[k - 1]!) >= x(e))) for (const e of out) allowed.add(g.head[e]!)
      }
      const after = lowerOutNeighbours(g, c.level, before, {tests: 1, work: 500_000})
      if (!after) continue
      lowered++
      // Others keep their levels, up to rows left empty disappearing: their order by level is kept.
      const others = Array.from({length: g.vertexCount}, (_, v) => v).filter((v) => !allowed.has(v))
      for (let v = 0; v < g.vertexCount; v++) if (after.level[v]! > c.level[v]!) failures.push(`${file} ${c.kind}: vertex ${v} raised`)
      for (const u of others) {
        for (const v of others) {
          if (Math.sign(after.level[u]! - after.level[v]!) !== Math.sign(c.level[u]! - c.level[v]!)) failures.push(`${file} ${c.kind}: vertex ${u} or ${v} moved`)
        }
      }
      for (let e = 0; e < g.edgeCount; e++) if (after.level[g.head[e]!]! <= after.level[g.tail[e]!]!) failures.push(`${file} ${c.kind}: edge ${e} not upward`)
      const layout = layoutLevels({graph: g, level: after.level, orders: after.orders, boxes, flow: 'up'}).layout
      const check = checkDrawing(g, layout, {boxes})
      if (!check.ok) failures.push(`${file} ${c.kind}: ${check.problems.slice(0, 3).join('; ')}`)
      if (writtenOrderKept(g, layout) > writtenOrderKept(g, beforeLayout)) moreWritten++
    }
    expect(failures).toEqual([])
    expect(lowered).toBeGreaterThan(5)
    expect(moreWritten).toBeGreaterThan(0)
  })
})

describe('narrowerWitness', () => {
  it('gives orders of the same items per level that draw crossing-free, some narrower (North DAGs, every fourth)', () => {
    const failures: string[] = []
    let given = 0
    let narrower = 0
    const key = (items: ReadonlyArray<{kind: string; vertex?: number; edge?: number}>): string => items.map((i) => `${i.kind}${i.vertex ?? i.edge}`).sort().join(' ')
    for (const {file, g, boxes, c} of northCandidates(4, 17)) {
      const draw = (orders: typeof c.orders) => layoutLevels({graph: g, level: c.level, orders, boxes, flow: 'up'}).layout
      const after = narrowerWitness(g, c.level, c.orders, boxes.map((b) => b.width), {node: 24, edge: 14}, {tests: 1, work: 500_000})
      if (!after) continue
      given++
      if (after.length !== c.orders.length || after.some((items, l) => key(items) !== key(c.orders[l]!))) failures.push(`${file} ${c.kind}: other items`)
      const layout = draw(after)
      const check = checkDrawing(g, layout, {boxes})
      if (!check.ok) failures.push(`${file} ${c.kind}: ${check.problems.slice(0, 3).join('; ')}`)
      if (layout.width < draw(c.orders).width) narrower++
    }
    expect(failures).toEqual([])
    expect(given).toBeGreaterThan(5)
    expect(narrower).toBeGreaterThan(0)
  })
})

describe('depthFirstPlaces', () => {
  it('draws random out-trees with every vertex in written order', () => {
    const rand = prng(2026)
    let branching = 0
    for (let t = 0; t < 40; t++) {
      const n = 3 + Math.floor(rand() * 40)
      const pairs: Array<[number, number]> = []
      for (let v = 1; v < n; v++) pairs.push([Math.floor(rand() * v), v])
      // Written order (edge ids) unrelated to the vertex ids.
      for (let i = pairs.length - 1; i > 0; i--) {
        const j = Math.floor(rand() * (i + 1))
        ;[pairs[i], pairs[j]] = [pairs[j]!, pairs[i]!]
      }
      const g = createDigraph(n, pairs)
      const res = testUpwardPlanarity(g)
      if (res.status !== 'upward') throw new Error('a tree is upward planar')
      const st = stAugment(res.upward)
      const candidates = levelCandidates(g, st, {preferences: [depthFirstPlaces(g)]})
      expect(candidates.length).toBeGreaterThan(0)
      let forks = 0
      for (let v = 0; v < n; v++) if (g.outStart[v + 1]! - g.outStart[v]! >= 2) forks++
      branching += forks
      const boxes = randomBoxes(prng(t), n)
      for (const c of candidates) {
        const layout = layoutLevels({graph: g, level: c.level, orders: c.orders, boxes, flow: 'up'}).layout
        expect(writtenOrderKept(g, layout)).toBe(forks)
      }
    }
    expect(branching).toBeGreaterThan(50)
  })
})
