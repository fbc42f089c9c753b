import {describe, expect, it} from 'vitest'
import {createDigraph, traceFaces, type RotationSystem} from '../src/index.ts'
import {testPlanarity} from '../src/planarity/index.ts'
import {isBimodal} from '../src/upward/bimodal.ts'
import {testUpwardEmbedded} from '../src/upward/fixed-embedding.ts'
import {
  bimodalRotationSystems,
  checkHallViolation,
  checkUpwardWitness,
  embeddedOuterFacesBruteForce,
  isAcyclic,
  isPlanarRotation,
  isUpwardPlanarBruteForce,
  labeledDags,
  type Edge
} from './support/upward-oracle.ts'
import {mulberry32, randomUpwardPlanar, toRotationSystem} from './support/random-st.ts'

const rs = (n: number, edges: readonly Edge[], rotation: ReadonlyArray<ArrayLike<number>>): RotationSystem => ({
  graph: createDigraph(n, edges),
  rotation: rotation.map((r) => Int32Array.from(r))
})

/** testUpwardEmbedded's answer, its witness checked independently. */
let hallChecked = 0
function decide(n: number, edges: readonly Edge[], rotation: ReadonlyArray<ArrayLike<number>>, outerFace?: number): boolean {
  const res = testUpwardEmbedded(rs(n, edges, rotation), outerFace === undefined ? null : {outerFace})
  if (!res.ok) {
    if (res.reason === 'no-assignment') {
      // With a fixed outer face a minimum cut always certifies the "no".
      if (outerFace !== undefined) expect(res.hall).toBeDefined()
      if (res.hall !== undefined) {
        const faces = traceFaces(rs(n, edges, rotation))
        const darts = res.hall.faces.map((f) => faces.darts[f]![0]!)
        const outerDart = res.hall.outerFace === -1 ? -1 : faces.darts[res.hall.outerFace]![0]!
        expect(checkHallViolation(n, edges, rotation, res.hall.vertices, darts, outerDart)).toBe(null)
        hallChecked++
      }
    }
    return false
  }
  const up = res.upward
  const outerDarts = Array.from(up.outerFaces, (f) => up.faces.darts[f]![0]!)
  expect(checkUpwardWitness(n, edges, rotation, outerDarts, up.largeAngle)).toBe(null)
  if (outerFace !== undefined) expect([...up.outerFaces]).toContain(outerFace)
  expect(up.outerFace).toBe(up.outerFaces.length > 0 ? up.outerFaces[0] : -1)
  return true
}

/** Compares the test with the oracle on every bimodal planar embedding and every outer face. */
function crossCheck(n: number, edges: readonly Edge[], cap = 4000): {embeddings: number; upward: number; outerChecks: number} | null {
  let outerChecks = 0
  let embeddings = 0
  let upward = 0
  let gen: Generator<number[][]>
  try {
    gen = bimodalRotationSystems(n, edges, cap)
    for (const rotation of gen) {
      if (!isPlanarRotation(n, edges, rotation)) continue
      embeddings++
      const oracle = embeddedOuterFacesBruteForce(n, edges, rotation)
      const got = decide(n, edges, rotation)
      expect(got, JSON.stringify({n, edges, rotation})).toBe(oracle.upward)
      if (got) upward++
      const emb = rs(n, edges, rotation)
      const res = testUpwardEmbedded(emb)
      const faces = res.ok ? res.upward.faces : null
      if (faces === null) continue
      for (let f = 0; f < faces.darts.length; f++) {
        const want = oracle.upward && oracle.outerOk[faces.darts[f]![0]!]!
        expect(decide(n, edges, rotation, f), JSON.stringify({n, edges, rotation, f})).toBe(want)
        outerChecks++
      }
    }
  } catch (e) {
    if (e instanceof RangeError && /exceed the cap/.test(e.message)) return null
    throw e
  }
  return {embeddings, upward, outerChecks}
}

function randomDag(rnd: () => number, n: number, p: number): Edge[] {
  const order = Array.from({length: n}, (_, i) => i).sort(() => rnd() - 0.5)
  const edges: Edge[] = []
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rnd() < p) edges.push([order[i]!, order[j]!])
  return edges.sort(() => rnd() - 0.5)
}

describe('isBimodal', () => {
  it('accepts in-block/out-block rotations and rejects in, out, in, out', () => {
    // Vertex 0 with edges 1->0, 0->2, 3->0, 0->4.
    const edges: Edge[] = [[1, 0], [0, 2], [3, 0], [0, 4]]
    const rot = [[0, 1, 2, 3], [0], [1], [2], [3]]
    expect(isBimodal(rs(5, edges, rot))).toEqual({ok: false, vertex: 0})
    expect(isBimodal(rs(5, edges, [[0, 2, 1, 3], [0], [1], [2], [3]]))).toEqual({ok: true})
  })
})

