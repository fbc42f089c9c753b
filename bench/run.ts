/**
 * `pnpm bench NAME [args]` runs bench/NAME.ts. Benchmarks print their own tables; figures worth
 * keeping go into bench/README.md with the command that produced them.
 */
import {readdirSync} from 'node:fs'
import {fileURLToPath, pathToFileURL} from 'node:url'
import path from 'node:path'

const here = path.dirname(fileURLToPath(import.meta.url))
const names = readdirSync(here)
  .filter((f) => f.endsWith('.ts') && f !== 'run.ts' && !f.startsWith('_'))
  .map((f) => f.slice(0, -3))
  .sort()
const [name, ...rest] = process.argv.slice(2)
if (!name || !names.includes(name)) {
  process.stderr.write(`usage: pnpm bench <${names.join('|')}> [args]\n`)
  process.exit(2)
}
process.argv = [process.argv[0]!, path.join(here, `${name}.ts`), ...rest]
await import(pathToFileURL(path.join(here, `${name}.ts`)).href)
