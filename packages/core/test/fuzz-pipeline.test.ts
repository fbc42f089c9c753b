/**
 * Fuzzing the whole pipeline (parse → check → draw → SVG) with fast-check, fixed seeds so a failure
 * replays. Every case goes through support/fuzz-harness.ts, which re-checks each answer with an
 * independent checker (geometry, st-graph, cycle, Kuratowski, obstruction by deletion, and the
 * brute-force oracle for small obstructions) and the budget on a tick clock. 2,400 cases here;
 * `pnpm fuzz` runs 100,000.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {runCase, type Outcome} from './support/fuzz-harness.ts'
import {bytesArb, graphArb, mutatedArb, unitsArb, type FuzzInput} from './support/fuzz-inputs.ts'

const seed = 9_2026

function property(counts: Map<Outcome, number>) {
  return (input: FuzzInput): void => {
    const result = runCase(input.text, {budgetTicks: input.budgetTicks, flow: input.flow, ...(input.limits ? {limits: input.limits} : {})})
    counts.set(result.outcome, (counts.get(result.outcome) ?? 0) + 1)
    expect(result.problems, JSON.stringify(input.text)).toEqual([])
  }
}

describe('fuzzing the pipeline', () => {
  it('random bytes (decoded as UTF-8 with replacement) never throw and get positioned messages', () => {
    const counts = new Map<Outcome, number>()
    fc.assert(fc.property(bytesArb, property(counts)), {seed, numRuns: 400})
    expect(counts.get('threw')).toBeUndefined()
    expect(counts.get('syntax')).toBeGreaterThan(100)
  })

  it('random UTF-16 units (lone surrogates, BOMs, CR, combining marks) never throw', () => {
    const counts = new Map<Outcome, number>()
    fc.assert(fc.property(unitsArb, property(counts)), {seed: seed + 1, numRuns: 500})
    expect(counts.get('threw')).toBeUndefined()
  })

  it('random graphs: every answer verifies (drawing, st-graph, cycle, Kuratowski, obstruction)', () => {
    const counts = new Map<Outcome, number>()
    fc.assert(fc.property(graphArb, property(counts)), {seed: seed + 2, numRuns: 900})
    // The generator reaches every outcome, so each checker above actually ran.
    for (const outcome of ['upward', 'cycle', 'nonplanar', 'not-upward', 'undecided', 'too-large'] as const) {
      expect(counts.get(outcome) ?? 0, `${outcome}: ${JSON.stringify([...counts])}`).toBeGreaterThan(0)
    }
  })

  it('near-valid text (printed graphs with a few characters changed) never throws', () => {
    const counts = new Map<Outcome, number>()
    fc.assert(fc.property(mutatedArb, property(counts)), {seed: seed + 3, numRuns: 600})
    expect(counts.get('syntax')).toBeGreaterThan(0)
    expect(counts.get('upward')).toBeGreaterThan(0)
  })
})
