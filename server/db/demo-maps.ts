/**
 * The demo group's saved moduli maps, swept at seed time with the real core (`runMapSweep`,
 * shared/maps), never stored numbers:
 * - Fermat pair, τ plane: rows end where an edge collapses (an angle of the triangle (0, ω1, ω2)
 *   reaches 120°: first isogonic centre X(13), C. Kimberling, Encyclopedia of Triangle Centers);
 * - Square pair, α plane: every row crosses the branch points at α1 = π and α2 = π (derived: the
 *   one level row is 4 sin(ψ_b − (α1 + α2)/2) cos(α1/2) cos(α2/2)).
 */
import { runMapSweep } from '../../shared/maps'
import { MapResultSchema, parseMapSettings, type MapResult, type MapSettings, type MapSettingsInput } from '../../shared/types/maps'
import type { PatternDocument } from '../../shared/types/pattern'

/** One map of the demo. */
export interface DemoMapSpec {
  project: 0 | 1
  graph: string
  name: string
  author: 'owner' | 'editor'
  settings: MapSettingsInput
  /** What a reader finds on it (checked by the seed test): an `endedBy` or crossing kind. */
  shows: string[]
}

export const DEMO_MAPS: readonly DemoMapSpec[] = [
  {
    project: 0, graph: 'Fermat pair (rough drawing)', name: 'Fermat pair — where the towers stay apart', author: 'editor',
    settings: { plane: 'tau', x: { min: -0.9, max: 1.9, count: 15 }, y: { min: 0.2, max: 1.6, count: 8 }, collapseTolerance: 1e-7 },
    shows: ['collapse'],
  },
  {
    project: 0, graph: 'Square pair', name: 'Square pair — period phases', author: 'owner',
    settings: { plane: 'alpha', x: { min: 0.2, max: 6, count: 14 }, y: { min: 0.2, max: 6, count: 14 } },
    shows: ['branch point'],
  },
]

/** A swept map in the shape the map route stores (result parsed by the route's schema). */
export interface DemoMap { spec: DemoMapSpec, settings: MapSettings, result: MapResult }

/** Sweeps one map on the stored document. */
export function computeDemoMap(doc: PatternDocument, spec: DemoMapSpec): DemoMap {
  const settings = parseMapSettings(spec.settings)
  const swept = runMapSweep(doc, settings)
  const result = { ...MapResultSchema.parse(JSON.parse(JSON.stringify(swept))), settings } as MapResult
  return { spec, settings, result }
}
