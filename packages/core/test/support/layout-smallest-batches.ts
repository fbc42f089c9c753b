import {describe, expect, it} from 'vitest'
import {layoutCandidates, type Flow} from '../../src/layout/index.ts'
import {checkDrawing} from './geometry-check.ts'
import {prng, randomBoxes, randomLayoutCase} from './layout-st-generator.ts'

/**
 * Random upward planar graphs with 2..300 vertices (randomLayoutCase: spanning subgraphs of random
 * planar st-graphs), seeds first+1 .. first+count in batches of 100, each drawn by every candidate
 * layoutSmallest compares (the st-layout and the level drawings), one flow per graph in turn, through
 * the exact geometric checker.
 */
export function describeSmallestLayoutBatches(first: number, count: number): void {
  const flows: Flow[] = ['up', 'right', 'down', 'left']
  const batch = 100
  describe('every layoutSmallest candidate on random upward planar graphs', () => {
    for (let b = first / batch; b < (first + count) / batch; b++) {
      it(`graphs ${b * batch + 1}..${(b + 1) * batch}`, () => {
        const failures: string[] = []
        let levelDrawings = 0
        for (let seed = b * batch + 1; seed <= (b + 1) * batch; seed++) {
          const rand = prng(seed * 6151)
          const target = 2 + Math.floor(rand() * 299)
          const c = randomLayoutCase(seed + 70_000, target, 0.75 + 0.25 * rand(), 0.5 + 0.5 * rand())
          const boxes = randomBoxes(rand, c.graph.vertexCount)
          const flow = flows[seed % 4]!
          for (const drawn of layoutCandidates({graph: c.graph, st: c.st, boxes, flow})) {
            if (drawn.kind !== 'st') levelDrawings++
            const check = checkDrawing(c.graph, drawn.layout, {boxes})
            if (!check.ok) failures.push(`seed ${seed} ${flow} ${drawn.kind}${drawn.balanced ? ' balanced' : ''}: ${check.problems.slice(0, 3).join('; ')}`)
          }
        }
        expect(failures).toEqual([])
        // Not vacuous: most graphs get at least one level drawing besides the st-layout.
        expect(levelDrawings).toBeGreaterThan(batch)
      })
    }
  })
}
