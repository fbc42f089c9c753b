/**
 * A passing block becomes a figure: the drawing as inline SVG and, when the diagram has a title, a
 * caption. Delivered as hast through the mdast node's `data` (so remark-rehype needs no raw HTML), or
 * as an `html` node for pipelines that serialise Markdown or allow raw HTML.
 */
import type {Element, ElementContent} from 'hast'
import type {Html, RootContent} from 'mdast'
import {toHtml} from 'hast-util-to-html'
import {drawDiagram, type DiagramOptions} from '@upright/core'
import {renderSvg} from '@upright/svg'
import type {BlockResult} from './check-block.ts'

/** The mdast node that stands for a drawn diagram; remark-rehype turns its `data` into the figure. */
export interface UprightFigure {
  type: 'uprightFigure'
  data: {hName: 'figure'; hProperties: Record<string, string | string[]>; hChildren: ElementContent[]}
}

declare module 'mdast' {
  interface RootContentMap {
    uprightFigure: UprightFigure
  }
  interface BlockContentMap {
    uprightFigure: UprightFigure
  }
}

export type Output = 'hast' | 'html'

export type RenderOutcome = {ok: true; node: UprightFigure | Html; svg: string} | {ok: false; reason: string}

/**
 * Draw one checked block. `usedPrefixes` holds the id prefixes already on this page: a second copy of
 * the same diagram gets a numbered prefix so ids stay unique.
 */
export function renderBlock(result: BlockResult, output: Output, usedPrefixes: Map<string, number>): RenderOutcome {
  const check = result.check
  if (!check) return {ok: false, reason: 'the block was not checked'}
  const drawn = drawDiagram(check, {flow: result.options.flow})
  if (!drawn.ok) return {ok: false, reason: 'the diagram is not upward planar'}
  const {layout, labels, ids} = drawn.drawing
  const input = {layout, graph: check.graph!, labels, ids, title: titleOf(result.options)}
  let rendered = renderSvg(input)
  const prefix = /\bid="([^"]+?)-[^"-]*"/.exec(rendered.svg)?.[1]
  if (prefix !== undefined) {
    const seen = usedPrefixes.get(prefix) ?? 0
    usedPrefixes.set(prefix, seen + 1)
    if (seen > 0) rendered = renderSvg(input, {idPrefix: `${prefix}-${seen + 1}`})
  }
  const svg = rendered.hast.children.filter((c): c is Element => c.type === 'element')
  const children: ElementContent[] = [...svg]
  if (result.options.title) {
    children.push({type: 'element', tagName: 'figcaption', properties: {}, children: [{type: 'text', value: result.options.title}]})
  }
  const properties = {className: ['upright'], dataFlow: result.options.flow}
  if (output === 'html') {
    const figure: Element = {type: 'element', tagName: 'figure', properties, children}
    return {ok: true, node: {type: 'html', value: toHtml(figure)}, svg: rendered.svg}
  }
  return {
    ok: true,
    node: {type: 'uprightFigure', data: {hName: 'figure', hProperties: {className: ['upright'], 'data-flow': result.options.flow}, hChildren: children}},
    svg: rendered.svg
  }
}

function titleOf(options: DiagramOptions): string | undefined {
  return options.title
}

/** Put the figure where the block's node(s) were. */
export function replaceBlock(result: BlockResult, node: RootContent): void {
  const {parent, nodes} = result.block
  const children = parent.children as RootContent[]
  const at = children.indexOf(nodes[0]!)
  if (at >= 0) children.splice(at, nodes.length, node)
}
