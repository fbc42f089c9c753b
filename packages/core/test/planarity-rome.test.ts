import {readdirSync} from 'node:fs'
import {join} from 'node:path'
import {describe, expect, it} from 'vitest'
import {readGraphml} from './support/graphml.ts'
import {compare} from './support/planarity-compare.ts'

describe('Rome graphs (/work/shared/data/rome, see its SOURCE.md: 1,820 graphs, 549 planar per networkx)', () => {
  it('agrees with networkx on every graph', () => {
    const dir = '/work/shared/data/rome'
    const files = readdirSync(dir).filter((f) => f.endsWith('.graphml')).sort()
    const cases = files.map((f) => ({name: f, ...readGraphml(join(dir, f))}))
    expect(cases.length).toBe(1820)
    const {planar, disagreements} = compare(cases)
    expect(disagreements).toEqual([])
    expect(planar).toBe(549)
  })
})
