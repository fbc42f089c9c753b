/**
 * Level planarity of a level graph: can every vertex be put on the horizontal line of its level, and
 * every edge drawn as a y-monotone curve between its ends, with no two edges crossing?
 *
 * Method: the satisfiability formulation of Randerath, Speckenmeyer, Boros, Hammer, Kogan, Makino,
 * Simeone and Čepek, "A satisfiability formulation of problems on level graphs" (Electronic Notes in
 * Discrete Mathematics 9, 2001).
 * 1. Make the graph proper: an edge spanning several levels is split at a dummy node on every level
 *    it passes (a level drawing draws it through one point per level anyway).
 * 2. One boolean per unordered pair {a, b} of nodes on one level: "a is left of b".
 * 3. Two segments a→c and b→d between the same two consecutive levels, with a ≠ b and c ≠ d, do not
 *    cross exactly when left(a, b) = left(c, d). Segments sharing an end never cross.
 * Their theorem: the graph is level planar if and only if these equations alone (without the clauses
 * that make each level's relation transitive) are satisfiable. The equations are x = y or x = ¬y, so
 * satisfiability is 2-colouring a constraint graph by breadth-first search, and an unsatisfiable
 * system shows an odd cycle of equations: that cycle, mapped back to the input's edges, is the
 * certificate. Deciding takes O(P + Q) for P pairs of same-level nodes and Q pairs of segments between
 * consecutive levels (quadratic in the size of the proper graph).
 *
 * The witness (left-to-right orders) needs a transitive solution. The theorem says one exists; it is
 * found here by choosing one truth value per connected component of the equations, with transitivity
 * propagated (a < b and b < c force a < c) and chronological backtracking. Each propagation costs
 * O(level width); the search is exponential only in the worst case, so it is bounded by `maxSteps`
 * and then answers `undecided` (never a wrong answer). Pairs that no equation mentions are not searched:
 * once the rest is set, the relation is a strict partial order and any linear extension of it is a
 * solution. Ties are broken towards `rank` (the written order): each component first gets the value
 * that puts its first pair in rank order, and the linear extension takes the leftmost-ranked node it can.
 *
 * Forced pairs (`forced`: a must be left of b on their level) fix their component's value before the
 * search, or set their pair alone when no equation mentions it. Two forced pairs whose component's
 * equations disagree have no witness, shown by the path of equations between them; otherwise the
 * search above runs with the forced values kept, and when it runs out of choices without meeting
 * `maxSteps`, that exhausted search is the proof that no transitive solution respects them. Level
 * planarity with such constraints is recalled (from memory) as NP-hard in general (Brückner and
 * Rutter, "Partial and constrained level planarity", SODA 2017), so this search stays bounded by
 * `maxSteps` and answers `undecided` past it.
 */
import type {Digraph} from '../graph/digraph.ts'

/** An entry of a level's left-to-right order: a vertex on it, or an edge passing through it. */
export type LevelItem = {kind: 'vertex'; vertex: number} | {kind: 'edge'; edge: number}

/** A pair the witness must keep: `left` before `right` on `level`; an edge item names its point on that level. */
export interface ForcedPair {
  level: number
  left: LevelItem
  right: LevelItem
}

export type LevelPlanarity =
  | {status: 'planar'; orders: LevelItem[][]}
  /** `edges`: input edge ids whose segments make an odd cycle of equations (no drawing of them works). */
  | {status: 'not-planar'; edges: number[]}
  | {status: 'undecided'}

/**
 * With forced pairs, a fourth answer: level planar, but no drawing keeps them. `proof: 'equations'`:
 * forced pairs `pairs` (indices into `forced`, two) ask opposite values of one chain of equations,
 * whose segments belong to `edges` (empty when both name the same two points). `proof: 'search'`:
 * the bounded search ran through every choice, within `maxSteps`, without a transitive solution;
 * `pairs` lists every forced pair.
 */
export type ForcedLevelPlanarity = LevelPlanarity | {status: 'forced-infeasible'; proof: 'equations' | 'search'; pairs: number[]; edges: number[]}

