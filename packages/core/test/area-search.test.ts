/**
 * The area-searched candidate of layoutSmallest (layout/area-search.ts): on the North DAG g.10.93
 * (/work/shared/data/north, see SOURCE.md there) with the layout bench's boxes (labels `item N`, every
 * seventh with a second line, labelBox) it draws a drawing smaller than the reference library's,
 * which no candidate before it that layoutSmallest may keep does.
 *
 * Reference: @dagrejs/dagre 3.1.3 (a layered layout that allows crossings) with the same boxes and
 * gaps, as bench/support/dagre-layout.ts calls it; issue 5 asks for no more than its area. Before the
 * candidate the st-layout was kept at 1.021 of it (bench/README.md, "Smallest drawing": the
 * same-height rule kept it); bench/area-bound.ts found a 4-row assignment drawn at 0.902 of it
 * without the written order.
 *
 * g.10.1 (same boxes): the retry with another written-order set. The kept drawing keeps as many
 * vertices' out-edges in written order as the st-layout, read off the drawing (each out-edge's first
 * point, left to right by edge id), but not the same ones, so no search with the st-layout's set
 * forced drew it; it passes the geometric checker and is smaller than every drawing before the
 * area-searched ones that layoutSmallest may keep.
 *
 * g.21.34, g.23.99 (same boxes): the deep search (the area search once more, last, on deeper budgets,
 * below the drawing that would be kept) draws each under dagre's area; no drawing before it that the
 * same-height rule allows is under it (bench/layout.ts had them at 1.178 and 1.069 of dagre's area at
 * b9fda0b). Fails with the deep search's budget at 0. (g.31.0 was a third until the deep search's
 * finds had to lower the area times the total edge length as well: its find, 0.945 of the area for
 * 1.34 times the edge length, is no longer offered.)
 *
 * g.49.17 (same boxes): the last step, the kept drawing's rows evened out by area (balance-rows.ts
 * with the rows' heights), draws it under dagre's area (1.016 of it before); no drawing before it is
 * under it.
 */
import dagre from '@dagrejs/dagre'
import {describe, expect, it} from 'vitest'
import {stAugment} from '../src/augment/index.ts'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {defaultSpacing, layoutCandidates, layoutSmallest, writtenOrderKept, type Layout} from '../src/layout/index.ts'
import {SAME_ROWS_GAIN} from '../src/layout/smallest-layout.ts'
import {labelBox} from '../src/measure/index.ts'
import {testUpwardPlanarity} from '../src/upward/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {readGraphml} from './support/graphml.ts'
import {northDir} from './support/north-dags.ts'

type Box = {width: number; height: number}

/** dagre's reported area with our boxes and gaps, flow up (bench/support/dagre-layout.ts's call). */
function dagreArea(g: Digraph, boxes: Box[]): number {
  const d = new dagre.graphlib.Graph({multigraph: true})
  d.setGraph({rankdir: 'BT', nodesep: defaultSpacing.node, edgesep: defaultSpacing.edge, ranksep: defaultSpacing.layer, marginx: 0, marginy: 0})
  d.setDefaultEdgeLabel(() => ({}))
  for (let v = 0; v < g.vertexCount; v++) d.setNode(String(v), {...boxes[v]!})
  for (let e = 0; e < g.edgeCount; e++) d.setEdge(String(g.tail[e]), String(g.head[e]), {}, String(e))
  dagre.layout(d)
  return (d.graph().width ?? 0) * (d.graph().height ?? 0)
}

/** The vertices whose out-edges leave left to right in edge id order, read off the drawing (flow up). */
function inWrittenOrder(g: Digraph, l: Layout): number[] {
  const out: number[] = []
  for (let v = 0; v < g.vertexCount; v++) {
    const es = Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
    if (es.length >= 2 && es.every((e, i) => i === 0 || l.edges[es[i - 1]!]!.points[0]![0] < l.edges[e]!.points[0]![0])) out.push(v)
  }
  return out
}

/** A North DAG with the layout bench's boxes, flow up. */
function benchInput(name: string) {
  const {vertexCount, edges} = readGraphml(`${northDir}/${name}.graphml`)
  const g = createDigraph(vertexCount, edges)
  const res = testUpwardPlanarity(g)
  if (res.status !== 'upward') throw new Error(`${name} is not upward planar`)
  const boxes = Array.from({length: vertexCount}, (_, v) => labelBox(v % 7 === 3 ? `item ${v}\nsecond line` : `item ${v}`)).map((b) => ({width: b.width, height: b.height}))
  return {graph: g, st: stAugment(res.upward), boxes, flow: 'up' as const}
}

const rows = (l: Layout): number => new Set(l.nodes.map((n) => n.y)).size
const area = (l: Layout): number => l.width * l.height
/** The same-height rule: beside this st-layout, fewer rows or at most SAME_ROWS_GAIN of its area. */
const sameHeightAllows = (st: Layout, l: Layout): boolean => rows(l) < rows(st) || area(l) <= SAME_ROWS_GAIN * area(st)
/** What layoutSmallest may keep beside this st-layout: as many vertices in written order, and the rule above. */
const keepableBy = (g: Digraph, st: Layout) => (l: Layout): boolean => writtenOrderKept(g, l) >= writtenOrderKept(g, st) && sameHeightAllows(st, l)

