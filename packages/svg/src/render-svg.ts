/**
 * Layout → SVG, in three steps that each run once, in linear time in the size of the drawing:
 *  1. build a hast tree (hastscript), every number written by formatNumber at one precision;
 *  2. serialize it (hast-util-to-html) and optimize the text with svgo at that same precision, with
 *     the passes that would break accessibility or theming turned off;
 *  3. parse svgo's output back into hast (hast-util-from-html, positions dropped) and serialize that.
 * So the returned `hast` is exactly the optimized drawing, and `svg` is exactly what rehype would
 * print for it: a remark plugin can put the tree in the document, a CLI can write the string, and the
 * two agree byte for byte.
 */
import type {Element, ElementContent, Root, RootContent} from 'hast'
import {fromHtml} from 'hast-util-from-html'
import {toHtml} from 'hast-util-to-html'
import {s} from 'hastscript'
import {optimize, type Config} from 'svgo/browser'
import {EDGE_LABEL_BOX, FONT_STACK, TIER_CAPTION_BOX, checkLinkTarget, labelBox, toneDescriptions, type LabelBoxOptions, type Tone} from '@upright/core'
import {describeHierarchy, spokenLabel, type FlowWord} from './describe.ts'
import {DEFAULT_EDGE_STYLE, edgeShape, type EdgeStyle} from './geometry.ts'
import {hashText} from './hash.ts'
import {DEFAULT_PRECISION, checkPrecision, formatNumber} from './number.ts'
import {CLASS, EDGE_STROKE_WIDTH, NODE_STROKE_WIDTH, resolveTheme, stylesheet, type Theme} from './theme.ts'

/** The drawing to render. `Layout` from @upright/core has this shape. */
export interface RenderLayout {
  flow: FlowWord
  width: number
  height: number
  nodes: ReadonlyArray<{vertex: number; x: number; y: number; width: number; height: number}>
  edges: ReadonlyArray<{edge: number; points: ReadonlyArray<readonly [number, number]>}>
}

export interface RenderInput {
  layout: RenderLayout
  /** Tail and head of each edge id in `layout.edges` (a core `Digraph` fits). */
  graph: {readonly tail: ArrayLike<number>; readonly head: ArrayLike<number>}
  /** Label per vertex, as drawn; may hold line breaks (see labelBox in @upright/core). */
  labels: ReadonlyArray<string>
  /** The author's id per vertex; spoken to tell vertices with the same label apart. */
  ids?: ReadonlyArray<string> | undefined
  /** Accessible name (<title>). Default: "Diagram of N vertices and M edges". */
  title?: string | undefined
  /** Sentence read before the generated description (<desc>). */
  description?: string | undefined
  /**
   * Per edge id: true for an edge drawn in the warning style (dashed, in `--upright-marked-stroke`),
   * as the fallback drawing of a failing diagram marks the edges it inserted or reversed.
   */
  marked?: ReadonlyArray<boolean | undefined> | undefined
  /** A visible line of text under the drawing, in the warning colour (e.g. that it is not valid). */
  note?: string | undefined
  /**
   * Per vertex: its tone (`external`, `new`, `retiring`), drawn with the theme's tone properties and
   * said in words in <desc>, so colour is never the only carrier.
   */
  tones?: ReadonlyArray<Tone | undefined> | undefined
  /** Per vertex: a link target (http(s), relative or `#fragment`); the box becomes a link. */
  links?: ReadonlyArray<string | undefined> | undefined
  /**
   * Labels on edges: the box (centre and size, layout coordinates) the layout kept clear for each, on
   * its edge's line, and its text. Drawn as a pill over the line; said in <desc> after the edge's head.
   */
  edgeLabels?: ReadonlyArray<RenderEdgeLabel> | undefined
  /**
   * Tiers in declared order: a quiet band behind the tier's row and a caption in the box given for it
   * (layout coordinates, top-left corner and size); said in <desc> with their vertices.
   */
  tiers?: ReadonlyArray<RenderTier> | undefined
}

