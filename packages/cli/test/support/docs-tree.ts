/**
 * A generated documentation tree for tests and `pnpm bench site`: Markdown pages in nested folders,
 * prose around upright diagrams written as fences and directives. Diagrams are random spanning
 * subgraphs of random planar st-graphs (upward planar by construction, see
 * packages/core/test/support/random-st.ts), a few with an edge reversed into a cycle, so a run has
 * failures to report. Seeded: the same arguments write the same bytes.
 */
import {mkdirSync, writeFileSync} from 'node:fs'
import path from 'node:path'
import {mulberry32, randomUpwardPlanar} from '../../../core/test/support/random-st.ts'

export interface DocsTreeOptions {
  files: number
  diagrams: number
  seed?: number
  /** Vertex counts are drawn from [minVertices, maxVertices], more small than large. */
  minVertices?: number
  maxVertices?: number
  /** Share of diagrams given a cycle (default 0.04). */
  failing?: number
  /** Pages per folder (default 25). */
  perFolder?: number
}

export interface DocsTree {
  files: string[]
  diagrams: number
  failing: number
  vertices: number
}

const words = ['intake', 'ledger', 'router', 'harbour', 'beacon', 'quarry', 'orchard', 'lantern', 'meadow', 'signal', 'tally', 'compass']

export function writeDocsTree(dir: string, options: DocsTreeOptions): DocsTree {
  const rnd = mulberry32(options.seed ?? 1)
  const min = options.minVertices ?? 5
  const max = options.maxVertices ?? 80
  const perFolder = options.perFolder ?? 25
  const failShare = options.failing ?? 0.04
  const files: string[] = []
  let failing = 0
  let vertices = 0
  let made = 0
  for (let f = 0; f < options.files; f++) {
    // Spread the diagrams evenly: page f gets the ones numbered from floor(f·D/F) up to the next page's.
    const count = Math.floor(((f + 1) * options.diagrams) / options.files) - Math.floor((f * options.diagrams) / options.files)
    const parts = [`# Page ${f + 1}: the ${words[f % words.length]} service\n`, 'This page describes how the pieces depend on each other.\n']
    for (let d = 0; d < count; d++) {
      const n = min + Math.floor((max - min + 1) * rnd() ** 2)
      const g = randomUpwardPlanar((options.seed ?? 1) * 100_003 + made, n)
      made++
      const edges = g.edges.map(([a, b]) => [a, b] as [number, number])
      if (edges.length === 0) edges.push([0, 1])
      const broken = rnd() < failShare
      if (broken) {
        edges.push([edges[0]![1], edges[0]![0]])
        failing++
      }
      const used = new Set(edges.flat())
      vertices += used.size
      const labelled = new Set<number>()
      const name = (v: number) => {
        if (labelled.has(v) || (v * 7 + d) % 5 !== 0) return `${words[v % words.length]}${v}`
        labelled.add(v)
        return `${words[v % words.length]}${v} "${words[(v + 3) % words.length]} ${v}"`
      }
      const body = edges.map(([a, b]) => `${name(a)} -> ${name(b)}`).join('\n')
      parts.push(`## Diagram ${d + 1}\n`, `The ${words[(f + d) % words.length]} flow, step by step.\n`)
      if ((f + d) % 3 === 0) parts.push(`:::upright{flow=right}\n${body}\n:::\n`)
      else parts.push('```upright title="Flow ' + (d + 1) + '"\n' + body + '\n```\n')
      parts.push('- a list item after it\n- and another\n')
    }
    const folder = path.join(dir, `section-${String(Math.floor(f / perFolder)).padStart(3, '0')}`)
    mkdirSync(folder, {recursive: true})
    const file = path.join(folder, `page-${String(f).padStart(4, '0')}.md`)
    writeFileSync(file, parts.join('\n'))
    files.push(file)
  }
  // Each page needs a package.json above it for the default cache folder; the caller decides.
  return {files, diagrams: made, failing, vertices}
}
