/**
 * The whole way from diagram text to SVG with core's real check and layout: what the CLI and the
 * remark plugin do. The drawing must show every vertex once with its label inside its box, draw and
 * describe every edge of the user's graph (none of the augmentation's), and do so for all four flows.
 */
import {describe, expect, it} from 'vitest'
import {checkDiagram, drawDiagram, labelBox} from '@upright/core'
import {renderSvg} from '@upright/svg'
import {elements, parseManyWithPython, parseWithPython} from './support.ts'

const text = [
  'quarry "Stone quarry" -> mason "Mason’s yard", kiln "Lime kiln"',
  'mason, kiln -> wall "Harbour wall"',
  'kiln -> plaster "Plaster works" -> wall',
  'wall -> light "Lighthouse"'
].join('\n')

describe('text → check → layout → SVG', () => {
  const flows = ['up', 'down', 'left', 'right'] as const
  const check = checkDiagram(text)
  const rendered = flows.map((flow) => {
    const drawn = drawDiagram(check, {flow})
    if (!drawn.ok) throw new Error(`not drawn (flow ${flow})`)
    const {layout, labels, ids, st} = drawn.drawing
    return {flow, layout, labels, ...renderSvg({layout, graph: st.graph, labels, ids, title: 'Harbour works'})}
  })
  // One Python process reads all four SVGs.
  const views = parseManyWithPython(rendered.map((r) => r.svg))

  rendered.forEach(({flow, layout, labels, hast}, i) => {
    it(`draws and describes every vertex and edge (flow ${flow})`, () => {
      expect(check.status).toBe('upward')
      const g = check.graph!
      const all = elements(hast)
      expect(all.filter((e) => e.tagName === 'rect')).toHaveLength(1 + g.vertexCount)
      // one subpath per drawn edge of the user's graph
      const lines = all.find((e) => (e.properties['className'] as string[] | undefined)?.includes('upright-lines'))!
      expect(String(lines.properties['d']).match(/[Mm]/g)).toHaveLength(g.edgeCount)
      expect(layout.edges.map((e) => e.edge).sort((a, b) => a - b)).toEqual([...Array(g.edgeCount).keys()])

      for (const n of layout.nodes) {
        const box = labelBox(labels[n.vertex]!)
        expect(n.width).toBeGreaterThanOrEqual(box.width)
        expect(n.height).toBeGreaterThanOrEqual(box.height)
      }

      const seen = views[i]!
      expect([...seen.texts].sort()).toEqual([...labels].sort())
      const word = {up: 'upward', down: 'downward', left: 'to the left', right: 'to the right'}[flow]
      expect(seen.desc).toContain(`Arrows point ${word}.`)
      expect(seen.desc).toContain('Stone quarry points to Mason’s yard and Lime kiln.')
      expect(seen.desc).toContain('Lime kiln points to Harbour wall and Plaster works.')
      expect(seen.desc).toContain('Lighthouse points to nothing.')
      expect(seen.title).toBe('Harbour works')
    })
  })

  it('renders a lone vertex and keeps the documented structure', () => {
    const check = checkDiagram('beacon "Beacon"')
    const drawn = drawDiagram(check, {flow: 'up'})
    if (!drawn.ok) throw new Error('not drawn')
    const {layout, labels, ids, st} = drawn.drawing
    const r = renderSvg({layout, graph: st.graph, labels, ids})
    const seen = parseWithPython(r.svg)
    expect(seen.desc).toBe('1 vertex and 0 edges. Arrows point upward. Beacon points to nothing.')
    const groups = elements(r.hast).filter((e) => e.tagName === 'g').map((e) => e.properties['className'])
    expect(groups).toEqual([['upright-boxes'], ['upright-labels']])
  })
})
