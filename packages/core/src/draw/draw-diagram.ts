/**
 * From a passing check to a drawing: label boxes from font metrics, then one of two layouts, both
 * crossing-free by construction:
 * - without tiers, the smaller in area of the upward layout of the st-augmentation and level drawings
 *   with fewer rows (layout/smallest-layout.ts);
 * - with tiers, the level drawing of the levels and per-level orders the exact level-planarity test
 *   found (layout/tier-layout.ts), with a band and caption per tier.
 * Edge labels ride along in both: the layout runs on the graph with every labelled edge split at a
 * label vertex whose box is sized by the label text, and the halves are joined again afterwards
 * (layout/edge-labels.ts). The guarantee comes from the stages; this module only connects them.
 */
import {stAugment, type StAugmentation} from '../augment/index.ts'
import type {DiagramCheck} from '../check/index.ts'
import type {Digraph} from '../graph/digraph.ts'
import {joinEdgeLabels, layoutSmallest, layoutTiers, type EdgeLabelBox, type Layout, type Spacing, type TierBand} from '../layout/index.ts'
import {labelBox, type LabelBoxOptions} from '../measure/index.ts'
import type {Flow, Tone} from '../parse/index.ts'

export interface DrawSettings {
  flow: Flow
  /** Font size, padding and line height of the boxes (defaults: labelBox's). */
  label?: Readonly<LabelBoxOptions> | undefined
  spacing?: Partial<Spacing> | undefined
}

/** Text and padding of an edge label's box (a pill on the edge). Renderers place its text with the same. */
export const EDGE_LABEL_BOX: Readonly<LabelBoxOptions> = {fontSize: 12, lineHeight: 1.25, paddingX: 8, paddingY: 3, minWidth: 0}

/** Text and padding of a tier caption's box. */
export const TIER_CAPTION_BOX: Readonly<LabelBoxOptions> = {fontSize: 12, lineHeight: 1.25, paddingX: 6, paddingY: 4, minWidth: 0}

/** An edge label as drawn: its box on the edge (centre and size) and its text. */
export interface DrawnEdgeLabel extends EdgeLabelBox {
  text: string
}

/** A tier as drawn: its band and caption box, its name and the caption's text. */
export interface DrawnTier extends TierBand {
  name: string
  text: string
  /** Its vertices, in the order listed. */
  vertices: number[]
}

export interface Drawing {
  layout: Layout
  /** The diagram's graph: the layout's nodes are its vertices, its edges are the layout's edges. */
  graph: Digraph
  /** Per vertex: what its box shows (the label, or the id when it has none). */
  labels: string[]
  /** Per vertex: the id as written. */
  ids: string[]
  /** Per vertex: its tone, if any. */
  tones: Array<Tone | undefined>
  /** Per vertex: its checked link target, if any. */
  links: Array<string | undefined>
  /** One per labelled edge, in edge order; empty when no edge has a label. */
  edgeLabels: DrawnEdgeLabel[]
  /** One per tier, in declared order; empty without tiers. */
  tiers: DrawnTier[]
  /**
   * The planar st-digraph of the upward embedding (its first m edges are the graph's; the extra ones
   * are not drawn). The layout starts from it when the diagram has neither tiers nor edge labels (and
   * may then keep a level drawing with fewer rows instead).
   */
  st: StAugmentation
}

export type DrawResult = {ok: true; drawing: Drawing} | {ok: false; reason: 'not-upward'}

export function drawDiagram(check: DiagramCheck, settings: Readonly<DrawSettings>): DrawResult {
  if (check.status !== 'upward' || !check.upward || !check.graph) return {ok: false, reason: 'not-upward'}
  const graph = check.graph
  const parsed = check.parsed
  const ids = parsed.vertices.map((v) => v.key)
  const labels = parsed.vertices.map((v) => v.label ?? v.key)
  const size = (text: string, options: Readonly<LabelBoxOptions>): {width: number; height: number} => {
    const box = labelBox(text, options)
    return {width: box.width, height: box.height}
  }
  const boxes = labels.map((label) => size(label, settings.label ?? {}))
  const st = stAugment(check.upward)

  // The graph the layout runs on: with edge labels, the split graph and a box per label vertex.
  const split = check.labels
  const edgeLabelText = split ? split.labelledEdges.map((e) => parsed.edges[e]!.label ?? '') : []
  const work = split?.graph ?? graph
  const workBoxes = [...boxes, ...edgeLabelText.map((text) => size(text, EDGE_LABEL_BOX))]

  let layout: Layout
  let tiers: DrawnTier[] = []
  if (check.levels && parsed.tiers) {
    const captions = parsed.tiers.map((tier) => size(tier.label ?? tier.name, TIER_CAPTION_BOX))
    const tiered = layoutTiers({
      graph: work,
      level: check.levels.level,
      tierLevel: check.levels.tierLevel,
      orders: check.levels.orders,
      boxes: workBoxes,
      captions,
      flow: settings.flow,
      spacing: settings.spacing
    })
    layout = tiered.layout
    tiers = tiered.tiers.map((band) => {
      const tier = parsed.tiers![band.tier]!
      return {...band, name: tier.name, text: tier.label ?? tier.name, vertices: [...tier.vertices]}
    })
  } else {
    const workSt = split?.upward ? stAugment(split.upward) : st
    layout = layoutSmallest({graph: work, st: workSt, boxes: workBoxes, flow: settings.flow, spacing: settings.spacing}).layout
  }

  let edgeLabels: DrawnEdgeLabel[] = []
  if (split) {
    const joined = joinEdgeLabels(layout, graph.vertexCount, graph.edgeCount, split.labelledEdges)
    layout = joined.layout
    edgeLabels = joined.labels.map((box, k) => ({...box, text: edgeLabelText[k]!}))
  }
  const tones = parsed.vertices.map((v) => v.tone)
  const links = parsed.vertices.map((v) => v.href)
  return {ok: true, drawing: {layout, graph, labels, ids, tones, links, edgeLabels, tiers, st}}
}
