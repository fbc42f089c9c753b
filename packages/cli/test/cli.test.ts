import {mkdirSync, mkdtempSync, readFileSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {spawnSync} from 'node:child_process'
import {fileURLToPath} from 'node:url'
import {describe, expect, it} from 'vitest'
import {run, type JsonReport} from '@upright/cli'

const root = fileURLToPath(new URL('../../../', import.meta.url))

async function cli(args: string[], env: Record<string, string> = {}) {
  let stdout = ''
  let stderr = ''
  const code = await run(args, {
    cwd: root,
    env,
    stdout: {write: (s: string) => (stdout += s)},
    stderr: {write: (s: string) => (stderr += s)}
  })
  return {code, stdout, stderr}
}

describe('upright check', () => {
  it('reports a cycle in compiler format with a code frame and exits 1', async () => {
    const {code, stdout} = await cli(['check', 'fixtures/cli/cycle.upright'])
    expect(code).toBe(1)
    expect(stdout).toContain('fixtures/cli/cycle.upright:3:1: error: These 3 edges form a cycle `a -> b -> c -> a`')
    expect(stdout).toContain('[cycle]')
    expect(stdout).toContain('  3 | c -> a\n    | ^^^^^^')
    expect(stdout.trim().split('\n').at(-1)).toBe('1 diagram in 1 file: 0 passed, 1 failed')
    expect(stdout).not.toContain('\u001b[')
  })

  it('prints the JSON shape with file positions and a cycle certificate', async () => {
    const {code, stdout} = await cli(['check', '--format', 'json', 'fixtures/markdown/cycle-in-blockquote.md'])
    expect(code).toBe(1)
    const report = JSON.parse(stdout) as JsonReport
    expect(report).toEqual({
      diagrams: [
        {
          file: 'fixtures/markdown/cycle-in-blockquote.md',
          line: 7,
          column: 3,
          status: 'cycle',
          messages: [
            {
              line: 9,
              column: 3,
              endLine: 9,
              endColumn: 16,
              severity: 'error',
              ruleId: 'cycle',
              reason: expect.stringContaining('`build -> test -> ship -> build`')
            }
          ],
          certificate: {kind: 'cycle', vertices: ['build', 'test', 'ship']},
          // One edge breaks the only cycle; the exact feedback arc set says it is the fewest.
          fix: {remove: [['build', 'test']], exact: true}
        }
      ],
      summary: {diagrams: 1, passed: 0, failed: 1}
    })
  })

  it('reports a subdivided K3,3 with its branch vertices and edges (Kuratowski 1930)', async () => {
    const {code, stdout} = await cli(['check', '--format', 'json', 'fixtures/cli/k33.upright'])
    expect(code).toBe(1)
    const [diagram] = (JSON.parse(stdout) as JsonReport).diagrams
    expect(diagram!.status).toBe('nonplanar')
    expect(diagram!.certificate).toEqual({
      kind: 'kuratowski',
      type: 'K3,3',
      branch: ['a', 'b', 'c', 'x', 'y', 'z'],
      edges: ['a', 'b', 'c'].flatMap((u) => ['x', 'y', 'z'].map((v) => [u, v]))
    })
    expect(diagram!.messages[0]!.reason).toBe('These 9 edges form a subdivided K3,3, so no drawing of them avoids a crossing. Suggested fix: dropping this edge lets the diagram be drawn without crossings if arrows could point any way: `c -> z`.')
    // K3,3 minus any edge is planar, so one edge is the fewest (Kuratowski 1930).
    expect(diagram!.fix).toEqual({remove: [['c', 'z']], exact: true})
  })

  it('passes an upward planar diagram with exit 0', async () => {
    const {code, stdout} = await cli(['check', 'fixtures/cli/chain.upright'])
    expect(stdout).toBe('1 diagram in 1 file: 1 passed, 0 failed\n')
    expect(code).toBe(0)
  })

  it('rejects the 5-vertex wheel (smallest planar non-upward DAG, shared/UPWARD-FACTS.md) with all 8 edges', async () => {
    const {code, stdout} = await cli(['check', '--format', 'json', 'fixtures/cli/wheel.upright'])
    expect(code).toBe(1)
    const [diagram] = (JSON.parse(stdout) as JsonReport).diagrams
    expect(diagram!.status).toBe('not-upward')
    const cert = diagram!.certificate as {kind: string; edges: string[][]}
    expect(cert.kind).toBe('obstruction')
    expect(cert.edges).toHaveLength(8)
    expect(diagram!.messages[0]!.ruleId).toBe('not-upward')
  })

  it('exits 2 on an unreadable path and still checks the others', async () => {
    const {code, stdout, stderr} = await cli(['check', 'no/such/file.md', 'fixtures/cli/cycle.upright'])
    expect(code).toBe(2)
    expect(stderr).toContain('cannot read no/such/file.md: no such file or directory')
    expect(stdout).toContain('1 diagram in 1 file')
  })

  it('exits 2 on a usage error', async () => {
    expect((await cli(['check'])).code).toBe(2)
    expect((await cli(['check', '--format', 'xml', 'x.md'])).code).toBe(2)
    expect((await cli(['frobnicate'])).code).toBe(2)
  })

  it('reports invalid UTF-8 for that file only', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-'))
    writeFileSync(path.join(dir, 'bad.md'), Buffer.from([0x23, 0x20, 0xff, 0xfe, 0x0a]))
    writeFileSync(path.join(dir, 'cycle.upright'), 'x -> x\n')
    const {code, stdout} = await cli(['check', dir])
    expect(code).toBe(2)
    expect(stdout).toMatch(/bad\.md: error: cannot read: not valid UTF-8 text \[io\]/)
    expect(stdout).toContain('cycle.upright:1:1: error:')
  })

  it('walks folders in sorted order, skipping node_modules and dot-folders', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-'))
    for (const sub of ['b', 'a', 'node_modules', '.hidden']) {
      const d = path.join(dir, sub)
      mkdirSync(d)
      writeFileSync(path.join(d, 'x.upright'), 'p -> p\n')
    }
    const {stdout} = await cli(['check', '--format', 'json', dir])
    const files = (JSON.parse(stdout) as JsonReport).diagrams.map((d) => d.file)
    expect(files).toEqual([path.relative(root, path.join(dir, 'a/x.upright')), path.relative(root, path.join(dir, 'b/x.upright'))])
  })

  it('runs as `pnpm upright` from the repository root (no build step)', () => {
    const result = spawnSync('npx', ['--yes', 'pnpm@12.4.2', '--silent', 'upright', 'check', 'fixtures/cli/cycle.upright'], {
      cwd: root,
      encoding: 'utf8',
      env: {...process.env, NO_COLOR: '1'}
    })
    expect(result.status).toBe(1)
    expect(result.stdout).toContain('fixtures/cli/cycle.upright:3:1: error:')
  })
})

