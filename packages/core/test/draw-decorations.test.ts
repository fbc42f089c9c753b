/**
 * Tiers and edge labels in drawings: drawDiagram's output for fixtures and random diagrams goes
 * through the independent checker extended to label boxes and tier levels (support/decorated-check.ts),
 * in all four flows. The checker itself is shown to reject broken drawings first.
 */
import {readFileSync, readdirSync} from 'node:fs'
import {describe, expect, it} from 'vitest'
import {checkDiagram, type DiagramCheck} from '../src/check/index.ts'
import {drawDiagram, EDGE_LABEL_BOX, type Drawing} from '../src/draw/index.ts'
import type {Flow, Layout} from '../src/layout/index.ts'
import {labelBox} from '../src/measure/index.ts'
import {mulberry32, randomInt} from '../../../test/support/random.ts'
import {checkDecoratedDrawing} from './support/decorated-check.ts'
import {randomUpwardPlanar} from './support/random-st.ts'

const flows: Flow[] = ['up', 'down', 'left', 'right']

function drawOf(text: string, flow: Flow): {check: DiagramCheck; drawing: Drawing} {
  const check = checkDiagram(text)
  expect(check.status, check.diagnostics.map((d) => d.reason).join('\n')).toBe('upward')
  const drawn = drawDiagram(check, {flow})
  if (!drawn.ok) throw new Error('not drawn')
  return {check, drawing: drawn.drawing}
}

function problems(check: DiagramCheck, drawing: Drawing, layout: Layout = drawing.layout): string[] {
  const size = (text: string, options = {}): {width: number; height: number} => {
    const box = labelBox(text, options)
    return {width: box.width, height: box.height}
  }
  const result = checkDecoratedDrawing(check.graph!, layout, {
    boxes: drawing.labels.map((label) => size(label)),
    labels: drawing.edgeLabels,
    labelBoxes: drawing.edgeLabels.map((label) => size(label.text, EDGE_LABEL_BOX)),
    tiers: drawing.tiers,
    level: check.levels?.level
  })
  return result.ok ? [] : result.problems
}

const tiered = [
  'tier members "Members": visitor, grower, steward',
  'tier services "Services": catalogue, lending',
  'tier stores: packets, vault',
  'visitor, grower -> "searches" catalogue',
  'grower, steward -> lending',
  'catalogue -> packets',
  'lending -> "reserves" packets, vault',
  'steward -> checks -> vault'
].join('\n')

describe('the decorated checker rejects broken drawings', () => {
  const {check, drawing} = drawOf(tiered, 'up')
  const clone = (): Layout => JSON.parse(JSON.stringify(drawing.layout)) as Layout

  it('accepts the drawing as made', () => {
    expect(problems(check, drawing)).toEqual([])
  })

  it('rejects a vertex moved off its tier line', () => {
    const moved = clone()
    const v = check.parsed.vertices.findIndex((x) => x.key === 'grower')
    const node = moved.nodes.find((n) => n.vertex === v)!
    node.y -= 1
    // Its edges now start off the box: the base checker complains too, but the tier line must be named.
    expect(problems(check, drawing, moved).join('\n')).toMatch(/not on one line|off the line/)
  })

  it('rejects a label box that does not sit on its edge', () => {
    const shifted = {...drawing, edgeLabels: drawing.edgeLabels.map((l, k) => (k === 0 ? {...l, x: l.x + 3} : l))}
    // Moved sideways, its sides still meet the line, so the cut is found and the box itself is checked.
    const shiftedFar = {...drawing, edgeLabels: drawing.edgeLabels.map((l, k) => (k === 0 ? {...l, y: l.y + 5} : l))}
    expect(problems(check, shiftedFar).join('\n')).toMatch(/does not run through its label box/)
    expect(problems(check, shifted)).toEqual([])
  })

  it('rejects a label box that covers another edge', () => {
    const wide = {...drawing, edgeLabels: drawing.edgeLabels.map((l, k) => (k === 0 ? {...l, width: 2 * drawing.layout.width} : l))}
    expect(problems(check, wide).join('\n')).toMatch(/meets|overlap|outside/)
  })

  it('rejects a caption over a box, and bands out of order', () => {
    const tiers = drawing.tiers.map((t) => ({...t, caption: {...t.caption}, band: {...t.band}}))
    const node = drawing.layout.nodes[0]!
    tiers[0]!.caption.x = node.x - 2
    expect(problems(check, {...drawing, tiers}).join('\n')).toMatch(/caption meets the box/)
    const swapped = [drawing.tiers[1]!, drawing.tiers[0]!, drawing.tiers[2]!]
    expect(problems(check, {...drawing, tiers: swapped}).join('\n')).toMatch(/not beyond tier|not inside its band/)
  })
})