export interface RenderEdgeLabel {
  edge: number
  x: number
  y: number
  width: number
  height: number
  text: string
}

export interface RenderTier {
  band: {x: number; y: number; width: number; height: number}
  caption: {x: number; y: number; width: number; height: number}
  text: string
  vertices: ReadonlyArray<number>
}

/** Classes of the tier bands, their captions and the edge labels: public hooks for site CSS. */
export const DECORATION_CLASS = {
  tiers: 'upright-tiers',
  tierCaptions: 'upright-tier-captions',
  edgeLabels: 'upright-edge-labels',
  edgeLabelText: 'upright-edge-label-text'
} as const

/**
 * Default colours of tier bands and edge labels, light and dark; sites override them through
 * --upright-tier-fill, --upright-tier-text, --upright-edge-label-fill, --upright-edge-label-stroke and
 * --upright-edge-label-text.
 */
const DECORATION = {
  light: {tierFill: '#f1eee3', tierText: '#5d6b63', labelStroke: '#9fb0b5', labelText: '#38515a'},
  dark: {tierFill: '#1b2427', tierText: '#9db1aa', labelStroke: '#5f747b', labelText: '#c6d6d8'}
} as const

/** Classes and default colours of the warning style (fallback drawings only). */
const MARKED = {lines: 'upright-marked', arrows: 'upright-marked-arrows', note: 'upright-note', light: '#b4541e', dark: '#f0a567'} as const

export interface Options {
  /**
   * Prefix of every id in the SVG (and the scope of its CSS). Default: `upright-` and 12 hex digits
   * of an FNV-1a hash of the input and options, so different diagrams on one page never clash.
   * Pass one to tell apart two copies of the same diagram on one page.
   */
  idPrefix?: string | undefined
  /** Decimal places of every coordinate. Default 2 (DEFAULT_PRECISION). */
  precision?: number | undefined
  /** Colours and scheme; see theme.ts and the README. */
  theme?: Readonly<Theme> | undefined
  /** The label options the boxes were sized with (labelBox); text is placed with the same. */
  label?: Readonly<LabelBoxOptions> | undefined
  /** Space around the drawing inside the SVG, px. Default 12. */
  margin?: number | undefined
  /** Corner radius of vertex boxes, px. Default 6. */
  nodeRadius?: number | undefined
  /** Bend radius and arrowhead size, px. Defaults: DEFAULT_EDGE_STYLE. */
  edge?: Readonly<Partial<EdgeStyle>> | undefined
}

export interface RenderResult {
  /** The optimized SVG, standalone (with xmlns) and fit to inline in HTML. */
  svg: string
  /** The same drawing as a hast tree: a root holding one <svg> element. */
  hast: Root
}

const ID_PREFIX = /^[A-Za-z][A-Za-z0-9_-]*$/

function nonNegative(name: string, value: number | undefined, fallback: number): number {
  const v = value ?? fallback
  if (!(Number.isFinite(v) && v >= 0)) throw new RangeError(`${name} must be a finite number ≥ 0, got ${v}`)
  return v
}

interface Settings {
  prefix: string
  precision: number
  theme: ReturnType<typeof resolveTheme>
  label: Readonly<LabelBoxOptions>
  margin: number
  nodeRadius: number
  edge: EdgeStyle
}

function settle(input: RenderInput, options: Readonly<Options> | null | undefined): Settings {
  const precision = checkPrecision(options?.precision ?? DEFAULT_PRECISION)
  const theme = resolveTheme(options?.theme)
  const label = {...options?.label}
  const margin = nonNegative('margin', options?.margin, 12)
  const nodeRadius = nonNegative('nodeRadius', options?.nodeRadius, 6)
  const edge: EdgeStyle = {
    bendRadius: nonNegative('edge.bendRadius', options?.edge?.bendRadius, DEFAULT_EDGE_STYLE.bendRadius),
    arrowLength: nonNegative('edge.arrowLength', options?.edge?.arrowLength, DEFAULT_EDGE_STYLE.arrowLength),
    arrowWidth: nonNegative('edge.arrowWidth', options?.edge?.arrowWidth, DEFAULT_EDGE_STYLE.arrowWidth)
  }
  let prefix = options?.idPrefix
  if (prefix === undefined) {
    prefix = `upright-${hashText(fingerprint(input, {precision, theme, label, margin, nodeRadius, edge})).slice(0, 12)}`
  } else if (!ID_PREFIX.test(prefix)) {
    throw new RangeError(`idPrefix must start with a letter and hold only letters, digits, _ and -, got ${JSON.stringify(prefix)}`)
  }
  return {prefix, precision, theme, label, margin, nodeRadius, edge}
}

