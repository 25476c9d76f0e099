/**
 * The diagram point nearest to the pointer, measured in screen pixels (so an axis spanning 1e-6
 * and one spanning 1e3 weigh alike). The point inspector keeps the nearest point while the pointer
 * moves over the plot, instead of going blank between points.
 */

/** A plotted datum `[x, y, runIndex, pointIndex]` and whether it is a special point. */
export interface PlottedDatum { x: number, y: number, run: number, index: number, special: boolean }

/**
 * Nearest datum to the pointer at data coordinates `(px, py)`, where one screen pixel is `sx` data
 * units along x and `sy` along y (signs ignored). A special point within `specialBonusPx` pixels of
 * the nearest regular point wins, so markers stay easy to hover. `null` for no data.
 */
export function nearestDatum(data: readonly PlottedDatum[], px: number, py: number, sx: number, sy: number, specialBonusPx = 4): PlottedDatum | null {
  const ax = Math.abs(sx) || 1, ay = Math.abs(sy) || 1
  let best: PlottedDatum | null = null
  let bestD = Infinity
  for (const d of data) {
    if (!Number.isFinite(d.x) || !Number.isFinite(d.y)) continue
    const dist = Math.hypot((d.x - px) / ax, (d.y - py) / ay) - (d.special ? specialBonusPx : 0)
    if (dist < bestD) { bestD = dist; best = d }
  }
  return best
}

/** The plotted data of a branch diagram option (line series: points; scatter series: special points). */
export function plottedData(series: ReadonlyArray<{ type: string, data: ReadonlyArray<readonly number[]> }>): PlottedDatum[] {
  const out: PlottedDatum[] = []
  for (const s of series) {
    for (const d of s.data) out.push({ x: d[0]!, y: d[1]!, run: d[2]!, index: d[3]!, special: s.type === 'scatter' })
  }
  return out
}
