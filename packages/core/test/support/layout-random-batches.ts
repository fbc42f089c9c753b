import {describe, expect, it} from 'vitest'
import {layoutUpward, type Flow} from '../../src/layout/index.ts'
import {checkDrawing} from './geometry-check.ts'
import {prng, randomBoxes, randomLayoutCase} from './layout-st-generator.ts'

/**
 * Random upward planar graphs with 1..300 vertices (spanning subgraphs of random planar st-graphs, see
 * the generator), every flow, through the exact geometric checker: seeds first+1 .. first+count in
 * batches of 100. Split over several test files so each stays short and they run in parallel.
 */
export function describeRandomLayoutBatches(first: number, count: number): void {
  const flows: Flow[] = ['up', 'down', 'left', 'right']
  const batch = 100
  describe('random upward planar graphs', () => {
    for (let b = first / batch; b < (first + count) / batch; b++) {
      it(`graphs ${b * batch + 1}..${(b + 1) * batch}, four flows each`, () => {
        const failures: string[] = []
        let vertices = 0
        for (let seed = b * batch + 1; seed <= (b + 1) * batch; seed++) {
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
}
