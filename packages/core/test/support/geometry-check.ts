/**
 * Independent geometric checker for layouts (tests only). Exact: orientation signs come from
 * robust-predicates (Shewchuk's adaptive-precision orient2d, ported to JS), comparisons of coordinates
 * are plain float comparisons, which are exact. Shares no code with the layout.
 *
 * What a valid drawing of G is, precisely (flow direction f: up = -y, down = +y, right = +x, left = -x):
 * 1. One node per vertex (finite centre, positive size, at least the requested box size when given) and
 *    one polyline per edge with at least two finite points; all inside [0, width] x [0, height] (the only
 *    check with a tolerance, 1e-9 relative, because the layout translates by a float).
 * 2. Upward: every segment of every polyline strictly increases the coordinate along f.
 * 3. Ports: the first point lies on the tail box's side facing f (e.g. the top side for up: y equals
 *    centre - height/2 and x within the side, ends included); the last point on the head box's side
 *    facing against f.
 * 4. Boxes: no two closed boxes meet.
 * 5. Edges and boxes: a polyline meets no closed box other than its tail and head boxes; it meets its
 *    tail box only in its first point and its head box only in its last point.
 * 6. Edges and edges: the polylines of two distinct edges are disjoint, with one exception: two edges
 *    with a common end vertex v may share their end point at v (one port used by both); then their
 *    polylines meet in that point only.
 */
import {orient2d} from 'robust-predicates'
import type {Digraph} from '../../src/graph/digraph.ts'
import type {BoxSize, Flow, Layout} from '../../src/layout/index.ts'

export type DrawingCheck = {ok: true} | {ok: false; problems: string[]}

interface Rect {
  x0: number
  y0: number
  x1: number
  y1: number
}

const sign = (v: number): number => (v > 0 ? 1 : v < 0 ? -1 : 0)

function along(flow: Flow, p: readonly [number, number]): number {
  return flow === 'up' ? -p[1] : flow === 'down' ? p[1] : flow === 'right' ? p[0] : -p[0]
}

function onClosedSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by)
}

/** Closed segments ab and cd have a common point (exact). */
export function segmentsMeet(
  ax: number, ay: number, bx: number, by: number,
  cx: number, cy: number, dx: number, dy: number
): boolean {
  const o1 = sign(orient2d(ax, ay, bx, by, cx, cy))
  const o2 = sign(orient2d(ax, ay, bx, by, dx, dy))
  const o3 = sign(orient2d(cx, cy, dx, dy, ax, ay))
  const o4 = sign(orient2d(cx, cy, dx, dy, bx, by))
  if (o1 * o2 < 0 && o3 * o4 < 0) return true
  if (o1 === 0 && onClosedSegment(ax, ay, bx, by, cx, cy)) return true
  if (o2 === 0 && onClosedSegment(ax, ay, bx, by, dx, dy)) return true
  if (o3 === 0 && onClosedSegment(cx, cy, dx, dy, ax, ay)) return true
  if (o4 === 0 && onClosedSegment(cx, cy, dx, dy, bx, by)) return true
  return false
}

function inRect(r: Rect, x: number, y: number): boolean {
  return r.x0 <= x && x <= r.x1 && r.y0 <= y && y <= r.y1
}

/** Closed segment ab meets closed rectangle r (exact). */
export function segmentMeetsRect(ax: number, ay: number, bx: number, by: number, r: Rect): boolean {
  if (inRect(r, ax, ay) || inRect(r, bx, by)) return true
  return (
    segmentsMeet(ax, ay, bx, by, r.x0, r.y0, r.x1, r.y0) ||
    segmentsMeet(ax, ay, bx, by, r.x1, r.y0, r.x1, r.y1) ||
    segmentsMeet(ax, ay, bx, by, r.x1, r.y1, r.x0, r.y1) ||
    segmentsMeet(ax, ay, bx, by, r.x0, r.y1, r.x0, r.y0)
  )
}

/**
 * Candidate pairs of items whose bounding boxes meet, from a uniform grid; each pair is reported once
 * (in the cell holding the lower corner of the two boxes' intersection).
 */