describe('testUpwardEmbedded: small facts (UPWARD-FACTS.md, Bertolazzi et al. 1994)', () => {
  it('a single edge: one face with 2 switches, outer capacity 2', () => {
    const res = testUpwardEmbedded(rs(2, [[0, 1]], [[0], [0]]))
    expect(res.ok).toBe(true)
    if (!res.ok) return
    expect(res.upward.faces.darts.length).toBe(1)
    expect([...res.upward.largeAngle]).toEqual([1, 0]) // dart 1 enters 0, dart 0 enters 1
  })

  it('isolated vertices take no part; an edgeless graph is upward with no outer face', () => {
    const res = testUpwardEmbedded(rs(3, [], [[], [], []]))
    expect(res.ok && res.upward.outerFace === -1 && [...res.upward.largeAngle]).toEqual([-1, -1, -1])
    expect(decide(4, [[1, 2]], [[], [0], [0], []])).toBe(true)
  })

  it('reports a directed cycle with its edges', () => {
    const res = testUpwardEmbedded(rs(3, [[0, 1], [1, 2], [2, 0]], [[0, 2], [1, 0], [2, 1]]))
    expect(res.ok === false && res.reason).toBe('cyclic')
    if (!res.ok && res.reason === 'cyclic') expect(res.cycle.edges.sort()).toEqual([0, 1, 2])
  })

  it('throws on a rotation system that is not planar or not of its graph', () => {
    // K4 with a toroidal rotation system (Euler fails).
    const edges: Edge[] = [[0, 1], [0, 2], [0, 3], [1, 2], [1, 3], [2, 3]]
    const rotations = [...bimodalRotationSystems(4, edges)]
    const bad = rotations.find((r) => !isPlanarRotation(4, edges, r))!
    expect(() => testUpwardEmbedded(rs(4, edges, bad))).toThrow(RangeError)
    expect(() => testUpwardEmbedded(rs(2, [[0, 1]], [[0], []]))).toThrow(RangeError)
  })

  it('wheel with hub 2 and rim 0-3-1-4 (5 vertices, 8 edges): its planar embedding is not bimodal', () => {
    const edges: Edge[] = [[0, 2], [0, 3], [0, 4], [1, 2], [1, 3], [1, 4], [2, 3], [2, 4]]
    const planar = testPlanarity(createDigraph(5, edges))
    expect(planar.planar).toBe(true)
    if (!planar.planar) return
    const res = testUpwardEmbedded(planar.embedding)
    expect(res).toEqual({ok: false, reason: 'not-bimodal', vertex: 2})
    // The oracle finds no bimodal planar rotation system at all.
    expect([...bimodalRotationSystems(5, edges)].filter((r) => isPlanarRotation(5, edges, r)).length).toBe(0)
    expect(isUpwardPlanarBruteForce(5, edges)).toBe(false)
  })

  it('transitive tournament on 5 vertices minus (0, 4): bimodal planar embeddings exist, none is upward', () => {
    const edges: Edge[] = []
    for (let u = 0; u < 5; u++) for (let v = u + 1; v < 5; v++) if (!(u === 0 && v === 4)) edges.push([u, v])
    const stats = crossCheck(5, edges)
    expect(stats).not.toBe(null)
    expect(stats!.embeddings).toBeGreaterThan(0)
    expect(stats!.upward).toBe(0)
    expect(isUpwardPlanarBruteForce(5, edges)).toBe(false)
  })

  it('the two blocks of UPWARD-FACTS.md sharing cut vertex 4: upward apart, not together', () => {
    const a: Edge[] = [[1, 0], [1, 2], [2, 0], [3, 1], [3, 2], [3, 4], [4, 1], [4, 2]]
    const b: Edge[] = [[4, 8], [5, 4], [5, 8], [6, 4], [6, 5], [6, 7], [7, 4], [7, 8]]
    expect(isUpwardPlanarBruteForce(9, a)).toBe(true)
    expect(isUpwardPlanarBruteForce(9, b)).toBe(true)
    expect(isUpwardPlanarBruteForce(9, [...a, ...b])).toBe(false)
    // Every bimodal planar embedding of the union fails the fixed-embedding test too.
    let embeddings = 0
    for (const rotation of bimodalRotationSystems(9, [...a, ...b], 1e6)) {
      if (!isPlanarRotation(9, [...a, ...b], rotation)) continue
      embeddings++
      expect(testUpwardEmbedded(rs(9, [...a, ...b], rotation)).ok).toBe(false)
    }
    expect(embeddings).toBeGreaterThan(0)
  })
})

