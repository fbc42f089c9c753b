/**
 * Hand-made layouts for the renderer's tests: vertices placed on given rows and columns, each edge
 * leaving the top of its tail and entering the bottom of its head (flow up), with a bend pair at the
 * middle height when the two are not above one another. Enough to exercise the SVG; the real layout
 * is tested in core.
 */
import type {Element, Root, RootContent} from 'hast'
import {spawnSync} from 'node:child_process'
import {createDigraph, labelBox, type Digraph} from '@upright/core'
import type {RenderLayout} from '../src/index.ts'

export interface HandLayout {
  graph: Digraph
  layout: RenderLayout
  labels: string[]
  ids: string[]
}

/** `rows[v]` is v's row counted from the bottom, `cols[v]` its column. */
export function handLayout(
  ids: string[],
  labels: string[],
  edges: Array<[number, number]>,
  rows: number[],
  cols: number[]
): HandLayout {
  const graph = createDigraph(ids.length, edges)
  const boxes = labels.map((label) => labelBox(label))
  const colWidth = Math.max(...boxes.map((b) => b.width)) + 24
  const rowHeight = Math.max(...boxes.map((b) => b.height)) + 48
  const top = Math.max(...rows)
  const nodes = ids.map((_, v) => ({
    vertex: v,
    x: colWidth / 2 + cols[v]! * colWidth,
    y: rowHeight / 2 + (top - rows[v]!) * rowHeight,
    width: boxes[v]!.width,
    height: boxes[v]!.height
  }))
  const layoutEdges = edges.map(([t, h], e) => {
    const a = nodes[t]!
    const b = nodes[h]!
    const start: [number, number] = [a.x, a.y - a.height / 2]
    const end: [number, number] = [b.x, b.y + b.height / 2]
    const mid = (start[1] + end[1]) / 2
    const points: Array<[number, number]> =
      a.x === b.x ? [start, end] : [start, [a.x, mid], [b.x, mid], end]
    return {edge: e, points}
  })
  const width = colWidth * (Math.max(...cols) + 1)
  const height = rowHeight * (top + 1)
  return {graph, layout: {flow: 'up', width, height, nodes, edges: layoutEdges}, labels, ids}
}

/** A small hierarchy in the invented island-logistics scenario. */
export function islandRoutes(): HandLayout {
  return handLayout(
    ['depot', 'gate', 'causeway', 'tower'],
    ['Supply depot', 'North gate', 'Causeway\nto the isle', 'Watchtower'],
    [[0, 1], [0, 2], [1, 3], [2, 3], [0, 3]],
    [0, 1, 1, 2],
    [1, 0, 2, 1]
  )
}

/** Every element in document order. */
export function elements(tree: Root | RootContent): Element[] {
  const out: Element[] = []
  const walk = (node: Root | RootContent): void => {
    if (node.type === 'element') out.push(node)
    if ('children' in node) for (const child of node.children) walk(child)
  }
  walk(tree)
  return out
}

export interface XmlView {
  tag: string
  attrs: Record<string, string>
  title: string
  desc: string
  ids: string[]
  texts: string[]
  styles: string[]
}

/**
 * Parse an SVG string with Python's xml.etree (an XML parser outside this project) and report what a
 * standalone SVG reader sees. Throws when the text is not well-formed XML.
 */
export function parseWithPython(svg: string): XmlView {
  return parseManyWithPython([svg])[0]!
}

/** parseWithPython for several SVGs in one Python process. */
export function parseManyWithPython(svgs: string[]): XmlView[] {
  const script = `
import json, sys, xml.etree.ElementTree as ET
ns = '{http://www.w3.org/2000/svg}'
def text(el):
    return ''.join(el.itertext())
def view(root):
  return {
  'tag': root.tag,
  'attrs': dict(root.attrib),
  'title': text(root.find(ns + 'title')),
  'desc': text(root.find(ns + 'desc')),
  'ids': [el.get('id') for el in root.iter() if el.get('id') is not None],
  'texts': [text(el) if el.find(ns + 'tspan') is None else '\\n'.join(text(t) for t in el.findall(ns + 'tspan')) for el in root.iter(ns + 'text')],
  'styles': [text(el) for el in root.iter(ns + 'style')],
  }
print(json.dumps([view(ET.fromstring(svg)) for svg in json.loads(sys.stdin.read())]))
`
  const run = spawnSync('python3', ['-c', script], {input: JSON.stringify(svgs), encoding: 'utf8'})
  if (run.status !== 0) throw new Error(`python3 could not parse the SVG: ${run.stderr}`)
  return JSON.parse(run.stdout) as XmlView[]
}
