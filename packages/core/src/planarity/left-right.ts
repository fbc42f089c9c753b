/**
 * The left-right planarity test of de Fraysseix and Rosenstiehl, following the exposition of
 * U. Brandes, "The left-right planarity test" (manuscript, 2009): three depth-first passes
 *   1. orientation: DFS tree, heights, lowpoints, nesting depths;
 *   2. testing: constraints between return edges kept as a stack of conflict pairs of intervals;
 *   3. embedding: back edges signed (left/right) and placed around their ancestors.
 * O(n + m) time and space. Every pass is iterative (explicit stacks) so a path of 10^6 vertices does
 * not overflow the call stack, and all state lives in typed arrays indexed by vertex or edge id.
 *
 * Input here is a SIMPLE undirected graph (no loops, no parallel edges) as incidence lists
 * (incidence.ts); `test-planarity.ts` reduces a general digraph to one and maps results back.
 */
import {incidenceOfSimple, type Incidence, type SimpleGraph} from './incidence.ts'

const NONE = -1
/** Out-lists up to this length are sorted by insertion (see LocalSorter). */
const SHORT = 32

export type {SimpleGraph} from './incidence.ts'

/**
 * Rotation of a planar graph: `order[start[v] .. start[v+1])` are the edge ends around v in one
 * consistent cyclic orientation (clockwise under the face-on-the-left convention of rotation-system.ts),
 * given by their labels in the incidence lists (see incidence.ts): half-edges of a simple graph (2e
 * at a[e], 2e+1 at b[e], so the edge is h >> 1), or the caller's edge ids.
 */
export interface SimpleRotation {
  readonly start: Int32Array
  readonly order: Int32Array
}

/** Is the simple graph planar? No embedding is built (used by Kuratowski extraction). */
export function isPlanarSimple(g: SimpleGraph): boolean {
  return run(incidenceOfSimple(g), false) !== null
}

/**
 * A rotation system if the simple graph is planar, else null. With `ids` (one per edge), the rotation
 * lists ids[e] for edge e instead of half-edges.
 */
export function embedPlanarSimple(g: SimpleGraph, ids?: Int32Array): SimpleRotation | null {
  return run(incidenceOfSimple(g, ids), true)
}

/** isPlanarSimple on incidence lists built by the caller (e.g. incidenceOfDigraph). */
export function isPlanarIncidence(inc: Incidence): boolean {
  return run(inc, false) !== null
}

/** embedPlanarSimple on incidence lists built by the caller; the rotation lists their labels. */
export function embedIncidence(inc: Incidence): SimpleRotation | null {
  return run(inc, true)
}

