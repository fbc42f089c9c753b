/**
 * Cross-flow coordinates for a layered graph whose per-layer orders are fixed.
 *
 * Minimises the quadratic energy sum over drawn segments of w * (x(a) + port(a) - x(b) - port(b))^2
 * (a segment joins two objects on consecutive layers; ports are fixed offsets along a box side)
 * subject to the order and the minimum separations inside each layer:
 * x(next) - x(prev) >= half(prev) + half(next) + gap. The weights follow the priorities of Gansner,
 * Koutsofios, North, Vo (IEEE TSE 1993, sec. 4): 1 between two boxes, 2 between a box and a bend, 8
 * between two bends, so long edges straighten first.
 *
 * The minimisation is block coordinate descent over layers, sweeping up then down: with the other
 * layers fixed, one layer's problem is min sum W_i (x_i - d_i)^2 with x_{i+1} - x_i >= sep_i, which the
 * substitution y_i = x_i - (sep_0 + ... + sep_{i-1}) turns into weighted isotonic regression, solved
 * exactly in linear time by the pool-adjacent-violators algorithm (Ayer, Brunk, Ewing, Reid, Silverman,
 * Ann. Math. Stat. 26, 1955; Best & Chakravarti, Math. Programming 47, 1990). Each layer step cannot
 * raise the energy, and every intermediate state keeps the orders and separations, so the number of
 * sweeps trades quality for time only, never correctness.
 *
 * The start is the caller's guess of each object's place across the flow, shrunk to the widest
 * layer's packed width when it is wider (see below). Starting compact matters for the area: before
 * that, the width of large drawings was mostly an echo of the start's.
 *
 * The least width any coordinates with the orders can have is the widest layer packed. When the sweeps
 * leave the drawing wider, every layer is clamped into a window that wide and a few more sweeps run
 * inside it (each layer's bounded problem is the isotonic one with its solution clamped), so the
 * drawing is as narrow as its orders allow; this lowered the area on the North DAGs
 * (bench/README.md, Layout) at the cost of more slanted edges.
 *
 * A last few passes move single bends onto the line of a neighbouring segment where the separations
 * (and the window) allow, which merges the slight kinks the sweeps leave on long edges into straight runs.
 *
 * Time: O(objects + segments) per sweep, SWEEPS (+ WINDOW_SWEEPS) sweeps and STRAIGHTEN_PASSES passes.
 */

export interface LayeredGraph {
  /** Objects (boxes and bend points), each on one layer. */
  objectCount: number
  layers: ReadonlyArray<Int32Array>
  /** Half extent across the flow. */
  half: Float64Array
  isBox: Uint8Array
  /** Segments between objects on consecutive layers. */
  segLow: Int32Array
  segHigh: Int32Array
  segLowPort: Float64Array
  segHighPort: Float64Array
  segWeight: Float64Array
}

const SWEEPS = 24
/** Sweeps inside the narrower window, when the first ones spread wider than needed. */
const WINDOW_SWEEPS = 8
/** Straightening passes after the sweeps (see the end of assignCoordinates). */
const STRAIGHTEN_PASSES = 4
/** Pull towards the current place, so objects without segments stay put and weights never vanish. */
const ANCHOR = 1e-3

export function separation(lg: LayeredGraph, a: number, b: number, nodeGap: number, edgeGap: number): number {
  const gap = lg.isBox[a] && lg.isBox[b] ? nodeGap : edgeGap
  return lg.half[a]! + lg.half[b]! + gap
}

