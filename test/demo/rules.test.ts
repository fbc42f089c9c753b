/**
 * docs/rules.md against the code: every rule id the packages can report has a section whose heading
 * (and so its anchor) is exactly the id, and every section's example fails with that rule at the
 * position its text gives.
 */
import {readFileSync, readdirSync, statSync} from 'node:fs'
import path from 'node:path'
import {fileURLToPath} from 'node:url'
import {describe, expect, it} from 'vitest'
import {checkTree, parseMarkdown, type BlockResult} from 'remark-upright'

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..')
const rulesText = readFileSync(path.join(repo, 'docs/rules.md'), 'utf8')

/** Rule ids written as literals in the packages' sources (`ruleId: '…'`, `fail('…'`, `error('…'`). */
function ruleIdsInSources(): Set<string> {
  const ids = new Set<string>()
  const walk = (dir: string): void => {
    for (const name of readdirSync(dir)) {
      const full = path.join(dir, name)
      if (statSync(full).isDirectory()) walk(full)
      else if (name.endsWith('.ts')) {
        const text = readFileSync(full, 'utf8')
        for (const m of text.matchAll(/(?:ruleId: |\bfail\(|\berror\(\s*)'([a-z]+(?:-[a-z]+)*)'/g)) ids.add(m[1]!)
      }
    }
  }
  for (const pkg of readdirSync(path.join(repo, 'packages'))) {
    const src = path.join(repo, 'packages', pkg, 'src')
    try {
      statSync(src)
    } catch {
      continue
    }
    walk(src)
  }
  return ids
}

interface Section {
  id: string
  /** Line of the heading in docs/rules.md. */
  line: number
  text: string
}

function sections(): Section[] {
  const lines = rulesText.split('\n')
  const found: Section[] = []
  lines.forEach((line, i) => {
    const m = /^## (\S+)$/.exec(line)
    if (m) found.push({id: m[1]!, line: i + 1, text: ''})
  })
  found.forEach((s, k) => {
    const end = k + 1 < found.length ? found[k + 1]!.line - 1 : lines.length
    s.text = lines.slice(s.line - 1, end).join('\n')
  })
  return found
}

/** Headings become anchors by lower-casing and dropping punctuation other than `-` (common practice on code hosts). */
function anchor(heading: string): string {
  return heading.toLowerCase().replace(/[^\p{L}\p{N}\s-]/gu, '').replace(/\s/g, '-')
}

describe('docs/rules.md', () => {
  it('has a section, with the id as its anchor, for every rule id in the sources', () => {
    const ids = ruleIdsInSources()
    // The ids the brief names, so a grep that found too little cannot pass quietly.
    for (const id of ['cycle', 'nonplanar', 'not-upward', 'undecided', 'missing-vertex', 'unknown-option']) expect(ids).toContain(id)
    const headings = sections().map((s) => anchor(s.id))
    for (const id of ids) expect(headings, id).toContain(id)
    expect(headings).toContain('check-unavailable')
  })

  it('each example fails with its own rule, at the place the text gives', () => {
    const results = checkTree(parseMarkdown(rulesText), rulesText, {})
    const examples: string[] = []
    for (const section of sections()) {
      const inSection = results.filter((r) => r.block.start.line > section.line && r.block.start.line < section.line + section.text.split('\n').length)
      const example = inSection[0]
      // Options are shown as whole fences (inside a Markdown fence), read below; `undecided`,
      // `check-unavailable` and `internal-error` have no diagram that shows them reliably.
      if (!example) continue
      examples.push(section.id)
      const message = example.messages.find((m) => m.ruleId === section.id)
      expect(message, `${section.id}: ${JSON.stringify(example.messages.map((m) => m.ruleId))}`).toBeDefined()
      const stated = /\((\d+):(\d+)\)/.exec(section.text)
      if (stated) {
        // Positions in the text are within the diagram body: line 1 is the line after the fence.
        const at = bodyPoint(example, message!.place.start)
        expect(`${at.line}:${at.column}`, section.id).toBe(`${stated[1]}:${stated[2]}`)
      }
    }
    expect(examples.length).toBeGreaterThanOrEqual(13)
  })

  it('each option example fails with its own rule', () => {
    let checked = 0
    for (const section of sections()) {
      const fence = /^````markdown\n([\s\S]*?)\n````$/m.exec(section.text)
      if (!fence || !/^(?:```|:::)upright/m.test(fence[1]!)) continue
      const text = fence[1]! + '\n'
      const [result] = checkTree(parseMarkdown(text), text, {})
      expect(result?.messages.map((m) => m.ruleId), section.id).toContain(section.id)
      checked++
    }
    expect(checked).toBe(3)
  })
})

function bodyPoint(result: BlockResult, p: {line: number; column: number}): {line: number; column: number} {
  return {line: p.line - result.block.start.line, column: p.column}
}
