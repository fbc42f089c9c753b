import type {Point} from '@upright/core'

/**
 * Line index of a whole file: where each line starts and its text without the line ending.
 * CRLF, CR and LF all end a line, as in CommonMark.
 */
export interface SourceLines {
  readonly text: string
  /** starts[i] = offset of line i + 1. */
  readonly starts: number[]
  /** Line text (1-based), without its line ending; '' past the end. */
  line(n: number): string
  /** The point at an offset. */
  pointAt(offset: number): Point
}

export function indexLines(text: string): SourceLines {
  const starts = [0]
  const ends: number[] = []
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (c === 13 /* \r */ || c === 10 /* \n */) {
      ends.push(i)
      if (c === 13 && text.charCodeAt(i + 1) === 10) i++
      starts.push(i + 1)
    }
  }
  ends.push(text.length)
  return {
    text,
    starts,
    line(n) {
      return n >= 1 && n <= starts.length ? text.slice(starts[n - 1], ends[n - 1]) : ''
    },
    pointAt(offset) {
      let lo = 0
      let hi = starts.length - 1
      while (lo < hi) {
        const mid = (lo + hi + 1) >> 1
        if (starts[mid]! <= offset) lo = mid
        else hi = mid - 1
      }
      return {line: lo + 1, column: offset - starts[lo]! + 1, offset}
    }
  }
}

/** Split a diagram body into lines the way the core parser counts them. */
export function splitLines(text: string): string[] {
  return text.split(/\r\n|\r|\n/)
}
