/**
 * The verdicts shown as badges for a stored analysis summary (`analyzePattern(doc).summary` of
 * shared/pattern/analyze.ts). Shown in this order; a key that is absent is skipped, a null value
 * (e.g. `rigid` when the pattern was too large for the dense check) shows as undecided.
 */
const LABELS: Array<[key: string, label: string]> = [
  ['gluingPattern', 'valid gluing'],
  ['orientable', 'orientable'],
  ['balanced', 'balanced'],
  ['rigid', 'rigid'],
  ['phaseRigid', 'phase-rigid'],
]

/** Badges for a summary (empty when the pattern has not been analysed). */
export function summaryVerdicts(summary: Record<string, unknown> | null): Array<{ label: string, value: boolean | null }> {
  if (!summary) return []
  return LABELS
    .filter(([k]) => typeof summary[k] === 'boolean' || summary[k] === null)
    .map(([k, label]) => ({ label, value: summary[k] as boolean | null }))
}

/** A short line such as "torus · 2 towers · 4 edges · genus 3" (or "… · 6 open ends" in the plane). */
export function summaryFacts(summary: Record<string, unknown> | null): string {
  if (!summary) return ''
  const facts: string[] = []
  if (typeof summary.space === 'string') facts.push(summary.space)
  if (typeof summary.vertices === 'number') facts.push(`${summary.vertices} towers`)
  if (typeof summary.closedEdges === 'number') facts.push(`${summary.closedEdges} edges`)
  if (summary.space === 'torus' && typeof summary.predictedGenus === 'number') facts.push(`genus ${summary.predictedGenus}`)
  if (typeof summary.openEnds === 'number' && summary.openEnds > 0) facts.push(`${summary.openEnds} open ends`)
  return facts.join(' · ')
}
