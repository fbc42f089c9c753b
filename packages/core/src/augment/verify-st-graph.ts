/**
 * Independent checker for an st-augmentation (shares no code with st-augment.ts; traces faces by
 * itself). H must: contain G with the same vertex and edge ids, the added ids listed exactly; be
 * acyclic (Kahn 1962) with exactly one source s and one sink t, those declared; carry a planar
 * rotation system (every vertex lists exactly its edges, H connected, V − E + F = 2: Mohar &
 * Thomassen, "Graphs on Surfaces", 2001) with every vertex bimodal; and have s and t on the declared
 * outer face, so H + (s, t) is planar too. Optionally H's rotation restricted to G's edges must be
 * G's given embedding (the augmentation kept G's upward embedding). O(n + m).
 */
import type {Digraph} from '../graph/digraph.ts'
import type {RotationSystem} from '../embedding/rotation-system.ts'
import type {StAugmentation} from './st-augment.ts'

export type VerifyStResult = {ok: true} | {ok: false; reason: string}

export function verifyStGraph(g: Digraph, aug: StAugmentation, gEmbedding?: RotationSystem): VerifyStResult {
  const fail = (reason: string): VerifyStResult => ({ok: false, reason})
  const h = aug.graph
  const n = g.vertexCount
  const m = g.edgeCount
  const nH = h.vertexCount
  const mH = h.edgeCount
  if (nH < n || mH < m) return fail(`H has ${nH} vertices and ${mH} edges, fewer than G's ${n} and ${m}`)
  for (let e = 0; e < m; e++) {
    if (h.tail[e] !== g.tail[e] || h.head[e] !== g.head[e]) return fail(`edge ${e} of G is not edge ${e} of H`)
  }
  const same = (xs: readonly number[], from: number, to: number) =>
    xs.length === to - from && xs.every((x, i) => x === from + i)
  if (!same(aug.addedEdges, m, mH)) return fail('addedEdges is not exactly the ids after G\'s edges')
  if (!same(aug.addedVertices, n, nH)) return fail('addedVertices is not exactly the ids after G\'s vertices')

  // Acyclic, one source, one sink.
  const indeg = new Int32Array(nH)
  const outdeg = new Int32Array(nH)
  for (let e = 0; e < mH; e++) {
    if (h.tail[e] === h.head[e]) return fail(`edge ${e} is a loop`)
    outdeg[h.tail[e]!]!++
    indeg[h.head[e]!]!++
  }
  const sources: number[] = []
  const sinks: number[] = []
  for (let v = 0; v < nH; v++) {
    if (indeg[v] === 0) sources.push(v)
    if (outdeg[v] === 0) sinks.push(v)
  }
  if (nH === 0) return aug.source === -1 && aug.sink === -1 ? {ok: true} : fail('empty H with a source or sink')
  if (sources.length !== 1) return fail(`H has ${sources.length} sources`)
  if (sinks.length !== 1) return fail(`H has ${sinks.length} sinks`)
  if (sources[0] !== aug.source || sinks[0] !== aug.sink) {
    return fail(`declared source ${aug.source} and sink ${aug.sink}, found ${sources[0]} and ${sinks[0]}`)
  }
  const out: number[][] = Array.from({length: nH}, () => [])
  for (let e = 0; e < mH; e++) out[h.tail[e]!]!.push(h.head[e]!)
  const left = indeg.slice()
  const queue = [aug.source]
  let seen = 0
  while (queue.length > 0) {
    const v = queue.pop()!
    seen++
    for (const w of out[v]!) if (--left[w]! === 0) queue.push(w)
  }
  if (seen !== nH) return fail('H has a directed cycle')
  // One source and acyclic: every vertex is reachable from s, so H is connected.

  // The rotation system: exactly the incident edges, bimodal, planar.
  const emb = aug.embedding
  if (emb.graph !== h) return fail('the embedding is not of H')
  if (emb.rotation.length !== nH) return fail('the embedding has the wrong number of rotations')
  const pos = new Int32Array(2 * mH).fill(-1) // position of dart (2e from tail, 2e+1 from head) in its tail's rotation
  for (let v = 0; v < nH; v++) {
    const r = emb.rotation[v]!
    let changes = 0
    for (let i = 0; i < r.length; i++) {
      const e = r[i]!
      if (!(e >= 0 && e < mH)) return fail(`vertex ${v} lists edge ${e}, which is not in H`)
      const d = h.tail[e] === v ? 2 * e : h.head[e] === v ? 2 * e + 1 : -1
      if (d === -1) return fail(`vertex ${v} lists edge ${e}, which is not incident to it`)
      if (pos[d] !== -1) return fail(`vertex ${v} lists edge ${e} twice`)
      pos[d] = i
      const a = h.tail[e] === v
      const b = h.tail[r[(i + 1) % r.length]!] === v
      if (a !== b) changes++
    }
    if (changes > 2) return fail(`vertex ${v} is not bimodal`)
  }
  for (let d = 0; d < 2 * mH; d++) if (pos[d] === -1) return fail(`edge ${d >> 1} is missing from a rotation`)
  const from = (d: number) => (d & 1 ? h.head[d >> 1]! : h.tail[d >> 1]!)
  const to = (d: number) => (d & 1 ? h.tail[d >> 1]! : h.head[d >> 1]!)
  const faceOf = new Int32Array(2 * mH).fill(-1)
  let faceCount = 0
  for (let d0 = 0; d0 < 2 * mH; d0++) {
    if (faceOf[d0] !== -1) continue
    let d = d0
    do {
      faceOf[d] = faceCount
      const v = to(d)
      const r = emb.rotation[v]!
      const back = d ^ 1 // leaves v along the same edge
      const e2 = r[(pos[back]! + 1) % r.length]!
      d = h.tail[e2] === v ? 2 * e2 : 2 * e2 + 1
    } while (d !== d0)
    faceCount++
  }
  if (mH > 0 && nH - mH + faceCount !== 2) return fail(`V - E + F = ${nH - mH + faceCount}, not 2: not planar`)

  // s and t on the declared outer face.
  if (mH === 0) {
    if (aug.outerFace !== -1) return fail('H has no edges but an outer face is declared')
  } else {
    const walk = aug.faces.darts[aug.outerFace]
    if (walk === undefined || walk.length === 0) return fail(`outer face ${aug.outerFace} does not exist`)
    const f = faceOf[walk[0]!]!
    let size = 0
    for (let d = 0; d < 2 * mH; d++) if (faceOf[d] === f) size++
    if (size !== walk.length || walk.some((d) => faceOf[d] !== f)) return fail('the declared outer face is not a face')
    const onFace = new Set<number>()
    for (const d of walk) onFace.add(from(d))
    if (!onFace.has(aug.source) || !onFace.has(aug.sink)) return fail('s and t are not both on the outer face')
  }

  if (gEmbedding !== undefined) {
    for (let v = 0; v < n; v++) {
      const want = Array.from(gEmbedding.rotation[v]!)
      const got = Array.from(emb.rotation[v]!).filter((e) => e < m)
      if (want.length !== got.length) return fail(`H's rotation at ${v} does not hold G's edges`)
      if (want.length === 0) continue
      const k = got.indexOf(want[0]!)
      if (k === -1 || want.some((e, i) => got[(k + i) % got.length] !== e)) {
        return fail(`H's rotation at ${v} restricted to G is not G's embedding`)
      }
    }
  }
  return {ok: true}
}
