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
 *    halves; a piece without a separation pair is triconnected (R). Only the first planar piece
 *    of a line of descent runs the planarity test: the bond, polygon and split steps are
 *    contractions and deletions, so each half's rotation is derived from its parent's in time
 *    linear in the piece (each half's virtual edge follows a path through the other half);
 *    Euler's formula checks every derived rotation;
 * 3. adjacent bonds and adjacent polygons are merged, which makes the result unique.
 * Complexity. A separation pair of a split half is one of the piece (the virtual edge stands for a
 * connected rest), so each piece keeps a cursor: vertices below it are known to lie in no
 * separation pair and are not tried again in its descendants. A vertex is shared by two halves only
 * when it is a pole of the split, so the failed tries number O(n + splits) and the successful ones
 * O(splits) = O(m), each costing O(m): O(m²) time in all, O(n²) on planar graphs (plus, on
 * planar pieces, Σ over faces of their size squared per piece for the candidates). That worst
 * case stays: a split that peels a small part off a large piece still re-indexes the large rest.
 * What is linear per piece in practice is the constant: typed arrays reused across pieces, no
 * per-piece planarity test (above). On the 10,000-vertex thinned grid of bench/upward.ts the
 * largest block (29,023 edges) needs 30 pieces.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
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

interface Piece {
  items: Item[]
  cursor: number
  rot: Map<number, Item[]> | null
}

/**
 * A rotation after items were replaced (swap: item -> its stand-in, or null when deleted) and
 * the vertices `gone` left the piece. O(size of the rotation).
 */
function rerouted(rot: Map<number, Item[]>, swap: ReadonlyMap<Item, Item | null>, gone: readonly number[]): Map<number, Item[]> {
  const out = new Map<number, Item[]>()
  for (const [v, seq] of rot) {
    const next: Item[] = []
    for (const it of seq) {
      const r = swap.get(it)
      if (r === undefined) next.push(it)
      else if (r !== null) next.push(r)
    }
    out.set(v, next)
  }
  for (const v of gone) out.delete(v)
  return out
}

/**
 * The first and last items of some path from x to y whose inner vertices all have comp = side
 * (a direct x–y item counts when side is 0), by a search from x. The piece is biconnected and
 * {x, y} separates it, so both sides have one.
 */
function pathEnds(
  x: number,
  y: number,
  side: number,
  comp: Uint8Array,
  adjStart: Int32Array,
  adj: Int32Array,
  other: (item: number, v: number) => number
): [number, number] {
  const rootItem = new Map<number, number>()
  const queue: number[] = []
  for (let p = adjStart[x]!; p < adjStart[x + 1]!; p++) {
    const i = adj[p]!
    const w = other(i, x)
    if (w === y) {
      if (side === 0) return [i, i]
      continue
    }
    if (comp[w] === side && !rootItem.has(w)) {
      rootItem.set(w, i)
      queue.push(w)
    }
  }
  for (let q = 0; q < queue.length; q++) {
    const v = queue[q]!
    for (let p = adjStart[v]!; p < adjStart[v + 1]!; p++) {
      const i = adj[p]!
      const w = other(i, v)
      if (w === y) return [rootItem.get(v)!, i]
      if (comp[w] === side && !rootItem.has(w)) {
        rootItem.set(w, rootItem.get(v)!)
        queue.push(w)
      }
    }
  }
  throw new Error('internal: no path between the poles of a split')
}

interface Item {
  a: number
  b: number
  real: number
  virtual: number
  /** Scratch: the item's index in the piece that holds it now (set by PieceIndex.build). */
  at?: number
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
  // rot: a planar rotation of the piece (items around each input vertex, clockwise), handed down
  // from the piece it was split from; null until a planarity test has given one
  const work: Piece[] = [{items: edges.map(([a, b], i) => ({a, b, real: i, virtual: -1})), cursor: 0, rot: null}]
  // scratch indexed by input vertex id, shared by all pieces (no per-piece maps)
  const ix = new PieceIndex(n)

  let tries = 0
  while (work.length > 0) {
    if (stop?.() === true) throw new DecompositionStopped()
    const piece = work.pop()!
    let items = piece.items
    let rot = piece.rot
    // 1-2. series-parallel rounds: split off bonds of parallel items and polygons of degree-2 chains
    // until neither is left (each split is at a separation pair, so the cursor stays valid)
    let done: ComponentKind | null = null
    for (;;) {
      ix.build(items)
      const groups = ix.parallelGroups()
      if (groups.count === 1) {
        done = 'P'
        break
      }
      let changed = false
      if (groups.count < items.length) {
        changed = true
        const swap = new Map<Item, Item | null>()
        const kept: Item[] = []
        for (let g = 0; g < groups.count; g++) {
          const first = groups.members[groups.start[g]!]!
          const size = groups.start[g + 1]! - groups.start[g]!
          if (size === 1) {
            kept.push(items[first]!)
            continue
          }
          const bond: Item[] = []
          for (let p = groups.start[g]!; p < groups.start[g + 1]!; p++) bond.push(items[groups.members[p]!]!)
          const a = items[first]!.a, b = items[first]!.b
          const v = virtuals++
          bond.push({a, b, real: -1, virtual: v})
          finals.push({kind: 'P', items: bond})
          const stand = {a, b, real: -1, virtual: v}
          kept.push(stand)
          // the bond's first item's curve now carries the virtual edge; the others are deleted
          for (const it of bond) swap.set(it, null)
          swap.set(items[first]!, stand)
        }
        items = kept
        if (rot !== null) rot = rerouted(rot, swap, [])
        ix.build(items)
      }
      const {k, adjStart, adj, verts} = ix
      let branch = false
      for (let v = 0; v < k && !branch; v++) if (adjStart[v + 1]! - adjStart[v]! !== 2) branch = true
      if (!branch) {
        done = 'S'
        break
      }
      // maximal chains through degree-2 vertices, each between two branch vertices (local ids)
      const gone = new Uint8Array(items.length)
      const added: Item[] = []
      const swap = new Map<Item, Item | null>()
      const inner: number[] = []
      for (let v = 0; v < k; v++) {
        if (adjStart[v + 1]! - adjStart[v]! !== 2 || gone[adj[adjStart[v]!]!]) continue
        const chain: number[] = []
        const ends: number[] = []
        const endItem: Item[] = []
        for (let side = 0; side < 2; side++) {
          let item = adj[adjStart[v]! + side]!, x = v
          if (side === 0) inner.push(verts[v]!)
          for (;;) {
            chain.push(item)
            x = ix.other(item, x)
            if (adjStart[x + 1]! - adjStart[x]! !== 2) break
            inner.push(verts[x]!)
            const p = adjStart[x]!
            item = adj[p] === item ? adj[p + 1]! : adj[p]!
          }
          ends.push(verts[x]!)
          endItem.push(items[item]!)
        }
        for (const i of chain) gone[i] = 1
        const w = virtuals++
        const polygon = chain.map((i) => items[i]!)
        polygon.push({a: ends[0]!, b: ends[1]!, real: -1, virtual: w})
        finals.push({kind: 'S', items: polygon})
        const stand = {a: ends[0]!, b: ends[1]!, real: -1, virtual: w}
        added.push(stand)
        // the chain's curve now carries the virtual edge: it keeps the end items' places
        for (const it of polygon) swap.set(it, null)
        swap.set(endItem[0]!, stand)
        swap.set(endItem[1]!, stand)
        changed = true
      }
      if (added.length > 0) {
        const rest = items.filter((_, i) => !gone[i])
        for (const it of added) rest.push(it)
        items = rest
        if (rot !== null) rot = rerouted(rot, swap, inner)
      }
      if (!changed) break
    }
    if (done !== null) {
      finals.push({kind: done, items})
      continue
    }
    // ix describes `items` here: the last round changed nothing
    const {k, adjStart, adj, verts} = ix
    const ia = ix.ia, ib = ix.ib
    const other = (i: number, x: number) => (ia[i] === x ? ib[i]! : ia[i]!)
    // 3. a separation pair, trying vertices in increasing id from the cursor
    const order: number[] = []
    for (let i = 0; i < k; i++) if (verts[i]! >= piece.cursor) order.push(i)
    order.sort((p, q) => verts[p]! - verts[q]!)
    let found: {x: number; y: number} | null = null
    // On a planar piece only vertices sharing faces with x can pair with it (below); else every x
    // is tried with one DFS of the piece minus x.
    const L = items.length
    const pairs: Array<[number, number]> = new Array<[number, number]>(L)
    for (let i = 0; i < L; i++) pairs[i] = [ia[i]!, ib[i]!]
    const pg = createDigraph(k, pairs)
    let rotation: Int32Array[] | null = null
    if (rot !== null) {
      // a planar piece's halves are planar (minors of it): their rotations are derived, not re-tested
      rotation = new Array<Int32Array>(k)
      for (let v = 0; v < k; v++) {
        const seq = rot.get(verts[v]!)!
        const r = new Int32Array(seq.length)
        for (let j = 0; j < seq.length; j++) r[j] = seq[j]!.at!
        rotation[v] = r
      }
    } else {
      const planar = testPlanarity(pg)
      if (planar.planar) {
        rotation = planar.embedding.rotation.map((r) => Int32Array.from(r))
        const r = new Map<number, Item[]>()
        for (let v = 0; v < k; v++) r.set(verts[v]!, Array.from(rotation[v]!, (i) => items[i]!))
        rot = r
      }
    }
    const pairFor = rotation === null ? null : planarPairFinder(k, pg, rotation, adjStart, adj, other)
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
    for (let i = 0; i < items.length; i++) {
      if (comp[ia[i]!] === 1 || comp[ib[i]!] === 1) inside.push(items[i]!)
      else outside.push(items[i]!)
    }
    const cursor = verts[x]!
    let rotIn: Map<number, Item[]> | null = null, rotOut: Map<number, Item[]> | null = null
    if (rot !== null) {
      // each half's virtual edge is drawn along a path x ~> y through the other half, so it takes
      // the places of that path's end items at x and y (a contraction: the half stays plane)
      rotIn = new Map()
      rotOut = new Map()
      const throughOut = pathEnds(x, y, 0, comp, adjStart, adj, other)
      const throughIn = pathEnds(x, y, 1, comp, adjStart, adj, other)
      for (let v = 0; v < k; v++) {
        if (v === x || v === y) continue
        ;(comp[v] === 1 ? rotIn : rotOut).set(verts[v]!, rot.get(verts[v]!)!)
      }
      const isIn = (it: Item) => {
        const i = it.at!
        return comp[ia[i]!] === 1 || comp[ib[i]!] === 1
      }
      for (const [p, q] of [
        [x, throughOut[0]!],
        [y, throughOut[1]!]
      ] as const) {
        const seqIn: Item[] = [], seqOut: Item[] = []
        const outEnd = items[q]!
        const inEnd = items[p === x ? throughIn[0]! : throughIn[1]!]!
        for (const it of rot.get(verts[p]!)!) {
          if (isIn(it)) {
            seqIn.push(it)
            if (it === inEnd) seqOut.push(outside[0]!)
          } else {
            seqOut.push(it)
            if (it === outEnd) seqIn.push(inside[0]!)
          }
        }
        rotIn.set(verts[p]!, seqIn)
        rotOut.set(verts[p]!, seqOut)
      }
    }
    work.push({items: outside, cursor, rot: rotOut}, {items: inside, cursor, rot: rotIn})
  }

  return merge(finals, virtuals)
}

/**
 * Local numbering and item adjacency (CSR) of one piece: vertices in order of first appearance
 * (a before b, items in order), each vertex's items in item order. The map from input vertex id
 * to local id lives in arrays of the input's size that every piece reuses, so indexing a piece
 * costs O(its items), not O(n).
 */
class PieceIndex {
  private readonly localOf: Int32Array
  private readonly mark: Int32Array
  private readonly firstWith: Int32Array
  private epoch = 0
  private tag = -1
  k = 0
  verts = new Int32Array(0)
  ia = new Int32Array(0)
  ib = new Int32Array(0)
  adjStart = new Int32Array(1)
  adj = new Int32Array(0)

  constructor(n: number) {
    this.localOf = new Int32Array(n)
    this.mark = new Int32Array(n).fill(-1)
    this.firstWith = new Int32Array(n)
  }

  build(items: readonly Item[]): void {
    const L = items.length
    const stamp = ++this.epoch
    const localOf = this.localOf, mark = this.mark
    const verts = new Int32Array(2 * L)
    const ia = new Int32Array(L), ib = new Int32Array(L)
    let k = 0
    for (let i = 0; i < L; i++) {
      const it = items[i]!
      it.at = i
      if (mark[it.a] !== stamp) {
        mark[it.a] = stamp
        localOf[it.a] = k
        verts[k++] = it.a
      }
      ia[i] = localOf[it.a]!
      if (mark[it.b] !== stamp) {
        mark[it.b] = stamp
        localOf[it.b] = k
        verts[k++] = it.b
      }
      ib[i] = localOf[it.b]!
    }
    const adjStart = new Int32Array(k + 1)
    for (let i = 0; i < L; i++) {
      adjStart[ia[i]! + 1]!++
      adjStart[ib[i]! + 1]!++
    }
    for (let v = 0; v < k; v++) adjStart[v + 1]! += adjStart[v]!
    const fill = adjStart.slice(0, k)
    const adj = new Int32Array(2 * L)
    for (let i = 0; i < L; i++) {
      adj[fill[ia[i]!]!++] = i
      adj[fill[ib[i]!]!++] = i
    }
    this.k = k
    this.verts = verts.subarray(0, k)
    this.ia = ia
    this.ib = ib
    this.adjStart = adjStart
    this.adj = adj
  }

  other(i: number, x: number): number {
    return this.ia[i] === x ? this.ib[i]! : this.ia[i]!
  }

  /**
   * Items grouped by unordered vertex pair, groups in order of their first item, members in item
   * order (start/members in CSR form). For each vertex u, the items to higher-numbered neighbours
   * are scanned in item order, so a group's leader is its smallest item.
   */
  parallelGroups(): {count: number; start: Int32Array; members: Int32Array} {
    const {k, adjStart, adj, ia} = this
    const L = ia.length
    const leader = new Int32Array(L)
    // mark / firstWith reused with a fresh tag per vertex u (tags count down from -2, so they
    // never collide with build()'s positive epochs nor with an earlier call's tags)
    const mark = this.mark, firstWith = this.firstWith, verts = this.verts
    for (let u = 0; u < k; u++) {
      const tag = --this.tag
      for (let p = adjStart[u]!; p < adjStart[u + 1]!; p++) {
        const i = adj[p]!
        const w = this.other(i, u)
        if (w < u) continue
        const gw = verts[w]!
        if (mark[gw] === tag) leader[i] = firstWith[gw]!
        else {
          mark[gw] = tag
          firstWith[gw] = i
          leader[i] = i
        }
      }
    }
    const groupOf = new Int32Array(L)
    let count = 0
    for (let i = 0; i < L; i++) groupOf[i] = leader[i] === i ? count++ : groupOf[leader[i]!]!
    const start = new Int32Array(count + 1)
    for (let i = 0; i < L; i++) start[groupOf[i]! + 1]!++
    for (let g = 0; g < count; g++) start[g + 1]! += start[g]!
    const fill = start.slice(0, count)
    const members = new Int32Array(L)
    for (let i = 0; i < L; i++) members[fill[groupOf[i]!]!++] = i
    return {count, start, members}
  }
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
  pg: Digraph,
  rotation: readonly Int32Array[],
  adjStart: Int32Array,
  adj: Int32Array,
  other: (item: number, v: number) => number
): (x: number) => number {
  const faces = traceFaces({graph: pg, rotation})
  const F = faces.darts.length
  // Euler's formula holds exactly for a plane rotation of a connected graph: a check on the
  // derived rotations that costs nothing beside tracing the faces
  if (F !== pg.edgeCount - k + 2) throw new Error('internal: a piece rotation is not plane')
  // vertices of each face, and faces around each vertex (each once)
  // (CSR: fv[fvStart[f] ..] in walking order, fa[faStart[v] ..] in increasing face id)
  const onFace = new Int32Array(k).fill(-1)
  const fvStart = new Int32Array(F + 1)
  const fv = new Int32Array(2 * pg.edgeCount)
  let fill = 0
  for (let f = 0; f < F; f++) {
    for (const d of faces.darts[f]!) {
      const v = dartHead(pg, d)
      if (onFace[v] !== f) {
        onFace[v] = f
        fv[fill++] = v
      }
    }
    fvStart[f + 1] = fill
  }
  const faStart = new Int32Array(k + 1)
  for (let p = 0; p < fill; p++) faStart[fv[p]! + 1]!++
  for (let v = 0; v < k; v++) faStart[v + 1]! += faStart[v]!
  const faFill = faStart.slice(0, k)
  const fa = new Int32Array(fill)
  for (let f = 0; f < F; f++) for (let p = fvStart[f]!; p < fvStart[f + 1]!; p++) fa[faFill[fv[p]!]!++] = f
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
    for (let q = faStart[x]!; q < faStart[x + 1]!; q++) {
      const f = fa[q]!
      for (let p = fvStart[f]!; p < fvStart[f + 1]!; p++) {
        const y = fv[p]!
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
