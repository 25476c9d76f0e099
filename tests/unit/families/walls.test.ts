/**
 * Walls along lattice families and the events of the published conditions. Meeks' pattern
 * [H. Chen, M. Traizet, arXiv 2103.15676, 2021, Ex. 7.1]: the phase Jacobian is 2 cos a for an
 * obtuse lattice (edges e1, e3 shortest), 2(cos a + cos b) for ω1 ⊥ ω2 (all four tie) and 2 cos b
 * for an acute one (e2, e4 shortest). Sheared from ω2 = (−0.2, 1.3) by s·ω1, ω1 = (1, 0), the
 * lattice is orthogonal at s = 0.2 exactly: the wall (derived).
 */
import { describe, expect, it, vi } from 'vitest'
import { FamilyRunner } from '../../../shared/families'
import { conditionEvents, describeWall } from '../../../shared/families/walls'
import { compilePattern } from '../../../shared/pattern/model'
import type { PatternDocument } from '../../../shared/types/pattern'
import type { FamilySettingsInput } from '../../../shared/types/family'
import { meeks, twoTowers } from '../pattern/published-patterns'
import { wallAt } from '../../../app/utils/family/wall'
import { parseFamilySettings } from '../../../shared/types/family'
import { parsePatternDocument } from '../../../shared/types/pattern'

// app/utils import the core through Nuxt's #shared alias; point it at the same files here
vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
vi.mock('#shared/families/lattice-paths', () => import('../../../shared/families/lattice-paths'))
vi.mock('#shared/families/phase', () => import('../../../shared/families/phase'))
vi.mock('#shared/families/walls', () => import('../../../shared/families/walls'))
vi.mock('#shared/pattern/model', () => import('../../../shared/pattern/model'))
vi.mock('#shared/pattern/balance-solve', () => import('../../../shared/pattern/balance-solve'))

