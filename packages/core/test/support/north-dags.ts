import {readdirSync} from 'node:fs'
import {createDigraph, type Digraph} from '../../src/graph/digraph.ts'
import {testUpwardPlanarity} from '../../src/upward/index.ts'
import {readGraphml} from './graphml.ts'

/** The North DAGs (SOURCE.md there says where they come from). */
export const northDir = '/work/shared/data/north'

export interface NorthDag {
  file: string
  vertexCount: number
  edges: [number, number][]
  graph: Digraph
}

/** The .graphml files of the North DAGs, sorted by name. */
export function northFiles(): string[] {
  return readdirSync(northDir).filter((f) => f.endsWith('.graphml')).sort()
}

function readNorth(file: string): NorthDag {
  const {vertexCount, edges} = readGraphml(`${northDir}/${file}`)
  return {file, vertexCount, edges, graph: createDigraph(vertexCount, edges)}
}

/** The North DAGs with exactly one source (SOURCE.md: 610 of them). */
export function singleSourceNorthDags(): NorthDag[] {
  const out: NorthDag[] = []
  for (const file of northFiles()) {
    const dag = readNorth(file)
    let sources = 0
    for (let v = 0; v < dag.vertexCount; v++) if (dag.graph.inStart[v + 1] === dag.graph.inStart[v]) sources++
    if (sources === 1) out.push(dag)
  }
  return out
}

/**
 * Every `step`-th North DAG from index `start` with at most `maxVertices` vertices that the exact test
 * finds not upward planar, lazily, so a caller can stop once it has enough. `index` is the file's place
 * in northFiles().
 */
export function* notUpwardNorthDags(start: number, step: number, maxVertices: number): Generator<NorthDag & {index: number}> {
  const files = northFiles()
  for (let index = start; index < files.length; index += step) {
    const dag = readNorth(files[index]!)
    if (dag.vertexCount > maxVertices) continue
    if (testUpwardPlanarity(dag.graph, {maxMillis: 5000}).status !== 'not-upward') continue
    yield {...dag, index}
  }
}
