import {describe, expect, it} from 'vitest'
import {createDigraph} from '../src/index.ts'
import {testPlanarity} from '../src/planarity/index.ts'
import {findMinimalObstruction, testUpwardPlanarity} from '../src/upward/index.ts'
import {isUpwardPlanarBruteForce, labeledDags, type Edge} from './support/upward-oracle.ts'
import {mulberry32, randomUpwardPlanar} from './support/random-st.ts'
import {randomDag, type Family} from './support/upward-families.ts'
import {checkObstruction, decide, parse, upward} from './support/upward-check.ts'

describe('facts (sources named per case)', () => {
  it('every DAG on at most 4 vertices is upward planar; 1, 1, 3, 25, 543 labeled DAGs (OEIS A003024)', () => {
    // Each is a subgraph of the transitive tournament on 4 vertices, a planar st-graph with edge (s, t).
    const counts: number[] = []
    for (let n = 0; n <= 4; n++) {
      let c = 0
      for (const edges of labeledDags(n)) {
        c++
        expect(upward(n, edges), JSON.stringify(edges)).toBe(true)
      }
      counts.push(c)
    }
    expect(counts).toEqual([1, 1, 3, 25, 543])
  })

  it('every directed forest is upward planar (a tree reduces to a point; common practice)', () => {
    const rnd = mulberry32(41)
    for (let k = 0; k < 300; k++) {
      const n = 1 + Math.floor(rnd() * 40)
      const edges = randomDag(rnd, n, 0, 'forest')
      const r = decide(n, edges)
      expect(r.status).toBe('upward')
      if (r.status === 'upward') expect(r.method).toBe('reduced')
    }
  })

  it('an st-digraph is upward planar iff it plus (s, t) is planar (Di Battista & Tamassia, TCS 61, 1988)', () => {
    const rnd = mulberry32(7)
    let yes = 0, no = 0
    for (let k = 0; k < 400; k++) {
      const n = 3 + Math.floor(rnd() * 10)
      const edges = randomDag(rnd, n, 0.25 + 0.35 * rnd(), 'st')
      const g = createDigraph(n, edges)
      const s = [...Array(n).keys()].find((v) => !edges.some(([, b]) => b === v))!
      const t = [...Array(n).keys()].find((v) => !edges.some(([a]) => a === v))!
      const planarWithST = testPlanarity(createDigraph(n, [...edges, [s, t]])).planar
      const planarAlone = testPlanarity(g).planar
      const got = upward(n, edges)
      expect(got).toBe(planarWithST)
      if (planarAlone && !planarWithST) no++
      if (got) yes++
    }
    expect(yes).toBeGreaterThan(50)
    expect(no).toBeGreaterThan(5) // planar alone is not enough, and such cases were met
  })

  it('a planar digraph whose vertices are all sources or sinks is upward planar (Di Battista, Liu & Rival, IPL 36, 1990)', () => {
    const rnd = mulberry32(11)
    let planar = 0
    for (let k = 0; k < 300; k++) {
      const n = 2 + Math.floor(rnd() * 14)
      const edges = randomDag(rnd, n, 0.2 + 0.4 * rnd(), 'bipartite')
      const isPlanar = testPlanarity(createDigraph(n, edges)).planar
      expect(upward(n, edges)).toBe(isPlanar)
      if (isPlanar) planar++
    }
    expect(planar).toBeGreaterThan(100)
  })

  it('the transitive tournament on 5 vertices minus (first, last) is planar, st, and not upward (UPWARD-FACTS.md)', () => {
    const edges: Edge[] = []
    for (let i = 0; i < 5; i++) for (let j = i + 1; j < 5; j++) if (!(i === 0 && j === 4)) edges.push([i, j])
    expect(testPlanarity(createDigraph(5, edges)).planar).toBe(true)
    const r = decide(5, edges)
    expect(r).toMatchObject({status: 'not-upward', reason: 'no-upward-embedding', method: 'st'})
    expect(checkObstruction(5, edges)).toBe(9) // every edge is needed
  })

  it('the 5-vertex wheel with hub 2 has no bimodal embedding (UPWARD-FACTS.md, checked by brute force there)', () => {
    const edges = parse('0->2, 0->3, 0->4, 1->2, 1->3, 1->4, 2->3, 2->4')
    expect(isUpwardPlanarBruteForce(5, edges)).toBe(false)
    expect(decide(5, edges)).toMatchObject({status: 'not-upward', reason: 'not-bimodal'})
    expect(checkObstruction(5, edges)).toBe(8)
  })

  it('two upward planar blocks sharing a cut vertex can fail together (UPWARD-FACTS.md)', () => {
    const a = parse('1->0, 1->2, 2->0, 3->1, 3->2, 3->4, 4->1, 4->2')
    const b = parse('4->8, 5->4, 5->8, 6->4, 6->5, 6->7, 7->4, 7->8')
    expect(upward(9, a)).toBe(true)
    expect(upward(9, b)).toBe(true)
    expect(isUpwardPlanarBruteForce(9, [...a, ...b])).toBe(false)
    expect(decide(9, [...a, ...b]).status).toBe('not-upward')
  })
})

