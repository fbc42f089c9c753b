/**
 * `--shard i/n`: the i-th of n disjoint slices of the sorted file list, so CI jobs can split a check.
 * Files are ordered by their path relative to the base folder with `/` separators (the same order on
 * every machine and OS) and dealt round-robin: file k goes to shard (k mod n) + 1. Every file is in
 * exactly one shard, and shard sizes differ by at most one.
 */
import path from 'node:path'

export interface Shard {
  index: number
  count: number
}

export type ParsedShard = {ok: true; shard: Shard} | {ok: false; reason: string}

export function parseShard(text: string): ParsedShard {
  const match = /^(\d+)\/(\d+)$/.exec(text.trim())
  if (!match) return {ok: false, reason: 'expected i/n, such as 2/4'}
  const index = Number(match[1])
  const count = Number(match[2])
  if (count < 1) return {ok: false, reason: 'the number of shards must be at least 1'}
  if (index < 1 || index > count) return {ok: false, reason: `the shard must be from 1 to ${count}`}
  return {ok: true, shard: {index, count}}
}

export function selectShard(files: readonly string[], base: string, shard: Shard): string[] {
  const keyed = files.map((file) => ({file, key: path.relative(base, file).split(path.sep).join('/')}))
  keyed.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0))
  return keyed.filter((_, k) => k % shard.count === shard.index - 1).map((x) => x.file)
}
