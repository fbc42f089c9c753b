/**
 * Read each file and check its diagrams with the same code the remark plugin uses, so the CLI and a
 * site build can never disagree about a diagram.
 */
import {readFile} from 'node:fs/promises'
import path from 'node:path'
import {defaultBudgetMillis, type DiagramOptions, type Flow, type Limits, type Point} from '@upright/core'
import {checkTree, parseMarkdown, type BlockMessage, type BlockResult, type DiagramBlock, type OutcomeCache} from 'remark-upright/check'
import {checkBlockBody} from './check-bare.ts'
import {describeFsError} from './collect-files.ts'
import {fileKey, type FileCache} from './file-cache.ts'
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
  /** Where Markdown diagrams' results are looked up and stored (see remark-upright's `openOutcomeCache`). */
  cache?: OutcomeCache | undefined
  /** Whole-file results of Markdown files (file-cache.ts); used with `cache`. */
  fileCache?: FileCache | undefined
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
  const settings = {flow: options.flow, budget, limits: options.limits, cache: options.cache}
  const key = options.fileCache ? fileKey(options.fileCache, text, settings) : undefined
  const held = key === undefined ? undefined : options.fileCache!.get(key)
  if (held) return {file, display, text, results: held.map(fromPortableResult)}
  const results = checkTree(parseMarkdown(text), text, settings)
  // A file with an undecided diagram is checked again next time, as that diagram is.
  if (key !== undefined && results.every((r) => r.status !== 'undecided')) options.fileCache!.set(key, results.map(toPortableResult))
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
