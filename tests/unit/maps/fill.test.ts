/**
 * Maps reach every cell connected to the seed through balanced cells (rows and columns, rows
 * re-seeded from solved neighbours) and tell cells past a collapse from cells unreachable from the
 * seed. Reference: Fermat–Torricelli in the τ plane — the Fermat pair is balanced exactly where
 * every angle of the triangle (0, 1, τ) is below 120° (classical; first isogonic centre X(13),
 * C. Kimberling, Encyclopedia of Triangle Centers).
 */
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { mapToText, runMapSweep, verifyMapCells } from '../../../shared/maps'
import { NOT_REACHED, pastDegeneration, type MapResult } from '../../../shared/types/maps'

const doc = findPatternExample('fermat-pair')!.document // τ = 0.5 + i, the seed

/** Every angle of the triangle (0, 1, τ) below 120° (angles: derived, see fermat.test.ts). */
const inside = (a: number, b: number) => {
  const at0 = Math.atan2(b, a), at1 = Math.atan2(b, 1 - a)
  return [at0, at1, Math.PI - at0 - at1].every(t => t < 2 * Math.PI / 3)
}

/**
 * Distance from τ = (a, b) to the union of the three 120° curves, which contains the region's
 * boundary (derived): the ray from 0 at 120°, the ray from 1 at 60°, and the arc over [0, 1] on
 * which the angle at τ is 120° (centre (1/2, −1/(2√3)), radius 1/√3, inscribed angle theorem).
 */
function boundaryDistance(a: number, b: number): number {
  const ray = (ox: number, dx: number, dy: number) => {
    const t = Math.max(0, (a - ox) * dx + b * dy)
    return Math.hypot(a - ox - t * dx, b - t * dy)
  }
  const s3 = Math.sqrt(3)
  const cx = 0.5, cy = -1 / (2 * s3), R = 1 / s3
  const ang = Math.atan2(b - cy, a - cx), a0 = Math.atan2(-cy, 1 - cx), a1 = Math.atan2(-cy, -cx) // arc from (1, 0) to (0, 0) through the top
  const arc = ang >= a0 && ang <= a1 ? Math.abs(Math.hypot(a - cx, b - cy) - R) : Math.min(Math.hypot(a, b), Math.hypot(a - 1, b))
  return Math.min(ray(0, -0.5, s3 / 2), ray(1, 0.5, s3 / 2), arc)
}

describe('a τ map of the Fermat pair reaching small Im τ (default settings)', () => {
  const settings = { plane: 'tau', x: { min: -0.5, max: 1.5, count: 21 }, y: { min: 0.06, max: 1.46, count: 15 } }
  const map = runMapSweep(doc, settings)
  const cells = map.rows.flatMap(r => r.cells)
  const step = 0.1

  it('agrees with the analytic region in every cell farther than one grid step from its boundary', () => {
    let compared = 0, lowRows = 0
    for (const c of cells) {
      // the spine column Re τ = 0.5 is collapsed below Im τ = 1/(2√3): these rows need the fill
      if (c.status === 'solved' && c.y < 1 / (2 * Math.sqrt(3))) lowRows++
      if (boundaryDistance(c.x, c.y) <= step) continue
      compared++
      expect({ x: c.x, y: c.y, solved: c.status === 'solved' }).toEqual({ x: c.x, y: c.y, solved: inside(c.x, c.y) })
      if (c.status !== 'solved') expect(c.endedBy).toBe('collapse')
    }
    console.log(`fill: ${compared} of ${cells.length} cells compared, ${lowRows} solved in rows whose spine cell is collapsed`)
    expect(compared).toBeGreaterThan(200)
    expect(lowRows).toBeGreaterThan(10)
  })

  it('every solved cell, also those reached along columns, re-verifies at its grid point', () => {
    const v = verifyMapCells(doc, settings, cells)
    expect(v.verified).toBe(true)
  })

  it('draws collapsed cells as x in the text picture', () => {
    const low = mapToText(map).split('\n')[map.ys.length - 1]! // bottom row, Im τ = 0.06
    expect(low).toMatch(/x/)
    expect(low).toMatch(/2/)
  })
})

describe('unreachable from the seed vs past a collapse', () => {
  it('a seed that does not solve leaves every cell unreachable from the seed, drawn as .', () => {
    // τ = 0.5 + 0.05i: the angle at τ is 2·atan(10) ≈ 168.6° > 120°, the seed has collapsed
    const map = runMapSweep(doc, { plane: 'tau', x: { min: 0.4, max: 0.6, count: 3 }, y: { min: 0.05, max: 0.07, count: 2 }, seed: [0.5, 0.05] })
    const cells = map.rows.flatMap(r => r.cells)
    expect(cells.every(c => c.status !== 'solved' && c.endedBy === NOT_REACHED && !pastDegeneration(c))).toBe(true)
    expect(mapToText(map)).not.toMatch(/x/)
  })

  it('the text picture shows the two differently', () => {
    const cell = (j: number, status: 'solved' | 'unreachable', endedBy?: string) => ({ i: 0, j, x: j, y: 1, status, ...(status === 'solved' ? { negativeEigenvalues: 2 } : {}), ...(endedBy ? { endedBy } : {}) })
    const map = { xs: [0, 1, 2], ys: [1], spineColumn: 0, rows: [{ i: 0, y: 1, crossings: [], cells: [cell(0, 'solved'), cell(1, 'unreachable', 'collapse'), cell(2, 'unreachable', NOT_REACHED)] }] } as unknown as MapResult
    expect(mapToText(map).split('\n')[0]!.trim()).toBe('1.0000 2x.')
  })
})