export interface LevelPlanarityOptions {
  /** Per vertex: its place in the written order (smaller = further left); default the vertex id. */
  rank?: ArrayLike<number>
  /** Per edge: the preferred place of the points where it passes a level, on rank's scale; default its tail's rank. */
  edgeRank?: ArrayLike<number>
  /**
   * Each component of equations first tries the value that puts most of its pairs in rank order
   * (true), or the one that puts its first pair in rank order (false, the default).
   */
  majority?: boolean
  /** Propagation steps the witness search may take before answering `undecided`. */
  maxSteps?: number
  /**
   * Decide only: a planar answer comes without orders (`orders` empty), skipping the witness search.
   * For callers that test many partial assignments and need the orders of the last one only.
   */
  decideOnly?: boolean
  /**
   * Most pair variables plus segment pairs (P + Q above) to set up; past it the answer is `undecided`
   * before anything quadratic is allocated. Default 4,000,000.
   */
  maxWork?: number
}

export interface ForcedLevelPlanarityOptions extends LevelPlanarityOptions {
  /**
   * Pairs the witness must keep in order (see ForcedPair). With them, `decideOnly` still runs the
   * witness search (the pairs can only be refuted there) but returns no orders.
   */
  forced: readonly ForcedPair[]
}

/** What the test reads of a graph: its edges. A Digraph is one; a caller testing many subgraphs can pass edge arrays without building adjacency lists. */
export type LevelGraph = Pick<Digraph, 'vertexCount' | 'edgeCount' | 'tail' | 'head'>

/**
 * Working arrays kept between calls. Callers such as the level search (layout/level-search.ts) run
 * thousands of small tests; allocating some twenty typed arrays for each cost more than the test on
 * small graphs (and their backing stores, garbage-collector time). Each call takes the prefix it
 * needs and fills it; the test is synchronous and does not call itself, and no answer refers to these
 * arrays, so sharing them is safe.
 */
const pool = {
  int32: [] as Int32Array[],
  int8: [] as Int8Array[],
  float64: [] as Float64Array[],
}
/** Arrays longer than this are not kept (one large test should not hold its memory for the process's life). */
const POOL_LIMIT = 1 << 20
/** Pooled array `slot` with room for `size` entries (contents undefined: the caller fills what it reads). */
function pooled<T extends Int32Array | Int8Array | Float64Array>(list: T[], slot: number, size: number, make: (size: number) => T): T {
  const have = list[slot]
  if (have && have.length >= size) return have
  if (size > POOL_LIMIT) return make(size)
  const grown = make(Math.min(POOL_LIMIT, Math.max(size, 2 * (have?.length ?? 0), 64)))
  list[slot] = grown
  return grown
}
const ints = (slot: number, size: number): Int32Array => pooled(pool.int32, slot, size, (s) => new Int32Array(s))
const bytes = (slot: number, size: number): Int8Array => pooled(pool.int8, slot, size, (s) => new Int8Array(s))
const floats = (slot: number, size: number): Float64Array => pooled(pool.float64, slot, size, (s) => new Float64Array(s))

/**
 * Throws RangeError unless every edge goes from a lower to a strictly higher level ≥ 0, and unless
 * each forced pair names two different items that lie on its level.
 */
