/**
 * `upright check` on the files a repository really holds: invalid UTF-8 and binary files get a clear
 * error for that file only (the others are still checked); the CLI never writes into the user's files
 * (mtimes, bytes and the listing of a fixture tree are the same before and after); `--limits` reaches
 * the check.
 */
import {createHash} from 'node:crypto'
import {cpSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, statSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {describe, expect, it} from 'vitest'
import {run} from '../../packages/cli/src/index.ts'

const root = fileURLToPath(new URL('../../', import.meta.url))

async function cli(args: string[], cwd: string) {
  let stdout = ''
  let stderr = ''
  const code = await run(args, {
    cwd,
    env: {},
    stdout: {write: (s: string) => (stdout += s)},
    stderr: {write: (s: string) => (stderr += s)}
  })
  return {code, stdout, stderr}
}

/** A PNG signature and header, then bytes that are not UTF-8: what an image saved as .md looks like. */
const binaryBytes = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00, 0x00, 0x00, 0x0d, 0x49, 0x48, 0x44, 0x52, 0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10])

describe('upright check on undecodable files', () => {
  it('reports invalid UTF-8 and binary files one by one and still checks the rest', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-hygiene-'))
    writeFileSync(path.join(dir, 'a-good.md'), '# Good\n\n```upright\nflour -> dough -> bread\n```\n')
    // "caf" then a lone continuation byte, then an overlong encoding of "/": both invalid UTF-8.
    writeFileSync(path.join(dir, 'b-invalid.md'), Uint8Array.from([...Buffer.from('```upright\ncaf'), 0xa9, 0x20, 0xc0, 0xaf, ...Buffer.from(' -> x\n```\n')]))
    writeFileSync(path.join(dir, 'c-image.md'), binaryBytes)
    writeFileSync(path.join(dir, 'd-binary.upright'), binaryBytes)
    writeFileSync(path.join(dir, 'e-good.upright'), 'a -> b\r\nb -> c\r\n')

    const text = await cli(['check', dir], dir)
    expect(text.code).toBe(2)
    for (const name of ['b-invalid.md', 'c-image.md', 'd-binary.upright']) {
      expect(text.stdout).toContain(`${name}: error: cannot read: not valid UTF-8 text [io]`)
    }
    expect(text.stdout).not.toMatch(/a-good\.md|e-good\.upright/)
    expect(text.stdout.trim().split('\n').at(-1)).toBe('2 diagrams in 5 files: 2 passed, 0 failed, 3 files unreadable')
    expect(text.stderr).toBe('')

    const json = await cli(['check', '--format', 'json', dir], dir)
    expect(json.code).toBe(2)
    expect(() => JSON.parse(json.stdout)).not.toThrow()
    expect(json.stdout).toContain('not valid UTF-8 text')
  })

  it('a valid UTF-8 file full of control characters is checked, with positioned errors', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-hygiene-'))
    writeFileSync(path.join(dir, 'controls.upright'), 'a -> b\n\u0000\u0001 -> c\n')
    const {code, stdout} = await cli(['check', dir], dir)
    expect(code).toBe(1)
    expect(stdout).toContain('controls.upright:2:1: error: Unexpected character U+0000')
  })
})

/** Path → [mtime, size, sha256] for every file and directory under `dir`. */
function snapshot(dir: string): Map<string, string> {
  const out = new Map<string, string>()
  const walk = (at: string): void => {
    for (const name of readdirSync(at).sort()) {
      const full = path.join(at, name)
      const info = statSync(full)
      const hash = info.isFile() ? createHash('sha256').update(readFileSync(full)).digest('hex') : 'dir'
      out.set(path.relative(dir, full), `${info.mtimeMs} ${info.size} ${hash}`)
      if (info.isDirectory()) walk(full)
    }
  }
  out.set('.', `${statSync(dir).mtimeMs}`)
  walk(dir)
  return out
}

describe('the CLI never writes into the user files', () => {
  it('leaves a tree of passing, failing and broken files byte for byte as it was', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-readonly-'))
    for (const sub of ['fixtures/broken', 'fixtures/markdown', 'fixtures/cli']) cpSync(path.join(root, sub), path.join(dir, sub), {recursive: true})
    mkdirSync(path.join(dir, 'nested/deeper'), {recursive: true})
    writeFileSync(path.join(dir, 'nested/deeper/crlf.md'), '```upright\r\na -> b\r\na -> b\r\n```\r\n')
    writeFileSync(path.join(dir, 'nested/image.md'), binaryBytes)
    const before = snapshot(dir)
    expect(before.size).toBeGreaterThan(15)

    const runs = [
      ['check', '.'],
      ['check', '--format', 'json', 'fixtures', 'nested'],
      ['check', '--limits', '{"maxVertices": 2}', '.'],
      ['layout', 'fixtures/cli/chain.upright'],
      ['render', 'fixtures/markdown/good.md']
    ]
    for (const args of runs) {
      const result = await cli(args, dir)
      expect(result.code, args.join(' ')).toBeGreaterThanOrEqual(0)
    }
    expect(snapshot(dir)).toEqual(before)
  })
})

describe('--limits', () => {
  it('reaches the check, and a bad value is a usage error', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-limits-'))
    writeFileSync(path.join(dir, 'chain.upright'), 'a -> b -> c -> d\n')
    const passing = await cli(['check', 'chain.upright'], dir)
    expect(passing.code).toBe(0)
    const limited = await cli(['check', '--limits', '{"maxVertices": 3}', 'chain.upright'], dir)
    expect(limited.code).toBe(1)
    expect(limited.stdout).toContain('chain.upright:1:16: error: This diagram has 4 vertices; the limit is 3')
    expect(limited.stdout).toContain('[too-many-vertices]')
    const json = await cli(['check', '--format', 'json', '--limits', '{"maxEdges": 2}', 'chain.upright'], dir)
    expect(JSON.parse(json.stdout).diagrams[0].status).toBe('too-large')

    for (const bad of ['{"maxVertex": 3}', '{"maxVertices": 0}', '[1]', 'nope']) {
      const r = await cli(['check', '--limits', bad, 'chain.upright'], dir)
      expect(r.code, bad).toBe(2)
      expect(r.stderr, bad).toMatch(/--limits/)
    }
  })
})
