/**
 * Edge paths: the layout's polyline with its bends rounded, and an arrowhead drawn as its own filled
 * path at the head end (no <marker>, so no id references and the same look in every renderer).
 * The polyline stays the geometry that the layout's checks see; rounding only cuts each bend's
 * corner inside the triangle it spans, and the cut never reaches past half of an inner segment.
 */
import {formatNumber} from './number.ts'

export type Pt = readonly [number, number]

export interface EdgeStyle {
  /** Largest corner radius at a bend, px. */
  bendRadius: number
  /** Arrowhead length along the edge, px. */
  arrowLength: number
  /** Arrowhead width across the edge, px. */
  arrowWidth: number
}

export const DEFAULT_EDGE_STYLE: Readonly<EdgeStyle> = {bendRadius: 10, arrowLength: 10, arrowWidth: 8}

/** Drop consecutive repeats, which have no direction. */
function dedupe(points: ReadonlyArray<Pt>): Pt[] {
  const out: Pt[] = []
  for (const p of points) {
    const last = out[out.length - 1]
    if (!last || last[0] !== p[0] || last[1] !== p[1]) out.push(p)
  }
  return out
}

function unit(from: Pt, to: Pt): [number, number, number] {
  const dx = to[0] - from[0]
  const dy = to[1] - from[1]
  const length = Math.hypot(dx, dy)
  return [dx / length, dy / length, length]
}

export interface EdgeShape {
  /** Path data of the line (stroke only). */
  line: string
  /** Path data of the arrowhead (fill only), or '' for an edge with no length. */
  arrow: string
}

/**
 * The line and arrowhead for a polyline from tail to head. The line stops inside the arrowhead
 * (60% of its length back from the tip) so the stroke never shows past the point.
 */
export function edgeShape(polyline: ReadonlyArray<Pt>, style: Readonly<EdgeStyle>, precision: number): EdgeShape {
  const pts = dedupe(polyline)
  const f = (v: number): string => formatNumber(v, precision)
  if (pts.length < 2) return {line: '', arrow: ''}

  const tip = pts[pts.length - 1]!
  const [ux, uy, lastLength] = unit(pts[pts.length - 2]!, tip)
  const back: Pt = [tip[0] - ux * style.arrowLength, tip[1] - uy * style.arrowLength]
  const half = style.arrowWidth / 2
  const notchDepth = style.arrowLength * 0.6
  const notch: Pt = [tip[0] - ux * notchDepth, tip[1] - uy * notchDepth]
  // Wings sit at the back, either side; the notch gives the head a shallow swallow-tail.
  const arrow =
    `M${f(tip[0])} ${f(tip[1])}L${f(back[0] - uy * half)} ${f(back[1] + ux * half)}` +
    `L${f(notch[0])} ${f(notch[1])}L${f(back[0] + uy * half)} ${f(back[1] - ux * half)}Z`

  // Shorten the line to end inside the head; if the last segment is shorter than that, end at its start.
  const cut = Math.min(notchDepth, lastLength)
  const end: Pt = [tip[0] - ux * cut, tip[1] - uy * cut]
  const path = dedupe([...pts.slice(0, -1), end])

  let d = `M${f(path[0]![0])} ${f(path[0]![1])}`
  for (let i = 1; i < path.length - 1; i++) {
    const a = path[i - 1]!
    const b = path[i]!
    const c = path[i + 1]!
    const [ix, iy, inLength] = unit(a, b)
    const [ox, oy, outLength] = unit(b, c)
    const turn = ix * oy - iy * ox
    if (Math.abs(turn) < 1e-9 && ix * ox + iy * oy > 0) continue // straight through: no corner
    // An end segment may be used in full, an inner one only up to its middle (its other corner needs the rest).
    const inRoom = i - 1 === 0 ? inLength : inLength / 2
    const outRoom = i + 1 === path.length - 1 ? outLength : outLength / 2
    const r = Math.min(style.bendRadius, inRoom, outRoom)
    d += `L${f(b[0] - ix * r)} ${f(b[1] - iy * r)}Q${f(b[0])} ${f(b[1])} ${f(b[0] + ox * r)} ${f(b[1] + oy * r)}`
  }
  const last = path[path.length - 1]!
  d += `L${f(last[0])} ${f(last[1])}`
  return {line: d, arrow}
}
