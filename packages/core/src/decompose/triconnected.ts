/**
 * Triconnected components (the SPQR tree without its Q-nodes) of a biconnected multigraph, by
 * recursive splitting at separation pairs: Tutte's decomposition as formalised by Hopcroft & Tarjan
 * ("Dividing a graph into triconnected components", SIAM J. Comput. 2, 1973) and Di Battista &
 * Tamassia ("On-line planarity testing", SIAM J. Comput. 25, 1996) for the tree. Their linear-time
 * path search is NOT used here; instead:
 * 1. parallel edges are split off as bonds (P), and maximal chains through degree-2 vertices as
 *    polygons (S), in rounds until neither is left (a piece of one vertex pair is a bond, a cycle a
 *    polygon);
 * 2. then a separation pair {x, y} is looked for, x in increasing id: on a planar piece, y among
 *    the vertices sharing faces with x in a planar embedding of the piece, confirmed by one search
 *    (planarPairFinder); otherwise y as an articulation point of the piece minus x (one DFS, O(m)
 *    per x). One component of piece − {x, y} is split off with a new virtual edge {x, y} in both
 *    halves; a piece without a separation pair is triconnected (R);
 * 3. adjacent bonds and adjacent polygons are merged, which makes the result unique.
 * Complexity. A separation pair of a split half is one of the piece (the virtual edge stands for a
 * connected rest), so each piece keeps a cursor: vertices below it are known to lie in no
 * separation pair and are not tried again in its descendants. A vertex is shared by two halves only
 * when it is a pole of the split, so the failed tries number O(n + splits) and the successful ones
 * O(splits) = O(m), each costing O(m): O(m²) time in all, O(n²) on planar graphs (plus, on
 * planar pieces, Σ over faces of their size squared per piece for the candidates).
 */
import {createDigraph} from '../graph/digraph.ts'
import {dartHead, traceFaces} from '../embedding/rotation-system.ts'
import {testPlanarity} from '../planarity/test-planarity.ts'

/** An edge of a skeleton: a real edge of the input (virtual = -1) or half of a virtual pair. */
export interface SkeletonEdge {
  readonly a: number
  readonly b: number
  /** Input edge id, or -1 for a virtual edge. */
  readonly real: number
  /** Virtual pair id (index into TriconnectedComponents.links), or -1 for a real edge. */
  readonly virtual: number
}

export type ComponentKind = 'S' | 'P' | 'R'

export interface TriconnectedComponent {
  /** S: polygon (a cycle), P: bond (two vertices, three or more edges), R: triconnected simple graph. */
  readonly kind: ComponentKind
  readonly edges: readonly SkeletonEdge[]
}

export interface VirtualLink {
  /** The two components holding this virtual edge, and its index in each one's edge list. */
  readonly node: readonly [number, number]
  readonly index: readonly [number, number]
}

export interface TriconnectedComponents {
  readonly components: readonly TriconnectedComponent[]
  /** One per virtual pair: the edges of the SPQR tree. */
  readonly links: readonly VirtualLink[]
}

interface Item {
  a: number
  b: number
  real: number
  virtual: number
}

/** Thrown by triconnectedComponents when its `stop` callback says so; callers catch it. */
export class DecompositionStopped extends Error {
  constructor() {
    super('triconnected decomposition stopped')
  }
}

/**
 * `edges` must form a biconnected multigraph (loops not allowed) with at least two edges; a graph
 * of two vertices gives one bond. Throws RangeError otherwise (a caller's bug). `stop` is asked
 * between pieces and every 32 separation-pair tries; when it returns true, DecompositionStopped is
 * thrown (for a caller's time budget).
 */
