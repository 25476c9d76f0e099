/**
 * What every surface export says about itself: the pattern and its version, which mesh
 * (schematic or relaxed), the settings, the copies and the unit.
 */
import type { RelaxSettings, SurfaceSettings } from './options'
import type { Copies } from './unroll'

export interface SurfaceExportMeta {
  pattern: string
  /** Saved version of the pattern (null for a file or an unsaved drawing). */
  version: number | null
  mesh: 'schematic' | 'relaxed'
  settings: SurfaceSettings
  relax?: RelaxSettings
  copies: Copies
  /** Length of one file unit, in words. */
  unit: string
  /** Multiplier applied to surface units before writing. */
  unitScale: number
}

/** The unit sentence of the exports: one file unit is `unitScale⁻¹` surface units. */
export function unitSentence(scale: number): string {
  return scale === 1
    ? 'surface units: the vertical period is 2π (one unit = period / 2π)'
    : `surface units × ${scale}: the vertical period is ${(2 * Math.PI * scale).toPrecision(6)}`
}

/** One line of meta for headers that have little room (STL: 80 bytes). */
export function shortMeta(m: SurfaceExportMeta): string {
  const v = m.version === null ? '' : ` v${m.version}`
  return `Wingfold ${m.mesh}${v} rows=${m.settings.rows} edge=${m.settings.edgeLength.toFixed(3)} n=${m.copies.join('x')} unit=2pi/period*${m.unitScale} ${m.pattern}`
}