function overlappingPairs(boxes: Rect[], visit: (i: number, j: number) => void): void {
  const count = boxes.length
  if (count < 2) return
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity
  for (const b of boxes) {
    minX = Math.min(minX, b.x0); minY = Math.min(minY, b.y0)
    maxX = Math.max(maxX, b.x1); maxY = Math.max(maxY, b.y1)
  }
  const span = Math.max(maxX - minX, maxY - minY, 1)
  const side = Math.max(1, Math.ceil(Math.sqrt(count)))
  const cell = span / side + 1e-9
  const cells = new Map<number, number[]>()
  const cx = (x: number): number => Math.min(side, Math.floor((x - minX) / cell))
  const cy = (y: number): number => Math.min(side, Math.floor((y - minY) / cell))
  for (let i = 0; i < count; i++) {
    const b = boxes[i]!
    for (let gx = cx(b.x0); gx <= cx(b.x1); gx++) {
      for (let gy = cy(b.y0); gy <= cy(b.y1); gy++) {
        const k = gx * (side + 1) + gy
        let list = cells.get(k)
        if (!list) cells.set(k, (list = []))
        list.push(i)
      }
    }
  }
  for (const [k, list] of cells) {
    const gx = Math.floor(k / (side + 1))
    const gy = k % (side + 1)
    for (let a = 0; a < list.length; a++) {
      const i = list[a]!
      const bi = boxes[i]!
      for (let b = a + 1; b < list.length; b++) {
        const j = list[b]!
        const bj = boxes[j]!
        if (bi.x1 < bj.x0 || bj.x1 < bi.x0 || bi.y1 < bj.y0 || bj.y1 < bi.y0) continue
        if (cx(Math.max(bi.x0, bj.x0)) !== gx || cy(Math.max(bi.y0, bj.y0)) !== gy) continue
        visit(i, j)
      }
    }
  }
}

