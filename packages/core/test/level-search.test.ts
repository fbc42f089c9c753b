/**
 * searchLevels (layout/level-search.ts): a level-planar assignment within a number of rows, or a
 * proof that none exists.
 *
 * Reference: exhaustive enumeration. On small random DAGs every level assignment within the rows
 * (each vertex between its longest paths from the sources and to the sinks) goes through
 * testLevelPlanarity, which level.test.ts checks against a brute-force oracle over every combination
 * of left-to-right orders; an assignment exists exactly when the search finds one, and each one found
 * is re-checked with its orders by checkLevelDrawing (an independent crossing test). With a bound on
 * the rows' widths, only the assignments whose widest row, counted by the test itself, stays under
 * it are enumerated; for the 'least' estimate a row counts its boxes and the least gaps over every
 * left-to-right pattern of its boxes and bends (brute force). Also: the
 * North DAG g.30.12 (/work/shared/data/north, see SOURCE.md there), where the search proves that its
 * longest path's 8 rows cannot be drawn without crossings (dagre draws 8 rows with crossings) and
 * finds 9.
 */
import {describe, expect, it} from 'vitest'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {searchLevels, type LevelSearch} from '../src/layout/level-search.ts'
import {longestPathToSinks, longestPathUp} from '../src/layout/layering.ts'
import {testLevelPlanarity, type LevelItem} from '../src/level/level-planarity.ts'
import {checkLevelDrawing} from '../src/level/check-level-drawing.ts'
import {prng} from './support/layout-st-generator.ts'
import {readGraphml} from './support/graphml.ts'
import {northDir} from './support/north-dags.ts'

function randomDag(rand: () => number, n: number, p: number): Digraph {
  const perm = Array.from({length: n}, (_, i) => i)
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1))
    ;[perm[i], perm[j]] = [perm[j]!, perm[i]!]
  }
  const edges: Array<[number, number]> = []
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rand() < p) edges.push([perm[i]!, perm[j]!])
  return createDigraph(n, edges)
}

/** Whether some assignment within `rows` levels (and that `accept` takes) is level planar, by enumeration. */
function existsByEnumeration(g: Digraph, rows: number, accept: (level: Int32Array) => boolean = () => true): boolean {
  const n = g.vertexCount
  const up = longestPathUp(g)
  const down = longestPathToSinks(g)
  const level = new Int32Array(n)
  const go = (v: number): boolean => {
    if (v === n) {
      for (let e = 0; e < g.edgeCount; e++) if (level[g.head[e]!]! <= level[g.tail[e]!]!) return false
      return accept(level) && testLevelPlanarity(g, level).status === 'planar'
    }
    for (let l = up[v]!; l <= rows - 1 - down[v]!; l++) {
      level[v] = l
      if (go(v + 1)) return true
    }
    return false
  }
  return go(0)
}

function checkFound(g: Digraph, rows: number, level: Int32Array, orders: Parameters<typeof checkLevelDrawing>[2]): string | undefined {
  for (let e = 0; e < g.edgeCount; e++) if (level[g.head[e]!]! <= level[g.tail[e]!]!) return `edge ${e} does not go up`
  const height = Math.max(...level) + 1
  if (height > rows) return `${height} rows, more than ${rows}`
  const used = new Set(level)
  if (used.size !== height) return 'an empty level'
  const check = checkLevelDrawing(g, level, orders)
  return check.ok ? undefined : check.reason
}

interface Tally {
  failures: string[]
  found: number
  none: number
}

/**
 * searchLevels on g within `rows`, unguided and with a random guide, against existsByEnumeration;
 * each assignment found re-checked (checkFound). Disagreements go to tally.failures under `label`.
 */