export function triconnectedComponents(
  n: number,
  edges: ReadonlyArray<readonly [number, number]>,
  stop?: () => boolean
): TriconnectedComponents {
  if (edges.length < 2) throw new RangeError('triconnectedComponents needs at least two edges')
  for (const [a, b] of edges) {
    if (a === b || a < 0 || b < 0 || a >= n || b >= n) throw new RangeError(`bad edge (${a}, ${b})`)
  }
  let virtuals = 0
  const finals: Array<{kind: ComponentKind; items: Item[]}> = []
  const work: Array<{items: Item[]; cursor: number}> = [{items: edges.map(([a, b], i) => ({a, b, real: i, virtual: -1})), cursor: 0}]

  let tries = 0
  while (work.length > 0) {
    if (stop?.() === true) throw new DecompositionStopped()
    const piece = work.pop()!
    let items = piece.items
    // 1-2. series-parallel rounds: split off bonds of parallel items and polygons of degree-2 chains
    // until neither is left (each split is at a separation pair, so the cursor stays valid)
    let done: ComponentKind | null = null
    for (;;) {
      const groups = new Map<number, Item[]>()
      for (const it of items) {
        const key = it.a < it.b ? it.a * n + it.b : it.b * n + it.a
        const g = groups.get(key)
        if (g === undefined) groups.set(key, [it])
        else g.push(it)
      }
      if (groups.size === 1) {
        done = 'P'
        break
      }
      let changed = false
      if (groups.size < items.length) {
        changed = true
        const kept: Item[] = []
        for (const g of groups.values()) {
          if (g.length === 1) {
            kept.push(g[0]!)
            continue
          }
          const v = virtuals++
          finals.push({kind: 'P', items: [...g, {a: g[0]!.a, b: g[0]!.b, real: -1, virtual: v}]})
          kept.push({a: g[0]!.a, b: g[0]!.b, real: -1, virtual: v})
        }
        items = kept
      }
      const at = new Map<number, number[]>()
      items.forEach((it, i) => {
        for (const x of [it.a, it.b]) {
          const l = at.get(x)
          if (l === undefined) at.set(x, [i])
          else l.push(i)
        }
      })
      let branch = false
      for (const l of at.values()) if (l.length !== 2) branch = true
      if (!branch) {
        done = 'S'
        break
      }
      // maximal chains through degree-2 vertices, each between two branch vertices
      const gone = new Uint8Array(items.length)
      const added: Item[] = []
      for (const [v, l] of at) {
        if (l.length !== 2 || gone[l[0]!]) continue
        const chain: number[] = []
        const ends: number[] = []
        for (const first of l) {
          let item = first, x = v
          for (;;) {
            chain.push(item)
            const it = items[item]!
            x = it.a === x ? it.b : it.a
            const lx = at.get(x)!
            if (lx.length !== 2) break
            item = lx[0] === item ? lx[1]! : lx[0]!
          }
          ends.push(x)
        }
        for (const i of chain) gone[i] = 1
        const w = virtuals++
        finals.push({kind: 'S', items: [...chain.map((i) => items[i]!), {a: ends[0]!, b: ends[1]!, real: -1, virtual: w}]})
        added.push({a: ends[0]!, b: ends[1]!, real: -1, virtual: w})
        changed = true
      }
      if (added.length > 0) items = [...items.filter((_, i) => !gone[i]), ...added]
      if (!changed) break
    }
    if (done !== null) {
      finals.push({kind: done, items})
      continue
    }
    const local = new Map<number, number>()
    const verts: number[] = []
    for (const it of items) {
      for (const x of [it.a, it.b]) {
        if (!local.has(x)) {
          local.set(x, verts.length)
          verts.push(x)
        }
      }
    }
    const k = verts.length
    const deg = new Int32Array(k)
    for (const it of items) {
      deg[local.get(it.a)!]!++
      deg[local.get(it.b)!]!++
    }
    // 3. a separation pair, trying vertices in increasing id from the cursor
    const adjStart = new Int32Array(k + 1)
    for (let i = 0; i < k; i++) adjStart[i + 1] = adjStart[i]! + deg[i]!
    const adj = new Int32Array(2 * items.length) // item index
    const fill = adjStart.slice(0, k)
    items.forEach((it, i) => {
      adj[fill[local.get(it.a)!]!++] = i
      adj[fill[local.get(it.b)!]!++] = i
    })
    const other = (i: number, x: number) => {
      const it = items[i]!
      return local.get(it.a === verts[x] ? it.b : it.a)!
    }
    const order = verts.map((_, i) => i).filter((i) => verts[i]! >= piece.cursor).sort((p, q) => verts[p]! - verts[q]!)
    let found: {x: number; y: number} | null = null
    // On a planar piece only vertices sharing faces with x can pair with it (below); else every x
    // is tried with one DFS of the piece minus x.
    const pairFor = planarPairFinder(k, items, local, adjStart, adj, other)
    for (const x of order) {
      if ((++tries & 31) === 0 && stop?.() === true) throw new DecompositionStopped()
      const y = pairFor !== null ? pairFor(x) : articulationWithout(k, adjStart, adj, other, x)
      if (y !== -1) {
        found = {x, y}
        break
      }
      piece.cursor = verts[x]! + 1
    }
    if (found === null) {
      finals.push({kind: 'R', items})
      continue
    }
    // split off the component of piece − {x, y} that holds the first vertex reached
    const {x, y} = found
    const comp = new Uint8Array(k)
    comp[x] = 2
    comp[y] = 2
    let start = -1
    for (let i = 0; i < k && start === -1; i++) if (comp[i] === 0) start = i
    const stack = [start]
    comp[start] = 1
    while (stack.length > 0) {
      const v = stack.pop()!
      for (let p = adjStart[v]!; p < adjStart[v + 1]!; p++) {
        const w = other(adj[p]!, v)
        if (comp[w] === 0) {
          comp[w] = 1
          stack.push(w)
        }
      }
    }
    const v = virtuals++
    const xa = verts[x]!, ya = verts[y]!
    const inside: Item[] = [{a: xa, b: ya, real: -1, virtual: v}]
    const outside: Item[] = [{a: xa, b: ya, real: -1, virtual: v}]
    for (const it of items) {
      if (comp[local.get(it.a)!] === 1 || comp[local.get(it.b)!] === 1) inside.push(it)
      else outside.push(it)
    }
    const cursor = verts[x]!
    work.push({items: outside, cursor}, {items: inside, cursor})
  }

  return merge(finals, virtuals)
}

