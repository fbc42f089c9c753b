/**
 * Edge shapes: rounding the bends must keep what the layout guarantees. A quadratic Bézier lies in the
 * convex hull of its control points (a textbook property of Bézier curves), so each rounded corner
 * stays within the corner's triangle; these tests sample the drawn path and check it against the
 * polyline.
 */
import fc from 'fast-check'
import {describe, expect, it} from 'vitest'
import {edgeShape, type Pt} from '../src/geometry.ts'

const style = {bendRadius: 10, arrowLength: 10, arrowWidth: 8}

/** Sample points along path data made of absolute M, L and Q commands (what edgeShape writes). */
function sample(d: string): Array<[number, number]> {
  const tokens = d.match(/[MLQZ]|-?\d+(?:\.\d+)?/g)!
  const out: Array<[number, number]> = []
  let i = 0
  let cur: [number, number] = [0, 0]
  const num = (): number => Number(tokens[i++])
  while (i < tokens.length) {
    const cmd = tokens[i++]
    if (cmd === 'M' || cmd === 'L') {
      const next: [number, number] = [num(), num()]
      if (cmd === 'L') for (let k = 1; k <= 8; k++) out.push([cur[0] + ((next[0] - cur[0]) * k) / 8, cur[1] + ((next[1] - cur[1]) * k) / 8])
      else out.push(next)
      cur = next
    } else if (cmd === 'Q') {
      const c: [number, number] = [num(), num()]
      const next: [number, number] = [num(), num()]
      for (let k = 1; k <= 16; k++) {
        const t = k / 16
        const u = 1 - t
        out.push([u * u * cur[0] + 2 * u * t * c[0] + t * t * next[0], u * u * cur[1] + 2 * u * t * c[1] + t * t * next[1]])
      }
      cur = next
    }
  }
  return out
}

function distanceToPolyline(p: readonly [number, number], line: ReadonlyArray<Pt>): number {
  let best = Infinity
  for (let i = 0; i + 1 < line.length; i++) {
    const [ax, ay] = line[i]!
    const [bx, by] = line[i + 1]!
    const len2 = (bx - ax) ** 2 + (by - ay) ** 2
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - ax) * (bx - ax) + (p[1] - ay) * (by - ay)) / len2))
    best = Math.min(best, Math.hypot(p[0] - ax - t * (bx - ax), p[1] - ay - t * (by - ay)))
  }
  return best
}

/** Random polylines that go strictly upward (y decreasing), like an edge of a flow-up layout. */
const upwardPolyline = fc
  .array(fc.tuple(fc.integer({min: -200, max: 200}), fc.integer({min: 4, max: 120})), {minLength: 1, maxLength: 6})
  .map((steps) => {
    const pts: Pt[] = [[0, 0]]
    for (const [dx, dy] of steps) {
      const [x, y] = pts[pts.length - 1]!
      pts.push([x + dx, y - dy])
    }
    return pts
  })

describe('edgeShape', () => {
  it('draws a straight edge as one segment ending inside the arrowhead', () => {
    const shape = edgeShape([[50, 100], [50, 20]], style, 2)
    expect(shape.line).toBe('M50 100L50 26')
    expect(shape.arrow).toBe('M50 20L54 30L50 26L46 30Z')
  })

  it('rounds an orthogonal bend with a quadratic corner at the bend point', () => {
    const shape = edgeShape([[0, 100], [0, 60], [40, 60], [40, 0]], style, 2)
    expect(shape.line).toBe('M0 100L0 70Q0 60 10 60L30 60Q40 60 40 50L40 6')
  })

  it('keeps every upward polyline upward and close to its polyline once rounded (fast-check, seeded)', () => {
    fc.assert(
      fc.property(upwardPolyline, (pts) => {
        const shape = edgeShape(pts, style, 6)
        const samples = sample(shape.line)
        // starts where the polyline starts
        expect(samples[0]![0]).toBeCloseTo(pts[0]![0], 5)
        expect(samples[0]![1]).toBeCloseTo(pts[0]![1], 5)
        for (let k = 1; k < samples.length; k++) expect(samples[k]![1]).toBeLessThanOrEqual(samples[k - 1]![1] + 1e-6)
        for (const p of samples) expect(distanceToPolyline(p, pts)).toBeLessThanOrEqual(style.bendRadius / 2 + 1e-6)
        // the arrowhead's tip is the polyline's last point
        const tip = shape.arrow.match(/^M(-?[\d.]+) (-?[\d.]+)/)!
        expect(Number(tip[1])).toBeCloseTo(pts[pts.length - 1]![0], 5)
        expect(Number(tip[2])).toBeCloseTo(pts[pts.length - 1]![1], 5)
      }),
      {seed: 11, numRuns: 300}
    )
  })

  it('ignores repeated points and draws nothing for a point', () => {
    expect(edgeShape([[0, 10], [0, 10], [0, 0]], style, 2).line).toBe('M0 10L0 6')
    expect(edgeShape([[3, 3], [3, 3]], style, 2)).toEqual({line: '', arrow: ''})
  })
})
