/**
 * Certificates along a family: every saved point (λ, u) of a run is certified on the system the
 * family follows at that λ — horizontal balance at the lattice ω(λ) for lattice paths, the phase
 * system at α(λ), K(λ) for phase paths (plane wing paths are not covered). The same function
 * re-proves a client's claims on the server (`verifyCertificateClaims`).
 */
import { latticePath } from '../families/lattice-paths'
import { phasePath } from '../families/phase'
import { compilePattern, type PatternModel } from '../pattern/model'
import { LATTICE_PATH_KINDS, PHASE_PATH_KINDS, parseFamilySettings, type FamilySettings, type FamilySettingsInput } from '../types/family'
import type { PatternDocument } from '../types/pattern'
import { horizontalSystem } from './horizontal'
import { certifyZero, proveClaim, type CertifyOptions } from './krawczyk'
import { phaseSystem, vertexPhaseRows, type PhaseRow } from './phase'
import type { PartCertificate } from './pattern'
import type { IntervalSystem } from './system'

/** A saved point: its index in the run, λ and the unknowns u. */
export interface FamilyPointInput { index?: number; lambda: number; u: ArrayLike<number> }

/** The certificate of one point. */
export interface PointCertificate { index: number; lambda: number; certificate: PartCertificate }

/** Options: certificate options, phase rows, and progress (called after each point). */
export interface FamilyCertifyOptions extends CertifyOptions {
  phaseRows?: (m: PatternModel) => PhaseRow[]
  onProgress?: (done: number, total: number) => void
}

type SystemAt = (lambda: number) => { sys: IntervalSystem; symmetric: boolean } | { notCovered: string }

/** The interval system of the family at λ. */
function familySystem(doc: PatternDocument, settings: FamilySettings, phaseRows?: (m: PatternModel) => PhaseRow[]): SystemAt {
  const m = compilePattern(doc)
  const kind = settings.path.kind
  if ((LATTICE_PATH_KINDS as readonly string[]).includes(kind)) {
    const path = latticePath(settings.path, m.lattice)
    const pin: [number, number] = [m.positions[0]!, m.positions[1]!]
    return l => ({ sys: horizontalSystem(m, path.at(l).lattice, pin), symmetric: true })
  }
  if ((PHASE_PATH_KINDS as readonly string[]).includes(kind)) {
    const path = phasePath(m, settings.path)
    const rows = (phaseRows ?? vertexPhaseRows)(m)
    return l => ({ sys: phaseSystem(m, { rows, alpha: path.alpha(l), weights: path.weights(l), psi: m.psi }), symmetric: false })
  }
  return () => ({ notCovered: 'plane wing paths: the published rigidity there also moves the wing directions' })
}

/** Certifies every point; a point of the wrong length is "enclosure too wide" with the reason. */
export function certifyFamilyPoints(
  doc: PatternDocument, settings: FamilySettings | FamilySettingsInput, points: FamilyPointInput[],
  options: FamilyCertifyOptions = {},
): PointCertificate[] {
  const at = familySystem(doc, parseFamilySettings(settings), options.phaseRows)
  const { onProgress, phaseRows: _rows, ...certifyOptions } = options
  return points.map((pt, i) => {
    const index = pt.index ?? i
    const s = at(pt.lambda)
    let certificate: PartCertificate
    if ('notCovered' in s) certificate = { certified: false, size: 0, reason: 'not-covered', detail: s.notCovered }
    else if (pt.u.length !== s.sys.n) certificate = { certified: false, size: s.sys.n, reason: 'enclosure-too-wide', detail: `u has length ${pt.u.length}, expected ${s.sys.n}` }
    else certificate = certifyZero(s.sys, Float64Array.from(pt.u), { ...certifyOptions, symmetric: s.symmetric })
    onProgress?.(i + 1, points.length)
    return { index, lambda: pt.lambda, certificate }
  })
}

/** A claimed certificate of one point, as a client submits it. */
export interface CertificateClaim { index: number; rMin: number; rMax: number }

/** Outcome of the server's re-proof. */
export interface ClaimVerification { accepted: boolean; refused: { index: number; reason: string }[] }

/** Re-proves each claim at its point: the claimed radii must be proven here. */
export function verifyCertificateClaims(
  doc: PatternDocument, settings: FamilySettings | FamilySettingsInput, points: FamilyPointInput[],
  claims: CertificateClaim[], options: CertifyOptions = {},
): ClaimVerification {
  const at = familySystem(doc, parseFamilySettings(settings))
  const byIndex = new Map(points.map((p, i) => [p.index ?? i, p]))
  const refused: { index: number; reason: string }[] = []
  for (const c of claims) {
    const pt = byIndex.get(c.index)
    if (!pt) { refused.push({ index: c.index, reason: 'no saved point with this index' }); continue }
    const s = at(pt.lambda)
    if ('notCovered' in s) { refused.push({ index: c.index, reason: s.notCovered }); continue }
    if (pt.u.length !== s.sys.n) { refused.push({ index: c.index, reason: 'the point has the wrong number of unknowns' }); continue }
    if (!proveClaim(s.sys, Float64Array.from(pt.u), c.rMin, c.rMax, { ...options, symmetric: s.symmetric })) {
      refused.push({ index: c.index, reason: `the radii ${c.rMin} … ${c.rMax} could not be proven` })
    }
  }
  return { accepted: refused.length === 0, refused }
}
