/**
 * Vertex colours of the 3-D view: by mean curvature (|H|·L on a log scale, 1e-5 … 1e-1) or by
 * height within one vertical period. Pure, small ramps between a few fixed colours.
 */
import type { SurfaceViewData } from '../../../workers/surface.worker'

export const SURFACE_COLOUR_BY = ['curvature', 'height'] as const
export type SurfaceColourBy = typeof SURFACE_COLOUR_BY[number]

/** Curvature ramp: pale blue (flat) → amber → deep red (curved). Height ramp: teal → sand → violet. */
const RAMPS: Record<SurfaceColourBy, [number, number, number][]> = {
  curvature: [[0.78, 0.86, 0.93], [0.96, 0.77, 0.35], [0.7, 0.13, 0.12]],
  height: [[0.16, 0.5, 0.55], [0.93, 0.86, 0.66], [0.45, 0.3, 0.66], [0.16, 0.5, 0.55]],
}

/** Colour at t ∈ [0, 1] of a ramp, into out[o..o+2]. */
function ramp(stops: [number, number, number][], t: number, out: Float32Array, o: number): void {
  const x = Math.min(1, Math.max(0, t)) * (stops.length - 1)
  const i = Math.min(stops.length - 2, Math.floor(x)), f = x - i
  for (let d = 0; d < 3; d++) out[o + d] = stops[i]![d]! * (1 - f) + stops[i + 1]![d]! * f
}

/** Position on the colour scale of a curvature value (log10 from −5 to −1). */
export function curvatureScale(h: number): number {
  return h > 0 ? (Math.log10(h) + 5) / 4 : 0
}

export function surfaceColours(d: SurfaceViewData, by: SurfaceColourBy): Float32Array {
  const n = d.positions.length / 3
  const out = new Float32Array(3 * n)
  const P = d.periods[2][2]
  for (let i = 0; i < n; i++) {
    const t = by === 'curvature' ? curvatureScale(d.curvature[i]!) : (((d.positions[3 * i + 2]! % P) + P) % P) / P
    ramp(RAMPS[by], t, out, 3 * i)
  }
  return out
}
