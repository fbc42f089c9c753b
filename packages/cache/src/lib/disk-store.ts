/**
 * Disk layer: one file per key under `dir/<first two hex digits>/<key>.entry`, so a folder never holds
 * more than a few thousand names.
 *
 * Safe when several processes (or worker threads) share the folder:
 * - a write goes to a temporary file of its own (process id, thread id, counter) and is renamed over
 *   the entry, so a reader sees the old entry, the new one or none, never half of one (rename is
 *   atomic within a file system, POSIX rename(2));
 * - each entry carries its key and a SHA-256 of its payload; a file that is truncated, edited or
 *   unreadable is treated as absent (and removed), so a damaged cache costs a recomputation, never a
 *   wrong answer;
 * - eviction and a concurrent write can race; the loser only loses a cache entry.
 *
 * Bounded: when the entries add up to more than `maxBytes`, the least recently used (oldest mtime;
 * a hit refreshes it) are removed until they fit in 90% of it. Pruning scans the folder, O(entries
 * · log entries); it runs on this thread's first write to the folder, after every eighth of
 * `maxBytes` written, and when the caller asks (the CLI does, once, at the end of a run that wrote).
 * Stores of one folder in one thread (the CLI's file cache and the plugin's diagram cache) share
 * that account, so they do not each scan the folder. A run that only reads adds nothing, so it need
 * not scan at all: `bytesWrittenInThread` tells the caller whether anything was written.
 */
import {mkdirSync, readdirSync, readFileSync, renameSync, statSync, unlinkSync, utimesSync, writeFileSync} from 'node:fs'
import path from 'node:path'
import {threadId} from 'node:worker_threads'
import {sha256} from './cache-key.ts'

export interface DiskStoreOptions {
  /** The cache folder; created on the first write. */
  dir: string
  /** Upper bound on the summed size of entries, bytes (default: 50 MiB). */
  maxBytes?: number | undefined
}

export interface DiskStore {
  readonly dir: string
  read(key: string): string | undefined
  write(key: string, payload: string): void
  /** Remove least recently used entries until the folder fits; returns how many were removed. */
  prune(): number
  readonly stats: {reads: number; hits: number; corrupt: number; writes: number; writeErrors: number; evicted: number}
}

export const defaultMaxBytes = 50 * 1024 * 1024

const magic = 'upright-cache 1'
const keyPattern = /^[0-9a-f]{64}$/
let tmpCounter = 0
/** Per folder, in this thread: whether it was pruned yet, and the bytes written since. */
const folders = new Map<string, {pruned: boolean; writtenSincePrune: number}>()
let writtenInThread = 0

/**
 * Bytes of entries written by every disk store of this thread so far. A caller that sees no change
 * over a run knows the run added nothing, so the folder is as far within its bound as before.
 */
export function bytesWrittenInThread(): number {
  return writtenInThread
}

export function openDiskStore(options: Readonly<DiskStoreOptions>): DiskStore {
  const dir = path.resolve(options.dir)
  const maxBytes = options.maxBytes ?? defaultMaxBytes
  const stats = {reads: 0, hits: 0, corrupt: 0, writes: 0, writeErrors: 0, evicted: 0}
  let folder = folders.get(dir)
  if (!folder) folders.set(dir, (folder = {pruned: false, writtenSincePrune: 0}))
  const account = folder
  const entryPath = (key: string) => path.join(dir, key.slice(0, 2), `${key}.entry`)

  const store: DiskStore = {
    dir,
    stats,
    read(key) {
      if (!keyPattern.test(key)) throw new RangeError(`cache key must be 64 hex digits, got ${JSON.stringify(key)}`)
      stats.reads++
      const file = entryPath(key)
      let text: string
      try {
        text = readFileSync(file, 'utf8')
      } catch {
        return undefined
      }
      const payload = decodeEntry(text, key)
      if (payload === undefined) {
        stats.corrupt++
        try {
          unlinkSync(file)
        } catch {
          // Another process may have replaced or removed it already.
        }
        return undefined
      }
      stats.hits++
      try {
        const now = new Date()
        utimesSync(file, now, now)
      } catch {
        // Recency is a hint for eviction only.
      }
      return payload
    },
    write(key, payload) {
      if (!keyPattern.test(key)) throw new RangeError(`cache key must be 64 hex digits, got ${JSON.stringify(key)}`)
      const file = entryPath(key)
      const text = encodeEntry(key, payload)
      const tmp = path.join(path.dirname(file), `.tmp-${process.pid}-${threadId}-${tmpCounter++}`)
      try {
        mkdirSync(path.dirname(file), {recursive: true})
        writeFileSync(tmp, text)
        renameSync(tmp, file)
        stats.writes++
      } catch {
        stats.writeErrors++
        try {
          unlinkSync(tmp)
        } catch {
          // Nothing was written.
        }
        return
      }
      const bytes = Buffer.byteLength(text)
      writtenInThread += bytes
      account.writtenSincePrune += bytes
      if (!account.pruned || account.writtenSincePrune > maxBytes / 8) store.prune()
    },
    prune() {
      account.pruned = true
      account.writtenSincePrune = 0
      const removed = pruneFolder(dir, maxBytes)
      stats.evicted += removed
      return removed
    }
  }
  return store
}

function encodeEntry(key: string, payload: string): string {
  return `${magic}\n${key}\n${sha256(payload)}\n${payload}`
}

function decodeEntry(text: string, key: string): string | undefined {
  const a = text.indexOf('\n')
  const b = text.indexOf('\n', a + 1)
  const c = text.indexOf('\n', b + 1)
  if (a < 0 || b < 0 || c < 0) return undefined
  if (text.slice(0, a) !== magic || text.slice(a + 1, b) !== key) return undefined
  const payload = text.slice(c + 1)
  return sha256(payload) === text.slice(b + 1, c) ? payload : undefined
}

/** Temporary files older than this were left by a process that died mid-write. */
const staleTmpMillis = 60 * 60 * 1000

function pruneFolder(dir: string, maxBytes: number): number {
  const entries: Array<{file: string; size: number; mtime: number}> = []
  let total = 0
  let subdirs: string[]
  try {
    subdirs = readdirSync(dir).filter((name) => /^[0-9a-f]{2}$/.test(name))
  } catch {
    return 0
  }
  const now = Date.now()
  for (const sub of subdirs) {
    let names: string[]
    try {
      names = readdirSync(path.join(dir, sub))
    } catch {
      continue
    }
    for (const name of names) {
      const file = path.join(dir, sub, name)
      try {
        const info = statSync(file)
        if (name.startsWith('.tmp-')) {
          if (now - info.mtimeMs > staleTmpMillis) unlinkSync(file)
          continue
        }
        if (!name.endsWith('.entry')) continue
        entries.push({file, size: info.size, mtime: info.mtimeMs})
        total += info.size
      } catch {
        // Removed by another process meanwhile.
      }
    }
  }
  if (total <= maxBytes) return 0
  entries.sort((x, y) => x.mtime - y.mtime || (x.file < y.file ? -1 : 1))
  const target = maxBytes * 0.9
  let removed = 0
  for (const entry of entries) {
    if (total <= target) break
    try {
      unlinkSync(entry.file)
      removed++
    } catch {
      // Already gone.
    }
    total -= entry.size
  }
  return removed
}
