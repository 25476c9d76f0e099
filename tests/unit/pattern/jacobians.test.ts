/**
 * Analytic derivatives against central finite differences (common practice: h = 1e-6, error
 * O(h²) ≈ 1e-10 relative to the entries) on seeded random drawings, plus symmetry.
 */
import { describe, expect, it } from 'vitest'
import { balanceJacobian, balanceLatticeDerivative, balanceResidual } from '../../../shared/pattern/balance'
import type { Lattice } from '../../../shared/pattern/model'
import { phaseAlphaDerivative, phaseJacobian, phaseResidual } from '../../../shared/pattern/phases'
import { dense, finiteDifference, maxAbsDiff, reportDeviation, rows, seeded, torusModel } from './helpers'

/** A random torus pattern: V vertices, each pair of consecutive vertices joined, plus random extra edges. */
function randomTorusModel(seed: number) {
  const rnd = seeded(seed)
  const V = 3 + Math.floor(rnd() * 4)
  const positions: Record<string, [number, number]> = {}
  for (let v = 0; v < V; v++) positions[`v${v}`] = [rnd() * 2, rnd() * 2]
  const shift = (): [number, number] => [Math.floor(rnd() * 3) - 1, Math.floor(rnd() * 3) - 1]
  const edges: [string, string, [number, number]][] = []
  for (let v = 0; v < V; v++) edges.push([`v${v}`, `v${(v + 1) % V}`, shift()])
  for (let k = 0; k < V; k++) edges.push([`v${Math.floor(rnd() * V)}`, `v${Math.floor(rnd() * V)}`, [1, Math.floor(rnd() * 2)]])
  const w1: [number, number] = [2 + rnd(), 0.3 * rnd()], w2: [number, number] = [0.4 * rnd(), 2 + rnd()]
  return torusModel(w1, w2, positions, edges)
}

describe('balance derivatives', () => {
  for (const seed of [1, 2, 3, 4, 5]) {
    it(`J = ∂B/∂p and ∂B/∂ω match finite differences and J is symmetric (seed ${seed})`, () => {
      const m = randomTorusModel(seed)
      const p = m.positions, lat = m.lattice
      const J = dense(balanceJacobian(m, p, lat))
      const fd = finiteDifference(x => balanceResidual(m, x, lat), p)
      const dev = maxAbsDiff(J, fd)
      reportDeviation(`balance Jacobian vs finite differences, seed ${seed}`, 'central differences, common practice', dev)
      expect(dev).toBeLessThan(1e-7)
      expect(maxAbsDiff(J, J[0]!.map((_, j) => J.map(r => r[j]!)))).toBe(0)
      const packLattice = (w: Float64Array): Lattice => ({ w1: [w[0]!, w[1]!], w2: [w[2]!, w[3]!] })
      const w0 = Float64Array.from([...lat.w1, ...lat.w2])
      const dW = rows(balanceLatticeDerivative(m, p, lat), 4)
      const fdW = finiteDifference(w => balanceResidual(m, p, packLattice(w)), w0)
      const devW = maxAbsDiff(dW, fdW)
      reportDeviation(`balance lattice derivative vs finite differences, seed ${seed}`, 'central differences, common practice', devW)
      expect(devW).toBeLessThan(1e-7)
    })
  }
})

describe('phase derivatives', () => {
  for (const seed of [11, 12, 13, 14]) {
    it(`∂G/∂ψ and ∂G/∂α match finite differences and ∂G/∂ψ is symmetric (seed ${seed})`, () => {
      const m = randomTorusModel(seed)
      const rnd = seeded(seed + 100)
      const psi = Float64Array.from({ length: m.nVertices }, () => 6 * rnd())
      const alpha: [number, number] = [6 * rnd(), 6 * rnd()]
      const K = Float64Array.from({ length: m.nEdges }, () => 0.5 + rnd())
      const J = dense(phaseJacobian(m, psi, alpha, K))
      const dev = maxAbsDiff(J, finiteDifference(x => phaseResidual(m, x, alpha, K), psi))
      reportDeviation(`phase Jacobian vs finite differences, seed ${seed}`, 'central differences, common practice', dev)
      expect(dev).toBeLessThan(1e-8)
      expect(maxAbsDiff(J, J[0]!.map((_, j) => J.map(r => r[j]!)))).toBe(0)
      const dA = rows(phaseAlphaDerivative(m, psi, alpha, K), 2)
      const devA = maxAbsDiff(dA, finiteDifference(a => phaseResidual(m, psi, [a[0]!, a[1]!], K), Float64Array.from(alpha)))
      reportDeviation(`phase α derivative vs finite differences, seed ${seed}`, 'central differences, common practice', devA)
      expect(devA).toBeLessThan(1e-8)
    })
  }
})
