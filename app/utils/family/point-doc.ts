/**
 * The pattern as it is at one point of a family, for the point inspector: positions from the
 * point's unknowns (vertex 0 stays where the document puts it: it is pinned) and, on lattice
 * paths, the lattice at λ. Phase paths leave the drawing as it is. Pure.
 */
import { latticePath } from '#shared/families/lattice-paths'
import { LATTICE_PATH_KINDS, type FamilySettings } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

const isLattice = (k: string) => (LATTICE_PATH_KINDS as readonly string[]).includes(k)
const isDrawing = (k: string) => isLattice(k) || k === 'wing-rotation'

/** A copy of `doc` drawn at (λ, u) of a run with these settings. */
export function documentAtPoint(doc: PatternDocument, settings: FamilySettings, lambda: number, u: readonly number[]): PatternDocument {
  const out = structuredClone(doc)
  const kind = settings.path.kind
  if (!isDrawing(kind)) return out
  out.vertices.forEach((v, i) => {
    if (i === 0) return
    const x = u[2 * (i - 1)], y = u[2 * (i - 1) + 1]
    if (Number.isFinite(x) && Number.isFinite(y)) v.position = [x!, y!]
  })
  if (isLattice(kind) && doc.lattice) {
    const l = latticePath(settings.path, { w1: [...doc.lattice.w1], w2: [...doc.lattice.w2] }).at(lambda).lattice
    out.lattice = { w1: [l.w1[0], l.w1[1]], w2: [l.w2[0], l.w2[1]] }
  }
  return out
}
