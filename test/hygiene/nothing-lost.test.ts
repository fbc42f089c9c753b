/**
 * Nothing lost: a Markdown tree that goes through remark-upright comes out with every node unchanged
 * (type, value, attributes, position, order) except the passing diagrams, each replaced by one figure
 * in the same place. Failing diagrams with no drawing (syntax error, a size limit, bad option, empty)
 * stay exactly as written in both failure modes; a cycle, a K3,3 and a not-upward diagram stay as
 * written in fail mode and become warn mode's marked fallback figure, in their own place. Drawings as
 * hast and as html.
 */
import remarkDirective from 'remark-directive'
import remarkParse from 'remark-parse'
import remarkUpright from 'remark-upright'
import {unified} from 'unified'
import {describe, expect, it} from 'vitest'

/** The part of an mdast node these checks read (the mdast types are not a dependency of the root). */
interface MdNode {
  type: string
  lang?: string | null
  name?: string
  value?: string
  attributes?: Record<string, string | null | undefined> | null
  children?: MdNode[]
}
type Root = MdNode
type RootContent = MdNode

/** Every diagram that passes has the comment `# passes` on its first body line. */
const markdown = `# Millbrook handbook

Intro with *emphasis*, **strong**, \`code\`, a [link](https://example.org "t"), ![img](a.png) and <https://example.org>.
A hard break follows\\
here. Text directive :abbr[HTML]{title="HyperText"}.

<div class="raw">raw html</div>

\`\`\`upright
# passes
flour -> dough -> bread
flour -> dough
\`\`\`

> A quote with a failing diagram:
>
> \`\`\`upright
> a -> b -> c -> a
> \`\`\`

1. first item
2. second item with a diagram:

   \`\`\`upright flow=down title="Shift"
   # passes
   open -> bake -> close
   \`\`\`

   - nested *list*

\`\`\`js
const x = 1 // other code stays
\`\`\`

---

:::note
A container directive of another name.
:::

\`\`\`upright
a -> ;
\`\`\`

::video{src="intro.mp4"}

\`\`\`upright
a1, a2, a3 -> b1, b2, b3
\`\`\`

\`\`\`upright
notes -> curation, catalogue, archive
sheets -> curation, catalogue, archive
curation -> catalogue, archive
\`\`\`

\`\`\`upright colour=red
a -> b
\`\`\`

\`\`\`upright
# only a comment
\`\`\`

:::upright{title="Directive"}
# passes
x "Ex" -> y "Why" -> z
:::

\`\`\`upright
v1 -> v2 -> v3 -> v4 -> v5 -> v6 -> v7 -> v8 -> v9 -> v10 -> v11 -> v12 -> v13
\`\`\`

[ref]: https://example.org/ref "Reference"

Last paragraph with a [reference][ref].
`

function parse(): Root {
  return unified().use(remarkParse).use(remarkDirective).parse(markdown) as MdNode
}

const isPassingDiagram = (node: RootContent): boolean =>
  (node.type === 'code' && node.lang === 'upright' && (node.value ?? '').startsWith('# passes')) ||
  (node.type === 'containerDirective' && node.name === 'upright' && node.attributes?.['title'] === 'Directive')

/** The diagrams warn mode also replaces: by a marked fallback drawing (cycle, K3,3, not upward). */
const hasFallback = (node: RootContent): boolean =>
  node.type === 'code' && node.lang === 'upright' && /^(?:a -> b -> c -> a|a1, a2, a3|notes ->)/.test(node.value ?? '')

const isFigure = (node: RootContent): boolean => node.type === 'uprightFigure' || (node.type === 'html' && (node.value ?? '').startsWith('<figure class="upright'))

/** A deep copy without the nodes `drop` matches; returns how many were dropped. */
function without(tree: Root, drop: (node: RootContent) => boolean): {tree: Root; dropped: number} {
  let dropped = 0
  const copy = (node: Root | RootContent): Root | RootContent => {
    if (!node.children) return structuredClone(node)
    const children = node.children.filter((child) => {
      if (drop(child)) {
        dropped++
        return false
      }
      return true
    })
    return {...structuredClone({...node, children: []}), children: children.map(copy)}
  }
  return {tree: copy(tree), dropped}
}

describe('remark-upright changes nothing but the passing diagrams', () => {
  for (const onFailure of ['warn', 'fail'] as const) {
    for (const output of ['hast', 'html'] as const) {
      it(`onFailure ${onFailure}, output ${output}`, async () => {
        const original = parse()
        const tree = parse()
        const processor = unified().use(remarkParse).use(remarkDirective).use(remarkUpright, {onFailure, output, limits: {maxVertices: 12}})
        const file = {value: markdown, messages: []}
        const outcome = await (processor.run(tree as never, file as never) as unknown as Promise<unknown>).then(
          () => 'ok',
          (error: unknown) => error
        )
        if (onFailure === 'fail') expect(outcome).toBeInstanceOf(Error)
        else expect(outcome).toBe('ok')

        // Fail mode replaces the passing diagrams only; warn mode also draws the failing ones that
        // have a fallback drawing. Everything else, failing blocks included, is untouched.
        const replaced = onFailure === 'warn' ? (node: RootContent) => isPassingDiagram(node) || hasFallback(node) : isPassingDiagram
        const expected = without(original, replaced)
        const actual = without(tree, isFigure)
        expect(expected.dropped).toBe(onFailure === 'warn' ? 6 : 3)
        expect(actual.dropped).toBe(expected.dropped)
        expect(actual.tree).toEqual(expected.tree)

        // The failing diagrams are all still there, and each was reported.
        const rules = (file.messages as Array<{ruleId: string}>).map((m) => m.ruleId).sort()
        expect(rules).toEqual(['cycle', 'duplicate-edge', 'empty-diagram', 'nonplanar', 'not-upward', 'too-many-vertices', 'unexpected-character', 'unknown-option'].sort())
      })
    }
  }
})
