/**
 * `npx tsx bench/level-rows.ts [--tests N] NAME…`: for North DAGs (/work/shared/data/north, see
 * SOURCE.md there, NAME without .graphml), the fewest rows of a crossing-free layered drawing as far as
 * the exact search (packages/core/src/layout/level-search.ts) settles it within N level tests per row
 * count (default 20,000): from G's longest path up, each row count answered "none" (proved: no
 * level-planar assignment within that many rows), "found" or "stopped" (budget spent), until the first
 * found; beside them dagre's rows (its drawing has crossings where ours cannot) and the rows of what
 * levelCandidates finds. A "none" at k rules out every count below k too.
 */
import {join} from 'node:path'
import {dagreLayout} from './support/dagre-layout.ts'
import {createDigraph} from '../packages/core/src/graph/digraph.ts'
import {testUpwardPlanarity} from '../packages/core/src/upward/index.ts'
import {stAugment} from '../packages/core/src/augment/index.ts'
import {levelCandidates} from '../packages/core/src/layout/index.ts'
import {longestPathUp} from '../packages/core/src/layout/layering.ts'
import {searchLevels} from '../packages/core/src/layout/level-search.ts'
import {labelBox} from '../packages/core/src/measure/index.ts'
import {readGraphml} from '../packages/core/test/support/graphml.ts'

const args = process.argv.slice(2)
const at = args.indexOf('--tests')
const tests = at >= 0 ? Number(args[at + 1]) : 20_000
const names = at >= 0 ? args.filter((_, i) => i !== at && i !== at + 1) : args
const height = (level: ArrayLike<number>): number => Math.max(...Array.from(level)) + 1
for (const name of names) {
  const {vertexCount, edges} = readGraphml(join('/work/shared/data/north', `${name}.graphml`))
  const g = createDigraph(vertexCount, edges)
  const r = testUpwardPlanarity(g)
  if (r.status !== 'upward') {
    console.log(`${name}: not upward planar`)
    continue
  }
  const boxes = Array.from({length: vertexCount}, (_, v) => labelBox(v % 7 === 3 ? `item ${v}\nsecond line` : `item ${v}`))
  const dagre = dagreLayout(g, boxes)
  const dagreRows = new Set(dagre.nodes.map((n) => n.y)).size
  const candidates = levelCandidates(g, stAugment(r.upward))
  const fewest = Math.min(...candidates.map((c) => height(c.level)))
  const least = height(longestPathUp(g))
  const answers: string[] = []
  for (let rows = least; rows < fewest; rows++) {
    const budget = {tests, work: 1e12}
    const t0 = performance.now()
    const s = searchLevels(g, rows, budget)
    answers.push(`${rows}: ${s.status}${s.status === 'found' ? ` (${height(s.level)} rows)` : ''}, ${tests - budget.tests} tests, ${(performance.now() - t0).toFixed(0)} ms`)
    if (s.status !== 'none') break
  }
  console.log(`${name} (${vertexCount} vertices, ${edges.length} edges): longest path ${least} rows, dagre ${dagreRows}, candidates ${fewest}; ${answers.join('; ') || 'nothing below the candidates'}`)
}