describe('testUpwardEmbedded against the brute-force oracle', () => {
  it('labeled DAGs: 1, 1, 3, 25, 543 on 0..4 vertices (OEIS A003024); all on 4 vertices are upward', () => {
    expect([0, 1, 2, 3, 4].map((n) => [...labeledDags(n)].length)).toEqual([1, 1, 3, 25, 543])
    let embeddings = 0
    for (const edges of labeledDags(4)) {
      expect(isUpwardPlanarBruteForce(4, edges)).toBe(true)
      const stats = crossCheck(4, edges)!
      expect(stats.upward).toBeGreaterThan(0)
      embeddings += stats.embeddings
    }
    expect(embeddings).toBeGreaterThan(543)
  })

  it('directed forests: every bimodal embedding is upward (one face holds every angle)', () => {
    const rnd = mulberry32(7)
    for (let i = 0; i < 150; i++) {
      const n = 1 + Math.floor(rnd() * 8)
      const edges: Edge[] = []
      for (let v = 1; v < n; v++) {
        if (rnd() < 0.15) continue // leave some roots: a forest
        const u = Math.floor(rnd() * v)
        edges.push(rnd() < 0.5 ? [u, v] : [v, u])
      }
      for (const rotation of bimodalRotationSystems(n, edges, 2000)) {
        expect(decide(n, edges, rotation)).toBe(true)
      }
    }
  })

  it('random DAGs on <= 7 vertices, mixed families, every embedding and every outer face', () => {
    const rnd = mulberry32(20261202)
    let graphs = 0
    let embeddings = 0
    let upwardEmbeddings = 0
    let outerChecks = 0
    let upward = 0
    let notUpward = 0
    let tries = 0
    while (graphs < 1600 && tries < 40000) {
      tries++
      const n = 2 + Math.floor(rnd() * 6)
      const family = tries % 5
      let edges: Edge[]
      if (family === 4) {
        // a planar st-graph with some edges flipped where that keeps it acyclic: dense, planar, hard
        const st = randomUpwardPlanar(tries, 5 + Math.floor(rnd() * 3)).st
        edges = st.edges.map(([u, v]) => [u, v] as Edge)
        for (let e = 0; e < edges.length; e++) {
          if (rnd() < 0.35) {
            const [u, v] = edges[e]!
            edges[e] = [v, u]
            if (!isAcyclic(st.vertexCount, edges)) edges[e] = [u, v]
          }
        }
        edges = edges.filter(() => rnd() < 0.9)
        const stats = crossCheck(st.vertexCount, edges, 6000)
        if (stats === null) continue
        graphs++
        embeddings += stats.embeddings
        upwardEmbeddings += stats.upward
        outerChecks += stats.outerChecks
        if (stats.upward > 0) upward++
        else if (stats.embeddings > 0) notUpward++
        continue
      } else if (family === 0) {
        // bipartite: every vertex a source or a sink
        const side = Array.from({length: n}, () => rnd() < 0.5)
        edges = []
        for (let u = 0; u < n; u++) for (let v = 0; v < n; v++) if (side[u] && !side[v] && rnd() < 0.5) edges.push([u, v])
      } else {
        edges = randomDag(rnd, n, 0.3 + 0.6 * rnd())
        if (family === 1) {
          // single source: an edge from the first source to every other source
          const indeg = new Array<number>(n).fill(0)
          for (const [, v] of edges) indeg[v]!++
          const sources = indeg.flatMap((d, v) => (d === 0 ? [v] : []))
          for (let i = 1; i < sources.length; i++) {
            const e: Edge = [sources[0]!, sources[i]!]
            edges.push(e)
          }
        }
      }
      const stats = crossCheck(n, edges, 3000)
      if (stats === null) continue
      graphs++
      embeddings += stats.embeddings
      upwardEmbeddings += stats.upward
      outerChecks += stats.outerChecks
      if (stats.upward > 0) upward++
      else if (stats.embeddings > 0) notUpward++
    }
    expect(graphs).toBe(1600)
    expect(upward).toBeGreaterThan(1000)
    expect(notUpward).toBeGreaterThan(2)
    expect(embeddings - upwardEmbeddings).toBeGreaterThan(200)
    expect(hallChecked).toBeGreaterThan(500)
    console.log(
      `oracle cross-check: ${graphs} DAGs (${upward} upward, ${notUpward} planar-bimodal but not upward), ` +
        `${embeddings} bimodal planar embeddings (${upwardEmbeddings} upward), ${outerChecks} outer-face checks, ${hallChecked} Hall certificates checked so far`
    )
  })

  it('bipartite orientations (every vertex a source or sink) of planar graphs are upward planar (Di Battista, Liu & Rival, IPL 36, 1990)', () => {
    const rnd = mulberry32(99)
    let checked = 0
    for (let i = 0; i < 300; i++) {
      const n = 2 + Math.floor(rnd() * 6)
      const side = Array.from({length: n}, () => rnd() < 0.5)
      const edges: Edge[] = []
      for (let u = 0; u < n; u++) for (let v = 0; v < n; v++) if (side[u] && !side[v] && rnd() < 0.6) edges.push([u, v])
      const planar = testPlanarity(createDigraph(n, edges))
      if (!planar.planar) continue
      checked++
      expect(isUpwardPlanarBruteForce(n, edges)).toBe(true)
      // In a bipartite orientation every rotation is bimodal, so the planarity test's own
      // embedding must pass.
      expect(testUpwardEmbedded(planar.embedding).ok).toBe(true)
    }
    expect(checked).toBeGreaterThan(150)
  })

  it('one source s and one sink t: upward planar iff G + (s, t) is planar (UPWARD-FACTS.md)', () => {
    const rnd = mulberry32(5)
    let yes = 0
    let no = 0
    for (let i = 0; i < 160; i++) {
      const n = 3 + Math.floor(rnd() * 5)
      const edges: Edge[] = []
      for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if (rnd() < 0.55) edges.push([a, b])
      // make 0 the only source and n-1 the only sink
      for (let v = 1; v < n; v++) if (!edges.some(([, h]) => h === v)) edges.push([0, v])
      for (let v = 0; v < n - 1; v++) if (!edges.some(([t]) => t === v)) edges.push([v, n - 1])
      let oracle: boolean
      try {
        oracle = isUpwardPlanarBruteForce(n, edges, {cap: 2e5})
      } catch {
        continue
      }
      const plus = testPlanarity(createDigraph(n, [...edges, [0, n - 1]])).planar
      expect(oracle).toBe(plus)
      if (oracle) yes++
      else no++
    }
    expect(yes).toBeGreaterThan(30)
    expect(no).toBeGreaterThan(5)
  })
})

