/**
 * Certificates along a family: every saved point (λ, u) of a run is certified on the system the
 * family follows at that λ — horizontal balance at the lattice ω(λ) for lattice paths, the phase
 * system at α(λ), K(λ) for phase paths (the published level rows of the document's drawing,
 * exactly the equations shared/families/phase.ts follows; phase paths do not move the drawing).
 * Plane wing paths are not covered. The same function re-proves a client's claims on the server (`verifyCertificateClaims`).
 */
import { latticePath } from '../families/lattice-paths'
import { phasePath } from '../families/phase'
import { compilePattern } from '../pattern/model'
import { LATTICE_PATH_KINDS, PHASE_PATH_KINDS, parseFamilySettings, type FamilySettings, type FamilySettingsInput } from '../types/family'
import type { PatternDocument } from '../types/pattern'
import { horizontalSystem } from './horizontal'
import { certifyZero, proveClaim, type CertifyOptions } from './krawczyk'
import { modelPhaseRows, phaseSystem } from './phase'
import type { PartCertificate } from './pattern'
import type { IntervalSystem } from './system'
import { lambdaInterval, latticePathBox, phasePathBox, segmentCentre } from './segment'
import { succ } from './round'
import type { Interval } from './interval'

/** A saved point: its index in the run, λ and the unknowns u. */
export interface FamilyPointInput { index?: number; lambda: number; u: ArrayLike<number> }

/** The certificate of one point. */
export interface PointCertificate { index: number; lambda: number; certificate: PartCertificate }

/** Options: certificate options and progress (called after each point). */
export interface FamilyCertifyOptions extends CertifyOptions {
  onProgress?: (done: number, total: number) => void
}

type SystemAt = (lambda: number) => { sys: IntervalSystem; symmetric: boolean } | { notCovered: string }

/** The interval system of the family at λ. */
function familySystem(doc: PatternDocument, settings: FamilySettings): SystemAt {
  const m = compilePattern(doc)
  const kind = settings.path.kind
  if ((LATTICE_PATH_KINDS as readonly string[]).includes(kind)) {
    const path = latticePath(settings.path, m.lattice)
    const pin: [number, number] = [m.positions[0]!, m.positions[1]!]
    return l => ({ sys: horizontalSystem(m, path.at(l).lattice, pin), symmetric: true })
  }
  if ((PHASE_PATH_KINDS as readonly string[]).includes(kind)) {
    const path = phasePath(m, settings.path)
    const { rows, pinned } = modelPhaseRows(m)
    return l => ({ sys: phaseSystem(m, { rows, pinned, alpha: path.alpha(l), weights: path.weights(l), psi: m.psi }), symmetric: false })
  }
  return () => ({ notCovered: 'plane wing paths: their unknowns are not the square reduction the plane certificate proves (shared/certify/plane.ts); certify the drawing itself' })
}

