/**
 * Attach the suggested fix to a failing check: the failure's message gains the sentence and the
 * suggested edges' positions, the certificate gains `fix` (in the writer's ids, so it survives caching),
 * and the check gains `fix` (parsed edge ids). The fix gets its own budget, as large as the check's.
 */
import type {CheckSettings, DiagramCheck} from '../check/check-diagram.ts'
import {suggestFix, userFix, withFixMessage, type Fix} from './suggest-fix.ts'

export type {Fix}

const fixable: Record<string, string> = {cycle: 'cycle', nonplanar: 'nonplanar', 'not-upward': 'not-upward'}

export function attachFix(check: DiagramCheck, settings: Readonly<CheckSettings>): DiagramCheck {
  const ruleId = fixable[check.status]
  if (!ruleId || !check.graph || !check.certificate) return check
  const at = check.diagnostics.findIndex((d) => d.ruleId === ruleId)
  if (at < 0) return check
  const fix = suggestFix(check.status, check.graph, {maxMillis: settings.budgetMillis ?? 3000, ...(settings.now ? {now: settings.now} : {})})
  if (!fix || fix.edges.length === 0) return check
  const diagnostics = [...check.diagnostics]
  diagnostics[at] = withFixMessage(diagnostics[at]!, check.parsed, fix)
  return {...check, diagnostics, certificate: {...check.certificate, fix: userFix(check.parsed, fix)}, fix}
}
