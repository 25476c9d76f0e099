/**
 * Certificates against outside references:
 * - the Fermat–Torricelli point of a lattice triangle (classical; first isogonic centre X(13),
 *   C. Kimberling, Encyclopedia of Triangle Centers) through the two-vertex three-edge torus
 *   pattern: the certified box contains the closed-form point and shrinks as the point improves;
 * - a non-rigid pattern (the 2×2 supercell of the square pair: each of its diagonal lines slides
 *   on its own, a parallel redrawing beyond the translations — derived, as in the rigidity tests)
 *   must fail, never succeed;
 * - twisted states on rings (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync
 *   basin", Chaos 16, 015103, 2006): the reduced Jacobian is cos(2πq/n) times a ring Laplacian,
 *   so a certificate exists exactly when cos(2πq/n) ≠ 0 and its uniqueness radius → 0 as n → 4q;
 * - seeded random balanced patterns: every certified box contains the zero found by Newton's
 *   method carried out in 40-digit decimal arithmetic (decimal.js).
 */
import Decimal from 'decimal.js'
import { describe, expect, it } from 'vitest'
import { certifyHorizontal, certifyPhases } from '../../../shared/certify/pattern'
import { findPatternExample } from '../../../shared/examples'
import { balanceJacobian } from '../../../shared/pattern/balance'
import { analyzeRigidity } from '../../../shared/pattern/rigidity'
import { solveBalance } from '../../../shared/pattern/balance-solve'
import { compilePattern, type PatternModel } from '../../../shared/pattern/model'
import { tripletsToDense } from '../../../shared/linalg/dense'
import { supercell } from '../../../shared/pattern/supercell'
import { seeded } from '../linalg/random'
import { reportDeviation, torusDoc, torusModel } from '../pattern/helpers'
import { isogonicCentre } from '../pattern/triangle-centres'

type P = [number, number]

function fermatModel(w1: P, w2: P, start: P): PatternModel {
  return compilePattern(torusDoc(w1, w2, { corner: [0, 0], free: start }, [
    ['corner', 'free', [0, 0]], ['corner', 'free', [-1, 0]], ['corner', 'free', [0, -1]],
  ]))
}


describe('Fermat–Torricelli point (Kimberling X(13)) in the certified box', () => {
  // ω1 = (2, 0), ω2 = (1, 2): X(13) = (1, 1/√3) (derived: the triangle is isosceles about x = 1,
  // and the apex angles seen from (1, y) are 120° at y = tan(30°)·1)
  const w1: P = [2, 0], w2: P = [1, 2]
  const exact: P = [1, 1 / Math.sqrt(3)]
  it('closed form agrees with the trilinears', () => {
    const x13 = isogonicCentre([0, 0], w1, w2)
    expect(Math.hypot(x13[0] - exact[0], x13[1] - exact[1])).toBeLessThan(1e-14)
  })
  it('certified at each approximation, box contains X(13), radius shrinks as the point improves', () => {
    let previous = Infinity
    for (const delta of [3e-2, 1e-3, 1e-6, 1e-9, 0]) {
      const m = fermatModel(w1, w2, [exact[0] + delta, exact[1] - 0.7 * delta])
      const c = certifyHorizontal(m, m.positions, m.lattice)
      expect(c.certified, `δ = ${delta}`).toBe(true)
      if (!c.certified) continue
      const dist = Math.max(Math.abs(m.positions[2]! - exact[0]), Math.abs(m.positions[3]! - exact[1]))
      reportDeviation(`Fermat point δ = ${delta}: rMin − distance to X(13)`, 'Kimberling ETC X(13)', c.rMin - dist)
      expect(dist).toBeLessThanOrEqual(c.rMin)
      expect(c.rMin).toBeLessThan(previous)
      expect(c.rMax).toBeGreaterThan(c.rMin)
      previous = c.rMin
    }
    expect(previous).toBeLessThan(1e-14)
  })
  it('a seeded random acute lattice triangle: X(13) inside the box of the balanced point', () => {
    const rnd = seeded(13)
    for (let k = 0; k < 20; k++) {
      const w1r: P = [1 + rnd(), 0.3 * (rnd() - 0.5)], w2r: P = [0.3 + 0.5 * rnd(), 1 + rnd()]
      const m = fermatModel(w1r, w2r, [(w1r[0] + w2r[0]) / 3, (w1r[1] + w2r[1]) / 3])
      const b = solveBalance(m, m.positions, m.lattice)
      expect(b.converged).toBe(true)
      const c = certifyHorizontal(m, b.positions, m.lattice)
      expect(c.certified).toBe(true)
      if (!c.certified) continue
      const x13 = isogonicCentre([0, 0], w1r, w2r)
      expect(Math.max(Math.abs(b.positions[2]! - x13[0]), Math.abs(b.positions[3]! - x13[1]))).toBeLessThanOrEqual(c.rMin + 1e-15)
    }
  })
})

