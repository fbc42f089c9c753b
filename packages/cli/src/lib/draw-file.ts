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

/**
 * The documented JSON shape: SVG coordinates, node x/y at the box centre, points tail → head. With
 * edge labels, a labelled edge has `label` {text, x, y, width, height} (its box, centre and size; the
 * points run through it); with tiers, `tiers` lists each tier {name, label, nodes, band, caption} in
 * declared order, band and caption as {x, y, width, height} with x/y at the centre like nodes.
 */
export function layoutJson(drawing: Drawing, stats: boolean): Record<string, unknown> {
  const {layout, ids} = drawing
  const edgeEnds = edgeIds(drawing)
  const labelOf = new Map(drawing.edgeLabels.map((l) => [l.edge, {text: l.text, x: l.x, y: l.y, width: l.width, height: l.height}]))
  const json: Record<string, unknown> = {
    flow: layout.flow,
    width: layout.width,
    height: layout.height,
    nodes: layout.nodes.map((n) => ({id: ids[n.vertex], x: n.x, y: n.y, width: n.width, height: n.height})),
    edges: layout.edges.map((e) => ({from: edgeEnds[e.edge]![0], to: edgeEnds[e.edge]![1], points: e.points, ...(labelOf.has(e.edge) ? {label: labelOf.get(e.edge)} : {})}))
  }
  if (drawing.tiers.length > 0) {
    const centred = (r: {x: number; y: number; width: number; height: number}): Record<string, number> => ({x: r.x + r.width / 2, y: r.y + r.height / 2, width: r.width, height: r.height})
    json['tiers'] = drawing.tiers.map((t) => ({name: t.name, label: t.text, nodes: t.vertices.map((v) => ids[v]), band: centred(t.band), caption: centred(t.caption)}))
  }
  if (stats) json['stats'] = layoutStats(layout)
  return json
}

function edgeIds(drawing: Drawing): Array<[string, string]> {
  const g = drawing.graph
  const out: Array<[string, string]> = []
  for (const e of drawing.layout.edges) out[e.edge] = [drawing.ids[g.tail[e.edge]!]!, drawing.ids[g.head[e.edge]!]!]
  return out
}

export function renderFileSvg(drawing: Drawing, title: string | undefined): string {
  return renderSvg({layout: drawing.layout, graph: drawing.graph, labels: drawing.labels, ids: drawing.ids, tones: drawing.tones, links: drawing.links, edgeLabels: drawing.edgeLabels, tiers: drawing.tiers, title}).svg
}

export type {Layout}
