/**
 * A second layer of the cache for `upright check`: a whole Markdown file's results by a hash of its
 * text, so a run over unchanged files skips even the Markdown parse (which costs more than looking
 * up its diagrams). Entries live in the same folder as the diagrams' (remark-upright's cache.ts),
 * with the same guarantees: keyed by everything the results depend on (text, default flow, budget,
 * limits and the producing code), checksummed, shape-checked on reading, and never holding an
 * `undecided` diagram.
 */
import {cacheKey, createResultCache, type ResultCache} from '@upright/cache'
import {defaultBudgetMillis, resolveLimits, type Flow, type Limits} from '@upright/core'
import {openOutcomeCache, type CacheSetting} from 'remark-upright/check'
import type {PortableResult} from './portable-report.ts'

export type FileCache = ResultCache<PortableResult[]> & {readonly tool: string}

/** Bump when PortableResult changes shape. */
const fileFormat = 1
const open = new Map<string, FileCache>()

export function openFileCache(setting: {dir: string} | boolean, cwd: string): FileCache | undefined {
  const outcomes = openOutcomeCache(setting as CacheSetting, cwd)
  if (!outcomes) return undefined
  const dir = outcomes.disk?.dir
  const id = dir ?? ''
  let cache = open.get(id)
  if (!cache) {
    cache = Object.assign(createResultCache<PortableResult[]>({dir, decode: decodeResults}), {tool: outcomes.tool})
    open.set(id, cache)
  }
  return cache
}

export function fileKey(
  cache: FileCache,
  text: string,
  settings: {flow?: Flow | undefined; budget?: number | undefined; limits?: Readonly<Partial<Limits>> | undefined}
): string {
  return cacheKey({
    kind: 'markdown-file',
    format: fileFormat,
    tool: cache.tool,
    text,
    flow: settings.flow ?? null,
    budget: settings.budget ?? defaultBudgetMillis,
    limits: resolveLimits(settings.limits)
  })
}

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
