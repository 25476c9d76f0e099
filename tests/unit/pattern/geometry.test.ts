/**
 * Geometry and shifts: cyclic-order margins (an order flip changes the margin's sign), the plane
 * balance with the scale fixed, open wings that cannot balance, and the sublattice index
 * against the gcd of the 2×2 minors (index of a full-rank subgroup of Z² = gcd of its maximal
 * minors; H. Cohen, A Course in Computational Algebraic Number Theory, 1993, §2.4).
 */
import { describe, expect, it } from 'vitest'
import { balanceResidual } from '../../../shared/pattern/balance'
import { solveBalance } from '../../../shared/pattern/balance-solve'
import { orderMargins } from '../../../shared/pattern/geometry'
import { compilePattern } from '../../../shared/pattern/model'
import { sublatticeIndex } from '../../../shared/pattern/shifts'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { parsePatternDocument } from '../../../shared/types/pattern'
import { findPatternExample } from '../../../shared/examples'
import { seeded } from './helpers'

function gcd(a: number, b: number): number { return b === 0 ? Math.abs(a) : gcd(b, a % b) }

describe('sublattice index', () => {
  it('equals the gcd of all 2×2 minors on seeded random integer vectors', () => {
    const rnd = seeded(5)
    for (let t = 0; t < 300; t++) {
      const n = 1 + Math.floor(rnd() * 5)
      const vs = Array.from({ length: n }, () => [Math.floor(rnd() * 13) - 6, Math.floor(rnd() * 13) - 6] as [number, number])
      let g = 0
      for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) g = gcd(g, vs[i]![0] * vs[j]![1] - vs[i]![1] * vs[j]![0])
      expect(sublatticeIndex(vs)).toBe(g === 0 ? null : g)
    }
  })
})

describe('cyclic order margins', () => {
  it('are positive on the examples and change sign when two neighbours in σ swap', () => {
    const doc = findPatternExample('plane-bridge')!.document
    const m = compilePattern(doc)
    expect(Math.min(...orderMargins(m, m.positions, m.lattice))).toBeGreaterThan(0)
    // move 'east' above 'west' and past the vertical: at 'west' the span passes 'west-up'
    const margins = [1.2, 0.2, -0.2, -1.2].map((x) => {
      const p = Float64Array.from(m.positions); p[2] = x; p[3] = 1.5
      return orderMargins(m, p, m.lattice)[0]!
    })
    expect(margins[0]).toBeGreaterThan(0)
    expect(margins[1]).toBeGreaterThan(0)
    expect(margins[2]).toBeLessThan(0)
    expect(margins[3]).toBeLessThan(0)
    // continuous through the flip: |margin| is the angle to the vertical
    expect(Math.abs(margins[1]! - Math.atan2(0.2, 1.5))).toBeLessThan(1e-12)
    expect(Math.abs(margins[2]! + Math.atan2(0.2, 1.5))).toBeLessThan(1e-12)
  })

  it('the report names the vertices whose drawn order disagrees', () => {
    const doc = structuredClone(findPatternExample('plane-bridge')!.document)
    doc.vertices[1]!.position = [-0.3, 1.5]
    const r = analyzePattern(doc)
    expect(r.verdicts.cyclicOrder.ok).toBe(false)
    expect(r.verdicts.cyclicOrder.witness!.vertices).toContain('west')
  })
})

describe('plane balance', () => {
  it('balances a tilted drawing with the scale kept, and the drawing stays rigid', () => {
    const doc = structuredClone(findPatternExample('plane-bridge')!.document)
    doc.vertices[1]!.position = [1.4, 0.35]
    const m = compilePattern(doc)
    const r = solveBalance(m, m.positions, m.lattice)
    expect(r.converged).toBe(true)
    expect(Math.hypot(...balanceResidual(m, r.positions, m.lattice))).toBeLessThan(1e-12)
    // pinned west, east on the horizontal through it; the projection on the start direction is kept
    expect(Array.from(r.positions.subarray(0, 2))).toEqual([0, 0])
    expect(Math.abs(r.positions[3]!)).toBeLessThan(1e-12)
    const d0 = Math.hypot(1.4, 0.35)
    expect(Math.abs((r.positions[2]! * 1.4) / d0 - d0)).toBeLessThan(1e-12)
  })

  it('reports open wings that do not sum to zero instead of iterating', () => {
    const doc = parsePatternDocument({
      format: 'wingfold-pattern', version: 1, name: 'lopsided', space: 'plane',
      vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: [1, 0] }],
      edges: [{ id: 'e', from: 'a', to: 'b' }],
      wings: [{ id: 'w1', vertex: 'a', direction: [0, 1] }, { id: 'w2', vertex: 'b', direction: [0, 1] }],
    })
    const m = compilePattern(doc)
    const r = solveBalance(m, m.positions, m.lattice)
    expect(r.converged).toBe(false)
    expect(r.iterations).toBe(0)
    expect(r.reason).toMatch(/sum to/)
    const rep = analyzePattern(doc)
    expect(rep.verdicts.openWings.ok).toBe(false)
    expect(rep.verdicts.openWings.sum).toEqual([0, 2])
  })
})

describe('balancePattern keeps the rotation read from the rough drawing', () => {
  it('writes the rotation out when the balanced drawing flips an order, so the report shows it', async () => {
    const { balancePattern } = await import('../../../shared/pattern/balance-solve')
    // square pair drawn with b far off-centre: σ at a is read from this rough drawing
    const doc = parsePatternDocument({
      format: 'wingfold-pattern', version: 1, name: 'rough', space: 'torus', lattice: { w1: [1, 0], w2: [0, 1] },
      vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: [0.5, 0.5] }],
      edges: [
        { id: 'e0', from: 'a', to: 'b' }, { id: 'e1', from: 'a', to: 'b', shift: [-1, 0] },
        { id: 'e2', from: 'a', to: 'b', shift: [0, -1] }, { id: 'e3', from: 'a', to: 'b', shift: [-1, -1] },
      ],
    })
    const same = balancePattern(doc)
    expect(same.document.rotation).toBeUndefined()
    const moved = structuredClone(doc)
    // b beyond the corner ω1 + ω2: seen from a, e2 (17°) comes before e3 (40°), while the
    // balanced drawing (b at the centre) has e3 (−135°) before e2 (−45°)
    moved.vertices[1]!.position = [1.6, 1.5]
    const r = balancePattern(moved)
    expect(r.converged).toBe(true)
    const m0 = compilePattern(moved)
    const flipped = Array.from(orderMargins(m0, compilePattern(r.document).positions, m0.lattice)).some(x => x < 0)
    expect(flipped).toBe(true)
    expect(r.document.rotation).toBeDefined()
    expect(analyzePattern(r.document).verdicts.cyclicOrder.ok).toBe(false)
  })
})

describe('balance solve on a non-rigid pattern', () => {
  it('balances a perturbed square grid (balanced drawings form a family) and keeps its two parallel redrawings', async () => {
    const { balancePattern } = await import('../../../shared/pattern/balance-solve')
    const doc = structuredClone(findPatternExample('square-grid')!.document)
    const rnd = seeded(3)
    for (const v of doc.vertices.slice(1)) v.position = [v.position[0] + 0.3 * (rnd() - 0.5), v.position[1] + 0.3 * (rnd() - 0.5)]
    const r = balancePattern(doc)
    expect(r.converged).toBe(true)
    const rep = analyzePattern(r.document)
    expect(rep.verdicts.balance.ok).toBe(true)
    expect(rep.verdicts.rigidity.inertia!.zero).toBe(2) // four lines − two translations
  })
})
