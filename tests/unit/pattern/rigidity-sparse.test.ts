/**
 * The sparse rigidity path (pinned LDLᵀ inertia + inverse iteration) against the dense path,
 * which is itself checked against ml-matrix's SVD in rigidity.test.ts; and against closed forms:
 * - Sylvester's law of inertia (J. J. Sylvester 1852; Golub–Van Loan, Matrix Computations, 2013,
 *   §8.1): the inertia of the pinned matrix equals that of J on the complement of its trivial kernel;
 * - the triangular lattice (three families of lines at 60°) is rigid under parallel redrawing: a
 *   parallel redrawing of a triangle is a homothety, neighbours share it, and the torus admits
 *   only ratio 1 (from memory, classical);
 * - an m × m supercell of the square pair (one line in each diagonal direction) has m lines in
 *   each direction, each of which can slide on its own: 2m − 2 parallel redrawings beyond the
 *   translations (derived);
 * - twisted ring states: the reduced phase spectrum −cos(2πq/n)(2 − 2cos(2πj/n)) (D. A. Wiley,
 *   S. H. Strogatz, M. Girvan, "The size of the sync basin", Chaos 16, 2006; circulant spectrum).
 */
import { describe, expect, it } from 'vitest'
import { analyzeRigidity } from '../../../shared/pattern/rigidity'
import { analyzePhaseRigidity } from '../../../shared/pattern/phase-solve'
import { compilePattern } from '../../../shared/pattern/model'
import { balanceResidual } from '../../../shared/pattern/balance'
import { supercell } from '../../../shared/pattern/supercell'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { findPatternExample } from '../../../shared/examples'
import { reportDeviation, torusDoc, torusModel } from './helpers'

const h = Math.sqrt(3) / 2
/** One vertex of degree 6 in the hexagonal torus: the triangular lattice. */
const triangular = torusDoc([1, 0], [0.5, h], { o: [0.2, 0.1] }, [['o', 'o', [1, 0]], ['o', 'o', [0, 1]], ['o', 'o', [-1, 1]]])

function compare(label: string, m: ReturnType<typeof compilePattern>) {
  const d = analyzeRigidity(m, m.positions, m.lattice, { method: 'dense' })
  const s = analyzeRigidity(m, m.positions, m.lattice, { method: 'sparse' })
  expect(s.method).toBe('sparse')
  expect(s.inertia).toEqual(d.inertia)
  expect(s.rigid).toBe(d.rigid)
  expect(s.trivialDimension).toBe(d.trivialDimension)
  if (d.rigid) {
    const rel = Math.abs(s.sigmaMin! - d.sigmaMin!) / d.sigmaMin!
    reportDeviation(`${label}: sparse vs dense σ_min (relative)`, 'dense path / ml-matrix', rel)
    expect(rel).toBeLessThan(1e-6)
  } else {
    expect(s.sigmaMin!).toBeLessThanOrEqual(s.tolerance)
  }
  // the weakest mode is orthogonal to the translations
  const sx = s.weakestMode.reduce((a, [x]) => a + x, 0), sy = s.weakestMode.reduce((a, [, y]) => a + y, 0)
  expect(Math.hypot(sx, sy)).toBeLessThan(1e-8)
  return { d, s }
}

describe('sparse rigidity agrees with the dense spectrum', () => {
  it('triangular lattice 8×8 supercell (V = 64): rigid, J ≤ 0 so every reduced eigenvalue negative', () => {
    const m = compilePattern(supercell(triangular, 8, 8))
    const { s } = compare('triangular 8×8', m)
    expect(s.rigid).toBe(true)
    expect(s.inertia).toEqual({ negative: 2 * 64 - 2, zero: 0, positive: 0 })
  })
  it('square pair 5×5 supercell (V = 50): 2·5 − 2 = 8 parallel redrawings beyond translations', () => {
    const m = compilePattern(supercell(findPatternExample('square-pair')!.document, 5, 5))
    const { s } = compare('square pair 5×5', m)
    expect(s.rigid).toBe(false)
    expect(s.inertia!.zero).toBe(2 * 5 - 2)
  })
  for (const slug of ['square-pair', 'three-line-weave', 'two-line-knot', 'square-grid', 'plane-bridge']) {
    it(`example ${slug}`, () => { compare(slug, compilePattern(findPatternExample(slug)!.document)) })
  }
  it('a rough (unbalanced) plane drawing: dilation pinned as well', () => {
    const doc = findPatternExample('plane-bridge')!.document
    const rough = { ...doc, vertices: doc.vertices.map((v, i) => ({ ...v, position: [v.position[0] + 0.13 * i, v.position[1] - 0.07 * i * i] as [number, number] })) }
    const { s } = compare('plane rough', compilePattern(rough))
    expect(s.trivialDimension).toBe(3)
  })
})