/** Everything that changes the output, as one string (JSON keeps key order and number text fixed). */
function fingerprint(input: RenderInput, settings: Omit<Settings, 'prefix'>): string {
  const {layout, graph} = input
  return JSON.stringify([
    layout.flow,
    layout.width,
    layout.height,
    layout.nodes.map((n) => [n.vertex, n.x, n.y, n.width, n.height]),
    layout.edges.map((e) => [e.edge, graph.tail[e.edge], graph.head[e.edge], e.points]),
    input.labels,
    input.ids ?? null,
    input.title ?? null,
    input.description ?? null,
    settings,
    // Only when present, so the hash of an ordinary drawing is what it always was.
    ...(input.marked || input.note !== undefined ? [input.marked ?? null, input.note ?? null] : []),
    ...(input.edgeLabels?.length || input.tiers?.length ? [input.edgeLabels ?? null, input.tiers ?? null] : [])
  ])
}

function buildTree(input: RenderInput, settings: Settings): Root {
  const {layout, graph} = input
  const {prefix, precision, margin} = settings
  const f = (v: number): string => formatNumber(v, precision)
  const light = settings.theme.scheme === 'dark' ? settings.theme.dark : settings.theme.light

  for (const e of layout.edges) {
    if (!(e.edge >= 0 && e.edge < graph.tail.length && e.edge < graph.head.length)) {
      throw new RangeError(`layout edge ${e.edge} is not an edge of the graph`)
    }
  }
  const nodes = [...layout.nodes].sort((a, b) => a.vertex - b.vertex)
  const edges = [...layout.edges].sort((a, b) => a.edge - b.edge)
  const pairs = edges.map((e) => [graph.tail[e.edge]!, graph.head[e.edge]!] as const)

  const title = input.title ?? `Diagram of ${nodes.length} ${nodes.length === 1 ? 'vertex' : 'vertices'} and ${edges.length} ${edges.length === 1 ? 'edge' : 'edges'}`
  const labelOf = new Map((input.edgeLabels ?? []).map((label) => [label.edge, label.text]))
  const generated = describeHierarchy({
    flow: layout.flow,
    vertices: nodes.map((n) => n.vertex),
    edges: pairs,
    edgeLabels: labelOf.size > 0 ? edges.map((e) => labelOf.get(e.edge)) : undefined,
    tiers: input.tiers,
    // Tones are said in words beside the label, so the description never relies on colour.
    labels: input.tones ? input.labels.map((l, v) => (input.tones![v] ? `${l} (${toneDescriptions[input.tones![v]!]})` : l)) : input.labels,
    ids: input.ids
  })
  const lead = input.description?.trim()
  const desc = lead ? `${lead}${/[.!?]$/.test(lead) ? '' : '.'} ${generated}` : generated

  // All lines share one style, so they form one path of many subpaths (likewise the arrowheads):
  // what svgo's mergePaths would produce, without its pairwise checks.
  let lineData = ''
  let arrowData = ''
  let markedLineData = ''
  let markedArrowData = ''
  for (const e of edges) {
    const shape = edgeShape(e.points, settings.edge, precision)
    if (input.marked?.[e.edge]) {
      markedLineData += shape.line
      markedArrowData += shape.arrow
    } else {
      lineData += shape.line
      arrowData += shape.arrow
    }
  }

  const boxes: Element[] = []
  const labels: Element[] = []
  const links: Element[] = []
  for (const n of nodes) {
    const tone = input.tones?.[n.vertex]
    const href = input.links?.[n.vertex]
    // The parser already refused unsafe targets; check again here, as this renderer may be fed directly.
    if (href !== undefined && checkLinkTarget(href).ok) {
      links.push(
        s('a', {href, ariaLabel: input.labels[n.vertex] ?? ''}, [
          s('rect', {x: f(n.x - n.width / 2), y: f(n.y - n.height / 2), width: f(n.width), height: f(n.height), rx: f(Math.min(settings.nodeRadius, n.width / 2, n.height / 2))})
        ])
      )
    }
    boxes.push(
      s('rect', {
        className: tone ? [`${CLASS.root}-tone-${tone}`] : undefined,
        x: f(n.x - n.width / 2),
        y: f(n.y - n.height / 2),
        width: f(n.width),
        height: f(n.height),
        rx: f(Math.min(settings.nodeRadius, n.width / 2, n.height / 2))
      })
    )
    const box = labelBox(input.labels[n.vertex] ?? '', settings.label)
    const spans: ElementContent[] = []
    box.lines.forEach((line, i) => {
      if (line !== '') spans.push(s('tspan', {x: f(n.x), y: f(n.y + box.baselines[i]!)}, line))
    })
    if (spans.length === 1) {
      const only = spans[0] as Element
      labels.push(s('text', {x: only.properties['x'], y: only.properties['y']}, only.children))
    } else if (spans.length > 1) {
      labels.push(s('text', spans))
    }
  }

  const fontSize = labelBox('', settings.label).fontSize
  const note = input.note?.trim() ? input.note.trim() : undefined
  const noteBox = note === undefined ? undefined : labelBox(note, settings.label)
  const noteSpace = noteBox ? noteBox.fontSize * 2 : 0
  const width = Math.max(layout.width, noteBox ? noteBox.width : 0) + 2 * margin
  const height = layout.height + 2 * margin + noteSpace
  const warning = settings.theme.scheme === 'dark' ? MARKED.dark : MARKED.light
  const markedRules =
    markedLineData || note
      ? `#${prefix} .${MARKED.lines}{fill:none;stroke:var(--upright-marked-stroke,${warning});stroke-dasharray:6 4}` +
        `#${prefix} .${MARKED.arrows},#${prefix} .${MARKED.note}{fill:var(--upright-marked-stroke,${warning})}#${prefix} .${MARKED.note}{font-style:italic}` +
        (settings.theme.scheme === 'auto'
          ? `@media (prefers-color-scheme:dark){#${prefix} .${MARKED.lines}{stroke:var(--upright-marked-stroke,${MARKED.dark})}#${prefix} .${MARKED.arrows},#${prefix} .${MARKED.note}{fill:var(--upright-marked-stroke,${MARKED.dark})}}`
          : '')
      : ''
  const svg = s(
    'svg',
    {
      xmlns: 'http://www.w3.org/2000/svg',
      id: prefix,
      className: [CLASS.root],
      viewBox: `${f(-margin)} ${f(-margin)} ${f(width)} ${f(height)}`,
      width: f(width),
      height: f(height),
      role: 'img',
      ariaLabelledBy: `${prefix}-title`,
      ariaDescribedBy: `${prefix}-desc`
    },
    [
      s('title', {id: `${prefix}-title`}, title),
      s('desc', {id: `${prefix}-desc`}, desc),
      s('style', stylesheet(prefix, settings.theme, `${f(fontSize)}px ${FONT_STACK}`) + markedRules + toneAndLinkRules(prefix, input) + decorationRules(prefix, input, settings.theme.scheme)),
      s('rect', {
        className: [CLASS.background],
        x: f(-margin),
        y: f(-margin),
        width: f(width),
        height: f(height),
        rx: f(Math.min(8, margin)),
        fill: light.background
      }),
      tierBands(input, settings),
      lineData
        ? s('path', {className: [CLASS.lines], d: lineData, fill: 'none', stroke: light.edgeStroke, strokeWidth: EDGE_STROKE_WIDTH, strokeLinecap: 'round', strokeLinejoin: 'round'})
        : null,
      edgeLabelPills(input, settings),
      s('g', {className: [CLASS.boxes], fill: light.nodeFill, stroke: light.nodeStroke, strokeWidth: NODE_STROKE_WIDTH}, boxes),
      s('g', {className: [CLASS.labels], fill: light.nodeText, fontFamily: FONT_STACK, fontSize: f(fontSize), textAnchor: 'middle'}, labels),
      arrowData ? s('path', {className: [CLASS.arrows], d: arrowData, fill: light.arrowFill}) : null,
      links.length > 0 ? s('g', {className: [`${CLASS.root}-links`], fill: 'transparent'}, links) : null,
      markedLineData
        ? s('path', {className: [MARKED.lines], d: markedLineData, fill: 'none', stroke: warning, strokeWidth: EDGE_STROKE_WIDTH, strokeDasharray: '6 4', strokeLinecap: 'round', strokeLinejoin: 'round'})
        : null,
      markedArrowData ? s('path', {className: [MARKED.arrows], d: markedArrowData, fill: warning}) : null,
      note ? s('text', {className: [MARKED.note], x: f(0), y: f(layout.height + margin / 2 + noteBox!.fontSize * 1.4), fill: warning}, note) : null
    ]
  )
  return {type: 'root', children: [svg]}
}