/** `initial`: a guess of each object's place across the flow (shrunk here if wider than needed). */
export function assignCoordinates(
  lg: LayeredGraph,
  initial: Float64Array,
  nodeGap: number,
  edgeGap: number
): Float64Array {
  const count = lg.objectCount
  const segCount = lg.segLow.length
  // Object -> incident segments (CSR).
  const start = new Int32Array(count + 1)
  for (let s = 0; s < segCount; s++) {
    start[lg.segLow[s]! + 1]!++
    start[lg.segHigh[s]! + 1]!++
  }
  for (let o = 0; o < count; o++) start[o + 1]! += start[o]!
  const fill = start.slice(0, count)
  const inc = new Int32Array(2 * segCount)
  for (let s = 0; s < segCount; s++) {
    inc[fill[lg.segLow[s]!]!++] = s
    inc[fill[lg.segHigh[s]!]!++] = s
  }

  const x = new Float64Array(count)
  let widest = 0
  for (const layer of lg.layers) widest = Math.max(widest, layer.length)
  const target = new Float64Array(widest)
  const weight = new Float64Array(widest)
  const offset = new Float64Array(widest)
  // Pool-adjacent-violators blocks.
  const blockW = new Float64Array(widest)
  const blockWT = new Float64Array(widest)
  const blockEnd = new Int32Array(widest)

  // Cumulative separations per layer position: constant over the sweeps, computed once.
  const offsetOf = new Float64Array(count)
  for (const layer of lg.layers) {
    let acc = 0
    for (let i = 0; i < layer.length; i++) {
      if (i > 0) acc += separation(lg, layer[i - 1]!, layer[i]!, nodeGap, edgeGap)
      offsetOf[layer[i]!] = acc
    }
  }

  // Bounds across the flow for every object's extent: none at first, `need` wide after the sweeps
  // if the drawing came out wider (see below).
  let windowLeft = -Infinity
  let windowRight = Infinity
  const solveLayer = (layer: Int32Array, useSegments: boolean): void => {
    const k = layer.length
    if (k === 0) return
    for (let i = 0; i < k; i++) {
      const o = layer[i]!
      const acc = offsetOf[o]!
      offset[i] = acc
      let w = ANCHOR
      let wt = ANCHOR * x[o]!
      for (let j = start[o]!, end = useSegments ? start[o + 1]! : start[o]!; j < end; j++) {
        const s = inc[j]!
        const sw = lg.segWeight[s]!
        // Where o would have to sit for this segment to be vertical.
        const want = lg.segLow[s] === o
          ? x[lg.segHigh[s]!]! + lg.segHighPort[s]! - lg.segLowPort[s]!
          : x[lg.segLow[s]!]! + lg.segLowPort[s]! - lg.segHighPort[s]!
        w += sw
        wt += sw * want
      }
      weight[i] = w
      target[i] = wt / w - acc
    }
    isotonic(k)
    // Inside a window, y = x - offset has the same bounds for the whole layer, and clamping the
    // isotonic solution to constant bounds gives the bounded optimum.
    const yLo = windowLeft + lg.half[layer[0]!]!
    const yHi = windowRight - lg.half[layer[k - 1]!]! - offset[k - 1]!
    let b = 0
    let i = 0
    while (i < k) {
      const mean = Math.min(yHi, Math.max(yLo, blockWT[b]! / blockW[b]!))
      for (; i < blockEnd[b]!; i++) x[layer[i]!] = mean + offset[i]!
      b++
    }
  }

  // Weighted isotonic regression of target[0..k) with weights weight[0..k), non-decreasing.
  const isotonic = (k: number): void => {
    let nb = 0
    for (let i = 0; i < k; i++) {
      blockW[nb] = weight[i]!
      blockWT[nb] = weight[i]! * target[i]!
      blockEnd[nb] = i + 1
      nb++
      while (nb > 1 && blockWT[nb - 2]! / blockW[nb - 2]! >= blockWT[nb - 1]! / blockW[nb - 1]!) {
        blockW[nb - 2]! += blockW[nb - 1]!
        blockWT[nb - 2]! += blockWT[nb - 1]!
        blockEnd[nb - 2] = blockEnd[nb - 1]!
        nb--
      }
    }
  }

  // Start: the initial guess, shrunk if it spans more than the widest layer needs, then projected
  // onto the constraints (weights ANCHOR only, so just the guess). The sweeps move objects only by
  // local averaging, so a spread-out start stays spread out for many sweeps (the energy does not
  // depend on a common shift, and pulling a wide drawing together takes a number of sweeps that
  // grows with its width); starting at most as wide as the widest layer lets the sweeps straighten
  // edges instead, and the separations widen whatever layer needs it.
  let need = 0
  for (const layer of lg.layers) {
    const k = layer.length
    if (k > 0) need = Math.max(need, offsetOf[layer[k - 1]!]! + lg.half[layer[0]!]! + lg.half[layer[k - 1]!]!)
  }
  let lo = Infinity
  let hi = -Infinity
  for (let o = 0; o < count; o++) {
    lo = Math.min(lo, initial[o]!)
    hi = Math.max(hi, initial[o]!)
  }
  const scale = hi - lo > need ? need / (hi - lo) : 1
  for (let o = 0; o < count; o++) x[o] = scale === 1 ? initial[o]! : (initial[o]! - lo) * scale
  for (const layer of lg.layers) solveLayer(layer, false)

  const L = lg.layers.length
  for (let sweep = 0; sweep < SWEEPS; sweep++) {
    if (sweep % 2 === 0) for (let r = 0; r < L; r++) solveLayer(lg.layers[r]!, true)
    else for (let r = L - 1; r >= 0; r--) solveLayer(lg.layers[r]!, true)
  }
  // No drawing with these orders can be narrower than `need`. If the sweeps spread wider, clamp
  // into a window that wide, centred on the drawing, and sweep again inside it, so edges straighten
  // as far as the narrower room allows.
  if (squeeze(lg, x, need, nodeGap, edgeGap)) {
    let lo = Infinity
    let hi = -Infinity
    for (let o = 0; o < count; o++) {
      lo = Math.min(lo, x[o]! - lg.half[o]!)
      hi = Math.max(hi, x[o]! + lg.half[o]!)
    }
    windowLeft = lo
    windowRight = hi
    for (let sweep = 0; sweep < WINDOW_SWEEPS; sweep++) {
      if (sweep % 2 === 0) for (let r = 0; r < L; r++) solveLayer(lg.layers[r]!, true)
      else for (let r = L - 1; r >= 0; r--) solveLayer(lg.layers[r]!, true)
    }
  }

  // Straightening: the sweeps leave long edges with many slight kinks (each a bend in the drawing).
  // Move each bend onto the line of one of its two segments' other ends (the nearer that fits) when
  // that place keeps the separations from both its neighbours in the layer: orders and separations
  // hold throughout, so this only merges kinks. Up, down, up, down.
  const want = (o: number, s: number): number =>
    lg.segLow[s] === o
      ? x[lg.segHigh[s]!]! + lg.segHighPort[s]! - lg.segLowPort[s]!
      : x[lg.segLow[s]!]! + lg.segLowPort[s]! - lg.segHighPort[s]!
  const straighten = (layer: Int32Array): void => {
    for (let i = 0; i < layer.length; i++) {
      const o = layer[i]!
      if (lg.isBox[o] || start[o + 1]! - start[o]! !== 2) continue
      const lo = i > 0 ? x[layer[i - 1]!]! + separation(lg, layer[i - 1]!, o, nodeGap, edgeGap) : windowLeft + lg.half[o]!
      const hi = i + 1 < layer.length ? x[layer[i + 1]!]! - separation(lg, o, layer[i + 1]!, nodeGap, edgeGap) : windowRight - lg.half[o]!
      const s0 = inc[start[o]!]!
      const s1 = inc[start[o]! + 1]!
      // Only along the edge's own chain of bends: next to a box, a slanted segment through a bend
      // already on its line reads as straight, and snapping would put a kink there.
      const bendEnd = (s: number): boolean => !lg.isBox[lg.segLow[s] === o ? lg.segHigh[s]! : lg.segLow[s]!]
      let a = bendEnd(s0) ? want(o, s0) : NaN
      let b = bendEnd(s1) ? want(o, s1) : NaN
      if (Number.isNaN(a) || Math.abs(b - x[o]!) < Math.abs(a - x[o]!)) [a, b] = [b, a]
      if (a >= lo && a <= hi) x[o] = a
      else if (b >= lo && b <= hi) x[o] = b
    }
  }
  for (let pass = 0; pass < STRAIGHTEN_PASSES; pass++) {
    if (pass % 2 === 0) for (let r = 0; r < L; r++) straighten(lg.layers[r]!)
    else for (let r = L - 1; r >= 0; r--) straighten(lg.layers[r]!)
  }
  return x
}

