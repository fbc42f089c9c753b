/**
 * The marked fallback drawing for a diagram that failed its check (warn mode): an honest picture that
 * is not a valid hierarchy drawing, with every liberty taken marked.
 *
 * 1. A cycle is broken by reversing a small feedback arc set (explain/feedback-arc-set.ts); those edges
 *    are drawn against the flow, i.e. with their arrow pointing the other way, and marked `reversed`.
 *    Self-loops cannot be drawn either way and are left out (listed in `omitted`).
 * 2. A maximal feasible upward planar subgraph (explain/upward-subgraph.ts with the condition of
 *    `feasibility` below) is drawn crossing-free as usual: upward embedding → st-augmentation → the
 *    layout stage. Feasible (Chimani, Gutwenger, Mutzel & Wong, "Layer-free upward crossing
 *    minimization", ACM JEA 15, 2010): the augmentation stays acyclic together with every dropped
 *    edge, so each dropped edge has an upward route.
 * 3. The dropped edges are inserted one at a time, in written order, into the embedded st-digraph with
 *    few crossings (insert-edges.ts: upward planarization after Chimani et al. 2010 and "Upward
 *    planarization layout", JGAA 15(1), 2011), then each is taken out and routed again once all are
 *    in; crossings become dummy vertices, so the layout stage draws the planarized graph
 *    crossing-free and the dummies are then removed, leaving the crossings. Inserted edges are marked
 *    `inserted`. Only if no subgraph passed the feasibility condition in the time budget can a
 *    dropped edge (u, v) close a cycle with the augmentation; it is then inserted as (v, u) and marked
 *    `reversed` as well (its arrow still points at v).
 *
 * Every crossing of the result involves at least one marked edge: the subgraph of unmarked edges is
 * drawn exactly as the layout stage draws it, crossing-free.
 */
import {createDigraph, type Digraph} from '../graph/digraph.ts'
import {traceFaces, type RotationSystem} from '../embedding/rotation-system.ts'
import {stAugment, type StAugmentation} from '../augment/index.ts'
import {findCycle} from '../acyclic/index.ts'
import {layoutUpward, type Layout, type Spacing, type BoxSize} from '../layout/index.ts'
import {labelBox, type LabelBoxOptions} from '../measure/index.ts'
import type {Flow, ParsedDiagram} from '../parse/index.ts'
import {testUpwardPlanarity, type UpwardBudget} from '../upward/index.ts'
import {feedbackArcSet} from '../explain/feedback-arc-set.ts'
import {maximalUpwardSubgraph, type SubgraphCondition} from '../explain/upward-subgraph.ts'
import {insertEdge, removeEdge, type EditableEmbedding} from './insert-edges.ts'

export type EdgeMark = 'inserted' | 'reversed' | 'reversed-inserted'

export interface FallbackLayout {
  /** Polylines run from each edge's tail to its head as written (a reversed edge runs against the flow). */
  layout: Layout
  /** Per edge id of the graph: how it was drawn; undefined for an ordinary edge. */
  marks: Array<EdgeMark | undefined>
  /** Self-loops, not drawn. */
  omitted: number[]
  /** Edges left out of the upward planar subgraph and inserted afterwards (ascending). */
  inserted: number[]
  /** Edges drawn reversed (ascending). */
  reversed: number[]
  /** Points where two drawn edges cross (each involves an inserted edge). */
  crossings: number
  /** False when a budget ran out while choosing the subgraph (it is then not proven maximal). */
  maximal: boolean
}

export interface FallbackSettings {
  flow: Flow
  boxes: ReadonlyArray<BoxSize>
  spacing?: Partial<Spacing> | undefined
  /** Budget for the upward planarity tests (default 3000 ms in all). */
  budget?: Readonly<UpwardBudget> | undefined
}

/** Box of a crossing dummy and of a bend dummy (crossing an augmentation edge), in layout units. */
const crossingBox: BoxSize = {width: 6, height: 6}
const bendBox: BoxSize = {width: 2, height: 2}

