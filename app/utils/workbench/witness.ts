/**
 * What the canvas highlights for a failing verdict: vertices, edges and arrows at vertices
 * (balance residuals, a kernel mode). Built from the report of `analyzePattern`. Pure.
 */
import type { PatternReport, VerdictName } from '#shared/pattern/report'
import type { PatternDocument } from '#shared/types/pattern'

/** Canvas highlight: vertex ids, edge ids, and arrows (vertex index, direction in world units). */
export interface Highlight {
  vertices: string[]
  edges: string[]
  arrows: Array<{ vertex: number, d: [number, number] }>
}

const EMPTY: Highlight = { vertices: [], edges: [], arrows: [] }

/** Edge id of a half-edge name `<edge>:from` / `<edge>:to` (wings keep their own id). */
export function edgeOfHalfEdge(name: string): string {
  return name.replace(/:(from|to)$/, '')
}

/**
 * The highlight for verdict `name` of `report` on `doc`.
 * @param arrowLength world length of the longest arrow (default 0.25)
 */
export function witnessHighlight(report: PatternReport, doc: PatternDocument, name: VerdictName, arrowLength = 0.25): Highlight {
  const v = report.verdicts[name] as { witness?: Record<string, unknown> }
  const w = v.witness
  if (!w) return EMPTY
  const out: Highlight = { vertices: [], edges: [], arrows: [] }
  if (Array.isArray(w.vertices)) out.vertices = w.vertices as string[]
  if (Array.isArray(w.edges)) out.edges = w.edges as string[]
  if (Array.isArray(w.halfEdges)) out.edges = [...new Set((w.halfEdges as string[]).map(edgeOfHalfEdge))]
  if (Array.isArray(w.components)) out.vertices = (w.components as string[][]).slice(1).flat()
  if (Array.isArray(w.faces) && typeof w.faces[0] === 'object') {
    out.edges = [...new Set((w.faces as Array<{ halfEdges: string[] }>).flatMap(f => f.halfEdges.map(edgeOfHalfEdge)))]
  }
  if (name === 'balance') out.arrows = scaledArrows(report.verdicts.balance.residuals, arrowLength)
  if (Array.isArray(w.kernelMode) && Array.isArray(w.kernelMode[0])) out.arrows = scaledArrows(w.kernelMode as [number, number][], arrowLength)
  if (name === 'rigidity' || name === 'balance') out.vertices = out.vertices.length ? out.vertices : doc.vertices.map(x => x.id)
  return out
}

function scaledArrows(vectors: [number, number][], length: number): Highlight['arrows'] {
  const max = Math.max(...vectors.map(([x, y]) => Math.hypot(x, y)), 1e-300)
  return vectors.flatMap(([x, y], vertex) => (Math.hypot(x, y) > 1e-9 * max ? [{ vertex, d: [x / max * length, y / max * length] as [number, number] }] : []))
}

/**
 * Colour of a phase difference φ (radians) on our diverging scale: sea-glass at 0, paper-white
 * at ±π/2, amber at ±π (φ is reduced to (−π, π]; the sign is shown by the dash pattern).
 */
export function phaseColour(phi: number): string {
  const r = Math.atan2(Math.sin(phi), Math.cos(phi))
  const t = Math.abs(r) / Math.PI // 0 … 1
  const glass = [34, 146, 127], mid = [233, 230, 220], amber = [217, 124, 11]
  const [a, b, s] = t < 0.5 ? [glass, mid, t * 2] : [mid, amber, (t - 0.5) * 2]
  const c = a.map((x, i) => Math.round(x + (b[i]! - x) * s))
  return `rgb(${c[0]}, ${c[1]}, ${c[2]})`
}
