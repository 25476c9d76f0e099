import { describe, expect, it, vi } from 'vitest'

// app/utils import the core through Nuxt's #shared alias; point it at the same file here
vi.mock('#shared/format', () => import('../../shared/format'))
const { colourScale } = await import('../../app/utils/map/scale')

describe('map colour scale', () => {
  it('says a quantity is constant instead of drawing a flat scale', () => {
    // every cell 1 up to round-off (1 + 2⁻⁵² is the next double after 1: derived)
    const s = colourScale([1, 1 + 2 ** -52, 1, Number.NaN])
    expect(s.constant).toBe(true)
    expect(s.labels).toEqual(['1', '1'])
  })

  it('labels the ends with enough digits to tell them apart', () => {
    // 1.0000 and 1.00003 agree to 5 significant digits and differ in the 6th (derived)
    const s = colourScale([1, 1.00003, 1.00001])
    expect(s.constant).toBe(false)
    expect([s.lo, s.hi]).toEqual([1, 1.00003])
    expect(s.labels[0]).not.toBe(s.labels[1])
    expect(s.labels).toEqual(['1.00003', '1'])
  })

  it('keeps five digits when they already differ, and zero spread at zero is constant', () => {
    expect(colourScale([0.25, 3.5]).labels).toEqual(['3.5', '0.25'])
    expect(colourScale([0, 0]).constant).toBe(true)
    expect(colourScale([]).constant).toBe(false)
  })
})
