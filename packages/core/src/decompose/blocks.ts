/**
 * Blocks (biconnected components) of an undirected multigraph given by its edge list, as lists of
 * edge ids: Hopcroft & Tarjan's lowpoint DFS with an edge stack ("Efficient algorithms for graph
 * manipulation", CACM 16, 1973), iterative. O(n + m). Loops are not allowed; isolated vertices
 * belong to no block; a bridge is a block of one edge; parallel edges share their block.
 */
export function blocksOf(n: number, edges: ReadonlyArray<readonly [number, number]>): number[][] {
  const m = edges.length
  const start = new Int32Array(n + 1)
  for (const [a, b] of edges) {
    start[a + 1]!++
    start[b + 1]!++
  }
  for (let v = 0; v < n; v++) start[v + 1]! += start[v]!
  const adj = new Int32Array(2 * m)
  const fill = start.slice(0, n)
  edges.forEach(([a, b], e) => {
    adj[fill[a]!++] = e
    adj[fill[b]!++] = e
  })
  const num = new Int32Array(n).fill(-1)
  const low = new Int32Array(n)
  const parentEdge = new Int32Array(n).fill(-1)
  const pos = new Int32Array(n)
  const edgeSeen = new Uint8Array(m)
  const edgeStack: number[] = []
  const out: number[][] = []
  let counter = 0
  for (let r = 0; r < n; r++) {
    if (num[r] !== -1 || start[r] === start[r + 1]) continue
    num[r] = low[r] = counter++
    pos[r] = start[r]!
    const stack = [r]
    while (stack.length > 0) {
      const v = stack[stack.length - 1]!
      if (pos[v]! < start[v + 1]!) {
        const e = adj[pos[v]!++]!
        if (e === parentEdge[v] || edgeSeen[e]) continue
        edgeSeen[e] = 1
        edgeStack.push(e)
        const [a, b] = edges[e]!
        const w = a === v ? b : a
        if (num[w] === -1) {
          num[w] = low[w] = counter++
          parentEdge[w] = e
          pos[w] = start[w]!
          stack.push(w)
        } else if (num[w]! < low[v]!) {
          low[v] = num[w]!
        }
      } else {
        stack.pop()
        if (stack.length === 0) break
        const p = stack[stack.length - 1]!
        if (low[v]! < low[p]!) low[p] = low[v]!
        if (low[v]! >= num[p]!) {
          // p separates v's subtree: pop its block down to the tree edge (p, v)
          const block: number[] = []
          const pe = parentEdge[v]!
          for (;;) {
            const e = edgeStack.pop()!
            block.push(e)
            if (e === pe) break
          }
          out.push(block.sort((x, y) => x - y))
        }
      }
    }
  }
  return out
}
