/**
 * The pattern as it is at one point of a family, for the point inspector: positions from the
 * point's unknowns (vertex 0 stays where the document puts it: it is pinned) and, on lattice
 * paths, the lattice at λ. Phase paths leave the drawing as it is and set the point's phases
 * (ψ of vertices 1…V−1 from u, α and the weights K at λ). Pure.
 */
import { latticePath } from '#shared/families/lattice-paths'
import { phasePath } from '#shared/families/phase'
import { compilePattern } from '#shared/pattern/model'
import { LATTICE_PATH_KINDS, PHASE_PATH_KINDS, type FamilySettings } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

const isLattice = (k: string) => (LATTICE_PATH_KINDS as readonly string[]).includes(k)
const isDrawing = (k: string) => isLattice(k) || k === 'wing-rotation'

/** A copy of `doc` drawn at (λ, u) of a run with these settings. */
export function documentAtPoint(doc: PatternDocument, settings: FamilySettings, lambda: number, u: readonly number[]): PatternDocument {
  const out = structuredClone(doc)
  const kind = settings.path.kind
  if ((PHASE_PATH_KINDS as readonly string[]).includes(kind)) return phasesAtPoint(out, settings, lambda, u)
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

/** `doc` (a copy) with the phases and weights of a phase-path point. */
function phasesAtPoint(doc: PatternDocument, settings: FamilySettings, lambda: number, u: readonly number[]): PatternDocument {
  const m = compilePattern(doc)
  const path = phasePath(m, settings.path)
  const K = path.weights(lambda)
  const vertexPhases: Record<string, number> = { [doc.vertices[0]!.id]: m.psi[0]! }
  doc.vertices.forEach((v, i) => { if (i > 0 && Number.isFinite(u[i - 1])) vertexPhases[v.id] = u[i - 1]! })
  doc.phases = { alpha: path.alpha(lambda), vertexPhases }
  doc.edges.forEach((e, i) => { e.weight = K[i]! })
  return doc
}
