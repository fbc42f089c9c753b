/**
 * Build the demo handbook with a plain unified pipeline — remark-parse, remark-directive,
 * remark-upright, remark-rehype, rehype-stringify — one HTML file per Markdown page, an index, and a
 * style sheet. Nothing here knows about diagrams beyond counting them: checking and drawing them is the
 * plugin's job, so this is also the shortest example of using the plugin in a site of one's own.
 *
 * Pages are all processed before anything is written, so a failing diagram leaves the output folder
 * as it was rather than half rebuilt.
 */
import {mkdir, readFile, readdir, writeFile} from 'node:fs/promises'
import path from 'node:path'
import rehypeStringify from 'rehype-stringify'
import remarkDirective from 'remark-directive'
import remarkParse from 'remark-parse'
import remarkRehype from 'remark-rehype'
import remarkUpright, {diagramName, type Options as UprightOptions} from 'remark-upright'
import {unified} from 'unified'
import {indexShell, pageShell} from './shell.ts'

/** The site's style sheet, kept as plain CSS beside the pages. */
export const styleSheet = new URL('../style.css', import.meta.url)

export interface BuildSiteOptions {
  /** Folder of Markdown pages (`*.md`, not recursive). */
  pagesDir: string
  /** Folder the site is written to; created when missing. */
  outDir: string
  /** Name shown in every page's header and title (default: `'Larkmoor Seed Commons handbook'`). */
  siteName?: string | undefined
  /** Page names (without `.md`) listed first in the index, in this order; the rest follow by name. */
  order?: readonly string[] | undefined
  /** Passed to remark-upright unchanged (default: its own defaults, so a failing diagram fails the build). */
  upright?: Readonly<UprightOptions> | undefined
}

/** One message about a page, in file coordinates (1-based). */
export interface SiteMessage {
  file: string
  line: number | undefined
  column: number | undefined
  severity: 'error' | 'warning'
  reason: string
  ruleId: string | undefined
  note: string | undefined
  url: string | undefined
}

export interface BuiltPage {
  /** Page name without extension, e.g. `release`; written as `${name}.html`. */
  name: string
  /** Text of the page's first level-1 heading (or its name). */
  title: string
  /** Upright blocks found in the Markdown (fences and directives). */
  diagrams: number
  /** Absolute path of the written HTML file. */
  output: string
}

export type BuildSiteResult =
  | {ok: true; pages: BuiltPage[]; outDir: string; messages: SiteMessage[]}
  | {ok: false; messages: SiteMessage[]}

interface ProcessedPage {
  name: string
  title: string
  diagrams: number
  html: string
}

export async function buildSite(options: Readonly<BuildSiteOptions>): Promise<BuildSiteResult> {
  const siteName = options.siteName ?? 'Larkmoor Seed Commons handbook'
  const order = options.order ?? []
  const rank = (f: string): number => {
    const i = order.indexOf(f.slice(0, -'.md'.length))
    return i === -1 ? order.length : i
  }
  const names = (await readdir(options.pagesDir))
    .filter((f) => f.endsWith('.md'))
    .sort((a, b) => rank(a) - rank(b) || (a < b ? -1 : a > b ? 1 : 0))
  const processed: ProcessedPage[] = []
  const messages: SiteMessage[] = []
  let failed = false

  for (const fileName of names) {
    const filePath = path.join(options.pagesDir, fileName)
    const text = await readFile(filePath, 'utf8')
    const result = await processPage(filePath, text, options.upright)
    messages.push(...result.messages)
    if (!result.ok) {
      failed = true
      continue
    }
    processed.push({name: fileName.slice(0, -'.md'.length), ...result.page})
  }
  if (failed) return {ok: false, messages}

  await mkdir(options.outDir, {recursive: true})
  const pages: BuiltPage[] = []
  for (const page of processed) {
    const output = path.resolve(options.outDir, `${page.name}.html`)
    await writeFile(output, pageShell({siteName, title: page.title, body: page.html}))
    pages.push({name: page.name, title: page.title, diagrams: page.diagrams, output})
  }
  await writeFile(path.join(options.outDir, 'index.html'), indexShell({siteName, pages}))
  await writeFile(path.join(options.outDir, 'style.css'), await readFile(styleSheet))
  return {ok: true, pages, outDir: path.resolve(options.outDir), messages}
}

