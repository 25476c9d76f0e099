/**
 * Area-weighted vertex normals of a periodic mesh (sum of the adjacent triangles' cross products,
 * common practice), from unrolled corner points.
 */
import type { PeriodicMesh } from './mesh'

/** Unit normal per vertex (x, y, z interleaved); zero where the cross products cancel. */
export function vertexNormals(m: PeriodicMesh, points: Float64Array): Float64Array {
  const V = m.positions.length / 3, F = m.triangles.length / 3
  const n = new Float64Array(3 * V)
  for (let t = 0; t < F; t++) {
    const o = 9 * t
    const ux = points[o + 3]! - points[o]!, uy = points[o + 4]! - points[o + 1]!, uz = points[o + 5]! - points[o + 2]!
    const vx = points[o + 6]! - points[o]!, vy = points[o + 7]! - points[o + 1]!, vz = points[o + 8]! - points[o + 2]!
    const cx = uy * vz - uz * vy, cy = uz * vx - ux * vz, cz = ux * vy - uy * vx
    for (let i = 0; i < 3; i++) {
      const v = m.triangles[3 * t + i]!
      n[3 * v] = n[3 * v]! + cx; n[3 * v + 1] = n[3 * v + 1]! + cy; n[3 * v + 2] = n[3 * v + 2]! + cz
    }
  }
  for (let v = 0; v < V; v++) {
    const l = Math.hypot(n[3 * v]!, n[3 * v + 1]!, n[3 * v + 2]!)
    if (l > 0) for (let d = 0; d < 3; d++) n[3 * v + d] = n[3 * v + d]! / l
  }
  return n
}
