/**
 * Exact upward-planarity search for a connected digraph: branch and bound over its planar embeddings,
 * with the fixed-embedding test of Bertolazzi, Di Battista, Liotta & Mannino (Algorithmica 12, 1994)
 * as the bound (see large-angle-assignment.ts).
 *
 * The embedding grows path by path in the manner of the planarity algorithm of Demoucron, Malgrange &
 * Pertuiset (Rev. Française Rech. Opér. 8, 1964; cited from memory): relative to the placed subgraph H, the rest of G splits into fragments (an
 * unplaced edge between placed vertices, or a component of unplaced vertices with its attachment
 * edges). In any planar embedding of G extending H's, a fragment lies inside one face of H that holds
 * all its attachments, and a path through it runs between one corner of each end in that face. So
 * branching over (face, corner, corner) for one path enumerates each planar embedding exactly once.
 * Pruning:
 * - a fragment with no admissible face (a face holding all its attachments, each at a corner where
 *   the attaching edge keeps the vertex bimodal) cannot be placed;
 * - the fragment with the fewest admissible faces is placed next (forced moves first, as in DMP);
 * - a vertex that is not bimodal stays so when edges are added around it;
 * - a subgraph of an upward drawing is drawn upward, so a partial embedding that admits no upward
 *   drawing for any outer face cannot be completed; moreover a vertex that is so far a sink (source)
 *   but still has an out-edge (in-edge) to place must have its large angle where that edge can go;
 * - mirror images are both upward or both not, so the first branching off a lone cycle takes one of
 *   its two faces only.
 * Given the written order of the edges (`key`), the corners of each branching are tried best first:
 * an out-edge placed after an out-edge written before it, and before one written after it. This
 * changes which embedding is found first, never whether one is (a tie-break, not a constraint).
 *
 * Exponential in the worst case (the problem is NP-complete: Garg & Tamassia, SIAM J. Comput. 31,
 * 2001); the caller's budget bounds the time. Each node costs O(m·F) for faces and fragments plus the
 * matching of the bound.
 */
import {assignLargeAngles, type LargeAngles} from './large-angle-assignment.ts'

export type SearchOutcome =
  | {found: true; rot: number[][]; angles: LargeAngles; nodes: number}
  /** `assignmentPruned`: whether the face-assignment bound ever cut; if not, no bimodal embedding exists. */
  | {found: false; nodes: number; assignmentPruned: boolean}
  | {found: 'budget'; nodes: number}

/** 'upward' prunes with the full fixed-embedding test; 'bimodal' only asks for a bimodal embedding. */
export type SearchGoal = 'upward' | 'bimodal'

interface Fragment {
  /** Placed vertices it attaches to, each with the directions of its attaching edges (1 out, 2 in). */
  attach: Map<number, number>
  /** Any unplaced edge of it that touches a placed vertex, to start a path from. */
  edges: number[]
  /** Unplaced vertices inside (empty for a single edge between placed vertices). */
  inside: number[]
}

const outOfTime = Symbol('budget')

/**
 * A copy built by push, so always a packed array of small integers: the face lists here come from
 * push, slice and filter, whose results are packed or holey depending on the tier running them, and
 * the `allowed` test inlined into assignLargeAngles deoptimized ("wrong map") on each new kind.
 */
function packedCopy(a: readonly number[]): number[] {
  const out: number[] = []
  for (let i = 0; i < a.length; i++) out.push(a[i]!)
  return out
}