export function testLevelPlanarity(graph: LevelGraph, level: ArrayLike<number>, options?: LevelPlanarityOptions & {forced?: undefined}): LevelPlanarity
export function testLevelPlanarity(graph: LevelGraph, level: ArrayLike<number>, options: ForcedLevelPlanarityOptions): ForcedLevelPlanarity
export function testLevelPlanarity(graph: LevelGraph, level: ArrayLike<number>, options: LevelPlanarityOptions & {forced?: readonly ForcedPair[] | undefined} = {}): ForcedLevelPlanarity {
  const n = graph.vertexCount
  const m = graph.edgeCount
  const gTail = graph.tail
  const gHead = graph.head
  const rank = options.rank
  const edgeRank = options.edgeRank
  const maxSteps = options.maxSteps ?? 5_000_000
  const maxWork = options.maxWork ?? 4_000_000
  for (let v = 0; v < n; v++) {
    const l = level[v]!
    if (!Number.isInteger(l) || l < 0) throw new RangeError(`level[${v}] must be a whole number ≥ 0, got ${l}`)
  }

  // 1. The proper graph: nodes 0..n-1 are the vertices, then one dummy per edge per inner level, edge
  // by edge; segments likewise, edge by edge from the tail up. Counted first, so typed arrays hold them.
  let maxLevel = 0
  for (let v = 0; v < n; v++) maxLevel = Math.max(maxLevel, level[v]!)
  let dummies = 0
  for (let e = 0; e < m; e++) {
    const u = gTail[e]!
    const w = gHead[e]!
    if (level[w]! <= level[u]!) throw new RangeError(`edge ${e} (${u} -> ${w}) does not go up a level`)
    dummies += level[w]! - level[u]! - 1
  }
  if (dummies > maxWork) return {status: 'undecided'}
  const nodeCount = n + dummies
  const segCount = m + dummies
  const nodeLevel = ints(0, nodeCount)
  /** The edge a dummy node lies on (vertices: −1). */
  const nodeEdge = ints(1, nodeCount)
  const nodeRank = floats(0, nodeCount)
  const segTail = ints(2, segCount)
  const segHead = ints(3, segCount)
  const segEdge = ints(4, segCount)
  /** Node of edge e's first dummy (on level[tail] + 1); the rest follow level by level. */
  const firstDummy = ints(5, m)
  // Every rank a whole number of moderate size (the default, vertex ids): then the sort below can
  // use one numeric key per node instead of a comparison function.
  let integral = true
  for (let v = 0; v < n; v++) {
    nodeLevel[v] = level[v]!
    nodeEdge[v] = -1
    const r = rank ? rank[v]! : v
    nodeRank[v] = r
    if (!(Number.isInteger(r) && Math.abs(r) < 2 ** 20)) integral = false
  }
  let node = n
  let seg = 0
  for (let e = 0; e < m; e++) {
    const u = gTail[e]!
    const w = gHead[e]!
    let previous = u
    firstDummy[e] = node
    // A dummy sits, by preference, between its ends' ranks: at its edge's place if given, else the tail's.
    const r = edgeRank ? edgeRank[e]! : nodeRank[u]!
    if (level[u]! + 1 < level[w]! && !(Number.isInteger(r) && Math.abs(r) < 2 ** 20)) integral = false
    for (let l = level[u]! + 1; l < level[w]!; l++) {
      nodeLevel[node] = l
      nodeEdge[node] = e
      nodeRank[node] = r
      segTail[seg] = previous
      segHead[seg] = node
      segEdge[seg] = e
      seg++
      previous = node++
    }
    segTail[seg] = previous
    segHead[seg] = w
    segEdge[seg] = e
    seg++
  }

  // Bound the quadratic part before building it.
  const perLevel = floats(1, maxLevel + 1).fill(0, 0, maxLevel + 1)
  const perBand = floats(2, maxLevel + 1).fill(0, 0, maxLevel + 1)
  for (let x = 0; x < nodeCount; x++) perLevel[nodeLevel[x]!]!++
  for (let s = 0; s < segCount; s++) perBand[nodeLevel[segTail[s]!]!]!++
  let work = 0
  let equationRoom = 0
  for (let l = 0; l <= maxLevel; l++) {
    work += (perLevel[l]! * (perLevel[l]! - 1)) / 2 + (perBand[l]! * (perBand[l]! - 1)) / 2
    equationRoom += (perBand[l]! * (perBand[l]! - 1)) / 2
  }
  if (work > maxWork) return {status: 'undecided'}

  // 2. Nodes per level in preference order (rank, then node id), as slices of one array:
  // levelNodes[levelStart[l] .. levelStart[l + 1]). A node's position there names its pair variables.
  const levelCount = maxLevel + 1
  const levelStart = ints(6, levelCount + 1)
  levelStart[0] = 0
  for (let l = 0; l < levelCount; l++) levelStart[l + 1] = levelStart[l]! + perLevel[l]!
  const levelNodes = ints(7, nodeCount)
  const levelFill = ints(8, levelCount)
  levelFill.set(levelStart.subarray(0, levelCount))
  for (let x = 0; x < nodeCount; x++) levelNodes[levelFill[nodeLevel[x]!]!++] = x
  if (integral) {
    // rank · nodeCount + node orders by rank, then node; exact below 2^53.
    const keys = floats(3, nodeCount)
    for (let l = 0; l < levelCount; l++) {
      const from = levelStart[l]!
      const to = levelStart[l + 1]!
      if (to - from < 2) continue
      for (let p = from; p < to; p++) keys[p] = nodeRank[levelNodes[p]!]! * nodeCount + levelNodes[p]!
      keys.subarray(from, to).sort()
      for (let p = from; p < to; p++) {
        const key = keys[p]!
        levelNodes[p] = key - Math.floor(key / nodeCount) * nodeCount
      }
    }
  } else {
    for (let l = 0; l < levelCount; l++) {
      const from = levelStart[l]!
      const to = levelStart[l + 1]!
      if (to - from < 2) continue
      // A plain array and comparison, as ranks may be any numbers (NaN included).
      const nodes = Array.from(levelNodes.subarray(from, to)).sort((a, b) => nodeRank[a]! - nodeRank[b]! || a - b)
      levelNodes.set(nodes, from)
    }
  }
  const position = ints(9, nodeCount)
  /** First variable of each level; variables of the pair at positions i < j of a level of k nodes follow pairVar. */
  const varBase = new Float64Array(levelCount)
  let varCount = 0
  for (let l = 0; l < levelCount; l++) {
    varBase[l] = varCount
    const from = levelStart[l]!
    const k = levelStart[l + 1]! - from
    for (let p = 0; p < k; p++) position[levelNodes[from + p]!] = p
    varCount += (k * (k - 1)) / 2
  }
  /** Variable of the pair at positions i < j of level l. */
  const pairVar = (l: number, i: number, j: number): number => varBase[l]! + i * (levelStart[l + 1]! - levelStart[l]!) - (i * (i + 1)) / 2 + (j - i - 1)
  /** left(a, b) as a variable and a sign, value(left) = value(var) XOR flip, packed as 2 · var + flip. */
  const literal = (a: number, b: number): number => {
    const i = position[a]!
    const j = position[b]!
    return i < j ? 2 * pairVar(nodeLevel[a]!, i, j) : 2 * pairVar(nodeLevel[a]!, j, i) + 1
  }

  // 3. Equations between segments of the same band, in band order and, within a band, by segment
  // pairs in segment order; then an adjacency list (CSR) of each variable's equations.
  const eqA = ints(10, equationRoom)
  const eqB = ints(11, equationRoom)
  const eqParity = bytes(0, equationRoom)
  const eqSegs = ints(12, 2 * equationRoom)
  let eqCount = 0
  const bandStart = ints(13, levelCount + 1)
  bandStart[0] = 0
  for (let l = 0; l < levelCount; l++) bandStart[l + 1] = bandStart[l]! + perBand[l]!
  const bandSegs = ints(14, segCount)
  const bandFill = ints(15, levelCount)
  bandFill.set(bandStart.subarray(0, levelCount))
  for (let s = 0; s < segCount; s++) bandSegs[bandFill[nodeLevel[segTail[s]!]!]!++] = s
  /** Per segment of the band at hand: its tail's and head's positions on their levels. */
  const tailAt = ints(16, segCount)
  const headAt = ints(17, segCount)
  for (let b = 0; b + 1 < levelCount; b++) {
    const from = bandStart[b]!
    const to = bandStart[b + 1]!
    if (to - from < 2) continue
    // Tails lie on level b, heads on b + 1.
    const lowBase = varBase[b]!
    const lowK = levelStart[b + 1]! - levelStart[b]!
    const highBase = varBase[b + 1]!
    const highK = levelStart[b + 2]! - levelStart[b + 1]!
    for (let x = from; x < to; x++) {
      tailAt[x] = position[segTail[bandSegs[x]!]!]!
      headAt[x] = position[segHead[bandSegs[x]!]!]!
    }
    for (let x = from; x < to; x++) {
      const s = bandSegs[x]!
      const ts = tailAt[x]!
      const hs = headAt[x]!
      for (let y = x + 1; y < to; y++) {
        const tt = tailAt[y]!
        const ht = headAt[y]!
        // Segments sharing an end (same node, same position) never cross.
        if (ts === tt || hs === ht) continue
        const fa = ts < tt ? 0 : 1
        const fb = hs < ht ? 0 : 1
        const ia = fa === 0 ? ts : tt
        const ja = fa === 0 ? tt : ts
        const ib = fb === 0 ? hs : ht
        const jb = fb === 0 ? ht : hs
        eqA[eqCount] = lowBase + ia * lowK - (ia * (ia + 1)) / 2 + (ja - ia - 1)
        eqB[eqCount] = highBase + ib * highK - (ib * (ib + 1)) / 2 + (jb - ib - 1)
        eqParity[eqCount] = fa ^ fb
        eqSegs[2 * eqCount] = s
        eqSegs[2 * eqCount + 1] = bandSegs[y]!
        eqCount++
      }
    }
  }
  const adjStart = ints(18, varCount + 1).fill(0, 0, varCount + 1)
  for (let q = 0; q < eqCount; q++) {
    adjStart[eqA[q]! + 1]!++
    adjStart[eqB[q]! + 1]!++
  }
  for (let v = 0; v < varCount; v++) adjStart[v + 1]! += adjStart[v]!
  const adj = ints(19, 2 * eqCount)
  const fill = ints(20, varCount)
  fill.set(adjStart.subarray(0, varCount))
  for (let q = 0; q < eqCount; q++) {
    adj[fill[eqA[q]!]!++] = q
    adj[fill[eqB[q]!]!++] = q
  }

  // 2-colouring by BFS: colour = value relative to the component root, which is set to true. Only
  // variables in some equation take part; the others are free (component −1).
  const colour = bytes(1, varCount).fill(0, 0, varCount)
  const component = ints(21, varCount).fill(-1, 0, varCount)
  const parentEq = ints(22, varCount).fill(-1, 0, varCount)
  const depth = ints(23, varCount).fill(0, 0, varCount)
  const componentRoots: number[] = []
  const queue = ints(24, varCount)
  for (let root = 0; root < varCount; root++) {
    if (component[root] !== -1 || adjStart[root] === adjStart[root + 1]) continue
    const c = componentRoots.length
    componentRoots.push(root)
    component[root] = c
    let head = 0
    let tail = 0
    queue[tail++] = root
    while (head < tail) {
      const x = queue[head++]!
      for (let p = adjStart[x]!; p < adjStart[x + 1]!; p++) {
        const q = adj[p]!
        const y = eqA[q] === x ? eqB[q]! : eqA[q]!
        const want = colour[x]! ^ eqParity[q]!
        if (component[y] === -1) {
          colour[y] = want
          component[y] = c
          parentEq[y] = q
          depth[y] = depth[x]! + 1
          queue[tail++] = y
        } else if (colour[y] !== want) {
          return {status: 'not-planar', edges: equationPathEdges(x, y, [q])}
        }
      }
    }
  }

  /** Input edges of the equations on the tree path between variables x and y of one component, plus `equations`. */
  function equationPathEdges(x: number, y: number, equations: number[]): number[] {
    let a = x
    let b = y
    const up = (v: number): number => {
      const q = parentEq[v]!
      equations.push(q)
      return eqA[q] === v ? eqB[q]! : eqA[q]!
    }
    while (depth[a]! > depth[b]!) a = up(a)
    while (depth[b]! > depth[a]!) b = up(b)
    while (a !== b) {
      a = up(a)
      b = up(b)
    }
    const edges = new Set<number>()
    for (const q of equations) {
      edges.add(segEdge[eqSegs[2 * q]!]!)
      edges.add(segEdge[eqSegs[2 * q + 1]!]!)
    }
    return [...edges].sort((p, q) => p - q)
  }

  // Forced pairs: each as a variable and the value it needs (0: the smaller position on the left).
  const forced = options.forced ?? []
  const forcedVar = new Int32Array(forced.length)
  const forcedValue = new Uint8Array(forced.length)
  const nodeOf = (item: LevelItem, l: number, p: number): number => {
    if (item.kind === 'vertex') {
      if (item.vertex < 0 || item.vertex >= n || nodeLevel[item.vertex] !== l) throw new RangeError(`forced pair ${p}: vertex ${item.vertex} is not on level ${l}`)
      return item.vertex
    }
    const e = item.edge
    if (e < 0 || e >= m || l <= level[gTail[e]!]! || l >= level[gHead[e]!]!) throw new RangeError(`forced pair ${p}: edge ${e} does not pass level ${l}`)
    return firstDummy[e]! + (l - level[gTail[e]!]! - 1)
  }
  /** Per component, the forced pair that fixed its flip (−1: none yet). */
  const fixedBy = new Int32Array(componentRoots.length).fill(-1)
  for (let p = 0; p < forced.length; p++) {
    const {level: l, left, right} = forced[p]!
    const a = nodeOf(left, l, p)
    const b = nodeOf(right, l, p)
    if (a === b) throw new RangeError(`forced pair ${p} names one item twice`)
    const packed = literal(a, b)
    const v = Math.floor(packed / 2)
    const value = packed % 2
    forcedVar[p] = v
    forcedValue[p] = value
    const c = component[v]!
    if (c < 0) continue
    const q = fixedBy[c]!
    if (q < 0) fixedBy[c] = p
    else if ((colour[v]! ^ value) !== (colour[forcedVar[q]!]! ^ forcedValue[q]!)) {
      return {status: 'forced-infeasible', proof: 'equations', pairs: [q, p], edges: equationPathEdges(forcedVar[q]!, v, [])}
    }
  }
  // Forced pairs that no equation mentions and disagree directly (a before b and b before a).
  const freeForced = new Map<number, number>()
  for (let p = 0; p < forced.length; p++) {
    const v = forcedVar[p]!
    if (component[v]! >= 0) continue
    const q = freeForced.get(v)
    if (q === undefined) freeForced.set(v, p)
    else if (forcedValue[q] !== forcedValue[p]) return {status: 'forced-infeasible', proof: 'equations', pairs: [q, p], edges: []}
  }

  if (options.decideOnly && forced.length === 0) return {status: 'planar', orders: []}

  // The witness: one value per component, transitivity propagated, backtracking on conflict. A free
  // variable forced by propagation is set on its own (named −1 − variable on the trail).
  /** Level and positions (i < j) of each variable. O(P). */
  const varLevel = ints(25, varCount)
  const varI = ints(26, varCount)
  const varJ = ints(27, varCount)
  for (let l = 0, v = 0; l < levelCount; l++) {
    const k = levelStart[l + 1]! - levelStart[l]!
    for (let i = 0; i < k; i++) {
      for (let j = i + 1; j < k; j++, v++) {
        varLevel[v] = l
        varI[v] = i
        varJ[v] = j
      }
    }
  }
  const componentCount = componentRoots.length
  const memberStart = ints(28, componentCount + 1).fill(0, 0, componentCount + 1)
  for (let v = 0; v < varCount; v++) if (component[v]! >= 0) memberStart[component[v]! + 1]!++
  for (let c = 0; c < componentCount; c++) memberStart[c + 1]! += memberStart[c]!
  const memberList = ints(29, memberStart[componentCount]!)
  const memberFill = ints(30, componentCount)
  memberFill.set(memberStart.subarray(0, componentCount))
  for (let v = 0; v < varCount; v++) if (component[v]! >= 0) memberList[memberFill[component[v]!]!++] = v
  /**
   * Per level, k×k from relBase[l]: +1 when the node at position i is left of the one at j, −1 right,
   * 0 unknown. Always antisymmetric (both entries of a pair are set and cleared together), so a
   * column can be read as the negated row.
   */
  const relBase = new Float64Array(levelCount)
  let relSize = 0
  for (let l = 0; l < levelCount; l++) {
    relBase[l] = relSize
    const k = levelStart[l + 1]! - levelStart[l]!
    relSize += k * k
  }
  const relation = bytes(2, relSize).fill(0, 0, relSize)
  const assigned = new Int8Array(componentCount).fill(-1)
  const trail: number[] = []
  let steps = 0

  /**
   * Set variable v to `value` (0: position varI left of varJ) and propagate; false on conflict. One
   * step per other position of the level, counted as it is reached (maxSteps).
   */
  function setVariable(v: number, value: number, pending: number[]): boolean {
    const left = value === 0 ? varI[v]! : varJ[v]!
    const right = value === 0 ? varJ[v]! : varI[v]!
    const l = varLevel[v]!
    const k = levelStart[l + 1]! - levelStart[l]!
    const base = relBase[l]!
    const leftRow = base + left * k
    const rightRow = base + right * k
    relation[leftRow + right] = 1
    relation[rightRow + left] = -1
    const varFrom = varBase[l]!
    // Positions 0 .. allowed − 1 may be reached within maxSteps; reaching the next one exceeds it.
    const allowed = maxSteps - steps
    const end = allowed < k ? Math.max(allowed, 0) : k
    for (let w = 0; w < end; w++) {
      // rw: right before w (1) or after (−1); lw likewise for left; 0 unknown. At w = left or right
      // neither rule below applies (rw = −1 or 0 there, lw = 0 or 1).
      const rw = relation[rightRow + w]!
      const lw = relation[leftRow + w]!
      if (rw === 0 && lw === 0) continue
      // left < right and right < w force left < w.
      if (rw === 1 && lw !== 1) {
        if (lw === -1) {
          steps += w + 1
          return false
        }
        const v = left < w ? varFrom + left * k - (left * (left + 1)) / 2 + (w - left - 1) : varFrom + w * k - (w * (w + 1)) / 2 + (left - w - 1)
        const value = left < w ? 0 : 1
        if (component[v]! < 0) pending.push(-1 - v, value)
        else pending.push(component[v]!, colour[v]! ^ value)
      }
      // w < left and left < right force w < right (rw = 1 was a conflict above).
      if (lw === -1 && rw === 0) {
        const v = w < right ? varFrom + w * k - (w * (w + 1)) / 2 + (right - w - 1) : varFrom + right * k - (right * (right + 1)) / 2 + (w - right - 1)
        const value = w < right ? 0 : 1
        if (component[v]! < 0) pending.push(-1 - v, value)
        else pending.push(component[v]!, colour[v]! ^ value)
      }
    }
    steps += end
    if (end < k) {
      steps++
      return false
    }
    return true
  }

  /**
   * Give component c the flip `f` (its variables get colour XOR f) and propagate; false on conflict.
   * Pending entries are pairs (c, f) for a component, or (−1 − v, value) for a free variable.
   */
  function assign(c: number, f: number): boolean {
    return propagate([c, f])
  }

  /** Work through pending entries (see assign) until none is left; false on conflict. */
  function propagate(pending: number[]): boolean {
    while (pending.length > 0) {
      const flip = pending.pop()!
      const id = pending.pop()!
      if (id < 0) {
        const v = -1 - id
        const l = varLevel[v]!
        const k = levelStart[l + 1]! - levelStart[l]!
        const known = relation[relBase[l]! + varI[v]! * k + varJ[v]!]!
        if (known !== 0) {
          if (known !== (flip === 0 ? 1 : -1)) return false
          continue
        }
        trail.push(id)
        if (!setVariable(v, flip, pending)) return false
        continue
      }
      if (assigned[id] !== -1) {
        if (assigned[id] !== flip) return false
        continue
      }
      assigned[id] = flip
      trail.push(id)
      for (let p = memberStart[id]!; p < memberStart[id + 1]!; p++) {
        const v = memberList[p]!
        if (!setVariable(v, colour[v]! ^ flip, pending)) return false
      }
    }
    return true
  }

  function clearVariable(v: number): void {
    const l = varLevel[v]!
    const k = levelStart[l + 1]! - levelStart[l]!
    relation[relBase[l]! + varI[v]! * k + varJ[v]!] = 0
    relation[relBase[l]! + varJ[v]! * k + varI[v]!] = 0
  }

  function undoTo(mark: number): void {
    while (trail.length > mark) {
      const id = trail.pop()!
      if (id < 0) {
        clearVariable(-1 - id)
        continue
      }
      for (let p = memberStart[id]!; p < memberStart[id + 1]!; p++) clearVariable(memberList[p]!)
      assigned[id] = -1
    }
  }

  // Iterative depth-first search over the components in order; the preferred flip first (0: the root
  // pair in rank order; with `majority`, the flip that puts more of the component's pairs in rank
  // order, 0 on a tie). A variable's value is colour XOR flip, and value 0 is rank order.
  const prefer = new Uint8Array(componentCount)
  if (options.majority) {
    for (let c = 0; c < componentCount; c++) {
      let ones = 0
      for (let p = memberStart[c]!; p < memberStart[c + 1]!; p++) ones += colour[memberList[p]!]!
      if (2 * ones > memberStart[c + 1]! - memberStart[c]!) prefer[c] = 1
    }
  }
  /** The search ran out of choices (not of steps): no transitive solution keeps the forced pairs. */
  const refuted = (): ForcedLevelPlanarity => ({status: 'forced-infeasible', proof: 'search', pairs: forced.map((_, p) => p), edges: []})
  // The forced values first, below every decision (never undone): a conflict here, before any
  // choice, already refutes them.
  if (forced.length > 0) {
    const pending: number[] = []
    for (let p = 0; p < forced.length; p++) {
      const v = forcedVar[p]!
      if (component[v]! < 0) pending.push(-1 - v, forcedValue[p]!)
      else pending.push(component[v]!, colour[v]! ^ forcedValue[p]!)
    }
    if (!propagate(pending)) return steps > maxSteps ? {status: 'undecided'} : refuted()
  }
  const choice: number[] = []
  const marks: number[] = []
  let next = 0
  for (;;) {
    while (next < componentCount && assigned[next] !== -1) next++
    if (next === componentCount) break
    marks.push(trail.length)
    choice.push(next)
    if (assign(next, prefer[next]!)) continue
    if (steps > maxSteps) return {status: 'undecided'}
    // Backtrack to the latest decision that still has its second value to try.
    let resolved = false
    while (choice.length > 0) {
      const c = choice.pop()!
      const mark = marks.pop()!
      const triedSecond = c < 0
      undoTo(mark)
      if (triedSecond) continue
      marks.push(trail.length)
      choice.push(-1 - c)
      if (assign(c, 1 - prefer[c]!)) {
        resolved = true
        break
      }
      if (steps > maxSteps) return {status: 'undecided'}
    }
    if (!resolved) {
      // Every choice tried: the forced pairs rule out each transitive solution.
      if (forced.length > 0) return refuted()
      // The theorem says a transitive solution exists once the equations are satisfiable.
      throw new Error('level planarity: equations satisfiable but no transitive solution found')
    }
    // Every component before the one just decided was already set when it was chosen.
    next = -1 - choice.at(-1)!
  }

  if (options.decideOnly) return {status: 'planar', orders: []}
  // The relation set so far is a strict partial order (closed under the propagation); the pairs no
  // equation mentions are free, so any linear extension completes it. Take the one nearest to rank
  // order: always the leftmost-ranked node with nothing unplaced to its left (Kahn, O(k²) a level).
  const orders: LevelItem[][] = []
  for (let l = 0; l < levelCount; l++) {
    const from = levelStart[l]!
    const k = levelStart[l + 1]! - from
    const base = relBase[l]!
    const before = new Int32Array(k)
    for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) if (relation[base + j * k + i] === 1) before[i]!++
    const done = new Uint8Array(k)
    const placed: LevelItem[] = []
    while (placed.length < k) {
      let pick = 0
      while (done[pick] || before[pick] !== 0) pick++
      done[pick] = 1
      const x = levelNodes[from + pick]!
      placed.push(x < n ? {kind: 'vertex', vertex: x} : {kind: 'edge', edge: nodeEdge[x]!})
      for (let j = 0; j < k; j++) if (relation[base + pick * k + j] === 1) before[j]!--
    }
    orders.push(placed)
  }
  return {status: 'planar', orders}
}