export function layoutFallback(g: Digraph, settings: Readonly<FallbackSettings>): FallbackLayout {
  const n = g.vertexCount
  const m = g.edgeCount
  const now = settings.budget?.now ?? (() => performance.now())
  const deadline = now() + (settings.budget?.maxMillis ?? 3000)
  const omitted: number[] = []
  const drawable: number[] = []
  for (let e = 0; e < m; e++) (g.tail[e] === g.head[e] ? omitted : drawable).push(e)
  // 1. Reverse a feedback arc set of the drawable edges.
  const base = createDigraph(n, drawable.map((e) => [g.tail[e]!, g.head[e]!] as const))
  const fas = findCycle(base).acyclic ? [] : feedbackArcSet(base).edges.map((i) => drawable[i]!)
  const flipped = new Set(fas)
  const from = (e: number): number => (flipped.has(e) ? g.head[e]! : g.tail[e]!)
  const to = (e: number): number => (flipped.has(e) ? g.tail[e]! : g.head[e]!)
  const acyclic = createDigraph(n, drawable.map((e) => [from(e), to(e)] as const))
  // 2. Maximal feasible upward planar subgraphs grown in several edge orders (written, reversed, by a
  // topological order of the tails, then a few seeded shuffles); each is planarized, and the one with
  // the fewest edges against the flow (none unless the budget ran out), then the fewest crossings, is
  // drawn. Which edges are dropped decides most of the crossings, and a drawing rarely costs much, so
  // the extra orders pay (on North's g.16.60 they take 45 crossings down to 25).
  const topo = topologicalRank(acyclic)
  const orders = [
    [...Array(drawable.length).keys()],
    [...Array(drawable.length).keys()].reverse(),
    [...Array(drawable.length).keys()].sort((a, b) => topo[acyclic.tail[a]!]! - topo[acyclic.tail[b]!]! || topo[acyclic.head[a]!]! - topo[acyclic.head[b]!]! || a - b)
  ]
  const fixedOrders = orders.length
  const random = seededRandom(0x5eed)
  for (let k = 0; k < (drawable.length <= shuffleUpTo ? shuffledOrders : 0); k++) {
    const order = [...Array(drawable.length).keys()]
    for (let i = order.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1))
      ;[order[i], order[j]] = [order[j]!, order[i]!]
    }
    orders.push(order)
  }
  let best: Planarized | undefined
  let bestScore = Infinity
  for (let k = 0; k < orders.length; k++) {
    // Each order may use all that is left of the budget: a time share per order would cut an order short
    // on a loaded machine while the whole budget still sufficed, and change the drawing. The work is
    // bounded by the count of orders instead (3 fixed, shuffles only up to shuffleUpTo edges).
    const attempt = planWithOrder(g, settings, drawable, flipped, acyclic, orders[k]!, omitted, {maxMillis: Math.max(0, deadline - now()), now})
    // A shuffle cut short by the budget is ignored, so the budget can only remove shuffles.
    if (k >= fixedOrders && !attempt.maximal) continue
    const score = attempt.against * 1e6 + attempt.crossings
    if (score < bestScore) {
      best = attempt
      bestScore = score
    }
    if (score === 0) break
  }
  return best!.draw()
}

/**
 * Seeded shuffles after the three fixed orders, for diagrams of at most `shuffleUpTo` edges: these
 * finish well inside the default budget, so the output stays deterministic (the shuffles are seeded).
 */
const shuffledOrders = 8
const shuffleUpTo = 48

/** A small linear congruential generator (Numerical Recipes constants), for deterministic shuffles. */
function seededRandom(seed: number): () => number {
  let state = seed >>> 0
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0
    return state / 4294967296
  }
}

/** A planarized drawing before layout: its score, and the layout on demand (only the best is drawn). */
interface Planarized {
  crossings: number
  /** False when the budget ran out while choosing the subgraph. */
  maximal: boolean
  /** Dropped edges inserted against the flow (the augmentation forced it; only without feasibility). */
  against: number
  draw: () => FallbackLayout
}

