/**
 * The budget covers the whole check, fix suggestion included. On a tick clock (each `now()` call is
 * one tick) a stage may look at the clock a bounded number of times after the deadline — once per
 * piece of work it then gives up — but must not start new upward tests: before the fix, the maximal
 * upward subgraph search ran one zero-budget test (cycle and planarity tests first) per chunk of edges
 * after the deadline, so a 500 ms budget took about 3 s on 1,080 edges.
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram} from '../src/index.ts'

/** 120 copies of a small not-upward gadget chained together: 1,080 edges. */
function gadgets(k: number): string {
  let text = ''
  for (let i = 0; i < k; i++) text += `n${i} -> c${i}, g${i}, a${i}\ns${i} -> c${i}, g${i}, a${i}\nc${i} -> g${i}, a${i}\na${i} -> n${i + 1}\n`
  return text
}

describe('the budget', () => {
  it('bounds the clock reads after the deadline, for every budget, whatever the outcome', () => {
    const text = gadgets(120)
    const outcomes = new Set<string>()
    for (const budget of [1, 30, 300, 3_000, 30_000]) {
      let t = 0
      let deadline = 0
      let afterDeadline = 0
      const now = (): number => {
        t++
        if (deadline === 0) deadline = t + budget
        else if (t > deadline) afterDeadline++
        return t
      }
      const check = checkDiagram(text, {budgetMillis: budget, now})
      outcomes.add(check.status)
      expect(check.parsed.edges.length).toBe(1080)
      // At most a few reads per edge: one per chunk the fix search still splits, and a handful per stage.
      expect(afterDeadline, `budget ${budget}: ${check.status}`).toBeLessThanOrEqual(2 * 1080 + 64)
      if (check.status === 'undecided') expect(t).toBeGreaterThan(deadline)
    }
    expect(outcomes).toContain('undecided')
    expect(outcomes).toContain('not-upward')
  })
})
