/**
 * Re-evaluation of map cells with the same core: max|F(u, x, y)| at each solved cell's own grid
 * point (not the engine's located λ), so a stored map can be checked without trusting its
 * producer. F is dimensionless for drawings (a sum of unit vectors), in units of the weights for phases.
 */
import { formatNumber } from '../format'
import { compilePattern } from '../pattern/model'
import { parseMapSettings, type MapCell } from '../types/maps'
import type { PatternDocument } from '../types/pattern'
import { planeTwoParameterProblem } from './trace'

/** Outcome of {@link verifyMapCells}. */
export interface MapVerification {
  verified: boolean
  checked: number
  maxResidual: number
  offending: { i: number; j: number; residualNorm: number; reason: string }[]
}

/** Checks solved cells (others are skipped); tolerance default 1e-7 (the grid value is met to the engine's locate tolerance). */
export function verifyMapCells(doc: PatternDocument, settingsInput: unknown, cells: Pick<MapCell, 'i' | 'j' | 'x' | 'y' | 'status' | 'u'>[], tol = 1e-7): MapVerification {
  const s = parseMapSettings(settingsInput)
  const p = planeTwoParameterProblem(compilePattern(doc), s)
  const out = new Float64Array(p.n)
  const res: MapVerification = { verified: true, checked: 0, maxResidual: 0, offending: [] }
  for (const c of cells) {
    if (c.status !== 'solved') continue
    res.checked++
    if (!c.u || c.u.length !== p.n) {
      res.offending.push({ i: c.i, j: c.j, residualNorm: Infinity, reason: `state has ${c.u?.length ?? 0} entries, expected ${p.n}` })
      continue
    }
    p.residual(Float64Array.from(c.u), c.x, c.y, out)
    let r = 0
    for (let k = 0; k < p.n; k++) r = Math.max(r, Math.abs(out[k]!))
    if (!Number.isFinite(r)) r = Infinity
    res.maxResidual = Math.max(res.maxResidual, r)
    if (!(r <= tol)) res.offending.push({ i: c.i, j: c.j, residualNorm: r, reason: `max|F| = ${formatNumber(r)} > ${tol}` })
  }
  res.verified = res.offending.length === 0
  return res
}

/** A deterministic sample of up to `count` solved cells (seeded linear congruential choice, seed 1). */
export function sampleCells<T extends Pick<MapCell, 'status'>>(cells: T[], count: number, seed = 1): T[] {
  const solved = cells.filter(c => c.status === 'solved')
  if (solved.length <= count) return solved
  let x = seed >>> 0
  const picked = new Set<number>()
  while (picked.size < count) {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0
    picked.add(x % solved.length)
  }
  return [...picked].sort((a, b) => a - b).map(k => solved[k]!)
}