describe('fixtures', () => {
  const dir = new URL('../../../fixtures/golden/', import.meta.url)
  const cases = readdirSync(dir, {withFileTypes: true}).filter((d) => d.isDirectory()).map((d) => d.name).sort()
  it('include tiered and labelled cases', () => {
    expect(cases).toEqual(expect.arrayContaining(['tiers-up', 'edge-labels-right', 'tiers-labels-down', 'tiers-left']))
  })
  for (const name of cases) {
    it(`${name}, four flows`, () => {
      const text = readFileSync(new URL(`${name}/input.upright`, dir), 'utf8')
      for (const flow of flows) {
        const {check, drawing} = drawOf(text, flow)
        expect(problems(check, drawing), `${name} ${flow}`).toEqual([])
        expect(drawing.edgeLabels.length).toBe(check.parsed.edges.filter((e) => e.label !== undefined).length)
        expect(drawing.tiers.length).toBe(check.parsed.tiers?.length ?? 0)
      }
    })
  }

  it('tiers-up: one row per tier, in declared order from the bottom, captions left of every box', () => {
    const text = readFileSync(new URL('tiers-up/input.upright', dir), 'utf8')
    const {check, drawing} = drawOf(text, 'up')
    const ys = drawing.tiers.map((tier) => tier.vertices.map((v) => drawing.layout.nodes[v]!.y))
    for (const row of ys) expect(new Set(row).size).toBe(1)
    expect(ys[0]![0]! > ys[1]![0]! && ys[1]![0]! > ys[2]![0]!).toBe(true)
    const left = Math.min(...drawing.layout.nodes.map((n) => n.x - n.width / 2))
    for (const tier of drawing.tiers) expect(tier.caption.x + tier.caption.width).toBeLessThan(left)
    expect(drawing.tiers.map((t) => t.text)).toEqual(['Members', 'Services', 'Stores'])
    // The untiered vertex sits on a level of its own, between its tiered neighbours.
    const checks = check.parsed.vertices.findIndex((v) => v.key === 'checks')
    expect(drawing.layout.nodes[checks]!.y).toBeLessThan(ys[0]![0]!)
  })

  it('edge labels: each labelled edge is one polyline from tail box to head box through its label', () => {
    const text = readFileSync(new URL('edge-labels-right/input.upright', dir), 'utf8')
    const {check, drawing} = drawOf(text, 'right')
    expect(drawing.layout.edges.length).toBe(check.graph!.edgeCount)
    expect(drawing.layout.nodes.length).toBe(check.graph!.vertexCount)
    expect(drawing.edgeLabels.map((l) => l.text)).toEqual(['cleans', 'weighs', 'sends samples', 'approves'])
    for (const label of drawing.edgeLabels) {
      const pts = drawing.layout.edges[label.edge]!.points
      expect(pts.some(([x, y]) => x === label.x - label.width / 2 && y === label.y)).toBe(true)
      expect(pts.some(([x, y]) => x === label.x + label.width / 2 && y === label.y)).toBe(true)
    }
  })

  it('the same text gives the same drawing', () => {
    const text = readFileSync(new URL('tiers-labels-down/input.upright', dir), 'utf8')
    expect(JSON.stringify(drawOf(text, 'down').drawing)).toBe(JSON.stringify(drawOf(text, 'down').drawing))
  })
})

const words = ['reads', 'asks', 'files', 'sends seed', 'weighs', 'lends', 'a', 'checks germination', 'logs']

