/**
 * Analytic F_u and F_λ of every family problem against central finite differences of its own
 * residual (common practice), at points away from the start so that every term is active; and
 * the symmetry of F_u where the problem declares it.
 */
import { describe, expect, it } from 'vitest'
import { familyProblem } from '../../../shared/families/build'
import { tripletsToDense } from '../../../shared/linalg/dense'
import { parseFamilySettings, type FamilySettingsInput } from '../../../shared/types/family'
import type { PatternDocument } from '../../../shared/types/pattern'
import { seeded } from '../linalg/random'
import { BRIDGE_WINGS, fermatPair, planeBridge, ring } from './fixtures'
import { findPatternExample } from '../../../shared/examples'

function check(doc: PatternDocument, settings: FamilySettingsInput, lambda: number, seed: number) {
  const { problem } = familyProblem(doc, parseFamilySettings(settings))
  const n = problem.n
  const rand = seeded(seed)
  // the document's unknowns (phases, or positions then μ = 0) moved by a small seeded perturbation
  const u = new Float64Array(n)
  const rest = doc.vertices.slice(1)
  if (n === rest.length) rest.forEach((v, i) => { u[i] = doc.phases?.vertexPhases?.[v.id] ?? 0 })
  else rest.forEach((v, i) => { u[2 * i] = v.position[0]; u[2 * i + 1] = v.position[1] })
  for (let i = 0; i < n; i++) u[i]! += 0.05 * (rand() - 0.5)
  const J = problem.jacobian(u, lambda)
  const A = tripletsToDense(J.Fu)
  const h = 1e-6
  const fp = new Float64Array(n), fm = new Float64Array(n)
  let worst = 0
  for (let j = 0; j <= n; j++) {
    const up = u.slice(), um = u.slice()
    let lp = lambda, lm = lambda
    if (j < n) { up[j]! += h; um[j]! -= h } else { lp += h; lm -= h }
    problem.residual(up, lp, fp)
    problem.residual(um, lm, fm)
    for (let i = 0; i < n; i++) {
      const fd = (fp[i]! - fm[i]!) / (2 * h)
      const an = j < n ? A.get(i, j) : J.Flambda[i]!
      worst = Math.max(worst, Math.abs(fd - an))
    }
  }
  expect(worst).toBeLessThan(1e-6)
  if (problem.symmetric) {
    let asym = 0
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) asym = Math.max(asym, Math.abs(A.get(i, j) - A.get(j, i)))
    expect(asym).toBeLessThan(1e-14)
  }
  return problem
}

describe('family Jacobians against finite differences', () => {
  const pair = () => structuredClone(findPatternExample('square-pair')!.document)
  const cases: [string, () => PatternDocument, FamilySettingsInput, number][] = [
    ['shear', () => fermatPair(0.2), { path: { kind: 'shear' }, to: 1 }, 0.3],
    ['stretch', () => fermatPair(0.2), { path: { kind: 'stretch' }, to: 2 }, 1.4],
    ['angle', () => fermatPair(0.2), { path: { kind: 'angle' }, to: 2 }, 1.2],
    ['interpolate', () => fermatPair(0.2), { path: { kind: 'interpolate', target: { w1: [1.2, 0.1], w2: [-0.3, 0.9] } }, to: 1 }, 0.4],
    ['tau-polyline', () => fermatPair(0.2), { path: { kind: 'tau-polyline', points: [[0.5, 1.2], [0.1, 0.8]] }, to: 2 }, 1.3],
    ['wing-rotation', planeBridge, { path: { kind: 'wing-rotation', ...BRIDGE_WINGS }, to: 1 }, 0.4],
    ['alpha1', pair, { path: { kind: 'alpha1' }, to: 2 }, 1.7],
    ['alpha2', pair, { path: { kind: 'alpha2' }, to: 2 }, 0.9],
    ['alpha-line', pair, { path: { kind: 'alpha-line', direction: [0.6, -0.8] }, to: 2 }, 0.5],
    ['weight-scale', () => ring(5), { path: { kind: 'weight-scale', edges: ['e1', 'e3'] }, to: 2 }, 1.6],
  ]
  cases.forEach(([name, doc, settings, lambda], k) => {
    it(`${name}: F_u and F_λ`, () => {
      const d = doc()
      if (name === 'weight-scale') d.phases = { alpha: [2, 0], vertexPhases: { v1: 0.3, v2: 0.9, v3: 1.1, v4: 1.6 } }
      const p = check(d, settings, lambda, 17 + k)
      expect(p.symmetric).toBe(name !== 'wing-rotation')
    })
  })
})
