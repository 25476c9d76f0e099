/**
 * Fermat–Torricelli in the τ plane: the two-vertex, three-edge torus pattern (shifts 0, −e1, −e2)
 * puts the free vertex at the first isogonic centre of the triangle (0, ω1, ω2), which exists
 * inside exactly when every angle is below 120°; otherwise an edge has collapsed to the obtuse
 * corner (classical; C. Kimberling, Encyclopedia of Triangle Centers, X(13)).
 * With ω1 = 1 the angles of the triangle (0, 1, τ) are: at 0 arg τ, at 1 arg(1 − τ̄) = atan2(Im τ, 1 − Re τ),
 * at τ the rest of π (derived here).
 */
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { runMapSweep, traceMapCurve, verifyMapCells } from '../../../shared/maps'

const doc = findPatternExample('fermat-pair')!.document
const angles = (a: number, b: number) => {
  const at0 = Math.atan2(b, a), at1 = Math.atan2(b, 1 - a)
  return { 'to-origin': at0, 'to-w1': at1, 'to-w2': Math.PI - at0 - at1 }
}
const inside = (a: number, b: number) => Object.values(angles(a, b)).every(t => t < 2 * Math.PI / 3)
const settings = { plane: 'tau', x: { min: -0.9, max: 1.9, count: 15 }, y: { min: 0.2, max: 1.6, count: 8 }, collapseTolerance: 1e-7 }

describe('τ map of the Fermat pair', () => {
  const map = runMapSweep(doc, settings)
  const cells = map.rows.flatMap(r => r.cells)

  it('solves exactly the cells where all angles are below 120° (the region is connected to the seed; the rest lie past a collapse)', () => {
    expect(cells).toHaveLength(15 * 8)
    // the spine column Re τ = 0.5 enters the 120° circle at Im τ = 1/(2√3): rows below are reached along columns
    let solved = 0
    for (const c of cells) {
      const expected = inside(c.x, c.y) ? 'solved' : 'unreachable'
      expect({ x: c.x, y: c.y, status: c.status }).toEqual({ x: c.x, y: c.y, status: expected })
      if (c.status === 'solved') {
        solved++
        // balanced drawings are minima of the length (J = −Hess L ⇒ 2 negative eigenvalues for the free vertex)
        expect(c.negativeEigenvalues).toBe(2)
        expect(c.sigmaMin).toBeGreaterThan(0)
      } else expect(c.endedBy).toMatch(/collapse/)
    }
    expect(solved).toBeGreaterThan(40)
  })

  it('every solved cell re-verifies with the same core at its grid point', () => {
    const v = verifyMapCells(doc, settings, cells)
    expect(v.verified).toBe(true)
    expect(v.maxResidual).toBeLessThan(1e-8)
  })

  it('reports total length per √area from the closed form L² = (a² + b² + c²)/2 + 2√3·Area', () => {
    // closed form: classical Fermat–Torricelli minimal length (from memory)
    for (const c of cells.filter(c => c.status === 'solved')) {
      const [a, b] = [c.x, c.y]
      const sides = [1, Math.hypot(a, b), Math.hypot(a - 1, b)]
      const L = Math.sqrt(sides.reduce((s, l) => s + l * l, 0) / 2 + 2 * Math.sqrt(3) * (b / 2))
      // in units with ω1 = 1 the cell area is Im τ
      expect(c.lengthPerRootArea!).toBeCloseTo(L / Math.sqrt(b), 8)
    }
  })

  it('traces the three collapse curves onto the analytic 120° curves to 1e-8', () => {
    const crossings = [...map.spineCrossings, ...map.rows.flatMap(r => r.crossings)].filter(c => c.kind === 'collapse')
    const seen = new Set<string>()
    for (const c of crossings) {
      const curve = traceMapCurve(doc, settings, c, { aMin: -2, aMax: 3, bMin: 0.05, bMax: 3 })
      const edge = curve.kind.replace('collapse of edge ', '') as keyof ReturnType<typeof angles>
      seen.add(edge)
      expect(curve.converged).toBe(true)
      expect(curve.points.length).toBeGreaterThan(20)
      for (const [a, b] of curve.points) expect(Math.abs(angles(a, b)[edge] - 2 * Math.PI / 3)).toBeLessThan(1e-8)
    }
    expect([...seen].sort()).toEqual(['to-origin', 'to-w1', 'to-w2'])
  })
})
