/**
 * The yes/no verdicts shown as badges for a stored analysis summary. The summary comes from the
 * core's `analyzePattern(doc).summary`; only boolean fields with a known label are shown, in
 * this order, so an unknown or partial summary degrades to fewer badges rather than an error.
 */
const LABELS: Array<[key: string, label: string]> = [
  ['connected', 'connected'],
  ['validGluing', 'valid gluing'],
  ['orientable', 'orientable'],
  ['closes', 'closes'],
  ['balanced', 'balanced'],
  ['rigid', 'rigid'],
  ['phaseBalanced', 'phase-balanced'],
]

/** Badges for a summary (empty when the pattern has not been analysed). */
export function summaryVerdicts(summary: Record<string, unknown> | null): Array<{ label: string, value: boolean }> {
  if (!summary) return []
  return LABELS.filter(([k]) => typeof summary[k] === 'boolean').map(([k, label]) => ({ label, value: summary[k] as boolean }))
}