describe('testUpwardEmbedded on random planar st-graphs and their spanning subgraphs', () => {
  it('the generator gives planar st-graphs with s and t on the marked outer face (checked with the oracle\'s own face tracing)', () => {
    for (let seed = 1; seed <= 300; seed++) {
      const st = randomUpwardPlanar(seed, 2 + (seed % 50)).st
      const n = st.vertexCount
      expect(isAcyclic(n, st.edges)).toBe(true)
      expect(isPlanarRotation(n, st.edges, st.rotation)).toBe(true)
      const indeg = new Array<number>(n).fill(0)
      const outdeg = new Array<number>(n).fill(0)
      for (const [u, v] of st.edges) {
        outdeg[u]!++
        indeg[v]!++
      }
      expect(indeg.flatMap((d, v) => (d === 0 ? [v] : []))).toEqual([st.source])
      expect(outdeg.flatMap((d, v) => (d === 0 ? [v] : []))).toEqual([st.sink])
      // Walk the outer face from its marked dart: it must pass through s and t.
      const onOuter = new Set<number>()
      const head = (d: number) => (d & 1 ? st.edges[d >> 1]![0] : st.edges[d >> 1]![1])
      let d = st.outerDart
      do {
        const v = head(d)
        onOuter.add(v)
        const r = st.rotation[v]!
        const e2 = r[(r.indexOf(d >> 1) + 1) % r.length]!
        d = st.edges[e2]![0] === v ? 2 * e2 : 2 * e2 + 1
      } while (d !== st.outerDart)
      expect(onOuter.has(st.source) && onOuter.has(st.sink)).toBe(true)
    }
  })

  it('accepts every one, with st outer face given or not, and the witness checks out', () => {
    for (let seed = 1; seed <= 500; seed++) {
      const r = randomUpwardPlanar(seed, 2 + (seed % 40))
      expect(decide(r.vertexCount, r.edges, r.rotation), `seed ${seed}`).toBe(true)
      expect(decide(r.st.vertexCount, r.st.edges, r.st.rotation)).toBe(true)
      const stFaces = testUpwardEmbedded(toRotationSystem(r.st))
      if (!stFaces.ok) continue
      const f = stFaces.upward.faces.faceOfDart[r.st.outerDart]!
      expect(decide(r.st.vertexCount, r.st.edges, r.st.rotation, f)).toBe(true)
      if (r.outerDart >= 0) {
        const g = testUpwardEmbedded(toRotationSystem(r))
        if (g.ok) expect(decide(r.vertexCount, r.edges, r.rotation, g.upward.faces.faceOfDart[r.outerDart]!)).toBe(true)
      }
    }
  })

  it('is deterministic: the same input gives the same embedding twice', () => {
    const r = randomUpwardPlanar(42, 60)
    const a = testUpwardEmbedded(toRotationSystem(r))
    const b = testUpwardEmbedded(toRotationSystem(r))
    expect(a.ok && b.ok).toBe(true)
    if (a.ok && b.ok) {
      expect([...a.upward.largeAngle]).toEqual([...b.upward.largeAngle])
      expect(a.upward.outerFace).toBe(b.upward.outerFace)
    }
  })
})
