import {runPythonJson} from '../../../../test/support/python.ts'

/**
 * One networkx answer per digraph (networkx 3.6 on this machine), one python3 process for the whole
 * batch: `expression` is evaluated with `g` a MultiDiGraph on vertices 0..n−1 (parallel edges and
 * loops kept), e.g. `nx.is_directed_acyclic_graph(g)`. Its value must be JSON-serialisable.
 */
export function networkxEachDigraph<T>(graphs: ReadonlyArray<{vertexCount: number; edges: ReadonlyArray<readonly [number, number]>}>, expression: string): T[] {
  const script = [
    'import sys, json, networkx as nx',
    'out = []',
    'for n, edges in json.load(sys.stdin):',
    '    g = nx.MultiDiGraph()',
    '    g.add_nodes_from(range(n))',
    '    g.add_edges_from(edges)',
    `    out.append(${expression})`,
    'json.dump(out, sys.stdout)'
  ].join('\n')
  const out = runPythonJson<T[]>(script, graphs.map((g) => [g.vertexCount, g.edges]))
  if (out.length !== graphs.length) throw new Error('networkx returned a wrong number of answers')
  return out
}
