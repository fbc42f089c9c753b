import {spawnSync} from 'node:child_process'
import {describe, expect, it} from 'vitest'
import {triconnectedComponents} from '../src/decompose/triconnected.ts'

// Reference facts from networkx 3.6 on random biconnected graphs: for every graph, the pairs
// {x, y} whose removal disconnects it (brute force over pairs), and for every vertex set the
// decomposition calls triconnected, nx.node_connectivity. Theorem used (Hopcroft & Tarjan 1973;
// Di Battista & Tamassia 1996): in a simple biconnected graph, {x, y} separates it iff it is the
// pair of a virtual edge or two non-adjacent vertices of one polygon (S) component.
interface Case {
  n: number
  edges: Array<[number, number]>
  cuts: Array<[number, number]>
}

function networkxCases(seed: number, count: number): Case[] {
  const script = `
import json, random, itertools, networkx as nx
rnd = random.Random(${seed})
out = []
while len(out) < ${count}:
    n = rnd.randint(3, 11)
    p = rnd.uniform(0.2, 0.7)
    g = nx.gnp_random_graph(n, p, seed=rnd.randint(0, 10**9))
    if g.number_of_edges() < 3 or not nx.is_connected(g) or not nx.is_biconnected(g):
        continue
    cuts = []
    for x, y in itertools.combinations(range(n), 2):
        h = g.copy()
        h.remove_nodes_from([x, y])
        if h.number_of_nodes() > 0 and not nx.is_connected(h):
            cuts.append([x, y])
    out.append({'n': n, 'edges': [list(e) for e in g.edges()], 'cuts': cuts})
print(json.dumps(out))
`
  const r = spawnSync('python3', ['-c', script], {encoding: 'utf8', maxBuffer: 1 << 26})
  if (r.status !== 0) throw new Error(r.stderr)
  return JSON.parse(r.stdout) as Case[]
}

function connectivities(graphs: Array<Array<[number, number]>>): number[] {
  const script = `
import json, sys, networkx as nx
print(json.dumps([nx.node_connectivity(nx.Graph(es)) for es in json.load(sys.stdin)]))
`
  const r = spawnSync('python3', ['-c', script], {input: JSON.stringify(graphs), encoding: 'utf8', maxBuffer: 1 << 26})
  if (r.status !== 0) throw new Error(r.stderr)
  return JSON.parse(r.stdout) as number[]
}

/**
 * Planar biconnected graphs with many separation pairs, from networkx 3.6: a wheel or a cycle (3–6
 * rim vertices) glued in turn along a random existing edge, often the same edge as the step before
 * (so one pair holds several parts); a 2-sum keeps the graph planar and biconnected, and wheels are
 * triconnected. Vertices shuffled; checked planar by nx.check_planarity.
 * Separation pairs: {x, y} with y an articulation point of the graph minus x (nx.articulation_points).
 */
function planarCases(seed: number, count: number): Case[] {
  const script = `
import json, random, networkx as nx
rnd = random.Random(${seed})
out = []
while len(out) < ${count}:
    g = nx.Graph()
    g.add_edge(0, 1)
    n = 2
    last = None
    for step in range(rnd.randint(1, 14)):
        u, v = last if last and rnd.random() < 0.3 else rnd.choice(sorted(g.edges()))
        last = (u, v)
        rim = [u, v] + list(range(n, n + rnd.randint(1, 4)))
        n += len(rim) - 2
        for i in range(1, len(rim)):
            g.add_edge(rim[i], rim[(i + 1) % len(rim)])
        if rnd.random() < 0.5:
            g.add_edges_from((n, r) for r in rim)
            n += 1
    perm = list(range(n))
    rnd.shuffle(perm)
    h = nx.relabel_nodes(g, dict(enumerate(perm)))
    assert nx.check_planarity(h)[0] and nx.is_biconnected(h)
    cuts = sorted({tuple(sorted((x, y))) for x in h for y in nx.articulation_points(h.subgraph(set(h) - {x}))})
    out.append({'n': n, 'edges': [list(e) for e in h.edges()], 'cuts': [list(c) for c in cuts]})
print(json.dumps(out))
`
  const r = spawnSync('python3', ['-c', script], {encoding: 'utf8', maxBuffer: 1 << 26})
  if (r.status !== 0) throw new Error(r.stderr)
  return JSON.parse(r.stdout) as Case[]
}

/**
 * Checks one decomposition: every real edge once, a tree of links with matching poles, no two
 * bonds or polygons side by side, S/P/R shapes, and the separation pairs it implies equal to
 * networkx's. Returns the R skeletons (for a connectivity check) and the counts per kind.
 */