/** Steps 2 to 5 for one edge order (4 and 5 when asked to draw). */
function planWithOrder(
  g: Digraph,
  settings: Readonly<FallbackSettings>,
  drawable: readonly number[],
  flipped: ReadonlySet<number>,
  acyclic: Digraph,
  edgeOrder: readonly number[],
  omitted: number[],
  budget: UpwardBudget
): Planarized {
  const n = g.vertexCount
  const m = g.edgeCount
  const now = budget.now ?? (() => performance.now())
  const deadline = now() + budget.maxMillis
  const fas = [...flipped]
  const from = (e: number): number => (flipped.has(e) ? g.head[e]! : g.tail[e]!)
  const to = (e: number): number => (flipped.has(e) ? g.tail[e]! : g.head[e]!)
  const feasible = feasibility(acyclic)
  const sub = maximalUpwardSubgraph(acyclic, {maxMillis: Math.max(0, deadline - now()), now}, edgeOrder, feasible.condition)
  const droppedSet = new Set(sub.dropped.map((i) => drawable[i]!))
  const dropped = drawable.filter((e) => droppedSet.has(e))
  const {ids, st} = feasible.augmentationOf(drawable.length - sub.dropped.length) ?? rescue(acyclic, sub.dropped, deadline, now)
  const kept = ids.map((i) => drawable[i]!)

  // 3. Editable copy of H with a new bottom s' -> s and top t -> t', which fix the outer face.
  const hg = st.graph
  const h: EditableEmbedding = {
    tail: Array.from(hg.tail),
    head: Array.from(hg.head),
    owner: Array.from(hg.tail, (_, e) => (e < kept.length ? kept[e]! : -1)),
    rotation: st.embedding.rotation.map((r) => Array.from(r)),
    dummy: new Array<number>(hg.vertexCount).fill(0)
  }
  const bottom = addVertex(h)
  const top = addVertex(h)
  const toSource = addEdge(h, bottom, st.source, -1)
  h.rotation[bottom]!.push(toSource)
  placeOuter(h, st, st.source, toSource)
  const fromSink = addEdge(h, st.sink, top, -1)
  h.rotation[top]!.push(fromSink)
  placeOuter(h, st, st.sink, fromSink)
  const outerDart = 2 * toSource + 1 // enters the new bottom; its face is the outer face for good

  // Heights: a topological numbering of H with as many dropped edges as can join it acyclically.
  const extra: Array<[number, number]> = []
  const order: Array<{e: number; u: number; v: number; reversed: boolean}> = []
  for (const e of dropped) {
    const u = from(e)
    const v = to(e)
    const forward = !reaches(h, extra, v, u)
    order.push({e, u: forward ? u : v, v: forward ? v : u, reversed: !forward})
    extra.push(forward ? [u, v] : [v, u])
  }
  const height = topologicalNumbers(h, extra)
  let crossings = 0
  const marks: Array<EdgeMark | undefined> = new Array(m).fill(undefined)
  for (const e of fas) marks[e] = 'reversed'
  const reversedAlso = new Set<number>()
  for (const item of order) {
    const r = insertEdge(h, height, item.u, item.v, item.e, outerDart, 2 * fromSink)
    if (!r.ok) throw new Error(`layoutFallback: could not insert edge ${item.e}`)
    crossings += r.crossings
    if (item.reversed) reversedAlso.add(item.e)
    const flippedTwice = flipped.has(item.e) !== item.reversed
    marks[item.e] = flippedTwice ? 'reversed-inserted' : 'inserted'
  }
  // Local improvement (the re-insertion step of planarization heuristics, common practice): take each
  // inserted edge out and route it again now that all the others are in (the search finds the fewest
  // crossings among routes that fit the heights); passes repeat while they gain, at most three.
  for (let pass = 0; pass < 3 && order.length > 1; pass++) {
    const start = crossings
    for (const item of order) {
      // The heights left by earlier routes can leave no route that fits them: then the edge keeps
      // its old route (restored from a copy).
      const saved = {h: copyEmbedding(h), height: [...height], crossings}
      crossings -= removeEdge(h, height, item.e)
      const r = insertEdge(h, height, item.u, item.v, item.e, outerDart, 2 * fromSink)
      if (r.ok) {
        crossings += r.crossings
        continue
      }
      Object.assign(h, saved.h)
      height.splice(0, height.length, ...saved.height)
      crossings = saved.crossings
    }
    if (crossings >= start) break
  }

  const draw = (): FallbackLayout => {
    // 4. Renumber: drawn vertices (G's, then dummies) first, drawn edges first, as the layout wants.
    const vcount = h.rotation.length
    const isAdded = new Uint8Array(vcount)
    for (const v of st.addedVertices) isAdded[v] = 1
    isAdded[bottom] = isAdded[top] = 1
    const vmap = new Int32Array(vcount)
    let next = 0
    for (let v = 0; v < vcount; v++) if (!isAdded[v]) vmap[v] = next++
    const drawnVertices = next
    for (let v = 0; v < vcount; v++) if (isAdded[v]) vmap[v] = next++
    const ecount = h.tail.length
    const emap = new Int32Array(ecount)
    let nextEdge = 0
    for (let e = 0; e < ecount; e++) if (h.owner[e]! >= 0) emap[e] = nextEdge++
    const drawnEdges = nextEdge
    for (let e = 0; e < ecount; e++) if (h.owner[e]! < 0) emap[e] = nextEdge++
    const pairs = new Array<[number, number]>(ecount)
    for (let e = 0; e < ecount; e++) pairs[emap[e]!] = [vmap[h.tail[e]!]!, vmap[h.head[e]!]!]
    const graph = createDigraph(vcount, pairs)
    const rotation: Int32Array[] = new Array(vcount)
    for (let v = 0; v < vcount; v++) rotation[vmap[v]!] = Int32Array.from(h.rotation[v]!, (e) => emap[e]!)
    const embedding: RotationSystem = {graph, rotation}
    const faces = traceFaces(embedding)
    const planarized: StAugmentation = {
      graph,
      embedding,
      faces,
      outerFace: faces.faceOfDart[2 * emap[toSource]! + 1]!,
      source: vmap[bottom]!,
      sink: vmap[top]!,
      addedEdges: Array.from({length: ecount - drawnEdges}, (_, i) => drawnEdges + i),
      addedVertices: Array.from({length: vcount - drawnVertices}, (_, i) => drawnVertices + i)
    }
    const drawnGraph = createDigraph(drawnVertices, pairs.slice(0, drawnEdges))
    const boxes: BoxSize[] = []
    for (let v = 0; v < vcount; v++) if (!isAdded[v]) boxes[vmap[v]!] = v < n ? settings.boxes[v]! : h.dummy[v] === 1 ? crossingBox : bendBox
    const planarLayout = layoutUpward({graph: drawnGraph, st: planarized, boxes, flow: settings.flow, spacing: settings.spacing})

    // 5. Join the pieces of each edge through its dummies, and drop the dummies.
    const polyOf = new Map<number, Array<[number, number]>>()
    for (const edge of planarLayout.edges) polyOf.set(edge.edge, edge.points)
    const outOf: number[][] = Array.from({length: drawnVertices}, () => [])
    for (let e = 0; e < drawnEdges; e++) outOf[graph.tail[e]!]!.push(e)
    const ownerOfNew = new Int32Array(drawnEdges)
    for (let e = 0; e < ecount; e++) if (h.owner[e]! >= 0) ownerOfNew[emap[e]!] = h.owner[e]!
    const edges: Layout['edges'] = []
    for (const e of drawable) {
      const start = flipped.has(e) !== reversedAlso.has(e) ? g.head[e]! : g.tail[e]!
      const points: Array<[number, number]> = []
      let at = start
      const end = start === g.tail[e] ? g.head[e]! : g.tail[e]!
      while (at !== end) {
        const piece = outOf[at]!.find((f) => ownerOfNew[f] === e)
        if (piece === undefined) throw new Error(`layoutFallback: edge ${e} lost its way`)
        points.push(...polyOf.get(piece)!)
        at = graph.head[piece]!
      }
      edges.push({edge: e, points: start === g.tail[e] ? points : points.reverse()})
    }
    const nodes = planarLayout.nodes.filter((node) => node.vertex < n)
    const layout: Layout = {flow: planarLayout.flow, width: planarLayout.width, height: planarLayout.height, nodes, edges}
    const reversed = drawable.filter((e) => marks[e] === 'reversed' || marks[e] === 'reversed-inserted')
    return {layout, marks, omitted, inserted: dropped, reversed, crossings, maximal: sub.maximal}
  }
  return {crossings, against: reversedAlso.size, maximal: sub.maximal, draw}
}

