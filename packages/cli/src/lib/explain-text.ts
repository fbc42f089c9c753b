/**
 * `upright explain` in text: every diagram's outcome, each message with a code frame, every involved
 * position with its own frame (the check's report lists them as one line each), and the suggested fix.
 */
import type {FileReport} from './check-files.ts'
import {codeFrame, messageLine, painter, summaryLine, unreadableLine, type TextStyle} from './format-text.ts'

export function formatExplain(reports: readonly FileReport[], style: TextStyle): string {
  const paint = painter(style)
  const out: string[] = []
  for (const report of reports) {
    if (report.error) {
      out.push(unreadableLine(report.display, report.error, paint))
      continue
    }
    const lines = report.text.split(/\r\n|\r|\n/)
    report.results.forEach((result, i) => {
      const at = `${report.display}:${result.block.start.line}:${result.block.start.column}`
      const verdict = result.status === 'upward' ? paint('green', 'drawable') : paint('red', result.status)
      out.push(`${paint('bold', `diagram ${i + 1}`)} at ${at}: ${verdict}`)
      for (const m of result.messages) {
        out.push(`  ${messageLine(report.display, m, paint)}`)
        out.push(...codeFrame(lines, m, paint).map((l) => `  ${l}`))
        if (m.note) out.push(`    ${paint('cyan', 'note')}: ${m.note}`)
        for (const r of m.related ?? []) {
          out.push(`    ${paint('dim', `${report.display}:${r.place.start.line}:${r.place.start.column}`)}: ${r.reason}`)
          out.push(...codeFrame(lines, r, paint).map((l) => `    ${l}`))
        }
      }
      const certificate = result.certificate ?? result.check?.certificate
      if (certificate?.fix) {
        const edges = certificate.fix.remove.map(([u, v]) => `${u} -> ${v}`).join(', ')
        const how = certificate.fix.exact ? 'no fewer edges will do' : 'a small set, not proven smallest'
        out.push(`  ${paint('cyan', 'fix')}: remove ${edges} (${how})`)
      }
    })
  }
  out.push(summaryLine(reports))
  return out.join('\n') + '\n'
}
