/**
 * One way to print a number everywhere (runs, maps, inspector, exports, CLI): 0 as "0" (never
 * "0.0e+0"), magnitudes in [1e-3, 1e4) in fixed digits, others as "1.23e-7". Pure.
 */
export function formatNumber(v: number | null | undefined, digits = 3): string {
  if (v === null || v === undefined || Number.isNaN(v)) return '—'
  if (!Number.isFinite(v)) return v > 0 ? '∞' : '−∞'
  if (v === 0) return '0'
  const a = Math.abs(v)
  if (a >= 1e-3 && a < 1e4) return String(Number(v.toPrecision(digits)))
  return v.toExponential(Math.max(0, digits - 1)).replace(/e\+?/, 'e')
}
