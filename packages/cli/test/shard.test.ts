/** `upright check --shard i/n`: the shards of a tree are disjoint, balanced, and together the whole. */
import {mkdtempSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {parseShard, selectShard} from '../src/lib/shard.ts'
import {cli} from './support/run-cli.ts'
import {writeDocsTree} from './support/docs-tree.ts'

describe('selectShard', () => {
  it('splits any file list into n disjoint slices whose union is the list, sizes within one', () => {
    const base = path.join(tmpdir(), 'base')
    fc.assert(
      fc.property(fc.uniqueArray(fc.stringMatching(/^[a-z]{1,3}(\/[a-z]{1,3}){0,2}\.md$/), {maxLength: 60}), fc.integer({min: 1, max: 7}), (names, n) => {
        const files = names.map((f) => path.join(base, f))
        const shards = Array.from({length: n}, (_, i) => selectShard(files, base, {index: i + 1, count: n}))
        const all = shards.flat()
        expect(all.length).toBe(files.length)
        expect(new Set(all)).toEqual(new Set(files))
        const sizes = shards.map((s) => s.length)
        expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1)
        // The slice does not depend on the order the files were listed in.
        const reversed = Array.from({length: n}, (_, i) => selectShard([...files].reverse(), base, {index: i + 1, count: n}))
        expect(reversed).toEqual(shards)
      }),
      {numRuns: 200}
    )
  })

  it('parses i/n and rejects the rest', () => {
    expect(parseShard('2/4')).toEqual({ok: true, shard: {index: 2, count: 4}})
    for (const bad of ['0/3', '4/3', '1/0', '1', '1/2/3', 'a/b', '-1/2', '']) expect(parseShard(bad).ok, bad).toBe(false)
  })
})

describe('upright check --shard', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'upright-shard-'))
  const tree = writeDocsTree(dir, {files: 14, diagrams: 20, seed: 3, maxVertices: 20, failing: 0.2})

  it('reports each diagram in exactly one of the shards', async () => {
    const whole = await cli(['check', '--no-cache', '--format', 'json', '.'], dir)
    const parts = [] as Array<{code: number; diagrams: Array<{file: string; line: number; status: string}>}>
    for (let i = 1; i <= 3; i++) {
      const run = await cli(['check', '--no-cache', '--format', 'json', '--shard', `${i}/3`, '.'], dir)
      parts.push({code: run.code, diagrams: JSON.parse(run.stdout).diagrams})
    }
    const all = (JSON.parse(whole.stdout) as {diagrams: Array<{file: string; line: number; status: string}>}).diagrams
    const union = parts.flatMap((p) => p.diagrams)
    const id = (d: {file: string; line: number}) => `${d.file}:${d.line}`
    expect(union.map(id).sort()).toEqual(all.map(id).sort())
    expect(new Set(union.map(id)).size).toBe(union.length)
    // Each file lands whole in one shard.
    const shardOf = new Map<string, number>()
    parts.forEach((p, i) => p.diagrams.forEach((d) => expect(shardOf.get(d.file) ?? i).toBe(i) ?? shardOf.set(d.file, i)))
    // A shard fails exactly when it holds a failing diagram.
    for (const p of parts) expect(p.code).toBe(p.diagrams.some((d) => d.status !== 'upward') ? 1 : 0)
    expect(all.length).toBe(tree.diagrams)
  })

  it('is a usage error when malformed', async () => {
    const bad = await cli(['check', '--shard', '4/3', '.'], dir)
    expect(bad.code).toBe(2)
    expect(bad.stderr).toContain('the shard must be from 1 to 3')
  })
})