describe('analyzePattern switches to the sparse path above maxDenseVertices', () => {
  it('triangular lattice 30×30 (V = 900): balanced, rigid by the sparse method, inertia exact', () => {
    const doc = supercell(triangular, 30, 30)
    const m = compilePattern(doc)
    const b = balanceResidual(m, m.positions, m.lattice)
    expect(Math.max(...Array.from(b, Math.abs))).toBeLessThan(1e-12)
    const r = analyzePattern(doc)
    expect(r.verdicts.rigidity.method).toBe('sparse')
    expect(r.verdicts.rigidity.ok).toBe(true)
    expect(r.verdicts.rigidity.inertia).toEqual({ negative: 2 * 900 - 2, zero: 0, positive: 0 })
    // Closed form by Fourier analysis over the supercell (Bloch waves, common practice): at wave
    // vector k ∈ Z_m², J acts on the 2-vector amplitude as D(k) = −Σ_e 2(1 − cos 2π(k·s_e)/m) P_e,
    // P_e = I − u_e u_eᵀ over the three unit edges; the trivial kernel is k = 0.
    const dirs = [[1, 0, [1, 0]], [0.5, h, [0, 1]], [-0.5, h, [-1, 1]]] as const
    let expected = Infinity
    for (let k1 = 0; k1 < 30; k1++) {
      for (let k2 = 0; k2 < 30; k2++) {
        if (k1 === 0 && k2 === 0) continue
        let a = 0, b = 0, c = 0
        for (const [ux, uy, sh] of dirs) {
          const w = -2 * (1 - Math.cos((2 * Math.PI * (k1 * sh[0] + k2 * sh[1])) / 30))
          a += w * (1 - ux * ux); b += w * (-ux * uy); c += w * (1 - uy * uy)
        }
        const mean = (a + c) / 2, rad = Math.hypot((a - c) / 2, b)
        expected = Math.min(expected, Math.abs(mean - rad), Math.abs(mean + rad))
      }
    }
    const rel = Math.abs(r.verdicts.rigidity.sigmaMin! - expected) / expected // ℓ̄ = 1
    reportDeviation('triangular lattice 30×30: sparse σ_min vs Bloch closed form (relative)', 'Fourier analysis of a periodic framework, common practice', rel)
    expect(rel).toBeLessThan(1e-6)
  })
})

describe('sparse phase rigidity on twisted rings (Wiley–Strogatz–Girvan 2006)', () => {
  for (const [n, q] of [[12, 1], [12, 4], [12, 3], [500, 100], [500, 125]] as const) {
    it(`n = ${n}, q = ${q}`, () => {
      const positions: Record<string, [number, number]> = {}
      const edges: [string, string, [number, number]][] = []
      for (let i = 0; i < n; i++) {
        positions[`r${i}`] = [i / n, 0]
        edges.push([`r${i}`, `r${(i + 1) % n}`, [i === n - 1 ? 1 : 0, 0]])
      }
      const m = torusModel([1, 0], [0, 1], positions, edges)
      const psi = Float64Array.from({ length: n }, (_, i) => (2 * Math.PI * q * i) / n)
      const r = analyzePhaseRigidity(m, psi, [0, 0], m.weight, 1e-9, 1)
      expect(r.method).toBe('sparse')
      const c = Math.cos((2 * Math.PI * q) / n)
      if (n === 4 * q) {
        expect(r.rigid).toBe(false)
        expect(r.inertia).toEqual({ negative: 0, zero: n - 1, positive: 0 })
      } else {
        expect(r.inertia).toEqual(c > 0 ? { negative: n - 1, zero: 0, positive: 0 } : { negative: 0, zero: 0, positive: n - 1 })
        // smallest |eigenvalue|: |c|·(2 − 2cos(2π/n))
        const expected = Math.abs(c) * (2 - 2 * Math.cos((2 * Math.PI) / n))
        const rel = Math.abs(r.sigmaMin! - expected) / expected
        reportDeviation(`twisted ring n=${n}, q=${q}: sparse σ_min (relative)`, 'Wiley–Strogatz–Girvan 2006 + circulant spectrum', rel)
        expect(rel).toBeLessThan(1e-6)
      }
    })
  }
})
