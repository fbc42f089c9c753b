/**
 * Figures of a drawing: area, aspect ratio, bends, total edge length, and crossings counted
 * geometrically (for comparing with other layouts; ours are crossing-free by construction).
 *
 * Crossings: pairs of segments from different edges that meet, found with a sweep over x (segments
 * sorted by their left end, an active list pruned by right end); O(S log S + P) for S segments and P
 * pairs whose x-ranges overlap. Plain floating-point orientation tests: this is a measurement, not a
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
  let length = 0
  for (const {points} of layout.edges) {
    bends += Math.max(0, points.length - 2)
    for (let i = 1; i < points.length; i++) {
      length += Math.hypot(points[i]![0] - points[i - 1]![0], points[i]![1] - points[i - 1]![1])
    }
  }
  return {
    area: layout.width * layout.height,
    aspectRatio: layout.height > 0 ? layout.width / layout.height : 1,
    bends,
    totalEdgeLength: length,
    crossings: countCrossings(layout),
  }
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
  const endIndex: number[] = [] // 0 first segment, 2 last, 1 middle, 3 only segment
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
  const order = Array.from({length: count}, (_, i) => i).sort(
    (a, b) => Math.min(s[4 * a]!, s[4 * a + 2]!) - Math.min(s[4 * b]!, s[4 * b + 2]!)
  )
  let active: number[] = []
  let crossings = 0
  for (const i of order) {
    const minX = Math.min(s[4 * i]!, s[4 * i + 2]!)
    active = active.filter((j) => Math.max(s[4 * j]!, s[4 * j + 2]!) >= minX)
    const iy0 = Math.min(s[4 * i + 1]!, s[4 * i + 3]!)
    const iy1 = Math.max(s[4 * i + 1]!, s[4 * i + 3]!)
    for (const j of active) {
      if (owner[j] === owner[i]) continue
      if (Math.max(s[4 * j + 1]!, s[4 * j + 3]!) < iy0 || Math.min(s[4 * j + 1]!, s[4 * j + 3]!) > iy1) continue
      if (!meet(s, i, j)) continue
      if (sharedPort(s, i, j, endIndex[i]!, endIndex[j]!)) continue
      crossings++
    }
    active.push(i)
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
