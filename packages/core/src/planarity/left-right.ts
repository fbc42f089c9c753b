/**
 * The left-right planarity test of de Fraysseix and Rosenstiehl, following the exposition of
 * U. Brandes, "The left-right planarity test" (manuscript, 2009): three depth-first passes
 *   1. orientation: DFS tree, heights, lowpoints, nesting depths;
 *   2. testing: constraints between return edges kept as a stack of conflict pairs of intervals;
 *   3. embedding: back edges signed (left/right) and placed around their ancestors.
 * O(n + m) time and space. Every pass is iterative (explicit stacks) so a path of 10^6 vertices does
 * not overflow the call stack, and all state lives in typed arrays indexed by vertex or edge id.
 *
 * Input here is a SIMPLE undirected graph (no loops, no parallel edges); `test-planarity.ts` reduces a
 * general digraph to one and maps results back.
 */

const NONE = -1

export interface SimpleGraph {
  readonly vertexCount: number
  /** Endpoints of edge i: (a[i], b[i]), a[i] !== b[i], no pair repeated. */
  readonly a: Int32Array
  readonly b: Int32Array
}

/**
 * Rotation of a planar simple graph: `order[start[v] .. start[v+1])` are the half-edges around v in one
 * consistent cyclic orientation (clockwise under the face-on-the-left convention of rotation-system.ts).
 * Half-edge 2e is edge e's end at a[e], 2e+1 its end at b[e] (so the edge id is h >> 1); or, when the
 * caller passed `ids`, the entries are ids[e] instead.
 */
export interface SimpleRotation {
  readonly start: Int32Array
  readonly order: Int32Array
}

/** Is the simple graph planar? No embedding is built (used by Kuratowski extraction). */
export function isPlanarSimple(g: SimpleGraph): boolean {
  return run(g, false) !== null
}

/**
 * A rotation system if the simple graph is planar, else null. With `ids` (one per edge), the rotation
 * lists ids[e] for edge e instead of half-edges: testPlanarity passes the digraph's edge ids, so a
 * simple input's rotation needs no second pass.
 */
export function embedPlanarSimple(g: SimpleGraph, ids?: Int32Array): SimpleRotation | null {
  return run(g, true, ids)
}

