/**
 * The pattern whose surface the run page shows at a point of a family: `drawn` is the drawing at
 * the point (`documentAtPoint`); on the α1 and α2 phase paths the phases at the point are added
 * (λ is the period phase, u the vertex phases with vertex 0 pinned); other phase paths keep the
 * document's phases. And whether the phases keep the towers' horizontal mirror planes (every
 * φ = ψ(to) − ψ(from) + k·α within 1e-9 of 0 or π). Pure.
 */
import type { FamilySettings } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

export function withPhasesAtPoint(doc: PatternDocument, drawn: PatternDocument, settings: FamilySettings, lambda: number, u: readonly number[]): PatternDocument {
  const out = structuredClone(drawn)
  const kind = settings.path.kind
  if (kind !== 'alpha1' && kind !== 'alpha2') return out
  const alpha: [number, number] = [...(doc.phases?.alpha ?? [0, 0])]
  alpha[kind === 'alpha1' ? 0 : 1] = lambda
  const vertexPhases: Record<string, number> = { ...(doc.phases?.vertexPhases ?? {}) }
  doc.vertices.forEach((v, i) => { if (i > 0 && Number.isFinite(u[i - 1])) vertexPhases[v.id] = u[i - 1]! })
  out.phases = { ...(doc.phases ?? {}), alpha, vertexPhases }
  return out
}

/** Every phase difference within `tol` of 0 or π (mod 2π). */
export function keepsMirrorPlanes(doc: PatternDocument, tol = 1e-9): boolean {
  const psi = (id: string) => doc.phases?.vertexPhases?.[id] ?? 0
  const [a1, a2] = doc.phases?.alpha ?? [0, 0]
  return doc.edges.every((e) => {
    const [k1, k2] = e.shift ?? [0, 0]
    const phi = psi(e.to) - psi(e.from) + k1 * a1 + k2 * a2
    const r = ((phi % Math.PI) + Math.PI) % Math.PI
    return Math.min(r, Math.PI - r) <= tol
  })
}
