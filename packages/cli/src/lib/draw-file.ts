/**
 * `upright layout` and `upright render`: one diagram of one file (a `.upright` file, or the N-th
 * diagram of a Markdown file), drawn. A diagram that fails its check is reported like `check` does.
 */
import {drawDiagram, layoutStats, type Drawing, type Flow, type Layout, type Limits} from '@upright/core'
import {renderSvg} from '@upright/svg'
import {checkFile, type FileReport} from './check-files.ts'

export interface DrawFileOptions {
  base: string
  flow?: Flow | undefined
  title?: string | undefined
  budget?: number | undefined
  limits?: Readonly<Partial<Limits>> | undefined
  /** 1-based index of the diagram in a Markdown file. */
  diagram: number
}

export type DrawFileResult =
  | {ok: true; report: FileReport; drawing: Drawing; title: string | undefined}
  | {ok: false; report: FileReport; problem: 'unreadable' | 'no-such-diagram' | 'failed'}

export async function drawFile(file: string, options: DrawFileOptions): Promise<DrawFileResult> {
  const report = await checkFile(file, options)
  if (report.error) return {ok: false, report, problem: 'unreadable'}
  const result = report.results[options.diagram - 1]
  if (!result) return {ok: false, report, problem: 'no-such-diagram'}
  // Report only the chosen diagram.
  const only: FileReport = {...report, results: [result]}
  if (result.status !== 'upward' || !result.check) return {ok: false, report: only, problem: 'failed'}
  const drawn = drawDiagram(result.check, {flow: result.options.flow})
  if (!drawn.ok) return {ok: false, report: only, problem: 'failed'}
  return {ok: true, report: only, drawing: drawn.drawing, title: result.options.title}
}

/** The documented JSON shape: SVG coordinates, node x/y at the box centre, points tail → head. */
export function layoutJson(drawing: Drawing, stats: boolean): Record<string, unknown> {
  const {layout, ids} = drawing
  const edgeEnds = edgeIds(drawing)
  const json: Record<string, unknown> = {
    flow: layout.flow,
    width: layout.width,
    height: layout.height,
    nodes: layout.nodes.map((n) => ({id: ids[n.vertex], x: n.x, y: n.y, width: n.width, height: n.height})),
    edges: layout.edges.map((e) => ({from: edgeEnds[e.edge]![0], to: edgeEnds[e.edge]![1], points: e.points}))
  }
  if (stats) json['stats'] = layoutStats(layout)
  return json
}

function edgeIds(drawing: Drawing): Array<[string, string]> {
  const g = drawing.st.graph
  const out: Array<[string, string]> = []
  for (const e of drawing.layout.edges) out[e.edge] = [drawing.ids[g.tail[e.edge]!]!, drawing.ids[g.head[e.edge]!]!]
  return out
}

export function renderFileSvg(drawing: Drawing, title: string | undefined): string {
  return renderSvg({layout: drawing.layout, graph: drawing.st.graph, labels: drawing.labels, ids: drawing.ids, tones: drawing.tones, links: drawing.links, title}).svg
}

export type {Layout}
