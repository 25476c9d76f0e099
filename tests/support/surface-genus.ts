/**
 * Genus of a triangle soup's quotient by a lattice, from the triangles alone (used on exported
 * STL files): corners are welded modulo the periods (fractional coordinates rounded to 1e-4),
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
  const corner = (t: number, i: number): [string, number[]] => {
    const x = [tri[9 * t + 3 * i]!, tri[9 * t + 3 * i + 1]!, tri[9 * t + 3 * i + 2]!]
    const f = B.mmul(Matrix.columnVector(x)).to1DArray()
    const k = f.map(c => Math.floor(c + 1e-6))
    const key = f.map((c, d) => Math.round((c - k[d]!) * 1e4) % 1e4).join(',')
    if (!vertices.has(key)) vertices.set(key, vertices.size)
    return [key, k]
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