function run(inc: Incidence, embed: boolean): SimpleRotation | null {
  const n = inc.vertexCount
  const m = inc.edgeCount
  const {adjStart, other, label} = inc
  if (embed && label.length !== 2 * m) throw new RangeError('embedding needs incidence lists with labels')
  // Euler's bound for simple planar graphs: m <= 3n - 6 when n >= 3 (counting only non-isolated vertices).
  if (m > 2) {
    let used = 0
    for (let v = 0; v < n; v++) if (adjStart[v + 1] !== adjStart[v]) used++
    if (m > 3 * used - 6) return null
  }

  // Memory layout. At 10^6 edges the arrays no longer fit in cache and each scattered read costs a
  // cache (and often TLB) miss, so the number of such reads that wait on each other, not the operation
  // count, sets the time (measured: bench/README.md, "Planarity"). The incidence slots (label, other
  // end; see incidence.ts) are only read.

  // ---- Phase 1: orientation ----------------------------------------------------------------------
  // What phase 1 learns about an edge goes to a record of R ints in `block`, laid out by DFS preorder:
  // the vertex discovered p-th owns records blockStart[p] .. blockStart[p+1), one per incidence slot in
  // slot order. Record b of an edge oriented away from that vertex holds block[Rb] the other end's
  // preorder number, block[Rb+1] its nesting depth, 2 lowpoint + (1 if chordal), so the lowpoint is
  // nesting >> 1, and, for an embedding, block[Rb+2] the edge end's label; block[Rb] is NONE for any
  // other slot. (At 10^6 edges the decision alone writes and rereads 16 MB of records instead of 32:
  // bench/README.md, "Planarity". Finding the label later in the slot instead costs a scattered read
  // per vertex, which was slower than the larger records.) The records are written near the DFS frontier,
  // so the renumbering below reads them in order, and only written: the lowpoints of a tree edge,
  // while its subtree is open, are kept on the stack (the path, in cache), so that coming back to a
  // vertex after a large subtree does not wait on reading its record.
  // Per input vertex only vert[2v] height (NONE while unvisited) and vert[2v+1] preorder number: one
  // scattered read per edge end, the one the DFS cannot avoid. The DFS stack holds the path, indexed
  // by height: vertex, scan slot, end slot, slot-to-record offset, the record of its parent edge and
  // that edge's lowpoint and second lowpoint so far.
  const vert = new Int32Array(2 * n).fill(NONE)
  const R = embed ? 3 : 2
  // Phase 1 fills 2Rm ints; phase 2 reuses 3m, phase 3 8m. Sized for what the call uses: V8 gets
  // typed arrays zeroed (fresh pages faulted in, or reused heap memory cleared), so every allocated
  // int costs time at 10^6 edges whether or not it is touched (bench/README.md, "Planarity").
  const block = new Int32Array((embed ? 8 : 4) * m)
  const blockStart = new Int32Array(n + 1)
  // By preorder number, written as vertices are discovered (in order).
  const vertexOf = new Int32Array(n) // internal label -> input label
  const height = new Int32Array(n)
  const vstack = new Int32Array(n)
  const stScan = new Int32Array(n)
  const stEnd = new Int32Array(n)
  const stOffset = new Int32Array(n)
  const stParent = new Int32Array(n)
  const stLow = new Int32Array(n)
  const stLow2 = new Int32Array(n)
  const roots: number[] = [] // by preorder number
  let preCount = 0
  let blockTop = 0

  // A finished out-edge of the vertex at height h, with lowpoints lp <= lp2, updates the lowpoints of
  // that vertex's parent edge (h > 0): the smallest, and the smallest above it. Minima, so the order
  // in which out-edges finish does not matter.
  const mergeLow = (h: number, lp: number, lp2: number): void => {
    const plp = stLow[h]!
    if (lp < plp) {
      stLow2[h] = Math.min(plp, lp2)
      stLow[h] = lp
    } else if (lp > plp) {
      stLow2[h] = Math.min(stLow2[h]!, lp)
    } else {
      stLow2[h] = Math.min(stLow2[h]!, lp2)
    }
  }
  // Discover w at height h (= its stack index) through parent edge record pb.
  const discover = (w: number, h: number, pb: number): void => {
    vert[2 * w] = h
    vert[2 * w + 1] = preCount
    vertexOf[preCount] = w
    height[preCount] = h
    blockStart[preCount++] = blockTop
    const s0 = adjStart[w]!, s1 = adjStart[w + 1]!
    vstack[h] = w; stScan[h] = s0; stEnd[h] = s1; stOffset[h] = blockTop - s0; stParent[h] = pb
    stLow[h] = h - 1; stLow2[h] = h - 1 // a tree edge starts with its source's height
    blockTop += s1 - s0
  }

  for (let r = 0; r < n; r++) {
    if (vert[2 * r] !== NONE) continue
    roots.push(preCount)
    discover(r, 0, NONE)
    let t = 0 // top of the stack, = height of the vertex on top
    while (t >= 0) {
      const s = stScan[t]!
      if (s < stEnd[t]!) {
        stScan[t] = s + 1
        // Which edges are new here: the graph is simple and every non-tree edge joins an ancestor and
        // a descendant, so w unvisited means a tree edge, w two or more levels up a back edge, and
        // anything else (the parent, or a finished descendant) was oriented from w's side already.
        const w = other[s]!
        const hw = vert[2 * w]!
        const b = s + stOffset[t]!
        if (hw !== NONE && hw >= t - 1) { block[R * b] = NONE; continue }
        if (embed) block[R * b + 2] = label[s]!
        if (hw === NONE) {
          block[R * b] = preCount
          discover(w, ++t, b)
        } else {
          // A back edge: lowpoint hw, second lowpoint t (its source), so nesting depth 2 hw.
          block[R * b] = vert[2 * w + 1]!; block[R * b + 1] = 2 * hw
          if (t > 0) mergeLow(t, hw, t)
        }
      } else {
        // The tree edge into the vertex at height t is finished: its record gets its lowpoint and
        // nesting depth (+1: chordal, a second lowpoint below its source at height t - 1).
        const lp = stLow[t]!, lp2 = stLow2[t]!
        const pb = stParent[t]!
        t--
        if (pb === NONE) continue
        block[R * pb + 1] = 2 * lp + (lp2 < t ? 1 : 0)
        if (t > 0) mergeLow(t, lp, lp2)
      }
    }
  }
  blockStart[n] = blockTop

  // ---- Renumbering --------------------------------------------------------------------------------
  // Phases 2 and 3 walk the DFS tree again, taking out-edges in nesting order. Under the input's labels
  // that walk jumps all over memory, so vertices are relabelled by DFS preorder and edges by their
  // place in the sorted out-lists (grouped by source, by nesting depth within a group, ties in slot
  // order, which within a vertex is edge id order: the tie order of the test's earlier versions, so
  // its output is unchanged): a subtree is then a contiguous range of labels and a vertex's out-edges
  // a contiguous range of edge ids, and the later passes read memory mostly in order. O(n + m).
  // The records are already grouped by source in preorder, so each group is sorted on the spot (a
  // short local sort, see LocalSorter) and every array here is read and written in order. (Before,
  // a global counting sort by nesting depth and a gather through the permutation cost two scattered
  // passes more.)
  // Oriented edge c (new labels from here on) goes to dst[c] with nesting depth nesting[c], so its
  // lowpoint is nesting[c] >> 1. Its source is not kept: phases 2 and 3 find it on their stack. (Each
  // m-sized array is zeroed when allocated, which costs time at 10^6 edges; see block above.)
  const dst = new Int32Array(m)
  const nesting = new Int32Array(m)
  const half = new Int32Array(embed ? m : 0) // the label of the edge end at src (see incidence.ts)
  const parentEdge = new Int32Array(n).fill(NONE)
  const outStart = new Int32Array(n + 1)
  let maxDegree = 0
  for (let p = 0; p < n; p++) maxDegree = Math.max(maxDegree, blockStart[p + 1]! - blockStart[p]!)
  const key = new Int32Array(maxDegree), at = new Int32Array(maxDegree)
  const sorter = new LocalSorter(maxDegree)
  {
    let c = 0
    for (let pv = 0; pv < n; pv++) {
      outStart[pv] = c
      let len = 0
      for (let b = blockStart[pv]!; b < blockStart[pv + 1]!; b++) {
        if (block[R * b] !== NONE) { key[len] = block[R * b + 1]!; at[len++] = b }
      }
      sorter.sort(key, at, len)
      for (let j = 0; j < len; j++) {
        const b = at[j]!
        const pw = block[R * b]!
        dst[c] = pw; nesting[c] = key[j]!
        if (embed) half[c] = block[R * b + 2]!
        if (pw > pv) parentEdge[pw] = c // out-edges to later preorder numbers are tree edges
        c++
      }
    }
    outStart[n] = c
  }

  // ---- Phase 2: testing ---------------------------------------------------------------------------
  // A conflict pair is two intervals L = [lLow .. lHigh], R = [rLow .. rHigh] of return edges, each
  // linked from high to low through ref[]; an empty interval has both ends NONE.
  // The records are spent after the renumbering: reuse them (fewer large allocations, each of which
  // costs page faults and garbage-collector pressure at 10^6 edges).
  const ref = block.subarray(0, m).fill(NONE)
  const side = new Int8Array(embed ? m : 0).fill(1) // only an embedding needs sides
  const lowptEdge = block.subarray(m, 2 * m)
  const stackBottom = block.subarray(2 * m, 3 * m)
  // Conflict pairs on the stack: one pushed per return (back) edge, and merging pushes at most one
  // after popping at least one, so there are never more than the back edges, m - (n - roots).
  const pairs = m - (n - roots.length) + 1
  const lLow = new Int32Array(pairs)
  const lHigh = new Int32Array(pairs)
  const rLow = new Int32Array(pairs)
  const rHigh = new Int32Array(pairs)
  let top = 0 // number of conflict pairs on the stack

  const lowest = (i: number): number => {
    if (lLow[i] === NONE && lHigh[i] === NONE) return nesting[rLow[i]!]! >> 1
    if (rLow[i] === NONE && rHigh[i] === NONE) return nesting[lLow[i]!]! >> 1
    return Math.min((nesting[lLow[i]!]! >> 1), (nesting[rLow[i]!]! >> 1))
  }

  // Constraints that the return edges of ei (a later out-edge of v) impose against those of earlier
  // out-edges; e is v's parent edge. False when the graph is not planar.
  const addConstraints = (ei: number, e: number): boolean => {
    let pLL = NONE, pLH = NONE, pRL = NONE, pRH = NONE
    // Merge the return edges of ei into P.R.
    do {
      top--
      let qLL = lLow[top]!, qLH = lHigh[top]!, qRL = rLow[top]!, qRH = rHigh[top]!
      if (qLL !== NONE || qLH !== NONE) { // swap so that Q.L is empty
        let t = qLL; qLL = qRL; qRL = t
        t = qLH; qLH = qRH; qRH = t
      }
      if (qLL !== NONE || qLH !== NONE) return false
      if ((nesting[qRL]! >> 1) > (nesting[e]! >> 1)) { // merge intervals
        if (pRL === NONE && pRH === NONE) pRH = qRH
        else ref[pRL] = qRH
        pRL = qRL
      } else { // align
        ref[qRL] = lowptEdge[e]!
      }
    } while (top !== stackBottom[ei])
    // Merge the conflicting return edges of earlier out-edges into P.L.
    while (top > 0) {
      const i = top - 1
      const lConf = lHigh[i] !== NONE && (nesting[lHigh[i]!]! >> 1) > (nesting[ei]! >> 1)
      const rConf = rHigh[i] !== NONE && (nesting[rHigh[i]!]! >> 1) > (nesting[ei]! >> 1)
      if (!lConf && !rConf) break
      top--
      let qLL = lLow[i]!, qLH = lHigh[i]!, qRL = rLow[i]!, qRH = rHigh[i]!
      if (rConf) {
        let t = qLL; qLL = qRL; qRL = t
        t = qLH; qLH = qRH; qRH = t
      }
      if (qRH !== NONE && (nesting[qRH]! >> 1) > (nesting[ei]! >> 1)) return false
      // The interval below lowpt(ei) joins P.R.
      if (pRL !== NONE) ref[pRL] = qRH
      if (qRL !== NONE) pRL = qRL
      if (pLL === NONE && pLH === NONE) pLH = qLH
      else ref[pLL] = qLH
      pLL = qLL
    }
    if (pLL !== NONE || pLH !== NONE || pRL !== NONE || pRH !== NONE) {
      lLow[top] = pLL; lHigh[top] = pLH; rLow[top] = pRL; rHigh[top] = pRH
      top++
    }
    return true
  }

  // Remove the back edges that end at u (they are closed once u's child is finished).
  const trimBackEdges = (u: number): void => {
    const hu = height[u]!
    while (top > 0 && lowest(top - 1) === hu) {
      top--
      if (embed && lLow[top] !== NONE) side[lLow[top]!] = -1
    }
    if (top === 0) return
    const i = top - 1
    while (lHigh[i] !== NONE && dst[lHigh[i]!] === u) lHigh[i] = ref[lHigh[i]!]!
    if (lHigh[i] === NONE && lLow[i] !== NONE) { // just emptied
      ref[lLow[i]!] = rLow[i]!
      if (embed) side[lLow[i]!] = -1
      lLow[i] = NONE
    }
    while (rHigh[i] !== NONE && dst[rHigh[i]!] === u) rHigh[i] = ref[rHigh[i]!]!
    if (rHigh[i] === NONE && rLow[i] !== NONE) {
      ref[rLow[i]!] = lLow[i]!
      if (embed) side[rLow[i]!] = -1
      rLow[i] = NONE
    }
  }

  // Integrate the return edges of out-edge ei of v (after ei's subtree, if any, is done).
  const integrate = (v: number, ei: number, first: boolean): boolean => {
    if ((nesting[ei]! >> 1) < height[v]!) {
      const e = parentEdge[v]!
      if (first) lowptEdge[e] = lowptEdge[ei]!
      else if (!addConstraints(ei, e)) return false
    }
    return true
  }

  const idx = outStart.slice(0, n)
  for (const r of roots) {
    let sp = 0
    vstack[sp++] = r
    while (sp > 0) {
      const v = vstack[sp - 1]!
      if (idx[v]! < outStart[v + 1]!) {
        const ei = idx[v]! // out-edges of v are ids outStart[v] .. outStart[v+1] in nesting order
        const w = dst[ei]!
        stackBottom[ei] = top
        if (parentEdge[w] === ei) { vstack[sp++] = w; continue } // tree edge: descend first
        lowptEdge[ei] = ei
        lLow[top] = NONE; lHigh[top] = NONE; rLow[top] = ei; rHigh[top] = ei
        top++
        if (!integrate(v, ei, idx[v] === outStart[v])) return null
        idx[v]!++
      } else {
        sp--
        const e = parentEdge[v]!
        if (e === NONE) continue
        const u = vstack[sp - 1]! // e's source, v's parent on the path
        trimBackEdges(u)
        // The side of e is the side of a highest return edge.
        if ((nesting[e]! >> 1) < height[u]!) {
          const hL = lHigh[top - 1]!, hR = rHigh[top - 1]!
          ref[e] = hL !== NONE && (hR === NONE || (nesting[hL]! >> 1) > (nesting[hR]! >> 1)) ? hL : hR
        }
        if (!integrate(u, e, idx[u] === outStart[u])) return null
        idx[u]!++
      }
    }
  }
  if (!embed) return {start: new Int32Array(0), order: new Int32Array(0)}

  // ---- Phase 3: embedding -------------------------------------------------------------------------
  // Resolve signs: side[e] *= sign(ref[e]) along ref chains, iteratively.
  const chain = block.subarray(7 * m, 8 * m) // spent since the renumbering
  for (let e0 = 0; e0 < m; e0++) {
    let len = 0
    let e = e0
    while (ref[e] !== NONE) { chain[len++] = e; e = ref[e]! }
    while (len > 0) {
      const f = chain[--len]!
      side[f] = side[f]! * side[ref[f]!]!
      ref[f] = NONE
    }
  }
  for (let e = 0; e < m; e++) nesting[e] = nesting[e]! * side[e]!
  // Each out-list again sorted on the spot, now by signed nesting depth (shifted to be non-negative),
  // ties in edge id order, i.e. in the previous order: out[outStart[v] ..) lists v's edges.
  const out = new Int32Array(m)
  for (let v = 0; v < n; v++) {
    const i0 = outStart[v]!, len = outStart[v + 1]! - i0
    for (let j = 0; j < len; j++) { key[j] = nesting[i0 + j]! + 2 * n + 1; at[j] = i0 + j }
    sorter.sort(key, at, len)
    for (let j = 0; j < len; j++) out[i0 + j] = at[j]!
  }

  // Cyclic doubly linked lists of half-edges around each vertex. Half-edge 2e sits at e's source,
  // 2e+1 at dst[e]. "next" is the clockwise successor.
  const next = block.subarray(3 * m, 5 * m) // spent since the renumbering
  const prev = block.subarray(5 * m, 7 * m)
  const first = new Int32Array(n).fill(NONE)
  for (let v = 0; v < n; v++) {
    const s = outStart[v]!, t = outStart[v + 1]!
    if (s === t) continue
    first[v] = 2 * out[s]!
    for (let i = s; i < t; i++) {
      const h = 2 * out[i]!
      next[h] = 2 * out[i + 1 < t ? i + 1 : s]!
      prev[h] = 2 * out[i > s ? i - 1 : t - 1]!
    }
  }
  const insertAfter = (h: number, at: number): void => {
    const nx = next[at]!
    next[at] = h; prev[h] = at; next[h] = nx; prev[nx] = h
  }
  const insertBefore = (h: number, at: number): void => insertAfter(h, prev[at]!)
  const leftRef = vert.subarray(0, n) // spent since the renumbering
  const rightRef = vert.subarray(n, 2 * n)
  idx.set(outStart.subarray(0, n))
  for (const r of roots) {
    let sp = 0
    vstack[sp++] = r
    while (sp > 0) {
      const v = vstack[sp - 1]!
      if (idx[v]! >= outStart[v + 1]!) { sp--; continue }
      const ei = out[idx[v]!++]!
      const w = dst[ei]!
      const hw = 2 * ei + 1
      if (parentEdge[w] === ei) {
        // The parent edge becomes w's first half-edge (just before its out-edges).
        if (first[w] === NONE) { next[hw] = hw; prev[hw] = hw } else insertBefore(hw, first[w]!)
        first[w] = hw
        leftRef[v] = 2 * ei
        rightRef[v] = 2 * ei
        vstack[sp++] = w
      } else if (side[ei] === 1) {
        insertAfter(hw, rightRef[w]!)
      } else {
        insertBefore(hw, leftRef[w]!)
        leftRef[w] = hw
      }
    }
  }

  // Output in the input's labels: internal vertex pv is vertexOf[pv]; internal half-edge 2i sits at
  // i's source and is reported by its slot label there (half[i]); its twin at dst[i] by the same label
  // when labels are edge ids, else by the twin half-edge half[i] ^ 1. Walked in internal vertex order
  // (the lists read nearly in order) and written to the input vertex's range: scattered writes are
  // cheap, scattered dependent reads are not.
  const start = adjStart // the degree prefix sums, as the output needs them
  const order = new Int32Array(2 * m)
  const twin = inc.labelsAreIds ? 0 : 1
  for (let pv = 0; pv < n; pv++) {
    const f = first[pv]!
    if (f === NONE) continue
    let k = start[vertexOf[pv]!]!
    let h = f
    do {
      order[k++] = half[h >> 1]! ^ (h & twin)
      h = next[h]!
    } while (h !== f)
  }
  return {start, order}
}