function checkCase(c: Case): {rSkeletons: Array<Array<[number, number]>>; r: number; s: number; p: number} {
  const rSkeletons: Array<Array<[number, number]>> = []
  let rCount = 0, sCount = 0, pCount = 0
  const t = triconnectedComponents(c.n, c.edges)
  const label = JSON.stringify(c.edges)
  // every real edge exactly once
  const reals = t.components.flatMap((comp) => comp.edges.filter((e) => e.real !== -1).map((e) => e.real)).sort((a, b) => a - b)
  expect(reals, label).toEqual(c.edges.map((_, i) => i))
  // links form a tree over the components, each virtual edge held twice with equal poles
  expect(t.links.length).toBe(t.components.length - 1)
  const seen = new Set<number>([0])
  for (let grow = true; grow; ) {
    grow = false
    for (const l of t.links) {
      const [p, q] = l.node
      if (seen.has(p) !== seen.has(q)) {
        seen.add(p)
        seen.add(q)
        grow = true
      }
    }
  }
  expect(seen.size).toBe(t.components.length)
  for (const l of t.links) {
    const e0 = t.components[l.node[0]]!.edges[l.index[0]]!
    const e1 = t.components[l.node[1]]!.edges[l.index[1]]!
    expect(e0.virtual).toBe(e1.virtual)
    expect(new Set([e0.a, e0.b])).toEqual(new Set([e1.a, e1.b]))
    // unique decomposition: no two bonds or two polygons side by side
    const k0 = t.components[l.node[0]]!.kind, k1 = t.components[l.node[1]]!.kind
    expect(k0 === k1 && k0 !== 'R', label).toBe(false)
  }
  // separation pairs
  const pairs = new Set<string>()
  const key = (x: number, y: number) => (x < y ? `${x},${y}` : `${y},${x}`)
  for (const l of t.links) {
    const e = t.components[l.node[0]]!.edges[l.index[0]]!
    pairs.add(key(e.a, e.b))
  }
  for (const comp of t.components) {
    const vs = [...new Set(comp.edges.flatMap((e) => [e.a, e.b]))]
    if (comp.kind === 'S') {
      sCount++
      expect(vs.length).toBe(comp.edges.length)
      expect(vs.length).toBeGreaterThanOrEqual(3)
      // cycle order: consecutive edges share a vertex
      comp.edges.forEach((e, i) => {
        const f = comp.edges[(i + 1) % comp.edges.length]!
        expect([f.a, f.b].some((x) => x === e.a || x === e.b)).toBe(true)
      })
      const adjacent = new Set(comp.edges.map((e) => key(e.a, e.b)))
      for (let i = 0; i < vs.length; i++) for (let j = i + 1; j < vs.length; j++) {
        if (!adjacent.has(key(vs[i]!, vs[j]!))) pairs.add(key(vs[i]!, vs[j]!))
      }
    } else if (comp.kind === 'P') {
      pCount++
      expect(vs.length).toBe(2)
      expect(comp.edges.length).toBeGreaterThanOrEqual(3)
    } else {
      rCount++
      expect(vs.length).toBeGreaterThanOrEqual(4)
      const simple = new Set(comp.edges.map((e) => key(e.a, e.b)))
      expect(simple.size).toBe(comp.edges.length)
      rSkeletons.push(comp.edges.map((e) => [e.a, e.b]))
    }
  }
  expect([...pairs].sort(), label).toEqual(c.cuts.map(([x, y]) => key(x, y)).sort())
  return {rSkeletons, r: rCount, s: sCount, p: pCount}
}

/** checkCase on every case, totals summed. */
function checkCases(cases: readonly Case[]): ReturnType<typeof checkCase> {
  const total: ReturnType<typeof checkCase> = {rSkeletons: [], r: 0, s: 0, p: 0}
  for (const c of cases) {
    const one = checkCase(c)
    total.rSkeletons.push(...one.rSkeletons)
    total.r += one.r
    total.s += one.s
    total.p += one.p
  }
  return total
}

describe('triconnected components', () => {
  it('match networkx on 400 random biconnected graphs: separation pairs, triconnected R skeletons, a tree that recomposes the graph', () => {
    const {rSkeletons, r: rCount, s: sCount, p: pCount} = checkCases(networkxCases(2026, 400))
    const kappa = connectivities(rSkeletons)
    for (const k of kappa) expect(k).toBeGreaterThanOrEqual(3)
    expect(rCount).toBeGreaterThan(50)
    expect(sCount).toBeGreaterThan(50)
    expect(pCount).toBeGreaterThan(20)
  })

  it('match networkx on 150 planar graphs glued from wheels and cycles (the planar path, which peels every separation pair in one sweep)', () => {
    const cases = planarCases(2027, 150)
    const {rSkeletons, r: rCount, s: sCount, p: pCount} = checkCases(cases)
    const most = Math.max(...cases.map((c) => c.n))
    for (const k of connectivities(rSkeletons)) expect(k).toBeGreaterThanOrEqual(3)
    expect(most).toBeGreaterThan(40)
    expect(rCount).toBeGreaterThan(200)
    expect(sCount).toBeGreaterThan(200)
    expect(pCount).toBeGreaterThan(50)
  })

  it('handles bonds of parallel edges and a plain cycle', () => {
    const bond = triconnectedComponents(2, [[0, 1], [1, 0], [0, 1]])
    expect(bond.components.map((c) => c.kind)).toEqual(['P'])
    const cycle = triconnectedComponents(5, [[0, 1], [1, 2], [2, 3], [3, 4], [4, 0]])
    expect(cycle.components.map((c) => c.kind)).toEqual(['S'])
    // a cycle with a doubled edge: a polygon and a bond
    const doubled = triconnectedComponents(4, [[0, 1], [1, 2], [2, 3], [3, 0], [0, 1]])
    expect(doubled.components.map((c) => c.kind).sort()).toEqual(['P', 'S'])
  })
})
