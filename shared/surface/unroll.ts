/**
 * Copies of the fundamental cell as plain arrays (for display and export): the quotient mesh
 * repeated n1 × n2 × n3 times along its periods, a vertex shared by the triangles that meet at the
 * same point of space (same quotient vertex, same total shift), so each copy is one connected
 * piece and neighbouring copies share their seams.
 */
import type { PeriodicMesh } from './mesh'

/** Unrolled triangles: positions (3 per vertex), indices (3 per triangle), source vertex per vertex. */
export interface UnrolledMesh {
  positions: Float64Array
  indices: Uint32Array
  source: Int32Array
}

/** Copies per period, [n1, n2, n3]; periods that are not symmetries are counted once. */
export type Copies = [number, number, number]

export function unrollMesh(m: PeriodicMesh, copies: Copies = [1, 1, 1]): UnrolledMesh {
  const n = copies.map((c, d) => (m.periodic[d] ? Math.max(1, Math.floor(c)) : 1)) as Copies
  const key = new Map<string, number>()
  const pos: number[] = [], src: number[] = [], idx: number[] = []
  const F = m.triangles.length / 3
  const [P1, P2, P3] = m.periods
  for (let i = 0; i < n[0]; i++) for (let j = 0; j < n[1]; j++) for (let l = 0; l < n[2]; l++) {
    for (let c = 0; c < 3 * F; c++) {
      const v = m.triangles[c]!
      const k1 = m.shifts[3 * c]! + i, k2 = m.shifts[3 * c + 1]! + j, k3 = m.shifts[3 * c + 2]! + l
      const k = `${v},${k1},${k2},${k3}`
      let at = key.get(k)
      if (at === undefined) {
        at = src.length
        key.set(k, at)
        src.push(v)
        for (let d = 0; d < 3; d++) pos.push(m.positions[3 * v + d]! + k1 * P1[d]! + k2 * P2[d]! + k3 * P3[d]!)
      }
      idx.push(at)
    }
  }
  return { positions: new Float64Array(pos), indices: new Uint32Array(idx), source: new Int32Array(src) }
}
