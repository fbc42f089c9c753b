/**
 * The cached unit: what checking (and drawing) one diagram body produced, in body coordinates, so an
 * entry is reused wherever the diagram moves in a file or between files. File positions are mapped
 * after the cache (check-block.ts). Keyed by the body text, the resolved options, the time budget and
 * the producing code (package versions, and a hash of the sources when run from them).
 *
 * `undecided` is never stored: it depends on how busy the machine was, not only on the inputs.
 */
import {createRequire} from 'node:module'
import {
  cacheKey,
  createResultCache,
  findCacheDir,
  sourceFingerprint,
  type ResultCache
} from '@upright/cache'
import type {Certificate, Diagnostic, DiagramOptions, DiagramStatus, Limits} from '@upright/core'

export interface DiagramOutcome {
  status: Exclude<DiagramStatus, 'undecided'>
  /** The body's diagnostics, in body coordinates (as `checkDiagram` gives them). */
  diagnostics: Diagnostic[]
  certificate?: Certificate | undefined
  /** For a drawn passing diagram: the SVG with its default id prefix. */
  svg?: string | undefined
}

export type OutcomeCache = ResultCache<DiagramOutcome> & {readonly tool: string}

/** The plugin's and the CLI's `cache` setting: `false` none, `true` memory only, or a disk folder. */
export type CacheSetting = boolean | {dir?: string | null | undefined; maxBytes?: number | null | undefined}

/** Format of the stored value; bump when DiagramOutcome changes shape. */
const outcomeFormat = 1

const open = new Map<string, OutcomeCache>()

/**
 * The cache for a setting, shared by every plugin instance and call in this thread (so a dev server
 * that rebuilds its processor keeps its entries). `cwd` is where a default disk folder is looked for.
 */
export function openOutcomeCache(setting: CacheSetting | null | undefined, cwd: string): OutcomeCache | undefined {
  if (setting === false) return undefined
  const dir = setting === true || setting === null || setting === undefined ? undefined : (setting.dir ?? findCacheDir(cwd))
  const maxBytes = typeof setting === 'object' && setting !== null ? (setting.maxBytes ?? undefined) : undefined
  const id = dir === undefined ? '' : `${dir}\0${maxBytes ?? ''}`
  let cache = open.get(id)
  if (!cache) {
    const tool = dir === undefined ? 'in-process' : toolFingerprint()
    cache = Object.assign(createResultCache<DiagramOutcome>({dir, maxBytes, decode: decodeOutcome}), {tool})
    open.set(id, cache)
  }
  return cache
}

export function outcomeKey(cache: OutcomeCache, body: string, options: DiagramOptions, budgetMillis: number, limits: Limits): string {
  return cacheKey({format: outcomeFormat, tool: cache.tool, body, options, budgetMillis, limits})
}

let tool: string | undefined

function toolFingerprint(): string {
  if (tool === undefined) {
    const require = createRequire(import.meta.url)
    tool = sourceFingerprint([import.meta.url, require.resolve('@upright/core'), require.resolve('@upright/svg')])
  }
  return tool
}

const statuses = new Set(['upward', 'cycle', 'nonplanar', 'not-upward', 'syntax', 'too-large'])

/** A parsed entry back as an outcome, or `undefined` if any field is not what we wrote. */
export function decodeOutcome(json: unknown): DiagramOutcome | undefined {
  if (!isRecord(json) || typeof json['status'] !== 'string' || !statuses.has(json['status'])) return undefined
  const diagnostics = json['diagnostics']
  if (!Array.isArray(diagnostics) || !diagnostics.every(isDiagnostic)) return undefined
  const svg = json['svg']
  if (svg !== undefined && (typeof svg !== 'string' || !svg.startsWith('<svg'))) return undefined
  const certificate = json['certificate']
  if (certificate !== undefined && !(isRecord(certificate) && typeof certificate['kind'] === 'string')) return undefined
  const outcome: DiagramOutcome = {status: json['status'] as DiagramOutcome['status'], diagnostics: diagnostics as Diagnostic[]}
  if (certificate !== undefined) outcome.certificate = certificate as unknown as Certificate
  if (svg !== undefined) outcome.svg = svg
  return outcome
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value)
}

function isPoint(value: unknown): boolean {
  return isRecord(value) && Number.isInteger(value['line']) && Number.isInteger(value['column']) && Number.isInteger(value['offset'])
}

function isRange(value: unknown): boolean {
  return isRecord(value) && isPoint(value['start']) && isPoint(value['end'])
}

function isDiagnostic(value: unknown): boolean {
  if (!isRecord(value)) return false
  if (value['severity'] !== 'error' && value['severity'] !== 'warning') return false
  if (typeof value['ruleId'] !== 'string' || typeof value['reason'] !== 'string' || !isRange(value['range'])) return false
  if (value['note'] !== undefined && typeof value['note'] !== 'string') return false
  const related = value['related']
  return related === undefined || (Array.isArray(related) && related.every((r) => isRecord(r) && isRange(r['range']) && typeof r['reason'] === 'string'))
}