/**
 * The feasibility condition of Chimani, Gutwenger, Mutzel & Wong (2010): a subgraph U of the acyclic
 * graph G is drawn only if its upward embedding has an st-augmentation A with G ∪ A acyclic. Since
 * U ⊆ G, G ∪ A is exactly U ∪ A plus the dropped edges, so every dropped edge (u, v) then has u below
 * v in some topological numbering of the augmented st-digraph, and insert-edges.ts finds an upward
 * route for it. The face saturation asks before each edge and skips one that would close a cycle
 * with G and the augmentation so far (one depth-first search each, O(n + m)); a subgraph whose
 * faces then cannot be saturated counts as not drawable, and maximalUpwardSubgraph drops edges until
 * one can. The last accepted augmentation is kept: it belongs to the final subgraph.
 */
function feasibility(acyclic: Digraph): {
  condition: SubgraphCondition
  augmentationOf: (keptCount: number) => {ids: readonly number[]; st: StAugmentation} | undefined
} {
  const n = acyclic.vertexCount
  let last: {ids: readonly number[]; st: StAugmentation} | undefined
  const condition: SubgraphCondition = (ids, _sub, upward) => {
    const extra: number[][] = Array.from({length: n}, () => [])
    const seen = new Int32Array(n)
    let stamp = 0
    const reaches = (a: number, b: number): boolean => {
      stamp++
      const stack = [a]
      seen[a] = stamp
      while (stack.length > 0) {
        const x = stack.pop()!
        if (x === b) return true
        const visit = (y: number): void => {
          if (seen[y] !== stamp) {
            seen[y] = stamp
            stack.push(y)
          }
        }
        for (let j = acyclic.outStart[x]!; j < acyclic.outStart[x + 1]!; j++) visit(acyclic.head[acyclic.outEdges[j]!]!)
        for (const y of extra[x]!) visit(y)
      }
      return false
    }
    const st = stAugment(upward, {
      allowEdge: (t, h) => {
        if (t === h || reaches(h, t)) return false
        extra[t]!.push(h)
        return true
      }
    })
    if (!st) return false
    last = {ids: [...ids], st}
    return true
  }
  return {condition, augmentationOf: (keptCount) => (last && last.ids.length === keptCount ? last : undefined)}
}

