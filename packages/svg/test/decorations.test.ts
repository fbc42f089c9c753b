/**
 * Tiers and edge labels from text to SVG, through renderSvg, `upright layout` / `upright render` and
 * the remark plugin, in all four flows. The SVG is read back by Python's XML parser (outside this
 * project): every tier caption and edge label is drawn once as text and said in <desc>, each labelled
 * edge is still one line with one arrowhead (at its real head), and the colours go through public
 * custom properties.
 */
import {mkdtempSync, writeFileSync} from 'node:fs'
import {tmpdir} from 'node:os'
import path from 'node:path'
import {describe, expect, it} from 'vitest'
import remarkParse from 'remark-parse'
import remarkRehype from 'remark-rehype'
import rehypeStringify from 'rehype-stringify'
import {unified} from 'unified'
import remarkUpright from 'remark-upright'
import {checkDiagram, drawDiagram, type Drawing} from '@upright/core'
import {renderSvg} from '@upright/svg'
import {run} from '../../cli/src/index.ts'
import {elements, parseManyWithPython} from './support.ts'

const text = [
  'tier members "Members": visitor, grower, steward',
  'tier services "Services": catalogue, lending',
  'tier stores "Seed stores": packets, vault',
  'visitor, grower -> "searches" catalogue',
  'grower, steward -> lending',
  'catalogue -> "lists" packets',
  'lending -> "reserves" packets, vault',
  'steward -> checks -> vault'
].join('\n')

const flows = ['up', 'down', 'left', 'right'] as const
const start = {up: 'from the bottom', down: 'from the top', left: 'from the right', right: 'from the left'} as const

function draw(flow: (typeof flows)[number]): Drawing {
  const drawn = drawDiagram(checkDiagram(text), {flow})
  if (!drawn.ok) throw new Error('not drawn')
  return drawn.drawing
}

const classOf = (e: {properties: Record<string, unknown>}): string[] => (e.properties['className'] as string[] | undefined) ?? []

describe('tiers and edge labels in the SVG', () => {
  const drawings = flows.map(draw)
  const rendered = drawings.map((d) =>
    renderSvg({layout: d.layout, graph: d.graph, labels: d.labels, ids: d.ids, edgeLabels: d.edgeLabels, tiers: d.tiers, title: 'Seed requests'})
  )
  const views = parseManyWithPython(rendered.map((r) => r.svg))

  flows.forEach((flow, i) => {
    it(`flow ${flow}: bands, captions, pills, one line and one arrowhead per edge, words in desc`, () => {
      const d = drawings[i]!
      const all = elements(rendered[i]!.hast)
      const group = (name: string) => all.find((e) => e.tagName === 'g' && classOf(e).includes(name))!
      expect(group('upright-tiers').children.filter((c) => c.type === 'element' && c.tagName === 'rect')).toHaveLength(3)
      expect(group('upright-edge-labels').children.filter((c) => c.type === 'element' && c.tagName === 'rect')).toHaveLength(5)
      const m = d.graph.edgeCount
      const lines = all.find((e) => classOf(e).includes('upright-lines'))!
      const arrows = all.find((e) => classOf(e).includes('upright-arrows'))!
      expect(String(lines.properties['d']).match(/[Mm]/g)).toHaveLength(m)
      expect(String(arrows.properties['d']).match(/[Mm]/g)).toHaveLength(m)

      const seen = views[i]!
      const texts = [...seen.texts].sort()
      const expected = [...d.labels, 'Members', 'Services', 'Seed stores', 'searches', 'searches', 'lists', 'reserves', 'reserves'].sort()
      expect(texts).toEqual(expected)
      expect(seen.desc).toContain(`3 tiers, ${start[flow]}: Members: visitor, grower and steward; Services: catalogue and lending; Seed stores: packets and vault.`)
      expect(seen.desc).toContain('visitor points to catalogue (edge “searches”).')
      expect(seen.desc).toContain('lending points to packets (edge “reserves”) and vault (edge “reserves”).')
      expect(seen.desc).toContain('steward points to lending and checks.')
      const css = seen.styles.join('')
      for (const property of ['--upright-tier-fill', '--upright-tier-text', '--upright-edge-label-fill', '--upright-edge-label-stroke', '--upright-edge-label-text']) {
        expect(css).toContain(property)
      }
    })
  })

  it('leaves the stylesheet of a plain diagram without tier or label rules', () => {
    const drawn = drawDiagram(checkDiagram('a -> b'), {flow: 'up'})
    if (!drawn.ok) throw new Error('not drawn')
    const d = drawn.drawing
    const svg = renderSvg({layout: d.layout, graph: d.graph, labels: d.labels, ids: d.ids, edgeLabels: d.edgeLabels, tiers: d.tiers}).svg
    expect(svg).not.toMatch(/upright-tier|upright-edge-label/)
  })
})

