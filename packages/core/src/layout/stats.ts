/**
 * Figures of a drawing: area, aspect ratio, bends, total edge length, and crossings counted
 * geometrically (for comparing with other layouts; ours are crossing-free by construction).
 *
 * Crossings: pairs of segments from different edges that meet, candidates from a uniform grid of
 * about S cells for S segments; O(S + C + P) for C cell entries and P candidate pairs sharing a cell. Plain floating-point orientation tests: this is a measurement, not a
 * proof (the tests check our drawings with exact predicates). Two edges that share an end vertex and
 * meet exactly at a common end point of both (a shared port) do not count.
 */
import type {Layout} from './types.ts'

export interface LayoutStats {
  area: number
  /** width / height (1 for an empty drawing). */
  aspectRatio: number
  /** Interior points of all edge polylines. */
  bends: number
  totalEdgeLength: number
  crossings: number
}

export function layoutStats(layout: Layout): LayoutStats {
  let bends = 0
  for (const {points} of layout.edges) bends += Math.max(0, points.length - 2)
  return {
    area: layout.width * layout.height,
    aspectRatio: layout.height > 0 ? layout.width / layout.height : 1,
    bends,
    totalEdgeLength: totalEdgeLength(layout),
    crossings: countCrossings(layout),
  }
}

/** The summed length of every edge's polyline. O(points). */
export function totalEdgeLength(layout: Layout): number {
  let length = 0
  for (const {points} of layout.edges) {
    for (let i = 1; i < points.length; i++) length += Math.hypot(points[i]![0] - points[i - 1]![0], points[i]![1] - points[i - 1]![1])
  }
  return length
}

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  const d = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
  return d > 0 ? 1 : d < 0 ? -1 : 0
}

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by)
}

/** Closed segments ab and cd meet. */
function meet(s: Float64Array, i: number, j: number): boolean {
  const ax = s[4 * i]!, ay = s[4 * i + 1]!, bx = s[4 * i + 2]!, by = s[4 * i + 3]!
  const cx = s[4 * j]!, cy = s[4 * j + 1]!, dx = s[4 * j + 2]!, dy = s[4 * j + 3]!
  const o1 = orient(ax, ay, bx, by, cx, cy)
  const o2 = orient(ax, ay, bx, by, dx, dy)
  const o3 = orient(cx, cy, dx, dy, ax, ay)
  const o4 = orient(cx, cy, dx, dy, bx, by)
  if (o1 !== o2 && o3 !== o4 && o1 !== 0 && o2 !== 0 && o3 !== 0 && o4 !== 0) return true
  if (o1 === 0 && onSegment(ax, ay, bx, by, cx, cy)) return true
  if (o2 === 0 && onSegment(ax, ay, bx, by, dx, dy)) return true
  if (o3 === 0 && onSegment(cx, cy, dx, dy, ax, ay)) return true
  if (o4 === 0 && onSegment(cx, cy, dx, dy, bx, by)) return true
  return o1 * o2 < 0 && o3 * o4 < 0
}

export function countCrossings(layout: Layout): number {
  const segs: number[] = []
  const owner: number[] = []
  const endIndex: number[] = [] // bit 1: first segment of its polyline, bit 2: last
  for (let k = 0; k < layout.edges.length; k++) {
    const pts = layout.edges[k]!.points
    for (let i = 1; i < pts.length; i++) {
      segs.push(pts[i - 1]![0], pts[i - 1]![1], pts[i]![0], pts[i]![1])
      owner.push(k)
      endIndex.push((i === 1 ? 1 : 0) | (i === pts.length - 1 ? 2 : 0))
    }
  }
  const s = Float64Array.from(segs)
  const count = owner.length
  if (count < 2) return 0
  // Uniform grid over the segments' bounding boxes, about one cell per segment; a pair is tested in
  // the one cell holding the lower corner of the intersection of their bounding boxes.
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity
  for (let i = 0; i < count; i++) {
    minX = Math.min(minX, s[4 * i]!, s[4 * i + 2]!)
    maxX = Math.max(maxX, s[4 * i]!, s[4 * i + 2]!)
    minY = Math.min(minY, s[4 * i + 1]!, s[4 * i + 3]!)
    maxY = Math.max(maxY, s[4 * i + 1]!, s[4 * i + 3]!)
  }
  const side = Math.max(1, Math.ceil(Math.sqrt(count)))
  const cw = (maxX - minX) / side || 1
  const ch = (maxY - minY) / side || 1
  const cellX = (x: number): number => Math.min(side - 1, Math.floor((x - minX) / cw))
  const cellY = (y: number): number => Math.min(side - 1, Math.floor((y - minY) / ch))
  const cells = new Map<number, number[]>()
  const box = (i: number): [number, number, number, number] => [
    Math.min(s[4 * i]!, s[4 * i + 2]!), Math.min(s[4 * i + 1]!, s[4 * i + 3]!),
    Math.max(s[4 * i]!, s[4 * i + 2]!), Math.max(s[4 * i + 1]!, s[4 * i + 3]!),
  ]
  for (let i = 0; i < count; i++) {
    const [x0, y0, x1, y1] = box(i)
    for (let gx = cellX(x0); gx <= cellX(x1); gx++) {
      for (let gy = cellY(y0); gy <= cellY(y1); gy++) {
        const key = gx * side + gy
        let list = cells.get(key)
        if (!list) cells.set(key, (list = []))
        list.push(i)
      }
    }
  }
  let crossings = 0
  for (const [key, list] of cells) {
    const gx = Math.floor(key / side)
    const gy = key % side
    for (let a = 0; a < list.length; a++) {
      const i = list[a]!
      const bi = box(i)
      for (let b = a + 1; b < list.length; b++) {
        const j = list[b]!
        if (owner[j] === owner[i]) continue
        const bj = box(j)
        if (bi[2] < bj[0] || bj[2] < bi[0] || bi[3] < bj[1] || bj[3] < bi[1]) continue
        if (cellX(Math.max(bi[0], bj[0])) !== gx || cellY(Math.max(bi[1], bj[1])) !== gy) continue
        if (!meet(s, i, j)) continue
        if (sharedPort(s, i, j, endIndex[i]!, endIndex[j]!)) continue
        crossings++
      }
    }
  }
  return crossings
}

/**
 * Segments i and j meet only at a point that ends both polylines (a port shared by two edges at the
 * same vertex): ends equal and the segments not collinear.
 */
function sharedPort(s: Float64Array, i: number, j: number, endsI: number, endsJ: number): boolean {
  const endsOf = (k: number, ends: number): Array<[number, number]> => {
    const out: Array<[number, number]> = []
    if (ends & 1) out.push([s[4 * k]!, s[4 * k + 1]!])
    if (ends & 2) out.push([s[4 * k + 2]!, s[4 * k + 3]!])
    return out
  }
  for (const [px, py] of endsOf(i, endsI)) {
    for (const [qx, qy] of endsOf(j, endsJ)) {
      if (px !== qx || py !== qy) continue
      const ax = s[4 * i]! === px && s[4 * i + 1]! === py ? s[4 * i + 2]! : s[4 * i]!
      const ay = s[4 * i]! === px && s[4 * i + 1]! === py ? s[4 * i + 3]! : s[4 * i + 1]!
      const bx = s[4 * j]! === qx && s[4 * j + 1]! === qy ? s[4 * j + 2]! : s[4 * j]!
      const by = s[4 * j]! === qx && s[4 * j + 1]! === qy ? s[4 * j + 3]! : s[4 * j + 1]!
      return orient(px, py, ax, ay, bx, by) !== 0
    }
  }
  return false
}
