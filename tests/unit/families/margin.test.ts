/**
 * The family runs monitor the rigidity verdict's own margin (trivial motions removed,
 * dimensionless), not σ_min of the pinned F_u: checked point by point against the verdict
 * (shared/pattern/rigidity.ts, phase-solve.ts), whose dense path is ml-matrix's symmetric
 * eigen-decomposition, and against the pinned σ_min, which falls with the supercell's size.
 */
import { describe, expect, it } from 'vitest'
import { createContinuation } from '../../../shared/continuation'
import { findPatternExample } from '../../../shared/examples'
import { setupFamily } from '../../../shared/families/build'
import { compilePattern } from '../../../shared/pattern/model'
import { analyzeRigidity } from '../../../shared/pattern/rigidity'
import { analyzePhaseRigidity } from '../../../shared/pattern/phase-solve'
import { supercell } from '../../../shared/pattern/supercell'
import { parseFamilySettings } from '../../../shared/types/family'
import { ring } from './fixtures'

describe('rigidity margin monitored along families', () => {
  for (const m of [3, 6]) {
    it(`shear of the six-wing ${m}×${m} supercell: every point's margin is the verdict's σ_min·ℓ̄`, () => {
      const doc = supercell(findPatternExample('six-wing-lattice')!.document, m, m)
      const setup = setupFamily(doc, parseFamilySettings({ path: { kind: 'shear' }, to: 0.2, balanceFirst: false }))
      const run = createContinuation(setup.problem, setup.start, { ...setup.options, maxPoints: 4, maxStep: 0.05 })
      while (!run.done) run.next()
      const model = compilePattern(doc)
      expect(run.points.length).toBe(4)
      for (const p of run.points) {
        const lattice = { w1: model.lattice.w1, w2: [model.lattice.w2[0] + p.lambda * model.lattice.w1[0], model.lattice.w2[1] + p.lambda * model.lattice.w1[1]] as [number, number] }
        const pos = new Float64Array(2 * model.nVertices)
        pos[0] = model.positions[0]!; pos[1] = model.positions[1]!
        pos.set(p.u, 2)
        const verdict = analyzeRigidity(model, pos, lattice, { method: 'dense' })
        // a few inverse iterations (J ≤ 0 here): an upper bound of the verdict's value (300
        // iterations), close to it; the lattice's lowest modes form a cluster that shear splits
        // only slightly, which is where a short iteration is least accurate
        expect(p.sigmaMin!).toBeGreaterThanOrEqual(verdict.sigmaMin! * (1 - 1e-9))
        expect(p.sigmaMin!).toBeLessThan(verdict.sigmaMin! * 1.03)
      }
    })
  }

  it('ring of 6 in α1: the margin is the phase verdict\'s σ_min / K̄', () => {
    const doc = ring(6)
    const setup = setupFamily(doc, parseFamilySettings({ path: { kind: 'alpha1' }, to: 2 }))
    const run = createContinuation(setup.problem, setup.start, { ...setup.options, maxPoints: 5 })
    while (!run.done) run.next()
    const model = compilePattern(doc)
    for (const p of run.points) {
      const psi = Float64Array.from([model.psi[0]!, ...p.u])
      const verdict = analyzePhaseRigidity(model, psi, [p.lambda, model.alpha[1]], model.weight, 1e-7, 1000)
      expect(verdict.method).toBe('dense')
      expect(Math.abs(p.sigmaMin! - verdict.sigmaMin!) / verdict.sigmaMin!).toBeLessThan(1e-3)
    }
  })
})
