import type {Digraph} from '../graph/digraph.ts'
import type {StAugmentation} from '../augment/index.ts'

/**
 * `Flow` (declared with the diagram options) says which way edges point in the finished drawing (SVG
 * coordinates, y grows downward):
 * - `up`: sources at the bottom, every edge points towards smaller y. The embedding's left-to-right
 *   order is kept as is (no mirror).
 * - `down`: `up` mirrored top-to-bottom: sources at the top, edges point towards larger y.
 * - `right`: `up` turned a quarter turn clockwise: sources on the left, edges point towards larger x;
 *   what was left in `up` is at the top.
 * - `left`: `right` mirrored left-to-right: sources on the right, edges point towards smaller x;
 *   what was left in `up` is still at the top.
 */
import type {Flow} from '../parse/options.ts'
export type {Flow}

export interface BoxSize {
  width: number
  height: number
}

/** The st-augmentation of G (augment stage): H ⊇ G, its embedding, faces and outer face. */
export type {StAugmentation} from '../augment/index.ts'

export interface Spacing {
  /** Gap between consecutive layers, along the flow. Default 40. */
  layer: number
  /** Gap between two boxes side by side in a layer. Default 24. */
  node: number
  /** Gap between an edge bend and its neighbours in a layer, and between ports on a box side. Default 14. */
  edge: number
}

export const defaultSpacing: Readonly<Spacing> = {layer: 40, node: 24, edge: 14}

export interface LayoutInput {
  /** G, the user's graph (vertices 0..n-1, edges 0..m-1). */
  graph: Digraph
  /** The st-augmentation of G with its embedding (G's vertices and edges keep their ids in H). */
  st: StAugmentation
  /** Box size per vertex of G (label metrics plus padding). */
  boxes: ReadonlyArray<BoxSize>
  flow: Flow
  /** Gaps; each field defaults to `defaultSpacing`. Non-positive values are raised to a small minimum. */
  spacing?: Partial<Spacing> | undefined
}

export interface LayoutNode {
  vertex: number
  /** Centre of the box. */
  x: number
  y: number
  width: number
  height: number
}

export interface LayoutEdge {
  edge: number
  /** Tail to head; the first point lies on the tail box's border, the last on the head box's border. */
  points: Array<[number, number]>
}

/**
 * A drawing in SVG coordinates (origin top-left, y downward). All boxes and points lie in
 * [0, width] x [0, height] and touch each side (up to float rounding from the final translation); add
 * any margin when rendering. Edge end points lie exactly on their box's side (centre ± half size).
 */
export interface Layout {
  flow: Flow
  width: number
  height: number
  nodes: LayoutNode[]
  edges: LayoutEdge[]
}
