/**
 * Where the cache lives by default: `node_modules/.cache/upright` of the nearest folder at or above
 * `from` that holds a package.json (the convention build tools share, so `rm -rf node_modules`
 * clears it). No package.json up to the root: no default folder, and the caller keeps the cache in
 * memory only rather than litter an arbitrary folder.
 */
import {existsSync} from 'node:fs'
import path from 'node:path'

export const cacheFolderName = 'upright'

export function findCacheDir(from: string): string | undefined {
  let dir = path.resolve(from)
  for (;;) {
    if (existsSync(path.join(dir, 'package.json'))) return path.join(dir, 'node_modules', '.cache', cacheFolderName)
    const parent = path.dirname(dir)
    if (parent === dir) return undefined
    dir = parent
  }
}
