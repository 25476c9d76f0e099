/**
 * Genus of a triangle soup's quotient by a lattice, from the triangles alone (used on exported
 * STL files): corners are welded modulo the periods (fractional coordinates within 2e-5 of a period, searched on a hash grid),
 * edges keyed by their two welded ends and the lattice step between them, triangles that are
 * copies of one another (exports of several cells) counted once, then Euler's formula
 * χ = V − E + F = 2 − 2g for a closed orientable surface (B. Mohar, C. Thomassen, "Graphs on
 * Surfaces", 2001).
 */
import { Matrix, inverse } from 'ml-matrix'

/** Genus of the quotient of a triangle soup by the lattice of `periods`, from the soup alone. */
export function soupGenus(tri: Float32Array, periods: number[][]): number {
  const B = inverse(new Matrix(periods).transpose())
  const vertices = new Map<string, number>(), edges = new Set<string>(), faces = new Set<string>()
  const F = tri.length / 9
  // Weld on a hash grid of fractional coordinates (cells of 1/G of a period, neighbours searched,
  // wrapped): a float32 point and its copies may fall on either side of a rounding boundary.
  const G = 2000, tol = 2e-5
  const grid = new Map<string, { f: number[], id: string }[]>()
  const wrap = (c: number) => ((c % G) + G) % G
  const corner = (t: number, i: number): [string, number[]] => {
    const x = [tri[9 * t + 3 * i]!, tri[9 * t + 3 * i + 1]!, tri[9 * t + 3 * i + 2]!]
    const f = B.mmul(Matrix.columnVector(x)).to1DArray()
    // c − floor(c) rounds to exactly 1 for c = −1e-17: such a point belongs to cell 0.
    const frac = f.map(c => { const r = c - Math.floor(c); return r >= 1 ? 0 : r })
    const cell = frac.map(c => Math.floor(c * G))
    for (const dx of [-1, 0, 1]) for (const dy of [-1, 0, 1]) for (const dz of [-1, 0, 1]) {
      for (const p of grid.get([wrap(cell[0]! + dx), wrap(cell[1]! + dy), wrap(cell[2]! + dz)].join(',')) ?? []) {
        const d = p.f.map((c, j) => { const e = Math.abs(c - frac[j]!); return Math.min(e, 1 - e) })
        if (Math.max(...d) < tol) return [p.id, f.map((c, j) => Math.round(c - p.f[j]!))]
      }
    }
    const id = String(vertices.size)
    vertices.set(id, vertices.size)
    const k = cell.join(',')
    grid.set(k, [...(grid.get(k) ?? []), { f: frac, id }])
    return [id, f.map((c, j) => Math.round(c - frac[j]!))]
  }
  for (let t = 0; t < F; t++) {
    const cs = [0, 1, 2].map(i => corner(t, i))
    const first = [...cs].sort((a, b) => (a[0] < b[0] ? -1 : 1))
    faces.add(first.map(([k, s]) => `${k}@${s.map((x, d) => x - first[0]![1][d]!)}`).join(' '))
    for (let i = 0; i < 3; i++) {
      const [a, ka] = cs[i]!, [b, kb] = cs[(i + 1) % 3]!
      const rel = kb.map((x, d) => x - ka[d]!)
      const neg = rel.map(x => -x)
      edges.add(a < b ? `${a}|${b}|${rel}` : a > b ? `${b}|${a}|${neg}` : `${a}|${a}|${[rel, neg].map(String).sort()[0]}`)
    }
  }
  const chi = vertices.size - edges.size + faces.size
  return (2 - chi) / 2
}

