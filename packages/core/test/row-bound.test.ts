/**
 * Lower bounds on layered drawings (layout/row-bound.ts).
 *
 * References outside the module:
 * - leastGaps against brute force: every left-to-right pattern of b boxes and p bends, its gaps
 *   summed neighbour by neighbour.
 * - leastRowWidth, leastHeight and rowsHeight (each row's tallest box) against the drawings themselves, read off the Layout alone: rows
 *   are the distinct box centres along the flow, the edges passing a row are those whose ends stand on
 *   rows either side of it, and a row's drawn extent across the flow runs over its boxes and the points
 *   where the passing routes meet its centre line. Drawings: every drawing layoutCandidates makes
 *   (st-layout and level drawings) for the North DAGs (/work/shared/data/north, see SOURCE.md there)
 *   with the layout bench's boxes, and level drawings (layoutLevels) of random level-planar
 *   assignments with random boxes, gaps and flows. Each bound must hold on every drawing and meet the
 *   drawing exactly on some, so a bound one gap too high fails it.
 */
import {describe, expect, it} from 'vitest'
import {stAugment} from '../src/augment/index.ts'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {layoutCandidates, layoutLevels, type BoxSize, type Flow, type Layout} from '../src/layout/index.ts'
import {defaultSpacing} from '../src/layout/types.ts'
import {leastGaps, leastGapsToCome, leastHeight, leastRowWidth, leastRowWidths, rowsHeight} from '../src/layout/row-bound.ts'
import {testLevelPlanarity} from '../src/level/level-planarity.ts'
import {labelBox} from '../src/measure/index.ts'
import {testUpwardPlanarity} from '../src/upward/index.ts'
import {prng} from './support/layout-st-generator.ts'
import {readGraphml} from './support/graphml.ts'
import {northDir, northFiles} from './support/north-dags.ts'

const EPS = 1e-6

/** Gaps of every pattern of `boxes` boxes and `bends` bends (true: a box), the least of them. */
function bruteGaps(boxes: number, bends: number, nodeGap: number, edgeGap: number): number {
  let least = Infinity
  const pattern: boolean[] = []
  const go = (b: number, p: number): void => {
    if (b === 0 && p === 0) {
      let sum = 0
      for (let i = 1; i < pattern.length; i++) sum += pattern[i - 1] && pattern[i] ? nodeGap : edgeGap
      least = Math.min(least, sum)
      return
    }
    for (const box of [true, false]) {
      if (box ? b === 0 : p === 0) continue
      pattern.push(box)
      go(box ? b - 1 : b, box ? p : p - 1)
      pattern.pop()
    }
  }
  go(boxes, bends)
  return least
}

describe('leastGaps and leastGapsToCome against brute force over every order', () => {
  it('up to 6 boxes and 6 bends, gaps with the box gap above twice the edge gap, between, and below the edge gap', () => {
    const failures: string[] = []
    for (const [nodeGap, edgeGap] of [[24, 14], [24, 5], [10, 14], [7, 7], [30, 15]] as const) {
      for (let b = 0; b <= 6; b++) {
        for (let p = 0; p <= 6; p++) {
          const want = bruteGaps(b, p, nodeGap, edgeGap)
          const got = leastGaps(b, p, nodeGap, edgeGap)
          if (got !== want) failures.push(`gaps ${nodeGap}/${edgeGap}, ${b} boxes ${p} bends: ${got}, brute force ${want}`)
          // To come: the least over this many bends or more (brute force up to 12 bends; past b − 1 extra
          // bends only add), never above any completion with more boxes.
          let toCome = Infinity
          for (let q = p; q <= 12; q++) toCome = Math.min(toCome, bruteGaps(b, q, nodeGap, edgeGap))
          const come = leastGapsToCome(b, p, nodeGap, edgeGap)
          if (come !== toCome) failures.push(`to come ${nodeGap}/${edgeGap}, ${b} boxes ${p} bends: ${come}, brute force ${toCome}`)
          for (let b2 = b; b2 <= 6; b2++) for (let q = p; q <= 6; q++) if (come > leastGaps(b2, q, nodeGap, edgeGap)) failures.push(`to come above a completion: ${b}/${p} -> ${b2}/${q}`)
        }
      }
    }
    expect(failures).toEqual([])
  })
})

/** Across- and along-the-flow coordinates of an SVG point for a flow. */
const axes = (flow: Flow): {across: 0 | 1; along: 0 | 1} => (flow === 'left' || flow === 'right' ? {across: 1, along: 0} : {across: 0, along: 1})