/** A random tiered diagram: vertices in tiers 0..T-1 or none, edges only from lower to higher rank. */
function randomTiered(seed: number): string {
  const rand = mulberry32(seed * 2654435761)
  const n = randomInt(rand, 3, 22)
  const tierCount = randomInt(rand, 2, 5)
  const tierOf = Array.from({length: n}, () => (rand() < 0.75 ? randomInt(rand, 0, tierCount - 1) : -1))
  const rank = tierOf.map((t) => (t >= 0 ? t * 10 + 5 : rand() * tierCount * 10))
  const lines: string[] = []
  for (let t = 0; t < tierCount; t++) {
    const members = tierOf.flatMap((x, v) => (x === t ? [`v${v}`] : []))
    if (members.length > 0) lines.push(`tier t${t}${rand() < 0.5 ? ` "Tier ${t}"` : ''}: ${members.join(', ')}`)
  }
  const edgeCount = randomInt(rand, n - 1, Math.floor(1.6 * n))
  const labelShare = rand() < 0.5 ? 0 : rand()
  for (let i = 0; i < edgeCount; i++) {
    const a = randomInt(rand, 0, n - 1)
    const b = randomInt(rand, 0, n - 1)
    if (rank[a]! >= rank[b]! || (tierOf[a]! >= 0 && tierOf[a] === tierOf[b])) continue
    const label = rand() < labelShare ? ` "${words[randomInt(rand, 0, words.length - 1)]}"` : ''
    lines.push(`v${a} ->${label} v${b}`)
  }
  for (let v = 0; v < n; v++) if (tierOf[v] === -1) lines.push(`v${v}`)
  return lines.join('\n')
}

/** A random upward planar diagram (randomUpwardPlanar) with labels on a random share of its edges. */
function randomLabelled(seed: number): string {
  const rand = mulberry32(seed * 40503)
  const r = randomUpwardPlanar(seed, randomInt(rand, 2, 40))
  const share = 0.2 + 0.8 * rand()
  const lines = r.edges.map(([a, b]) => (rand() < share ? `v${a} -> "${words[randomInt(rand, 0, words.length - 1)]}" v${b}` : `v${a} -> v${b}`))
  for (let v = 0; v < r.vertexCount; v++) lines.push(`v${v}`)
  return lines.join('\n')
}

/**
 * Draws a random diagram in the flow its seed picks and checks it; what is wrong goes to `failures`.
 * The drawing, or undefined when there is none.
 */
function drawSeeded(seed: number, check: DiagramCheck, failures: string[]): Drawing | undefined {
  const flow = flows[seed % 4]!
  const result = drawDiagram(check, {flow})
  if (!result.ok) {
    failures.push(`seed ${seed}: not drawn`)
    return undefined
  }
  const found = problems(check, result.drawing)
  if (found.length > 0) failures.push(`seed ${seed} ${flow}: ${found.slice(0, 3).join('; ')}`)
  return result.drawing
}

describe('random diagrams through the decorated checker', () => {
  it('≥ 300 random tiered diagrams that pass the check are drawn level by level, crossing-free', () => {
    const failures: string[] = []
    let drawn = 0
    let labelled = 0
    for (let seed = 1; seed <= 1500 && drawn < 320; seed++) {
      const text = randomTiered(seed)
      const check = checkDiagram(text)
      if (check.status !== 'upward' || !check.parsed.tiers) continue
      const drawing = drawSeeded(seed, check, failures)
      if (!drawing) continue
      drawn++
      if (drawing.edgeLabels.length > 0) labelled++
    }
    expect(failures).toEqual([])
    expect(drawn).toBeGreaterThanOrEqual(300)
    expect(labelled).toBeGreaterThanOrEqual(100)
  })

  it('≥ 300 random labelled upward planar diagrams keep every label box clear of other edges and boxes', () => {
    const failures: string[] = []
    let drawn = 0
    for (let seed = 1; seed <= 340; seed++) {
      const text = randomLabelled(seed)
      const check = checkDiagram(text)
      expect(check.status, `seed ${seed}`).toBe('upward')
      if (drawSeeded(seed, check, failures)) drawn++
    }
    expect(failures).toEqual([])
    expect(drawn).toBeGreaterThanOrEqual(300)
  })
})