/** Certifies every point; a point of the wrong length is "enclosure too wide" with the reason. */
export function certifyFamilyPoints(
  doc: PatternDocument, settings: FamilySettings | FamilySettingsInput, points: FamilyPointInput[],
  options: FamilyCertifyOptions = {},
): PointCertificate[] {
  const at = familySystem(doc, parseFamilySettings(settings))
  const { onProgress, ...certifyOptions } = options
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

/** The certificate of the branch between two consecutive saved points. */
export interface SegmentCertificate { from: number; to: number; lambdaFrom: number; lambdaTo: number; certificate: PartCertificate }

/** The interval system of the family over λ ∈ L, or why there is none. */
function familySystemOver(doc: PatternDocument, settings: FamilySettings): (L: Interval) => { sys: IntervalSystem; symmetric: boolean } | { notCovered: string } {
  const m = compilePattern(doc)
  const kind = settings.path.kind
  if ((LATTICE_PATH_KINDS as readonly string[]).includes(kind)) {
    const pin: [number, number] = [m.positions[0]!, m.positions[1]!]
    return (L) => {
      const box = latticePathBox(settings.path, m.lattice, L)
      return 'notCovered' in box ? box : { sys: horizontalSystem(m, box, pin), symmetric: true }
    }
  }
  if ((PHASE_PATH_KINDS as readonly string[]).includes(kind)) {
    const { rows, pinned } = modelPhaseRows(m)
    return (L) => {
      const box = phasePathBox(m, settings.path, L)
      return 'notCovered' in box ? box : { sys: phaseSystem(m, { rows, pinned, alpha: m.alpha, weights: m.weight, psi: m.psi, alphaBox: box.alpha, weightBox: box.weights }), symmetric: false }
    }
  }
  return () => ({ notCovered: 'plane wing paths: their unknowns are not the square reduction the plane certificate proves (shared/certify/plane.ts); certify the drawing itself' })
}

/** Most pieces a segment is split into before it is reported not certified. */
const MAX_PIECES = 64

/**
 * One segment as a chain of pieces: λ-subintervals Λ_j with centres on the chord between the
 * saved points, piece counts 1, 2, 4, … up to MAX_PIECES. Piece j proves a unique zero in
 * B(c_j, r_j) (existence) and in B(c_j, R_j) (uniqueness) for every λ ∈ Λ_j; neighbours join
 * when ‖c_j − c_{j+1}‖∞ + r_j ≤ R_{j+1} and ‖c_j − c_{j+1}‖∞ + r_{j+1} ≤ R_j (the zero at the shared λ
 * is the same), the ends when the first and last balls reach the saved points' boxes. The radii
 * reported are the largest existence radius and the smallest uniqueness radius over the pieces.
 */
function chainedSegment(
  over: ReturnType<typeof familySystemOver>, a: { lambda: number; u: ArrayLike<number> }, b: { lambda: number; u: ArrayLike<number> },
  ra: number, rb: number, options: CertifyOptions,
): PartCertificate {
  let last: PartCertificate = { certified: false, size: 0, reason: 'enclosure-too-wide', detail: 'no piece count worked' }
  const n = a.u.length
  const at = (t: number) => Float64Array.from({ length: n }, (_, i) => a.u[i]! + t * (b.u[i]! - a.u[i]!))
  for (let pieces = 1; pieces <= MAX_PIECES; pieces *= 2) {
    const proofs: { c: Float64Array; r: number; R: number; y: number; z0: number }[] = []
    let ok = true
    for (let j = 0; j < pieces && ok; j++) {
      const t0 = j / pieces, t1 = (j + 1) / pieces
      const l0 = a.lambda + t0 * (b.lambda - a.lambda), l1 = j + 1 === pieces ? b.lambda : a.lambda + t1 * (b.lambda - a.lambda)
      const s = over(lambdaInterval(j === 0 ? a.lambda : l0, l1))
      if ('notCovered' in s) return { certified: false, size: 0, reason: 'not-covered', detail: s.notCovered }
      const { centre } = segmentCentre(at(t0), at(t1), 0, 0)
      // the end pieces must reach the saved points' existence boxes
      let reach = 0
      if (j === 0) reach = Math.max(reach, segmentCentre(centre, a.u, 0, ra).reach)
      if (j + 1 === pieces) reach = Math.max(reach, segmentCentre(centre, b.u, 0, rb).reach)
      const c = certifyZero(s.sys, centre, { ...options, symmetric: s.symmetric, minRadius: reach })
      last = c
      if (!c.certified) { ok = false; break }
      proofs.push({ c: centre, r: c.rMin, R: c.rMax, y: c.y, z0: c.z0 })
    }
    if (!ok) continue
    const dist = (x: Float64Array, y: Float64Array) => x.reduce((m, v, i) => Math.max(m, succ(Math.abs(v - y[i]!))), 0)
    const joined = proofs.every((p, j) => j === 0 || (succ(dist(p.c, proofs[j - 1]!.c) + proofs[j - 1]!.r) <= p.R && succ(dist(p.c, proofs[j - 1]!.c) + p.r) <= proofs[j - 1]!.R))
    if (!joined) continue
    return { certified: true, size: n, rMin: Math.max(...proofs.map(p => p.r)), rMax: Math.min(...proofs.map(p => p.R)), y: Math.max(...proofs.map(p => p.y)), z0: Math.max(...proofs.map(p => p.z0)), norm: 'max' }
  }
  return last
}

/**
 * Certifies the branch between each pair of consecutive points (by index) whose point
 * certificates both hold; see ./segment.ts for the statement.
 */
export function certifyFamilySegments(
  doc: PatternDocument, settings: FamilySettings | FamilySettingsInput, points: FamilyPointInput[],
  pointCertificates: PointCertificate[], options: FamilyCertifyOptions = {},
): SegmentCertificate[] {
  const over = familySystemOver(doc, parseFamilySettings(settings))
  const { onProgress, ...certifyOptions } = options
  const byIndex = new Map(pointCertificates.map(c => [c.index, c.certificate]))
  const sorted = points.map((p, i) => ({ ...p, index: p.index ?? i })).sort((a, b) => a.index - b.index)
  const out: SegmentCertificate[] = []
  for (let k = 0; k + 1 < sorted.length; k++) {
    const a = sorted[k]!, b = sorted[k + 1]!
    const ca = byIndex.get(a.index), cb = byIndex.get(b.index)
    const base = { from: a.index, to: b.index, lambdaFrom: a.lambda, lambdaTo: b.lambda }
    let certificate: PartCertificate
    if (!ca?.certified || !cb?.certified) certificate = { certified: false, size: 0, reason: 'enclosure-too-wide', detail: 'an end point is not certified' }
    else {
      const s = over(lambdaInterval(a.lambda, b.lambda))
      if ('notCovered' in s) certificate = { certified: false, size: 0, reason: 'not-covered', detail: s.notCovered }
      else certificate = chainedSegment(over, a, b, ca.rMin, cb.rMin, certifyOptions)
    }
    out.push({ ...base, certificate })
    onProgress?.(k + 1, sorted.length - 1)
  }
  return out
}