describe('upright layout and render', () => {
  it('prints the layout JSON with stats: boxes around centres, edges pointing up, 0 crossings', async () => {
    const {code, stdout} = await cli(['layout', 'fixtures/cli/chain.upright', '--stats'])
    expect(code).toBe(0)
    const json = JSON.parse(stdout)
    expect(json.flow).toBe('up')
    expect(json.nodes.map((n: {id: string}) => n.id)).toEqual(['a', 'b', 'c'])
    expect(json.edges.map((e: {from: string; to: string}) => [e.from, e.to])).toEqual([['a', 'b'], ['b', 'c']])
    for (const e of json.edges as Array<{points: number[][]}>) {
      // flow=up: y decreases from tail to head (SVG y grows downward).
      for (let i = 1; i < e.points.length; i++) expect(e.points[i]![1]).toBeLessThan(e.points[i - 1]![1]!)
    }
    expect(json.stats).toMatchObject({crossings: 0, bends: 0})
  })

  it('rotates with --flow right: edges point to larger x', async () => {
    const {stdout} = await cli(['layout', 'fixtures/cli/chain.upright', '--flow', 'right'])
    const json = JSON.parse(stdout)
    expect(json.flow).toBe('right')
    for (const e of json.edges as Array<{points: number[][]}>) expect(e.points.at(-1)![0]).toBeGreaterThan(e.points[0]![0]!)
  })

  it('renders byte-identical SVG twice, to stdout or a file', async () => {
    const a = await cli(['render', 'fixtures/cli/chain.upright'])
    const b = await cli(['render', 'fixtures/cli/chain.upright'])
    expect(a.code).toBe(0)
    expect(a.stdout).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/)
    expect(a.stdout).toBe(b.stdout)
    const dir = mkdtempSync(path.join(tmpdir(), 'upright-'))
    const out = path.join(dir, 'out.svg')
    expect((await cli(['render', 'fixtures/cli/chain.upright', '-o', out])).code).toBe(0)
    expect(readFileSync(out, 'utf8')).toBe(a.stdout)
  })

  it('refuses to draw a failing diagram, with the check messages, exit 1', async () => {
    const {code, stdout, stderr} = await cli(['render', 'fixtures/cli/wheel.upright'])
    expect(code).toBe(1)
    expect(stdout).toBe('')
    expect(stderr).toContain('[not-upward]')
  })

  it('picks the n-th diagram of a Markdown file and says when there is none', async () => {
    expect((await cli(['layout', 'fixtures/markdown/good.md', '--diagram', '2'])).code).toBe(0)
    const missing = await cli(['layout', 'fixtures/markdown/good.md', '--diagram', '3'])
    expect(missing.code).toBe(2)
    expect(missing.stderr).toContain('there is no diagram 3')
  })
})
