/**
 * Independent checker for a Kuratowski certificate (shares no code with the extraction): the edges are
 * distinct edges of g forming a simple graph in which every vertex has degree 2 except the branch
 * vertices; walking from each branch vertex along degree-2 vertices reaches another branch vertex, and
 * the paths found join every pair of K5's vertices exactly once, or every pair across K3,3's two sides
 * exactly once and nothing else. Such a graph is non-planar (Kuratowski 1930; K5 and K3,3 break
 * Euler's bounds m <= 3n - 6 and, bipartite, m <= 2n - 4). O(n + k).
 */
import type {Digraph} from '../graph/digraph.ts'
import type {KuratowskiSubgraph} from './index.ts'

export function verifyKuratowski(g: Digraph, k: KuratowskiSubgraph): {ok: true} | {ok: false; reason: string} {
  const n = g.vertexCount
  const isK5 = k.type === 'K5'
  if (!isK5 && k.type !== 'K3,3') return fail(`unknown type ${String(k.type)}`)
  const want = isK5 ? 5 : 6
  if (k.branch.length !== want) return fail(`${k.type} needs ${want} branch vertices, got ${k.branch.length}`)
  const branchIndex = new Map<number, number>()
  for (const [i, v] of k.branch.entries()) {
    if (!(Number.isInteger(v) && v >= 0 && v < n)) return fail(`branch vertex ${v} does not exist`)
    if (branchIndex.has(v)) return fail(`branch vertex ${v} is repeated`)
    branchIndex.set(v, i)
  }
  const deg = new Int32Array(n)
  const pairSeen = new Set<string>()
  for (let i = 0; i < k.edges.length; i++) {
    const e = k.edges[i]!
    if (!(Number.isInteger(e) && e >= 0 && e < g.edgeCount)) return fail(`edge ${e} does not exist`)
    if (i > 0 && !(k.edges[i - 1]! < e)) return fail('edges are not strictly ascending')
    const u = g.tail[e]!, v = g.head[e]!
    if (u === v) return fail(`edge ${e} is a self-loop`)
    const key = u < v ? `${u},${v}` : `${v},${u}`
    if (pairSeen.has(key)) return fail(`edge ${e} is parallel to another listed edge`)
    pairSeen.add(key)
    deg[u]!++
    deg[v]!++
  }
  const branchDeg = isK5 ? 4 : 3
  for (let v = 0; v < n; v++) {
    const d = deg[v]!
    if (branchIndex.has(v)) {
      if (d !== branchDeg) return fail(`branch vertex ${v} has degree ${d}, expected ${branchDeg}`)
    } else if (d !== 0 && d !== 2) {
      return fail(`vertex ${v} has degree ${d} but is not a branch vertex`)
    }
  }
  // Incidence lists of the subgraph.
  const start = new Int32Array(n + 1)
  for (let v = 0; v < n; v++) start[v + 1] = start[v]! + deg[v]!
  const inc = new Int32Array(2 * k.edges.length)
  const fill = start.slice(0, n)
  for (const e of k.edges) { inc[fill[g.tail[e]!]!++] = e; inc[fill[g.head[e]!]!++] = e }
  const used = new Uint8Array(g.edgeCount)
  let usedCount = 0
  const joined = new Set<string>()
  for (const b of k.branch) {
    for (let i = start[b]!; i < start[b + 1]!; i++) {
      let e = inc[i]!
      if (used[e]) continue // path already walked from its other end
      let v = b
      for (;;) {
        used[e] = 1
        usedCount++
        v = g.tail[e] === v ? g.head[e]! : g.tail[e]!
        if (branchIndex.has(v)) break
        const e0 = inc[start[v]!]!, e1 = inc[start[v]! + 1]!
        e = e0 === e ? e1 : e0
        if (used[e]) return fail(`the path from branch vertex ${b} runs into itself at vertex ${v}`)
      }
      if (v === b) return fail(`a path leaves branch vertex ${b} and returns to it`)
      const x = branchIndex.get(b)!, y = branchIndex.get(v)!
      if (!isK5 && (x < 3) === (y < 3)) return fail(`a path joins ${b} and ${v}, which are on the same side of K3,3`)
      const key = x < y ? `${x},${y}` : `${y},${x}`
      if (joined.has(key)) return fail(`branch vertices ${b} and ${v} are joined by two paths`)
      joined.add(key)
    }
  }
  if (usedCount !== k.edges.length) return fail('some edges lie on a cycle away from the branch vertices')
  const pairs = isK5 ? 10 : 9
  if (joined.size !== pairs) return fail(`only ${joined.size} of the ${pairs} branch pairs are joined`)
  return {ok: true}
}

function fail(reason: string): {ok: false; reason: string} {
  return {ok: false, reason}
}
