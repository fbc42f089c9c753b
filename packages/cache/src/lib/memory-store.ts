/**
 * In-process layer: a Map in least-recently-used order (a Map iterates in insertion order, so
 * re-inserting on every hit keeps the oldest first), bounded by the summed size its caller states.
 * O(1) per get and set, amortised.
 */
export interface MemoryStore<T> {
  get(key: string): T | undefined
  set(key: string, value: T, size: number): void
  readonly size: number
}

export function createMemoryStore<T>(maxSize: number): MemoryStore<T> {
  const entries = new Map<string, {value: T; size: number}>()
  let total = 0
  return {
    get(key) {
      const entry = entries.get(key)
      if (!entry) return undefined
      entries.delete(key)
      entries.set(key, entry)
      return entry.value
    },
    set(key, value, size) {
      const old = entries.get(key)
      if (old) {
        total -= old.size
        entries.delete(key)
      }
      if (size > maxSize) return
      entries.set(key, {value, size})
      total += size
      for (const [k, e] of entries) {
        if (total <= maxSize) break
        entries.delete(k)
        total -= e.size
      }
    },
    get size() {
      return total
    }
  }
}
