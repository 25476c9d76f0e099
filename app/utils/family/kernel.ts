/**
 * A kernel vector (null vector of F_u, or the other branch's direction at a branch point) as one
 * arrow per free vertex: direction and length relative to the largest. Drawing paths: (dx, dy)
 * pairs; phase paths: one phase change, drawn along x (sign only). Pure.
 */
import { PHASE_PATH_KINDS } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

/** One arrow: the vertex, its angle in degrees (counter-clockwise from +x) and length in [0, 1]. */
export interface KernelArrow { label: string, angleDeg: number, relative: number }

/** Arrows of a kernel vector (vertex 0 is pinned; extra entries beyond the vertices are ignored). */
export function kernelArrows(doc: PatternDocument, kind: string, kernel: readonly number[]): KernelArrow[] {
  const phase = (PHASE_PATH_KINDS as readonly string[]).includes(kind)
  const free = doc.vertices.slice(1)
  const vecs = free.map((v, i) => phase ? [kernel[i] ?? 0, 0] : [kernel[2 * i] ?? 0, kernel[2 * i + 1] ?? 0])
  const max = Math.max(...vecs.map(([x, y]) => Math.hypot(x!, y!)), 0)
  return free.map((v, i) => {
    const [x, y] = vecs[i]!
    return { label: v.id, angleDeg: Math.atan2(y!, x!) * 180 / Math.PI, relative: max > 0 ? Math.hypot(x!, y!) / max : 0 }
  })
}
