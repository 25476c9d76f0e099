/**
 * Length levels of vertical balance on cuts for the workbench: a colour per level and the level of
 * each edge, from the analysis report (see shared/pattern/vertical-levels.ts). Pure.
 */
import type { PatternReport } from '#shared/pattern/report'

/** Our own categorical palette for length levels (level 1 = the shortest edges). */
const LEVEL_COLOURS = ['#2f6f8f', '#d97c0b', '#22927f', '#a23322', '#6d5a9e', '#8a7a2b', '#3f7f3a', '#9c4f7a']

/** Colour of level k (0-based), cycling. */
export function levelColour(k: number): string {
  return LEVEL_COLOURS[k % LEVEL_COLOURS.length]!
}

/** Level (0-based) of each edge id; loops, which never cross a cut, are absent. */
export function edgeLevels(r: PatternReport): Map<string, number> {
  const out = new Map<string, number>()
  r.verdicts.phaseBalance.levels.forEach((l, k) => { for (const e of l.edges) out.set(e, k) })
  return out
}

/** One equation as text, e.g. "{w}: −e2 − e4" (the set X, then the signed edges whose K·sin φ it sums). */
export function equationText(q: { vertices: string[], terms: { edge: string, sign: number }[] }): string {
  const terms = q.terms.map((t, i) => (i === 0 ? `${t.sign < 0 ? '−' : ''}${t.edge}` : `${t.sign < 0 ? '−' : '+'} ${t.edge}`)).join(' ')
  return `{${q.vertices.join(', ')}}: ${terms}`
}
