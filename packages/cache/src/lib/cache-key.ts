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

/**
 * Keys for many long texts (whole files) under the same `parts` (settings, tool): each key is a
 * SHA-256 of the canonical JSON of `parts`, a line break, and the text. The JSON is made once, and
 * the text is hashed as it is rather than copied into a JSON string first (on a warm run that copy
 * and the key sorting cost as much as the hash). Unambiguous: canonical JSON holds no raw line
 * break (JSON escapes them), so the first one ends it.
 */
export function textKeys(parts: unknown): (text: string) => string {
  const prefix = canonicalJson(parts) + '\n'
  return (text) => createHash('sha256').update(prefix, 'utf8').update(text, 'utf8').digest('hex')
}

export function sha256(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex')
}
