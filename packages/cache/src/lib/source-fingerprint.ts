/**
 * What version of the producing code made a cached result. A published package is named by its
 * version; a package run from its TypeScript sources (this repository, under tsx) changes without a
 * new version, so there the fingerprint also hashes every source file, and an edit to the checker
 * can never be answered with a result the old code cached. Read once per process and entry point.
 */
import {readdirSync, readFileSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {createHash} from 'node:crypto'

const memo = new Map<string, string>()

/**
 * `entries`: the main module file (a path or file: URL) of each package the results depend on. Each
 * package is found as the nearest folder above its entry holding a package.json.
 */
export function sourceFingerprint(entries: readonly string[]): string {
  const hash = createHash('sha256')
  for (const entry of entries) hash.update(packageFingerprint(entry)).update('\n')
  return hash.digest('hex')
}

function packageFingerprint(entry: string): string {
  const file = entry.startsWith('file:') ? fileURLToPath(entry) : path.resolve(entry)
  const known = memo.get(file)
  if (known) return known
  let dir = path.dirname(file)
  let manifest: {name?: string; version?: string} | undefined
  for (;;) {
    try {
      manifest = JSON.parse(readFileSync(path.join(dir, 'package.json'), 'utf8')) as {name?: string; version?: string}
      break
    } catch {
      const parent = path.dirname(dir)
      if (parent === dir) break
      dir = parent
    }
  }
  let fingerprint = `${manifest?.name ?? file}@${manifest?.version ?? '?'}`
  if (/\.(ts|mts|cts)$/.test(file)) {
    const hash = createHash('sha256')
    for (const source of listSources(path.dirname(file))) {
      hash.update(path.relative(dir, source)).update('\0').update(readFileSync(source)).update('\0')
    }
    fingerprint += `+src.${hash.digest('hex').slice(0, 16)}`
  }
  memo.set(file, fingerprint)
  return fingerprint
}

function listSources(dir: string): string[] {
  const out: string[] = []
  const entries = readdirSync(dir, {withFileTypes: true}).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
  for (const entry of entries) {
    const full = path.join(dir, entry.name)
    if (entry.isDirectory()) out.push(...listSources(full))
    else if (/\.(ts|js|mjs|json)$/.test(entry.name)) out.push(full)
  }
  return out
}
