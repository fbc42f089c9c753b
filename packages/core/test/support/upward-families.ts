import type {Edge} from './upward-oracle.ts'

/** Seeded random DAG families for the upward-planarity tests (common practice generators). */
export type Family = 'dag' | 'single-source' | 'st' | 'bipartite' | 'forest'

function shuffled(n: number, rnd: () => number): number[] {
  const p = Array.from({length: n}, (_, i) => i)
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1))
    ;[p[i], p[j]] = [p[j]!, p[i]!]
  }
  return p
}

/**
 * A random DAG of the family on n vertices with edge probability p between vertices in a random
 * topological order; 'single-source' and 'st' add edges from earlier (to later) vertices until the
 * first (last) vertex in the order is the only source (sink); 'bipartite' only joins a random set of
 * sources to the other vertices, all sinks; 'forest' gives each vertex after the first at most one
 * neighbour before it, in either direction.
 */
export function randomDag(rnd: () => number, n: number, p: number, family: Family): Edge[] {
  const order = shuffled(n, rnd)
  const has = new Set<string>()
  const edges: Edge[] = []
  const add = (i: number, j: number) => {
    // i before j in the order: the edge runs order[i] -> order[j]
    const key = `${i},${j}`
    if (has.has(key)) return
    has.add(key)
    edges.push([order[i]!, order[j]!])
  }
  if (family === 'forest') {
    for (let j = 1; j < n; j++) {
      if (rnd() < 0.15) continue
      const i = Math.floor(rnd() * j)
      if (rnd() < 0.5) add(i, j)
      else edges.push([order[j]!, order[i]!])
    }
    return edges
  }
  if (family === 'bipartite') {
    const top = shuffled(n, rnd).slice(0, 1 + Math.floor(rnd() * (n - 1)))
    const isTop = new Set(top)
    for (const u of top) for (let v = 0; v < n; v++) if (!isTop.has(v) && rnd() < p) edges.push([u, v])
    return edges
  }
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rnd() < p) add(i, j)
  if (family === 'single-source' || family === 'st') {
    for (let j = 1; j < n; j++) if (!edges.some(([, v]) => v === order[j])) add(Math.floor(rnd() * j), j)
  }
  if (family === 'st') {
    for (let i = 0; i < n - 1; i++) if (!edges.some(([u]) => u === order[i])) add(i, i + 1 + Math.floor(rnd() * (n - 1 - i)))
  }
  return edges
}
