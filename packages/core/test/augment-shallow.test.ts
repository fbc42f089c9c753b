import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {createDigraph, type Digraph} from '../src/graph/digraph.ts'
import {testUpwardPlanarity} from '../src/upward/test-upward-planarity.ts'
import {stAugment, verifyStGraph} from '../src/augment/index.ts'
import {readGraphml} from './support/graphml.ts'

// Vertices on H's longest path (Kahn order, relaxing each edge once: common practice for DAGs).
function longestPath(g: Digraph): number {
  const n = g.vertexCount
  const indeg = new Int32Array(n)
  for (let e = 0; e < g.edgeCount; e++) indeg[g.head[e]!]!++
  const depth = new Int32Array(n)
  const queue: number[] = []
  for (let v = 0; v < n; v++) if (indeg[v] === 0) queue.push(v)
  let best = n > 0 ? 1 : 0
  for (let i = 0; i < queue.length; i++) {
    const v = queue[i]!
    for (let j = g.outStart[v]!; j < g.outStart[v + 1]!; j++) {
      const w = g.head[g.outEdges[j]!]!
      depth[w] = Math.max(depth[w]!, depth[v]! + 1)
      best = Math.max(best, depth[w]! + 1)
      if (--indeg[w] === 0) queue.push(w)
    }
  }
  expect(queue.length).toBe(n)
  return best
}

// The North DAGs (/work/shared/data/north, see its SOURCE.md), every fourth file.
const dir = '/work/shared/data/north'

describe('stAugment: shallow saturation', () => {
  it('keeps H valid and, over the North DAGs, no taller in total than walk-order saturation', () => {
    const files = readdirSync(dir).filter((f) => f.endsWith('.graphml')).sort()
    let graphs = 0
    let shallowTotal = 0
    let plainTotal = 0
    let taller = 0
    for (let i = 0; i < files.length; i += 4) {
      const {vertexCount, edges} = readGraphml(join(dir, files[i]!))
      const g = createDigraph(vertexCount, edges)
      const res = testUpwardPlanarity(g, {maxMillis: 5_000})
      if (res.status !== 'upward') continue
      graphs++
      const shallow = stAugment(res.upward)
      // A hook that allows every edge selects the plain walk-order saturation.
      const plain = stAugment(res.upward, {allowEdge: () => true})
      expect(plain).toBeDefined()
      expect(verifyStGraph(g, shallow, res.upward.embedding), files[i]).toEqual({ok: true})
      expect(verifyStGraph(g, plain!, res.upward.embedding), files[i]).toEqual({ok: true})
      const a = longestPath(shallow.graph)
      const b = longestPath(plain!.graph)
      shallowTotal += a
      plainTotal += b
      if (a > b) taller++
    }
    expect(graphs).toBeGreaterThan(150)
    // Measured when written: 2205 against 2246 vertices on longest paths (203 graphs), taller in 2.
    expect(shallowTotal).toBeLessThan(plainTotal)
    expect(taller).toBeLessThan(graphs / 10)
    console.log(`shallow saturation: ${graphs} North DAGs, longest paths ${shallowTotal} vs ${plainTotal} (walk order), taller in ${taller}`)
  })
})