describe('area-searched candidate', () => {
  it('g.10.93: draws under dagre\'s area where the candidates before it keep nothing that small', () => {
    const {vertexCount, edges} = readGraphml(`${northDir}/g.10.93.graphml`)
    const g = createDigraph(vertexCount, edges)
    const res = testUpwardPlanarity(g)
    expect(res.status).toBe('upward')
    if (res.status !== 'upward') return
    const st = stAugment(res.upward)
    const boxes = Array.from({length: vertexCount}, (_, v) => labelBox(v % 7 === 3 ? `item ${v}\nsecond line` : `item ${v}`)).map((b) => ({width: b.width, height: b.height}))
    const input = {graph: g, st, boxes, flow: 'up' as const}
    const reference = dagreArea(g, boxes)
    const drawn = layoutCandidates(input)
    const stLayout = drawn[0]!.layout
    // What layoutSmallest may keep: the written order of the st-layout, and the same-height rule.
    const keepable = keepableBy(g, stLayout)
    const first = drawn.findIndex((d) => d.kind === 'area-searched')
    expect(first).toBeGreaterThan(0)
    const before = drawn.slice(0, first).filter((d, k) => k === 0 || keepable(d.layout))
    expect(Math.min(...before.map((d) => area(d.layout)))).toBeGreaterThan(reference)
    const searched = drawn.slice(first).filter((d) => d.kind !== 'deep-searched')
    expect(searched.every((d) => d.kind === 'area-searched')).toBe(true)
    for (const d of searched) expect(checkDrawing(g, d.layout, {boxes})).toEqual({ok: true})
    const below = searched.filter((d) => keepable(d.layout) && area(d.layout) < reference)
    expect(below.length).toBeGreaterThan(0)
    // The deep search after it may keep a smaller one still, never a larger one.
    const kept = layoutSmallest(input)
    expect(['area-searched', 'deep-searched']).toContain(kept.kind)
    expect(area(kept.layout)).toBeLessThanOrEqual(Math.min(...below.map((d) => area(d.layout))))
  })

  it('g.10.1: a written-order set other than the st-layout\'s, as large, gives a smaller drawing that is kept', () => {
    const input = benchInput('g.10.1')
    const g = input.graph
    const drawn = layoutCandidates(input)
    const stLayout = drawn[0]!.layout
    const stSet = inWrittenOrder(g, stLayout)
    const keepable = (l: Layout): boolean =>
      inWrittenOrder(g, l).length >= stSet.length && sameHeightAllows(stLayout, l)
    const first = drawn.findIndex((d) => d.kind === 'area-searched')
    expect(first).toBeGreaterThan(0)
    const before = Math.min(...drawn.slice(0, first).filter((d, k) => k === 0 || keepable(d.layout)).map((d) => area(d.layout)))
    // The smallest area-searched drawing it may keep (the deep search after it may keep a smaller
    // one still, never a larger one).
    const searched = drawn.filter((d) => d.kind === 'area-searched' && keepable(d.layout)).sort((a, b) => area(a.layout) - area(b.layout))[0]!
    expect(searched).toBeDefined()
    expect(checkDrawing(g, searched.layout, {boxes: input.boxes})).toEqual({ok: true})
    const set = inWrittenOrder(g, searched.layout)
    expect(set.length).toBeGreaterThanOrEqual(stSet.length)
    expect(stSet.every((v) => set.includes(v))).toBe(false)
    expect(area(searched.layout)).toBeLessThan(before)
    expect(area(layoutSmallest(input).layout)).toBeLessThanOrEqual(area(searched.layout))
  })

  it('g.21.34, g.23.99: the deep search draws under dagre\'s area where nothing before it that layoutSmallest may keep does', () => {
    for (const name of ['g.21.34', 'g.23.99']) {
      const input = benchInput(name)
      const g = input.graph
      const reference = dagreArea(g, input.boxes)
      const drawn = layoutCandidates(input)
      const stLayout = drawn[0]!.layout
      const keepable = keepableBy(g, stLayout)
      const first = drawn.findIndex((d) => d.kind === 'deep-searched')
      expect(first, name).toBeGreaterThan(0)
      expect(drawn.slice(first).every((d) => d.kind === 'deep-searched'), name).toBe(true)
      // Before it: nothing under dagre's area that keeps the written order (nor any drawing at all
      // under it, written order or not, that the same-height rule allows).
      const before = drawn.slice(0, first).filter((d, k) => k === 0 || sameHeightAllows(stLayout, d.layout))
      expect(Math.min(...before.map((d) => area(d.layout))), name).toBeGreaterThan(reference)
      const kept = layoutSmallest(input)
      expect(kept.kind, name).toBe('deep-searched')
      expect(keepable(kept.layout), name).toBe(true)
      expect(area(kept.layout), name).toBeLessThan(reference)
      expect(checkDrawing(g, kept.layout, {boxes: input.boxes}), name).toEqual({ok: true})
    }
  })

  it('g.49.17: the kept drawing\'s rows evened out by area draw under dagre\'s area', () => {
    const input = benchInput('g.49.17')
    const g = input.graph
    const reference = dagreArea(g, input.boxes)
    const drawn = layoutCandidates(input)
    const first = drawn.findIndex((d) => d.kind === 'area-evened')
    expect(first).toBeGreaterThan(0)
    expect(Math.min(...drawn.slice(0, first).map((d) => area(d.layout)))).toBeGreaterThan(reference)
    const kept = layoutSmallest(input)
    expect(kept.kind).toBe('area-evened')
    expect(area(kept.layout)).toBeLessThan(reference)
    expect(checkDrawing(g, kept.layout, {boxes: input.boxes})).toEqual({ok: true})
  })
})
