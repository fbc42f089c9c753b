/**
 * Tones: the few named emphases a vertex may carry, written `(name)` after it. Each says something
 * about the box's place in the system, not how it looks; the renderer maps them to theme custom
 * properties and states them in words too (a tone is never the only carrier of its meaning).
 *
 * - `external`: run by someone else (a partner, a vendor); the diagram's owners cannot change it.
 * - `new`: being added; not there yet, or only just.
 * - `retiring`: on its way out; do not build on it.
 */
export const tones = ['external', 'new', 'retiring'] as const

export type Tone = (typeof tones)[number]

/** Words for a tone, for accessible descriptions (`<desc>`, `<title>`) beside its colours. */
export const toneDescriptions: Readonly<Record<Tone, string>> = Object.freeze({
  external: 'external: run outside the team',
  new: 'new: being added',
  retiring: 'retiring: being phased out'
})
