import {mulberry32} from '../../../../test/support/random.ts'

/**
 * Random acyclic digraphs as diagram texts, `count` rounds of 4 to 4 + vertexSpan − 1 vertices with
 * edge probability 0.25 from lower to higher index, lines shuffled so edge ids (written order) are not
 * sorted by head. Rounds that draw no edge give no text. Used by the written-order tests and benches.
 */
export function randomAcyclicTexts(seed: number, count: number, vertexSpan: number): string[] {
  const random = mulberry32(seed)
  const texts: string[] = []
  for (let round = 0; round < count; round++) {
    const n = 4 + Math.floor(random() * vertexSpan)
    const lines: string[] = []
    for (let u = 0; u < n; u++) for (let w = u + 1; w < n; w++) if (random() < 0.25) lines.push(`v${u} -> v${w}`)
    for (let i = lines.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1))
      ;[lines[i], lines[j]] = [lines[j]!, lines[i]!]
    }
    if (lines.length > 0) texts.push(lines.join('\n'))
  }
  return texts
}
