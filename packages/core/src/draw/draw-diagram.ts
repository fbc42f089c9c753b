/**
 * From a passing check to a drawing: label boxes from font metrics, the st-augmentation of the
 * upward embedding, then the layout. The guarantee comes from the stages (upward planar embedding →
 * planar st-supergraph → layout crossing-free by construction); this module only connects them.
 */
import {stAugment, type StAugmentation} from '../augment/index.ts'
import type {DiagramCheck} from '../check/index.ts'
import {layoutUpward, type Layout, type Spacing} from '../layout/index.ts'
import {labelBox, type LabelBoxOptions} from '../measure/index.ts'
import type {Flow, Tone} from '../parse/index.ts'

export interface DrawSettings {
  flow: Flow
  /** Font size, padding and line height of the boxes (defaults: labelBox's). */
  label?: Readonly<LabelBoxOptions> | undefined
  spacing?: Partial<Spacing> | undefined
}

export interface Drawing {
  layout: Layout
  /** Per vertex: what its box shows (the label, or the id when it has none). */
  labels: string[]
  /** Per vertex: the id as written. */
  ids: string[]
  /** Per vertex: its tone, if any. */
  tones: Array<Tone | undefined>
  /** Per vertex: its checked link target, if any. */
  links: Array<string | undefined>
  /** The planar st-digraph the layout was built from (its extra edges are not drawn). */
  st: StAugmentation
}

export type DrawResult = {ok: true; drawing: Drawing} | {ok: false; reason: 'not-upward'}

export function drawDiagram(check: DiagramCheck, settings: Readonly<DrawSettings>): DrawResult {
  if (check.status !== 'upward' || !check.upward || !check.graph) return {ok: false, reason: 'not-upward'}
  const ids = check.parsed.vertices.map((v) => v.key)
  const labels = check.parsed.vertices.map((v) => v.label ?? v.key)
  const boxes = labels.map((label) => {
    const box = labelBox(label, settings.label ?? {})
    return {width: box.width, height: box.height}
  })
  const st = stAugment(check.upward)
  const layout = layoutUpward({graph: check.graph, st, boxes, flow: settings.flow, spacing: settings.spacing})
  const tones = check.parsed.vertices.map((v) => v.tone)
  const links = check.parsed.vertices.map((v) => v.href)
  return {ok: true, drawing: {layout, labels, ids, tones, links, st}}
}