describe('size limit', () => {
  it('above maxSize the answer is "not certified: too large", never a proof', () => {
    const m = fermatModel([2, 0], [1, 2], [1, 1 / Math.sqrt(3)])
    const c = certifyHorizontal(m, m.positions, m.lattice, { maxSize: 1 })
    expect(c.certified).toBe(false)
    if (!c.certified) expect(c.reason).toBe('too-large')
  })
})

describe('non-rigid patterns never certify', () => {
  it('square pair 2×2 supercell (lines slide): not certified, reason not rigid', () => {
    const m = compilePattern(supercell(findPatternExample('square-pair')!.document, 2, 2))
    const b = solveBalance(m, m.positions, m.lattice)
    expect(b.converged).toBe(true)
    const c = certifyHorizontal(m, b.positions, m.lattice)
    expect(c.certified).toBe(false)
    if (!c.certified) expect(c.reason).toBe('not-rigid')
  })
})

/** A ring of n vertices with the wrap edge shifted by ω1 and the twisted state of winding q. */
function ring(n: number, q: number) {
  const positions: Record<string, P> = {}
  const edges: [string, string, P][] = []
  for (let i = 0; i < n; i++) {
    positions[`r${i}`] = [i / n, 0]
    edges.push([`r${i}`, `r${(i + 1) % n}`, [i === n - 1 ? 1 : 0, 0]])
  }
  const m = torusModel([1, 0], [0, 1], positions, edges)
  const psi = Float64Array.from({ length: n }, (_, i) => (2 * Math.PI * q * i) / n)
  return { m, psi }
}

describe('twisted phase rings (Wiley–Strogatz–Girvan 2006)', () => {
  it('certified exactly when cos(2πq/n) ≠ 0', () => {
    for (const [n, q] of [[8, 1], [8, 2], [8, 3], [12, 3], [12, 5], [7, 2], [20, 5], [20, 4]] as const) {
      const { m, psi } = ring(n, q)
      const c = certifyPhases(m, psi, [0, 0], m.weight)
      expect(c.certified, `n = ${n}, q = ${q}`).toBe(n !== 4 * q)
      if (!c.certified) expect(c.reason).toBe('not-rigid')
    }
  })
  it('the uniqueness radius shrinks to 0 as n → 4q (n = 4q + 1)', () => {
    let previous = Infinity
    for (const q of [1, 2, 3, 4, 6, 8]) {
      const { m, psi } = ring(4 * q + 1, q)
      const c = certifyPhases(m, psi, [0, 0], m.weight)
      expect(c.certified).toBe(true)
      if (!c.certified) continue
      // the true twisted state ψ_j = 2πqj/n (π to 40 digits) lies in the certified box
      const pi = DD.acos(-1), n = 4 * q + 1
      let dist = new DD(0)
      for (let j = 1; j < n; j++) dist = Decimal.max(dist, pi.times(2 * q * j).div(n).minus(psi[j]!).abs())
      expect(dist.lte(c.rMin)).toBe(true)
      expect(c.rMin).toBeLessThan(1e-10)
      expect(c.rMax).toBeLessThan(previous)
      previous = c.rMax
    }
    expect(previous).toBeLessThan(0.05)
  })
})

const DD = Decimal.clone({ precision: 40 })

/** B(p) in 40-digit decimals for the reduced unknowns (vertex 0 pinned). */
function decimalResidual(m: PatternModel, pin: P, u: Decimal[]): Decimal[] {
  const V = m.nVertices
  const pos = (v: number, c: number) => v === 0 ? new DD(pin[c]!) : u[2 * v - 2 + c]!
  const B = Array.from({ length: 2 * V }, () => new DD(0))
  for (let e = 0; e < m.nEdges; e++) {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    if (v === w) continue
    const x = [0, 1].map(c => pos(w, c).minus(pos(v, c)).plus(new DD(m.shift[4 * e]!).times(m.lattice.w1[c]!)).plus(new DD(m.shift[4 * e + 1]!).times(m.lattice.w2[c]!)))
    const l = x[0]!.times(x[0]!).plus(x[1]!.times(x[1]!)).sqrt()
    for (const c of [0, 1]) { B[2 * v + c] = B[2 * v + c]!.plus(x[c]!.div(l)); B[2 * w + c] = B[2 * w + c]!.minus(x[c]!.div(l)) }
  }
  return B.slice(2)
}