/**
 * svgo passes, chosen for a tree we generate ourselves. Kept: the ones that shorten what we write
 * (path data to relative and shorthand commands, numbers, colours, the stylesheet via csso, groups and
 * attributes). Left out, each for a reason:
 * - cleanupIds: ids are already short, scoped by the prefix and referenced from aria-* and the CSS;
 * - inlineStyles: rules must stay in <style> so media queries and the site's properties reach them;
 * - removeUnknownsAndDefaults, removeHiddenElems, removeUselessStrokeAndFill: we write no unknown,
 *   hidden or useless markup, and they match the stylesheet against every element, which costs more
 *   than the rest of the optimization together on large diagrams (and the first would drop role="img");
 * - mergePaths, moveElemsAttrsToGroup, moveGroupAttrsToElems, collapseGroups, convertShapeToPath:
 *   the tree is built already merged and grouped, and its structure is documented for site CSS
 *   (`.upright-boxes rect` must hold even for a one-vertex diagram); boxes stay <rect>;
 * - removeTitle, removeDesc, removeViewBox: needed for accessibility and scaling.
 */
const SVGO_PLUGINS = [
  'removeComments',
  'cleanupAttrs',
  'mergeStyles',
  'minifyStyles',
  'cleanupNumericValues',
  'convertColors',
  'removeEmptyText',
  'removeEmptyAttrs',
  'removeEmptyContainers',
  'convertPathData',
  'sortAttrs'
] as const