function compareWithEnumeration(g: Digraph, rows: number, rand: () => number, label: string, tally: Tally): void {
  const expected = existsByEnumeration(g, rows)
  const guide = Int32Array.from({length: g.vertexCount}, () => Math.floor(rand() * rows))
  for (const r of [searchLevels(g, rows, {tests: 1e6, work: 1e9}), searchLevels(g, rows, {tests: 1e6, work: 1e9}, guide)]) judgeAnswer(g, rows, r, expected, label, tally)
}

/**
 * One answer of searchLevels against the enumeration's `expected`: a stop or a disagreement is a
 * failure; a find is counted and re-checked (checkFound, then `more`, the test's own checks of it),
 * a "none" counted.
 */
function judgeAnswer(g: Digraph, rows: number, r: LevelSearch, expected: boolean, label: string, tally: Tally, more?: (found: Extract<LevelSearch, {status: 'found'}>) => string[]): void {
  if (r.status === 'stopped') tally.failures.push(`${label}: stopped`)
  else if ((r.status === 'found') !== expected) tally.failures.push(`${label}: ${r.status}, enumeration says ${expected}`)
  if (r.status === 'none') tally.none++
  if (r.status !== 'found') return
  tally.found++
  const bad = checkFound(g, rows, r.level, r.orders)
  if (bad) tally.failures.push(`${label}: ${bad}`)
  for (const problem of more?.(r) ?? []) tally.failures.push(`${label}: ${problem}`)
}

/** The least sum of gaps over every left-to-right pattern of `boxes` boxes and `bends` bends (memoised). */
const gapMemo = new Map<string, number>()
function bruteGaps(boxes: number, bends: number, nodeGap: number, edgeGap: number): number {
  const key = `${boxes} ${bends} ${nodeGap} ${edgeGap}`
  const known = gapMemo.get(key)
  if (known !== undefined) return known
  let least = Infinity
  // last: 0 nothing yet, 1 a box, 2 a bend.
  const go = (b: number, p: number, last: number, sum: number): void => {
    if (b === 0 && p === 0) least = Math.min(least, sum)
    if (b > 0) go(b - 1, p, 1, sum + (last === 1 ? nodeGap : last === 2 ? edgeGap : 0))
    if (p > 0) go(b, p - 1, 2, sum + (last === 0 ? 0 : edgeGap))
  }
  go(boxes, bends, 0, 0)
  gapMemo.set(key, least)
  return least
}

/**
 * searchLevels with a RowWidthBound (`estimate`) on 300 random DAGs of 5 to 9 vertices against
 * enumeration of the level-planar assignments whose widest row (`widest`, the test's own count) is
 * below the bound; the bound drawn between the narrowest and the widest level-planar assignment's
 * widest row (and at the narrowest, where none is narrower); unguided and guided, each find
 * re-checked (checkFound, and its widest row).
 */
function boundAgainstEnumeration(
  rand: () => number,
  drawGaps: (rand: () => number) => {nodeGap: number; edgeGap: number},
  estimate: 'least' | undefined,
  widest: (g: Digraph, level: Int32Array, across: number[], gaps: {nodeGap: number; edgeGap: number}) => number
): {failures: string[]; found: number; none: number} {
  const tally: Tally = {failures: [], found: 0, none: 0}
  for (let c = 0; c < 300; c++) {
    const n = 5 + Math.floor(rand() * 5)
    const g = randomDag(rand, n, 0.25 + rand() * 0.35)
    if (g.edgeCount === 0) continue
    const across = Array.from({length: n}, () => 20 + Math.floor(rand() * 60))
    const rows = Math.max(...longestPathUp(g)) + 1 + Math.floor(rand() * 3)
    const gaps = drawGaps(rand)
    const widths: number[] = []
    existsByEnumeration(g, rows, (level) => {
      if (testLevelPlanarity(g, level).status === 'planar') widths.push(widest(g, level, across, gaps))
      return false
    })
    if (widths.length === 0) continue
    const lo = Math.min(...widths)
    const hi = Math.max(...widths)
    for (const below of [lo, lo + 1 + Math.floor(rand() * (hi - lo + 1))]) {
      const expected = widths.some((w) => w < below)
      const guide = Int32Array.from({length: n}, () => Math.floor(rand() * rows))
      const bound = {across, ...gaps, below, ...(estimate ? {estimate} : {})}
      const label = `case ${c} rows ${rows} gaps ${gaps.nodeGap}/${gaps.edgeGap} below ${below}`
      const narrow = (r: {level: Int32Array}): string[] => (widest(g, r.level, across, gaps) >= below ? [`widest row ${widest(g, r.level, across, gaps)}, not below ${below}`] : [])
      for (const r of [searchLevels(g, rows, {tests: 1e6, work: 1e9}, undefined, bound), searchLevels(g, rows, {tests: 1e6, work: 1e9}, guide, bound)]) judgeAnswer(g, rows, r, expected, label, tally, narrow)
    }
  }
  return tally
}

