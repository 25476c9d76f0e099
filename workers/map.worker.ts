/**
 * Map worker: a thin comlink adapter around the sweep (shared/maps). The page's pool asks one
 * worker for the spine, then hands rows out to every worker; a row is one call, so cancelling
 * means terminating the worker (rows already returned are kept by the pool).
 */
import { expose } from 'comlink'
import { fillMap, sweepRow, sweepSpine, traceMapCurve, type MapSpine, type TracedCurve } from '../shared/maps'
import type { MapCrossing, MapResult, MapRow, MapRowStart } from '../shared/types/maps'
import type { PatternDocument } from '../shared/types/pattern'

/** Creates the API object (exported for tests over a MessageChannel). */
export function createMapWorkerApi() {
  return {
    /** Seed → spine column → each row's start state. Throws on invalid settings or a plane the pattern lacks. */
    spine(doc: PatternDocument, settings: unknown): MapSpine { return sweepSpine(doc, settings) },
    /** One row from its start (see sweepRow). */
    row(doc: PatternDocument, settings: unknown, start: MapRowStart, spineColumn: number): MapRow { return sweepRow(doc, settings, start, spineColumn) },
    /** After the rows: every cell reachable along rows and columns from solved cells, the rest classified (fill.ts). */
    fill(doc: PatternDocument, settings: unknown, map: MapResult): MapResult { return fillMap(doc, settings, map) },
    /** The collapse or rigidity-loss curve through a crossing, inside the map's window. */
    trace(doc: PatternDocument, settings: unknown, crossing: MapCrossing): TracedCurve { return traceMapCurve(doc, settings, crossing) },
  }
}

/** The API the worker exposes (every method returns a Promise on the page). */
export type MapWorkerApi = ReturnType<typeof createMapWorkerApi>

if (typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined') expose(createMapWorkerApi())