/**
 * The least width any coordinates with these orders can have is `need`, the widest layer packed. When
 * the drawing is wider, clamp every layer into a window that wide, centred on the drawing: a pass
 * left to right raises each object to at least the window's left end plus what lies packed before it,
 * and a pass right to left lowers each to at most the window's right end minus what lies packed after
 * it. Both keep the order and the separations (a layer's packed width fits the window, so the bounds
 * never cross), and objects already inside with room to spare do not move. Every point of a route
 * lies within its objects' extents across the flow, so the drawing is then `need` wide. O(objects).
 */
function squeeze(lg: LayeredGraph, x: Float64Array, need: number, nodeGap: number, edgeGap: number): boolean {
  let lo = Infinity
  let hi = -Infinity
  for (let o = 0; o < lg.objectCount; o++) {
    lo = Math.min(lo, x[o]! - lg.half[o]!)
    hi = Math.max(hi, x[o]! + lg.half[o]!)
  }
  if (!(hi - lo > need)) return false
  const left = (lo + hi) / 2 - need / 2
  const right = left + need
  for (const layer of lg.layers) {
    const k = layer.length
    if (k === 0) continue
    let min = left + lg.half[layer[0]!]!
    for (let i = 0; i < k; i++) {
      const o = layer[i]!
      if (i > 0) min = Math.max(min, x[layer[i - 1]!]! + separation(lg, layer[i - 1]!, o, nodeGap, edgeGap))
      if (x[o]! < min) x[o] = min
    }
    let max = right - lg.half[layer[k - 1]!]!
    for (let i = k - 1; i >= 0; i--) {
      const o = layer[i]!
      if (i < k - 1) max = Math.min(max, x[layer[i + 1]!]! - separation(lg, o, layer[i + 1]!, nodeGap, edgeGap))
      if (x[o]! > max) x[o] = max
    }
  }
  return true
}