describe('reduction lemmas against the brute-force oracle', () => {
  // Each case grows a random small DAG by the inverse of one reduction and asks the oracle (which
  // shares no code with the library) whether the answer changed.
  it('adding a leaf, subdividing an edge, or adding a path beside an edge never changes the answer', () => {
    const rnd = mulberry32(99)
    const seen = {leaf: 0, subdivide: 0, parallel: 0, no: 0}
    for (let k = 0; k < 400; k++) {
      const n = 4 + Math.floor(rnd() * 3)
      const edges = randomDag(rnd, n, 0.5 + 0.3 * rnd(), 'dag')
      if (edges.length === 0 || edges.length > 11) continue
      const before = isUpwardPlanarBruteForce(n, edges)
      if (!before) seen.no++
      const op = k % 3
      const [a, b] = edges[Math.floor(rnd() * edges.length)]!
      let grown: Edge[]
      if (op === 0) {
        const u = Math.floor(rnd() * n)
        grown = [...edges, rnd() < 0.5 ? [u, n] : [n, u]]
        seen.leaf++
      } else if (op === 1) {
        grown = [...edges.filter(([x, y]) => !(x === a && y === b)), [a, n], [n, b]]
        seen.subdivide++
      } else {
        grown = [...edges, [a, n], [n, b]]
        seen.parallel++
      }
      expect(isUpwardPlanarBruteForce(n + 1, grown), JSON.stringify({edges, grown})).toBe(before)
      expect(upward(n + 1, grown)).toBe(before)
    }
    expect(seen.no).toBeGreaterThan(10)
  })
})

describe('input shapes', () => {
  it('parallel edges do not change the answer (a copy drawn beside its twin; common practice)', () => {
    const rnd = mulberry32(3)
    for (let k = 0; k < 300; k++) {
      const n = 4 + Math.floor(rnd() * 4)
      const edges = randomDag(rnd, n, 0.3 + 0.4 * rnd(), 'dag')
      if (edges.length === 0) continue
      const doubled = [...edges, ...edges.filter(() => rnd() < 0.4)]
      expect(upward(n, doubled), JSON.stringify(doubled)).toBe(upward(n, edges))
    }
  })

  it('several components: upward iff each is; isolated vertices take no part', () => {
    const wheel = parse('0->2, 0->3, 0->4, 1->2, 1->3, 1->4, 2->3, 2->4')
    const path = parse('5->6, 6->7')
    expect(upward(9, path)).toBe(true)
    expect(upward(9, [...path, ...parse('8->5')])).toBe(true)
    expect(decide(9, [...path, ...wheel]).status).toBe('not-upward')
    const r = decide(12, [...path, ...parse('9->10, 9->11, 10->11')])
    expect(r.status).toBe('upward')
    if (r.status === 'upward') expect(r.upward.outerFaces.length).toBe(2)
  })

  it('rejects a cyclic input as a caller error', () => {
    expect(() => testUpwardPlanarity(createDigraph(2, [[0, 1], [1, 0]]))).toThrow(RangeError)
    expect(() => testUpwardPlanarity(createDigraph(1, [[0, 0]]))).toThrow(RangeError)
  })
})

describe('budget', () => {
  it('answers undecided, never a guess, when the clock runs out', () => {
    const edges = parse('1->0, 1->2, 2->0, 3->1, 3->2, 3->4, 4->1, 4->2, 4->8, 5->4, 5->8, 6->4, 6->5, 6->7, 7->4, 7->8')
    let t = 0
    const r = testUpwardPlanarity(createDigraph(9, edges), {maxMillis: 5, now: () => (t += 1)})
    expect(r.status).toBe('undecided')
    const o = findMinimalObstruction(createDigraph(9, edges), {maxMillis: 5, now: () => (t += 1)})
    expect(o).toEqual({ok: false, reason: 'budget'})
    expect(findMinimalObstruction(createDigraph(3, [[0, 1], [1, 2]]))).toEqual({ok: false, reason: 'upward'})
  })

  it('is deterministic: the same input gives the same embedding', () => {
    const g = randomUpwardPlanar(5, 25)
    const a = testUpwardPlanarity(createDigraph(g.vertexCount, g.edges))
    const b = testUpwardPlanarity(createDigraph(g.vertexCount, g.edges))
    expect(a.status).toBe('upward')
    if (a.status === 'upward' && b.status === 'upward') {
      expect(a.upward.embedding.rotation.map((r) => [...r])).toEqual(b.upward.embedding.rotation.map((r) => [...r]))
      expect([...a.upward.largeAngle]).toEqual([...b.upward.largeAngle])
    }
  })
})
