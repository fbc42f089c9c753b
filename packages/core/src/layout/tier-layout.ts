/**
 * A diagram with tiers: the level drawing (level-layout.ts) of the levels and orders the check found,
 * plus one quiet band per tier across the whole drawing and a caption for it in a gutter before the
 * drawing (left of it for flows up and down, above it for left and right). Captions stay clear of
 * every box and edge: the gutter lies outside the drawing, and a tier's band is made at least as thick
 * as its caption needs.
 */
import type {Digraph} from '../graph/digraph.ts'
import type {LevelItem} from '../level/level-planarity.ts'
import {layoutLevels} from './level-layout.ts'
import {defaultSpacing, type BoxSize, type Flow, type Layout, type Spacing} from './types.ts'

/** A rectangle in SVG coordinates: top-left corner and size. */
export interface PlacedRect {
  x: number
  y: number
  width: number
  height: number
}

export interface TierBand {
  /** Index into the diagram's tiers (0 = declared first, where edges start). */
  tier: number
  /** Its level in the level drawing. */
  level: number
  /** The band behind the tier's boxes, across the whole drawing. */
  band: PlacedRect
  /** Where the caption's box goes (text centred in it). */
  caption: PlacedRect
}

export interface TierLayoutInput {
  graph: Digraph
  level: ArrayLike<number>
  /** Level of each tier. */
  tierLevel: ArrayLike<number>
  orders: ReadonlyArray<ReadonlyArray<LevelItem>>
  boxes: ReadonlyArray<BoxSize>
  /** Caption box per tier (sized by the caller from its text). */
  captions: ReadonlyArray<BoxSize>
  flow: Flow
  spacing?: Partial<Spacing> | undefined
}

export interface TierLayout {
  layout: Layout
  tiers: TierBand[]
}

export function layoutTiers(input: TierLayoutInput): TierLayout {
  const {flow, captions} = input
  const sideways = flow === 'left' || flow === 'right'
  const levels = input.orders.length
  const gap = Math.max(1, input.spacing?.node ?? defaultSpacing.node)
  const layerGap = Math.max(1, input.spacing?.layer ?? defaultSpacing.layer)
  // A band reaches a quarter of the gap beyond its boxes, so bands of consecutive levels never touch.
  const pad = layerGap / 4
  const minBand = new Float64Array(levels)
  let gutter = 0
  for (let t = 0; t < captions.length; t++) {
    const c = captions[t]!
    const l = input.tierLevel[t]!
    minBand[l] = Math.max(minBand[l]!, sideways ? c.width : c.height)
    gutter = Math.max(gutter, sideways ? c.height : c.width)
  }
  const {layout, bands} = layoutLevels({...input, minBand})
  if (captions.length === 0) return {layout, tiers: []}

  // Shift the drawing past the gutter and a gap, and by `pad` along the flow so bands fit inside.
  const dx = sideways ? pad : gutter + gap
  const dy = sideways ? gutter + gap : pad
  const nodes = layout.nodes.map((node) => ({...node, x: node.x + dx, y: node.y + dy}))
  const edges = layout.edges.map((edge) => ({edge: edge.edge, points: edge.points.map(([px, py]): [number, number] => [px + dx, py + dy])}))
  // The far sides, from the shifted boxes and points themselves, so that float rounding of the shift
  // can never leave a box sticking out of a band that spans the whole drawing.
  let width = layout.width + dx + (sideways ? pad : 0)
  let height = layout.height + dy + (sideways ? 0 : pad)
  for (const node of nodes) {
    width = Math.max(width, node.x + node.width / 2)
    height = Math.max(height, node.y + node.height / 2)
  }
  for (const edge of edges) {
    for (const [px, py] of edge.points) {
      width = Math.max(width, px)
      height = Math.max(height, py)
    }
  }
  const shifted: Layout = {flow, width, height, nodes, edges}
  const tiers: TierBand[] = []
  for (let t = 0; t < captions.length; t++) {
    const l = input.tierLevel[t]!
    const [lo, hi] = bands[l]!
    const c = captions[t]!
    if (sideways) {
      const x0 = lo + dx - pad
      const x1 = hi + dx + pad
      tiers.push({
        tier: t,
        level: l,
        band: {x: x0, y: 0, width: x1 - x0, height: shifted.height},
        caption: {x: (x0 + x1) / 2 - c.width / 2, y: (gutter - c.height) / 2, width: c.width, height: c.height}
      })
    } else {
      const y0 = lo + dy - pad
      const y1 = hi + dy + pad
      tiers.push({
        tier: t,
        level: l,
        band: {x: 0, y: y0, width: shifted.width, height: y1 - y0},
        caption: {x: 0, y: (y0 + y1) / 2 - c.height / 2, width: c.width, height: c.height}
      })
    }
  }
  return {layout: shifted, tiers}
}
