/**
 * Load never changes a decided answer or a drawing. A loaded machine is a clock that runs fast
 * compared with the work done, so every diagram below is checked and drawn twice with injected clocks:
 * one that never moves (no budget can run out: the answer of an idle machine; it also counts the
 * reads R) and one that moves 0.9 · budget / R ms at every read, so the slowed run ends at 90% of the
 * 3 s budget (asserted) with the clock read as often as the idle run reads it. Any time slice
 * shorter than the whole budget (a fast path that gives up after some milliseconds and falls to
 * another route, a search that keeps the first embedding found within a slice) would read the slowed
 * clock past its slice and change the route, the embedding and so the SVG; only the whole budget may
 * end a check, and then as `undecided`.
 *
 * Covers: checkDiagram (status, diagnostics, certificate, fix suggestion) → drawDiagram → renderSvg,
 * byte for byte, on every 16th North DAG (upward and not; /work/shared/data/north, SOURCE.md there),
 * every demo handbook diagram (site-demo/pages) and every golden fixture input; and testUpwardPlanarity
 * itself (status, reason, method, embedding) on the same North DAGs, which must reach the branch and
 * bound, the single-source test and the cheap paths; and the warn-mode fallback layout (fallback/) of
 * the first 8 of every 5th not-upward North DAG up to 60 vertices (g.10.27 among them drew 3 vs 4
 * crossings when each edge order had a time share of the budget).
 */
import {readFileSync, readdirSync} from 'node:fs'
import {describe, expect, it} from 'vitest'
import {checkDiagram, defaultBudgetMillis, type DiagramCheck} from '../src/check/index.ts'
import {drawDiagram} from '../src/draw/index.ts'
import type {Flow} from '../src/layout/index.ts'
import {testUpwardPlanarity} from '../src/upward/index.ts'
import {renderSvg} from '../../svg/src/index.ts'
import {northDir, northFiles, notUpwardNorthDags} from './support/north-dags.ts'
import {layoutFallback} from '../src/fallback/index.ts'
import {readGraphml} from './support/graphml.ts'
import {createDigraph} from '../src/graph/digraph.ts'

/** A clock that advances `step` ms per read, and how far it went and how often it was read. */
function steppingClock(step: number): {now: () => number; elapsed: () => number; reads: () => number} {
  let t = 0
  let reads = 0
  return {now: () => (reads++, (t += step)), elapsed: () => t, reads: () => reads}
}

/** Runs f on a frozen clock (counting reads), then on one slowed to end at 90% of the budget. */
function idleAndLoaded<T>(f: (now: () => number) => T): {idle: T; loaded: T; loadedMillis: number} {
  const frozen = steppingClock(0)
  const idle = f(frozen.now)
  const slow = steppingClock((0.9 * defaultBudgetMillis) / Math.max(1, frozen.reads()))
  const loaded = f(slow.now)
  return {idle, loaded, loadedMillis: slow.elapsed()}
}

/** What a reader gets from one diagram: the check's outcome and, when it passes, the SVG. */
function outcome(text: string, flow: Flow, now: () => number): {status: string; check: string; svg: string} {
  const check: DiagramCheck = checkDiagram(text, {now})
  const drawn = drawDiagram(check, {flow})
  const svg = drawn.ok
    ? renderSvg({layout: drawn.drawing.layout, graph: drawn.drawing.graph, labels: drawn.drawing.labels, ids: drawn.drawing.ids, tones: drawn.drawing.tones, links: drawn.drawing.links, edgeLabels: drawn.drawing.edgeLabels, tiers: drawn.drawing.tiers}).svg
    : ''
  const {status, diagnostics, certificate, fix} = check
  return {status, check: JSON.stringify({diagnostics, certificate, fix}), svg}
}

function expectSameUnderLoad(name: string, text: string, flow: Flow): string {
  const {idle, loaded, loadedMillis} = idleAndLoaded((now) => outcome(text, flow, now))
  expect(loadedMillis, `${name}: the slowed run must stay inside the budget`).toBeLessThan(defaultBudgetMillis)
  expect(loaded.status, name).toBe(idle.status)
  expect(loaded.check, name).toBe(idle.check)
  expect(loaded.svg, name).toBe(idle.svg)
  // The same route reads the clock as often: the slowed run ends at 90% of the budget.
  expect(loadedMillis, name).toBeGreaterThan(0.8 * defaultBudgetMillis)
  return idle.status
}

const northSample = northFiles().filter((_, i) => i % 16 === 0)
const northText = (file: string): {text: string; vertexCount: number; edges: [number, number][]} => {
  const {vertexCount, edges} = readGraphml(`${northDir}/${file}`)
  return {text: edges.map(([a, b]) => `v${a} -> v${b}`).join('\n'), vertexCount, edges}
}