/** Drop unist positions so the tree depends only on the SVG text (and compares equal across runs). */
function dropPositions(node: Root | RootContent): void {
  delete node.position
  if ('children' in node) for (const child of node.children) dropPositions(child)
}

/**
 * Step 2: svgo at `precision`, with our pass list, or (for bench/svg.ts to compare against) svgo's
 * preset-default with the three overrides that keep ids, <style> rules and role="img".
 */
export function optimizeSvg(raw: string, precision: number, passes: 'upright' | 'preset-default'): string {
  const plugins: Config['plugins'] =
    passes === 'upright'
      ? [...SVGO_PLUGINS]
      : [
          {
            name: 'preset-default',
            params: {overrides: {cleanupIds: false, inlineStyles: false, removeUnknownsAndDefaults: {keepRoleAttr: true}}}
          }
        ]
  return optimize(raw, {multipass: false, floatPrecision: precision, js2svg: {pretty: false}, plugins}).data
}

/** Step 1 alone: the SVG text before svgo, and the precision it was written at (for bench/svg.ts). */
export function unoptimizedSvg(input: RenderInput, options?: Readonly<Options> | null): {svg: string; precision: number} {
  const settings = settle(input, options)
  return {svg: toHtml(buildTree(input, settings), {space: 'svg'}), precision: settings.precision}
}

