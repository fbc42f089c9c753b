/**
 * A cache of computed results by content address: memory first, then the disk folder when one is
 * given. Values are stored as JSON text; `decode` checks the parsed shape, so an entry written by a
 * different version of the producer, or damaged in a way its checksum missed, is recomputed rather
 * than trusted.
 */
import {createMemoryStore} from './memory-store.ts'
import {openDiskStore, type DiskStore} from './disk-store.ts'

export interface ResultCacheOptions<T> {
  /** Disk folder; without it the cache lives in memory only. */
  dir?: string | undefined
  /** Bound on the disk folder, bytes (default 50 MiB). */
  maxBytes?: number | undefined
  /** Bound on the memory layer, in characters of JSON (default 64 Mi). */
  memoryChars?: number | undefined
  /** The value back from its parsed JSON, or `undefined` when it does not have the expected shape. */
  decode(json: unknown): T | undefined
}

export interface CacheStats {
  memoryHits: number
  diskHits: number
  misses: number
  writes: number
  corrupt: number
  evicted: number
}

export interface ResultCache<T> {
  get(key: string): T | undefined
  set(key: string, value: T): void
  /** Enforce the disk bound now. */
  prune(): void
  readonly disk: DiskStore | undefined
  stats(): CacheStats
}

export function createResultCache<T>(options: Readonly<ResultCacheOptions<T>>): ResultCache<T> {
  const memory = createMemoryStore<T>(options.memoryChars ?? 64 * 1024 * 1024)
  const disk = options.dir === undefined ? undefined : openDiskStore({dir: options.dir, maxBytes: options.maxBytes})
  let memoryHits = 0
  let diskHits = 0
  let misses = 0
  let undecodable = 0
  return {
    disk,
    get(key) {
      const held = memory.get(key)
      if (held !== undefined) {
        memoryHits++
        return held
      }
      const text = disk?.read(key)
      if (text !== undefined) {
        let value: T | undefined
        try {
          value = options.decode(JSON.parse(text))
        } catch {
          value = undefined
        }
        if (value !== undefined) {
          diskHits++
          memory.set(key, value, text.length)
          return value
        }
        undecodable++
      }
      misses++
      return undefined
    },
    set(key, value) {
      const text = JSON.stringify(value)
      memory.set(key, value, text.length)
      disk?.write(key, text)
    },
    prune() {
      disk?.prune()
    },
    stats() {
      return {
        memoryHits,
        diskHits,
        misses,
        writes: disk?.stats.writes ?? 0,
        corrupt: (disk?.stats.corrupt ?? 0) + undecodable,
        evicted: disk?.stats.evicted ?? 0
      }
    }
  }
}