type PageResult =
  | {ok: true; page: Omit<ProcessedPage, 'name'>; messages: SiteMessage[]}
  | {ok: false; messages: SiteMessage[]}

async function processPage(filePath: string, text: string, upright: Readonly<UprightOptions> | undefined): Promise<PageResult> {
  // A first transform that looks at the tree before the plugin changes it: it counts the diagram
  // blocks and keeps hold of the vfile, whose messages we need even when the plugin stops the build.
  let seen: {file: {messages: ReadonlyArray<MessageLike>}; diagrams: number; title: string} | undefined
  const processor = unified()
    .use(remarkParse)
    .use(remarkDirective)
    .use(() => (tree: MdastRoot, file) => {
      seen = {file, diagrams: countDiagrams(tree), title: firstHeading(tree)}
    })
    .use(remarkUpright, upright)
    .use(remarkRehype)
    .use(rehypeStringify)

  try {
    const file = await processor.process({path: filePath, value: text})
    return {
      ok: true,
      page: {title: seen!.title || path.basename(filePath, '.md'), diagrams: seen!.diagrams, html: String(file)},
      messages: file.messages.map((m) => toSiteMessage(filePath, m))
    }
  } catch (error) {
    const recorded = seen?.file.messages ?? []
    if (recorded.length > 0) return {ok: false, messages: recorded.map((m) => toSiteMessage(filePath, m))}
    // Not a message from a plugin: a bug or an I/O problem, reported as it is.
    const reason = error instanceof Error ? error.message : String(error)
    return {ok: false, messages: [{file: filePath, line: undefined, column: undefined, severity: 'error', reason, ruleId: undefined, note: undefined, url: undefined}]}
  }
}

/** The little of an mdast tree this module reads (the mdast types are not a dependency of the site). */
interface MdastNode {
  type: string
  children?: MdastNode[]
  lang?: string | null
  name?: string
  depth?: number
  value?: unknown
}
type MdastRoot = MdastNode

interface MessageLike {
  line?: number | undefined
  column?: number | undefined
  reason: string
  ruleId?: string | undefined
  fatal?: boolean | null | undefined
  note?: string | undefined
  url?: string | undefined
}

function toSiteMessage(file: string, m: MessageLike): SiteMessage {
  return {
    file,
    line: m.line ?? undefined,
    column: m.column ?? undefined,
    severity: m.fatal === true ? 'error' : 'warning',
    reason: m.reason,
    ruleId: m.ruleId ?? undefined,
    note: m.note ?? undefined,
    url: m.url ?? undefined
  }
}

/** Fences with the language `upright` and `:::upright` container directives, anywhere in the tree. */
function countDiagrams(tree: MdastRoot): number {
  let count = 0
  const visit = (node: MdastNode): void => {
    if (node.type === 'code' && node.lang === diagramName) count++
    else if (node.type === 'containerDirective' && node.name === diagramName) count++
    else for (const child of node.children ?? []) visit(child)
  }
  visit(tree)
  return count
}

function firstHeading(tree: MdastRoot): string {
  const heading = (tree.children ?? []).find((n) => n.type === 'heading' && n.depth === 1)
  const text = (node: MdastNode): string =>
    typeof node.value === 'string' ? node.value : (node.children ?? []).map(text).join('')
  return heading ? text(heading) : ''
}

/** `file:line:col: severity reason [rule]`, with the note and the rule's link indented below. */
export function formatMessages(messages: readonly SiteMessage[], base: string): string {
  const lines: string[] = []
  for (const m of messages) {
    const where = m.line === undefined ? '' : `:${m.line}:${m.column ?? 1}`
    const rule = m.ruleId ? ` [${m.ruleId}]` : ''
    lines.push(`${path.relative(base, m.file) || m.file}${where}: ${m.severity}: ${m.reason}${rule}`)
    for (const noteLine of (m.note ?? '').split('\n').filter(Boolean)) lines.push(`  ${noteLine}`)
    if (m.url) lines.push(`  see ${m.url}`)
  }
  return lines.length > 0 ? lines.join('\n') + '\n' : ''
}
