/**
 * Content addresses: a SHA-256 (FIPS 180-4) of a canonical JSON text of everything a result depends
 * on. Canonical means object keys sorted and `undefined` fields dropped, so two equal option objects
 * built in a different order get the same key. A cryptographic hash, not a short one, because a
 * collision would hand one diagram another's result: with 256 bits that needs ~2^128 entries.
 */
import {createHash} from 'node:crypto'

export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value))
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map((v) => (v === undefined ? null : sortKeys(v)))
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {}
    for (const key of Object.keys(value).sort()) {
      const v = (value as Record<string, unknown>)[key]
      if (v !== undefined) out[key] = sortKeys(v)
    }
    return out
  }
  return value
}

/** 64 hex digits naming `parts`. */
export function cacheKey(parts: unknown): string {
  return sha256(canonicalJson(parts))
}

export function sha256(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex')
}
