/**
 * Independent checker for a planar rotation system (shares no code with the left-right test).
 * 1. rotation[v] lists exactly the edges incident to v: a non-loop edge once at each end, a loop
 *    twice at its vertex.
 * 2. Faces are traced with the face on the left (after arriving along an edge at v, leave v along the
 *    edge that follows it in v's clockwise rotation), by position, so loops are handled too.
 * 3. Euler's formula V - E + F = 2 holds for every connected component with at least one edge (a
 *    rotation system is planar iff this holds; e.g. Mohar & Thomassen, "Graphs on Surfaces", 2001).
 *    Summed with isolated vertices this is V - E + F = 1 + C when the outer faces are counted once.
 * O(n + m).
 */
import type {RotationSystem} from '../embedding/rotation-system.ts'

export function verifyPlanarEmbedding(emb: RotationSystem): {ok: true} | {ok: false; reason: string} {
  const g = emb.graph
  const n = g.vertexCount
  const m = g.edgeCount
  if (emb.rotation.length !== n) return fail(`rotation has ${emb.rotation.length} lists for ${n} vertices`)
  // Half-edge h = base[v] + i is position i in rotation[v].
  const base = new Int32Array(n + 1)
  for (let v = 0; v < n; v++) base[v + 1] = base[v]! + emb.rotation[v]!.length
  if (base[n] !== 2 * m) return fail(`rotation has ${base[n]} entries, expected 2 x ${m} edges`)
  const slot = new Int32Array(2 * m).fill(-1) // slot[2e + k] = k-th half-edge of edge e
  const vertexOf = new Int32Array(2 * m)
  for (let v = 0; v < n; v++) {
    const rot = emb.rotation[v]!
    for (let i = 0; i < rot.length; i++) {
      const e = rot[i]!
      if (!(e >= 0 && e < m)) return fail(`vertex ${v} lists edge ${e}, which does not exist`)
      if (g.tail[e] !== v && g.head[e] !== v) return fail(`vertex ${v} lists edge ${e}, which is not incident to it`)
      const h = base[v]! + i
      vertexOf[h] = v
      if (slot[2 * e] === -1) slot[2 * e] = h
      else if (slot[2 * e + 1] === -1) slot[2 * e + 1] = h
      else return fail(`edge ${e} is listed more than twice`)
    }
  }
  const twin = new Int32Array(2 * m)
  for (let e = 0; e < m; e++) {
    const h0 = slot[2 * e]!, h1 = slot[2 * e + 1]!
    if (h1 === -1) return fail(`edge ${e} is listed ${h0 === -1 ? 'nowhere' : 'only once'}`)
    if (g.tail[e] !== g.head[e] && vertexOf[h0] === vertexOf[h1]) {
      return fail(`edge ${e} is listed twice at vertex ${vertexOf[h0]} and never at its other end`)
    }
    twin[h0] = h1
    twin[h1] = h0
  }
  // Components by union-find over edges.
  const parent = new Int32Array(n)
  for (let v = 0; v < n; v++) parent[v] = v
  const find = (v: number): number => {
    while (parent[v] !== v) { parent[v] = parent[parent[v]!]!; v = parent[v]! }
    return v
  }
  for (let e = 0; e < m; e++) {
    const x = find(g.tail[e]!), y = find(g.head[e]!)
    if (x !== y) parent[x] = y
  }
  // euler[root] accumulates V - E + F of its component.
  const euler = new Int32Array(n)
  const hasEdge = new Uint8Array(n)
  for (let v = 0; v < n; v++) euler[find(v)]!++
  for (let e = 0; e < m; e++) { const r = find(g.tail[e]!); euler[r]!--; hasEdge[r] = 1 }
  const seen = new Uint8Array(2 * m)
  for (let h0 = 0; h0 < 2 * m; h0++) {
    if (seen[h0]) continue
    euler[find(vertexOf[h0]!)]!++
    let h = h0
    do {
      seen[h] = 1
      const t = twin[h]!
      const w = vertexOf[t]!
      h = t + 1 === base[w + 1] ? base[w]! : t + 1
    } while (h !== h0)
  }
  for (let v = 0; v < n; v++) {
    if (find(v) === v && hasEdge[v] && euler[v] !== 2) {
      return fail(`the component of vertex ${v} has V - E + F = ${euler[v]}, not 2: the rotation is not planar`)
    }
  }
  return {ok: true}
}

function fail(reason: string): {ok: false; reason: string} {
  return {ok: false, reason}
}