/** Newton in 40-digit decimals from the float point, with the float Jacobian (converges linearly, 16 digits a step). */
function decimalNewton(m: PatternModel, p: Float64Array): Decimal[] {
  const pin: P = [p[0]!, p[1]!]
  let u = Array.from(p.slice(2), x => new DD(x))
  const J = tripletsToDense(balanceJacobian(m, p, m.lattice))
  const n = 2 * m.nVertices - 2
  const Jr = J.subMatrix(2, n + 1, 2, n + 1)
  for (let k = 0; k < 6; k++) {
    const F = decimalResidual(m, pin, u).map(d => d.toNumber())
    const s = solveDense(Jr.to2DArray(), F)
    u = u.map((x, i) => x.minus(s[i]!))
  }
  return u
}

/** Gaussian elimination with partial pivoting (common practice). */
function solveDense(A: number[][], b: number[]): number[] {
  const n = b.length, M = A.map((r, i) => [...r, b[i]!])
  for (let c = 0; c < n; c++) {
    let piv = c
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[piv]![c]!)) piv = r
    ;[M[c], M[piv]] = [M[piv]!, M[c]!]
    for (let r = c + 1; r < n; r++) {
      const f = M[r]![c]! / M[c]![c]!
      for (let k = c; k <= n; k++) M[r]![k]! -= f * M[c]![k]!
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r]![n]!
    for (let k = r + 1; k < n; k++) s -= M[r]![k]! * x[k]!
    x[r] = s / M[r]![r]!
  }
  return x
}

describe('seeded random balanced patterns: the certified box contains the high-precision Newton zero', () => {
  const h = Math.sqrt(3) / 2
  it('Fermat pairs and triangular-net supercells in random lattices, randomly perturbed and balanced', () => {
    const rnd = seeded(2026)
    let certified = 0
    for (let k = 0; k < 10; k++) {
      const w1: P = [1 + rnd(), 0.3 * (rnd() - 0.5)], w2: P = [0.3 + 0.5 * rnd(), 1 + rnd()]
      const m = k % 2 === 0
        ? fermatModel(w1, w2, [(w1[0] + w2[0]) / 3, (w1[1] + w2[1]) / 3])
        // one vertex, three loops (the triangular net) in a random lattice, as a 2×2 or 3×2 supercell
        : compilePattern(supercell(torusDoc(w1, [w2[0], h * w2[1]], { o: [0.1, 0.2] }, [['o', 'o', [1, 0]], ['o', 'o', [0, 1]], ['o', 'o', [-1, 1]]]), 2 + (k % 3 === 0 ? 1 : 0), 2))
      const p0 = m.positions.map(x => x + 0.05 * (rnd() - 0.5))
      const b = solveBalance(m, p0, m.lattice)
      expect(b.converged).toBe(true)
      const c = certifyHorizontal(m, b.positions, m.lattice)
      expect(c.certified, `pattern ${k}`).toBe(true)
      if (!c.certified) continue
      certified++
      const z = decimalNewton(m, b.positions)
      const resid = decimalResidual(m, [b.positions[0]!, b.positions[1]!], z).reduce((s, d) => Decimal.max(s, d.abs()), new DD(0))
      expect(resid.toNumber()).toBeLessThan(1e-30)
      const dist = z.reduce((s, d, i) => Decimal.max(s, d.minus(b.positions[i + 2]!).abs()), new DD(0))
      reportDeviation(`random pattern ${k}: rMin − distance of the 40-digit zero`, 'decimal.js Newton (derived)', c.rMin - dist.toNumber())
      expect(dist.lte(c.rMin)).toBe(true)
    }
    expect(certified).toBe(10)
  })
  it('honeycomb supercells (the Fermat pair 2×2) are not rigid by the rigidity verdict, and never certify', () => {
    const rnd = seeded(7)
    for (let k = 0; k < 4; k++) {
      const w1: P = [1 + rnd(), 0.3 * (rnd() - 0.5)], w2: P = [0.3 + 0.5 * rnd(), 1 + rnd()]
      const base = torusDoc(w1, w2, { corner: [0, 0], free: [(w1[0] + w2[0]) / 3, (w1[1] + w2[1]) / 3] }, [
        ['corner', 'free', [0, 0]], ['corner', 'free', [-1, 0]], ['corner', 'free', [0, -1]],
      ])
      const m = compilePattern(supercell(base, 2, 2))
      const b = solveBalance(m, m.positions, m.lattice)
      expect(analyzeRigidity(m, b.positions, m.lattice).rigid).toBe(false)
      expect(certifyHorizontal(m, b.positions, m.lattice).certified).toBe(false)
    }
  })
})
