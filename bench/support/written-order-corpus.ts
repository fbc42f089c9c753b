import {readFileSync, readdirSync} from 'node:fs'
import {join} from 'node:path'
import {randomAcyclicTexts} from '../../packages/core/test/support/random-texts.ts'
import {demoBodies} from '../../test/demo/demo-graphs.ts'

/**
 * The diagrams the written-order figures are measured on (bench/written-order.ts, bench/layout.ts):
 * every diagram of site-demo/pages and fixtures/golden, and 600 random acyclic digraphs of 4–15
 * vertices (seed 4242).
 */
export function writtenOrderCorpus(repo: string): {handwritten: string[]; generated: string[]} {
  const handwritten = demoBodies(join(repo, 'site-demo/pages')).map((b) => b.body)
  for (const d of readdirSync(join(repo, 'fixtures/golden'), {withFileTypes: true}).filter((x) => x.isDirectory())) {
    handwritten.push(readFileSync(join(repo, 'fixtures/golden', d.name, 'input.upright'), 'utf8'))
  }
  return {handwritten, generated: randomAcyclicTexts(4242, 600, 12)}
}
