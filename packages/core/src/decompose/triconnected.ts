/**
 * Triconnected components (the SPQR tree without its Q-nodes) of a biconnected multigraph, by
 * recursive splitting at separation pairs: Tutte's decomposition as formalised by Hopcroft & Tarjan
 * ("Dividing a graph into triconnected components", SIAM J. Comput. 2, 1973) and Di Battista &
 * Tamassia ("On-line planarity testing", SIAM J. Comput. 25, 1996) for the tree. Their linear-time
 * path search is NOT used here; instead:
 * 1. parallel edges are split off as bonds (P), and maximal chains through degree-2 vertices as
 *    polygons (S), in rounds until neither is left (a piece of one vertex pair is a bond, a cycle a
 *    polygon);
 * 2. then separation pairs {x, y} are looked for, x in increasing id. On a planar piece, y among
 *    the vertices sharing faces with x in a planar embedding of the piece, each confirmed by one
 *    search; one sweep over x peels off, at every pair found, each component of rest − {x, y} but
 *    the largest, with a new virtual edge {x, y} in both (peelPlanar). Otherwise y as an
 *    articulation point of the piece minus x (one DFS, O(m) per x), and the component of
 *    piece − {x, y} holding the first vertex is split off. A piece without a separation pair is
 *    triconnected (R). Only the first planar piece of a line of descent runs the planarity test:
 *    the bond, polygon and split steps are contractions and deletions, so each part's rotation is
 *    derived from its parent's in time linear in the piece (each part's virtual edge follows a path
 *    through the other side); Euler's formula checks every derived rotation;
 * 3. adjacent bonds and adjacent polygons are merged, which makes the result unique.
 * Complexity. A separation pair of a split part is one of the piece (the virtual edge stands for a
 * connected rest), so each piece keeps a cursor: vertices below it are known to lie in no
 * separation pair and are not tried again in its descendants. A vertex is shared by two parts only
 * when it is a pole of the split, so the failed tries number O(n + splits) and the successful ones
 * O(splits) = O(m), each costing O(m): O(m²) time in all, O(n²) on planar graphs (plus, on
 * planar pieces, Σ over faces of their size squared per piece for the candidates). That worst
 * case stays (each confirmation and each peel searches the whole rest), but on a planar piece the
 * rest is no longer re-indexed, re-reduced and re-embedded per pair: on the 10,000-vertex thinned
 * grid of bench/upward.ts the large rest of the largest block (29,023 edges) is indexed twice
 * instead of once per split (13 splits), and the whole decomposition about halves.
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
    // 3. separation pairs, trying vertices in increasing id from the cursor
    const order: number[] = []
    for (let i = 0; i < k; i++) if (verts[i]! >= piece.cursor) order.push(i)
    if (order.length === 0) {
      // every vertex was tried in an ancestor piece, whose separation pairs include this one's
      finals.push({kind: 'R', items})
      continue
    }
    order.sort((p, q) => verts[p]! - verts[q]!)
    const L = items.length
    const pairs: Array<[number, number]> = new Array<[number, number]>(L)
    for (let i = 0; i < L; i++) pairs[i] = [ia[i]!, ib[i]!]
    const pg = createDigraph(k, pairs)
    let rotation: Int32Array[] | null = null
    if (rot !== null) {
      // a planar piece's parts are planar (minors of it): their rotations are derived, not re-tested
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
    if (rotation !== null && rot !== null) {
      // planar: one sweep peels off every part hanging at a separation pair (peelPlanar)
      const candidates = planarCandidates(k, pg, rotation, adjStart, adj, other)
      const tick = () => {
        if ((++tries & 31) === 0 && stop?.() === true) throw new DecompositionStopped()
      }
      const parts = peelPlanar(piece, items, rot, ix, order, candidates, () => virtuals++, tick)
      if (parts === null) finals.push({kind: 'R', items})
      else work.push(...parts)
      continue
    }
    // not planar: the first pair {x, y} found splits the piece in two
    let found: {x: number; y: number} | null = null
    for (const x of order) {
      if ((++tries & 31) === 0 && stop?.() === true) throw new DecompositionStopped()
      const y = articulationWithout(k, adjStart, adj, other, x)
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
    work.push({items: outside, cursor, rot: null}, {items: inside, cursor, rot: null})
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
 * For a planar piece (simple, biconnected): a function giving for x every y that may form a
 * separation pair with it. In a plane biconnected simple graph, {x, y} separates iff x and y share
 * two faces (three if they are adjacent, the two beside their edge not counting): a closed curve
 * through x, y and the two faces then has vertices on both sides (Whitney; common practice in
 * planar graph algorithms). Candidates are read off the faces around x (Σ over faces of their size
 * squared for all x); the caller confirms each by a search, so a wrong candidate costs time, never a
 * wrong split. The faces stay those of this piece while peelPlanar contracts parts of it into
 * virtual edges: every face of the contracted graph lies in one face of this one, so its pairs stay
 * among these candidates.
 */
