import {describe, expect, it} from 'vitest'
import {layoutUpward, type Flow} from '../src/layout/index.ts'
import {checkDrawing} from './support/geometry-check.ts'
import {augmentationOfRandomUpward, prng, randomBoxes} from './support/layout-st-generator.ts'
import {randomUpwardPlanar} from './support/random-st.ts'

/**
 * 300 graphs from the upward tests' generator (randomUpwardPlanar: spanning subgraphs of random planar
 * st-graphs built another way than the layout's own generator), 2..300 vertices, with the st-graph
 * they span as the augmentation; every flow, through the exact geometric checker.
 */
const flows: Flow[] = ['up', 'down', 'left', 'right']

describe('randomUpwardPlanar graphs with their own st-graph', () => {
  for (let b = 0; b < 3; b++) {
    it(`graphs ${b * 100 + 1}..${(b + 1) * 100}`, () => {
      const failures: string[] = []
      for (let seed = b * 100 + 1; seed <= (b + 1) * 100; seed++) {
        const rand = prng(seed * 104729)
        const r = randomUpwardPlanar(seed, 2 + Math.floor(rand() * 299))
        const {graph, st} = augmentationOfRandomUpward(r)
        const boxes = randomBoxes(rand, graph.vertexCount)
        for (const flow of flows) {
          const check = checkDrawing(graph, layoutUpward({graph, st, boxes, flow}), {boxes})
          if (!check.ok) failures.push(`seed ${seed} ${flow}: ${check.problems.slice(0, 3).join('; ')}`)
        }
      }
      expect(failures).toEqual([])
    })
  }
})
