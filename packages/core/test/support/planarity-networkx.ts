import {spawnSync} from 'node:child_process'

/**
 * Reference planarity answers from networkx `check_planarity` (networkx 3.6 on this machine), one
 * python3 process for the whole batch, graphs as JSON on stdin. Loops and parallel edges are dropped
 * on the python side (nx.Graph), which does not change planarity.
 */
export function networkxPlanar(graphs: ReadonlyArray<{vertexCount: number; edges: ReadonlyArray<readonly [number, number]>}>): boolean[] {
  const script = [
    'import sys, json, networkx as nx',
    'out = []',
    'for n, edges in json.load(sys.stdin):',
    '    g = nx.Graph()',
    '    g.add_nodes_from(range(n))',
    '    g.add_edges_from((u, v) for u, v in edges if u != v)',
    '    out.append(nx.check_planarity(g)[0])',
    'json.dump(out, sys.stdout)',
  ].join('\n')
  const input = JSON.stringify(graphs.map((g) => [g.vertexCount, g.edges]))
  const r = spawnSync('python3', ['-c', script], {input, encoding: 'utf8', maxBuffer: 1 << 28})
  if (r.status !== 0) throw new Error(`python3/networkx failed: ${r.stderr}`)
  const out = JSON.parse(r.stdout) as boolean[]
  if (out.length !== graphs.length) throw new Error('networkx returned a wrong number of answers')
  return out
}
