/**
 * `pnpm fuzz`: the pipeline fuzz cases of packages/core/test/fuzz-pipeline.test.ts at volume.
 * Default 100,000 cases (an equal share per generator: bytes, UTF-16 units, graphs, near-valid text);
 * `--cases N`, `--seed S`. Passing diagrams are drawn, rendered and verified on every case; the
 * obstruction re-check by deletion runs on every case too. Prints counts per generator and outcome,
 * and the first problems found; exits 1 on any problem.
 */
import fc from 'fast-check'
import {runCase, type Outcome} from '../packages/core/test/support/fuzz-harness.ts'
import {bytesArb, graphArb, mutatedArb, unitsArb, type FuzzInput} from '../packages/core/test/support/fuzz-inputs.ts'

function argument(name: string, fallback: number): number {
  const at = process.argv.indexOf(name)
  if (at < 0) return fallback
  const value = Number(process.argv[at + 1])
  if (!Number.isInteger(value) || value < 1) throw new Error(`${name} needs a whole number ≥ 1`)
  return value
}

const total = argument('--cases', 100_000)
const seed = argument('--seed', 20261202)
const generators: Array<[string, fc.Arbitrary<FuzzInput>]> = [
  ['bytes', bytesArb],
  ['units', unitsArb],
  ['graph', graphArb],
  ['mutated', mutatedArb]
]
const outcomes: Outcome[] = ['upward', 'cycle', 'nonplanar', 'not-upward', 'syntax', 'too-large', 'undecided', 'threw']

const counts = new Map<string, Map<Outcome, number>>()
const failures: Array<{generator: string; text: string; problems: string[]}> = []
let maxLateReads = 0
const started = performance.now()

for (const [index, [name, arbitrary]] of generators.entries()) {
  const share = Math.floor(total / generators.length) + (index < total % generators.length ? 1 : 0)
  const perName = new Map<Outcome, number>()
  counts.set(name, perName)
  // fc.sample draws deterministic values from a seed without shrinking; batches keep memory flat.
  let done = 0
  let batch = 0
  while (done < share) {
    const size = Math.min(2000, share - done)
    for (const input of fc.sample(arbitrary, {seed: seed + index * 1_000_003 + batch, numRuns: size})) {
      const result = runCase(input.text, {budgetTicks: input.budgetTicks, flow: input.flow, ...(input.limits ? {limits: input.limits} : {})})
      perName.set(result.outcome, (perName.get(result.outcome) ?? 0) + 1)
      maxLateReads = Math.max(maxLateReads, result.lateReads)
      if (result.problems.length > 0 && failures.length < 20) failures.push({generator: name, text: input.text, problems: result.problems})
    }
    done += size
    batch++
  }
}

const seconds = (performance.now() - started) / 1000
const header = ['generator', ...outcomes, 'total']
const rows = [...counts].map(([name, perName]) => [name, ...outcomes.map((o) => String(perName.get(o) ?? 0)), String([...perName.values()].reduce((a, b) => a + b, 0))])
const all = ['all', ...outcomes.map((o) => String([...counts.values()].reduce((a, m) => a + (m.get(o) ?? 0), 0))), String(total)]
const table = [header, ...rows, all]
const widths = header.map((_, i) => Math.max(...table.map((r) => r[i]!.length)))
for (const row of table) console.log(row.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]!) : cell.padStart(widths[i]!))).join('  '))
console.log(`\n${total} cases in ${seconds.toFixed(1)} s; seed ${seed}; most clock reads past a deadline: ${maxLateReads}`)
if (failures.length > 0) {
  console.log(`\nPROBLEMS (first ${failures.length}):`)
  for (const f of failures) console.log(`- ${f.generator} ${JSON.stringify(f.text)}\n  ${f.problems.join('\n  ')}`)
  process.exitCode = 1
} else {
  console.log('no problems')
}
