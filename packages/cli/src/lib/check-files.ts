/**
 * Read each file and check its diagrams with the same code the remark plugin uses, so the CLI and a
 * site build can never disagree about a diagram.
 *
 * The Markdown parser and the checker are loaded on the first file the whole-file cache does not
 * hold: a warm run only reads, hashes and looks up text.
 */
import {readFile} from 'node:fs/promises'
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
    const bytes = await readFile(file)
    const decoded = decodeUtf8(bytes)
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

function decodeUtf8(bytes: Uint8Array): string | undefined {
  try {
    return new TextDecoder('utf-8', {fatal: true}).decode(bytes)
  } catch {
    return undefined
  }
}

export type {BlockMessage, BlockResult, DiagramBlock, Point}
