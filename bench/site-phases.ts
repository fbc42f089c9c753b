/**
 * `pnpm bench site-phases [--files N] [--diagrams N]`: where one thread's cold `upright check` work
 * goes: the Markdown parse alone (remark-upright's parseMarkdown, micromark with the directive
 * extension), then parse and check (checkTree, no cache) file by file as the CLI does, so the check's
 * share is the difference. Same generated tree as `pnpm bench site` (seed 2026), all texts read
 * first, one process, nothing written.
 *
 * Per phase: CPU time of this thread (process.cpuUsage counts every thread, so V8's compiler and
 * collector threads are reported apart as "process − thread"), and the collections the phase caused
 * (PerformanceObserver `gc` entries: minor = scavenges of the young generation, major = mark-compact)
 * with their summed pause. Both run twice, alternating; the second pass has the code optimized.
 */
import {mkdtempSync, readFileSync, rmSync} from 'node:fs'
import {loadavg, tmpdir} from 'node:os'
import path from 'node:path'
import {constants, PerformanceObserver} from 'node:perf_hooks'
import {threadCpuSeconds} from '../packages/cli/src/lib/thread-timing.ts'
import {writeDocsTree} from '../packages/cli/test/support/docs-tree.ts'
import {checkTree, parseMarkdown} from '../packages/remark/src/check.ts'

const args = process.argv.slice(2)
const arg = (name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`)
  return i >= 0 ? Number(args[i + 1]) : fallback
}
const work = mkdtempSync(path.join(tmpdir(), 'upright-site-phases-'))
const tree = writeDocsTree(path.join(work, 'docs'), {files: arg('files', 2000), diagrams: arg('diagrams', 5000), seed: 2026})
const texts = tree.files.map((f) => readFileSync(f, 'utf8'))
rmSync(work, {recursive: true, force: true})
console.log(`tree: ${texts.length} files, ${tree.diagrams} diagrams; load average ${loadavg()[0]!.toFixed(1)}`)

const gc = {minor: 0, major: 0, pauseMs: 0}
new PerformanceObserver((list) => {
  for (const e of list.getEntries()) {
    const kind = (e as unknown as {detail?: {kind?: number}}).detail?.kind
    if (kind === constants.NODE_PERFORMANCE_GC_MINOR) gc.minor++
    else if (kind === constants.NODE_PERFORMANCE_GC_MAJOR) gc.major++
    gc.pauseMs += e.duration
  }
}).observe({entryTypes: ['gc']})

const processCpu = () => {
  const u = process.cpuUsage()
  return (u.user + u.system) / 1e6
}
// GC entries arrive asynchronously: let them land before reading the counts.
const settle = () => new Promise((resolve) => setTimeout(resolve, 50))

async function phase(name: string, run: () => number): Promise<void> {
  await settle()
  const before = {...gc, thread: threadCpuSeconds() ?? Number.NaN, process: processCpu()}
  const count = run()
  const thread = (threadCpuSeconds() ?? Number.NaN) - before.thread
  const all = processCpu() - before.process
  await settle()
  console.log(
    `${name.padEnd(24)} thread cpu ${thread.toFixed(2).padStart(6)} s, process − thread ${(all - thread).toFixed(2).padStart(5)} s, ` +
      `scavenges ${String(gc.minor - before.minor).padStart(4)}, mark-compacts ${gc.major - before.major}, gc pauses ${(gc.pauseMs - before.pauseMs).toFixed(0)} ms  (${count})`
  )
}

// As the CLI does it, file by file, nothing kept: the parse alone, then parse and check; the check's
// share is the difference.
for (const pass of [1, 2]) {
  await phase(`parse, pass ${pass}`, () => texts.reduce((n, t) => n + parseMarkdown(t).children.length, 0))
  await phase(`parse + check, pass ${pass}`, () => texts.reduce((n, t) => n + checkTree(parseMarkdown(t), t, {}).length, 0))
}
console.log(`load average now ${loadavg()[0]!.toFixed(1)}`)