/** Render a layout as optimized, accessible, themable SVG: the string and the same tree as hast. */
export function renderSvg(input: RenderInput, options?: Readonly<Options> | null): RenderResult {
  const {svg: raw, precision} = unoptimizedSvg(input, options)
  const optimized = optimizeSvg(raw, precision, 'upright')
  const hast = fromHtml(optimized, {fragment: true})
  dropPositions(hast)
  return {svg: toHtml(hast, {closeEmptyElements: true}), hast}
}

/** The optimized drawing as a hast tree (a root holding one <svg>), e.g. for a remark/rehype plugin. */
export function toHast(input: RenderInput, options?: Readonly<Options> | null): Root {
  return renderSvg(input, options).hast
}

/**
 * Tones and links, only when used. Tones change the line of a box, not just its colour (dashes for
 * external, a heavier line for new, dots and a paler fill for retiring), so they survive greyscale and
 * print; sites recolour them through --upright-tone-* properties.
 */
function toneAndLinkRules(prefix: string, input: RenderInput): string {
  const id = `#${prefix}`
  const used = new Set(input.tones?.filter((t): t is Tone => t !== undefined))
  let css = ''
  if (used.has('external')) css += `${id} .upright-tone-external{stroke-dasharray:5 3}`
  if (used.has('new')) css += `${id} .upright-tone-new{stroke-width:var(--upright-tone-new-stroke-width,2.5px)}`
  if (used.has('retiring')) css += `${id} .upright-tone-retiring{stroke-dasharray:1 3;fill-opacity:var(--upright-tone-retiring-fill-opacity,.45)}`
  if (input.links?.some((l) => l !== undefined)) {
    css += `${id} .upright-links a{cursor:pointer}${id} .upright-links a:focus{outline:none}${id} .upright-links a:focus rect,${id} .upright-links a:hover rect{stroke:var(--upright-link-focus,var(--upright-node-stroke,var(--_ns)));stroke-width:2.5px}`
  }
  return css
}

/** Lines of `text` placed in the box `rect` (top-left corner and size) with `options`, centred. */
function textInBox(text: string, cx: number, cy: number, options: Readonly<LabelBoxOptions>, f: (v: number) => string, className?: string): Element | null {
  const box = labelBox(text, options)
  const spans: ElementContent[] = []
  box.lines.forEach((line, i) => {
    if (line !== '') spans.push(s('tspan', {x: f(cx), y: f(cy + box.baselines[i]!)}, line))
  })
  const cls = className ? [className] : undefined
  if (spans.length === 0) return null
  if (spans.length === 1) {
    const only = spans[0] as Element
    return s('text', {className: cls, x: only.properties['x'], y: only.properties['y']}, only.children)
  }
  return s('text', {className: cls}, spans)
}

/** Tier bands behind everything, and their captions: one group, bands first. */
function tierBands(input: RenderInput, settings: Settings): Element | null {
  const tiers = input.tiers ?? []
  if (tiers.length === 0) return null
  const f = (v: number): string => formatNumber(v, settings.precision)
  const light = settings.theme.scheme === 'dark' ? DECORATION.dark : DECORATION.light
  const bands = tiers.map((tier) => s('rect', {x: f(tier.band.x), y: f(tier.band.y), width: f(tier.band.width), height: f(tier.band.height), rx: f(Math.min(6, tier.band.height / 2, tier.band.width / 2))}))
  const captions = tiers.flatMap((tier) => {
    const text = textInBox(tier.text, tier.caption.x + tier.caption.width / 2, tier.caption.y + tier.caption.height / 2, TIER_CAPTION_BOX, f)
    return text ? [text] : []
  })
  return s('g', {className: [DECORATION_CLASS.tiers], fill: light.tierFill}, [
    ...bands,
    s('g', {className: [DECORATION_CLASS.tierCaptions], fill: light.tierText, fontFamily: FONT_STACK, fontSize: f(TIER_CAPTION_BOX.fontSize!), textAnchor: 'middle'}, captions)
  ])
}

