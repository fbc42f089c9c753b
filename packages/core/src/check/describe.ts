/** How the pipeline names vertices and edges in messages: by the ids the writer typed. */
import type {ParsedDiagram} from '../parse/index.ts'

export function vertexName(parsed: ParsedDiagram, v: number): string {
  return parsed.vertices[v]!.key
}

export function edgeName(parsed: ParsedDiagram, e: number): string {
  const edge = parsed.edges[e]!
  return `${vertexName(parsed, edge.from)} -> ${vertexName(parsed, edge.to)}`
}

export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`
}
