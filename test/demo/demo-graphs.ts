/**
 * The demo's diagrams as plain edge lists, read with the same block finder and parser the plugin uses,
 * and an independent check of each with networkx (python3): acyclic, planar, and contained in a planar
 * st-graph. The last is a witness of upward planarity that does not use our upward test: join a new
 * source S to every source, every sink to a new sink T, and add S -> T; if that graph is planar it is a
 * planar st-graph with S and T on one face, which has an upward drawing (Di Battista and Tamassia,
 * "Algorithms for plane representations of acyclic digraphs", TCS 61, 1988; Kelly 1987), and so has
 * every subgraph of it, the diagram included.
 */
import {readdirSync, readFileSync} from 'node:fs'
import path from 'node:path'
import {parseDiagram} from '../../packages/core/src/index.ts'
import {findDiagramBlocks, indexLines, parseMarkdown} from 'remark-upright'
import {runPythonJson} from '../support/python.ts'

export interface DemoGraph {
  page: string
  line: number
  vertices: string[]
  edges: Array<[string, string]>
}

export function demoGraphs(pagesDir: string): DemoGraph[] {
  const graphs: DemoGraph[] = []
  for (const name of readdirSync(pagesDir).filter((f) => f.endsWith('.md')).sort()) {
    const text = readFileSync(path.join(pagesDir, name), 'utf8')
    const blocks = findDiagramBlocks(parseMarkdown(text), indexLines(text))
    for (const block of blocks) {
      const parsed = parseDiagram(block.body)
      const keys = parsed.vertices.map((v) => v.key)
      graphs.push({
        page: name,
        line: block.start.line,
        vertices: keys,
        edges: parsed.edges.map((e) => [keys[e.from]!, keys[e.to]!])
      })
    }
  }
  return graphs
}

/** The text of every demo diagram, with its page and line. */
export function demoBodies(pagesDir: string): Array<{page: string; line: number; body: string}> {
  const bodies: Array<{page: string; line: number; body: string}> = []
  for (const name of readdirSync(pagesDir).filter((f) => f.endsWith('.md')).sort()) {
    const text = readFileSync(path.join(pagesDir, name), 'utf8')
    for (const block of findDiagramBlocks(parseMarkdown(text), indexLines(text))) bodies.push({page: name, line: block.start.line, body: block.body})
  }
  return bodies
}

/**
 * Extra edges for diagrams whose S/T closure alone is not planar because a source or sink sits inside
 * a face (the diagrams that need a careful embedding). Adding them must keep the graph acyclic; they
 * are the witness's, not the diagram's. Keyed by `page:line` of the block.
 */
export const witnessEdges: Readonly<Record<string, ReadonlyArray<[string, string]>>> = {
  // Compost bay 2 hangs off drying room B inside the face dry_b, thresh_1, winnow, thresh_2.
  'seed-lots.md:12': [['bay_2', 'winnow']],
  // The data-quality alerts hang off return facts inside the face f_returns, r_circ, board, r_quality.
  'data.md:47': [['dq', 'board']],
  // The vault keeper is a source inside the face lending desk, lot ledger, member parcel.
  'seed-year.md:37': [['desk', 'keeper']]
}

export interface NetworkxVerdict {
  acyclic: boolean
  planar: boolean
  /** The S/T closure described above is planar (a witness of upward planarity). */
  stClosurePlanar: boolean
  /** With `witnessEdges` added (if any): still acyclic, and its S/T closure is planar. */
  witness: boolean
  sources: number
  sinks: number
}

const script = String.raw`
import json, sys
import networkx as nx
out = []
for g in json.load(sys.stdin):
    d = nx.DiGraph()
    d.add_nodes_from(g["vertices"])
    d.add_edges_from(g["edges"])
    acyclic = nx.is_directed_acyclic_graph(d)
    planar, _ = nx.check_planarity(d.to_undirected())
    sources = [v for v in d if d.in_degree(v) == 0]
    sinks = [v for v in d if d.out_degree(v) == 0]
    S, T = ("__S__",), ("__T__",)
    c = nx.Graph(d.to_undirected())
    c.add_edges_from((S, v) for v in sources)
    c.add_edges_from((v, T) for v in sinks)
    c.add_edge(S, T)
    closure, _ = nx.check_planarity(c)
    w = nx.DiGraph(d)
    w.add_edges_from(g.get("extra", []))
    witnessAcyclic = nx.is_directed_acyclic_graph(w)
    w_sources = [v for v in w if w.in_degree(v) == 0]
    w_sinks = [v for v in w if w.out_degree(v) == 0]
    c = nx.Graph(w.to_undirected())
    c.add_edges_from((S, v) for v in w_sources)
    c.add_edges_from((v, T) for v in w_sinks)
    c.add_edge(S, T)
    witness, _ = nx.check_planarity(c)
    out.append({"acyclic": acyclic, "planar": planar, "stClosurePlanar": closure,
                "witness": witnessAcyclic and witness,
                "sources": len(sources), "sinks": len(sinks)})
print(json.dumps(out))
`

export function networkxVerdicts(graphs: readonly DemoGraph[]): NetworkxVerdict[] {
  const input = graphs.map((g) => ({...g, extra: witnessEdges[`${g.page}:${g.line}`] ?? []}))
  return runPythonJson<NetworkxVerdict[]>(script, input)
}
