/**
 * The colour scale of a map: its ends, labels with as many digits as it takes to tell the ends
 * apart, or the statement that the quantity is constant on the map (a flat scale such as
 * "1.0000–1.0000" says nothing).
 */
import { formatNumber } from '#shared/format'

/** Ends of the scale and how to label it. */
export interface ColourScale {
  lo: number
  hi: number
  /** True when every solved cell has the same value (to a relative 1e-9). */
  constant: boolean
  /** Labels of the high and the low end (equal when constant). */
  labels: [high: string, low: string]
}

/** Relative spread below which a quantity counts as constant on the map (common practice: far above round-off, far below any plotted contrast). */
export const CONSTANT_SPREAD = 1e-9

/** Colour scale of the finite `values` (no values: the scale 0–1, not constant). */
export function colourScale(values: readonly number[]): ColourScale {
  const finite = values.filter(Number.isFinite)
  if (!finite.length) return { lo: 0, hi: 1, constant: false, labels: ['1', '0'] }
  let lo = Infinity, hi = -Infinity
  for (const v of finite) { if (v < lo) lo = v; if (v > hi) hi = v }
  const size = Math.max(Math.abs(lo), Math.abs(hi))
  const constant = hi - lo <= CONSTANT_SPREAD * size
  if (constant) { const l = formatNumber(lo, 5); return { lo, hi, constant, labels: [l, l] } }
  let digits = 5
  while (digits < 15 && formatNumber(hi, digits) === formatNumber(lo, digits)) digits++
  return { lo, hi, constant, labels: [formatNumber(hi, digits), formatNumber(lo, digits)] }
}
