/**
 * The budget holds at 10,000 vertices: the parse looks at the clock every 256 lines and stops once
 * it has passed the deadline, and after parsing no stage of the check starts past it, whatever that
 * stage is (cycle test, planarity, the upward test's reductions and fast paths, the search), so a
 * short budget answers `undecided` instead of running each linear stage to its end. The clock is injected (as in fuzz-budget.test.ts), so nothing here
 * depends on how fast the machine is.
 *
 * A stage that starts late is visible on such a clock only through what it decides: a diagram whose
 * planarity test would say `nonplanar` must not say so when the deadline passed before that test.
 * And at every moment the deadline may pass, the answer is the true one or `undecided`, never
 * another, and the check stops within a few clock reads of it.
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, parseDiagram, type DiagramCheck} from '../src/index.ts'
import {mulberry32} from '../../../test/support/random.ts'

const noLimits = {maxVertices: Infinity, maxEdges: Infinity, maxTextBytes: Infinity, maxLineLength: Infinity, maxLabelLength: Infinity}

/**
 * A k×k grid, edges right and up, one diagonal per cell, each edge kept with probability `keep`:
 * planar (a subgraph of a triangulated grid) and acyclic (every edge raises i + (k+1)·j), with many
 * sources and sinks when keep < 1 — the general family of bench/growth.ts.
 */
function grid(k: number, keep: number, seed: number): Array<[number, number]> {
  const rnd = mulberry32(seed)
  const id = (i: number, j: number) => i + k * j
  const edges: Array<[number, number]> = []
  for (let j = 0; j < k; j++) {
    for (let i = 0; i < k; i++) {
      const candidates: Array<[number, number]> = []
      if (i + 1 < k) candidates.push([id(i, j), id(i + 1, j)])
      if (j + 1 < k) candidates.push([id(i, j), id(i, j + 1)])
      if (i + 1 < k && j + 1 < k) candidates.push(rnd() < 0.5 ? [id(i, j), id(i + 1, j + 1)] : [id(i + 1, j), id(i, j + 1)])
      for (const e of candidates) if (rnd() < keep) edges.push(e)
    }
  }
  return edges
}

const text = (edges: Array<[number, number]>, extra = '') => edges.map(([a, b]) => `v${a} -> v${b}`).join('\n') + extra

/** K3,3 oriented from one side to the other: acyclic and not planar (Kuratowski 1930). */
const k33 = '\nx1 -> y1, y2, y3\nx2 -> y1, y2, y3\nx3 -> y1, y2, y3\n'

/**
 * A clock that stands at 0 until read number `expireAt`, which finds the deadline passed; from then on
 * each read is a whole budget later than the one before (as if every stage took that long), so a
 * part of the check that takes what is left of the budget as its own finds it gone at its next read.
 * Counts the reads after the first one past the deadline. The first read sets the deadline, so
 * `expireAt` ≥ 2.
 */
function jumpClock(expireAt: number, budget: number) {
  const clock = {reads: 0, late: 0, now: (): number => 0}
  clock.now = () => {
    clock.reads++
    if (clock.reads < expireAt) return 0
    if (clock.reads > expireAt) clock.late++
    return (budget + 1) * (1 + clock.reads - expireAt)
  }
  return clock
}

const budget = 200
const edges = grid(100, 0.6, 82)
const general = text(edges)
const nonplanar = text(edges, k33)

describe('the budget at 10,000 vertices', () => {
  it('with time to spare, the grid with K3,3 added is nonplanar', () => {
    const check = checkDiagram(nonplanar, {budgetMillis: budget, now: () => 0, limits: noLimits})
    expect(check.parsed.vertices.length).toBe(new Set(edges.flat()).size + 6)
    expect(check.parsed.vertices.length).toBeGreaterThan(9_900)
    expect(check.status).toBe('nonplanar')
  })

  it('stops the parse itself at the deadline: past it at the parser\'s first look, the rest is not read', () => {
    // Read 1 sets the deadline; the parser looks every 256 lines, so read 2 is its first look.
    for (const source of [general, nonplanar]) {
      const clock = jumpClock(2, budget)
      const check: DiagramCheck = checkDiagram(source, {budgetMillis: budget, now: clock.now, limits: noLimits})
      expect(check.status).toBe('undecided')
      expect(check.graph).toBeUndefined()
      expect(check.parsed.outOfTime?.start.line).toBe(256)
      expect(check.parsed.edges.length).toBe(255)
      expect(check.diagnostics.map((d) => d.ruleId)).toEqual(['undecided'])
      expect(clock.late).toBeLessThanOrEqual(1)
    }
    // A short diagram is parsed without reading the clock: its answer cannot depend on load.
    let reads = 0
    parseDiagram(text(edges.slice(0, 255)), {expired: () => (reads++, true)})
    expect(reads).toBe(0)
  })

  it('starts no stage after the deadline: past it right after parsing, even planarity does not run', () => {
    for (const source of [general, nonplanar]) {
      // Read 1 sets the deadline, the parser's reads follow; the next one is the first look after parsing.
      let parseReads = 0
      parseDiagram(source, {expired: () => (parseReads++, false)})
      expect(parseReads).toBe(Math.floor(source.split('\n').length / 256))
      const clock = jumpClock(2 + parseReads, budget)
      const check: DiagramCheck = checkDiagram(source, {budgetMillis: budget, now: clock.now, limits: noLimits})
      expect(check.status).toBe('undecided')
      expect(check.graph?.vertexCount).toBe(check.parsed.vertices.length)
      expect(check.diagnostics.at(-1)?.ruleId).toBe('undecided')
      expect(clock.late).toBeLessThanOrEqual(1)
    }
  })

  it('answers the truth or undecided wherever the deadline falls, and stops within three reads of it', () => {
    // The reads after it: a part taking the rest of the budget as its own (its own start, its first
    // look), and checkDiagram working out what is left for the fix suggestion.
    // Every read of a run with no deadline is a moment the deadline can fall on.
    let total = 0
    checkDiagram(nonplanar, {budgetMillis: budget, now: () => (total++, 0), limits: noLimits})
    for (let at = 2; at <= total + 1; at++) {
      const clock = jumpClock(at, budget)
      const check = checkDiagram(nonplanar, {budgetMillis: budget, now: clock.now, limits: noLimits})
      expect(['nonplanar', 'undecided'], `deadline at read ${at}`).toContain(check.status)
      expect(clock.late, `deadline at read ${at}`).toBeLessThanOrEqual(3)
    }
    // The general grid is a subgraph of a planar st-graph, hence upward planar (Di Battista &
    // Tamassia 1988): its truth is `upward`.
    const statuses = new Set<string>()
    for (const at of [2, 3, 4, 5, 6, 7, 8, 12, 20, 40]) {
      const clock = jumpClock(at, budget)
      const check = checkDiagram(general, {budgetMillis: budget, now: clock.now, limits: noLimits})
      statuses.add(check.status)
      expect(['upward', 'undecided'], `deadline at read ${at}`).toContain(check.status)
      expect(clock.late, `deadline at read ${at}`).toBeLessThanOrEqual(3)
    }
    expect(statuses).toContain('undecided')
  })
})