function runToEnd(doc: PatternDocument, settings: FamilySettingsInput) {
  const r = new FamilyRunner(doc, settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  return r.result()
}

describe('walls along a lattice shear of Meeks [CT-I Ex. 7.1]', () => {
  const doc = meeks([1, 0], [-0.2, 1.3], 2 * Math.PI / 3, Math.PI / 2)

  it('stops at the orthogonal lattice s = 0.2 (located to 1e-8) with the verdicts before, at and after', () => {
    const r = runToEnd(doc, { path: { kind: 'shear' }, to: 0.5, stop: { locateTolerance: 1e-10 } })
    const walls = r.branch.specialPoints.filter(s => s.kind === 'wall')
    expect(walls).toHaveLength(1)
    const w = walls[0]!
    expect(Math.abs(w.lambda - 0.2)).toBeLessThan(1e-8)
    const m = compilePattern(doc)
    // the balanced drawing of lattice s: w = v − (ω1 + ω2)/2 (the four edge vectors ±(ω1 ± ω2)/2 cancel; derived)
    const state = (s: number, u?: ArrayLike<number>) => {
      const w2: [number, number] = [-0.2 + s, 1.3]
      const v = [m.positions[0]!, m.positions[1]!]
      const p = Float64Array.of(v[0]!, v[1]!, u ? u[0]! : v[0]! - (1 + w2[0]) / 2, u ? u[1]! : v[1]! - w2[1] / 2)
      return { p, lattice: { w1: [1, 0] as [number, number], w2 } }
    }
    const d = describeWall(m, state(0.1), state(w.lambda, w.u), state(0.3))
    // before: e1, e3 (2 cos a = −1, phase-rigid); at: all four (2(cos a + cos b) = −1); after: e2, e4 (2 cos b = 0)
    expect(d.before.equations[0]!.terms.map(t => t.edge).sort()).toEqual(['e1', 'e3'])
    expect(d.at.equations[0]!.terms).toHaveLength(4)
    expect(d.after.equations[0]!.terms.map(t => t.edge).sort()).toEqual(['e2', 'e4'])
    expect([d.before.phaseRigid, d.at.phaseRigid, d.after.phaseRigid]).toEqual([true, true, false])
    expect(d.before.balanced && d.at.balanced && d.after.balanced).toBe(true)
    expect(d.phaseBranchEnds).toBe(false)
    expect(d.ties.map(t => t.edges.join('/')).length).toBeGreaterThan(0)
    // the point inspector's reading of the same special point (balanced drawings at λ ∓ 1e-6)
    const w2 = wallAt(doc, parseFamilySettings({ path: { kind: 'shear' }, to: 0.5 }), w.lambda, w.u)
    expect([w2.before.phaseRigid, w2.at.phaseRigid, w2.after.phaseRigid]).toEqual([true, true, false])
    expect(w2.after.equations[0]!.terms.map(t => t.edge).sort()).toEqual(['e2', 'e4'])
  })

  it('trivial phases: no wall event (every structure is balanced)', () => {
    const r = runToEnd(meeks([1, 0], [-0.2, 1.3], 0, Math.PI), { path: { kind: 'shear' }, to: 0.5 })
    expect(r.branch.specialPoints.filter(s => s.kind === 'wall')).toHaveLength(0)
  })
})

/**
 * Honeycomb: two towers v, w and three edges v → w + k, k ∈ {(0,0), (1,0), (0,1)}. Balance puts v
 * at the Fermat point of the triangle A = w, B = w + ω1, C = w + ω2 (unit vectors summing to 0),
 * and the Fermat point is closest to the vertex of the largest angle, i.e. the one opposite the
 * longest side: the shortest level, the only one with an equation (it joins v and w), is the edge
 * to that vertex (derived). With ω1 = (1, 0), ω2 = (x, 0.8): |AB| = 1, |AC|² = x² + 0.64,
 * |BC|² = (1 − x)² + 0.64. For x < 0.4 BC is longest (edge a shortest); at x = 0.4 |BC| = |AB|,
 * edges a and c tie; for 0.4 < x < 0.6 AB is longest (edge c); at x = 0.6 |AC| = |AB|, edges c and
 * b tie; for x > 0.6 AC is longest (edge b). At x = 0.5 edges a and b tie but stay above c: no
 * wall. Sheared from x = 0.3 by s: walls at s = 0.1 (a/c) and s = 0.3 (c/b), derived.
 */
function honeycomb(): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'honeycomb', space: 'torus',
    lattice: { w1: [1, 0], w2: [0.3, 0.8] },
    vertices: [{ id: 'v', position: [0.45, 0.3] }, { id: 'w', position: [0, 0] }],
    edges: ([[0, 0], [1, 0], [0, 1]] as [number, number][]).map((shift, i) => ({ id: 'abc'[i]!, from: 'v', to: 'w', shift })),
    phases: { alpha: [0.7, -0.4], vertexPhases: { v: 0, w: 1.1 } },
  })
}

