/**
 * The pictures in README.md and docs/language.md (docs/images/build.ts): each committed SVG is what
 * `upright render` draws now, byte for byte (`npx tsx docs/images/build.ts` redraws them); the README
 * quotes every example verbatim beside its picture, language.md shows one picture per feature; and
 * the written-order pair is drawn in the two orders written, read off the SVG text positions.
 */
import {existsSync, readFileSync} from 'node:fs'
import path from 'node:path'
import {describe, expect, it} from 'vitest'
import {languageSections, pictures, render, repo} from '../../docs/images/build.ts'

const read = (file: string) => readFileSync(path.join(repo, file), 'utf8')

describe('docs/images', () => {
  const list = pictures()

  it('lists the four features for the README and for docs/language.md', () => {
    const files = list.map((p) => p.file)
    for (const name of ['tiers', 'edge-labels', 'tones', 'written-order']) {
      expect(files).toContain(`docs/images/${name}.svg`)
      expect(files).toContain(`docs/images/language-${name}.svg`)
    }
  })

  for (const picture of list) {
    it(`${picture.file} is what upright render draws now`, async () => {
      expect(existsSync(path.join(repo, picture.file)), `${picture.file}: run npx tsx docs/images/build.ts`).toBe(true)
      const svg = await render(picture)
      expect(svg.startsWith('<svg')).toBe(true)
      expect(svg === read(picture.file), `${picture.file} is stale: run npx tsx docs/images/build.ts`).toBe(true)
    })
  }

  it('the README quotes each example verbatim and shows its picture; language.md shows its own', () => {
    const readme = read('README.md')
    for (const picture of list.filter((p) => p.source.startsWith('docs/images/examples/'))) {
      const name = path.basename(picture.source, '.md')
      if (name !== 'written-order-swapped') expect(readme, name).toContain('````md\n' + read(picture.source) + '````\n')
      expect(readme, name).toMatch(new RegExp(`!\\[[^\\]]+\\]\\(docs/images/${name}\\.svg\\)`))
    }
    const language = read('docs/language.md')
    for (const {slug} of languageSections) expect(language, slug).toMatch(new RegExp(`!\\[[^\\]]+\\]\\(images/language-${slug}\\.svg\\)`))
  })

  it('draws the written-order example in the order written, and turned round when written the other way', () => {
    const x = (svg: string, label: string) => Number(new RegExp(`<text x="([\\d.]+)"[^>]*>${label}<`).exec(svg)?.[1])
    const written = read('docs/images/written-order.svg')
    const swapped = read('docs/images/written-order-swapped.svg')
    const inWritten = ['Weigh', 'Label', 'Sort'].map((l) => x(written, l))
    const inSwapped = ['Sort', 'Label', 'Weigh'].map((l) => x(swapped, l))
    for (const xs of [inWritten, inSwapped]) {
      expect(xs.every(Number.isFinite)).toBe(true)
      expect([...xs].sort((a, b) => a - b)).toEqual(xs)
    }
  })
})
