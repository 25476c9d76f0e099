import { describe, expect, it } from 'vitest'
import { nearestDatum, plottedData } from '../../app/utils/family/nearest'

describe('nearest diagram point', () => {
  // x spans 0…1e-6 and y 0…1000 on a plot of about 1000 × 500 px: 1 px = 1e-9 in x, 2 in y (derived)
  const series = [
    { type: 'line', data: [[0, 0, 0, 0], [5e-7, 500, 0, 1], [1e-6, 1000, 0, 2]] },
    { type: 'scatter', data: [[5.1e-7, 520, 0, 0]] },
  ]
  const data = plottedData(series)

  it('measures distance in pixels, not in data units', () => {
    // pointer at (9.5e-7, 40): point 2 is 50 px across and 480 px up (≈ 483 px), point 0 is 20 px down
    // but 950 px across, point 1 ≈ 505 px; in raw data units point 0 would be nearest (derived)
    expect(nearestDatum(data, 9.5e-7, 40, 1e-9, -2)).toMatchObject({ index: 2, special: false })
  })

  it('never returns nothing while there are points, however far the pointer is', () => {
    expect(nearestDatum(data, -1, -1e6, 1e-9, -2)!.index).toBe(0)
    expect(nearestDatum([], 0, 0, 1, 1)).toBeNull()
  })

  it('prefers a special marker that is nearly as close as a regular point', () => {
    // pointer at point 1; the special point is 10 px in x and 10 px in y away (≈14 px): regular wins,
    // within the 4 px allowance the special point wins (derived)
    const p = nearestDatum(data, 5e-7, 500, 1e-9, -2)!
    expect(p).toMatchObject({ index: 1, special: false })
    const q = nearestDatum(data, 5.06e-7, 512, 1e-9, -2)!
    expect(q).toMatchObject({ index: 0, special: true })
  })
})