function planarCandidates(
  k: number,
  pg: Digraph,
  rotation: readonly Int32Array[],
  adjStart: Int32Array,
  adj: Int32Array,
  other: (item: number, v: number) => number
): (x: number) => number[] {
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
  let round = 0
  return (x: number) => {
    round++
    for (let p = adjStart[x]!; p < adjStart[x + 1]!; p++) adjacent[other(adj[p]!, x)] = round
    const cands: number[] = []
    for (let q = faStart[x]!; q < faStart[x + 1]!; q++) {
      const f = fa[q]!
      for (let p = fvStart[f]!; p < fvStart[f + 1]!; p++) {
        const y = fv[p]!
        if (y === x) continue
        if (stamp[y] !== round) {
          stamp[y] = round
          count[y] = 0
        }
        count[y]!++
        if (count[y] === (adjacent[y] === round ? 3 : 2)) cands.push(y)
      }
    }
    return cands
  }
}

/**
 * Step 2 on a planar piece, for all its separation pairs in one pass instead of one split (and one
 * re-indexing of the large rest) per pair. x runs in increasing id from the cursor; for each
 * candidate y, the components of rest − {x, y} are labelled by one search; if there are several,
 * every one but the largest is peeled off into a piece of its own, with a virtual edge {x, y} on
 * both sides. The rest is the piece minus the parts peeled so far plus their
 * virtual edges: a minor of the piece (each part contracted into an edge), so its separation pairs
 * are the piece's, the faces of the piece still give every candidate (planarCandidates), and a
 * vertex that pairs with nobody in the rest never will after further peels (the cursor).
 * Each side's virtual edge is drawn along a path x ~> y through the other side, so it takes the
 * places of that path's end items in the rotations at x and y (a contraction: both stay plane).
 * Returns null when nothing separates (the piece is triconnected), else the rest, still to be
 * reduced (its virtual edges may be parallel), then the parts peeled off.
 * Cost: O(size of the piece) per tried candidate and per part peeled, on typed arrays.
 */
