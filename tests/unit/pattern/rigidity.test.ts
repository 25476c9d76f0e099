/**
 * Rigidity: the reduced spectrum against ml-matrix's SVD of the full Jacobian (J vanishes on the
 * trivial motions and is symmetric, so its singular values are those of the reduced matrix plus
 * one zero per trivial motion), J ≤ 0 (J = −Hess L with L a sum of norms: convex, common
 * practice), and kernel modes that are parallel redrawings (every edge keeps its direction).
 */
import { describe, expect, it } from 'vitest'
import { Matrix, SingularValueDecomposition } from 'ml-matrix'
import { balanceJacobian } from '../../../shared/pattern/balance'
import { edgeVectors } from '../../../shared/pattern/geometry'
import { compilePattern } from '../../../shared/pattern/model'
import { analyzeRigidity } from '../../../shared/pattern/rigidity'
import { parsePatternDocument } from '../../../shared/types/pattern'
import { findPatternExample } from '../../../shared/examples'
import { dense, reportDeviation, seeded } from './helpers'

function randomPlaneModel(seed: number) {
  const rnd = seeded(seed)
  const V = 3 + Math.floor(rnd() * 5)
  const vertices = Array.from({ length: V }, (_, v) => ({ id: `v${v}`, position: [3 * rnd(), 3 * rnd()] }))
  const edges = Array.from({ length: V }, (_, v) => ({ id: `c${v}`, from: `v${v}`, to: `v${(v + 1) % V}` }))
  for (let k = 0; k < V; k++) {
    const a = Math.floor(rnd() * V), b = (a + 1 + Math.floor(rnd() * (V - 1))) % V
    edges.push({ id: `x${k}`, from: `v${a}`, to: `v${b}` })
  }
  return compilePattern(parsePatternDocument({ format: 'wingfold-pattern', version: 1, name: 'r', space: 'plane', vertices, edges }))
}

describe('reduced spectrum vs ml-matrix SVD', () => {
  const models = [
    ...[1, 2, 3, 4].map(s => ({ label: `random plane drawing ${s}`, m: randomPlaneModel(s), trivial: 3 })),
    ...['square-pair', 'two-line-knot', 'three-line-weave', 'square-grid'].map(slug => ({
      label: slug, m: compilePattern(findPatternExample(slug)!.document), trivial: 2,
    })),
  ]
  for (const { label, m, trivial } of models) {
    it(`${label}: |reduced eigenvalues| = nonzero singular values of J; no positive eigenvalue`, () => {
      const r = analyzeRigidity(m, m.positions, m.lattice)
      expect(r.method).toBe('dense')
      expect(r.trivialDimension).toBe(trivial)
      const svd = new SingularValueDecomposition(new Matrix(dense(balanceJacobian(m, m.positions, m.lattice))))
      const sv = [...svd.diagonal].sort((a, b) => a - b).slice(trivial).map(s => s * r.lengthScale)
      const ours = r.eigenvalues.map(Math.abs).sort((a, b) => a - b)
      const dev = Math.max(...ours.map((x, i) => Math.abs(x - sv[i]!)))
      reportDeviation(`reduced spectrum vs ml-matrix SVD, ${label}`, 'ml-matrix SingularValueDecomposition', dev)
      expect(dev).toBeLessThan(1e-10)
      expect(r.inertia!.positive).toBe(0)
      expect(Math.abs(r.sigmaMin! - ours[0]!)).toBeLessThan(1e-14)
    })
  }
})

describe('line nets: kernel dimension = number of lines − 2, kernel modes are parallel redrawings', () => {
  const cases: [string, number][] = [['square-pair', 0], ['two-line-knot', 0], ['three-line-weave', 1], ['square-grid', 2]]
  for (const [slug, kernel] of cases) {
    it(`${slug}: ${kernel} non-trivial parallel redrawing(s)`, () => {
      const m = compilePattern(findPatternExample(slug)!.document)
      const r = analyzeRigidity(m, m.positions, m.lattice)
      expect(r.inertia!.zero).toBe(kernel)
      expect(r.rigid).toBe(kernel === 0)
      if (kernel === 0) return
      // the mode keeps each edge's direction: cross(x_e, δx_e) = 0, and it is no translation
      const delta = Float64Array.from(r.weakestMode.flat())
      const x = edgeVectors(m, m.positions, m.lattice)
      const dx = edgeVectors(m, delta, { w1: [0, 0], w2: [0, 0] })
      let maxCross = 0
      for (let e = 0; e < m.nEdges; e++) maxCross = Math.max(maxCross, Math.abs(x[2 * e]! * dx[2 * e + 1]! - x[2 * e + 1]! * dx[2 * e]!))
      expect(maxCross).toBeLessThan(1e-12)
      const meanX = r.weakestMode.reduce((s, d) => s + d[0], 0), meanY = r.weakestMode.reduce((s, d) => s + d[1], 0)
      expect(Math.hypot(meanX, meanY)).toBeLessThan(1e-12)
    })
  }
})

describe('rigidity options', () => {
  it('switches to the sparse method above maxDenseVertices (same verdict and inertia)', () => {
    const m = compilePattern(findPatternExample('square-grid')!.document)
    const dense = analyzeRigidity(m, m.positions, m.lattice)
    const r = analyzeRigidity(m, m.positions, m.lattice, { maxDenseVertices: 3 })
    expect(dense.method).toBe('dense')
    expect(r.method).toBe('sparse')
    expect(r.rigid).toBe(dense.rigid)
    expect(r.inertia).toEqual(dense.inertia)
  })
  it('rejects an unknown method', () => {
    const m = compilePattern(findPatternExample('square-pair')!.document)
    expect(() => analyzeRigidity(m, m.positions, m.lattice, { method: 'qr' as 'dense' })).toThrow(/method/)
  })
  it('rejects a non-positive tolerance', () => {
    const m = compilePattern(findPatternExample('square-pair')!.document)
    expect(() => analyzeRigidity(m, m.positions, m.lattice, { tolerance: 0 })).toThrow(/tolerance/)
  })
})
