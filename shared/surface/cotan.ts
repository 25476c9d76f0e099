/**
 * Cotangent weights of a periodic mesh (U. Pinkall, K. Polthier, "Computing discrete minimal
 * surfaces and their conjugates", Experimental Math. 2, 1993, eq. (2)): the Dirichlet energy of
 * a piecewise-linear map is ¼ Σ_edges (cot α + cot β)|x_j − x_k|², α, β the angles opposite the
 * edge. Corners are unrolled by their period shifts, so every quantity is periodic.
 */
import { cornerPoint, type PeriodicMesh } from './mesh'

/** Per corner c: the cotangent of the angle at c (weight of the opposite edge), and the triangle areas. */
export interface CotanData {
  cot: Float64Array
  area: Float64Array
  /** Unrolled corner points, 9 per triangle. */
  points: Float64Array
}

/** Cotangents are clamped to ±this, so a needle triangle cannot blow up a solve. */
export const COT_LIMIT = 1e4

export function cotanData(m: PeriodicMesh): CotanData {
  const F = m.triangles.length / 3
  const pts = new Float64Array(9 * F)
  for (let c = 0; c < 3 * F; c++) cornerPoint(m, c, pts, 3 * c)
  const cot = new Float64Array(3 * F), area = new Float64Array(F)
  for (let t = 0; t < F; t++) {
    const o = 9 * t
    for (let i = 0; i < 3; i++) {
      const a = o + 3 * i, b = o + 3 * ((i + 1) % 3), c = o + 3 * ((i + 2) % 3)
      const ux = pts[b]! - pts[a]!, uy = pts[b + 1]! - pts[a + 1]!, uz = pts[b + 2]! - pts[a + 2]!
      const vx = pts[c]! - pts[a]!, vy = pts[c + 1]! - pts[a + 1]!, vz = pts[c + 2]! - pts[a + 2]!
      const cx = uy * vz - uz * vy, cy = uz * vx - ux * vz, cz = ux * vy - uy * vx
      const cr = Math.hypot(cx, cy, cz)
      if (i === 0) area[t] = cr / 2
      const dot = ux * vx + uy * vy + uz * vz
      cot[3 * t + i] = cr > 0 ? Math.max(-COT_LIMIT, Math.min(COT_LIMIT, dot / cr)) : 0
    }
  }
  return { cot, area, points: pts }
}

/** Total area of the quotient mesh. */
export function meshArea(m: PeriodicMesh): number {
  return cotanData(m).area.reduce((s, a) => s + a, 0)
}
