/**
 * `pnpm demo`: build the demo handbook into site-demo/dist/ with a plain unified pipeline.
 * `pnpm demo -- --warn` reports failing diagrams as warnings and keeps them as code blocks;
 * `pnpm demo -- --out <dir>` writes somewhere else.
 */
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {buildSite, formatMessages} from './lib/build-site.ts'

const here = path.dirname(fileURLToPath(import.meta.url))
const args = process.argv.slice(2)
const warn = args.includes('--warn')
const outAt = args.indexOf('--out')
const outDir = outAt >= 0 && args[outAt + 1] ? path.resolve(args[outAt + 1]) : path.join(here, 'dist')

const result = await buildSite({
  pagesDir: path.join(here, 'pages'),
  outDir,
  order: ['overview', 'services', 'release', 'data', 'migration', 'seed-lots', 'volunteers'],
  upright: {onFailure: warn ? 'warn' : 'fail', rulesUrl: 'docs/rules.md'}
})
process.stderr.write(formatMessages(result.messages, process.cwd()))
if (result.ok) {
  const diagrams = result.pages.reduce((sum, p) => sum + p.diagrams, 0)
  const where = path.relative(process.cwd(), result.outDir) || '.'
  process.stdout.write(`wrote ${result.pages.length} pages (${diagrams} diagrams), an index and style.css to ${where}/\n`)
} else {
  const errors = result.messages.filter((m) => m.severity === 'error').length
  process.stderr.write(`demo build failed: ${errors} ${errors === 1 ? 'error' : 'errors'}; nothing written\n`)
  process.exitCode = 1
}
