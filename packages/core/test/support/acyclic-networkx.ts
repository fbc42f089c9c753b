import {networkxEachDigraph} from './networkx-digraphs.ts'

/**
 * Reference acyclicity answers from networkx `is_directed_acyclic_graph` (networkx 3.6 on this
 * machine), one python3 process for the whole batch. A MultiDiGraph keeps parallel edges and loops,
 * so a self-loop counts as a cycle.
 */
export function networkxAcyclic(graphs: ReadonlyArray<{vertexCount: number; edges: ReadonlyArray<readonly [number, number]>}>): boolean[] {
  return networkxEachDigraph<boolean>(graphs, 'nx.is_directed_acyclic_graph(g)')
}
