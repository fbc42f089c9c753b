/**
 * `pnpm bench level`: the tier check (testLevelPlanarity, src/level) against the check that runs without
 * tiers (testUpwardPlanarity) on the same graphs, in one run. Graphs: random level planar level graphs
 * built from a fixed drawing (each level a row of w vertices; edges between consecutive rows added in
 * random order when they cross none already there), so both checks answer yes and build a witness.
 * Median of 5 runs per size; the ratio is level time over upward time.
 */
import {createDigraph, testLevelPlanarity, testUpwardPlanarity} from '../packages/core/src/index.ts'
import {mulberry32 as prng} from '../test/support/random.ts'


function levelPlanarGraph(levels: number, width: number, random: () => number): {n: number; edges: Array<[number, number]>; level: number[]} {
  const id = (l: number, i: number) => l * width + i
  const edges: Array<[number, number]> = []
  for (let l = 0; l + 1 < levels; l++) {
    const band: Array<[number, number]> = []
    const candidates: Array<[number, number]> = []
    for (let i = 0; i < width; i++) for (let j = Math.max(0, i - 2); j < Math.min(width, i + 3); j++) candidates.push([i, j])
    for (let k = candidates.length - 1; k > 0; k--) {
      const r = Math.floor(random() * (k + 1))
      ;[candidates[k], candidates[r]] = [candidates[r]!, candidates[k]!]
    }
    for (const [i, j] of candidates) {
      if (band.every(([a, b]) => (a - i) * (b - j) >= 0)) band.push([i, j])
    }
    for (const [i, j] of band) edges.push([id(l, i), id(l + 1, j)])
  }
  const level = Array.from({length: levels * width}, (_, v) => Math.floor(v / width))
  return {n: levels * width, edges, level}
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.floor(sorted.length / 2)]!
}

const random = prng(12345)
console.log('| vertices | edges | levels × width | level planarity (ms) | upward planarity (ms) | ratio |')
console.log('| ---: | ---: | --- | ---: | ---: | ---: |')
for (const [levels, width] of [[5, 10], [10, 10], [10, 20], [20, 20], [20, 40], [40, 40]] as const) {
  const {n, edges, level} = levelPlanarGraph(levels, width, random)
  const graph = createDigraph(n, edges)
  const levelTimes: number[] = []
  const upwardTimes: number[] = []
  for (let run = 0; run < 5; run++) {
    let t = performance.now()
    const a = testLevelPlanarity(graph, level)
    levelTimes.push(performance.now() - t)
    if (a.status !== 'planar') throw new Error(`level: ${a.status}`)
    t = performance.now()
    const b = testUpwardPlanarity(graph, {maxMillis: 60_000})
    upwardTimes.push(performance.now() - t)
    if (b.status !== 'upward') throw new Error(`upward: ${b.status}`)
  }
  const l = median(levelTimes)
  const u = median(upwardTimes)
  console.log(`| ${n} | ${edges.length} | ${levels} × ${width} | ${l.toFixed(1)} | ${u.toFixed(1)} | ${(l / u).toFixed(2)} |`)
}
