/**
 * The pattern at a point of a phase run, as the point inspector analyses it: the point's phases
 * solve the vertical equations on cuts and the existence checklist is read there. Pattern: Meeks'
 * two towers in an acute lattice [H. Chen, M. Traizet, arXiv 2103.15676, 2021, Ex. 7.1], where the
 * one equation holds the shortest edges e2, e4 and phase rigidity is 2|cos φ4| ≠ 0 away from π/2.
 */
import { describe, expect, it, vi } from 'vitest'
import { FamilyRunner } from '../../../shared/families'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { parseFamilySettings } from '../../../shared/types/family'
import { documentAtPoint } from '../../../app/utils/family/point-doc'
import { meeks } from '../pattern/published-patterns'

// app/utils import the core through Nuxt's #shared alias; point it at the same files here
vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
vi.mock('#shared/families/lattice-paths', () => import('../../../shared/families/lattice-paths'))
vi.mock('#shared/families/phase', () => import('../../../shared/families/phase'))
vi.mock('#shared/pattern/model', () => import('../../../shared/pattern/model'))

describe('documentAtPoint on a phase run', () => {
  it('sets ψ and α of the point: its vertical equations hold and the checklist is computed there', () => {
    const doc = meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3)
    const settings = parseFamilySettings({ path: { kind: 'alpha2' }, to: doc.phases!.alpha[1] + 0.4, stop: { maxPoints: 20 } })
    const r = new FamilyRunner(doc, settings)
    while (!r.done) r.step({ points: 100, ms: 60_000 })
    const pts = r.result().branch.points
    const last = pts[pts.length - 1]!
    expect(last.lambda).toBeGreaterThan(doc.phases!.alpha[1] + 0.3)
    const at = documentAtPoint(doc, settings, last.lambda, last.u)
    expect(at.phases!.alpha[1]).toBe(last.lambda)
    const rep = analyzePattern(at)
    expect(rep.verdicts.phaseBalance.ok).toBe(true)
    expect(rep.verdicts.phaseBalance.residualNorm).toBeLessThan(1e-9)
    expect(rep.existence.items.find(i => i.id === 'T10')!.status).toBe('ok')
  })
})
