/**
 * Find Upright diagrams in a Markdown tree: fenced code with the language `upright`, and
 * `:::upright` container directives — parsed as directives when remark-directive is in the pipeline,
 * and recognised from their text when it is not (so a site without directives still gets them checked,
 * and nothing else in its documents changes meaning).
 *
 * Each block carries its body text and a map from body positions to file positions, so a message about
 * line 2 column 6 of a diagram lands on the right line and column of the Markdown file, inside lists and
 * blockquotes too.
 */
import type {Code, Nodes, Paragraph, Parent, Root, RootContent} from 'mdast'
import type {ContainerDirective} from 'mdast-util-directive'
import {directiveFromMarkdown} from 'mdast-util-directive'
import {fromMarkdown} from 'mdast-util-from-markdown'
import {directive} from 'micromark-extension-directive'
import type {Point} from '@upright/core'
import type {SourceLines} from './source-lines.ts'
import {splitLines} from './source-lines.ts'

export const diagramName = 'upright'

export interface DiagramBlock {
  /** How it was written. */
  form: 'fence' | 'directive'
  /** The parent and the run of its children this block occupies (more than one only for a directive
   * recognised from text, whose blank lines split it into several paragraphs). */
  parent: Parent
  nodes: RootContent[]
  /** The diagram text. */
  body: string
  /** Where the block starts in the file (the fence or `:::` line). */
  start: Point
  end: Point
  /** Body position → file position. */
  toFile(point: Point): Point
  /** Options as written: the fence's meta string, or the directive's attributes. */
  meta: {kind: 'meta'; value: string; start: Point} | {kind: 'attributes'; value: Record<string, string | null | undefined>; start: Point; end: Point} | undefined
}

export function findDiagramBlocks(tree: Root, lines: SourceLines): DiagramBlock[] {
  const blocks: DiagramBlock[] = []
  walk(tree)
  return blocks

  function walk(parent: Parent): void {
    const children = parent.children as RootContent[]
    for (let i = 0; i < children.length; i++) {
      const node = children[i]!
      if (node.type === 'code' && node.lang === diagramName && node.position) {
        blocks.push(fromFence(parent, node, lines))
      } else if (node.type === 'containerDirective' && node.name === diagramName && node.position) {
        blocks.push(fromDirective(parent, node, lines))
      } else if (node.type === 'paragraph' && node.position && opensDirectiveText(node, lines)) {
        const block = fromDirectiveText(parent, i, lines)
        blocks.push(block)
        i += block.nodes.length - 1
      } else if ('children' in node) {
        // Other containers (lists, quotes, other directives such as :::note) may hold diagrams too.
        walk(node as Parent)
      }
    }
  }
}

function fromFence(parent: Parent, node: Code, lines: SourceLines): DiagramBlock {
  const start = at(lines, node.position!.start)
  const body = node.value
  const bodyLines = splitLines(body)
  const prefixes = bodyLines.map((text, i) => prefixLength(lines.line(start.line + 1 + i), text))
  let meta: DiagramBlock['meta']
  if (node.meta) {
    const fenceLine = lines.line(start.line)
    const at = fenceLine.lastIndexOf(node.meta)
    const column = at >= 0 ? at + 1 : start.column
    meta = {kind: 'meta', value: node.meta, start: filePoint(lines, start.line, column)}
  }
  return {
    form: 'fence',
    parent,
    nodes: [node],
    body,
    start,
    end: at(lines, node.position!.end),
    toFile: (p) => filePoint(lines, start.line + p.line, (prefixes[p.line - 1] ?? 0) + p.column),
    meta
  }
}

function fromDirective(parent: Parent, node: ContainerDirective, lines: SourceLines): DiagramBlock {
  const start = at(lines, node.position!.start)
  const end = at(lines, node.position!.end)
  const span = bodyOf(lines, start, end.line)
  return {
    form: 'directive',
    parent,
    nodes: [node],
    body: span.body,
    start,
    end,
    toFile: span.toFile,
    meta: {kind: 'attributes', value: {...(node.attributes ?? {})}, start, end: filePoint(lines, start.line, lines.line(start.line).length + 1)}
  }
}

const openingText = new RegExp(`^:::${diagramName}(?=[\\s{]|$)`)

