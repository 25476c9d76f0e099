/**
 * Periodic supercells of a torus pattern: m×m copies of the cell in the lattice (mω1, mω2),
 * edges re-attached across copies with the shifts rewritten (domain.md §3). V grows by m².
 */
import type { PatternDocument } from '../shared/types/pattern'

/**
 * The m×m supercell of a torus document; weights kept, phases replicated as ψ(v, i, j) =
 * ψ(v) + i·α1 + j·α2 with period phases (m·α1, m·α2), which is balanced when the cell is.
 */
export function supercell(doc: PatternDocument, m: number): PatternDocument {
  if (doc.space !== 'torus' || !doc.lattice) throw new Error('supercell: needs a torus pattern')
  const { w1, w2 } = doc.lattice
  const id = (v: string, i: number, j: number) => `${v}@${i},${j}`
  const [a1, a2] = doc.phases?.alpha ?? [0, 0]
  const psi = doc.phases?.vertexPhases ?? {}
  const vertexPhases: Record<string, number> = {}
  const vertices: PatternDocument['vertices'] = []
  const edges: PatternDocument['edges'] = []
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      for (const v of doc.vertices) {
        vertexPhases[id(v.id, i, j)] = (psi[v.id] ?? 0) + i * a1 + j * a2
        vertices.push({ id: id(v.id, i, j), position: [v.position[0] + i * w1[0] + j * w2[0], v.position[1] + i * w1[1] + j * w2[1]] })
      }
      for (const e of doc.edges) {
        const [k1, k2] = e.shift ?? [0, 0]
        const i2 = i + k1, j2 = j + k2
        const wrap = (x: number) => ((x % m) + m) % m
        edges.push({
          id: id(e.id, i, j), from: id(e.from, i, j), to: id(e.to, wrap(i2), wrap(j2)),
          shift: [Math.floor(i2 / m), Math.floor(j2 / m)],
          ...(e.weight !== undefined ? { weight: e.weight } : {}),
        })
      }
    }
  }
  return {
    format: doc.format, version: doc.version, name: `${doc.name} (${m}×${m} supercell)`, space: 'torus',
    lattice: { w1: [m * w1[0], m * w1[1]], w2: [m * w2[0], m * w2[1]] },
    vertices, edges, phases: { alpha: [m * a1, m * a2], vertexPhases },
  }
}