/**
 * When no subgraph passed the condition (the budget ran out before any test did), the kept edges are
 * augmented without it; insertion then draws an edge against the flow where the augmentation forces
 * it (marked).
 */
function rescue(acyclic: Digraph, droppedIds: readonly number[], deadline: number, now: () => number): {ids: readonly number[]; st: StAugmentation} {
  const out = new Set(droppedIds)
  const ids = [...Array(acyclic.edgeCount).keys()].filter((i) => !out.has(i))
  const sub = createDigraph(acyclic.vertexCount, ids.map((i) => [acyclic.tail[i]!, acyclic.head[i]!] as const))
  const tested = testUpwardPlanarity(sub, {maxMillis: Math.max(1000, deadline - now()), now})
  if (tested.status !== 'upward') throw new Error('layoutFallback: the kept subgraph was tested upward planar and now is not')
  return {ids, st: stAugment(tested.upward)}
}

/** Position of each vertex in a topological order (Kahn's algorithm, smallest id first among ties). */
function topologicalRank(g: Digraph): Int32Array {
  const indegree = new Int32Array(g.vertexCount)
  for (let e = 0; e < g.edgeCount; e++) indegree[g.head[e]!]!++
  const ready: number[] = []
  for (let v = 0; v < g.vertexCount; v++) if (indegree[v] === 0) ready.push(v)
  const rank = new Int32Array(g.vertexCount)
  let k = 0
  for (let i = 0; i < ready.length; i++) {
    const v = ready[i]!
    rank[v] = k++
    for (let j = g.outStart[v]!; j < g.outStart[v + 1]!; j++) {
      const w = g.head[g.outEdges[j]!]!
      if (--indegree[w]! === 0) ready.push(w)
    }
  }
  return rank
}

