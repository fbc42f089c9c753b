/**
 * `pnpm bench memory-latency`: how long a read waits for memory on this machine, by working-set size.
 *
 * The planarity figures at 10^6 edges depend on it (bench/README.md, "Planarity"): there every pass
 * is linear, and the time per edge goes with the number of reads that wait on each other, times what
 * one such read costs in an array of that size. Two machines of the same kind can differ here by 2×,
 * so a ratio "10^6 against 10^3" is only comparable with this reading beside it.
 *
 * A pointer chase: one int per 64-byte line (a common cache-line size, recalled, not read from the
 * machine), the lines linked in one random cycle, so each read's address is the previous read's value
 * and no two reads overlap. Nanoseconds per read over 2·10^6 steps, after 2·10^5 steps of warm-up.
 */
const line = 16 // ints per 64-byte line

function chase(bytes: number, seed: number): number {
  const lines = Math.floor(bytes / 64)
  const order = new Int32Array(lines)
  for (let i = 0; i < lines; i++) order[i] = i
  let s = seed >>> 0
  for (let i = lines - 1; i > 0; i--) {
    s = (Math.imul(s, 1103515245) + 12345) >>> 0
    const j = s % (i + 1)
    const t = order[i]!
    order[i] = order[j]!
    order[j] = t
  }
  const next = new Int32Array(lines * line)
  for (let i = 0; i < lines; i++) next[order[i]! * line] = order[(i + 1) % lines]! * line
  let p = 0
  for (let i = 0; i < 200_000; i++) p = next[p]!
  const steps = 2_000_000
  const start = process.hrtime.bigint()
  for (let i = 0; i < steps; i++) p = next[p]!
  const ns = Number(process.hrtime.bigint() - start) / steps
  if (p < 0) throw new Error('unreachable: keeps the chase from being optimized away')
  return ns
}

const sizes = [1, 4, 16, 64]
console.log(`memory latency: pointer chase, one read per 64-byte line, 2e6 dependent reads; node ${process.version}`)
console.log(`| working set | ns per read (best of 3) |`)
console.log(`|---:|---:|`)
for (const mb of sizes) {
  const ns = Math.min(...[1, 2, 3].map((seed) => chase(mb * 1024 * 1024, seed)))
  console.log(`| ${mb} MB | ${ns.toFixed(1)} |`)
}
