/**
 * The pictures in README.md and docs/language.md, drawn by our own CLI (`upright render`, in-process):
 * - each docs/images/examples/<name>.md (one diagram, quoted verbatim in the README) becomes
 *   docs/images/<name>.svg;
 * - in docs/language.md, the first diagram under each heading named in `languageSections` becomes
 *   docs/images/language-<slug>.svg, so the picture follows whatever the example there says;
 * - the README's demo diagram (site-demo/pages/services.md, diagram 1) becomes service-layers.svg.
 *
 * `npx tsx docs/images/build.ts` rewrites them all and prints one line per file;
 * test/demo/docs-images.test.ts checks that the committed files are what this would write.
 */
import {readFileSync, readdirSync, writeFileSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {findDiagramBlocks, indexLines, parseMarkdown} from 'remark-upright'
import {run} from '../../packages/cli/src/index.ts'

export const repo = fileURLToPath(new URL('../../', import.meta.url))
const imagesDir = path.join(repo, 'docs/images')

/** Headings of docs/language.md whose first diagram is pictured, and the picture's name. */
export const languageSections: ReadonlyArray<{heading: string; slug: string}> = [
  {heading: 'Lists', slug: 'written-order'},
  {heading: 'Edge labels', slug: 'edge-labels'},
  {heading: 'Tones', slug: 'tones'},
  {heading: 'Tiers', slug: 'tiers'}
]

export interface Picture {
  /** Path of the SVG, relative to the repository. */
  file: string
  /** Markdown file (relative to the repository) and which of its diagrams, counting from 1. */
  source: string
  diagram: number
}

export function pictures(): Picture[] {
  const list: Picture[] = []
  const examples = path.join(imagesDir, 'examples')
  for (const name of readdirSync(examples).filter((f) => f.endsWith('.md')).sort()) {
    list.push({file: `docs/images/${name.replace(/\.md$/, '.svg')}`, source: `docs/images/examples/${name}`, diagram: 1})
  }
  const language = readFileSync(path.join(repo, 'docs/language.md'), 'utf8')
  const blocks = findDiagramBlocks(parseMarkdown(language), indexLines(language))
  const lines = language.split('\n')
  for (const {heading, slug} of languageSections) {
    const at = lines.indexOf(`## ${heading}`) + 1
    if (at === 0) throw new Error(`docs/language.md has no "## ${heading}"`)
    const index = blocks.findIndex((b) => b.start.line > at)
    if (index < 0) throw new Error(`docs/language.md has no diagram after "## ${heading}"`)
    list.push({file: `docs/images/language-${slug}.svg`, source: 'docs/language.md', diagram: index + 1})
  }
  list.push({file: 'docs/images/service-layers.svg', source: 'site-demo/pages/services.md', diagram: 1})
  return list
}

/** The SVG `upright render` draws for a picture. */
export async function render(picture: Picture): Promise<string> {
  let svg = ''
  let stderr = ''
  const code = await run(['render', picture.source, '--diagram', String(picture.diagram)], {
    cwd: repo,
    env: {},
    stdout: {write: (s: string) => (svg += s)},
    stderr: {write: (s: string) => (stderr += s)}
  })
  if (code !== 0) throw new Error(`upright render ${picture.source} --diagram ${picture.diagram} failed:\n${stderr}`)
  return svg
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  for (const picture of pictures()) {
    writeFileSync(path.join(repo, picture.file), await render(picture))
    process.stdout.write(`${picture.file} from ${picture.source} (diagram ${picture.diagram})\n`)
  }
}
