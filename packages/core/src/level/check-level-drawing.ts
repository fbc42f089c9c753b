/**
 * An independent check of a level-planarity witness: the orders hold every vertex on its level and
 * every edge once on each level it passes, and no two edges cross between consecutive levels (two
 * straight segments between the same two lines cross exactly when their ends swap order; sharing an
 * end is not a crossing). O(Σ segments² per band), for tests and assertions on small diagrams.
 */
import type {Digraph} from '../graph/digraph.ts'
import type {LevelItem} from './level-planarity.ts'

export type LevelDrawingCheck = {ok: true} | {ok: false; reason: string}

export function checkLevelDrawing(graph: Digraph, level: ArrayLike<number>, orders: readonly (readonly LevelItem[])[]): LevelDrawingCheck {
  const vertexAt = new Map<number, number>()
  /** `edge,level` → position. */
  const edgeAt = new Map<string, number>()
  for (let l = 0; l < orders.length; l++) {
    const order = orders[l]!
    for (let position = 0; position < order.length; position++) {
      const item = order[position]!
      if (item.kind === 'vertex') {
        if (level[item.vertex] !== l || vertexAt.has(item.vertex)) return {ok: false, reason: `vertex ${item.vertex} is misplaced on level ${l}`}
        vertexAt.set(item.vertex, position)
      } else {
        const key = `${item.edge},${l}`
        if (edgeAt.has(key)) return {ok: false, reason: `edge ${item.edge} is twice on level ${l}`}
        edgeAt.set(key, position)
      }
    }
  }
  let items = 0
  for (const order of orders) items += order.length
  let expected = graph.vertexCount
  for (let v = 0; v < graph.vertexCount; v++) {
    if (!vertexAt.has(v)) return {ok: false, reason: `vertex ${v} is not on level ${level[v]}`}
  }
  for (let e = 0; e < graph.edgeCount; e++) {
    const a = level[graph.tail[e]!]!
    const b = level[graph.head[e]!]!
    if (b <= a) return {ok: false, reason: `edge ${e} does not go up`}
    for (let l = a + 1; l < b; l++) {
      expected++
      if (!edgeAt.has(`${e},${l}`)) return {ok: false, reason: `edge ${e} is missing on level ${l}`}
    }
  }
  if (items !== expected) return {ok: false, reason: `the orders hold ${items} items, expected ${expected}`}
  const at = (e: number, l: number): number => {
    if (level[graph.tail[e]!] === l) return vertexAt.get(graph.tail[e]!)!
    if (level[graph.head[e]!] === l) return vertexAt.get(graph.head[e]!)!
    return edgeAt.get(`${e},${l}`)!
  }
  for (let l = 0; l + 1 < orders.length; l++) {
    const band: number[] = []
    for (let e = 0; e < graph.edgeCount; e++) if (level[graph.tail[e]!]! <= l && level[graph.head[e]!]! >= l + 1) band.push(e)
    for (let i = 0; i < band.length; i++) {
      for (let j = i + 1; j < band.length; j++) {
        const s = band[i]!
        const t = band[j]!
        if ((at(s, l) - at(t, l)) * (at(s, l + 1) - at(t, l + 1)) < 0) return {ok: false, reason: `edges ${s} and ${t} cross between levels ${l} and ${l + 1}`}
      }
    }
  }
  return {ok: true}
}
