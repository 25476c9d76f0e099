/**
 * Certificates of one drawing: the horizontal balance (torus: a unique balanced, rigid drawing
 * near the given positions) and, when the document carries phases, the vertical phase balance
 * (a unique balanced, phase-rigid ψ near the given phases). Each part is a {@link ZeroCertificate}
 * of ./krawczyk.ts in the max-norm: positions in lattice length units, phases in radians.
 */
import type { Lattice, PatternModel } from '../pattern/model'
import { certifyZero, type CertifyOptions, type ZeroCertificate } from './krawczyk'
import { horizontalSystem } from './horizontal'
import { choosePlaneReduction, planeSystem } from './plane'
import { balanceJacobian } from '../pattern/balance'
import { tripletsToDense } from '../linalg/dense'
import { modelPhaseRows, phaseSystem } from './phase'

/** A certificate part that does not apply, with the reason. */
export interface NotApplicable { certified: false; size: number; reason: 'not-covered'; detail: string }

/** One part of a drawing's certificate. */
export type PartCertificate = ZeroCertificate | NotApplicable

/** Options of {@link certifyDrawing} (the phase rows are always the published level rows). */
export type DrawingCertifyOptions = CertifyOptions

/**
 * Certificate of the horizontal system at positions p (2V) in lattice `lat`. Plane drawings:
 * the published system with the wing directions as unknowns, reduced to a square system by
 * ./plane.ts (three wing angles and the positions solved for, the other angles and the scale
 * held); a proof there gives P5, P6 at the true zero and the (|R| − 2)-dimensional family.
 */
export function certifyHorizontal(m: PatternModel, p: Float64Array, lat: Lattice, options?: CertifyOptions): PartCertificate {
  if (m.space === 'plane') return certifyPlane(m, p, lat, options)
  const sys = horizontalSystem(m, lat, [p[0]!, p[1]!])
  return certifyZero(sys, p.slice(2), { ...options, symmetric: true })
}

/**
 * Default size limit of plane certificates: their column choice (./plane.ts) is dense QR, O(n³);
 * `npx tsx bench/certify.ts` measured here, over runs under varying load: 241 unknowns 1.2–3.1 s,
 * 381 unknowns 2.4 s, 553 unknowns 4.0–15 s; 400 keeps a margin under 10 s.
 */
export const PLANE_MAX_SIZE = 400

/** The plane certificate (./plane.ts); "not rigid" when the wings cannot complete the rank of M in floating point. */
function certifyPlane(m: PatternModel, p: Float64Array, lat: Lattice, options?: CertifyOptions): PartCertificate {
  const n = 2 * m.nVertices + 1
  const limit = options?.maxSize ?? PLANE_MAX_SIZE
  if (n > limit) return { certified: false, size: n, reason: 'too-large', detail: `${n} unknowns, more than the limit ${limit}` }
  const J = tripletsToDense(balanceJacobian(m, p, lat))
  const red = choosePlaneReduction(m, p, (i, j) => J.get(i, j))
  if (!red) return { certified: false, size: n, reason: 'not-rigid', detail: 'no choice of wing directions completes the rank of M = [ℓ̄·J | R] in floating point' }
  return certifyZero(planeSystem(m, red), red.x, options)
}

/**
 * Certificate of the published phase system (the level rows of vertical balance on cuts of the
 * drawing (p, lat), the document's drawing by default) at ψ (V), α and weights K.
 */
export function certifyPhases(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  options?: DrawingCertifyOptions, p: Float64Array = m.positions, lat: Lattice = m.lattice,
): PartCertificate {
  const { rows, pinned } = modelPhaseRows(m, p, lat)
  const sys = phaseSystem(m, { rows, pinned, alpha, weights, psi })
  const x = new Float64Array(sys.n)
  for (let v = 0; v < m.nVertices; v++) if (sys.unknownOf[v]! >= 0) x[sys.unknownOf[v]!] = psi[v]!
  return certifyZero(sys, x, options)
}

/** Both parts for a compiled document (phase part only when `hasPhases`). */
export interface DrawingCertificate {
  horizontal: PartCertificate
  phase: PartCertificate | null
}

/** Certifies the model's own drawing (positions, lattice) and, with `hasPhases`, its phases. */
export function certifyDrawing(m: PatternModel, hasPhases: boolean, options?: DrawingCertifyOptions): DrawingCertificate {
  return {
    horizontal: certifyHorizontal(m, m.positions, m.lattice, options),
    phase: hasPhases ? certifyPhases(m, m.psi, m.alpha, m.weight, options) : null,
  }
}

/** One line for people: "certified (radius 2.1e-15; unique within 0.15)" or "not certified: …". */
export function describeCertificate(c: PartCertificate): string {
  if (c.certified && c.size === 0) return 'certified (no unknowns: the equations hold identically)'
  if (c.certified) return `certified (radius ${c.rMin.toExponential(1)}; unique within ${c.rMax.toExponential(1)}, max-norm)`
  const why = { 'not-rigid': 'not rigid', 'too-large': 'too large', 'enclosure-too-wide': 'enclosure too wide', 'not-covered': 'not covered' }[c.reason]
  return `not certified: ${why} (${c.detail})`
}