describe('searchLevels against exhaustive enumeration', () => {
  it('agrees on 600 random DAGs of 5 to 9 vertices, guided or not, each assignment found re-checked', () => {
    const rand = prng(20261202)
    const tally: Tally = {failures: [], found: 0, none: 0}
    for (let c = 0; c < 600; c++) {
      const n = 5 + Math.floor(rand() * 5)
      const g = randomDag(rand, n, 0.25 + rand() * 0.35)
      if (g.edgeCount === 0) continue
      const least = Math.max(...longestPathUp(g)) + 1
      for (let rows = least; rows <= least + 2; rows++) {
        compareWithEnumeration(g, rows, rand, `case ${c} rows ${rows}`, tally)
      }
    }
    expect(tally.failures).toEqual([])
    // Both answers occur (the rows are set at the longest path and up to two above).
    expect(tally.found).toBeGreaterThan(100)
    expect(tally.none).toBeGreaterThan(20)
  })

  it('agrees on sparser DAGs of 10 to 13 vertices, where tests are skipped and odd cycles recur (nogoods)', () => {
    // Sparse graphs keep the windows wide and the search deep: many vertices close a cycle (every
    // second one untested) and the search returns to levels it has ruled out before.
    const rand = prng(20261203)
    const tally: Tally = {failures: [], found: 0, none: 0}
    for (let c = 0; c < 300 && tally.found + tally.none < 160; c++) {
      const n = 10 + Math.floor(rand() * 4)
      const g = randomDag(rand, n, 0.18 + rand() * 0.12)
      if (g.edgeCount === 0) continue
      const up = longestPathUp(g)
      const down = longestPathToSinks(g)
      const least = Math.max(...up) + 1
      for (let rows = least; rows <= least + 1; rows++) {
        let assignments = 1
        for (let v = 0; v < n; v++) assignments *= rows - up[v]! - down[v]!
        if (assignments > 20_000) continue
        compareWithEnumeration(g, rows, rand, `case ${c} rows ${rows}`, tally)
      }
    }
    expect(tally.failures).toEqual([])
    expect(tally.found).toBeGreaterThan(20)
    expect(tally.none).toBeGreaterThan(20)
  })

  it('with a bound on the row widths, agrees with enumeration of the assignments that keep it', () => {
    // Each row's width counted here on its own terms: every box on it plus the box gap, and the edge
    // gap for each edge passing through it; the bound is drawn between the narrowest and the widest
    // level-planar assignment's widest row (and at the narrowest, where none is narrower). The edge
    // gap is large (50) and the rows up to two above the longest path, so passing edges often decide
    // (leaving their ends out of the culprits makes the search answer a wrong "none" here).
    const {failures, found, none} = boundAgainstEnumeration(prng(20261204), () => ({nodeGap: 24, edgeGap: 50}), undefined, (g, level, across, gaps) => {
      const rows = new Map<number, number>()
      for (let v = 0; v < g.vertexCount; v++) rows.set(level[v]!, (rows.get(level[v]!) ?? 0) + across[v]! + gaps.nodeGap)
      for (let e = 0; e < g.edgeCount; e++) for (let r = level[g.tail[e]!]! + 1; r < level[g.head[e]!]!; r++) rows.set(r, (rows.get(r) ?? 0) + gaps.edgeGap)
      return Math.max(...rows.values())
    })
    expect(failures).toEqual([])
    expect(found).toBeGreaterThan(100)
    expect(none).toBeGreaterThan(100)
  })

  it("with the 'least' estimate, agrees with enumeration of the assignments whose rows every order keeps under the bound", () => {
    // A row's least width counted here by brute force: its boxes' extents plus the least sum of gaps
    // over every left-to-right pattern of its boxes and bends (box gap between two boxes, edge gap
    // next to a bend); levels without a box are dropped, as the search drops them. Gaps drawn so that
    // a bend between two boxes is sometimes cheaper than the box gap (then more bends narrow a row,
    // and a partial row must be counted at the least it can come to), and the edge gap sometimes the
    // larger, at times by far. Counting partial rows at their present bends, checking whole
    // assignments at the bends to come, or leaving the passing edges' ends out of the culprits fails
    // this test. (Levels without boxes change no answer: the same levels closed up are searched too.)
    const {failures, found, none} = boundAgainstEnumeration(
      prng(20261205),
      (rand) => ({nodeGap: 5 + Math.floor(rand() * 40), edgeGap: rand() < 0.3 ? 40 + Math.floor(rand() * 60) : 2 + Math.floor(rand() * 30)}),
      'least',
      (g, level, across, gaps) => {
        const rows = new Map<number, {width: number; boxes: number; bends: number}>()
        for (let v = 0; v < g.vertexCount; v++) {
          const row = rows.get(level[v]!) ?? {width: 0, boxes: 0, bends: 0}
          row.width += across[v]!
          row.boxes++
          rows.set(level[v]!, row)
        }
        for (let e = 0; e < g.edgeCount; e++) {
          for (let r = level[g.tail[e]!]! + 1; r < level[g.head[e]!]!; r++) {
            const row = rows.get(r)
            if (row) row.bends++
          }
        }
        let widest = 0
        for (const row of rows.values()) widest = Math.max(widest, row.width + bruteGaps(row.boxes, row.bends, gaps.nodeGap, gaps.edgeGap))
        return widest
      }
    )
    expect(failures).toEqual([])
    expect(found).toBeGreaterThan(100)
    expect(none).toBeGreaterThan(100)
  })

  it('with written-order vertices, agrees with enumeration of the assignments that have a witness keeping them', () => {
    // The oracle per whole assignment: the level test with forced pairs built here (each written
    // vertex's out-edges, by id, meet the level above it left to right: the head there, else the
    // edge's point). The search forces the pairs of the placed part on every test; blaming only the
    // last vertex placed for a refutation by the witness search (not every placed one) answers a
    // wrong "none" here (4 of 1,656 answers). Each find's orders are read back: every written
    // vertex's out-edges in id order. 7 to 9 vertices, every vertex with two out-edges written.
    const rand = prng(20261206)
    const tally: Tally = {failures: [], found: 0, none: 0}
    for (let c = 0; c < 300; c++) {
      const n = 7 + Math.floor(rand() * 3)
      const g = randomDag(rand, n, 0.2 + rand() * 0.2)
      const written: number[] = []
      for (let v = 0; v < n; v++) if (g.outStart[v + 1]! - g.outStart[v]! >= 2) written.push(v)
      if (written.length === 0) continue
      const next = (level: ArrayLike<number>, e: number): {kind: 'vertex'; vertex: number} | {kind: 'edge'; edge: number} =>
        level[g.head[e]!] === level[g.tail[e]!]! + 1 ? {kind: 'vertex', vertex: g.head[e]!} : {kind: 'edge', edge: e}
      const forcedOf = (level: Int32Array) =>
        written.flatMap((v) => {
          const outs = Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
          return outs.slice(1).flatMap((e, k) => {
            const [a, b] = [next(level, outs[k]!), next(level, e)]
            return a.kind === 'vertex' && b.kind === 'vertex' && a.vertex === b.vertex ? [] : [{level: level[v]! + 1, left: a, right: b}]
          })
        })
      const least = Math.max(...longestPathUp(g)) + 1
      for (let rows = least; rows <= least + 2; rows++) {
        const expected = existsByEnumeration(g, rows, (level) => testLevelPlanarity(g, level, {forced: forcedOf(level)}).status === 'planar')
        const guide = Int32Array.from({length: n}, () => Math.floor(rand() * rows))
        // Each find's orders read back: every written vertex's out-edges in id order.
        const inOrder = (r: {level: Int32Array; orders: LevelItem[][]}): string[] => {
          const place = new Map(r.orders.flatMap((items) => items.map((item, i) => [item.kind === 'vertex' ? `v${item.vertex}` : `e${item.edge}`, i] as const)))
          const problems: string[] = []
          for (const v of written) {
            const outs = Array.from(g.outEdges.subarray(g.outStart[v]!, g.outStart[v + 1]!)).sort((a, b) => a - b)
            const at = outs.map((e) => {
              const item = next(r.level, e)
              // An edge's key names its point on every level it passes; the one above v is the first.
              return item.kind === 'vertex' ? place.get(`v${item.vertex}`)! : r.orders[r.level[v]! + 1]!.findIndex((x) => x.kind === 'edge' && x.edge === e)
            })
            if (at.some((x, k) => k > 0 && x < at[k - 1]!)) problems.push(`vertex ${v}'s out-edges not in written order`)
          }
          return problems
        }
        const label = `case ${c} rows ${rows} written ${written}`
        for (const r of [searchLevels(g, rows, {tests: 1e6, work: 1e9}, undefined, undefined, written), searchLevels(g, rows, {tests: 1e6, work: 1e9}, guide, undefined, written)]) judgeAnswer(g, rows, r, expected, label, tally, inOrder)
      }
    }
    expect(tally.failures).toEqual([])
    expect(tally.found).toBeGreaterThan(100)
    expect(tally.none).toBeGreaterThan(30)
  })

  it('with an area bound, agrees with enumeration of the assignments whose widest least row times height stays under it', () => {
    // Reference per whole assignment, counted here: levels without boxes dropped; the widest row's
    // boxes plus the least gaps over every pattern of its boxes and bends (bruteGaps); the height, each
    // row's tallest box plus a layer gap between consecutive rows, half of it next to a row whose
    // tallest box has no extent (banded-drawing.ts's bandCentres). The area bound drawn at the least
    // such area (none below it), just above it, and between the least and the largest; boxes one or
    // two lines tall, some of no extent. So every assignment the search rules out by the area really
    // is at least the bound, and the culprits are enough: leaving out the tallest box of each row
    // answers a wrong "none" here, and so does blaming only those and the widest row's vertices when
    // the whole assignment is ruled out with its rows' own bends (another assignment with the same
    // levels of those vertices can have more bends on that row, which can narrow it).
    const rand = prng(20261207)
    const tally: Tally = {failures: [], found: 0, none: 0}
    for (let c = 0; c < 300; c++) {
      const n = 5 + Math.floor(rand() * 5)
      const g = randomDag(rand, n, 0.25 + rand() * 0.35)
      if (g.edgeCount === 0) continue
      const across = Array.from({length: n}, () => 20 + Math.floor(rand() * 60))
      const along = Array.from({length: n}, () => [0, 18, 18, 18, 34, 34][Math.floor(rand() * 6)]!)
      const rows = Math.max(...longestPathUp(g)) + 1 + Math.floor(rand() * 3)
      const gaps = {nodeGap: 5 + Math.floor(rand() * 40), edgeGap: rand() < 0.3 ? 40 + Math.floor(rand() * 60) : 2 + Math.floor(rand() * 30)}
      const layerGap = 10 + Math.floor(rand() * 40)
      const areaOf = (level: Int32Array): number => {
        const row = new Map<number, {width: number; boxes: number; bends: number; tallest: number}>()
        for (let v = 0; v < n; v++) {
          const r = row.get(level[v]!) ?? {width: 0, boxes: 0, bends: 0, tallest: 0}
          r.width += across[v]!
          r.boxes++
          r.tallest = Math.max(r.tallest, along[v]!)
          row.set(level[v]!, r)
        }
        for (let e = 0; e < g.edgeCount; e++) for (let l = level[g.tail[e]!]! + 1; l < level[g.head[e]!]!; l++) if (row.has(l)) row.get(l)!.bends++
        const used = Array.from(row.keys()).sort((a, b) => a - b)
        let widest = 0
        let height = 0
        used.forEach((l, k) => {
          const r = row.get(l)!
          widest = Math.max(widest, r.width + bruteGaps(r.boxes, r.bends, gaps.nodeGap, gaps.edgeGap))
          height += r.tallest
          if (k > 0) height += row.get(used[k - 1]!)!.tallest > 0 && r.tallest > 0 ? layerGap : layerGap / 2
        })
        return widest * height
      }
      const areas: number[] = []
      existsByEnumeration(g, rows, (level) => {
        if (testLevelPlanarity(g, level).status === 'planar') areas.push(areaOf(level))
        return false
      })
      if (areas.length === 0) continue
      const lo = Math.min(...areas)
      const hi = Math.max(...areas)
      for (const below of [lo, lo + 0.5, lo + rand() * (hi - lo + 1)]) {
        const expected = areas.some((a) => a < below)
        const guide = Int32Array.from({length: n}, () => Math.floor(rand() * rows))
        const bound = {across, ...gaps, below: Infinity, estimate: 'least' as const, area: {along, layerGap, below}}
        const label = `case ${c} rows ${rows} gaps ${gaps.nodeGap}/${gaps.edgeGap}/${layerGap} below ${below}`
        const small = (r: {level: Int32Array}): string[] => (areaOf(r.level) >= below ? [`area ${areaOf(r.level)}, not below ${below}`] : [])
        for (const r of [searchLevels(g, rows, {tests: 1e6, work: 1e9}, undefined, bound), searchLevels(g, rows, {tests: 1e6, work: 1e9}, guide, bound)]) judgeAnswer(g, rows, r, expected, label, tally, small)
      }
    }
    expect(tally.failures).toEqual([])
    expect(tally.found).toBeGreaterThan(200)
    expect(tally.none).toBeGreaterThan(200)
  })

  it('stops within its budget and spends it in place, deterministically', () => {
    const {vertexCount, edges} = readGraphml(`${northDir}/g.37.18.graphml`)
    const g = createDigraph(vertexCount, edges)
    const a = {tests: 40, work: 1e9}
    const b = {tests: 40, work: 1e9}
    const ra = searchLevels(g, 10, a)
    const rb = searchLevels(g, 10, b)
    expect(ra.status).toBe('stopped')
    expect(a.tests).toBe(0)
    expect(JSON.stringify(rb)).toBe(JSON.stringify(ra))
    expect(b).toEqual(a)
  })

  it('g.30.12: no level-planar drawing in its longest path of 8 rows, one in 9', () => {
    const {vertexCount, edges} = readGraphml(`${northDir}/g.30.12.graphml`)
    const g = createDigraph(vertexCount, edges)
    expect(Math.max(...longestPathUp(g)) + 1).toBe(8)
    expect(searchLevels(g, 8, {tests: 10_000, work: 1e9}).status).toBe('none')
    const r = searchLevels(g, 9, {tests: 10_000, work: 1e9})
    expect(r.status).toBe('found')
    if (r.status === 'found') expect(checkFound(g, 9, r.level, r.orders)).toBeUndefined()
  })
})
