import {spawnSync} from 'node:child_process'

/**
 * Reference acyclicity answers from networkx `is_directed_acyclic_graph` (networkx 3.6 on this
 * machine), one python3 process for the whole batch. A MultiDiGraph keeps parallel edges and loops,
 * so a self-loop counts as a cycle.
 */
export function networkxAcyclic(graphs: ReadonlyArray<{vertexCount: number; edges: ReadonlyArray<readonly [number, number]>}>): boolean[] {
  const script = [
    'import sys, json, networkx as nx',
    'out = []',
    'for n, edges in json.load(sys.stdin):',
    '    g = nx.MultiDiGraph()',
    '    g.add_nodes_from(range(n))',
    '    g.add_edges_from(edges)',
    '    out.append(nx.is_directed_acyclic_graph(g))',
    'json.dump(out, sys.stdout)'
  ].join('\n')
  const r = spawnSync('python3', ['-c', script], {input: JSON.stringify(graphs.map((g) => [g.vertexCount, g.edges])), encoding: 'utf8', maxBuffer: 1 << 28})
  if (r.status !== 0) throw new Error(`python3/networkx failed: ${r.stderr}`)
  const out = JSON.parse(r.stdout) as boolean[]
  if (out.length !== graphs.length) throw new Error('networkx returned a wrong number of answers')
  return out
}
