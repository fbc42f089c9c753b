/**
 * A small log-log line chart as SVG, for bench/growth.ts: one polyline with point markers per
 * series, decade grid lines and labels on both axes, and a legend. Our own few lines instead of a
 * plotting dependency; deterministic output (fixed number formatting).
 */
export interface Series {
  name: string
  colour: string
  points: Array<[number, number]>
}

export interface ChartOptions {
  title: string
  xLabel: string
  yLabel: string
  width?: number
  height?: number
}

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')
const fmt = (v: number) => (Math.round(v * 10) / 10).toString()

export function logLogChart(series: readonly Series[], options: ChartOptions): string {
  const width = options.width ?? 900
  const height = options.height ?? 480
  const margin = {left: 78, right: 300, top: 44, bottom: 58}
  const all = series.flatMap((s) => s.points).filter(([x, y]) => x > 0 && y > 0)
  const lx = all.map(([x]) => Math.log10(x))
  const ly = all.map(([, y]) => Math.log10(y))
  const x0 = Math.floor(Math.min(...lx))
  const x1 = Math.ceil(Math.max(...lx))
  const y0 = Math.floor(Math.min(...ly))
  const y1 = Math.ceil(Math.max(...ly))
  const plotW = width - margin.left - margin.right
  const plotH = height - margin.top - margin.bottom
  const px = (x: number) => margin.left + ((Math.log10(x) - x0) / (x1 - x0 || 1)) * plotW
  const py = (y: number) => margin.top + plotH - ((Math.log10(y) - y0) / (y1 - y0 || 1)) * plotH
  const out: string[] = []
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="DejaVu Sans, Verdana, sans-serif" font-size="12">`)
  out.push(`<title>${esc(options.title)}</title>`)
  out.push(`<rect width="${width}" height="${height}" fill="#fcfbf7"/>`)
  out.push(`<text x="${margin.left}" y="24" font-size="15" font-weight="bold" fill="#14252a">${esc(options.title)}</text>`)
  for (let d = x0; d <= x1; d++) {
    const x = fmt(px(10 ** d))
    out.push(`<line x1="${x}" y1="${margin.top}" x2="${x}" y2="${margin.top + plotH}" stroke="#d9dedb"/>`)
    out.push(`<text x="${x}" y="${margin.top + plotH + 18}" text-anchor="middle" fill="#33454b">10${superscript(d)}</text>`)
  }
  for (let d = y0; d <= y1; d++) {
    const y = fmt(py(10 ** d))
    out.push(`<line x1="${margin.left}" y1="${y}" x2="${margin.left + plotW}" y2="${y}" stroke="#d9dedb"/>`)
    out.push(`<text x="${margin.left - 8}" y="${fmt(py(10 ** d) + 4)}" text-anchor="end" fill="#33454b">${tickLabel(d)}</text>`)
  }
  out.push(`<rect x="${margin.left}" y="${margin.top}" width="${plotW}" height="${plotH}" fill="none" stroke="#56707a"/>`)
  out.push(`<text x="${margin.left + plotW / 2}" y="${height - 16}" text-anchor="middle" fill="#14252a">${esc(options.xLabel)}</text>`)
  out.push(`<text transform="translate(20 ${margin.top + plotH / 2}) rotate(-90)" text-anchor="middle" fill="#14252a">${esc(options.yLabel)}</text>`)
  series.forEach((s, i) => {
    const pts = s.points.filter(([x, y]) => x > 0 && y > 0)
    if (pts.length > 1) out.push(`<polyline fill="none" stroke="${s.colour}" stroke-width="2" points="${pts.map(([x, y]) => `${fmt(px(x))},${fmt(py(y))}`).join(' ')}"/>`)
    for (const [x, y] of pts) out.push(`<circle cx="${fmt(px(x))}" cy="${fmt(py(y))}" r="3.5" fill="${s.colour}"/>`)
    const ly = margin.top + 10 + i * 22
    const lx0 = margin.left + plotW + 16
    out.push(`<line x1="${lx0}" y1="${ly}" x2="${lx0 + 22}" y2="${ly}" stroke="${s.colour}" stroke-width="2"/>`)
    out.push(`<text x="${lx0 + 28}" y="${ly + 4}" fill="#14252a">${esc(s.name)}</text>`)
  })
  out.push('</svg>')
  return out.join('\n') + '\n'
}

function superscript(n: number): string {
  const digits = '⁰¹²³⁴⁵⁶⁷⁸⁹'
  return (n < 0 ? '⁻' : '') + String(Math.abs(n)).split('').map((c) => digits[Number(c)]).join('')
}

/** Milliseconds on a log axis, labelled in ms or s. */
function tickLabel(decade: number): string {
  const ms = 10 ** decade
  if (ms >= 1000) return `${ms / 1000} s`
  return ms >= 1 ? `${ms} ms` : `${ms.toPrecision(1)} ms`
}

/** Least-squares slope of log y on log x: the exponent k in y ≈ c·x^k. */
export function fitExponent(points: ReadonlyArray<readonly [number, number]>): number | undefined {
  const p = points.filter(([x, y]) => x > 0 && y > 0).map(([x, y]) => [Math.log(x), Math.log(y)] as const)
  if (p.length < 2) return undefined
  const mx = p.reduce((s, [x]) => s + x, 0) / p.length
  const my = p.reduce((s, [, y]) => s + y, 0) / p.length
  let sxy = 0
  let sxx = 0
  for (const [x, y] of p) {
    sxy += (x - mx) * (y - my)
    sxx += (x - mx) ** 2
  }
  return sxx === 0 ? undefined : sxy / sxx
}
