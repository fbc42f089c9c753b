import type {Reporter, TestModule} from 'vitest/node'

/**
 * Prints one closing line `N passed, N failed` that CI reads (vitest's own summary is not read).
 * A module that failed to load counts as one failure, so a broken import can never look green.
 */
export default class SummaryReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>, unhandledErrors: ReadonlyArray<unknown>): void {
    let passed = 0
    let failed = unhandledErrors.length
    let skipped = 0
    for (const mod of testModules) {
      if (mod.state() === 'failed' && [...mod.children.allTests()].length === 0) failed++
      for (const test of mod.children.allTests()) {
        const state = test.result().state
        if (state === 'passed') passed++
        else if (state === 'failed') failed++
        else skipped++
      }
    }
    const tail = skipped > 0 ? `, ${skipped} skipped` : ''
    process.stdout.write(`\n${passed} passed, ${failed} failed${tail}\n`)
  }
}
