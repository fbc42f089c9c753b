/** A `.upright` file is one diagram body; its options come from command-line flags. */
import {checkDiagram, resolveOptions, type DiagramOptions, type Limits, type Point} from '@upright/core'
import type {BlockResult, DiagramBlock} from 'remark-upright'

export function checkBlockBody(
  text: string,
  layer: Partial<DiagramOptions>,
  budgetMillis: number,
  limits?: Readonly<Partial<Limits>>
): BlockResult {
  // The file was decoded with its BOM removed, so line 1 column 1 is the first visible character.
  const start: Point = {line: 1, column: 1, offset: 0}
  const block: DiagramBlock = {
    form: 'fence',
    parent: {type: 'root', children: []},
    nodes: [],
    body: text,
    start,
    end: start,
    toFile: (p) => p,
    meta: undefined
  }
  const check = checkDiagram(text, {budgetMillis, limits})
  const messages = check.diagnostics.map(({range, related, ...rest}) => ({
    ...rest,
    place: {start: range.start, end: range.end},
    ...(related ? {related: related.map((r) => ({place: {start: r.range.start, end: r.range.end}, reason: r.reason}))} : {})
  }))
  return {block, options: resolveOptions(layer), check, status: check.status, messages}
}
