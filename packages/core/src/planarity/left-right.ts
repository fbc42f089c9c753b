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
 * Half-edge 2e is edge e's end at a[e], 2e+1 its end at b[e] (so the edge id is h >> 1).
 */
export interface SimpleRotation {
  readonly start: Int32Array
  readonly order: Int32Array
}

/** Is the simple graph planar? No embedding is built (used by Kuratowski extraction). */
export function isPlanarSimple(g: SimpleGraph): boolean {
  return run(g, false) !== null
}

/** A rotation system if the simple graph is planar, else null. */
export function embedPlanarSimple(g: SimpleGraph): SimpleRotation | null {
  return run(g, true)
}

function run(g: SimpleGraph, embed: boolean): SimpleRotation | null {
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
  const adj = new Int32Array(2 * m)
  {
    const fill = adjStart.slice(0, n)
    for (let e = 0; e < m; e++) { adj[fill[g.a[e]!]!++] = e; adj[fill[g.b[e]!]!++] = e }
  }

  // ---- Phase 1: orientation ----------------------------------------------------------------------
  const height0 = new Int32Array(n).fill(NONE)
  const parentEdge0 = new Int32Array(n).fill(NONE)
  const src0 = new Int32Array(m).fill(NONE) // oriented edge src0 -> dst0
  const flip0 = new Uint8Array(m) // 1 where src0[e] is g.b[e]
  const dst0 = new Int32Array(m)
  const lowpt0 = new Int32Array(m)
  const lowpt2 = new Int32Array(m)
  const nesting0 = new Int32Array(m)
  const roots0: number[] = []
  const pre = new Int32Array(n) // DFS preorder number of each vertex
  let preCount = 0
  const vstack = new Int32Array(n)
  const cursor = adjStart.slice(0, n)

  // Nesting depth of a finished edge vw, and lowpoint propagation to the parent edge of v.
  const finishOrient = (e: number, v: number): void => {
    nesting0[e] = 2 * lowpt0[e]! + (lowpt2[e]! < height0[v]! ? 1 : 0) // +1: chordal
    const pe = parentEdge0[v]!
    if (pe === NONE) return
    if (lowpt0[e]! < lowpt0[pe]!) {
      lowpt2[pe] = Math.min(lowpt0[pe]!, lowpt2[e]!)
      lowpt0[pe] = lowpt0[e]!
    } else if (lowpt0[e]! > lowpt0[pe]!) {
      lowpt2[pe] = Math.min(lowpt2[pe]!, lowpt0[e]!)
    } else {
      lowpt2[pe] = Math.min(lowpt2[pe]!, lowpt2[e]!)
    }
  }

  for (let r = 0; r < n; r++) {
    if (height0[r] !== NONE) continue
    roots0.push(r)
    height0[r] = 0
    pre[r] = preCount++
    let sp = 0
    vstack[sp++] = r
    while (sp > 0) {
      const v = vstack[sp - 1]!
      if (cursor[v]! < adjStart[v + 1]!) {
        const e = adj[cursor[v]!++]!
        if (src0[e] !== NONE) continue
        let w = g.b[e]!
        if (w === v) { w = g.a[e]!; flip0[e] = 1 }
        src0[e] = v
        dst0[e] = w
        lowpt0[e] = height0[v]!
        lowpt2[e] = height0[v]!
        if (height0[w] === NONE) {
          parentEdge0[w] = e
          height0[w] = height0[v]! + 1
          pre[w] = preCount++
          vstack[sp++] = w
        } else {
          lowpt0[e] = height0[w]! // back edge
          finishOrient(e, v)
        }
      } else {
        sp--
        const pe = parentEdge0[v]!
        if (pe !== NONE) finishOrient(pe, src0[pe]!)
      }
    }
  }

  // ---- Renumbering --------------------------------------------------------------------------------
  // Phases 2 and 3 walk the DFS tree again, taking out-edges in nesting order. Under the input's labels
  // that walk jumps all over memory, and at 10^6 edges cache and TLB misses, not the operation count,
  // dominated the time (measured: bench/README.md, "Planarity"). So vertices are relabelled by DFS
  // preorder and edges by their place in the sorted out-lists (grouped by source, by nesting depth
  // within a group): a subtree is then a contiguous range of labels and a vertex's out-edges a
  // contiguous range of edge ids, and the later passes read memory mostly in order. O(n + m).
  const psrc = lowpt2 // lowpt2 is not needed after phase 1
  for (let e = 0; e < m; e++) psrc[e] = pre[src0[e]!]!
  const outStart = new Int32Array(n + 1)
  for (let e = 0; e < m; e++) outStart[psrc[e]! + 1]!++
  for (let v = 0; v < n; v++) outStart[v + 1]! += outStart[v]!
  const byKey = new Int32Array(m)
  const count = new Int32Array(4 * n + 5)
  // Stable counting sort of all edges by key[e] + offset (in 0 .. range), then stable distribution
  // into the out-list of group[e]: out-lists sorted by key.
  const sortOut = (key: Int32Array, offset: number, range: number, group: Int32Array, out: Int32Array): void => {
    count.fill(0, 0, range + 2)
    for (let e = 0; e < m; e++) count[key[e]! + offset + 1]!++
    for (let k = 0; k < range; k++) count[k + 1]! += count[k]!
    for (let e = 0; e < m; e++) byKey[count[key[e]! + offset]!++] = e
    const fill = count // reuse: the key counts are spent
    fill.set(outStart.subarray(0, n))
    for (let i = 0; i < m; i++) { const e = byKey[i]!; out[fill[group[e]!]!++] = e }
  }
  const perm = new Int32Array(m) // new edge id -> old edge id
  sortOut(nesting0, 0, 2 * n + 2, psrc, perm)
  const newOf = adj // the incidence lists are not needed after phase 1
  const src = new Int32Array(m) // oriented edge src -> dst, new labels from here on
  const dst = new Int32Array(m)
  const lowpt = new Int32Array(m)
  const nesting = new Int32Array(m)
  const flip = new Uint8Array(m)
  for (let i = 0; i < m; i++) {
    const e = perm[i]!
    newOf[e] = i
    src[i] = psrc[e]!
    dst[i] = pre[dst0[e]!]!
    lowpt[i] = lowpt0[e]!
    nesting[i] = nesting0[e]!
    flip[i] = flip0[e]!
  }
  const height = new Int32Array(n)
  const parentEdge = new Int32Array(n)
  for (let v = 0; v < n; v++) {
    const pv = pre[v]!
    height[pv] = height0[v]!
    const pe = parentEdge0[v]!
    parentEdge[pv] = pe === NONE ? NONE : newOf[pe]!
  }
  const roots = roots0.map((r) => pre[r]!)

  // ---- Phase 2: testing ---------------------------------------------------------------------------
  // A conflict pair is two intervals L = [lLow .. lHigh], R = [rLow .. rHigh] of return edges, each
  // linked from high to low through ref[]; an empty interval has both ends NONE.
  // Per-edge arrays of phase 1 are spent after the renumbering: reuse them (fewer large allocations,
  // each of which costs page faults and garbage-collector pressure at 10^6 edges).
  const ref = src0.fill(NONE)
  const side = new Int8Array(m).fill(1)
  const lowptEdge = lowpt0
  const stackBottom = nesting0
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
  const out = new Int32Array(m)
  sortOut(nesting, 2 * n + 1, 4 * n + 3, src, out)

  // Cyclic doubly linked lists of half-edges around each vertex. Half-edge 2e sits at src[e],
  // 2e+1 at dst[e]. "next" is the clockwise successor.
  const next = adj // spent since the renumbering (as newOf)
  const prev = new Int32Array(2 * m)
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
  const leftRef = height0 // spent since the renumbering
  const rightRef = parentEdge0
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

  // Output in the input's labels: vertex v is pre[v] here, edge i is perm[i]. Internal half-edge 2i
  // sits at src[i]; it is reported in the a/b convention of the input (2e at a[e], 2e+1 at b[e]).
  const start = new Int32Array(n + 1)
  for (let e = 0; e < m; e++) { start[g.a[e]! + 1]!++; start[g.b[e]! + 1]!++ }
  for (let v = 0; v < n; v++) start[v + 1]! += start[v]!
  const order = new Int32Array(2 * m)
  for (let v = 0; v < n; v++) {
    const f = first[pre[v]!]!
    if (f === NONE) continue
    let k = start[v]!
    let h = f
    do {
      const i = h >> 1
      order[k++] = 2 * perm[i]! + ((h & 1) ^ flip[i]!)
      h = next[h]!
    } while (h !== f)
  }
  return {start, order}
}
