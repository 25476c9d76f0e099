/**
 * The pattern as it is at one map cell: positions from the cell's state (vertex 0 stays where the
 * document puts it: it is pinned) and the lattice at τ (τ plane), or the period phases and vertex
 * phases (α plane). Pure; the result is a valid document to open read-only or to save as a version.
 */
import { tauLattice } from './plane'
import type { MapCell, MapSettings } from '../types/maps'
import type { PatternDocument } from '../types/pattern'

/** A copy of `doc` at a solved cell of a map with these settings. */
export function documentAtCell(doc: PatternDocument, settings: Pick<MapSettings, 'plane' | 'scaleBy'>, cell: Pick<MapCell, 'x' | 'y' | 'u'>): PatternDocument {
  const out = structuredClone(doc)
  const u = cell.u ?? []
  if (settings.plane === 'tau' && doc.lattice) {
    out.vertices.forEach((v, i) => {
      const x = u[2 * (i - 1)], y = u[2 * (i - 1) + 1]
      if (i > 0 && Number.isFinite(x) && Number.isFinite(y)) v.position = [x!, y!]
    })
    const l = tauLattice({ w1: [...doc.lattice.w1], w2: [...doc.lattice.w2] }, settings.scaleBy)(cell.x, cell.y).lattice
    out.lattice = { w1: [l.w1[0], l.w1[1]], w2: [l.w2[0], l.w2[1]] }
  } else if (settings.plane === 'alpha') {
    const psi0 = doc.phases?.vertexPhases?.[doc.vertices[0]!.id] ?? 0
    const vertexPhases: Record<string, number> = { [doc.vertices[0]!.id]: psi0 }
    doc.vertices.forEach((v, i) => { if (i > 0 && Number.isFinite(u[i - 1])) vertexPhases[v.id] = u[i - 1]! })
    out.phases = { ...doc.phases, alpha: [cell.x, cell.y], vertexPhases }
  }
  return out
}
