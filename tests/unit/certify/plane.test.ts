/**
 * Plane certificates on the published plane system, the wing directions among the unknowns
 * (H. Chen, "Gluing Karcher–Scherk saddle towers II", Comm. Anal. Geom. 32, 2024, Def. 1:
 * rigid ⇔ M = [ℓ̄·J | R] has rank 2V; then the balanced drawings near it form a family of
 * dimension dim D = |R| − 2 modulo translation). The square reduction of shared/certify/plane.ts
 * holds (2V − 2 + |R|) − (2V + 1) coordinates and angles plus the scale c, so its parameter count
 * must equal the published dim D: equiangular triangle 4 [C-II Ex. 7], two towers 4 and one tower
 * 2 [C-II Ex. 1], four lines bounding a square 6 (C-II Prop. 1 predicts rigid; rank M = 8, derived).
 * Patterns that are not rigid in the published sense must never certify: all wing lines parallel
 * (derived: every parallel redrawing along the common direction pushes no root sideways).
 */
import { describe, expect, it } from 'vitest'
import { certifyZero } from '../../../shared/certify/krawczyk'
import { certifyHorizontal } from '../../../shared/certify/pattern'
import { choosePlaneReduction, planeSystem } from '../../../shared/certify/plane'
import { balanceJacobian } from '../../../shared/pattern/balance'
import { compilePattern } from '../../../shared/pattern/model'
import { tripletsToDense } from '../../../shared/linalg/dense'
import { parsePatternDocument } from '../../../shared/types/pattern'
import { EQUILATERAL, oneTower, planeTriangle, squareOfLines, twoTowers } from '../pattern/published-patterns'

function reduction(doc: Parameters<typeof compilePattern>[0]) {
  const m = compilePattern(doc)
  const J = tripletsToDense(balanceJacobian(m, m.positions, m.lattice))
  return { m, red: choosePlaneReduction(m, m.positions, (i, j) => J.get(i, j)) }
}

describe('rigid plane patterns certify, and the reduction has the published family dimension', () => {
  const cases: [string, Parameters<typeof compilePattern>[0], number][] = [
    ['equiangular triangle [C-II Ex. 7]', planeTriangle(EQUILATERAL, [0, 0, 0]), 4],
    ['two towers, one edge [C-II Ex. 1]', twoTowers(), 4],
    ['one four-wing tower [C-II Ex. 1]', oneTower(), 2],
    ['four lines bounding a square (C-II Prop. 1; derived)', squareOfLines(), 6],
  ]
  for (const [name, doc, dimD] of cases) {
    it(`${name}: certified, dim D = ${dimD}`, () => {
      const { m, red } = reduction(doc)
      expect(red).not.toBeNull()
      const unknownsAfterPin = 2 * m.nVertices - 2 + m.nWings
      const scale = m.nVertices > 1 ? 1 : 0
      expect(unknownsAfterPin - red!.x.length + scale).toBe(dimD)
      const c = certifyHorizontal(m, m.positions, m.lattice)
      expect(c.certified).toBe(true)
      if (c.certified) expect(c.rMax).toBeGreaterThan(c.rMin)
    })
  }

  it('two certificates from different starting points of the same reduced system prove the same zero (uniqueness)', () => {
    const { m, red } = reduction(planeTriangle(EQUILATERAL, [0, 0, 0]))
    const sys = planeSystem(m, red!)
    const at = certifyZero(sys, red!.x)
    const moved = red!.x.map((v, i) => v + (i % 2 ? 3e-6 : -2e-6))
    const near = certifyZero(sys, moved)
    expect(at.certified && near.certified).toBe(true)
    if (!at.certified || !near.certified) return
    // the zero lies within rMin of each point, so the points are at most rMin + rMin' apart …
    const gap = Math.max(...moved.map((v, i) => Math.abs(v - red!.x[i]!)))
    expect(gap).toBeLessThanOrEqual(at.rMin + near.rMin)
    // … and the moved start is no closer than the perturbation allows (its residual is not zero)
    expect(near.rMin).toBeGreaterThan(1e-7)
    expect(near.rMin).toBeLessThan(near.rMax)
  })
})

describe('size limit', () => {
  it('above the limit a plane drawing is "not certified: too large", never a proof', () => {
    const m = compilePattern(squareOfLines())
    const c = certifyHorizontal(m, m.positions, m.lattice, { maxSize: 8 })
    expect(c.certified).toBe(false)
    if (!c.certified) expect(c.reason).toBe('too-large')
  })
})

describe('plane patterns that are not rigid never certify', () => {
  it('one tower with wings ±(1, 0) twice (rank M = 1)', () => {
    const doc = { ...oneTower(), wings: [[1, 0], [1, 0], [-1, 0], [-1, 0]].map((direction, i) => ({ id: `w${i}`, vertex: 'o', direction: direction as [number, number] })) }
    const m = compilePattern(doc)
    const c = certifyHorizontal(m, m.positions, m.lattice)
    expect(c.certified).toBe(false)
    if (!c.certified) expect(c.reason).toBe('not-rigid')
  })
  it('two towers with every wing along the edge line (all wing lines parallel), also after moving a tower', () => {
    for (const y of [0, 1e-9, 1e-4]) {
      const doc = parsePatternDocument({
        format: 'wingfold-pattern', version: 1, name: 'parallel wings', space: 'plane',
        vertices: [{ id: 'l', position: [0, 0] }, { id: 'r', position: [1.5, y] }],
        edges: [{ id: 'bridge', from: 'l', to: 'r' }],
        wings: [
          { id: 'l1', vertex: 'l', direction: [-1, 0] }, { id: 'l2', vertex: 'l', direction: [1, 0] }, { id: 'l3', vertex: 'l', direction: [-1, 0] },
          { id: 'r1', vertex: 'r', direction: [1, 0] }, { id: 'r2', vertex: 'r', direction: [-1, 0] }, { id: 'r3', vertex: 'r', direction: [1, 0] },
        ],
      })
      const m = compilePattern(doc)
      const c = certifyHorizontal(m, m.positions, m.lattice)
      expect(c.certified, `y = ${y}`).toBe(false)
    }
  })
})