describe('through the CLI and the remark plugin', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'upright-decorations-'))
  writeFileSync(path.join(dir, 'seed.upright'), text)
  const cli = async (args: string[]): Promise<{code: number; out: string}> => {
    let out = ''
    const code = await run(args, {cwd: dir, env: {}, stdout: {write: (s: string) => (out += s)}, stderr: {write: () => undefined}})
    return {code, out}
  }

  it('upright layout puts edge label boxes and tiers in the JSON', async () => {
    for (const flow of flows) {
      const {code, out} = await cli(['layout', 'seed.upright', '--flow', flow])
      expect(code).toBe(0)
      const json = JSON.parse(out) as {
        nodes: Array<{id: string; x: number; y: number}>
        edges: Array<{from: string; to: string; points: Array<[number, number]>; label?: {text: string; x: number; y: number; width: number; height: number}}>
        tiers: Array<{name: string; label: string; nodes: string[]; band: {x: number; y: number; width: number; height: number}; caption: object}>
      }
      expect(json.edges.filter((e) => e.label).map((e) => `${e.from}>${e.to}:${e.label!.text}`).sort()).toEqual(
        ['catalogue>packets:lists', 'grower>catalogue:searches', 'lending>packets:reserves', 'lending>vault:reserves', 'visitor>catalogue:searches']
      )
      expect(json.tiers.map((t) => [t.name, t.label, t.nodes])).toEqual([
        ['members', 'Members', ['visitor', 'grower', 'steward']],
        ['services', 'Services', ['catalogue', 'lending']],
        ['stores', 'Seed stores', ['packets', 'vault']]
      ])
      // A tier's nodes share the band's centre line along the flow.
      const along = flow === 'up' || flow === 'down' ? 'y' : 'x'
      for (const tier of json.tiers) {
        for (const id of tier.nodes) expect(json.nodes.find((n) => n.id === id)![along]).toBeCloseTo(tier.band[along], 6)
      }
      // The points of a labelled edge run through its label's centre line.
      for (const edge of json.edges) {
        if (!edge.label) continue
        const across = along === 'y' ? 0 : 1
        expect(edge.points.some((p) => p[across] === edge.label![along === 'y' ? 'x' : 'y'])).toBe(true)
      }
    }
  })

  it('upright render draws them', async () => {
    const {code, out} = await cli(['render', 'seed.upright', '--flow', 'right'])
    expect(code).toBe(0)
    expect(out).toContain('class="upright-tiers"')
    expect(out).toContain('class="upright-edge-labels"')
  })

  it('the remark plugin draws them', async () => {
    const markdown = ['# Seed requests', '', '```upright flow=down', text, '```', ''].join('\n')
    const html = String(await unified().use(remarkParse).use(remarkUpright).use(remarkRehype).use(rehypeStringify).process(markdown))
    expect(html).toContain('class="upright-tiers"')
    expect(html).toContain('class="upright-edge-labels"')
    expect(html).toContain('3 tiers, from the top')
  })
})
