/**
 * Diagram options from a fence meta string and from directive attributes: exact values, messages and
 * ranges (relative to the meta string, line 1, columns 1-based, offsets 0-based).
 */
import {describe, expect, it} from 'vitest'
import {
  defaultDiagramOptions,
  optionNames,
  optionSchema,
  parseAttributeOptions,
  parseMetaOptions,
  resolveOptions,
  type Diagnostic,
  type DiagramOptions
} from '@upright/core'

/** `[ruleId, reason, "startColumn-endColumn", text covered]` for each diagnostic. */
function brief(meta: string, diagnostics: Diagnostic[]): Array<[string, string, string, string]> {
  return diagnostics.map((diagnostic) => {
    const {start, end} = diagnostic.range
    expect(start.line).toBe(1)
    expect(end.line).toBe(1)
    expect(start.column).toBe(start.offset + 1)
    expect(end.column).toBe(end.offset + 1)
    return [diagnostic.ruleId, diagnostic.reason, `${start.column}-${end.column}`, meta.slice(start.offset, end.offset)]
  })
}

describe('parseMetaOptions', () => {
  it('reads bare and quoted values', () => {
    const meta = 'flow=down title="Release \\"v2\\" \\\\ notes"'
    expect(parseMetaOptions(meta)).toEqual({options: {flow: 'down', title: 'Release "v2" \\ notes'}, diagnostics: []})
  })

  it('reads nothing from an empty or blank meta string', () => {
    expect(parseMetaOptions('')).toEqual({options: {}, diagnostics: []})
    expect(parseMetaOptions('  \t ')).toEqual({options: {}, diagnostics: []})
  })

  it('accepts every flow and an empty title', () => {
    for (const flow of ['up', 'down', 'left', 'right'] as const) {
      expect(parseMetaOptions(`flow=${flow}`)).toEqual({options: {flow}, diagnostics: []})
    }
    expect(parseMetaOptions('title=""')).toEqual({options: {title: ''}, diagnostics: []})
  })

  it('reports an unknown key at the key', () => {
    const meta = 'flow=up colour=red'
    const {options, diagnostics} = parseMetaOptions(meta)
    expect(options).toEqual({flow: 'up'})
    expect(brief(meta, diagnostics)).toEqual([['unknown-option', 'Unknown option `colour`: the options are `flow`, `title`.', '9-15', 'colour']])
  })

  it('reports a bad value at the value, naming the allowed ones', () => {
    const meta = 'flow=sideways'
    expect(brief(meta, parseMetaOptions(meta).diagnostics)).toEqual([
      ['bad-option-value', 'Option `flow` must be one of `up`, `down`, `left`, `right`, not `sideways`.', '6-14', 'sideways']
    ])
    const quoted = 'flow="Down"'
    expect(brief(quoted, parseMetaOptions(quoted).diagnostics)).toEqual([
      ['bad-option-value', 'Option `flow` must be one of `up`, `down`, `left`, `right`, not `Down`.', '6-12', '"Down"']
    ])
    const empty = 'flow= title=x'
    const result = parseMetaOptions(empty)
    expect(result.options).toEqual({title: 'x'})
    expect(brief(empty, result.diagnostics)).toEqual([
      ['bad-option-value', 'Option `flow` must be one of `up`, `down`, `left`, `right`, not empty.', '6-6', '']
    ])
  })

  it('reports a key without a value at the key', () => {
    const meta = 'title flow'
    expect(brief(meta, parseMetaOptions(meta).diagnostics)).toEqual([
      ['bad-option-value', 'Option `title` needs a value: a text, such as `title="Release pipeline"`.', '1-6', 'title'],
      ['bad-option-value', 'Option `flow` needs a value: one of `up`, `down`, `left`, `right`.', '7-11', 'flow']
    ])
  })

  it('reports a repeated key at its second occurrence and keeps the first', () => {
    const meta = 'flow=down flow=up'
    const {options, diagnostics} = parseMetaOptions(meta)
    expect(options).toEqual({flow: 'down'})
    expect(brief(meta, diagnostics)).toEqual([['duplicate-option', 'Option `flow` is given twice; give it once.', '11-15', 'flow']])
  })

  it('reports string errors with their ranges', () => {
    const open = 'flow=up title="Release'
    expect(brief(open, parseMetaOptions(open).diagnostics)).toEqual([
      ['unterminated-string', 'This quoted value has no closing `"`.', '15-23', '"Release']
    ])
    const escape = 'title="a\\tb" flow=left'
    const result = parseMetaOptions(escape)
    expect(result.options).toEqual({flow: 'left'})
    expect(brief(escape, result.diagnostics)).toEqual([
      ['bad-escape', 'Unknown escape `\\t` in a quoted value: only `\\"` and `\\\\` are escapes, so write `\\\\` for a backslash.', '9-11', '\\t']
    ])
  })

  it('reports stray characters and carries on with the next word', () => {
    const meta = "=down flow=up, title='x' title=\"a\"b title=ok"
    const {options, diagnostics} = parseMetaOptions(meta)
    expect(brief(meta, diagnostics)).toEqual([
      ['unexpected-character', 'Unexpected character `=` (U+003D): options are written `key=value`.', '1-2', '='],
      // A bare value runs to the next space, so the comma belongs to it.
      ['bad-option-value', 'Option `flow` must be one of `up`, `down`, `left`, `right`, not `up,`.', '12-15', 'up,'],
      ['unexpected-character', "Unexpected character `'` (U+0027): quote an option value with double quotes.", '22-23', "'"],
      ['unexpected-character', 'Unexpected character `b` (U+0062) after the value of `title`: separate options with spaces.', '35-36', 'b']
    ])
    expect(options).toEqual({title: 'ok'})
  })

  it('counts columns in UTF-16 code units', () => {
    const meta = 'title="🚀 launch" flow=north'
    expect(brief(meta, parseMetaOptions(meta).diagnostics)).toEqual([
      ['bad-option-value', 'Option `flow` must be one of `up`, `down`, `left`, `right`, not `north`.', '24-29', 'north']
    ])
    expect(parseMetaOptions(meta).options).toEqual({title: '🚀 launch'})
  })
})

