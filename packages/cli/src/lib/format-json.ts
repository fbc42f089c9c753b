/** The machine-readable report: positions 1-based in the file, certificates in the writer's ids. */
import type {FileReport} from './check-files.ts'
import {summarize} from './format-text.ts'

export interface JsonMessage {
  line: number
  column: number
  endLine: number
  endColumn: number
  severity: 'error' | 'warning'
  ruleId: string
  reason: string
}

export interface JsonDiagram {
  file: string
  line: number
  column: number
  status: string
  messages: JsonMessage[]
  certificate: unknown
  /** For a cycle, nonplanar or not-upward failure: the edges whose removal the message suggests. */
  fix?: {remove: Array<[string, string]>; exact: boolean}
}

export interface JsonReport {
  diagrams: JsonDiagram[]
  summary: {diagrams: number; passed: number; failed: number}
  errors?: Array<{file: string; reason: string}>
}

export function toJsonReport(reports: readonly FileReport[]): JsonReport {
  const diagrams: JsonDiagram[] = []
  const errors: Array<{file: string; reason: string}> = []
  for (const report of reports) {
    if (report.error) errors.push({file: report.display, reason: report.error})
    for (const result of report.results) {
      const {fix, ...certificate} = (result.certificate ?? result.check?.certificate ?? {}) as {fix?: JsonDiagram['fix']}
      const found = result.certificate ?? result.check?.certificate
      diagrams.push({
        file: report.display,
        line: result.block.start.line,
        column: result.block.start.column,
        status: result.status,
        messages: result.messages.map((m) => ({
          line: m.place.start.line,
          column: m.place.start.column,
          endLine: m.place.end.line,
          endColumn: m.place.end.column,
          severity: m.severity,
          ruleId: m.ruleId,
          reason: m.reason
        })),
        certificate: found ? certificate : null,
        ...(fix ? {fix} : {})
      })
    }
  }
  const {diagrams: count, passed, failed} = summarize(reports)
  const json: JsonReport = {diagrams, summary: {diagrams: count, passed, failed}}
  if (errors.length > 0) json.errors = errors
  return json
}