describe('every change of structure along a lattice path is a located wall', () => {
  it('honeycomb under shear: two walls, a/c at s = 0.1 and c/b at s = 0.3 (derived), none at s = 0.2', () => {
    const doc = honeycomb()
    const r = runToEnd(doc, { path: { kind: 'shear' }, to: 0.4, stop: { locateTolerance: 1e-10 } })
    const walls = r.branch.specialPoints.filter(s => s.kind === 'wall')
    expect(walls.map(w => w.lambda)).toHaveLength(2)
    expect(Math.abs(walls[0]!.lambda - 0.1)).toBeLessThan(1e-8)
    expect(Math.abs(walls[1]!.lambda - 0.3)).toBeLessThan(1e-8)
    expect(walls.every(w => w.located)).toBe(true)
    const settings = parseFamilySettings({ path: { kind: 'shear' }, to: 0.4 })
    const [d1, d2] = walls.map(w => wallAt(doc, settings, w.lambda, w.u))
    const shortest = (d: ReturnType<typeof wallAt>['before']) => d.equations[0]!.terms.map(t => t.edge).sort()
    expect([shortest(d1!.before), shortest(d1!.at), shortest(d1!.after)]).toEqual([['a'], ['a', 'c'], ['c']])
    expect([shortest(d2!.before), shortest(d2!.at), shortest(d2!.after)]).toEqual([['c'], ['b', 'c'], ['b']])
    // one term sin φ ≠ 0 per side: these phases solve none of the one-edge equations
    expect(d1!.phaseBranchEnds && d2!.phaseBranchEnds).toBe(true)
  })

  it('Meeks ω2 = (s, 1.3) there and back through s = 0 [CT-I Ex. 7.1]: a wall each way, at s = 0', () => {
    const doc = meeks([1, 0], [-0.2, 1.3], 2 * Math.PI / 3, Math.PI / 2)
    // τ = ω2 (ω1 = (1, 0)): −0.2 + 1.3i → 0.2 + 1.3i → −0.2 + 1.3i; λ ∈ [0, 2], s = −0.2 + 0.4λ then 0.6 − 0.4λ
    const r = runToEnd(doc, { path: { kind: 'tau-polyline', points: [[0.2, 1.3], [-0.2, 1.3]] }, to: 2, stop: { locateTolerance: 1e-10 } })
    const walls = r.branch.specialPoints.filter(s => s.kind === 'wall')
    expect(walls).toHaveLength(2)
    expect(Math.abs(walls[0]!.lambda - 0.5)).toBeLessThan(1e-8)
    expect(Math.abs(walls[1]!.lambda - 1.5)).toBeLessThan(1e-8)
  })
})

describe('plane wing rotation: vertex no longer ordinary', () => {
  it('turning the cross wings of two towers onto the edge line: located at λ = −1.1 (derived)', () => {
    // twoTowers(1.1): wings ±n, n = (cos 1.1, sin 1.1), at both ends of a horizontal edge. Turning
    // l-up and r-down by λ and l-down and r-up by μ keeps balance with μ = λ; at λ = −1.1 all the
    // lines of each tower are horizontal: both towers become segments (degenerate).
    const r = runToEnd(twoTowers(1.1), { path: { kind: 'wing-rotation', rotate: ['l-up', 'r-down'], compensate: ['l-down', 'r-up'] }, to: -1.5, stop: { stopAtEvents: false } })
    const s = r.branch.specialPoints.find(p => p.kind === 'vertex no longer ordinary')
    expect(s).toBeDefined()
    expect(Math.abs(s!.lambda + 1.1)).toBeLessThan(1e-6)
  })
})

describe('rank of M drops (plane)', () => {
  it('the signed minor changes sign where one tower becomes a segment, and not before (derived)', () => {
    // only the cross wings of l turn by λ (a ± pair keeps l balanced): at λ = −1.1 tower l is a
    // segment, the x-row of l in M = [ℓ̄·J | R] vanishes (J of a horizontal edge and R's columns
    // u^⊥ of horizontal wings have no x-part there), so rank M = 2V − 1 at that λ only
    const doc = twoTowers(1.1)
    const m = compilePattern(doc)
    const turn = (l: number) => {
      const dir = m.wingDir.slice()
      for (const id of ['l-up', 'l-down']) {
        const j = m.wingIds.indexOf(id)
        const x = m.wingDir[2 * j]!, y = m.wingDir[2 * j + 1]!
        dir[2 * j] = Math.cos(l) * x - Math.sin(l) * y; dir[2 * j + 1] = Math.sin(l) * x + Math.cos(l) * y
      }
      return { ...m, wingDir: dir }
    }
    const at = (_u: Float64Array, l: number) => ({ p: m.positions, lattice: m.lattice, model: turn(l) })
    const ev = conditionEvents(m, at, { terminal: true, walls: false, planeRankTolerance: 1e-7 }).find(e => e.kind === 'rank of M drops')!
    const u = new Float64Array(0)
    const f = [0, -0.5, -1.0, -1.2, -1.5].map(l => ev.fn(u, l))
    expect(f.slice(0, 3).every(x => x > 0)).toBe(true)
    expect(f.slice(3).every(x => x < 0)).toBe(true)
    expect(Math.abs(ev.fn(u, -1.1))).toBeLessThan(1e-12)
  })
})
