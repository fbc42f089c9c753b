/**
 * `pnpm bench written-order`: how often the drawing keeps the written order, with the tie-break off
 * (`preferWrittenOrder: false`: grow-back still places leaves and parallel paths in written order) and
 * on (the default), and the time of checkDiagram either way. Agreement: of the vertices with two or
 * more out-edges, the share that show all of them left to right as written (check/written-order.ts).
 * Cases: every diagram of site-demo/pages and fixtures/golden, and 600 random acyclic digraphs of 4-15
 * vertices (edge probability 0.25, lines shuffled so edge ids are not sorted by head, seed 4242).
 */
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {checkDiagram} from '../packages/core/src/index.ts'
import {writtenOrderAgreement} from '../packages/core/src/check/written-order.ts'
import {writtenOrderCorpus} from './support/written-order-corpus.ts'

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..')

const {handwritten, generated} = writtenOrderCorpus(repo)

function measure(texts: readonly string[], preferWrittenOrder: boolean): {vertices: number; kept: number; diagrams: number; millis: number} {
  let vertices = 0, kept = 0, diagrams = 0
  const start = performance.now()
  for (const text of texts) {
    const result = checkDiagram(text, {budgetMillis: 20_000, preferWrittenOrder})
    if (result.status !== 'upward') continue
    const agreement = writtenOrderAgreement(result.upward!)
    diagrams++
    vertices += agreement.vertices
    kept += agreement.kept
  }
  return {vertices, kept, diagrams, millis: performance.now() - start}
}

const rows: string[][] = [['cases', 'tie-break', 'upward diagrams', 'vertices kept', 'share', 'check time']]
for (const [name, texts] of [['demo + golden', handwritten], ['random', generated]] as const) {
  for (const on of [false, true]) {
    const m = measure(texts, on)
    rows.push([name, on ? 'on' : 'off', String(m.diagrams), `${m.kept} / ${m.vertices}`, `${((100 * m.kept) / m.vertices).toFixed(1)}%`, `${m.millis.toFixed(0)} ms`])
  }
}
const widths = rows[0]!.map((_, i) => Math.max(...rows.map((r) => r[i]!.length)))
for (const row of rows) process.stdout.write(row.map((c, i) => c.padEnd(widths[i]!)).join('  ') + '\n')
