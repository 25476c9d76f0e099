/**
 * The canvas view: world coordinates (the pattern's plane, y up) to screen pixels (y down) and
 * back, zoom about a point, and a view that fits a pattern. Pure functions, no DOM.
 */
import type { PatternDocument } from '#shared/types/pattern'

export type Vec = [number, number]

/** World point at the centre of the canvas and pixels per world unit, for a canvas of width × height. */
export interface View {
  cx: number
  cy: number
  scale: number
  width: number
  height: number
}

/** Screen position (pixels, y down) of a world point. */
export function toScreen(v: View, p: readonly [number, number]): Vec {
  return [v.width / 2 + (p[0] - v.cx) * v.scale, v.height / 2 - (p[1] - v.cy) * v.scale]
}

/** World point under a screen position. */
export function toWorld(v: View, s: readonly [number, number]): Vec {
  return [v.cx + (s[0] - v.width / 2) / v.scale, v.cy - (s[1] - v.height / 2) / v.scale]
}

/** Zoom by `factor` keeping the world point under screen position `s` fixed. Scale is clamped to [1e-3, 1e6]. */
export function zoomAt(v: View, s: readonly [number, number], factor: number): View {
  const scale = Math.min(1e6, Math.max(1e-3, v.scale * factor))
  const w = toWorld(v, s)
  // after zooming, w must still map to s: cx = w.x − (s.x − W/2)/scale
  return { ...v, scale, cx: w[0] - (s[0] - v.width / 2) / scale, cy: w[1] + (s[1] - v.height / 2) / scale }
}

/** Move the view by a screen displacement (dragging the background). */
export function panBy(v: View, dx: number, dy: number): View {
  return { ...v, cx: v.cx - dx / v.scale, cy: v.cy + dy / v.scale }
}

/**
 * A view showing the whole pattern with a margin: in the torus the fundamental parallelogram
 * (origin, ω1, ω2, ω1+ω2) and every vertex; in the plane the vertices with room for the wings.
 * @param margin fraction of the canvas left free on each side (default 0.18)
 */
export function fitView(doc: PatternDocument, width: number, height: number, margin = 0.18): View {
  const pts: Vec[] = doc.vertices.map(v => [v.position[0], v.position[1]])
  if (doc.space === 'torus' && doc.lattice) {
    const { w1, w2 } = doc.lattice
    pts.push([0, 0], [w1[0], w1[1]], [w2[0], w2[1]], [w1[0] + w2[0], w1[1] + w2[1]])
  }
  let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity
  for (const [x, y] of pts) { x0 = Math.min(x0, x); x1 = Math.max(x1, x); y0 = Math.min(y0, y); y1 = Math.max(y1, y) }
  const span = Math.max(x1 - x0, y1 - y0, 1e-9)
  const pad = doc.space === 'plane' ? span * 0.6 + 0.5 : 0
  const sx = (width * (1 - 2 * margin)) / (x1 - x0 + 2 * pad || span)
  const sy = (height * (1 - 2 * margin)) / (y1 - y0 + 2 * pad || span)
  return { cx: (x0 + x1) / 2, cy: (y0 + y1) / 2, scale: Math.min(sx, sy), width, height }
}