/**
 * For a planar piece (simple, biconnected): a function giving for x some y with {x, y} a
 * separation pair, or -1. In a plane biconnected simple graph, {x, y} separates iff x and y share
 * two faces (three if they are adjacent, the two beside their edge not counting): a closed curve
 * through x, y and the two faces then has vertices on both sides (Whitney; common practice in
 * planar graph algorithms). Candidates are read off the faces around x (Σ over faces of their
 * size squared for all x) and each is confirmed by a search of the piece minus {x, y}, so a wrong
 * candidate costs time, never a wrong split. null when the piece is not planar.
 */
function planarPairFinder(
  k: number,
  items: readonly Item[],
  local: ReadonlyMap<number, number>,
  adjStart: Int32Array,
  adj: Int32Array,
  other: (item: number, v: number) => number
): ((x: number) => number) | null {
  const pg = createDigraph(k, items.map((it) => [local.get(it.a)!, local.get(it.b)!] as [number, number]))
  const planar = testPlanarity(pg)
  if (!planar.planar) return null
  const faces = traceFaces({graph: pg, rotation: planar.embedding.rotation})
  const F = faces.darts.length
  // vertices of each face, and faces around each vertex (each once)
  const faceVerts: number[][] = faces.darts.map((ds) => [...new Set(Array.from(ds, (d) => dartHead(pg, d)))])
  const facesAt: number[][] = Array.from({length: k}, () => [])
  for (let f = 0; f < F; f++) for (const v of faceVerts[f]!) facesAt[v]!.push(f)
  const count = new Int32Array(k)
  const stamp = new Int32Array(k).fill(-1)
  const adjacent = new Int32Array(k).fill(-1)
  const seen = new Int32Array(k).fill(-1)
  let round = 0
  const separates = (x: number, y: number): boolean => {
    round++
    seen[x] = seen[y] = round
    let start = 0
    while (start === x || start === y) start++
    const stack = [start]
    seen[start] = round
    let reached = 3
    while (stack.length > 0) {
      const v = stack.pop()!
      for (let p = adjStart[v]!; p < adjStart[v + 1]!; p++) {
        const w = other(adj[p]!, v)
        if (seen[w] !== round) {
          seen[w] = round
          reached++
          stack.push(w)
        }
      }
    }
    return reached < k
  }
  return (x: number) => {
    for (let p = adjStart[x]!; p < adjStart[x + 1]!; p++) adjacent[other(adj[p]!, x)] = x
    const cands: number[] = []
    for (const f of facesAt[x]!) {
      for (const y of faceVerts[f]!) {
        if (y === x) continue
        if (stamp[y] !== x) {
          stamp[y] = x
          count[y] = 0
        }
        count[y]!++
        if (count[y] === (adjacent[y] === x ? 3 : 2)) cands.push(y)
      }
    }
    for (const y of cands) if (separates(x, y)) return y
    return -1
  }
}

/**
 * An articulation point of the graph minus vertex x (by the lowpoint DFS of Hopcroft & Tarjan,
 * iterative), or -1. The graph minus x is connected because the piece is biconnected.
 */
