/**
 * Compiler-style text report: `path:line:col: error: reason [rule-id]`, a code frame of the line,
 * the note, then one summary line. Colour only when asked (a TTY without NO_COLOR).
 */
import type {FileReport} from './check-files.ts'
import type {BlockMessage} from 'remark-upright'

export interface TextStyle {
  colour: boolean
}

const ansi = {bold: '1', red: '31', yellow: '33', cyan: '36', dim: '2', green: '32'} as const

export type Paint = (code: keyof typeof ansi, s: string) => string

/** Wrap text in an ANSI colour when the style asks for colour; otherwise leave it as it is. */
export function painter(style: TextStyle): Paint {
  return (code, s) => (style.colour ? `\u001b[${ansi[code]}m${s}\u001b[0m` : s)
}

/** The line for a file that could not be read (check and explain alike). */
export function unreadableLine(display: string, error: string, paint: Paint): string {
  return `${paint('bold', display)}: ${paint('red', 'error')}: cannot read: ${error} [io]`
}

/** `path:line:col: error: reason [rule-id]`, the head line of one message. */
export function messageLine(display: string, m: BlockMessage, paint: Paint): string {
  const where = `${display}:${m.place.start.line}:${m.place.start.column}`
  const severity = m.severity === 'error' ? paint('red', 'error') : paint('yellow', 'warning')
  return `${paint('bold', where)}: ${severity}: ${m.reason} ${paint('dim', `[${m.ruleId}]`)}`
}

export function formatText(reports: readonly FileReport[], style: TextStyle): string {
  const paint = painter(style)
  const out: string[] = []
  for (const report of reports) {
    if (report.error) {
      out.push(unreadableLine(report.display, report.error, paint))
      continue
    }
    const lines = report.text.split(/\r\n|\r|\n/)
    for (const result of report.results) {
      for (const m of result.messages) {
        out.push(messageLine(report.display, m, paint))
        out.push(...codeFrame(lines, m, paint))
        if (m.note) out.push(`  ${paint('cyan', 'note')}: ${m.note}`)
        for (const r of m.related ?? []) {
          out.push(`  ${paint('dim', `${report.display}:${r.place.start.line}:${r.place.start.column}`)}: ${r.reason}`)
        }
      }
    }
  }
  out.push(summaryLine(reports))
  return out.join('\n') + '\n'
}

export function summaryLine(reports: readonly FileReport[]): string {
  const s = summarize(reports)
  const unreadable = s.unreadable > 0 ? `, ${s.unreadable} file${s.unreadable === 1 ? '' : 's'} unreadable` : ''
  return `${s.diagrams} diagram${s.diagrams === 1 ? '' : 's'} in ${s.files} file${s.files === 1 ? '' : 's'}: ${s.passed} passed, ${s.failed} failed${unreadable}`
}

export function summarize(reports: readonly FileReport[]) {
  let diagrams = 0
  let passed = 0
  let unreadable = 0
  for (const r of reports) {
    if (r.error) unreadable++
    for (const result of r.results) {
      diagrams++
      if (result.status === 'upward') passed++
    }
  }
  return {files: reports.length, diagrams, passed, failed: diagrams - passed, unreadable}
}

export function codeFrame(lines: string[], m: Pick<BlockMessage, "place">, paint: Paint): string[] {
  const {start, end} = m.place
  const text = lines[start.line - 1]
  if (text === undefined) return []
  const gutter = String(start.line)
  const last = end.line === start.line ? Math.max(end.column, start.column + 1) : text.length + 1
  const marker = ' '.repeat(start.column - 1) + '^'.repeat(Math.max(1, last - start.column))
  return [
    `  ${paint('dim', `${gutter} |`)} ${text}`,
    `  ${paint('dim', `${' '.repeat(gutter.length)} |`)} ${paint('red', marker)}`
  ]
}
