/**
 * Validated continuation between consecutive saved points (S. Day, J.-P. Lessard,
 * K. Mischaikow, "Validated continuation for equilibria of PDEs", SIAM J. Numer. Anal. 45, 2007):
 * with λ ranging over the whole interval Λ = [λ_k, λ_{k+1}], the family's equations are enclosed
 * for every λ ∈ Λ at once (lattice or phase path evaluated in interval arithmetic), centred at the
 * midpoint x̃ of the two saved points. A proof at radius r gives, for every λ ∈ Λ, exactly one
 * zero in B(x̃, r) with an invertible Jacobian, so (implicit function theorem) the zeros form one
 * smooth branch over Λ; r is at least the distance to either saved point plus its own existence
 * radius, so the branch passes through both certified zeros: "the branch from λ_k to λ_{k+1} is
 * certified". Lattice paths: shear, stretch, interpolation, a τ polyline within one of its pieces
 * (each affine in λ); the angle path and plane paths are not covered.
 */
import type { FamilyPath } from '../types/family'
import type { Lattice, PatternModel } from '../pattern/model'
import { add, interval, mul, point, sub, type Interval } from './interval'
import type { LatticeBox } from './horizontal'
import { succ } from './round'

type IV = [Interval, Interval]
const cmul = (a: IV, b: IV): IV => [sub(mul(a[0], b[0]), mul(a[1], b[1])), add(mul(a[0], b[1]), mul(a[1], b[0]))]
const pv = (v: readonly [number, number]): IV => [point(v[0]), point(v[1])]

/** The lattice path over λ ∈ L enclosed (the same formulas as families/lattice-paths.ts), or why not. */
export function latticePathBox(path: FamilyPath, l0: Lattice, L: Interval): LatticeBox | { notCovered: string } {
  const w1 = pv(l0.w1), w2 = pv(l0.w2)
  // τ0 = ω2/ω1 is computed in floating point exactly as the path does: the path's own constants
  const d = l0.w1[0] * l0.w1[0] + l0.w1[1] * l0.w1[1]
  const tau0: [number, number] = [(l0.w2[0] * l0.w1[0] + l0.w2[1] * l0.w1[1]) / d, (l0.w2[1] * l0.w1[0] - l0.w2[0] * l0.w1[1]) / d]
  switch (path.kind) {
    case 'shear': return { w1, w2: [add(w2[0], mul(L, w1[0])), add(w2[1], mul(L, w1[1]))] }
    case 'stretch': return { w1, w2: cmul(w1, [point(tau0[0]), L]) }
    case 'interpolate': {
      const a = [...l0.w1, ...l0.w2], b = [...path.target.w1, ...path.target.w2]
      const c = a.map((v, i) => add(point(v), mul(L, point(b[i]! - v))))
      return { w1: [c[0]!, c[1]!], w2: [c[2]!, c[3]!] }
    }
    case 'tau-polyline': {
      const pts: [number, number][] = [tau0, ...path.points.map(p => [...p] as [number, number])]
      const k = pts.length - 1
      const piece = (l: number) => Math.min(k - 1, Math.max(0, Math.floor(l)))
      const i = piece(L.lo)
      if (piece(L.hi) !== i || (L.hi > i + 1 && i < k - 1)) return { notCovered: 'the interval crosses a corner of the τ polyline' }
      const a = pts[i]!, b = pts[i + 1]!, f = sub(L, point(i))
      return { w1, w2: cmul(w1, [add(point(a[0]), mul(f, point(b[0] - a[0]))), add(point(a[1]), mul(f, point(b[1] - a[1])))]) }
    }
    default: return { notCovered: `the ${path.kind} path is not affine in λ` }
  }
}

/** α and K of a phase path over λ ∈ L enclosed (families/phase.ts), or why not. */
export function phasePathBox(m: PatternModel, path: FamilyPath, L: Interval): { alpha: [Interval, Interval]; weights: Interval[] } | { notCovered: string } {
  const [a1, a2] = m.alpha
  const K = Array.from(m.weight, k => point(k))
  switch (path.kind) {
    case 'alpha1': return { alpha: [L, point(a2)], weights: K }
    case 'alpha2': return { alpha: [point(a1), L], weights: K }
    case 'alpha-line': return { alpha: [add(point(a1), mul(L, point(path.direction[0]))), add(point(a2), mul(L, point(path.direction[1])))], weights: K }
    case 'weight-scale': {
      const scaled = new Set(path.edges.map(id => m.edgeIds.indexOf(id)))
      return { alpha: [point(a1), point(a2)], weights: K.map((k, e) => scaled.has(e) ? mul(L, k) : k) }
    }
    default: return { notCovered: `'${path.kind}' is not a phase path` }
  }
}

/** Centre (midpoint) of two points and the radius that reaches both end boxes. */
export function segmentCentre(u0: ArrayLike<number>, u1: ArrayLike<number>, r0: number, r1: number): { centre: Float64Array; reach: number } {
  const centre = new Float64Array(u0.length)
  let reach = 0
  for (let i = 0; i < u0.length; i++) {
    const c = 0.5 * u0[i]! + 0.5 * u1[i]!
    centre[i] = c
    reach = Math.max(reach, succ(Math.abs(c - u0[i]!)) + r0, succ(Math.abs(c - u1[i]!)) + r1)
  }
  return { centre, reach: succ(reach) }
}

/** The λ interval between two saved points (in either order). */
export function lambdaInterval(a: number, b: number): Interval { return interval(Math.min(a, b), Math.max(a, b)) }