function articulationWithout(
  k: number,
  adjStart: Int32Array,
  adj: Int32Array,
  other: (item: number, v: number) => number,
  x: number
): number {
  if (k <= 3) return -1
  const num = new Int32Array(k).fill(-1)
  const low = new Int32Array(k)
  const parentItem = new Int32Array(k).fill(-1)
  const pos = new Int32Array(k)
  const root = x === 0 ? 1 : 0
  let counter = 0
  let rootChildren = 0
  const stack = [root]
  num[root] = counter++
  low[root] = num[root]!
  pos[root] = adjStart[root]!
  while (stack.length > 0) {
    const v = stack[stack.length - 1]!
    if (pos[v]! < adjStart[v + 1]!) {
      const item = adj[pos[v]!++]!
      if (item === parentItem[v]) continue
      const w = other(item, v)
      if (w === x) continue
      if (num[w] === -1) {
        num[w] = counter++
        low[w] = num[w]!
        parentItem[w] = item
        pos[w] = adjStart[w]!
        stack.push(w)
        if (v === root) rootChildren++
      } else if (num[w]! < low[v]!) {
        low[v] = num[w]!
      }
    } else {
      stack.pop()
      if (stack.length > 0) {
        const p = stack[stack.length - 1]!
        if (low[v]! < low[p]!) low[p] = low[v]!
        if (p !== root && low[v]! >= num[p]!) return p
      }
    }
  }
  return rootChildren > 1 ? root : -1
}

/** Merges bonds sharing a virtual pair, and polygons sharing one; builds the links. */
function merge(finals: Array<{kind: ComponentKind; items: Item[]}>, virtuals: number): TriconnectedComponents {
  const holders: number[][] = Array.from({length: virtuals}, () => [])
  finals.forEach((c, i) => {
    for (const it of c.items) if (it.virtual !== -1) holders[it.virtual]!.push(i)
  })
  const parent = finals.map((_, i) => i)
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]!]!
      i = parent[i]!
    }
    return i
  }
  const dropped = new Uint8Array(virtuals)
  for (let v = 0; v < virtuals; v++) {
    const [p, q] = holders[v]!
    if (p === undefined || q === undefined) throw new Error('internal: virtual edge without two holders')
    if (finals[p]!.kind === finals[q]!.kind && finals[p]!.kind !== 'R') {
      dropped[v] = 1
      parent[find(p)] = find(q)
    }
  }
  const groupOf = new Map<number, number>()
  const components: Array<{kind: ComponentKind; edges: SkeletonEdge[]}> = []
  finals.forEach((c, i) => {
    const r = find(i)
    let g = groupOf.get(r)
    if (g === undefined) {
      g = components.length
      groupOf.set(r, g)
      components.push({kind: c.kind, edges: []})
    }
    for (const it of c.items) if (it.virtual === -1 || !dropped[it.virtual]) components[g]!.edges.push(it)
  })
  // renumber the kept virtual pairs and record where each half sits
  const newId = new Int32Array(virtuals).fill(-1)
  const links: Array<{node: [number, number]; index: [number, number]}> = []
  components.forEach((c, ci) => {
    c.edges = c.edges.map((e, ei) => {
      if (e.virtual === -1) return {a: e.a, b: e.b, real: e.real, virtual: -1}
      let id = newId[e.virtual]!
      if (id === -1) {
        id = newId[e.virtual] = links.length
        links.push({node: [ci, -1], index: [ei, -1]})
      } else {
        links[id]!.node[1] = ci
        links[id]!.index[1] = ei
      }
      return {a: e.a, b: e.b, real: -1, virtual: id}
    })
  })
  // a merged polygon's edges are not in cycle order; put them in order (common practice for S skeletons)
  components.forEach((c, ci) => {
    if (c.kind === 'S') c.edges = cycleOrder(c.edges, links, ci)
  })
  return {components, links}
}

function cycleOrder(
  edges: SkeletonEdge[],
  links: Array<{node: [number, number]; index: [number, number]}>,
  ci: number
): SkeletonEdge[] {
  const at = new Map<number, number[]>()
  edges.forEach((e, i) => {
    for (const x of [e.a, e.b]) {
      const l = at.get(x)
      if (l === undefined) at.set(x, [i])
      else l.push(i)
    }
  })
  const out: SkeletonEdge[] = []
  const used = new Uint8Array(edges.length)
  let i = 0
  let v = edges[0]!.a
  for (let step = 0; step < edges.length; step++) {
    used[i] = 1
    out.push(edges[i]!)
    const e = edges[i]!
    v = e.a === v ? e.b : e.a
    const next = at.get(v)!.find((j) => !used[j])
    if (next === undefined) break
    i = next
  }
  // fix the link indices of the reordered component
  out.forEach((e, ei) => {
    if (e.virtual === -1) return
    const l = links[e.virtual]!
    if (l.node[0] === ci) l.index[0] = ei
    else l.index[1] = ei
  })
  return out
}
