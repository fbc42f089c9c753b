/**
 * Read each file and check its diagrams with the same code the remark plugin uses, so the CLI and a
 * site build can never disagree about a diagram.
 *
 * The Markdown parser and the checker are loaded on the first file the whole-file cache does not
 * hold: a warm run only reads, hashes and looks up text.
 */
import {readFileSync} from 'node:fs'
import path from 'node:path'
import {defaultBudgetMillis, type DiagramOptions, type Flow, type Limits, type Point} from '@upright/core'
import type {BlockMessage, BlockResult, DiagramBlock} from 'remark-upright/check'
import {checkBlockBody} from './check-bare.ts'
import {describeFsError} from './collect-files.ts'
import {fileKey, openFileCache, type CacheChoice} from './file-cache.ts'
import {fromPortableResult, toPortableResult} from './portable-report.ts'

export interface FileReport {
  file: string
  /** Display path, relative to where the command was run. */
  display: string
  text: string
  results: BlockResult[]
  /** Set when the file could not be read or decoded; its diagrams were not checked. */
  error?: string
}

export interface CheckFilesOptions {
  base: string
  flow?: Flow | undefined
  title?: string | undefined
  budget?: number | undefined
  /** Size limits per diagram (`--limits`); unset fields keep their defaults. */
  limits?: Readonly<Partial<Limits>> | undefined
  /**
   * Where results of Markdown files are looked up and stored: whole files (file-cache.ts) and each
   * diagram (remark-upright's `openOutcomeCache`), in a folder, in memory only (`true`), or not at
   * all (`false`, the default).
   */
  cache?: CacheChoice | undefined
}

let checker: Promise<typeof import('remark-upright/check')> | undefined

/** The Markdown parser and the checker, loaded once, when first needed. */
function loadChecker(): Promise<typeof import('remark-upright/check')> {
  checker ??= import('remark-upright/check')
  return checker
}

export async function checkFile(file: string, options: CheckFilesOptions): Promise<FileReport> {
  const display = path.relative(options.base, file) || path.basename(file)
  let text: string
  try {
    // Synchronous: one call instead of the four round trips (open, stat, read, close) of the
    // promise API through the thread pool, which cost more than the whole cache hit on a warm run.
    // Each thread reads one file at a time anyway, and a worker thread blocks nothing else.
    const decoded = readUtf8(file)
    if (decoded === undefined) {
      return {file, display, text: '', results: [], error: 'not valid UTF-8 text'}
    }
    text = decoded
  } catch (error) {
    return {file, display, text: '', results: [], error: describeFsError(error)}
  }
  const budget = options.budget ?? defaultBudgetMillis
  if (path.extname(file).toLowerCase() === '.upright') {
    const layer: Partial<DiagramOptions> = {}
    if (options.flow) layer.flow = options.flow
    if (options.title !== undefined) layer.title = options.title
    return {file, display, text, results: [checkBlockBody(text, layer, budget, options.limits)]}
  }
  const settings = {flow: options.flow, budget, limits: options.limits}
  const fileCache = openFileCache(options.cache)
  const key = fileCache ? fileKey(fileCache, text, settings) : undefined
  const held = key === undefined ? undefined : fileCache!.get(key)
  if (held) return {file, display, text, results: held.map(fromPortableResult)}
  const {checkTree, parseMarkdown, openOutcomeCache} = await loadChecker()
  const cache = options.cache === undefined || options.cache === false ? undefined : openOutcomeCache(options.cache, options.base)
  const results = checkTree(parseMarkdown(text), text, {...settings, cache})
  // A file with an undecided diagram is checked again next time, as that diagram is.
  if (key !== undefined && results.every((r) => r.status !== 'undecided')) fileCache!.set(key, results.map(toPortableResult))
  return {file, display, text, results}
}

const utf8 = new TextDecoder('utf-8', {fatal: true})

/**
 * The file as text without its byte order mark, or `undefined` when it is not valid UTF-8. The
 * runtime's own UTF-8 read is the fast path; it turns invalid bytes into U+FFFD, so only a text
 * holding U+FFFD (rare, and valid when written as such) is read again and checked strictly.
 */
function readUtf8(file: string): string | undefined {
  const text = readFileSync(file, 'utf8')
  if (text.includes('\uFFFD')) {
    try {
      return utf8.decode(readFileSync(file))
    } catch {
      return undefined
    }
  }
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
}

export type {BlockMessage, BlockResult, DiagramBlock, Point}
