import {describe, expect, it} from 'vitest'
import {layoutUpward, type Flow} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {prng, randomBoxes, randomLayoutCase} from './support/layout-st-generator.ts'

/**
 * 1,000 random upward planar graphs with 1..300 vertices (spanning subgraphs of random planar
 * st-graphs, see the generator), every flow, through the exact geometric checker. Seeds 501..1,000
 * here, 1..500 in layout-random.test.ts (two files so each stays short and they run in parallel).
 */
const flows: Flow[] = ['up', 'down', 'left', 'right']
const FIRST = 500
const GRAPHS = 500
const BATCH = 100

describe('random upward planar graphs', () => {
  for (let b = FIRST / BATCH; b < (FIRST + GRAPHS) / BATCH; b++) {
    it(`graphs ${b * BATCH + 1}..${(b + 1) * BATCH}, four flows each`, () => {
      const failures: string[] = []
      let vertices = 0
      for (let seed = b * BATCH + 1; seed <= (b + 1) * BATCH; seed++) {
        const rand = prng(seed * 7919)
        const target = 2 + Math.floor(rand() * 299)
        const c = randomLayoutCase(seed, target, 0.75 + 0.25 * rand(), 0.5 + 0.5 * rand())
        vertices = Math.max(vertices, c.graph.vertexCount)
        const boxes = randomBoxes(rand, c.graph.vertexCount)
        for (const flow of flows) {
          const layout = layoutUpward({graph: c.graph, st: c.st, boxes, flow})
          const check = checkDrawing(c.graph, layout, {boxes})
          if (!check.ok) failures.push(`seed ${seed} flow ${flow}: ${check.problems.slice(0, 3).join('; ')}`)
        }
      }
      expect(failures).toEqual([])
      expect(vertices).toBeLessThanOrEqual(300)
    })
  }
})