interface Reading {
  /** Per row (in order along the flow): drawn extent across, least width by the bound, tallest box along the flow. */
  rows: Array<{extent: number; least: number; tallest: number}>
  /** Width across the flow and height along it, as the drawing reports them. */
  across: number
  along: number
}

/**
 * Each row of a drawing read off the Layout: its boxes, the edges passing it, its extent across the
 * flow (boxes and the passing routes where they meet its centre line) and leastRowWidth for them.
 */
function readRows(g: Digraph, layout: Layout, nodeGap: number, edgeGap: number): Reading {
  const {across, along} = axes(layout.flow)
  const centreOf = (v: number): number => (along === 1 ? layout.nodes[v]!.y : layout.nodes[v]!.x)
  const rowKeys = Array.from(new Set(layout.nodes.map((_, v) => Math.round(centreOf(v) / EPS)))).sort((a, b) => a - b)
  const rowOf = new Map(rowKeys.map((k, r) => [k, r]))
  const row = layout.nodes.map((_, v) => rowOf.get(Math.round(centreOf(v) / EPS))!)
  const rows = rowKeys.map((k, r) => {
    const c = k * EPS
    let lo = Infinity
    let hi = -Infinity
    let boxWidth = 0
    let boxes = 0
    layout.nodes.forEach((n, v) => {
      if (row[v] !== r) return
      const half = (across === 0 ? n.width : n.height) / 2
      const x = across === 0 ? n.x : n.y
      lo = Math.min(lo, x - half)
      hi = Math.max(hi, x + half)
      boxWidth += 2 * half
      boxes++
    })
    let bends = 0
    for (let e = 0; e < g.edgeCount; e++) {
      const a = row[g.tail[e]!]!
      const b = row[g.head[e]!]!
      if (Math.min(a, b) >= r || Math.max(a, b) <= r) continue
      bends++
      const pts = layout.edges[e]!.points
      for (let i = 1; i < pts.length; i++) {
        const p = pts[i - 1]!
        const q = pts[i]!
        if (Math.min(p[along], q[along]) > c + EPS || Math.max(p[along], q[along]) < c - EPS) continue
        const t = q[along] === p[along] ? 0 : Math.min(1, Math.max(0, (c - p[along]) / (q[along] - p[along])))
        const x = p[across] + t * (q[across] - p[across])
        lo = Math.min(lo, x)
        hi = Math.max(hi, x)
      }
    }
    let tallest = 0
    layout.nodes.forEach((n, v) => {
      if (row[v] === r) tallest = Math.max(tallest, along === 1 ? n.height : n.width)
    })
    return {extent: hi - lo, least: leastRowWidth(boxWidth, boxes, bends, nodeGap, edgeGap), tallest}
  })
  return {rows, across: across === 0 ? layout.width : layout.height, along: along === 1 ? layout.height : layout.width}
}

interface Tally {
  failures: string[]
  drawings: number
  rows: number
  tightRows: number
  tightWidth: number
  tightHeight: number
  tightRowsHeight: number
}

/** Checks one drawing's rows, width and height against the bounds; counts where they are met exactly. */
function checkBounds(label: string, g: Digraph, layout: Layout, boxes: ReadonlyArray<BoxSize>, spacing: {node: number; edge: number; layer: number}, perRow: boolean, t: Tally): void {
  const read = readRows(g, layout, spacing.node, spacing.edge)
  const {along} = axes(layout.flow)
  t.drawings++
  let widest = 0
  for (const [r, {extent, least}] of read.rows.entries()) {
    widest = Math.max(widest, least)
    if (!perRow) continue
    t.rows++
    if (extent < least - EPS) t.failures.push(`${label}: row ${r} drawn ${extent}, bound ${least}`)
    if (Math.abs(extent - least) < EPS) t.tightRows++
  }
  if (read.across < widest - EPS) t.failures.push(`${label}: width ${read.across}, bound ${widest}`)
  if (Math.abs(read.across - widest) < EPS) t.tightWidth++
  const height = leastHeight(boxes.map((b) => (along === 1 ? b.height : b.width)), read.rows.length, spacing.layer)
  if (read.along < height - EPS) t.failures.push(`${label}: height ${read.along}, bound ${height}`)
  if (Math.abs(read.along - height) < EPS) t.tightHeight++
  const byRows = rowsHeight(read.rows.map((r) => r.tallest), spacing.layer)
  if (read.along < byRows - EPS) t.failures.push(`${label}: height ${read.along}, rowsHeight ${byRows}`)
  if (Math.abs(read.along - byRows) < EPS) t.tightRowsHeight++
}

