import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {createDigraph} from '../src/index.ts'
import {testUpwardPlanarity} from '../src/upward/test-upward-planarity.ts'
import {testUpwardEmbedded} from '../src/upward/fixed-embedding.ts'
import {stAugment, verifyStGraph} from '../src/augment/index.ts'
import {readGraphml} from './support/graphml.ts'

// The North DAGs (/work/shared/data/north, see its SOURCE.md): every upward one, as decided by the
// exact test, is st-augmented and the result checked independently.
const dir = '/work/shared/data/north'

describe('stAugment on the North DAGs', () => {
  it('every upward North DAG augments to a verified planar st-graph keeping its embedding', () => {
    const files = readdirSync(dir).filter((f) => f.endsWith('.graphml')).sort()
    expect(files.length).toBe(1277)
    let upward = 0
    let addedEdges = 0
    let addedVertices = 0
    for (const f of files) {
      const {vertexCount, edges} = readGraphml(join(dir, f))
      const g = createDigraph(vertexCount, edges)
      const res = testUpwardPlanarity(g, {maxMillis: 10_000})
      if (res.status !== 'upward') continue
      upward++
      const aug = stAugment(res.upward)
      const check = verifyStGraph(g, aug, res.upward.embedding)
      expect(check, f).toEqual({ok: true})
      addedEdges += aug.addedEdges.length
      addedVertices += aug.addedVertices.length
      // The fixed-embedding test accepts H's embedding with the declared outer face: H is upward.
      expect(testUpwardEmbedded(aug.embedding, {outerFace: aug.outerFace}).ok, f).toBe(true)
    }
    expect(upward).toBeGreaterThan(800)
    console.log(`North: ${upward} upward DAGs augmented, ${addedEdges} edges and ${addedVertices} vertices added in all`)
  })
})