/** Edge labels: a pill over the line in the box the layout kept free, and the text in it. */
function edgeLabelPills(input: RenderInput, settings: Settings): Element | null {
  const labels = [...(input.edgeLabels ?? [])].sort((a, b) => a.edge - b.edge)
  if (labels.length === 0) return null
  const f = (v: number): string => formatNumber(v, settings.precision)
  const light = settings.theme.scheme === 'dark' ? DECORATION.dark : DECORATION.light
  const background = settings.theme.scheme === 'dark' ? settings.theme.dark.background : settings.theme.light.background
  const pills = labels.map((label) =>
    s('rect', {x: f(label.x - label.width / 2), y: f(label.y - label.height / 2), width: f(label.width), height: f(label.height), rx: f(Math.min(label.width, label.height) / 2)})
  )
  const texts = labels.flatMap((label) => {
    const text = textInBox(label.text, label.x, label.y, EDGE_LABEL_BOX, f)
    return text ? [text] : []
  })
  return s('g', {className: [DECORATION_CLASS.edgeLabels], fill: background, stroke: light.labelStroke, strokeWidth: 1}, [
    ...pills,
    s('g', {className: [DECORATION_CLASS.edgeLabelText], fill: light.labelText, stroke: 'none', fontFamily: FONT_STACK, fontSize: f(EDGE_LABEL_BOX.fontSize!), textAnchor: 'middle'}, texts)
  ])
}

/**
 * Tier and edge-label rules, only when used: paints through public properties with our defaults
 * (switched with the scheme), and the smaller font pinned by id like the labels' (see stylesheet).
 */
function decorationRules(prefix: string, input: RenderInput, scheme: 'auto' | 'light' | 'dark'): string {
  const id = `#${prefix}`
  const tiers = (input.tiers?.length ?? 0) > 0
  const labels = (input.edgeLabels?.length ?? 0) > 0
  if (!tiers && !labels) return ''
  const paint = (p: (typeof DECORATION)[keyof typeof DECORATION]): string => {
    let css = ''
    if (tiers) {
      css += `${id} .${DECORATION_CLASS.tiers}{fill:var(--upright-tier-fill,${p.tierFill})}`
      css += `${id} .${DECORATION_CLASS.tierCaptions}{fill:var(--upright-tier-text,${p.tierText})}`
    }
    if (labels) {
      css += `${id} .${DECORATION_CLASS.edgeLabels}{fill:var(--upright-edge-label-fill,var(--upright-background,var(--_bg)));stroke:var(--upright-edge-label-stroke,${p.labelStroke})}`
      css += `${id} .${DECORATION_CLASS.edgeLabelText}{fill:var(--upright-edge-label-text,${p.labelText});stroke:none}`
    }
    return css
  }
  let css = paint(scheme === 'dark' ? DECORATION.dark : DECORATION.light)
  if (scheme === 'auto') css += `@media (prefers-color-scheme:dark){${paint(DECORATION.dark)}}`
  const fonts: string[] = []
  if (tiers) fonts.push(`${id} .${DECORATION_CLASS.tierCaptions} text{font-size:${TIER_CAPTION_BOX.fontSize}px}`)
  if (labels) fonts.push(`${id} .${DECORATION_CLASS.edgeLabelText} text{font-size:${EDGE_LABEL_BOX.fontSize}px}`)
  css += fonts.join('')
  css += `@media print{${id} .${DECORATION_CLASS.tiers}{fill:#f2f2f2}${id} .${DECORATION_CLASS.tierCaptions},${id} .${DECORATION_CLASS.edgeLabelText}{fill:#000}${id} .${DECORATION_CLASS.edgeLabels}{fill:#fff;stroke:#000}}`
  return css
}
