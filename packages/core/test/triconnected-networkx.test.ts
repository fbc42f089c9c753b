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

describe('triconnected components', () => {
  it('match networkx on 400 random biconnected graphs: separation pairs, triconnected R skeletons, a tree that recomposes the graph', () => {
    const cases = networkxCases(2026, 400)
    const rSkeletons: Array<Array<[number, number]>> = []
    let rCount = 0, sCount = 0, pCount = 0
    for (const c of cases) {
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
    }
    const kappa = connectivities(rSkeletons)
    for (const k of kappa) expect(k).toBeGreaterThanOrEqual(3)
    expect(rCount).toBeGreaterThan(50)
    expect(sCount).toBeGreaterThan(50)
    expect(pCount).toBeGreaterThan(20)
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
