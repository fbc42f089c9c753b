/**
 * A small set of edges whose removal makes a graph planar (the skewness problem is NP-hard, Liu &
 * Geldmacher 1977, so this is a heuristic and says so).
 *
 * Repeated Kuratowski extraction: while the graph is not planar, take the certificate of the
 * planarity test (a subdivided K5 or K3,3) and remove one of its edges, which destroys that subgraph.
 * Then a re-add pass puts back, in the order removed, every removed edge whose return keeps the graph
 * planar, so the final set is minimal (no single edge of it can go back). Each step is one linear
 * planarity test: O(k · (n + m)) for k edges removed.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {testPlanarity} from '../planarity/index.ts'

export interface PlanarizingSet {
  /** Edge ids, ascending. */
  edges: number[]
  /** True when the set is known to be of minimum size (one edge, for a nonplanar graph). */
  exact: boolean
}

/**
 * `prefer(e)` ranks the candidates of each Kuratowski subgraph: the edge with the largest value is
 * removed (the caller passes the written position, so the edge written last goes first).
 */
export function planarizingSet(g: Digraph, prefer: (e: number) => number = (e) => e): PlanarizingSet {
  const removed = new Set<number>()
  /** The graph without the removed edges, and its edge ids in g. */
  const sub = (): {graph: Digraph; ids: number[]} => {
    const ids: number[] = []
    for (let e = 0; e < g.edgeCount; e++) if (!removed.has(e)) ids.push(e)
    return {graph: createDigraph(g.vertexCount, ids.map((e) => [g.tail[e]!, g.head[e]!] as const)), ids}
  }
  const order: number[] = []
  for (;;) {
    const {graph, ids} = sub()
    const result = testPlanarity(graph)
    if (result.planar) break
    const candidates = result.kuratowski.edges.map((e) => ids[e]!)
    const pick = candidates.reduce((a, b) => (prefer(b) > prefer(a) ? b : a))
    removed.add(pick)
    order.push(pick)
  }
  for (const e of order) {
    removed.delete(e)
    if (!testPlanarity(sub().graph).planar) removed.add(e)
  }
  const edges = [...removed].sort((a, b) => a - b)
  return {edges, exact: edges.length <= 1}
}
