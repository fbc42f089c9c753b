/**
 * Does a planar, connected, bimodal embedding admit an upward drawing for SOME outer face? If so,
 * return each source's and sink's large angle and a vertex whose large angle is in the outer face.
 *
 * Condition of Bertolazzi, Di Battista, Liotta & Mannino (Algorithmica 12, 1994): with 2·n_f switch
 * angles in face f, every source and sink gets exactly one of its angles (its large angle) so that an
 * inner face gets n_f − 1 and the outer face n_f + 1. By Euler's formula the demands add up to the
 * number of sources and sinks, so this is a perfect b-matching. Here it serves the embedding search as
 * a bound on partial embeddings, so all outer faces are tried at once: one maximum b-matching with
 * every face at n_f − 1, which leaves exactly two sources/sinks unplaced, then for each face f0 at most
 * two augmenting paths with f0's capacity raised by 2, undone from a log when they fail.
 * Time: O(k·a) for the base matching and O(F·a) for the outer-face trials, with k sources and sinks,
 * a their angles and F faces.
 */

export interface LargeAngles {
  /** large[v] = index of v's large angle (between rot[v][i] and rot[v][i+1]) or -1. */
  large: Int32Array
  outerVertex: number
}

/**
 * rot[v] lists the edge ids at v clockwise; tail/head give each edge id's endpoints. Vertices with an
 * empty rotation take no part. Returns null when the rotation system is not a connected planar
 * bimodal embedding or the assignment is impossible for every outer face.
 */
export function assignLargeAngles(
  rot: ReadonlyArray<readonly number[]>,
  tail: ArrayLike<number>,
  head: ArrayLike<number>,
  /** Optional restriction: may angle i of source/sink v be its large angle? Default: any. */
  allowed?: (v: number, i: number) => boolean,
): LargeAngles | null {
  const n = rot.length
  let maxEdge = -1, vertices = 0, degSum = 0
  for (let v = 0; v < n; v++) {
    const r = rot[v]!
    if (r.length > 0) vertices++
    degSum += r.length
    for (const e of r) if (e > maxEdge) maxEdge = e
  }
  const large = new Int32Array(n).fill(-1)
  if (vertices === 0) return {large, outerVertex: -1}
  const edges = degSum / 2
  const dartFrom = (e: number, v: number) => (tail[e] === v ? 2 * e : 2 * e + 1)
  const pos = new Int32Array(2 * maxEdge + 2)
  for (let v = 0; v < n; v++) {
    const r = rot[v]!
    // bimodality: at most two changes between in and out going round v
    let changes = 0
    for (let i = 0; i < r.length; i++) {
      pos[dartFrom(r[i]!, v)] = i
      if ((tail[r[i]!] === v) !== (tail[r[(i + 1) % r.length]!] === v)) changes++
    }
    if (changes > 2) return null
  }
  // faces: the dart into v along rot[v][i] is followed by the dart out along rot[v][i + 1]
  const faceOf = new Int32Array(2 * maxEdge + 2).fill(-1)
  let faces = 0
  for (let v = 0; v < n; v++) {
    for (const e0 of rot[v]!) {
      const d0 = dartFrom(e0, v)
      if (faceOf[d0] !== -1) continue
      let d = d0
      do {
        faceOf[d] = faces
        const w = (d & 1) === 0 ? head[d >> 1]! : tail[d >> 1]!
        const r = rot[w]!
        const i = pos[d ^ 1]!
        d = dartFrom(r[(i + 1) % r.length]!, w)
      } while (d !== d0)
      faces++
    }
  }
  if (vertices - edges + faces !== 2) return null // not connected, or not planar
  const switches = new Int32Array(faces)
  // candidates: for each source/sink, (face, angle index) pairs, one per face
  const xs: number[] = []
  const cand: Array<Array<[number, number]>> = []
  for (let v = 0; v < n; v++) {
    const r = rot[v]!
    const d = r.length
    if (d === 0) continue
    let outs = 0
    const mine: Array<[number, number]> = []
    for (let i = 0; i < d; i++) {
      const a = r[i]!, b = r[(i + 1) % d]!
      const f = faceOf[dartFrom(a, v) ^ 1]!
      if ((tail[a] === v) === (tail[b] === v)) {
        switches[f]!++
        if ((allowed === undefined || allowed(v, i)) && !mine.some(([g]) => g === f)) mine.push([f, i])
      }
      if (tail[a] === v) outs++
    }
    if (outs === 0 || outs === d) {
      xs.push(v)
      cand.push(mine)
    }
  }
  const cap = new Int32Array(faces)
  let capSum = 0
  for (let f = 0; f < faces; f++) {
    if (switches[f]! % 2 !== 0 || switches[f] === 0) return null // impossible in a bimodal DAG embedding
    cap[f] = switches[f]! / 2 - 1
    capSum += cap[f]!
  }
  if (capSum + 2 !== xs.length) return null
  const k = xs.length
  const match = new Int32Array(k).fill(-1) // index into cand[x]
  const load = new Int32Array(faces)
  const members: number[][] = Array.from({length: faces}, () => [])
  let stamp = 1
  const seen = new Int32Array(faces)
  const augment = (x: number): boolean => {
    for (let c = 0; c < cand[x]!.length; c++) {
      const f = cand[x]![c]![0]
      if (seen[f] === stamp) continue
      seen[f] = stamp
      if (load[f]! < cap[f]!) {
        place(x, c)
        return true
      }
      const list = members[f]!
      for (let j = 0; j < list.length; j++) {
        const y = list[j]!
        if (augment(y)) {
          place(x, c)
          return true
        }
      }
    }
    return false
  }
  const log: number[] = [] // (x, previous choice) pairs, to undo a failed outer-face trial
  const move = (x: number, c: number) => {
    const old = match[x]!
    if (old !== -1) {
      const f = cand[x]![old]![0]
      const list = members[f]!
      list.splice(list.indexOf(x), 1)
      load[f]!--
    }
    match[x] = c
    if (c !== -1) {
      const f = cand[x]![c]![0]
      members[f]!.push(x)
      load[f]!++
    }
  }
  const place = (x: number, c: number) => {
    log.push(x, match[x]!)
    move(x, c)
  }
  const free: number[] = []
  for (let x = 0; x < k; x++) {
    stamp++
    if (!augment(x)) free.push(x)
  }
  if (free.length !== 2) return null // more than two left over: no outer face can absorb them
  if (!free.every((x) => cand[x]!.length > 0)) return null
  for (let f0 = 0; f0 < faces; f0++) {
    cap[f0]! += 2
    log.length = 0
    stamp++
    let ok = augment(free[0]!)
    if (ok) {
      stamp++
      ok = augment(free[1]!)
    }
    if (ok) {
      for (let x = 0; x < k; x++) large[xs[x]!] = cand[x]![match[x]!]![1]
      return {large, outerVertex: xs[members[f0]![0]!]!}
    }
    cap[f0]! -= 2
    while (log.length > 0) {
      const old = log.pop()!
      move(log.pop()!, old)
    }
  }
  return null
}
