/**
 * The hypotheses of the published existence theorems as a checklist with the strength of each
 * verdict: torus T1–T11 (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676, 2021, Assumptions 3.2, 3.3, 3.6, Thm 6.7) and plane P1–P9 (H. Chen, "Gluing
 * Karcher–Scherk saddle towers II", Comm. Anal. Geom. 32, 2024, Thms 1–2). The input is the
 * analysis report's own checklist (shared/pattern/existence.ts: ids, statements and statuses);
 * the interval certificate upgrades the ids it proves, combinatorial ids are exact integer
 * computations, the rest stay numerical evidence. This file is the one place that builds the
 * list shown on the run page, in the workbench, by the CLI and in the JSON exports.
 */
import type { ExistenceChecklist, HypothesisStatus as ExistenceStatus } from '../pattern/existence'
import { LATTICE_PATH_KINDS, PHASE_PATH_KINDS } from '../types/family'
import type { DrawingCertificate } from './pattern'

/** Strength of one hypothesis verdict. */
export type HypothesisStatus = 'proven-interval' | 'exact' | 'numerical' | 'fails' | 'not-needed' | 'not-checked'

/** A hypothesis as the analysis states it (an item of the report's existence checklist). */
export interface HypothesisInput { id: string; status: ExistenceStatus; label?: string; detail?: string }

/** A checklist line. */
export interface ChecklistItem { id: string; label: string; status: HypothesisStatus; note?: string }

/**
 * Ids decided by exact integer or combinatorial computation: connectivity, genus, face sizes,
 * degrees, orientability; T9 because φ = ψ(to) − ψ(from) + k·α sums around a face to (Σ k)·α,
 * and Σ k = 0 on every face is integer data.
 */
const EXACT = new Set(['T1', 'T2', 'T3', 'T4', 'T9', 'P1', 'P2', 'P3'])
/** Ids the horizontal certificate proves (a balanced drawing exists and is rigid there). */
const HORIZONTAL = new Set(['T6', 'T7', 'P5', 'P6'])
/** Ids the phase certificate proves (a zero of the level rows exists, phase-rigid there). */
const PHASE = new Set(['T10', 'T11', 'P8', 'P9'])

/** Exactly what the horizontal certificate proves. */
export const HORIZONTAL_PROOF = 'proven by interval arithmetic: exactly one balanced drawing lies within the certified radius (max-norm, lattice fixed, vertex 0 pinned) and the reduced Jacobian is invertible on that box, so balance and rigidity hold at that true drawing, not at the float drawing itself'
/** Exactly what the plane certificate proves (shared/certify/plane.ts). */
export const PLANE_PROOF = 'proven by interval arithmetic: exactly one balanced drawing lies within the certified radius (max-norm; vertex 0, the scale and the held coordinates and wing angles fixed, the others free) with an invertible Jacobian there, so M = [ℓ̄·J | R] has rank 2V at that true drawing: it is balanced and rigid, with a family of balanced drawings of dimension |R| − 2 around it; not at the float drawing itself'
/** Exactly what the phase certificate proves. */
export const PHASE_PROOF = 'proven by interval arithmetic: exactly one zero of the level rows of vertical balance on cuts lies within the certified radius of ψ (max-norm, one ψ per component pinned) and their Jacobian is invertible on that box, so vertical balance and phase-rigidity hold at that true zero (K and the length levels as read from the drawing)'

/** Plain labels of the ids (used when the input carries no statement). */
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

/**
 * What a run's stored certificates prove about the pattern it follows: when every saved point is
 * certified, the system the run follows at each of them — the phase rows on phase paths, the
 * horizontal system on lattice paths; plane wing paths are not covered, so nothing.
 */
export function runProvenParts(pathKind: string, pointIndices: readonly number[], certified: ReadonlySet<number>): ProvenParts {
  const all = pointIndices.length > 0 && pointIndices.every(i => certified.has(i))
  return {
    horizontal: all && (LATTICE_PATH_KINDS as readonly string[]).includes(pathKind),
    phase: all && (PHASE_PATH_KINDS as readonly string[]).includes(pathKind),
  }
}

/** The checklist: each input hypothesis with the strongest status the evidence allows. */
export function certifiedChecklist(items: HypothesisInput[], proven: ProvenParts): ChecklistItem[] {
  return items.map(({ id, status, label, detail }): ChecklistItem => {
    const base = { id, label: label ?? HYPOTHESIS_LABELS[id] ?? id }
    const withDetail = detail ? { note: detail } : {}
    if (HORIZONTAL.has(id) && proven.horizontal) return { ...base, status: 'proven-interval', note: id.startsWith('P') ? PLANE_PROOF : HORIZONTAL_PROOF }
    if (PHASE.has(id) && proven.phase) return { ...base, status: 'proven-interval', note: PHASE_PROOF }
    if (status === 'fails') return { ...base, status: 'fails', ...withDetail }
    if (status === 'not needed') return { ...base, status: 'not-needed', ...withDetail }
    if (status === 'not checked') return { ...base, status: 'not-checked', ...withDetail }
    if (EXACT.has(id)) return { ...base, status: 'exact', ...withDetail }
    return { ...base, status: 'numerical', ...withDetail }
  })
}

/** Words for a status, as shown to people. */
export const STATUS_WORDS: Record<HypothesisStatus, string> = {
  'proven-interval': 'proven by interval arithmetic',
  exact: 'exact (integer data)',
  numerical: 'numerical evidence',
  fails: 'fails',
  'not-needed': 'not needed (trivial phases)',
  'not-checked': 'not checked',
}

/** The certified checklist with its theorem and one line, as every screen, the CLI and the exports show it. */
export interface CertifiedExistence {
  theorem: string
  items: ChecklistItem[]
  /** Which certificates the statuses rest on. */
  proven: ProvenParts
  /** One line: the failing ids, or which ids are proven, exact and only numerical. */
  line: string
  conclusion: string
}

/** Ids of the items with a status, joined. */
const idsWith = (items: ChecklistItem[], s: HypothesisStatus) => items.filter(i => i.status === s).map(i => i.id).join(', ')

/** The hypotheses of an existence checklist, each id with its statement, status and detail, in order. */
export function hypothesesOf(existence: ExistenceChecklist): HypothesisInput[] {
  return existence.items.map(i => ({ id: i.id, status: i.status, label: i.statement, detail: i.detail }))
}

/** Builds the certified checklist from the report's existence checklist and the proven parts. */
export function certifiedExistence(existence: ExistenceChecklist, proven: ProvenParts): CertifiedExistence {
  const items = certifiedChecklist(hypothesesOf(existence), proven)
  const failing = idsWith(items, 'fails'), unchecked = idsWith(items, 'not-checked')
  const parts = [
    failing ? `failing: ${failing}` : '', unchecked ? `not checked: ${unchecked}` : '',
    idsWith(items, 'proven-interval') ? `proven by interval arithmetic: ${idsWith(items, 'proven-interval')}` : '',
    idsWith(items, 'exact') ? `exact: ${idsWith(items, 'exact')}` : '',
    idsWith(items, 'numerical') ? `numerical evidence only: ${idsWith(items, 'numerical')}` : '',
  ].filter(Boolean)
  return { theorem: existence.theorem, items, proven, line: parts.join('; '), conclusion: existence.conclusion }
}
