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

/**
 * Throws RangeError unless every edge goes from a lower to a strictly higher level ≥ 0, and unless
 * each forced pair names two different items that lie on its level.
 */
export function testLevelPlanarity(graph: Digraph, level: ArrayLike<number>, options?: LevelPlanarityOptions & {forced?: undefined}): LevelPlanarity
export function testLevelPlanarity(graph: Digraph, level: ArrayLike<number>, options: ForcedLevelPlanarityOptions): ForcedLevelPlanarity
export function testLevelPlanarity(graph: Digraph, level: ArrayLike<number>, options: LevelPlanarityOptions & {forced?: readonly ForcedPair[] | undefined} = {}): ForcedLevelPlanarity {
  const n = graph.vertexCount
  const rank = options.rank
  const maxSteps = options.maxSteps ?? 5_000_000
  const maxWork = options.maxWork ?? 4_000_000
  for (let v = 0; v < n; v++) {
    const l = level[v]!
    if (!Number.isInteger(l) || l < 0) throw new RangeError(`level[${v}] must be a whole number ≥ 0, got ${l}`)
  }

  // 1. The proper graph: nodes 0..n-1 are the vertices, then one dummy per edge per inner level.
  const nodeLevel: number[] = []
  const nodeItem: LevelItem[] = []
  const nodeRank: number[] = []
  for (let v = 0; v < n; v++) {
    nodeLevel.push(level[v]!)
    nodeItem.push({kind: 'vertex', vertex: v})
    nodeRank.push(rank ? rank[v]! : v)
  }
  /** Segments between consecutive levels: tail node, head node, input edge. */
  const segTail: number[] = []
  const segHead: number[] = []
  const segEdge: number[] = []
  let maxLevel = 0
  for (let v = 0; v < n; v++) maxLevel = Math.max(maxLevel, level[v]!)
  let dummies = 0
  /** Node of edge e's first dummy (on level[tail] + 1); the rest follow level by level. */
  const firstDummy = new Int32Array(graph.edgeCount)
  for (let e = 0; e < graph.edgeCount; e++) {
    const u = graph.tail[e]!
    const w = graph.head[e]!
    if (level[w]! <= level[u]!) throw new RangeError(`edge ${e} (${u} -> ${w}) does not go up a level`)
    dummies += level[w]! - level[u]! - 1
  }
  if (dummies > maxWork) return {status: 'undecided'}
  for (let e = 0; e < graph.edgeCount; e++) {
    const u = graph.tail[e]!
    const w = graph.head[e]!
    let previous = u
    firstDummy[e] = nodeLevel.length
    for (let l = level[u]! + 1; l < level[w]!; l++) {
      const dummy = nodeLevel.length
      nodeLevel.push(l)
      nodeItem.push({kind: 'edge', edge: e})
      // A dummy sits, by preference, between its ends' ranks: at its edge's place if given, else the tail's.
      nodeRank.push(options.edgeRank ? options.edgeRank[e]! : nodeRank[u]!)
      segTail.push(previous)
      segHead.push(dummy)
      segEdge.push(e)
      previous = dummy
    }
    segTail.push(previous)
    segHead.push(w)
    segEdge.push(e)
  }

  // Bound the quadratic part before building it.
  const perLevel = new Float64Array(maxLevel + 1)
  const perBand = new Float64Array(maxLevel + 1)
  for (let node = 0; node < nodeLevel.length; node++) perLevel[nodeLevel[node]!]!++
  for (const t of segTail) perBand[nodeLevel[t]!]!++
  let work = 0
  for (let l = 0; l <= maxLevel; l++) work += (perLevel[l]! * (perLevel[l]! - 1)) / 2 + (perBand[l]! * (perBand[l]! - 1)) / 2
  if (work > maxWork) return {status: 'undecided'}

  // 2. Nodes per level in preference order; a node's position there names its pair variables.
  const levels: number[][] = Array.from({length: maxLevel + 1}, () => [])
  for (let node = 0; node < nodeLevel.length; node++) levels[nodeLevel[node]!]!.push(node)
  for (const nodes of levels) nodes.sort((a, b) => nodeRank[a]! - nodeRank[b]! || a - b)
  const position = new Int32Array(nodeLevel.length)
  const varBase: number[] = []
  let varCount = 0
  for (const nodes of levels) {
    varBase.push(varCount)
    nodes.forEach((node, i) => (position[node] = i))
    varCount += (nodes.length * (nodes.length - 1)) / 2
  }
  /** Variable of the pair at positions i < j of a level with k nodes. */
  const pairVar = (l: number, i: number, j: number): number => {
    const k = levels[l]!.length
    return varBase[l]! + i * k - (i * (i + 1)) / 2 + (j - i - 1)
  }
  /** left(a, b) as a variable and a sign: value(left) = value(var) XOR flip. */
  /** Level and positions (i < j) of each variable, filled in as variables are first used. */
  const varLevel = new Int32Array(varCount)
  const varI = new Int32Array(varCount)
  const varJ = new Int32Array(varCount)
  const variable = (l: number, i: number, j: number): number => {
    const v = pairVar(l, i, j)
    varLevel[v] = l
    varI[v] = i
    varJ[v] = j
    return v
  }
  const literal = (a: number, b: number): [number, number] => {
    const l = nodeLevel[a]!
    const i = position[a]!
    const j = position[b]!
    return i < j ? [variable(l, i, j), 0] : [variable(l, j, i), 1]
  }

  // 3. Equations between segments of the same band, as an adjacency list with parity.
  const eqA: number[] = []
  const eqB: number[] = []
  const eqParity: number[] = []
  const eqSegs: number[] = []
  const segsByBand: number[][] = Array.from({length: maxLevel}, () => [])
  for (let s = 0; s < segTail.length; s++) segsByBand[nodeLevel[segTail[s]!]!]!.push(s)
  for (const band of segsByBand) {
    for (let x = 0; x < band.length; x++) {
      for (let y = x + 1; y < band.length; y++) {
        const s = band[x]!
        const t = band[y]!
        if (segTail[s] === segTail[t] || segHead[s] === segHead[t]) continue
        const [va, fa] = literal(segTail[s]!, segTail[t]!)
        const [vb, fb] = literal(segHead[s]!, segHead[t]!)
        eqA.push(va)
        eqB.push(vb)
        eqParity.push(fa ^ fb)
        eqSegs.push(s, t)
      }
    }
  }
  const adjStart = new Int32Array(varCount + 1)
  for (let q = 0; q < eqA.length; q++) {
    adjStart[eqA[q]! + 1]!++
    adjStart[eqB[q]! + 1]!++
  }
  for (let v = 0; v < varCount; v++) adjStart[v + 1]! += adjStart[v]!
  const adj = new Int32Array(2 * eqA.length)
  const fill = adjStart.slice(0, varCount)
  for (let q = 0; q < eqA.length; q++) {
    adj[fill[eqA[q]!]!++] = q
    adj[fill[eqB[q]!]!++] = q
  }

  // 2-colouring by BFS: colour = value relative to the component root, which is set to true. Only
  // variables in some equation take part; the others are free (component −1).
  const colour = new Int8Array(varCount)
  const component = new Int32Array(varCount).fill(-1)
  const parentEq = new Int32Array(varCount).fill(-1)
  const depth = new Int32Array(varCount)
  const componentRoots: number[] = []
  const queue = new Int32Array(varCount)
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
          return {status: 'not-planar', edges: oddCycleEdges(x, y, q)}
        }
      }
    }
  }

  /** Input edges of the odd cycle: both tree paths up to their meeting point, and the closing equation. */
  function oddCycleEdges(x: number, y: number, closing: number): number[] {
    return equationPathEdges(x, y, [closing])
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
    if (e < 0 || e >= graph.edgeCount || l <= level[graph.tail[e]!]! || l >= level[graph.head[e]!]!) throw new RangeError(`forced pair ${p}: edge ${e} does not pass level ${l}`)
    return firstDummy[e]! + (l - level[graph.tail[e]!]! - 1)
  }
  /** Per component, the forced pair that fixed its flip (−1: none yet). */
  const fixedBy = new Int32Array(componentRoots.length).fill(-1)
  for (let p = 0; p < forced.length; p++) {
    const {level: l, left, right} = forced[p]!
    const a = nodeOf(left, l, p)
    const b = nodeOf(right, l, p)
    if (a === b) throw new RangeError(`forced pair ${p} names one item twice`)
    const [v, value] = literal(a, b)
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
  const componentCount = componentRoots.length
  const memberStart = new Int32Array(componentCount + 1)
  for (let v = 0; v < varCount; v++) if (component[v]! >= 0) memberStart[component[v]! + 1]!++
  for (let c = 0; c < componentCount; c++) memberStart[c + 1]! += memberStart[c]!
  const memberList = new Int32Array(memberStart[componentCount]!)
  const memberFill = memberStart.slice(0, componentCount)
  for (let v = 0; v < varCount; v++) if (component[v]! >= 0) memberList[memberFill[component[v]!]!++] = v
  /** Per level, k×k: +1 when the node at position i is left of the one at j, −1 right, 0 unknown. */
  const relation = levels.map((nodes) => new Int8Array(nodes.length * nodes.length))
  const assigned = new Int8Array(componentCount).fill(-1)
  const trail: number[] = []
  let steps = 0

  /** Set variable v to `value` (0: position varI left of varJ) and propagate; false on conflict. */
  function setVariable(v: number, value: number, pending: number[]): boolean {
    const [left, right] = value === 0 ? [varI[v]!, varJ[v]!] : [varJ[v]!, varI[v]!]
    const l = varLevel[v]!
    const k = levels[l]!.length
    const rel = relation[l]!
    rel[left * k + right] = 1
    rel[right * k + left] = -1
    for (let w = 0; w < k; w++) {
      if (++steps > maxSteps) return false
      if (w === left || w === right) continue
      // left < right and right < w force left < w; w < left forces w < right.
      if (rel[right * k + w] === 1 && !force(l, left, w, pending)) return false
      if (rel[w * k + left] === 1 && !force(l, w, right, pending)) return false
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
        const k = levels[varLevel[v]!]!.length
        const known = relation[varLevel[v]!]![varI[v]! * k + varJ[v]!]!
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

  /** Require position a left of position b on level l: conflict, nothing to do, or a pending entry. */
  function force(l: number, a: number, b: number, pending: number[]): boolean {
    const k = levels[l]!.length
    const known = relation[l]![a * k + b]!
    if (known === 1) return true
    if (known === -1) return false
    const v = a < b ? variable(l, a, b) : variable(l, b, a)
    // Wanted value of v: 0 when the smaller position is on the left.
    const value = a < b ? 0 : 1
    if (component[v]! < 0) pending.push(-1 - v, value)
    else pending.push(component[v]!, colour[v]! ^ value)
    return true
  }

  function clearVariable(v: number): void {
    const k = levels[varLevel[v]!]!.length
    relation[varLevel[v]!]![varI[v]! * k + varJ[v]!] = 0
    relation[varLevel[v]!]![varJ[v]! * k + varI[v]!] = 0
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
  const orders = levels.map((nodes, l) => {
    const k = nodes.length
    const rel = relation[l]!
    const before = new Int32Array(k)
    for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) if (rel[j * k + i] === 1) before[i]!++
    const done = new Uint8Array(k)
    const placed: LevelItem[] = []
    while (placed.length < k) {
      let pick = 0
      while (done[pick] || before[pick] !== 0) pick++
      done[pick] = 1
      placed.push(nodeItem[nodes[pick]!]!)
      for (let j = 0; j < k; j++) if (rel[pick * k + j] === 1) before[j]!--
    }
    return placed
  })
  return {status: 'planar', orders}
}
