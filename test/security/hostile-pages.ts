/**
 * Pages built from fixtures/hostile/xss-vectors.json (OWASP XSS Filter Evasion Cheat Sheet vectors)
 * through the site pipeline: unified + remark-parse + remark-directive + remark-upright +
 * remark-rehype + rehype-stringify. Shared by the browser test and the static checks.
 */
import {readFileSync} from 'node:fs'
import {fileURLToPath} from 'node:url'
import rehypeStringify from 'rehype-stringify'
import remarkDirective from 'remark-directive'
import remarkParse from 'remark-parse'
import remarkRehype from 'remark-rehype'
import remarkUpright from 'remark-upright'
import {unified} from 'unified'

export interface HostileCorpus {
  source: string
  vectors: string[]
  ids: string[]
  links: string[]
}

export const corpus: HostileCorpus = JSON.parse(
  readFileSync(fileURLToPath(new URL('../../fixtures/hostile/xss-vectors.json', import.meta.url)), 'utf8')
) as HostileCorpus

/** A label in the diagram language: only `\` and `"` need escapes. */
export const labelOf = (text: string): string => `"${text.replace(/[\\"]/g, (c) => `\\${c}`)}"`

/** A directive attribute value: character references are decoded by remark-directive. */
const attributeOf = (text: string): string => `"${text.replace(/&/g, '&amp;').replace(/"/g, '&quot;')}"`

/**
 * One diagram per vector: the vector as the title and as both labels (so the spoken description also
 * names the ids), a hostile-looking id as the first vertex; then one diagram of all the ids; then a
 * failing diagram (a cycle) with hostile labels, which stays in the page as code.
 */
export function hostileMarkdown(): string {
  const parts = ['# Hostile labels\n', 'Every diagram below holds an attack string in its title and labels.\n']
  corpus.vectors.forEach((vector, i) => {
    const id = corpus.ids[i % corpus.ids.length]!
    parts.push(`:::upright{title=${attributeOf(vector)}}\n${id} ${labelOf(vector)} -> target_${i} ${labelOf(vector)}\n:::\n`)
  })
  corpus.links.forEach((link, i) => {
    parts.push('```upright\n' + `linked_${i} ${labelOf(link)} <${link}> -> next_${i}` + '\n```\n')
  })
  parts.push('```upright title="ids"\n' + corpus.ids.join(' -> ') + '\n```\n')
  parts.push('```upright\nloop ' + labelOf(corpus.vectors[1]!) + ' -> back ' + labelOf(corpus.vectors[3]!) + ' -> loop\n```\n')
  return parts.join('\n')
}

/** Vectors are long; the label limit is raised so every diagram is drawn. */
const limits = {maxLabelLength: 1000}

export interface BuiltHostilePage {
  html: string
  drawn: number
  /** `line:column ruleId` of every message. */
  messages: string[]
}

/**
 * Build the page. `output: 'hast'` is the default path; `'html'` puts raw SVG strings in the tree,
 * which only reach the page with allowDangerousHtml, the riskiest configuration a site can choose.
 */
export async function buildHostilePage(output: 'hast' | 'html'): Promise<BuiltHostilePage> {
  const raw = output === 'html'
  const processor = unified()
    .use(remarkParse)
    .use(remarkDirective)
    .use(remarkUpright, {onFailure: 'warn', output, limits})
    .use(remarkRehype, {allowDangerousHtml: raw})
    .use(rehypeStringify, {allowDangerousHtml: raw})
  const file = await processor.process({path: 'hostile.md', value: hostileMarkdown()})
  const body = String(file)
  // Passing diagrams, and in warn mode the marked fallback drawings of failing ones (class
  // "upright upright-fallback").
  const drawn = (body.match(/<figure class="upright[ "]/g) ?? []).length
  const html = `<!doctype html>\n<html lang="en"><head><meta charset="utf-8"><title>Hostile labels</title></head><body>\n${body}\n</body></html>\n`
  return {html, drawn, messages: file.messages.map((m) => `${m.line}:${m.column} ${m.ruleId}`)}
}