describe('parseAttributeOptions', () => {
  it('reads known attributes', () => {
    expect(parseAttributeOptions({flow: 'left', title: 'Release pipeline'})).toEqual({
      options: {flow: 'left', title: 'Release pipeline'},
      diagnostics: []
    })
  })

  it('reports unknown keys, bad values and missing values without a range', () => {
    expect(parseAttributeOptions({flow: 'diagonal', id: 'x', title: null, class: undefined})).toEqual({
      options: {},
      diagnostics: [
        {severity: 'error', ruleId: 'bad-option-value', reason: 'Option `flow` must be one of `up`, `down`, `left`, `right`, not `diagonal`.'},
        {severity: 'error', ruleId: 'unknown-option', reason: 'Unknown option `id`: the options are `flow`, `title`.'},
        {severity: 'error', ruleId: 'bad-option-value', reason: 'Option `title` needs a value: a text, such as `title="Release pipeline"`.'},
        {severity: 'error', ruleId: 'unknown-option', reason: 'Unknown option `class`: the options are `flow`, `title`.'}
      ]
    })
  })

  it('does not treat inherited object keys as options', () => {
    expect(parseAttributeOptions({toString: 'x'}).diagnostics.map((diagnostic) => diagnostic.ruleId)).toEqual(['unknown-option'])
  })
})

describe('resolveOptions', () => {
  it('starts from the defaults: flow up, no title', () => {
    expect(resolveOptions()).toEqual({flow: 'up', title: undefined})
    expect(defaultDiagramOptions).toEqual({flow: 'up', title: undefined})
    expect(Object.isFrozen(defaultDiagramOptions)).toBe(true)
  })

  it('lets later layers win and ignores undefined fields', () => {
    expect(resolveOptions({flow: 'down', title: 'A'}, {flow: 'left'}, {title: undefined})).toEqual({flow: 'left', title: 'A'})
    expect(resolveOptions({title: 'A'}, {title: ''})).toEqual({flow: 'up', title: ''})
  })

  it('derives the options type from the schema (checked by tsc)', () => {
    const options: DiagramOptions = {flow: 'right', title: undefined}
    // @ts-expect-error: not a flow
    const wrong: DiagramOptions = {flow: 'sideways', title: 'x'}
    expect([options.flow, wrong.title]).toEqual(['right', 'x'])
  })

  it('has a schema entry with a summary for every option', () => {
    expect(optionNames).toEqual(['flow', 'title'])
    for (const name of optionNames) expect(optionSchema[name].summary.length).toBeGreaterThan(10)
  })
})