function opensDirectiveText(node: Paragraph, lines: SourceLines): boolean {
  const start = node.position!.start
  return openingText.test(lines.line(start.line).slice(start.column - 1))
}

/** `:::upright` read as plain text: the block runs to the first line that is only `:::`. */
function fromDirectiveText(parent: Parent, index: number, lines: SourceLines): DiagramBlock {
  const first = parent.children[index] as Paragraph
  const start = at(lines, first.position!.start)
  const prefix = lines.line(start.line).slice(0, start.column - 1)
  let closeLine = -1
  for (let n = start.line + 1; n <= lines.starts.length; n++) {
    if (/^\s*:::\s*$/.test(stripPrefix(lines.line(n), prefix).text)) {
      closeLine = n
      break
    }
  }
  const lastLine = closeLine === -1 ? lines.starts.length : closeLine
  const end = filePoint(lines, lastLine, lines.line(lastLine).length + 1)
  const nodes: RootContent[] = []
  for (let i = index; i < parent.children.length; i++) {
    const child = parent.children[i] as RootContent
    const position = (child as {position?: {start: {offset?: number | undefined}}}).position
    if (!position || position.start.offset! > end.offset) break
    nodes.push(child)
  }
  // Let the directive syntax itself read the attributes, so both paths agree on them.
  const opening = lines.line(start.line).slice(start.column - 1)
  const parsed = fromMarkdown(`${opening}\n:::`, {
    extensions: [directive()],
    mdastExtensions: [directiveFromMarkdown()]
  })
  const head = parsed.children[0] as Nodes | undefined
  const attributes = head && head.type === 'containerDirective' ? {...(head.attributes ?? {})} : {}
  const span = bodyOf(lines, start, closeLine === -1 ? lastLine + 1 : closeLine)
  return {
    form: 'directive',
    parent,
    nodes,
    body: span.body,
    start,
    end,
    toFile: span.toFile,
    meta: {kind: 'attributes', value: attributes, start, end: filePoint(lines, start.line, lines.line(start.line).length + 1)}
  }
}

/** The lines strictly between the opening line and `closingLine`, with the container prefix removed. */
function bodyOf(lines: SourceLines, start: Point, closingLine: number): {body: string; toFile: (p: Point) => Point} {
  const prefix = lines.line(start.line).slice(0, start.column - 1)
  let last = closingLine - 1
  // A directive closed by `:::` ends on that line; one left open runs to its end.
  if (!/^\s*:::\s*$/.test(stripPrefix(lines.line(closingLine), prefix).text)) last = closingLine
  const texts: string[] = []
  const prefixes: number[] = []
  for (let n = start.line + 1; n <= last; n++) {
    const stripped = stripPrefix(lines.line(n), prefix)
    texts.push(stripped.text)
    prefixes.push(stripped.removed)
  }
  return {
    body: texts.join('\n'),
    toFile: (p) => filePoint(lines, start.line + p.line, (prefixes[p.line - 1] ?? 0) + p.column)
  }
}

/** Remove a container prefix (indentation, `>` markers) as far as the line has it. */
function stripPrefix(line: string, prefix: string): {text: string; removed: number} {
  if (line.startsWith(prefix)) return {text: line.slice(prefix.length), removed: prefix.length}
  let i = 0
  while (i < prefix.length && i < line.length && (line[i] === ' ' || line[i] === '\t' || line[i] === '>')) i++
  return {text: line.slice(i), removed: i}
}

/** How many characters of the file line come before the body line's text. */
function prefixLength(fileLine: string, bodyLine: string): number {
  if (fileLine.endsWith(bodyLine)) return fileLine.length - bodyLine.length
  // Tabs expanded by the Markdown parser: align on the first non-blank character instead.
  const fileLead = fileLine.length - fileLine.trimStart().length
  const bodyLead = bodyLine.length - bodyLine.trimStart().length
  return Math.max(0, fileLead - bodyLead)
}

/** A unist point (offset optional) as a full point. */
function at(lines: SourceLines, p: {line: number; column: number}): Point {
  return filePoint(lines, p.line, p.column)
}

function filePoint(lines: SourceLines, line: number, column: number): Point {
  const lineStart = lines.starts[line - 1] ?? lines.text.length
  return {line, column, offset: lineStart + column - 1}
}
