/**
 * The hypotheses of the published existence theorems as a checklist, one item per hypothesis.
 * Torus (T1–T11): H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I: triply periodic
 * minimal surfaces", arXiv 2103.15676 (2021), Assumptions 3.2, 3.3, 3.6 and Thm 6.7 (trivial
 * phases: Thm 4.9, T1–T8 suffice). Plane (P1–P9): H. Chen, "Gluing Karcher–Scherk saddle towers
 * II: singly periodic minimal surfaces", Comm. Anal. Geom. 32 (2024), Thms 1–2 (trivial phases:
 * Thm 1, P1–P7 suffice). The plane conclusion is an immersed family; embeddedness needs further
 * conditions (C-II §2.5), so it is never claimed here. See docs/conditions.md.
 */

/** Status of one hypothesis. */
export type HypothesisStatus = 'ok' | 'fails' | 'not needed' | 'not checked'

/** One hypothesis. */
export interface Hypothesis {
  id: string
  statement: string
  status: HypothesisStatus
  /** Why, in a few words (numbers, witnesses, what was not checked). */
  detail: string
}

/** The checklist and its one-line conclusion. */
export interface ExistenceChecklist {
  theorem: string
  items: Hypothesis[]
  allHold: boolean
  /** Ids of the failing hypotheses. */
  failing: string[]
  /** "all hypotheses … hold (numerically)", or the failing / unchecked ids. */
  line: string
  /** What the theorem gives when every hypothesis holds. */
  conclusion: string
}

/** The facts the checklist reads (from the analysis). */
export interface ExistenceFacts {
  space: 'torus' | 'plane'
  connected: boolean
  openWings: number
  loops: number
  embeddingGenus: number
  smallestFace: number
  minDegree: number
  orientable: boolean
  drawing: { ok: boolean, checked: boolean, detail: string }
  balanced: boolean
  rigid: boolean
  ordinary: boolean
  trivialPhases: boolean
  phaseClosure: boolean
  verticallyBalanced: boolean
  phaseRigid: boolean
  predictedGenus: number
  dependsOnK: boolean
}

export const ALL_HOLD_LINE = 'all hypotheses of the published existence theorem hold (numerically)'

const st = (b: boolean): HypothesisStatus => (b ? 'ok' : 'fails')

/** Builds the checklist of the theorem that applies to the space of the pattern. */
export function existenceChecklist(f: ExistenceFacts): ExistenceChecklist {
  const trivial = f.trivialPhases
  const phase = (b: boolean): HypothesisStatus => (trivial ? 'not needed' : st(b))
  const trivialNote = 'trivial phases (every φ ∈ {0, π})'
  const kNote = f.dependsOnK ? '; depends on K (K = 1 assumed)' : ''
  const item = (id: string, statement: string, status: HypothesisStatus, detail = ''): Hypothesis => ({ id, statement, status, detail })
  const degreeItem = (id: string) => item(id, 'every vertex has degree ≥ 4', st(f.minDegree >= 4), `smallest degree ${f.minDegree}`)
  const orientItem = (id: string) => item(id, 'orientable', st(f.orientable), f.orientable ? 'half-edges alternate' : 'odd chain')
  const drawingItem = (id: string, statement: string) => item(id, statement, f.drawing.checked ? st(f.drawing.ok) : 'not checked', f.drawing.detail)
  const phaseItem = (id: string, statement: string, ok: boolean) => item(id, statement, phase(ok), trivial ? trivialNote : kNote.slice(2))
  const connectedText = f.connected ? 'connected' : 'not connected'
  const items: Hypothesis[] = f.space === 'torus'
    ? [
        item('T1', 'connected, no open wings, embedding of genus 1', st(f.connected && f.openWings === 0 && f.embeddingGenus === 1), `${connectedText}, ${f.openWings} open wings, embedding genus ${f.embeddingGenus}`),
        item('T2', 'every face has at least 2 half-edges', st(f.smallestFace >= 2), `smallest face ${f.smallestFace}`),
        degreeItem('T3'),
        orientItem('T4'),
        drawingItem('T5', 'straight drawing: distinct points, 2-face edges on one segment, other edges disjoint, drawn order = σ'),
        item('T6', 'balanced', st(f.balanced)),
        item('T7', 'rigid (ker J = translations)', st(f.rigid)),
        item('T8', 'every vertex ordinary', st(f.ordinary)),
        item('T9', 'phases close around faces', phase(f.phaseClosure), trivial ? trivialNote : ''),
        phaseItem('T10', 'vertically balanced on every cut', f.verticallyBalanced),
        phaseItem('T11', 'phase-rigid', f.phaseRigid),
      ]
    : [
        item('P1', 'connected, drawn in the plane (no loops)', st(f.connected && f.loops === 0), `${connectedText}, ${f.loops} loops`),
        degreeItem('P2'),
        orientItem('P3'),
        drawingItem('P4', 'straight drawing as for the torus (parallel wings allowed)'),
        item('P5', 'balanced, open wings included', st(f.balanced)),
        item('P6', 'rigid: M = [ℓ̄·J | R] has rank 2V', st(f.rigid)),
        item('P7', 'every vertex ordinary', st(f.ordinary)),
        phaseItem('P8', 'vertically balanced on every cut', f.verticallyBalanced),
        phaseItem('P9', 'phase-rigid', f.phaseRigid),
      ]
  const failing = items.filter(i => i.status === 'fails').map(i => i.id)
  const unchecked = items.filter(i => i.status === 'not checked').map(i => i.id)
  const allHold = failing.length === 0 && unchecked.length === 0
  const line = allHold
    ? ALL_HOLD_LINE
    : [failing.length ? `failing: ${failing.join(', ')}` : '', unchecked.length ? `not checked: ${unchecked.join(', ')}` : ''].filter(Boolean).join('; ')
  const theorem = f.space === 'torus'
    ? (trivial ? 'Chen–Traizet 2021, Thm 4.9 (trivial phases)' : 'Chen–Traizet 2021, Thm 6.7')
    : (trivial ? 'Chen 2024, Thm 1 (trivial phases)' : 'Chen 2024, Thm 2')
  const conclusion = f.space === 'torus'
    ? `a family of embedded triply periodic minimal surfaces of genus ${f.predictedGenus} in the quotient, for small ε`
    : `a family of immersed singly periodic minimal surfaces of genus ${f.predictedGenus} with ${f.openWings} Scherk ends (embeddedness is not claimed)`
  return { theorem, items, allHold, failing, line, conclusion }
}