function peelPlanar(
  piece: Piece,
  items: Item[],
  rot: Map<number, Item[]>,
  ix: PieceIndex,
  order: readonly number[],
  candidates: (x: number) => number[],
  newVirtual: () => number,
  tick: () => void
): Piece[] | null {
  const {k, adjStart, adj, verts, ia, ib} = ix
  const L = items.length
  // items 0..L-1 are the piece's; L.. the rest's virtual edges added here (ends ea/eb, local ids)
  const taken = new Uint8Array(L)
  const extra: Item[] = [], ea: number[] = [], eb: number[] = [], eTaken: number[] = []
  const extraAt: number[][] = new Array<number[]>(k)
  const gone = new Uint8Array(k)
  const itemOf = (i: number) => (i < L ? items[i]! : extra[i - L]!)
  const isTaken = (i: number) => (i < L ? taken[i] === 1 : eTaken[i - L] === 1)
  const far = (i: number, v: number) => (i < L ? (ia[i] === v ? ib[i]! : ia[i]!) : ea[i - L] === v ? eb[i - L]! : ea[i - L]!)
  /** Calls f for each item of the rest at v (with its other end). */
  const around = (v: number, f: (i: number, w: number) => void) => {
    for (let p = adjStart[v]!; p < adjStart[v + 1]!; p++) {
      const i = adj[p]!
      if (taken[i] === 0) f(i, ia[i] === v ? ib[i]! : ia[i]!)
    }
    const ex = extraAt[v]
    if (ex !== undefined) for (const i of ex) if (eTaken[i - L] === 0) f(i, far(i, v))
  }
  // component labels of rest − {x, y}: part[v] = 1 + component, -1 for x and y; members in CSR
  const part = new Int32Array(k)
  const members = new Int32Array(k)
  const partStart: number[] = [0]
  const label = (x: number, y: number): number => {
    part.fill(0)
    part[x] = part[y] = -1
    partStart.length = 1
    let fill = 0
    for (let s = 0; s < k; s++) {
      if (gone[s] || part[s] !== 0) continue
      const id = partStart.length
      part[s] = id
      let head = fill
      members[fill++] = s
      // the loops of `around`, written out: this search runs once per candidate over the whole rest
      while (head < fill) {
        const v = members[head++]!
        for (let p = adjStart[v]!; p < adjStart[v + 1]!; p++) {
          const i = adj[p]!
          if (taken[i] !== 0) continue
          const w = ia[i] === v ? ib[i]! : ia[i]!
          if (part[w] === 0) {
            part[w] = id
            members[fill++] = w
          }
        }
        const ex = extraAt[v]
        if (ex === undefined) continue
        for (const i of ex) {
          if (eTaken[i - L] !== 0) continue
          const w = far(i, v)
          if (part[w] === 0) {
            part[w] = id
            members[fill++] = w
          }
        }
      }
      partStart.push(fill)
    }
    return partStart.length - 1
  }
  // first and last item of a path x ~> y whose inner vertices satisfy inner(w); a direct item when direct
  const via = new Int32Array(k)
  const queue = new Int32Array(k)
  const seenAt = new Int32Array(k)
  let search = 0
  const pathEnds = (x: number, y: number, inner: (w: number) => boolean, direct: boolean): [number, number] => {
    search++
    let tail = 0
    let hit: [number, number] | null = null
    around(x, (i, w) => {
      if (hit !== null) return
      if (w === y) {
        if (direct) hit = [i, i]
      } else if (inner(w) && seenAt[w] !== search) {
        seenAt[w] = search
        via[w] = i
        queue[tail++] = w
      }
    })
    for (let head = 0; hit === null && head < tail; head++) {
      const v = queue[head]!
      around(v, (i, w) => {
        if (hit !== null) return
        if (w === y) hit = [via[v]!, i]
        else if (inner(w) && seenAt[w] !== search) {
          seenAt[w] = search
          via[w] = via[v]!
          queue[tail++] = w
        }
      })
    }
    if (hit === null) throw new Error('internal: no path between the poles of a split')
    return hit
  }

  const peeled: Piece[] = []
  /** Moves component c of rest − {x, y} (labelled) into a piece of its own. */
  const peel = (x: number, y: number, c: number) => {
    const inPart = (w: number) => part[w] === c
    const elsewhere = (w: number) => part[w] > 0 && part[w] !== c
    const [outX, outY] = pathEnds(x, y, elsewhere, true)
    const [inX, inY] = pathEnds(x, y, inPart, false)
    const outEnd = [itemOf(outX), itemOf(outY)], inEnd = [itemOf(inX), itemOf(inY)]
    const v = newVirtual()
    const xa = verts[x]!, ya = verts[y]!
    const mine: Item = {a: xa, b: ya, real: -1, virtual: v}
    const theirs: Item = {a: xa, b: ya, real: -1, virtual: v}
    const own: Item[] = [mine]
    const ownRot = new Map<number, Item[]>()
    for (let q = partStart[c - 1]!; q < partStart[c]!; q++) {
      const w = members[q]!
      around(w, (i) => {
        if (i < L) taken[i] = 2
        else eTaken[i - L] = 2
      })
    }
    // collect in a second pass so each item is listed once (2 = being taken, 1 = taken)
    for (let q = partStart[c - 1]!; q < partStart[c]!; q++) {
      const w = members[q]!
      const mark = (i: number) => {
        if (i < L ? taken[i] === 2 : eTaken[i - L] === 2) {
          if (i < L) taken[i] = 1
          else eTaken[i - L] = 1
          own.push(itemOf(i))
        }
      }
      for (let p = adjStart[w]!; p < adjStart[w + 1]!; p++) mark(adj[p]!)
      const ex = extraAt[w]
      if (ex !== undefined) for (const i of ex) mark(i)
      gone[w] = 1
      ownRot.set(verts[w]!, rot.get(verts[w]!)!)
      rot.delete(verts[w]!)
    }
    // the rest's new virtual edge, indexed like the piece's items
    const j = L + extra.length
    theirs.at = j
    extra.push(theirs)
    ea.push(x)
    eb.push(y)
    eTaken.push(0)
    ;(extraAt[x] ??= []).push(j)
    ;(extraAt[y] ??= []).push(j)
    for (const [p, end] of [
      [x, 0],
      [y, 1]
    ] as const) {
      const seqIn: Item[] = [], seqOut: Item[] = []
      for (const it of rot.get(verts[p]!)!) {
        if (isTaken(it.at!)) {
          seqIn.push(it)
          if (it === inEnd[end]) seqOut.push(theirs)
        } else {
          seqOut.push(it)
          if (it === outEnd[end]) seqIn.push(mine)
        }
      }
      ownRot.set(verts[p]!, seqIn)
      rot.set(verts[p]!, seqOut)
    }
    peeled.push({items: own, cursor: xa, rot: ownRot})
  }

  for (const x of order) {
    if (gone[x]) continue
    tick()
    // a candidate that did not separate the rest will not after later peels (a minor's pairs are
    // the piece's), and one that did no longer does: each is tried once
    for (const y of candidates(x)) {
      if (gone[y]) continue
      const count = label(x, y)
      if (count < 2) continue
      // keep the largest component (the first of equal ones) as the rest
      let keep = 1
      for (let c = 2; c <= count; c++) if (partStart[c]! - partStart[c - 1]! > partStart[keep]! - partStart[keep - 1]!) keep = c
      for (let c = 1; c <= count; c++) if (c !== keep) peel(x, y, c)
    }
    piece.cursor = verts[x]! + 1
  }
  if (peeled.length === 0) return null
  const rest: Item[] = []
  for (let i = 0; i < L; i++) if (taken[i] === 0) rest.push(items[i]!)
  extra.forEach((it, j) => {
    if (eTaken[j] === 0) rest.push(it)
  })
  return [{items: rest, cursor: piece.cursor, rot}, ...peeled]
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
