/**
 * The hypotheses of the published existence theorems as a checklist with the strength of each
 * verdict: torus T1–T11 (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676, 2021, Assumptions 3.2, 3.3, 3.6, Thm 6.7) and plane P1–P9 (H. Chen, "Gluing
 * Karcher–Scherk saddle towers II", Comm. Anal. Geom. 32, 2024, Thms 1–2). The input is any list
 * of hypothesis ids with a numerical verdict (the analysis report gives one); the interval
 * certificate upgrades the ids it proves, combinatorial ids are exact integer computations, the
 * rest stay numerical evidence.
 */
import type { DrawingCertificate } from './pattern'

/** Strength of one hypothesis verdict. */
export type HypothesisStatus = 'proven-interval' | 'exact' | 'numerical' | 'fails'

/** A hypothesis as the analysis states it. */
export interface HypothesisInput { id: string; holds: boolean; label?: string }

/** A checklist line. */
export interface ChecklistItem { id: string; label: string; status: HypothesisStatus; note?: string }

/** Ids decided by exact integer or combinatorial computation. */
const EXACT = new Set(['T1', 'T2', 'T3', 'T4', 'T9', 'P1', 'P2', 'P3'])
/** Ids the horizontal certificate proves (a balanced drawing exists and is rigid there). */
const HORIZONTAL = new Set(['T6', 'T7', 'P5', 'P6'])
/** Ids the phase certificate proves. */
const PHASE = new Set(['T10', 'T11', 'P8', 'P9'])

/** Plain labels of the ids. */
export const HYPOTHESIS_LABELS: Record<string, string> = {
  T1: 'connected, genus-1 embedding', T2: 'every face has two or more half-edges', T3: 'every degree at least 4',
  T4: 'orientable', T5: 'straight drawing in the rotation order', T6: 'balanced', T7: 'rigid',
  T8: 'all vertices ordinary', T9: 'phases close on faces', T10: 'vertically balanced', T11: 'phase-rigid',
  P1: 'connected, drawn in the plane', P2: 'every degree at least 4', P3: 'orientable', P4: 'straight drawing in the rotation order',
  P5: 'balanced, wings included', P6: 'rigid', P7: 'all vertices ordinary', P8: 'vertically balanced', P9: 'phase-rigid',
}

/** Which systems an interval certificate proved. */
export interface ProvenParts { horizontal: boolean; phase: boolean }

/** The proven parts of a drawing's certificate. */
export function provenParts(cert: DrawingCertificate | null): ProvenParts {
  return { horizontal: !!cert?.horizontal.certified, phase: !!cert?.phase?.certified }
}

/** The checklist: each input hypothesis with the strongest status the evidence allows. */
export function certifiedChecklist(items: HypothesisInput[], proven: ProvenParts): ChecklistItem[] {
  return items.map(({ id, holds, label }) => {
    const base = { id, label: label ?? HYPOTHESIS_LABELS[id] ?? id }
    if (HORIZONTAL.has(id) && proven.horizontal) return { ...base, status: 'proven-interval' as const, note: 'a unique zero within the certified radius; its Jacobian is invertible' }
    if (PHASE.has(id) && proven.phase) return { ...base, status: 'proven-interval' as const, note: 'a unique phase zero within the certified radius; its Jacobian is invertible' }
    if (!holds) return { ...base, status: 'fails' as const }
    if (EXACT.has(id)) return { ...base, status: 'exact' as const }
    return { ...base, status: 'numerical' as const }
  })
}

/** Words for a status, as shown to people. */
export const STATUS_WORDS: Record<HypothesisStatus, string> = {
  'proven-interval': 'proven by interval arithmetic',
  exact: 'exact (integer data)',
  numerical: 'numerical evidence',
  fails: 'fails',
}
