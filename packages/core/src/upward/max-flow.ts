/**
 * Maximum flow by Dinic's blocking-flow method (Dinitz, Soviet Math. Doklady 11, 1970), on typed
 * arrays. On the unit-capacity bipartite networks of the fixed-embedding test (sources/sinks on one
 * side with capacity 1) it runs in O(E·√V) (Even & Tarjan, SIAM J. Comput. 4, 1975).
 *
 * The network keeps its flow as residual capacities, so a solved network can be copied, have a
 * capacity raised, and be augmented further from where it stood (used to try each outer face).
 */

export interface FlowNetwork {
  readonly nodeCount: number
  /** Arc a runs to `to[a]`; arcs come in pairs, a ^ 1 being a's reverse. */
  readonly to: Int32Array
  /** Residual capacity of each arc. Mutated by maxFlow. */
  readonly residual: Int32Array
  /** Arcs leaving node u: arcs[start[u] .. start[u + 1]). */
  readonly start: Int32Array
  readonly arcs: Int32Array
}

/** Collects arcs, then freezes them into a FlowNetwork. */
export class FlowNetworkBuilder {
  readonly nodeCount: number
  private readonly tails: number[] = []
  private readonly heads: number[] = []
  private readonly caps: number[] = []

  constructor(nodeCount: number) {
    this.nodeCount = nodeCount
  }

  /** Adds arc u -> v with the given capacity; returns its id (its reverse is id ^ 1). */
  addArc(u: number, v: number, capacity: number): number {
    const id = 2 * this.tails.length
    this.tails.push(u)
    this.heads.push(v)
    this.caps.push(capacity)
    return id
  }

  build(): FlowNetwork {
    const k = this.tails.length
    const to = new Int32Array(2 * k)
    const residual = new Int32Array(2 * k)
    const start = new Int32Array(this.nodeCount + 1)
    for (let i = 0; i < k; i++) {
      to[2 * i] = this.heads[i]!
      to[2 * i + 1] = this.tails[i]!
      residual[2 * i] = this.caps[i]!
      start[this.tails[i]! + 1]!++
      start[this.heads[i]! + 1]!++
    }
    for (let u = 0; u < this.nodeCount; u++) start[u + 1]! += start[u]!
    const fill = start.slice(0, this.nodeCount)
    const arcs = new Int32Array(2 * k)
    for (let i = 0; i < k; i++) {
      arcs[fill[this.tails[i]!]!++] = 2 * i
      arcs[fill[this.heads[i]!]!++] = 2 * i + 1
    }
    return {nodeCount: this.nodeCount, to, residual, start, arcs}
  }
}

/** A copy that shares the (immutable) structure and owns its residual capacities. */
export function copyFlowNetwork(net: FlowNetwork): FlowNetwork {
  return {...net, residual: net.residual.slice()}
}

/**
 * Pushes as much additional flow from s to t as the residual network allows, at most `limit`;
 * returns the amount pushed.
 */
export function maxFlow(net: FlowNetwork, s: number, t: number, limit = Number.MAX_SAFE_INTEGER): number {
  const n = net.nodeCount
  const {to, residual, start, arcs} = net
  const level = new Int32Array(n)
  const cursor = new Int32Array(n)
  const queue = new Int32Array(n)
  // Explicit DFS stack of arcs, so deep networks cannot overflow the call stack.
  const pathArcs = new Int32Array(n)
  let total = 0
  while (total < limit) {
    level.fill(-1)
    level[s] = 0
    let qh = 0
    let qt = 0
    queue[qt++] = s
    while (qh < qt) {
      const u = queue[qh++]!
      for (let i = start[u]!; i < start[u + 1]!; i++) {
        const a = arcs[i]!
        const v = to[a]!
        if (residual[a]! > 0 && level[v] === -1) {
          level[v] = level[u]! + 1
          queue[qt++] = v
        }
      }
    }
    if (level[t] === -1) break
    for (let u = 0; u < n; u++) cursor[u] = start[u]!
    // Blocking flow: repeated DFS along level-increasing arcs with current-arc pointers.
    while (total < limit) {
      let depth = 0
      let u = s
      let found = false
      while (true) {
        if (u === t) {
          found = true
          break
        }
        let advanced = false
        while (cursor[u]! < start[u + 1]!) {
          const a = arcs[cursor[u]!]!
          const v = to[a]!
          if (residual[a]! > 0 && level[v] === level[u]! + 1) {
            pathArcs[depth++] = a
            u = v
            advanced = true
            break
          }
          cursor[u]!++
        }
        if (advanced) continue
        if (depth === 0) break
        // Dead end: retreat and skip the arc that led here.
        level[u] = -1
        const back = pathArcs[--depth]!
        u = to[back ^ 1]!
        cursor[u]!++
      }
      if (!found) break
      let push = limit - total
      for (let i = 0; i < depth; i++) push = Math.min(push, residual[pathArcs[i]!]!)
      for (let i = 0; i < depth; i++) {
        residual[pathArcs[i]!]! -= push
        residual[pathArcs[i]! ^ 1]! += push
      }
      total += push
    }
  }
  return total
}
