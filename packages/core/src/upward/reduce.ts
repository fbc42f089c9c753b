/**
 * Answer-preserving reductions for upward planarity, applied to one weakly connected component, with
 * a log that lets an upward embedding of the reduced core be grown back into one of the component.
 *
 * Lemmas (each checked against the brute-force oracle in test/upward-general.test.ts):
 * - Isolated vertex: takes no part (upward planarity is decided per component).
 * - Leaf: a vertex v of degree 1 can be deleted. In any upward drawing of G − v, a small enough disc
 *   around its neighbour u meets only u's own edges, and some direction strictly upward (or downward,
 *   for an edge v -> u) from u is free, so v fits there. In a bimodal embedding the right place is
 *   the end of u's out-block (in-block), or u's large angle when u is a sink (source); see growBack.
 * - Subdivision: a vertex with exactly one in-edge a -> v and one out-edge v -> b can be replaced by the
 *   edge a -> b (a y-monotone path and a y-monotone curve are interchangeable in a drawing).
 * - Parallel path: if a -> b is already present, the path a -> v -> b can be deleted outright: a copy
 *   of a -> b drawn close beside it is still upward and crossing-free, so neither answer changes.
 *   (This is why the reduced core never has parallel edges.)
 * All of this is common practice for upward planarity (e.g. Bertolazzi et al. 1998 start from a
 * component's simple core); the arguments above are ours.
 *
 * Time: O(n + m) with hashing of edge pairs.
 */
import type {Digraph} from '../graph/digraph.ts'

export type ReductionStep =
  | {kind: 'leaf'; v: number; e: number; u: number}
  | {kind: 'subdivide'; v: number; inEdge: number; outEdge: number; merged: number}
  | {kind: 'parallel'; v: number; inEdge: number; outEdge: number; twin: number}

/** Working edge ids: 0..m-1 are g's edges; merged edges get m, m+1, ... */
export interface Reduction {
  /** Endpoints of every working edge (g's edges first). */
  tail: number[]
  head: number[]
  steps: ReductionStep[]
  /** Vertices and working edges left in the core (connected, simple, no vertex of degree < 2). */
  coreVertices: number[]
  coreEdges: number[]
}

/** Reduce the component made of `vertices` (weakly connected in g). */
export function reduceComponent(g: Digraph, vertices: readonly number[]): Reduction {
  const tail: number[] = Array.from(g.tail)
  const head: number[] = Array.from(g.head)
  const alive = new Map<number, Set<number>>() // vertex -> incident working edges
  const byPair = new Map<string, number>()
  for (const v of vertices) alive.set(v, new Set())
  for (const v of vertices) {
    for (let i = g.outStart[v]!; i < g.outStart[v + 1]!; i++) {
      const e = g.outEdges[i]!
      alive.get(v)!.add(e)
      alive.get(g.head[e]!)!.add(e)
      byPair.set(`${v},${g.head[e]!}`, e)
    }
  }
  const steps: ReductionStep[] = []
  const removeEdge = (e: number) => {
    alive.get(tail[e]!)!.delete(e)
    alive.get(head[e]!)!.delete(e)
    if (byPair.get(`${tail[e]!},${head[e]!}`) === e) byPair.delete(`${tail[e]!},${head[e]!}`)
  }
  const queue = [...vertices]
  while (queue.length > 0) {
    const v = queue.pop()!
    const inc = alive.get(v)
    if (inc === undefined || inc.size > 2) continue
    if (inc.size === 0) {
      if (alive.size > 1) alive.delete(v) // keep one vertex so growing back has a place to start
      continue
    }
    if (inc.size === 1) {
      const e = inc.values().next().value as number
      const u = tail[e] === v ? head[e]! : tail[e]!
      removeEdge(e)
      alive.delete(v)
      steps.push({kind: 'leaf', v, e, u})
      queue.push(u)
      continue
    }
    const [e1, e2] = [...inc] as [number, number]
    let inEdge: number, outEdge: number
    if (head[e1] === v && tail[e2] === v) [inEdge, outEdge] = [e1, e2]
    else if (head[e2] === v && tail[e1] === v) [inEdge, outEdge] = [e2, e1]
    else continue
    const a = tail[inEdge]!, b = head[outEdge]!
    removeEdge(inEdge)
    removeEdge(outEdge)
    alive.delete(v)
    const twin = byPair.get(`${a},${b}`)
    if (twin !== undefined) {
      steps.push({kind: 'parallel', v, inEdge, outEdge, twin})
      queue.push(a, b)
    } else {
      const merged = tail.length
      tail.push(a)
      head.push(b)
      alive.get(a)!.add(merged)
      alive.get(b)!.add(merged)
      byPair.set(`${a},${b}`, merged)
      steps.push({kind: 'subdivide', v, inEdge, outEdge, merged})
    }
  }
  const coreVertices = [...alive.keys()].sort((x, y) => x - y)
  const edgeSet = new Set<number>()
  for (const inc of alive.values()) for (const e of inc) edgeSet.add(e)
  const coreEdges = [...edgeSet].sort((x, y) => x - y)
  return {tail, head, steps, coreVertices, coreEdges}
}