export function searchUpwardEmbedding(
  n: number,
  tail: ArrayLike<number>,
  head: ArrayLike<number>,
  goal: SearchGoal,
  expired: () => boolean,
  /** The vertex the embedding grows from; the order of the search depends on it, not its answer. */
  root = 0,
  /** Written order of each edge (smaller first); when given, corners agreeing with it are tried first. */
  key?: ArrayLike<number>,
): SearchOutcome {
  const m = tail.length
  const adj: number[][] = Array.from({length: n}, () => [])
  for (let e = 0; e < m; e++) {
    adj[tail[e]!]!.push(e)
    adj[head[e]!]!.push(e)
  }
  const other = (e: number, v: number) => (tail[e] === v ? head[e]! : tail[e]!)
  const dartFrom = (e: number, v: number) => (tail[e] === v ? 2 * e : 2 * e + 1)
  const rot: number[][] = Array.from({length: n}, () => [])
  const placedV = new Uint8Array(n)
  const placedE = new Uint8Array(m)
  let placedEdges = 0
  let nodes = 0

  const changes = (r: readonly number[], v: number) => {
    let c = 0
    for (let i = 0; i < r.length; i++) if ((tail[r[i]!] === v) !== (tail[r[(i + 1) % r.length]!] === v)) c++
    return c
  }
  /** Would an edge of direction `out` inserted at angle i of v keep v bimodal? */
  const okAt = (v: number, i: number, out: boolean) => {
    const r = rot[v]!
    if (r.length < 2) return true
    const x = tail[r[i]!] === v, y = tail[r[(i + 1) % r.length]!] === v
    if (x === y) return x === out || changes(r, v) === 0 // inside a block, or v has one direction
    return true // between the two blocks
  }
  const faceOfAngles = (): {faceAt: Int32Array[]; faces: number} => {
    const pos = new Int32Array(2 * m)
    for (let v = 0; v < n; v++) rot[v]!.forEach((e, i) => (pos[dartFrom(e, v)] = i))
    const faceOf = new Int32Array(2 * m).fill(-1)
    let faces = 0
    for (let v = 0; v < n; v++) {
      for (const e0 of rot[v]!) {
        const d0 = dartFrom(e0, v)
        if (faceOf[d0] !== -1) continue
        let d = d0
        do {
          faceOf[d] = faces
          const w = (d & 1) === 0 ? head[d >> 1]! : tail[d >> 1]!
          const r = rot[w]!
          d = dartFrom(r[(pos[d ^ 1]! + 1) % r.length]!, w)
        } while (d !== d0)
        faces++
      }
    }
    // built by push, not Array#map, so its elements kind does not depend on the tier (see packedCopy)
    const faceAt: Int32Array[] = []
    for (let v = 0; v < n; v++) faceAt.push(Int32Array.from(rot[v]!, (e) => faceOf[dartFrom(e, v) ^ 1]!))
    return {faceAt, faces}
  }

  const fragments = (): Fragment[] => {
    const out: Fragment[] = []
    const seen = new Uint8Array(n)
    for (let e = 0; e < m; e++) {
      if (placedE[e] || !placedV[tail[e]!] || !placedV[head[e]!]) continue
      out.push({attach: new Map([[tail[e]!, 1], [head[e]!, 2]]), edges: [e], inside: []})
    }
    for (let r = 0; r < n; r++) {
      if (placedV[r] || seen[r]) continue
      const inside = [r]
      seen[r] = 1
      const attach = new Map<number, number>()
      const edges: number[] = []
      for (let i = 0; i < inside.length; i++) {
        const v = inside[i]!
        for (const e of adj[v]!) {
          const w = other(e, v)
          if (placedV[w]) {
            attach.set(w, (attach.get(w) ?? 0) | (tail[e] === w ? 1 : 2))
            edges.push(e)
          } else if (!seen[w]) {
            seen[w] = 1
            inside.push(w)
          }
        }
      }
      out.push({attach, edges, inside})
    }
    return out
  }

  /** Faces where every attachment has a corner that keeps it bimodal for each attaching direction. */
  const admissible = (fr: Fragment, faceAt: Int32Array[], faces: number, okFaces: (v: number, dirs: number) => number[]): number[] => {
    let list: number[] | null = null
    for (const [a, dirs] of fr.attach) {
      if (faceAt[a]!.length === 0) continue // a lone vertex (only at the very start): no limit
      const here = okFaces(a, dirs)
      list = list === null ? here.slice() : list.filter((f) => here.includes(f))
      if (list.length === 0) break
    }
    return list ?? Array.from({length: faces}, (_, f) => f)
  }

  /** A path through the fragment: from a placed vertex to a placed vertex, or a pendant edge. */
  const pathIn = (fr: Fragment): {path: number[]; edges: number[]; ear: boolean} => {
    const e0 = fr.edges[0]!
    if (fr.inside.length === 0) return {path: [tail[e0]!, head[e0]!], edges: [e0], ear: true}
    const a = placedV[tail[e0]!] ? tail[e0]! : head[e0]!
    const x = other(e0, a)
    // BFS inside the fragment from x to any placed vertex reached by an edge other than e0
    const prevEdge = new Map<number, number>([[x, -1]])
    const queue = [x]
    for (let i = 0; i < queue.length; i++) {
      const v = queue[i]!
      for (const e of adj[v]!) {
        if (e === e0 || placedE[e]) continue
        const w = other(e, v)
        if (placedV[w]) {
          const path = [w, v]
          const edges = [e]
          let y = v
          while (y !== x) {
            const pe = prevEdge.get(y)!
            edges.push(pe)
            y = other(pe, y)
            path.push(y)
          }
          path.push(a)
          edges.push(e0)
          return {path, edges, ear: true}
        }
        if (!prevEdge.has(w)) {
          prevEdge.set(w, e)
          queue.push(w)
        }
      }
    }
    return {path: [a, x], edges: [e0], ear: false} // x hangs on a by a bridge
  }

  /** How well out-edge e, put at corner i of v (after rot[v][i]), agrees with its written neighbours. */
  const agrees = (v: number, i: number, e: number): number => {
    const r = rot[v]!
    if (key === undefined || tail[e] !== v || r.length === 0) return 0
    const before = r[i % r.length]!, after = r[(i + 1) % r.length]!
    let score = 0
    if (tail[before] === v) score += key[before]! < key[e]! ? 1 : -1
    if (tail[after] === v) score += key[e]! < key[after]! ? 1 : -1
    return score
  }
  /** Corner indices (or pairs) sorted best first by `score`; a stable sort keeps the plain order on ties. */
  const bestFirst = <T>(list: T[], score: (x: T) => number): T[] => {
    if (key === undefined) return list
    const scored = list.map((x) => [x, score(x)] as const).sort((p, q) => q[1] - p[1])
    const out: T[] = [] // by push: the loops over it saw holey and packed Array#map results
    for (const p of scored) out.push(p[0])
    return out
  }

  let assignmentPruned = false
  const bimodal = (touched: number[]): boolean => {
    for (const v of touched) if (changes(rot[v]!, v) > 2) return false
    return true
  }

  let result: {rot: number[][]; angles: LargeAngles} | null = null
  const go = (depth: number): boolean => {
    nodes++
    if (expired()) throw outOfTime
    if (placedEdges === m) {
      const angles = goal === 'upward' ? assignLargeAngles(rot, tail, head) : {large: new Int32Array(n).fill(-1), outerVertex: -1}
      if (angles === null) {
        assignmentPruned = true
        return false
      }
      result = {rot: rot.map((r) => r.slice()), angles}
      return true
    }
    const {faceAt, faces} = faceOfAngles()
    let best: Fragment | null = null
    let bestFaces: number[] = []
    // A placed vertex that is a sink so far but has an unplaced out-edge (or a source so far with
    // an unplaced in-edge) must send that edge through its large angle, the only one of its angles
    // open upward (downward); so its large angle must lie in a face where that fragment can go.
    // faces where v can take an edge in each needed direction (1 out, 2 in), per node and vertex
    const okCache = new Map<number, number[]>()
    const okFaces = (v: number, dirs: number): number[] => {
      const key = v * 4 + dirs
      let list = okCache.get(key)
      if (list === undefined) {
        const fa = faceAt[v]!
        const out: number[] = [], inn: number[] = []
        for (let i = 0; i < fa.length; i++) {
          if (okAt(v, i, true) && !out.includes(fa[i]!)) out.push(fa[i]!)
          if (okAt(v, i, false) && !inn.includes(fa[i]!)) inn.push(fa[i]!)
        }
        list = dirs === 1 ? out : dirs === 2 ? inn : out.filter((f) => inn.includes(f))
        okCache.set(key, list)
      }
      return list
    }
    const allowedFaces = new Map<number, number[]>()
    for (const fr of fragments()) {
      const list = admissible(fr, faceAt, faces, okFaces)
      if (list.length === 0 && faces > 0) return false
      if (best === null || list.length < bestFaces.length) {
        best = fr
        bestFaces = list
      }
      if (goal !== 'upward') continue
      for (const [v, dirs] of fr.attach) {
        const r = rot[v]!
        if (r.length === 0) continue
        const outs = r.reduce((c, e) => c + (tail[e] === v ? 1 : 0), 0)
        if (!((outs === 0 && dirs & 1) || (outs === r.length && dirs & 2))) continue
        const before = allowedFaces.get(v)
        allowedFaces.set(v, packedCopy(before === undefined ? list : before.filter((f) => list.includes(f))))
      }
    }
    if (goal === 'upward' && faces > 0) {
      const allowed = (v: number, i: number) => {
        const list = allowedFaces.get(v)
        return list === undefined || list.includes(faceAt[v]![i]!)
      }
      if (assignLargeAngles(rot, tail, head, allowed) === null) {
        assignmentPruned = true
        return false
      }
    }
    // Mirror symmetry: reversing every rotation maps upward embeddings to upward embeddings. When the
    // placed part is a single cycle (right after the first step), its two faces are mirror images,
    // so one of them suffices.
    if (depth === 1 && faces === 2) bestFaces = bestFaces.slice(0, 1)
    const {path, edges, ear} = pathIn(best!)
    const a = path[0]!, b = path[path.length - 1]!
    const first = edges[0]!, last = edges[edges.length - 1]!
    const inner = ear ? path.slice(1, -1) : path.slice(1)
    const place = (on: boolean) => {
      for (let i = 0; i < inner.length; i++) {
        const v = inner[i]!
        rot[v] = !on ? [] : i === inner.length - 1 && !ear ? [edges[i]!] : [edges[i]!, edges[i + 1]!]
        placedV[v] = on ? 1 : 0
      }
      for (const e of edges) placedE[e] = on ? 1 : 0
      placedEdges += on ? edges.length : -edges.length
    }
    const attempt = (): boolean => {
      place(true)
      const ok = bimodal(ear ? [a, b] : [a]) && go(depth + 1)
      place(false)
      return ok
    }
    const ra = rot[a]!
    if (ra.length === 0) {
      ra.push(first)
      if (ear) ra.push(last)
      const ok = attempt()
      ra.length = 0
      return ok
    }
    const fa = faceAt[a]!
    const good = new Uint8Array(faces)
    for (const f of bestFaces) good[f] = 1
    if (!ear) {
      const open: number[] = []
      for (let i = 0; i < fa.length; i++) if (good[fa[i]!]) open.push(i)
      const corners = bestFirst(open, (i) => agrees(a, i, first))
      for (const i of corners) {
        ra.splice(i + 1, 0, first)
        const ok = attempt()
        ra.splice(i + 1, 1)
        if (ok) return true
      }
      return false
    }
    if (a !== b) {
      const rb = rot[b]!
      const fb = faceAt[b]!
      const pairs: Array<[number, number]> = []
      for (let i = 0; i < fa.length; i++) {
        if (!good[fa[i]!]) continue
        for (let j = 0; j < fb.length; j++) if (fa[i] === fb[j]) pairs.push([i, j])
      }
      for (const [i, j] of bestFirst(pairs, ([i, j]) => agrees(a, i, first) + agrees(b, j, last))) {
        ra.splice(i + 1, 0, first)
        rb.splice(j + 1, 0, last)
        const ok = attempt()
        ra.splice(i + 1, 1)
        rb.splice(j + 1, 1)
        if (ok) return true
      }
      return false
    }
    // a closed path: both ends at a, in two angles of one face (or both in one angle, either order)
    for (let i = 0; i < fa.length; i++) {
      if (!good[fa[i]!]) continue
      for (let j = 0; j < fa.length; j++) {
        if (fa[i] !== fa[j]) continue
        const orders: Array<[number, number]> = i === j ? [[first, last], [last, first]] : [[first, last]]
        for (const [x, y] of orders) {
          if (i === j) ra.splice(i + 1, 0, x, y)
          else if (i < j) {
            ra.splice(j + 1, 0, y)
            ra.splice(i + 1, 0, x)
          } else {
            ra.splice(i + 1, 0, x)
            ra.splice(j + 1, 0, y)
          }
          const ok = attempt()
          ra.splice(ra.indexOf(x), 1)
          ra.splice(ra.indexOf(y), 1)
          if (ok) return true
        }
      }
    }
    return false
  }

  try {
    if (n === 0) return {found: true, rot, angles: {large: new Int32Array(0), outerVertex: -1}, nodes}
    placedV[root] = 1
    if (go(0)) {
      const r = result as unknown as {rot: number[][]; angles: LargeAngles}
      return {found: true, rot: r.rot, angles: r.angles, nodes}
    }
    return {found: false, nodes, assignmentPruned}
  } catch (err) {
    if (err === outOfTime) return {found: 'budget', nodes}
    throw err
  }
}
