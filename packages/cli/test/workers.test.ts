/**
 * `upright check --jobs N`: worker threads load the TypeScript sources (through tsx, as the CLI
 * runs without a build step), and the report is the same, byte for byte, for every N.
 */
import {mkdtempSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {threadId} from 'node:worker_threads'
import {describe, expect, it} from 'vitest'
import {checkFiles} from '../src/lib/check-pool.ts'
import {cli} from './support/run-cli.ts'
import {writeDocsTree} from './support/docs-tree.ts'

const dir = mkdtempSync(path.join(tmpdir(), 'upright-workers-'))
const tree = writeDocsTree(dir, {files: 30, diagrams: 60, seed: 7, maxVertices: 40, failing: 0.1})

describe('upright check on worker threads', () => {
  it('checks every file in a worker thread, each loading the .ts sources', async () => {
    const threads: number[] = []
    const reports = await checkFiles(tree.files, {base: dir}, {jobs: 2, cache: false, onProgress: (_, thread) => threads.push(thread)})
    expect(reports.map((r) => r.file)).toEqual(tree.files)
    expect(threads).toHaveLength(tree.files.length)
    expect(threads.every((t) => t !== threadId && t > 0)).toBe(true)
    const diagrams = reports.reduce((n, r) => n + r.results.length, 0)
    expect(diagrams).toBe(tree.diagrams)
    const failed = reports.reduce((n, r) => n + r.results.filter((x) => x.status !== 'upward').length, 0)
    expect(failed).toBe(tree.failing)
    expect(tree.failing).toBeGreaterThan(0)
  })

  it('prints the same text and JSON, in file order, with one thread and with two; a bar on a terminal only', async () => {
    const one = await cli(['check', '--no-cache', '--jobs', '1', '.'], dir)
    const two = await cli(['check', '--no-cache', '--jobs', '2', '.'], dir, true)
    expect(two.stdout).toBe(one.stdout)
    expect(two.code).toBe(one.code)
    expect(one.code).toBe(1)
    expect(one.stdout.trim().split('\n').at(-1)).toBe(`${tree.diagrams} diagrams in 30 files: ${tree.diagrams - tree.failing} passed, ${tree.failing} failed`)
    // The bar goes to standard error, only on a terminal, and is erased at the end.
    expect(one.stderr).toBe('')
    expect(two.stderr).toMatch(/^\rchecking \[[#-]{24}\] \d+\/30/)
    expect(two.stderr).toContain('\rchecking [########################] 30/30')
    expect(two.stderr.endsWith('\r\u001b[K')).toBe(true)
    const jsonOne = await cli(['check', '--no-cache', '--jobs', '1', '--format', 'json', '.'], dir)
    const jsonTwo = await cli(['check', '--no-cache', '--jobs', '2', '--format', 'json', '.'], dir)
    expect(jsonTwo).toEqual(jsonOne)
    const files = (JSON.parse(jsonOne.stdout) as {diagrams: Array<{file: string}>}).diagrams.map((d) => d.file)
    expect(files).toEqual([...files].sort())
    expect(new Set(files).size).toBe(30)
  })

  it('--timing accounts for every file and diagram once, per thread, with CPU time from the thread itself', async () => {
    for (const jobs of ['1', '2']) {
      const run = await cli(['check', '--no-cache', '--timing', '--jobs', jobs, '--format', 'json', '.'], dir)
      const {timing} = JSON.parse(run.stderr) as {
        timing: {jobs: number; phasesMs: Record<string, number>; processCpuSeconds: number; threads: Array<{thread: number; files: number; diagrams: number; busyMs: number; cpuSeconds?: number}>}
      }
      expect(timing.jobs).toBe(Number(jobs))
      expect(timing.threads).toHaveLength(Number(jobs))
      expect(timing.threads.reduce((n, t) => n + t.files, 0)).toBe(tree.files.length)
      expect(timing.threads.reduce((n, t) => n + t.diagrams, 0)).toBe(tree.diagrams)
      for (const t of timing.threads) {
        expect(t.busyMs).toBeGreaterThan(0)
        expect(t.busyMs).toBeLessThanOrEqual(timing.phasesMs['check']! + 1)
        // Linux: each thread's own counter, at most what the whole process used.
        if (process.platform === 'linux') {
          expect(t.cpuSeconds).toBeGreaterThan(0)
          expect(t.cpuSeconds).toBeLessThanOrEqual(timing.processCpuSeconds)
        }
      }
      if (jobs === '2') expect(new Set(timing.threads.map((t) => t.thread)).has(threadId)).toBe(false)
    }
    const text = await cli(['check', '--no-cache', '--timing', '--jobs', '2', '.'], dir)
    expect(text.stderr).toMatch(/^timing: startup [\d.]+ s, collect [\d.]+ s, check [\d.]+ s, finish [\d.]+ s; CPU [\d.]+ s in all/)
    expect(text.stderr.match(/worker thread \d+: \d+ files/g)).toHaveLength(2)
  })

  it('rejects --jobs that is not a whole number from 1', async () => {
    for (const bad of ['0', '-1', '1.5', 'many']) expect((await cli(['check', '--jobs', bad, '.'], dir)).code).toBe(2)
  })
})
