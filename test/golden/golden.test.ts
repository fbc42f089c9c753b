/**
 * Golden SVG fixtures, byte for byte: each case in fixtures/golden/ is rendered with `upright render`
 * and compared with its expected.svg. `UPDATE=1 npx vitest run test/golden` rewrites them (review the
 * diff before committing: a change is a change in what every site shows).
 */
import {existsSync, readFileSync, writeFileSync} from 'node:fs'
import path from 'node:path'
import {describe, expect, it} from 'vitest'
import {goldenCases, goldenDir, renderCase} from './render-golden.ts'

const update = process.env['UPDATE'] === '1'

describe('golden SVG', () => {
  const cases = goldenCases()
  it('has the cases', () => {
    expect(cases.length).toBeGreaterThanOrEqual(8)
  })

  for (const name of cases) {
    it(name, async () => {
      const {code, svg, stderr} = await renderCase(name)
      expect(stderr).toBe('')
      expect(code).toBe(0)
      expect(svg.startsWith('<svg')).toBe(true)
      const expectedFile = path.join(goldenDir, name, 'expected.svg')
      if (update) writeFileSync(expectedFile, svg)
      expect(existsSync(expectedFile), `${expectedFile} is missing: run with UPDATE=1 to write it`).toBe(true)
      // Byte for byte (a Buffer comparison, so no normalisation of any kind happens on the way).
      expect(Buffer.from(svg).equals(readFileSync(expectedFile)), `${name} differs from expected.svg`).toBe(true)
    })
  }

  it('rendering twice in one process gives the same bytes', async () => {
    for (const name of cases.slice(0, 3)) expect((await renderCase(name)).svg).toBe((await renderCase(name)).svg)
  })
})