function copyEmbedding(h: EditableEmbedding): EditableEmbedding {
  return {tail: [...h.tail], head: [...h.head], owner: [...h.owner], rotation: h.rotation.map((r) => [...r]), dummy: [...h.dummy]}
}

function addVertex(h: EditableEmbedding): number {
  h.rotation.push([])
  h.dummy.push(0)
  return h.rotation.length - 1
}

function addEdge(h: EditableEmbedding, t: number, hd: number, owner: number): number {
  h.tail.push(t)
  h.head.push(hd)
  h.owner.push(owner)
  return h.tail.length - 1
}

/** Put edge e into w's rotation inside the outer face's corner at w. */
function placeOuter(h: EditableEmbedding, st: StAugmentation, w: number, e: number): void {
  const rot = h.rotation[w]!
  if (rot.length === 0 || st.outerFace < 0) {
    rot.push(e)
    return
  }
  // A dart entering w whose face is the outer face names the outer corner at w.
  const g = st.graph
  for (let d = 0; d < 2 * g.edgeCount; d++) {
    const headOfDart = (d & 1) === 0 ? g.head[d >> 1] : g.tail[d >> 1]
    if (headOfDart === w && st.faces.faceOfDart[d] === st.outerFace) {
      rot.splice(rot.indexOf(d >> 1) + 1, 0, e)
      return
    }
  }
  throw new Error('layoutFallback: the st-graph source or sink is not on the outer face')
}

/** Is there a path from a to b in h plus the extra edges? */
function reaches(h: EditableEmbedding, extra: ReadonlyArray<[number, number]>, a: number, b: number): boolean {
  const out: number[][] = Array.from({length: h.rotation.length}, () => [])
  for (let e = 0; e < h.tail.length; e++) out[h.tail[e]!]!.push(h.head[e]!)
  for (const [x, y] of extra) out[x]!.push(y)
  const seen = new Uint8Array(h.rotation.length)
  const stack = [a]
  seen[a] = 1
  while (stack.length > 0) {
    const x = stack.pop()!
    if (x === b) return true
    for (const y of out[x]!) if (!seen[y]) {
      seen[y] = 1
      stack.push(y)
    }
  }
  return false
}

/** Kahn's algorithm: position of every vertex in a topological order of h plus the extra edges. */
function topologicalNumbers(h: EditableEmbedding, extra: ReadonlyArray<[number, number]>): number[] {
  const count = h.rotation.length
  const out: number[][] = Array.from({length: count}, () => [])
  const indegree = new Array<number>(count).fill(0)
  const add = (x: number, y: number): void => {
    out[x]!.push(y)
    indegree[y]!++
  }
  for (let e = 0; e < h.tail.length; e++) add(h.tail[e]!, h.head[e]!)
  for (const [x, y] of extra) add(x, y)
  const queue: number[] = []
  for (let v = 0; v < count; v++) if (indegree[v] === 0) queue.push(v)
  const number = new Array<number>(count).fill(-1)
  let k = 0
  while (queue.length > 0) {
    const x = queue.shift()!
    number[x] = k++
    for (const y of out[x]!) if (--indegree[y]! === 0) queue.push(y)
  }
  if (k !== count) throw new Error('layoutFallback: the augmented graph with the inserted edges has a cycle')
  return number
}

/** Label boxes as the ordinary drawing measures them. */
export function fallbackBoxes(parsed: ParsedDiagram, label: Readonly<LabelBoxOptions> = {}): BoxSize[] {
  return parsed.vertices.map((v) => {
    const box = labelBox(v.label ?? v.key, label)
    return {width: box.width, height: box.height}
  })
}
