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
  return {file, display, text, results: checkTree(parseMarkdown(text), text, {flow: options.flow, budget, limits: options.limits, cache: options.cache})}
}

function decodeUtf8(bytes: Uint8Array): string | undefined {
  try {
    return new TextDecoder('utf-8', {fatal: true}).decode(bytes)
  } catch {
    return undefined
  }
}

export type {BlockMessage, BlockResult, DiagramBlock, Point}
