/**
 * Rendering does not depend on the machine's locale or time zone: the golden cases are rendered in a
 * child process under an unusual time zone (Pacific/Chatham, UTC+12:45) and a locale with its own case
 * rules and decimal comma (Turkish), then under another pair, and must equal expected.svg byte for
 * byte. The child reports what it saw, so the test fails if the environment did not take effect.
 */
import {spawnSync} from 'node:child_process'
import {readFileSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {describe, expect, it} from 'vitest'
import {goldenCases, goldenDir} from './render-golden.ts'

const root = fileURLToPath(new URL('../../', import.meta.url))
const tsx = path.join(root, 'node_modules/.bin/tsx')

interface ChildOutput {
  seen: {timeZone: string; locale: string; number: string; offset: number}
  out: Record<string, string>
}

function renderIn(env: Record<string, string>): ChildOutput {
  const result = spawnSync(tsx, ['test/golden/render-golden.ts'], {
    cwd: root,
    env: {PATH: process.env['PATH'] ?? '', HOME: process.env['HOME'] ?? '', ...env},
    encoding: 'utf8',
    maxBuffer: 1 << 26
  })
  if (result.status !== 0) throw new Error(`render-golden.ts failed (${result.status}): ${result.stderr}`)
  return JSON.parse(result.stdout) as ChildOutput
}

describe('rendering is independent of locale and time zone', () => {
  const environments = [
    {env: {TZ: 'Pacific/Chatham', LANG: 'tr_TR.UTF-8', LC_ALL: 'tr_TR.UTF-8'}, zone: 'Pacific/Chatham', locale: 'tr', number: '1.234,5'},
    {env: {TZ: 'America/St_Johns', LANG: 'de_DE.UTF-8', LC_ALL: 'de_DE.UTF-8'}, zone: 'America/St_Johns', locale: 'de', number: '1.234,5'}
  ]
  for (const {env, zone, locale, number} of environments) {
    it(`${env.TZ}, ${env.LANG}`, () => {
      const {seen, out} = renderIn(env)
      expect(seen.timeZone).toBe(zone)
      expect(seen.locale.startsWith(locale)).toBe(true)
      expect(seen.number).toBe(number)
      expect(seen.offset).not.toBe(0)
      const cases = goldenCases()
      expect(Object.keys(out).sort()).toEqual(cases)
      for (const name of cases) {
        const expected = readFileSync(path.join(goldenDir, name, 'expected.svg'))
        expect(Buffer.from(out[name]!).equals(expected), `${name} under ${env.TZ} ${env.LANG}`).toBe(true)
      }
    })
  }
})
