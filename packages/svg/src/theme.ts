/**
 * Colours and the stylesheet embedded in each SVG.
 *
 * Every paint goes through a public custom property with our default as its fallback, e.g.
 * `fill: var(--upright-node-fill, var(--_nf))`, where the private `--_nf` holds the light or dark default
 * (switched by `prefers-color-scheme`). A site that sets `--upright-node-fill` anywhere above the SVG
 * owns that colour in both schemes; one that sets nothing gets our palette. Rules are scoped to the
 * diagram's id, so diagrams rendered with different options never restyle each other.
 *
 * Presentation attributes carry the light palette too, for renderers without CSS; any CSS wins over
 * them.
 */

export interface Palette {
  /** Card behind the drawing. */
  background: string
  /** Inside of a vertex box. */
  nodeFill: string
  /** Outline of a vertex box. */
  nodeStroke: string
  /** Label text. */
  nodeText: string
  /** Edge lines. */
  edgeStroke: string
  /** Arrowheads. */
  arrowFill: string
}

export interface Theme {
  /**
   * Which palette the SVG carries: `auto` (default) follows the reader's `prefers-color-scheme`;
   * `light` or `dark` pins one.
   */
  scheme?: 'auto' | 'light' | 'dark'
  /** Replaces colours of the light palette. */
  light?: Partial<Palette>
  /** Replaces colours of the dark palette. */
  dark?: Partial<Palette>
}

export const LIGHT_PALETTE: Readonly<Palette> = {
  background: '#fcfbf7',
  nodeFill: '#eaf2ef',
  nodeStroke: '#2e5e57',
  nodeText: '#14252a',
  edgeStroke: '#56707a',
  arrowFill: '#56707a'
}

export const DARK_PALETTE: Readonly<Palette> = {
  background: '#141b1e',
  nodeFill: '#1d2b2d',
  nodeStroke: '#86c5b5',
  nodeText: '#e4eee9',
  edgeStroke: '#93a9b0',
  arrowFill: '#93a9b0'
}

/** Stroke widths, px, when the site sets no `--upright-*-stroke-width`. */
export const NODE_STROKE_WIDTH = 1.25
export const EDGE_STROKE_WIDTH = 1.5

/** Class names on the drawn elements: public hooks for site CSS, listed in the README. */
export const CLASS = {
  /** The <svg> element. */
  root: 'upright',
  /** The card (<rect>) behind the drawing. */
  background: 'upright-background',
  /** The one <path> that holds every edge line (one subpath an edge). */
  lines: 'upright-lines',
  /** <g> of the vertex boxes (<rect>). */
  boxes: 'upright-boxes',
  /** <g> of the labels (<text>). */
  labels: 'upright-labels',
  /** The one <path> that holds every arrowhead. */
  arrows: 'upright-arrows'
} as const

// A colour is pasted into CSS, so only plain colour syntax is accepted: hex, a keyword, or a colour
// function with numbers, percentages, units and separators in it.
const COLOUR = /^(#[0-9a-f]{3,8}|[a-z]+|[a-z]+\([0-9a-z.,%/+\- ]*\))$/i

export interface ResolvedTheme {
  scheme: 'auto' | 'light' | 'dark'
  light: Palette
  dark: Palette
}

export function resolveTheme(theme: Readonly<Theme> | null | undefined): ResolvedTheme {
  const scheme = theme?.scheme ?? 'auto'
  if (scheme !== 'auto' && scheme !== 'light' && scheme !== 'dark') {
    throw new RangeError(`theme.scheme must be auto, light or dark, got ${String(scheme)}`)
  }
  const light = {...LIGHT_PALETTE, ...theme?.light}
  const dark = {...DARK_PALETTE, ...theme?.dark}
  for (const palette of [light, dark]) {
    for (const [key, value] of Object.entries(palette)) {
      if (typeof value !== 'string' || !COLOUR.test(value)) {
        throw new RangeError(`theme colour ${key} must be a plain CSS colour, got ${JSON.stringify(value)}`)
      }
    }
  }
  return {scheme, light, dark}
}

function privateProperties(p: Palette): string {
  return `--_bg:${p.background};--_nf:${p.nodeFill};--_ns:${p.nodeStroke};--_nt:${p.nodeText};--_es:${p.edgeStroke};--_af:${p.arrowFill}`
}

/**
 * The stylesheet for the diagram whose root element has id `id`. `font` is the CSS font shorthand
 * the boxes were measured with: it is pinned on the text elements by id so that a site rule such as
 * `svg text {font-size: 12px}` cannot make labels outgrow their boxes.
 */
export function stylesheet(id: string, theme: ResolvedTheme, font: string): string {
  const s = `#${id}`
  const first = theme.scheme === 'dark' ? theme.dark : theme.light
  const rules = [
    // Sizing at zero specificity, so any site rule (say, max-width:none in a scrolling wrapper) wins.
    `:where(${s}){max-width:100%;height:auto}`,
    `${s}{${privateProperties(first)}}`,
    theme.scheme === 'auto' ? `@media (prefers-color-scheme:dark){${s}{${privateProperties(theme.dark)}}}` : '',
    `${s} .${CLASS.background}{fill:var(--upright-background,var(--_bg))}`,
    `${s} .${CLASS.boxes}{fill:var(--upright-node-fill,var(--_nf));stroke:var(--upright-node-stroke,var(--_ns));` +
      `stroke-width:var(--upright-node-stroke-width,${NODE_STROKE_WIDTH}px)}`,
    `${s} .${CLASS.labels}{fill:var(--upright-node-text,var(--_nt))}`,
    `${s} text{font:${font}}`,
    `${s} .${CLASS.lines}{fill:none;stroke:var(--upright-edge-stroke,var(--_es));` +
      `stroke-width:var(--upright-edge-stroke-width,${EDGE_STROKE_WIDTH}px)}`,
    `${s} .${CLASS.arrows}{fill:var(--upright-arrow-fill,var(--upright-edge-stroke,var(--_af)))}`,
    // Paper: dark ink on white whatever the screen scheme or site palette.
    `@media print{${s} .${CLASS.background},${s} .${CLASS.boxes}{fill:#fff}${s} .${CLASS.boxes},${s} .${CLASS.lines}{stroke:#000}` +
      `${s} .${CLASS.labels},${s} .${CLASS.arrows}{fill:#000}}`
  ]
  return rules.join('')
}