export function checkDrawing(
  graph: Digraph,
  layout: Layout,
  options: {boxes?: ReadonlyArray<BoxSize>; maxProblems?: number} = {}
): DrawingCheck {
  const problems: string[] = []
  const limit = options.maxProblems ?? 20
  const report = (p: string): void => {
    if (problems.length < limit) problems.push(p)
  }
  const n = graph.vertexCount
  const m = graph.edgeCount
  const flow = layout.flow
  const finite = (v: number): boolean => Number.isFinite(v)

  // 1. Structure.
  const rects: Array<Rect | undefined> = new Array(n)
  for (const node of layout.nodes) {
    const v = node.vertex
    if (!(Number.isInteger(v) && v >= 0 && v < n)) { report(`node for unknown vertex ${v}`); continue }
    if (rects[v]) { report(`vertex ${v} has two nodes`); continue }
    if (![node.x, node.y, node.width, node.height].every(finite) || !(node.width > 0 && node.height > 0)) {
      report(`vertex ${v}: bad box ${JSON.stringify(node)}`)
      continue
    }
    const want = options.boxes?.[v]
    if (want && (node.width < want.width || node.height < want.height)) {
      report(`vertex ${v}: box ${node.width}x${node.height} smaller than its label box ${want.width}x${want.height}`)
    }
    rects[v] = {x0: node.x - node.width / 2, x1: node.x + node.width / 2, y0: node.y - node.height / 2, y1: node.y + node.height / 2}
  }
  for (let v = 0; v < n; v++) if (!rects[v]) report(`vertex ${v} has no node`)
  const polylines: Array<Array<[number, number]> | undefined> = new Array(m)
  for (const edge of layout.edges) {
    const e = edge.edge
    if (!(Number.isInteger(e) && e >= 0 && e < m)) { report(`polyline for unknown edge ${e}`); continue }
    if (polylines[e]) { report(`edge ${e} drawn twice`); continue }
    if (edge.points.length < 2 || !edge.points.every((p) => p.length === 2 && finite(p[0]) && finite(p[1]))) {
      report(`edge ${e}: needs at least two finite points`)
      continue
    }
    polylines[e] = edge.points
  }
  for (let e = 0; e < m; e++) if (!polylines[e]) report(`edge ${e} is not drawn`)
  if (problems.length > 0) return {ok: false, problems}

  const tol = 1e-9 * Math.max(1, layout.width, layout.height)
  const inside = (x: number, y: number): boolean => x >= -tol && y >= -tol && x <= layout.width + tol && y <= layout.height + tol
  for (let v = 0; v < n; v++) {
    const r = rects[v]!
    if (!inside(r.x0, r.y0) || !inside(r.x1, r.y1)) report(`vertex ${v}: box outside the ${layout.width}x${layout.height} drawing`)
  }

  // 2. Upward, 3. ports.
  for (let e = 0; e < m; e++) {
    const pts = polylines[e]!
    for (const [x, y] of pts) if (!inside(x, y)) { report(`edge ${e}: point (${x}, ${y}) outside the drawing`); break }
    for (let i = 1; i < pts.length; i++) {
      if (!(along(flow, pts[i]!) > along(flow, pts[i - 1]!))) {
        report(`edge ${e}: segment ${i - 1} does not point ${flow} (${pts[i - 1]} -> ${pts[i]})`)
      }
    }
    const t = rects[graph.tail[e]!]!
    const h = rects[graph.head[e]!]!
    const [fx, fy] = pts[0]!
    const [lx, ly] = pts[pts.length - 1]!
    const onSide = (r: Rect, x: number, y: number, side: 'top' | 'bottom' | 'left' | 'right'): boolean =>
      side === 'top' ? y === r.y0 && r.x0 <= x && x <= r.x1
        : side === 'bottom' ? y === r.y1 && r.x0 <= x && x <= r.x1
          : side === 'left' ? x === r.x0 && r.y0 <= y && y <= r.y1
            : x === r.x1 && r.y0 <= y && y <= r.y1
    const outSide = flow === 'up' ? 'top' : flow === 'down' ? 'bottom' : flow === 'right' ? 'right' : 'left'
    const inSide = flow === 'up' ? 'bottom' : flow === 'down' ? 'top' : flow === 'right' ? 'left' : 'right'
    if (!onSide(t, fx, fy, outSide)) report(`edge ${e}: first point (${fx}, ${fy}) not on the ${outSide} side of its tail box`)
    if (!onSide(h, lx, ly, inSide)) report(`edge ${e}: last point (${lx}, ${ly}) not on the ${inSide} side of its head box`)
  }

  // Items for the pair search: boxes 0..n-1, then segments.
  const items: Rect[] = rects.map((r) => r!)
  const segEdge: number[] = []
  const segIndex: number[] = []
  for (let e = 0; e < m; e++) {
    const pts = polylines[e]!
    for (let i = 1; i < pts.length; i++) {
      const [ax, ay] = pts[i - 1]!
      const [bx, by] = pts[i]!
      items.push({x0: Math.min(ax, bx), x1: Math.max(ax, bx), y0: Math.min(ay, by), y1: Math.max(ay, by)})
      segEdge.push(e)
      segIndex.push(i - 1)
    }
  }
  const seg = (k: number): [number, number, number, number] => {
    const pts = polylines[segEdge[k]!]!
    const i = segIndex[k]!
    return [pts[i]![0], pts[i]![1], pts[i + 1]![0], pts[i + 1]![1]]
  }

  overlappingPairs(items, (i, j) => {
    if (i > j) [i, j] = [j, i]
    if (j < n) {
      // 4. Two boxes whose bounding boxes meet do meet (they are their own bounding boxes).
      report(`boxes of vertices ${i} and ${j} overlap or touch`)
      return
    }
    const kj = j - n
    const ej = segEdge[kj]!
    const [ax, ay, bx, by] = seg(kj)
    if (i < n) {
      // 5. A segment and a box.
      const pts = polylines[ej]!
      const first = segIndex[kj] === 0
      const last = segIndex[kj] === pts.length - 2
      if ((i === graph.tail[ej] && first) || (i === graph.head[ej] && last)) {
        // The end point is on the box's side (3) and the segment strictly increases along the flow
        // (2), so every other point of the segment is strictly beyond that side's line while the box
        // is not: the segment meets this box in its end point only. (Tail and head differ: G is acyclic.)
        return
      }
      if (segmentMeetsRect(ax, ay, bx, by, items[i]!)) {
        report(`edge ${ej} (segment ${segIndex[kj]}) meets the box of vertex ${i}`)
      }
      return
    }
    // 6. Two segments.
    const ki = i - n
    const ei = segEdge[ki]!
    if (ei === ej) return // one strictly monotone polyline never meets itself away from its joints
    const [cx, cy, dx, dy] = seg(ki)
    if (!segmentsMeet(ax, ay, bx, by, cx, cy, dx, dy)) return
    // Allowed: a port shared by two edges with a common end vertex, and nothing else.
    const pi = polylines[ei]!
    const pj = polylines[ej]!
    const ends = (e: number, pts: Array<[number, number]>, k: number): Array<[number, [number, number]]> => {
      const out: Array<[number, [number, number]]> = []
      if (segIndex[k] === 0) out.push([graph.tail[e]!, pts[0]!])
      if (segIndex[k] === pts.length - 2) out.push([graph.head[e]!, pts[pts.length - 1]!])
      return out
    }
    for (const [vi, p] of ends(ei, pi, ki)) {
      for (const [vj, q] of ends(ej, pj, kj)) {
        if (vi !== vj || p[0] !== q[0] || p[1] !== q[1]) continue
        // Both segments start at p; they meet elsewhere only if collinear (then they overlap, both
        // leaving p in the flow direction).
        const oi = p[0] === cx && p[1] === cy ? [dx, dy] : [cx, cy]
        const oj = p[0] === ax && p[1] === ay ? [bx, by] : [ax, ay]
        if (orient2d(p[0], p[1], oi[0]!, oi[1]!, oj[0]!, oj[1]!) !== 0) return
      }
    }
    report(`edges ${ei} and ${ej} meet (segments ${segIndex[ki]} and ${segIndex[kj]})`)
  })

  return problems.length === 0 ? {ok: true} : {ok: false, problems}
}
