/**
 * Periodic supercells: the same pattern drawn in the torus spanned by m1·ω1 and m2·ω2. Vertex
 * (v, i, j) sits at p(v) + i·ω1 + j·ω2; an edge v → w with shift k joins (v, i, j) to
 * (w, (i + k1) mod m1, (j + k2) mod m2) with the supercell shift (⌊(i + k1)/m1⌋, ⌊(j + k2)/m2⌋).
 * A balanced (rigid) cell gives a balanced supercell; the supercell's rigidity can only be lost
 * to the new periodic motions (common practice: Bloch/Floquet reasoning on periodic frameworks).
 * Used by tests and the benchmark to make large patterns from the examples.
 */
import type { PatternDocument } from '../types/pattern'

const floorDiv = (a: number, m: number) => Math.floor(a / m)
const mod = (a: number, m: number) => ((a % m) + m) % m

/** The m1 × m2 supercell of a torus pattern (a rotation given explicitly is carried over). */
export function supercell(doc: PatternDocument, m1: number, m2: number): PatternDocument {
  if (doc.space !== 'torus' || !doc.lattice) throw new Error('supercell: only torus patterns have supercells')
  if (!(Number.isInteger(m1) && Number.isInteger(m2) && m1 >= 1 && m2 >= 1)) {
    throw new Error('supercell: m1 and m2 must be positive integers')
  }
  const { w1, w2 } = doc.lattice
  const vid = (id: string, i: number, j: number) => `${id}.${i}.${j}`
  const eid = (id: string, i: number, j: number) => `${id}.${i}.${j}`
  const vertices: PatternDocument['vertices'] = []
  const edges: PatternDocument['edges'] = []
  const rotation: Record<string, string[]> | undefined = doc.rotation ? {} : undefined
  const phases = doc.phases?.vertexPhases
  const vertexPhases: Record<string, number> = {}
  for (let i = 0; i < m1; i++) {
    for (let j = 0; j < m2; j++) {
      for (const v of doc.vertices) {
        const id = vid(v.id, i, j)
        vertices.push({
          id,
          position: [v.position[0] + i * w1[0] + j * w2[0], v.position[1] + i * w1[1] + j * w2[1]],
        })
        if (phases?.[v.id] !== undefined) vertexPhases[id] = phases[v.id]!
        if (rotation) {
          rotation[id] = doc.rotation![v.id]!.map((h) => {
            const [e, end] = h.split(':')
            return `${eid(e!, ...sourceCell(e!, end!, i, j))}:${end}`
          })
        }
      }
      for (const e of doc.edges) {
        const k = e.shift ?? [0, 0]
        const ti = i + k[0], tj = j + k[1]
        edges.push({
          ...e,
          id: eid(e.id, i, j),
          from: vid(e.from, i, j),
          to: vid(e.to, mod(ti, m1), mod(tj, m2)),
          shift: [floorDiv(ti, m1), floorDiv(tj, m2)],
        })
      }
    }
  }
  /** Cell (i, j) of the copy of edge e whose `end` half-edge sits in cell (i, j). */
  function sourceCell(e: string, end: string, i: number, j: number): [number, number] {
    if (end === 'from') return [i, j]
    const k = doc.edges.find(x => x.id === e)!.shift ?? [0, 0]
    return [mod(i - k[0], m1), mod(j - k[1], m2)]
  }
  return {
    ...doc,
    name: `${doc.name} (${m1}×${m2} supercell)`,
    lattice: { w1: [m1 * w1[0], m1 * w1[1]], w2: [m2 * w2[0], m2 * w2[1]] },
    vertices,
    edges,
    ...(rotation ? { rotation } : {}),
    ...(doc.phases ? { phases: { ...doc.phases, vertexPhases } } : {}),
  }
}