/**
 * Stable sort of one vertex's out-edges by nesting depth: parallel arrays key[0 .. len) (non-negative)
 * and at[0 .. len), reordered together. Insertion sort for short lists (in cache, O(len^2) with len at
 * most SHORT, so O(len)); LSD radix sort with 8-bit digits otherwise, O(len + 256) per digit and at
 * most 4 digits, also O(len). Over all vertices: O(n + m).
 */
class LocalSorter {
  private readonly key2: Int32Array
  private readonly at2: Int32Array
  private readonly digits = new Int32Array(257)
  constructor(capacity: number) {
    this.key2 = new Int32Array(capacity > SHORT ? capacity : 0)
    this.at2 = new Int32Array(capacity > SHORT ? capacity : 0)
  }

  sort(key: Int32Array, at: Int32Array, len: number): void {
    if (len <= SHORT) {
      for (let i = 1; i < len; i++) {
        const k = key[i]!, a = at[i]!
        let j = i
        while (j > 0 && key[j - 1]! > k) { key[j] = key[j - 1]!; at[j] = at[j - 1]!; j-- }
        key[j] = k; at[j] = a
      }
      return
    }
    let max = 0
    for (let i = 0; i < len; i++) max = Math.max(max, key[i]!)
    let k0 = key, a0 = at, k1 = this.key2, a1 = this.at2
    const count = this.digits
    for (let shift = 0; shift < 32 && max >>> shift !== 0; shift += 8) {
      count.fill(0)
      for (let i = 0; i < len; i++) count[((k0[i]! >>> shift) & 255) + 1]!++
      for (let d = 0; d < 256; d++) count[d + 1]! += count[d]!
      for (let i = 0; i < len; i++) {
        const j = count[(k0[i]! >>> shift) & 255]!++
        k1[j] = k0[i]!; a1[j] = a0[i]!
      }
      const tk = k0; k0 = k1; k1 = tk
      const ta = a0; a0 = a1; a1 = ta
    }
    if (k0 !== key) { key.set(k0.subarray(0, len)); at.set(a0.subarray(0, len)) }
  }
}
