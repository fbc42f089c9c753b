import {readFileSync} from 'node:fs'

/**
 * Minimal GraphML reader for the data sets in /work/shared/data (yFiles-written, nodes n0..n{k-1},
 * edges as `<edge source="nX" target="nY">`, no attributes needed). Regular expressions suffice for
 * these files; this is not a general GraphML parser.
 */
export function readGraphml(path: string): {vertexCount: number; edges: [number, number][]} {
  const text = readFileSync(path, 'utf8')
  let vertexCount = 0
  for (const match of text.matchAll(/<node\s[^>]*\bid="n(\d+)"/g)) {
    vertexCount = Math.max(vertexCount, Number(match[1]) + 1)
  }
  const edges: [number, number][] = []
  for (const match of text.matchAll(/<edge\s[^>]*>/g)) {
    const s = /\bsource="n(\d+)"/.exec(match[0])
    const t = /\btarget="n(\d+)"/.exec(match[0])
    if (s === null || t === null) throw new Error(`${path}: edge without nN source/target: ${match[0]}`)
    edges.push([Number(s[1]), Number(t[1])])
  }
  return {vertexCount, edges}
}