/** The ```upright blocks of the demo handbook, with the flow their fence names. */
function demoBlocks(): Array<{name: string; text: string; flow: Flow}> {
  const dir = new URL('../../../site-demo/pages/', import.meta.url)
  const out: Array<{name: string; text: string; flow: Flow}> = []
  for (const page of readdirSync(dir).filter((f) => f.endsWith('.md')).sort()) {
    const md = readFileSync(new URL(page, dir), 'utf8')
    for (const m of md.matchAll(/^```upright([^\n]*)\n([\s\S]*?)^```/gm)) {
      const flow = (/flow=(\w+)/.exec(m[1]!)?.[1] ?? 'up') as Flow
      out.push({name: `${page} #${out.length}`, text: m[2]!, flow})
    }
  }
  return out
}

/** The golden fixtures' inputs, with the flow their args.json names. */
function goldenInputs(): Array<{name: string; text: string; flow: Flow}> {
  const dir = new URL('../../../fixtures/golden/', import.meta.url)
  return readdirSync(dir, {withFileTypes: true})
    .filter((d) => d.isDirectory())
    .map((d) => d.name)
    .sort()
    .map((name) => {
      let args: string[] = []
      try {
        args = JSON.parse(readFileSync(new URL(`${name}/args.json`, dir), 'utf8')) as string[]
      } catch {
        // no args.json: default flags
      }
      const at = args.indexOf('--flow')
      return {name, text: readFileSync(new URL(`${name}/input.upright`, dir), 'utf8'), flow: (at >= 0 ? args[at + 1] : 'up') as Flow}
    })
}

describe('a slowed clock changes no decided answer and no drawing', () => {
  it('North DAGs: same check and byte-identical SVG', () => {
    const statuses = new Map<string, number>()
    for (const file of northSample) {
      const status = expectSameUnderLoad(file, northText(file).text, 'up')
      statuses.set(status, (statuses.get(status) ?? 0) + 1)
    }
    // Drawings and certificates are compared, and nothing ran out of budget.
    expect(statuses.get('upward'), JSON.stringify([...statuses])).toBeGreaterThan(30)
    expect((statuses.get('not-upward') ?? 0) + (statuses.get('nonplanar') ?? 0), JSON.stringify([...statuses])).toBeGreaterThan(10)
    expect(statuses.has('undecided')).toBe(false)
  }, 600_000)

  it('demo handbook diagrams and golden fixtures: same check and byte-identical SVG', () => {
    const cases = [...demoBlocks(), ...goldenInputs()]
    expect(cases.length).toBeGreaterThanOrEqual(25)
    let drawn = 0
    for (const c of cases) if (expectSameUnderLoad(c.name, c.text, c.flow) === 'upward') drawn++
    expect(drawn).toBeGreaterThanOrEqual(25)
  }, 300_000)

  it('testUpwardPlanarity: same status, reason, method and embedding on every route', () => {
    const methods = new Set<string>()
    for (const file of northSample) {
      const {vertexCount, edges} = northText(file)
      const g = createDigraph(vertexCount, edges)
      const {idle, loaded, loadedMillis} = idleAndLoaded((now) => testUpwardPlanarity(g, {maxMillis: defaultBudgetMillis, now}))
      expect(loadedMillis, file).toBeLessThan(defaultBudgetMillis)
      expect(loaded.status, file).toBe(idle.status)
      if (idle.status === 'undecided' || loaded.status === 'undecided') throw new Error(`${file}: undecided`)
      expect(loaded.method, file).toBe(idle.method)
      if (idle.status === 'upward' && loaded.status === 'upward') {
        expect(loaded.upward.embedding.rotation.map((r) => Array.from(r)), file).toEqual(idle.upward.embedding.rotation.map((r) => Array.from(r)))
        expect(JSON.stringify(loaded.upward, (_, v) => (ArrayBuffer.isView(v) ? Array.from(v as Int32Array) : v))).toBe(
          JSON.stringify(idle.upward, (_, v) => (ArrayBuffer.isView(v) ? Array.from(v as Int32Array) : v))
        )
      }
      if (idle.status === 'not-upward' && loaded.status === 'not-upward') expect(loaded.reason, file).toBe(idle.reason)
      expect(loadedMillis, file).toBeGreaterThan(0.8 * defaultBudgetMillis)
      methods.add(idle.method)
    }
    // The routes where a time slice could hide: the branch and bound, the single-source test, the cheap paths.
    for (const m of ['search', 'single-source', 'first-embedding']) expect(methods, [...methods].join(', ')).toContain(m)
  }, 600_000)

  it('the fallback layout of not-upward North DAGs', () => {
    let compared = 0
    for (const dag of notUpwardNorthDags(0, 5, 60)) {
      if (compared === 8) break
      compared++
      const boxes = Array.from({length: dag.vertexCount}, () => ({width: 40, height: 20}))
      const {idle, loaded, loadedMillis} = idleAndLoaded((now) => layoutFallback(dag.graph, {flow: 'up', boxes, budget: {maxMillis: defaultBudgetMillis, now}}))
      expect(loadedMillis, dag.file).toBeLessThan(defaultBudgetMillis)
      expect(JSON.stringify(loaded), dag.file).toBe(JSON.stringify(idle))
      expect(loadedMillis, dag.file).toBeGreaterThan(0.8 * defaultBudgetMillis)
    }
    expect(compared).toBe(8)
  }, 600_000)
})
