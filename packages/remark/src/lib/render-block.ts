/**
 * A passing block becomes a figure: the drawing as inline SVG and, when the diagram has a title, a
 * caption. Delivered as hast through the mdast node's `data` (so remark-rehype needs no raw HTML), or
 * as an `html` node for pipelines that serialise Markdown or allow raw HTML.
 */
import type {Element, ElementContent, Root, RootContent as RootContentHast} from 'hast'
import {fromHtml} from 'hast-util-from-html'
import type {Html, RootContent} from 'mdast'
import {toHtml} from 'hast-util-to-html'
import {drawDiagram, fallbackBoxes, layoutFallback, type DiagramOptions, type FallbackLayout} from '@upright/core'
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

export type DrawOutcome = {ok: true; svg: string; hast: Root} | {ok: false; reason: string}

/** Draw a block checked in this run, with the SVG's default id prefix (the form the cache keeps). */
export function drawBlock(result: BlockResult): DrawOutcome {
  const check = result.check
  if (!check) return {ok: false, reason: 'the block was not checked'}
  const drawn = drawDiagram(check, {flow: result.options.flow})
  if (!drawn.ok) return {ok: false, reason: 'the diagram is not upward planar'}
  const {layout, graph, labels, ids, tones, links, edgeLabels, tiers} = drawn.drawing
  const rendered = renderSvg({layout, graph, labels, ids, tones, links, edgeLabels, tiers, title: titleOf(result.options)})
  return {ok: true, svg: rendered.svg, hast: rendered.hast}
}

/** Failures that warn mode still draws, as a marked fallback (@upright/core's layoutFallback). */
export const fallbackStatuses: ReadonlySet<string> = new Set(['cycle', 'nonplanar', 'not-upward'])

/**
 * Warn mode: the marked fallback drawing of a failing block (a maximal drawable part crossing-free,
 * the other edges inserted or reversed, dashed in the warning colour) with a visible note under it.
 */
export function drawFallbackBlock(result: BlockResult): DrawOutcome {
  const check = result.check
  if (!check?.graph || !fallbackStatuses.has(check.status)) return {ok: false, reason: 'no fallback drawing for this block'}
  const fallback = layoutFallback(check.graph, {flow: result.options.flow, boxes: fallbackBoxes(check.parsed), budget: {maxMillis: 3000}})
  const labels = check.parsed.vertices.map((v) => v.label ?? v.key)
  const ids = check.parsed.vertices.map((v) => v.key)
  const rendered = renderSvg({
    layout: fallback.layout,
    graph: check.graph,
    labels,
    ids,
    title: titleOf(result.options),
    description: fallbackNote(fallback),
    marked: fallback.marks.map((mark) => mark !== undefined),
    note: fallbackNote(fallback)
  })
  return {ok: true, svg: rendered.svg, hast: rendered.hast}
}

/** The note under a fallback drawing: that it is not valid, and what was done to draw it. */
export function fallbackNote(fallback: FallbackLayout): string {
  const count = (k: number, one: string, many: string): string => `${k} ${k === 1 ? one : many}`
  const parts: string[] = []
  const forward = fallback.inserted.filter((e) => fallback.marks[e] === 'inserted').length
  if (forward > 0) parts.push(`${count(forward, 'dashed edge', 'dashed edges')} added with ${count(fallback.crossings, 'crossing', 'crossings')}`)
  if (fallback.reversed.length > 0) parts.push(`${count(fallback.reversed.length, 'dashed edge runs', 'dashed edges run')} against the flow`)
  if (fallback.omitted.length > 0) parts.push(`${count(fallback.omitted.length, 'self-loop', 'self-loops')} left out`)
  return `Not a valid hierarchy drawing: ${parts.join('; ')}.`
}

/** A fallback figure, marked with the class `upright-fallback`. */
export function renderFallbackBlock(result: BlockResult, output: Output, usedPrefixes: Map<string, number>): RenderOutcome {
  const drawn = drawFallbackBlock(result)
  if (!drawn.ok) return drawn
  const node = figureNode(result, drawn.svg, drawn.hast, output, usedPrefixes)
  if (node.type === 'html') node.value = node.value.replace('<figure class="upright"', '<figure class="upright upright-fallback"')
  else (node.data.hProperties['className'] as string[]).push('upright-fallback')
  return {ok: true, node, svg: drawn.svg}
}

/**
 * Draw one checked block as a figure. `usedPrefixes` holds the id prefixes already on this page: a
 * second copy of the same diagram gets a numbered prefix so ids stay unique.
 */
export function renderBlock(result: BlockResult, output: Output, usedPrefixes: Map<string, number>): RenderOutcome {
  const drawn = drawBlock(result)
  if (!drawn.ok) return drawn
  return {ok: true, node: figureNode(result, drawn.svg, drawn.hast, output, usedPrefixes), svg: drawn.svg}
}

/**
 * The figure for a drawing given as SVG text (and its hast, when at hand; a cached drawing is parsed
 * again). The default id prefix is the root element's id, derived from the drawing itself, so only
 * copies of one diagram share it; later copies get `-2`, `-3`, … appended to every id and reference.
 */
export function figureNode(
  result: BlockResult,
  svg: string,
  hast: Root | undefined,
  output: Output,
  usedPrefixes: Map<string, number>
): UprightFigure | Html {
  const prefix = /^<svg\b[^>]*?\sid="([^"]+)"/.exec(svg)?.[1]
  let tree = hast
  if (prefix !== undefined) {
    const seen = usedPrefixes.get(prefix) ?? 0
    usedPrefixes.set(prefix, seen + 1)
    if (seen > 0) {
      svg = svg.split(prefix).join(`${prefix}-${seen + 1}`)
      tree = undefined
    }
  }
  tree ??= svgTree(svg)
  const children: ElementContent[] = tree.children.filter((c): c is Element => c.type === 'element')
  if (result.options.title) {
    children.push({type: 'element', tagName: 'figcaption', properties: {}, children: [{type: 'text', value: result.options.title}]})
  }
  const properties = {className: ['upright'], dataFlow: result.options.flow}
  if (output === 'html') {
    const figure: Element = {type: 'element', tagName: 'figure', properties, children}
    return {type: 'html', value: toHtml(figure)}
  }
  return {type: 'uprightFigure', data: {hName: 'figure', hProperties: {className: ['upright'], 'data-flow': result.options.flow}, hChildren: children}}
}

/** SVG text back to hast, as @upright/svg builds it: a fragment without source positions. */
export function svgTree(svg: string): Root {
  const tree = fromHtml(svg, {fragment: true})
  dropPositions(tree)
  return tree
}

function dropPositions(node: Root | RootContentHast): void {
  delete node.position
  if ('children' in node) for (const child of node.children) dropPositions(child)
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
