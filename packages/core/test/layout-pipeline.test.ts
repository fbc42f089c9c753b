import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {testUpwardPlanarity} from '../src/upward/index.ts'
import {stAugment} from '../src/augment/index.ts'
import {layoutUpward, type Flow} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {readGraphml} from './support/graphml.ts'
import {prng, randomBoxes} from './support/layout-st-generator.ts'
import {randomUpwardPlanar} from './support/random-st.ts'

/**
 * The whole drawing path on graphs from outside the layout's own generator: the exact upward test,
 * the st-augmentation, the layout, the exact geometric checker.
 * Data: the North DAGs, /work/shared/data/north/ (see SOURCE.md there).
 */
const flows: Flow[] = ['up', 'down', 'left', 'right']
const NORTH = '/work/shared/data/north'

function drawAndCheck(g: Digraph, res: ReturnType<typeof testUpwardPlanarity>, seed: number, allFlows: boolean): string[] {
  if (res.status !== 'upward') return [`not drawn: ${res.status}`]
  const st = stAugment(res.upward)
  const boxes = randomBoxes(prng(seed), g.vertexCount)
  const failures: string[] = []
  for (const flow of allFlows ? flows : [flows[seed % 4]!]) {
    const layout = layoutUpward({graph: g, st, boxes, flow})
    const check = checkDrawing(g, layout, {boxes})
    if (!check.ok) failures.push(`${flow}: ${check.problems.slice(0, 3).join('; ')}`)
  }
  return failures
}

describe('North DAGs: every upward planar one drawn and checked, four flows', () => {
  const files = readdirSync(NORTH).filter((f) => f.endsWith('.graphml')).sort()
  const chunks = 4
  for (let c = 0; c < chunks; c++) {
    it(`files ${c + 1}/${chunks}`, () => {
      const failures: string[] = []
      let drawn = 0
      for (let i = c; i < files.length; i += chunks) {
        const {vertexCount, edges} = readGraphml(join(NORTH, files[i]!))
        const g = createDigraph(vertexCount, edges)
        const res = testUpwardPlanarity(g)
        if (res.status !== 'upward') continue
        drawn++
        for (const f of drawAndCheck(g, res, i, true)) failures.push(`${files[i]} ${f}`)
      }
      expect(failures).toEqual([])
      // 1,277 files, of which 41 planar-but-not-upward and some non-planar (bench/README.md, upward).
      expect(drawn).toBeGreaterThan(150)
    })
  }
})

describe('randomUpwardPlanar graphs (the upward tests\' generator) through test, augmentation and layout', () => {
  it('200 graphs up to 120 vertices, one flow each', () => {
    const failures: string[] = []
    for (let seed = 1; seed <= 200; seed++) {
      const r = randomUpwardPlanar(seed, 2 + (seed * 53) % 119)
      const g = createDigraph(r.vertexCount, r.edges)
      for (const x of drawAndCheck(g, testUpwardPlanarity(g), seed, false)) failures.push(`seed ${seed} ${x}`)
    }
    expect(failures).toEqual([])
  })
})

describe('small random DAGs (disconnected, isolated vertices, parallel edges) through test, augmentation and layout', () => {
  it('1,000 DAGs with 1..9 vertices, one flow each', () => {
    const failures: string[] = []
    let drawn = 0
    for (let seed = 1; seed <= 1000; seed++) {
      const rand = prng(seed * 7 + 3)
      const n = 1 + Math.floor(rand() * 9)
      const density = rand() * 0.6
      const edges: Array<[number, number]> = []
      for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rand() < density) edges.push([i, j])
      if (edges.length > 0 && rand() < 0.1) edges.push(edges[0]!) // a parallel edge now and then
      const g = createDigraph(n, edges)
      const res = testUpwardPlanarity(g)
      if (res.status !== 'upward') continue
      drawn++
      for (const x of drawAndCheck(g, res, seed, false)) failures.push(`seed ${seed} ${JSON.stringify(edges)} ${x}`)
    }
    expect(failures).toEqual([])
    expect(drawn).toBeGreaterThan(750)
  })
})
