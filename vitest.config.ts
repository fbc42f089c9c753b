import {defineConfig} from 'vitest/config'

export default defineConfig({
  test: {
    include: ['packages/*/test/**/*.test.ts', 'test/**/*.test.ts'],
    reporters: ['default', './test/support/summary-reporter.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000
  }
})
