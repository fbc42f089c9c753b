/**
 * Whole-file keys (`textKeys`) and the per-thread write account that lets a run that only read skip
 * scanning the folder (`bytesWrittenInThread`).
 */
import {mkdtempSync} from 'node:fs'
import {createHash} from 'node:crypto'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {describe, expect, it} from 'vitest'
import {bytesWrittenInThread, cacheKey, canonicalJson, openDiskStore, textKeys} from '../src/index.ts'

describe('textKeys', () => {
  it('is SHA-256 of the canonical settings, a line break and the text', () => {
    const parts = {tool: 't@1', flow: null, budget: 500, limits: {maxVertices: 10}}
    const expected = createHash('sha256').update(`${canonicalJson(parts)}\n# Seed library\n`).digest('hex')
    expect(textKeys(parts)('# Seed library\n')).toBe(expected)
    // Key order does not matter; any change of text or settings does.
    expect(textKeys({limits: {maxVertices: 10}, budget: 500, flow: null, tool: 't@1'})('# Seed library\n')).toBe(expected)
    expect(textKeys(parts)('# Seed library')).not.toBe(expected)
    expect(textKeys({...parts, budget: 501})('# Seed library\n')).not.toBe(expected)
    expect(textKeys(parts)('# Seed library\n')).toMatch(/^[0-9a-f]{64}$/)
  })

  it('cannot be matched by moving a line break between settings and text', () => {
    // The canonical JSON never holds a raw line break, so the first one always ends it.
    const a = textKeys({note: 'x'})('y')
    const b = textKeys({note: 'x\ny'})('')
    expect(a).not.toBe(b)
    expect(canonicalJson({note: 'x\ny'})).not.toContain('\n')
    expect(a).not.toBe(cacheKey({note: 'x', text: 'y'}))
  })
})

describe('bytesWrittenInThread', () => {
  it('grows by each entry written and not at all on reads', () => {
    const store = openDiskStore({dir: mkdtempSync(path.join(tmpdir(), 'upright-account-'))})
    const key = cacheKey({seed: 'marsh marigold'})
    const before = bytesWrittenInThread()
    store.write(key, '{"sown":true}')
    const after = bytesWrittenInThread()
    expect(after).toBeGreaterThan(before + '{"sown":true}'.length)
    expect(store.read(key)).toBe('{"sown":true}')
    expect(store.read(cacheKey({seed: 'absent'}))).toBeUndefined()
    expect(bytesWrittenInThread()).toBe(after)
  })
})
