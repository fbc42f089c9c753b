/**
 * Generated grid families shared by the growth and upward benches (see bench/growth.ts for what
 * each is and why it is upward planar or single-source). Seeded, so every run builds the same graphs.
 */
import {mulberry32 as prng} from '../../test/support/random.ts'

export interface Family {
  n: number
  edges: Array<[number, number]>
}

export function stGrid(target: number, seed: number): Family {
  const k = Math.max(2, Math.round(Math.sqrt(target)))
  const m = Math.max(2, Math.round(target / k))
  const rnd = prng(seed)
  const id = (i: number, j: number) => i + k * j
  const edges: Array<[number, number]> = []
  for (let j = 0; j < m; j++) {
    for (let i = 0; i < k; i++) {
      if (i + 1 < k) edges.push([id(i, j), id(i + 1, j)])
      if (j + 1 < m) edges.push([id(i, j), id(i, j + 1)])
      if (i + 1 < k && j + 1 < m) edges.push(rnd() < 0.5 ? [id(i, j), id(i + 1, j + 1)] : [id(i + 1, j), id(i, j + 1)])
    }
  }
  return {n: k * m, edges}
}

export function singleSource(st: Family, seed: number): Family {
  const rnd = prng(seed)
  const incoming: number[][] = Array.from({length: st.n}, () => [])
  st.edges.forEach(([, h], e) => incoming[h]!.push(e))
  const keep = new Uint8Array(st.edges.length)
  for (const ins of incoming) if (ins.length > 0) keep[ins[Math.floor(rnd() * ins.length)]!] = 1
  for (let e = 0; e < st.edges.length; e++) if (!keep[e] && rnd() < 0.5) keep[e] = 1
  return {n: st.n, edges: st.edges.filter((_, e) => keep[e])}
}

export function withoutSink(st: Family): Family {
  const t = st.n - 1
  return {n: st.n - 1, edges: st.edges.filter(([, h]) => h !== t)}
}

export function general(st: Family, seed: number): Family {
  const rnd = prng(seed)
  return {n: st.n, edges: st.edges.filter(() => rnd() < 0.6)}
}