describe('bounds hold on every drawing and are met on some', () => {
  const files = northFiles()
  const chunks = 4
  for (let c = 0; c < chunks; c++) {
    it(`North DAGs, every drawing layoutCandidates makes, the layout bench's boxes (files ${c + 1}/${chunks})`, () => {
      const t: Tally = {failures: [], drawings: 0, rows: 0, tightRows: 0, tightWidth: 0, tightHeight: 0, tightRowsHeight: 0}
      for (let i = c; i < files.length; i += chunks) {
        const {vertexCount, edges} = readGraphml(`${northDir}/${files[i]!}`)
        const g = createDigraph(vertexCount, edges)
        const res = testUpwardPlanarity(g)
        if (res.status !== 'upward') continue
        const boxes = Array.from({length: vertexCount}, (_, v) => labelBox(v % 7 === 3 ? `item ${v}\nsecond line` : `item ${v}`))
        for (const d of layoutCandidates({graph: g, st: stAugment(res.upward), boxes, flow: 'up'})) {
          // Level drawings are read row by row (a passing route crosses the row's band straight along
          // the flow at its bend); the st-layout may pass a row as one point, so only as a whole.
          checkBounds(`${files[i]} ${d.kind}`, g, d.layout, boxes, defaultSpacing, d.kind !== 'st', t)
        }
      }
      expect(t.failures).toEqual([])
      expect(t.drawings).toBeGreaterThan(400)
      expect(t.tightRows).toBeGreaterThan(0)
      expect(t.tightWidth).toBeGreaterThan(0)
      expect(t.tightHeight).toBeGreaterThan(0)
      expect(t.tightRowsHeight).toBeGreaterThan(0)
    })
  }

  it('random level-planar assignments drawn by layoutLevels, random boxes, gaps and flows', () => {
    const rand = prng(20261203)
    const flows: Flow[] = ['up', 'right', 'down', 'left']
    const t: Tally = {failures: [], drawings: 0, rows: 0, tightRows: 0, tightWidth: 0, tightHeight: 0, tightRowsHeight: 0}
    for (let c = 0; c < 600; c++) {
      const n = 3 + Math.floor(rand() * 12)
      const edges: Array<[number, number]> = []
      for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if (rand() < 0.3) edges.push([a, b])
      const g = createDigraph(n, edges)
      // Levels in vertex order (a topological order here), each at least one above its in-neighbours,
      // sometimes more (long edges, and levels with no box).
      const level = new Int32Array(n)
      for (let v = 0; v < n; v++) {
        let low = 0
        for (let i = g.inStart[v]!; i < g.inStart[v + 1]!; i++) low = Math.max(low, level[g.tail[g.inEdges[i]!]!]! + 1)
        level[v] = low + (rand() < 0.3 ? Math.floor(rand() * 3) : 0)
      }
      const r = testLevelPlanarity(g, level)
      if (r.status !== 'planar') continue
      const sameHeight = rand() < 0.5
      const boxes = Array.from({length: n}, () => ({width: 10 + Math.round(rand() * 70), height: sameHeight ? 20 : 10 + Math.round(rand() * 30)}))
      const spacing = {node: 1 + Math.round(rand() * 40), edge: 1 + Math.round(rand() * 40), layer: 1 + Math.round(rand() * 50)}
      const flow = flows[c % 4]!
      const {layout} = layoutLevels({graph: g, level, orders: r.orders, boxes, flow, spacing})
      checkBounds(`case ${c} ${flow} gaps ${spacing.node}/${spacing.edge}`, g, layout, boxes, spacing, true, t)
      // The bound from the levels themselves agrees with the one read off the drawing on the rows with boxes.
      const fromLevels = leastRowWidths(g, level, boxes.map((b) => (flow === 'left' || flow === 'right' ? b.height : b.width)), spacing.node, spacing.edge)
      const boxRows = Array.from(new Set(level)).sort((a, b) => a - b)
      const read = readRows(g, layout, spacing.node, spacing.edge)
      // Rows read in SVG order: level 0 last for flows up and left.
      const reversed = flow === 'up' || flow === 'left'
      boxRows.forEach((l, k) => {
        const at = reversed ? boxRows.length - 1 - k : k
        if (Math.abs(fromLevels[l]! - read.rows[at]!.least) > EPS) t.failures.push(`case ${c}: level ${l} bound ${fromLevels[l]}, read ${read.rows[at]!.least}`)
      })
    }
    expect(t.failures).toEqual([])
    expect(t.drawings).toBeGreaterThan(300)
    expect(t.tightRows).toBeGreaterThan(50)
    expect(t.tightWidth).toBeGreaterThan(50)
    expect(t.tightHeight).toBeGreaterThan(50)
    expect(t.tightRowsHeight).toBeGreaterThan(50)
  })
})
