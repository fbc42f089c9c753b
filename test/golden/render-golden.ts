/**
 * Render every golden case (fixtures/golden/<case>/input.upright, flags in args.json) with
 * `upright render`, in-process. Used by golden.test.ts, and run as a script by locale.test.ts under
 * another time zone and locale: then it prints {case: svg} as JSON and the environment it saw.
 */
import {existsSync, readFileSync, readdirSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {run} from '../../packages/cli/src/index.ts'

export const goldenDir = fileURLToPath(new URL('../../fixtures/golden/', import.meta.url))

export function goldenCases(): string[] {
  return readdirSync(goldenDir, {withFileTypes: true})
    .filter((entry) => entry.isDirectory())
    .map((entry) => entry.name)
    .sort()
}

export async function renderCase(name: string): Promise<{code: number; svg: string; stderr: string}> {
  const dir = path.join(goldenDir, name)
  const argsFile = path.join(dir, 'args.json')
  const args = existsSync(argsFile) ? (JSON.parse(readFileSync(argsFile, 'utf8')) as string[]) : []
  let svg = ''
  let stderr = ''
  const code = await run(['render', 'input.upright', ...args], {
    cwd: dir,
    env: {},
    stdout: {write: (s: string) => (svg += s)},
    stderr: {write: (s: string) => (stderr += s)}
  })
  return {code, svg, stderr}
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const out: Record<string, string> = {}
  for (const name of goldenCases()) out[name] = (await renderCase(name)).svg
  const seen = {
    timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone,
    locale: Intl.DateTimeFormat().resolvedOptions().locale,
    number: (1234.5).toLocaleString(),
    offset: new Date(0).getTimezoneOffset()
  }
  process.stdout.write(JSON.stringify({seen, out}))
}