function run(g: SimpleGraph, embed: boolean, ids?: Int32Array): SimpleRotation | null {
  const n = g.vertexCount
  const m = g.a.length
  // Undirected incidence lists (CSR); degrees first.
  const adjStart = new Int32Array(n + 1)
  for (let e = 0; e < m; e++) { adjStart[g.a[e]! + 1]!++; adjStart[g.b[e]! + 1]!++ }
  // Euler's bound for simple planar graphs: m <= 3n - 6 when n >= 3 (counting only non-isolated vertices).
  if (m > 2) {
    let used = 0
    for (let v = 1; v <= n; v++) if (adjStart[v] !== 0) used++
    if (m > 3 * used - 6) return null
  }
  for (let v = 0; v < n; v++) adjStart[v + 1]! += adjStart[v]!

  // Memory layout. At 10^6 edges the arrays no longer fit in cache and each scattered read costs a
  // cache (and often TLB) miss, so that count, not the operation count, sets the time (measured:
  // bench/README.md, "Planarity"). Phase 1 therefore keeps everything about an edge end in one record
  // of its incidence slot: slot s of vertex v (adjStart[v] <= s < adjStart[v+1], in edge id order)
  // holds at slot[4s] the half-edge (2e at a[e], 2e+1 at b[e]), at slot[4s+1] the other end, and, once
  // the edge is oriented away from v, its lowpoint and nesting depth at slot[4s+2], slot[4s+3] (NONE
  // while not). An oriented edge is named by its source slot. Vertex data is one record too:
  // vert[4v] height, vert[4v+1] parent slot, vert[4v+2] preorder number, vert[4v+3] scan position.
  const slot = new Int32Array(4 * 2 * m)
  {
    const fill = adjStart.slice(0, n)
    for (let e = 0; e < m; e++) {
      const x = g.a[e]!, y = g.b[e]!
      const s = 4 * fill[x]!++, t = 4 * fill[y]!++
      slot[s] = 2 * e; slot[s + 1] = y; slot[s + 2] = NONE; slot[s + 3] = NONE
      slot[t] = 2 * e + 1; slot[t + 1] = x; slot[t + 2] = NONE; slot[t + 3] = NONE
    }
  }

  // ---- Phase 1: orientation ----------------------------------------------------------------------
  const lowpt2 = new Int32Array(2 * m) // by source slot
  const vert = new Int32Array(4 * n)
  for (let v = 0; v < n; v++) { vert[4 * v] = NONE; vert[4 * v + 1] = NONE; vert[4 * v + 3] = adjStart[v]! }
  const roots0: number[] = []
  let preCount = 0
  const vstack = new Int32Array(n)

  // Nesting depth of a finished edge (source slot s, source v), and lowpoint propagation to the parent
  // edge of v.
  const finishOrient = (s: number, v: number): void => {
    const lp = slot[4 * s + 2]!, lp2 = lowpt2[s]!
    slot[4 * s + 3] = 2 * lp + (lp2 < vert[4 * v]! ? 1 : 0) // +1: chordal
    const ps = vert[4 * v + 1]!
    if (ps === NONE) return
    const plp = slot[4 * ps + 2]!
    if (lp < plp) {
      lowpt2[ps] = Math.min(plp, lp2)
      slot[4 * ps + 2] = lp
    } else if (lp > plp) {
      lowpt2[ps] = Math.min(lowpt2[ps]!, lp)
    } else {
      lowpt2[ps] = Math.min(lowpt2[ps]!, lp2)
    }
  }

  for (let r = 0; r < n; r++) {
    if (vert[4 * r] !== NONE) continue
    roots0.push(r)
    vert[4 * r] = 0
    vert[4 * r + 2] = preCount++
    let sp = 0
    vstack[sp++] = r
    while (sp > 0) {
      const v = vstack[sp - 1]!
      const s = vert[4 * v + 3]!
      if (s < adjStart[v + 1]!) {
        vert[4 * v + 3] = s + 1
        // Which edges are new here: the graph is simple and every non-tree edge joins an ancestor and
        // a descendant, so w unvisited means a tree edge, w two or more levels up a back edge, and
        // anything else (the parent, or a finished descendant) was oriented from w's side already.
        const w = slot[4 * s + 1]!
        const hv = vert[4 * v]!, hw = vert[4 * w]!
        if (hw !== NONE && hw >= hv - 1) continue
        lowpt2[s] = hv
        if (hw === NONE) {
          slot[4 * s + 2] = hv
          vert[4 * w] = hv + 1
          vert[4 * w + 1] = s
          vert[4 * w + 2] = preCount++
          vstack[sp++] = w
        } else {
          slot[4 * s + 2] = hw // back edge
          finishOrient(s, v)
        }
      } else {
        sp--
        const ps = vert[4 * v + 1]!
        if (ps !== NONE) finishOrient(ps, vstack[sp - 1]!)
      }
    }
  }

  // ---- Renumbering --------------------------------------------------------------------------------
  // Phases 2 and 3 walk the DFS tree again, taking out-edges in nesting order. Under the input's labels
  // that walk jumps all over memory, so vertices are relabelled by DFS preorder and edges by their
  // place in the sorted out-lists (grouped by source, by nesting depth within a group, ties in edge id
  // order): a subtree is then a contiguous range of labels and a vertex's out-edges a contiguous range
  // of edge ids, and the later passes read memory mostly in order. O(n + m).
  // First the oriented slots are packed, in slot order, into m records of the same array (record c is
  // written at or before the slot it comes from, so in place): rec[4c] source, rec[4c+1] target (both
  // as preorder numbers), rec[4c+2] lowpoint, rec[4c+3] nesting depth; the half-edge goes to half0[c],
  // and a tree edge's record number replaces the slot in its target's parent field.
  const rec = slot
  const half0 = lowpt2.subarray(0, m) // lowpt2 is spent
  const outStart = new Int32Array(n + 1)
  {
    let c = 0
    for (let v = 0; v < n; v++) {
      const pv = vert[4 * v + 2]!
      const c0 = c
      for (let s = adjStart[v]!; s < adjStart[v + 1]!; s++) {
        const nest = slot[4 * s + 3]!
        if (nest === NONE) continue
        const w = slot[4 * s + 1]!
        const h = slot[4 * s]!, lp = slot[4 * s + 2]!
        if (vert[4 * w + 1] === s) vert[4 * w + 1] = c // tree edge: w's parent edge is record c
        rec[4 * c] = pv; rec[4 * c + 1] = vert[4 * w + 2]!; rec[4 * c + 2] = lp; rec[4 * c + 3] = nest
        half0[c++] = h
      }
      outStart[pv + 1] = c - c0
    }
  }
  for (let v = 0; v < n; v++) outStart[v + 1]! += outStart[v]!
  const byKey = new Int32Array(m)
  const count = new Int32Array(4 * n + 5)
  const perm = new Int32Array(m) // new edge id -> record
  {
    // Stable counting sort of the records by nesting depth (0 .. 2n + 1), then stable distribution
    // into the out-lists. Records are in slot order, which within a vertex is edge id order: the tie
    // order of the test's earlier versions (so its output is unchanged).
    const range = 2 * n + 2
    count.fill(0, 0, range + 2)
    for (let c = 0; c < m; c++) count[rec[4 * c + 3]! + 1]!++
    for (let k = 0; k < range; k++) count[k + 1]! += count[k]!
    for (let c = 0; c < m; c++) byKey[count[rec[4 * c + 3]!]!++] = c
    const fill = count
    fill.set(outStart.subarray(0, n))
    for (let i = 0; i < m; i++) { const c = byKey[i]!; perm[fill[rec[4 * c]!]!++] = c }
  }
  const newOf = lowpt2.subarray(m, 2 * m) // record -> new edge id
  const src = new Int32Array(m) // oriented edge src -> dst, new labels from here on
  const dst = new Int32Array(m)
  const lowpt = new Int32Array(m)
  const nesting = new Int32Array(m)
  const half = new Int32Array(m) // the input half-edge at src (2e at a[e], 2e+1 at b[e])
  for (let i = 0; i < m; i++) {
    const c = perm[i]!
    newOf[c] = i
    src[i] = rec[4 * c]!
    dst[i] = rec[4 * c + 1]!
    lowpt[i] = rec[4 * c + 2]!
    nesting[i] = rec[4 * c + 3]!
    half[i] = half0[c]!
  }
  const height = new Int32Array(n)
  const parentEdge = new Int32Array(n)
  const vertexOf = new Int32Array(n) // internal label -> input label
  for (let v = 0; v < n; v++) {
    const pv = vert[4 * v + 2]!
    vertexOf[pv] = v
    height[pv] = vert[4 * v]!
    const pc = vert[4 * v + 1]!
    parentEdge[pv] = pc === NONE ? NONE : newOf[pc]!
  }
  const roots = roots0.map((r) => vert[4 * r + 2]!)
  const idOf = embed && ids !== undefined ? half0 : null // ids[edge of half[i]]; half0 is spent
  if (idOf !== null) for (let i = 0; i < m; i++) idOf[i] = ids![half[i]! >> 1]!

  // sortOut for phase 3: stable counting sort of all edges by key[e] + offset (in 0 .. range), then
  // stable distribution into the out-list of group[e]: out-lists sorted by key.
  const sortOut = (key: Int32Array, offset: number, range: number, group: Int32Array, out: Int32Array): void => {
    count.fill(0, 0, range + 2)
    for (let e = 0; e < m; e++) count[key[e]! + offset + 1]!++
    for (let k = 0; k < range; k++) count[k + 1]! += count[k]!
    for (let e = 0; e < m; e++) byKey[count[key[e]! + offset]!++] = e
    const fill = count // reuse: the key counts are spent
    fill.set(outStart.subarray(0, n))
    for (let i = 0; i < m; i++) { const e = byKey[i]!; out[fill[group[e]!]!++] = e }
  }

  // ---- Phase 2: testing ---------------------------------------------------------------------------
  // A conflict pair is two intervals L = [lLow .. lHigh], R = [rLow .. rHigh] of return edges, each
  // linked from high to low through ref[]; an empty interval has both ends NONE.
  // The slot records are spent after the renumbering: reuse them (fewer large allocations, each of
  // which costs page faults and garbage-collector pressure at 10^6 edges).
  const ref = slot.subarray(0, m).fill(NONE)
  const side = new Int8Array(m).fill(1)
  const lowptEdge = slot.subarray(m, 2 * m)
  const stackBottom = slot.subarray(2 * m, 3 * m)
  const lLow = new Int32Array(m + 1)
  const lHigh = new Int32Array(m + 1)
  const rLow = new Int32Array(m + 1)
  const rHigh = new Int32Array(m + 1)
  let top = 0 // number of conflict pairs on the stack

  const lowest = (i: number): number => {
    if (lLow[i] === NONE && lHigh[i] === NONE) return lowpt[rLow[i]!]!
    if (rLow[i] === NONE && rHigh[i] === NONE) return lowpt[lLow[i]!]!
    return Math.min(lowpt[lLow[i]!]!, lowpt[rLow[i]!]!)
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
      if (lowpt[qRL]! > lowpt[e]!) { // merge intervals
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
      const lConf = lHigh[i] !== NONE && lowpt[lHigh[i]!]! > lowpt[ei]!
      const rConf = rHigh[i] !== NONE && lowpt[rHigh[i]!]! > lowpt[ei]!
      if (!lConf && !rConf) break
      top--
      let qLL = lLow[i]!, qLH = lHigh[i]!, qRL = rLow[i]!, qRH = rHigh[i]!
      if (rConf) {
        let t = qLL; qLL = qRL; qRL = t
        t = qLH; qLH = qRH; qRH = t
      }
      if (qRH !== NONE && lowpt[qRH]! > lowpt[ei]!) return false
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
      if (lLow[top] !== NONE) side[lLow[top]!] = -1
    }
    if (top === 0) return
    const i = top - 1
    while (lHigh[i] !== NONE && dst[lHigh[i]!] === u) lHigh[i] = ref[lHigh[i]!]!
    if (lHigh[i] === NONE && lLow[i] !== NONE) { // just emptied
      ref[lLow[i]!] = rLow[i]!
      side[lLow[i]!] = -1
      lLow[i] = NONE
    }
    while (rHigh[i] !== NONE && dst[rHigh[i]!] === u) rHigh[i] = ref[rHigh[i]!]!
    if (rHigh[i] === NONE && rLow[i] !== NONE) {
      ref[rLow[i]!] = lLow[i]!
      side[rLow[i]!] = -1
      rLow[i] = NONE
    }
  }

  // Integrate the return edges of out-edge ei of v (after ei's subtree, if any, is done).
  const integrate = (v: number, ei: number, first: boolean): boolean => {
    if (lowpt[ei]! < height[v]!) {
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
        const u = src[e]!
        trimBackEdges(u)
        // The side of e is the side of a highest return edge.
        if (lowpt[e]! < height[u]!) {
          const hL = lHigh[top - 1]!, hR = rHigh[top - 1]!
          ref[e] = hL !== NONE && (hR === NONE || lowpt[hL]! > lowpt[hR]!) ? hL : hR
        }
        if (!integrate(u, e, idx[u] === outStart[u])) return null
        idx[u]!++
      }
    }
  }
  if (!embed) return {start: new Int32Array(0), order: new Int32Array(0)}

  // ---- Phase 3: embedding -------------------------------------------------------------------------
  // Resolve signs: side[e] *= sign(ref[e]) along ref chains, iteratively.
  const chain = byKey // the next sort refills it
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
  const out = perm // spent since the renumbering
  sortOut(nesting, 2 * n + 1, 4 * n + 3, src, out)

  // Cyclic doubly linked lists of half-edges around each vertex. Half-edge 2e sits at src[e],
  // 2e+1 at dst[e]. "next" is the clockwise successor.
  const next = slot.subarray(3 * m, 5 * m) // spent since the renumbering
  const prev = slot.subarray(5 * m, 7 * m)
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
  // src[i] and is reported in the a/b convention of the input (half[i] there, its twin at dst[i]), or
  // as the id of its edge. Walked in internal vertex order (the lists read nearly in order) and written to the
  // input vertex's range: scattered writes are cheap, scattered dependent reads are not.
  const start = adjStart // the degree prefix sums, as the output needs them
  const order = new Int32Array(2 * m)
  for (let pv = 0; pv < n; pv++) {
    const f = first[pv]!
    if (f === NONE) continue
    let k = start[vertexOf[pv]!]!
    let h = f
    if (idOf !== null) {
      do { order[k++] = idOf[h >> 1]!; h = next[h]! } while (h !== f)
      continue
    }
    do {
      const i = h >> 1
      order[k++] = half[i]! ^ (h & 1)
      h = next[h]!
    } while (h !== f)
  }
  return {start, order}
}
