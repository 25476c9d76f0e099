/**
 * Helpers that keep the canvas cheap to redraw for large patterns: the part of a pattern that a
 * drag of some vertices changes (those vertices and the edges and wings touching them), and one
 * SVG path for many segments or dots (the faded copies draw two elements instead of hundreds).
 * Pure functions, no DOM.
 */
import type { PatternDocument } from '#shared/types/pattern'

/** What moves when some vertices are dragged: their ids, and the indices of the edges and wings touching them. */
export interface MovingPart {
  vertexIds: Set<string>
  /** Indices into `doc.vertices`, ascending. */
  vertices: number[]
  /** Indices into `doc.edges`, ascending. */
  edges: number[]
  /** Indices into `doc.wings`, ascending. */
  wings: number[]
}

/**
 * The vertices at `indices` with every edge and wing incident to one of them.
 * Reads only ids and endpoints, never positions, so a reactive caller is not re-run by the drag itself.
 */
export function movingPart(doc: PatternDocument, indices: readonly number[]): MovingPart {
  const vertices = [...new Set(indices)].filter(i => i >= 0 && i < doc.vertices.length).sort((a, b) => a - b)
  const vertexIds = new Set(vertices.map(i => doc.vertices[i]!.id))
  const edges: number[] = []
  doc.edges.forEach((e, i) => { if (vertexIds.has(e.from) || vertexIds.has(e.to)) edges.push(i) })
  const wings: number[] = []
  ;(doc.wings ?? []).forEach((w, i) => { if (vertexIds.has(w.vertex)) wings.push(i) })
  return { vertexIds, vertices, edges, wings }
}

/** A straight segment in screen pixels. */
export interface Segment { x1: number, y1: number, x2: number, y2: number }

/** Screen pixels kept to two decimals: path strings stay short and the drawing stays crisp. */
const px = (x: number) => Math.round(x * 100) / 100

/** One path `d` drawing every segment (move-to, line-to per segment). */
export function segmentsPath(segments: readonly Segment[]): string {
  let d = ''
  for (const s of segments) d += `M${px(s.x1)} ${px(s.y1)}L${px(s.x2)} ${px(s.y2)}`
  return d
}

/** One path `d` drawing a filled disc of radius `r` around each point (two half-circle arcs each). */
export function dotsPath(points: ReadonlyArray<{ x: number, y: number }>, r: number): string {
  let d = ''
  for (const p of points) d += `M${px(p.x - r)} ${px(p.y)}a${r} ${r} 0 1 0 ${2 * r} 0a${r} ${r} 0 1 0 ${-2 * r} 0z`
  return d
}

/**
 * `next` with every item that equals (field by field, shallowly) the item of the same `id` in
 * `prev` replaced by that earlier object. The drawing marks each element with `v-memo` on its
 * item, so a redraw after a small change patches only the elements whose items are new objects.
 */
export function reuseItems<T extends { id: string }>(prev: readonly T[], next: T[]): T[] {
  if (!prev.length) return next
  const old = new Map(prev.map(x => [x.id, x]))
  return next.map((x) => {
    const o = old.get(x.id)
    return o && sameFields(o, x) ? o : x
  })
}

function sameFields(a: object, b: object): boolean {
  const ka = Object.keys(a)
  if (ka.length !== Object.keys(b).length) return false
  for (const k of ka) if ((a as Record<string, unknown>)[k] !== (b as Record<string, unknown>)[k]) return false
  return true
}
