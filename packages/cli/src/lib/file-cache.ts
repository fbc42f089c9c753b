/**
 * A second layer of the cache for `upright check`: a whole Markdown file's results by a hash of its
 * text, so a run over unchanged files skips even the Markdown parse (which costs more than looking
 * up its diagrams). Entries live in the same folder as the diagrams' (remark-upright's cache.ts),
 * with the same guarantees: keyed by everything the results depend on (text, default flow, budget,
 * limits and the producing code), checksummed, shape-checked on reading, and never holding an
 * `undecided` diagram.
 *
 * Opening it loads only @upright/cache, not the Markdown parser or the checker: a run where every
 * file hits reads and hashes text and nothing more (check-files.ts loads the rest on a miss).
 */
import {createRequire} from 'node:module'
import {createResultCache, sourceFingerprint, textKeys, type ResultCache} from '@upright/cache'
import {defaultBudgetMillis, resolveLimits, type Flow, type Limits} from '@upright/core'
import type {PortableResult} from './portable-report.ts'

export type FileCache = ResultCache<PortableResult[]> & {readonly tool: string}

/** How `upright check` caches, as the main thread resolved it: a folder, memory only, or none. */
export type CacheChoice = {dir: string} | boolean

/** Bump when PortableResult changes shape. */
const fileFormat = 1
const open = new Map<string, FileCache>()

export function openFileCache(setting: CacheChoice | undefined): FileCache | undefined {
  if (setting === undefined || setting === false) return undefined
  const dir = setting === true ? undefined : setting.dir
  const id = dir ?? ''
  let cache = open.get(id)
  if (!cache) {
    // In memory the producing code cannot change during the process; on disk it is named.
    const tool = dir === undefined ? 'in-process' : toolFingerprint()
    cache = Object.assign(createResultCache<PortableResult[]>({dir, decode: decodeResults}), {tool})
    open.set(id, cache)
  }
  return cache
}

let tool: string | undefined

/**
 * The code the results come from: this package, the Markdown side of remark-upright and the core
 * (versions, and hashes of their sources when run from them). Resolved, not imported.
 */
function toolFingerprint(): string {
  if (tool === undefined) {
    const require = createRequire(import.meta.url)
    tool = sourceFingerprint([import.meta.url, require.resolve('remark-upright/check'), require.resolve('@upright/core')])
  }
  return tool
}

export function fileKey(
  cache: FileCache,
  text: string,
  settings: {flow?: Flow | undefined; budget?: number | undefined; limits?: Readonly<Partial<Limits>> | undefined}
): string {
  const flow = settings.flow ?? null
  const budget = settings.budget ?? defaultBudgetMillis
  // The settings are the same for every file of a run: resolve them once.
  if (!lastParts || lastParts.tool !== cache.tool || lastParts.flow !== flow || lastParts.budget !== budget || lastParts.limits !== settings.limits) {
    const parts = {kind: 'markdown-file', format: fileFormat, tool: cache.tool, flow, budget, limits: resolveLimits(settings.limits)}
    lastParts = {tool: cache.tool, flow, budget, limits: settings.limits, key: textKeys(parts)}
  }
  return lastParts.key(text)
}

let lastParts:
  | {tool: string; flow: Flow | null; budget: number; limits: Readonly<Partial<Limits>> | undefined; key: (text: string) => string}
  | undefined

const statuses = new Set(['upward', 'cycle', 'nonplanar', 'not-upward', 'syntax', 'too-large'])

function decodeResults(json: unknown): PortableResult[] | undefined {
  if (!Array.isArray(json)) return undefined
  for (const r of json) {
    if (!isRecord(r) || !isRecord(r['block']) || !isRecord(r['options'])) return undefined
    const block = r['block']
    if ((block['form'] !== 'fence' && block['form'] !== 'directive') || typeof block['body'] !== 'string') return undefined
    if (!isPoint(block['start']) || !isPoint(block['end'])) return undefined
    if (typeof r['status'] !== 'string' || !statuses.has(r['status'])) return undefined
    if (typeof r['options']['flow'] !== 'string') return undefined
    const messages = r['messages']
    if (!Array.isArray(messages) || !messages.every(isMessage)) return undefined
    if (r['certificate'] !== undefined && !(isRecord(r['certificate']) && typeof r['certificate']['kind'] === 'string')) return undefined
  }
  return json as PortableResult[]
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value)
}

function isPoint(value: unknown): boolean {
  return isRecord(value) && Number.isInteger(value['line']) && Number.isInteger(value['column'])
}

function isPlace(value: unknown): boolean {
  return isRecord(value) && isPoint(value['start']) && isPoint(value['end'])
}

function isMessage(m: unknown): boolean {
  if (!isRecord(m) || !isPlace(m['place'])) return false
  if (m['severity'] !== 'error' && m['severity'] !== 'warning') return false
  if (typeof m['ruleId'] !== 'string' || typeof m['reason'] !== 'string') return false
  if (m['note'] !== undefined && typeof m['note'] !== 'string') return false
  const related = m['related']
  return related === undefined || (Array.isArray(related) && related.every((r) => isRecord(r) && isPlace(r['place']) && typeof r['reason'] === 'string'))
}
