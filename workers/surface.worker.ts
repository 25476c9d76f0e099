/**
 * Surface worker: a thin comlink adapter around shared/surface, so building, relaxing and
 * exporting a mesh never run on the page's main thread. Holds the current mesh between calls.
 * Reached from pages through app/composables/useSurfaceWorker.ts.
 */
import { expose, transfer } from 'comlink'
import type { PatternDocument } from '../shared/types/pattern'
import { meanCurvature } from '../shared/surface/curvature'
import type { SurfaceExportMeta } from '../shared/surface/export-meta'
import type { RelaxProgress } from '../shared/surface/relax'
import type { SchematicSurface } from '../shared/surface/schematic'
import { exportSurface, relaxSurface, reportSurface, schematicOf, type SurfaceFormat, type SurfaceReport } from '../shared/surface/surface-job'
import { parseRelaxSettings } from '../shared/surface/options'
import { unrollMesh, type Copies } from '../shared/surface/unroll'

/** What the 3-D view draws: unrolled copies with |H|·L per vertex, and the cell. */
export interface SurfaceViewData {
  positions: Float32Array
  indices: Uint32Array
  /** |H|·L per drawn vertex (0 on held vertices). */
  curvature: Float32Array
  periods: SchematicSurface['mesh']['periods']
  periodic: [boolean, boolean, boolean]
  copies: Copies
  /** Tower centres (x, y) and phases ψ in surface units. */
  towers: { x: number, y: number, psi: number }[]
}

function viewData(s: SchematicSurface, copies: Copies): SurfaceViewData {
  const u = unrollMesh(s.mesh, copies)
  const H = meanCurvature(s.mesh).perVertex
  const curvature = new Float32Array(u.source.length)
  for (let i = 0; i < u.source.length; i++) { const h = H[u.source[i]!]!; curvature[i] = Number.isFinite(h) ? h : 0 }
  const towers: SurfaceViewData['towers'] = []
  for (let v = 0; v < s.psi.length; v++) {
    let x = 0, y = 0, n = 0
    for (let i = 0; i < s.mesh.owner.length; i++) if (s.mesh.owner[i] === v) { x += s.mesh.positions[3 * i]!; y += s.mesh.positions[3 * i + 1]!; n++ }
    towers.push({ x: x / n, y: y / n, psi: s.psi[v]! })
  }
  return { positions: new Float32Array(u.positions), indices: u.indices, curvature, periods: s.mesh.periods, periodic: s.mesh.periodic, copies, towers }
}

const tick = () => new Promise<void>(resolve => setTimeout(resolve, 0))

/** The worker's API with its own state (the current mesh); one per worker, or per test. */
export function createSurfaceWorkerApi() {
  let current: { surface: SchematicSurface, report: SurfaceReport, relaxed: boolean } | undefined
  let cancelRequested = false
  return {
  /** Builds the schematic of a document; the view data for `copies`. Throws with a readable message on a pattern without towers. */
  build(doc: PatternDocument, settings: unknown, copies: Copies): { report: SurfaceReport, view: SurfaceViewData } {
    const surface = schematicOf(doc, settings)
    const report = reportSurface(surface)
    current = { surface, report, relaxed: false }
    const view = viewData(surface, copies)
    return transfer({ report, view }, [view.positions.buffer, view.indices.buffer, view.curvature.buffer])
  },
  /** Relaxes the current mesh; `onProgress` after every step; stops early after `cancel()`. */
  async relax(settings: unknown, copies: Copies, onProgress?: (p: RelaxProgress) => void): Promise<{ report: SurfaceReport, view: SurfaceViewData } | null> {
    if (!current) return null
    cancelRequested = false
    const s = current.surface
    const r = await relaxSurface(s, parseRelaxSettings(settings), async (p) => {
      onProgress?.(p)
      await tick() // lets a cancel() message in
      return !cancelRequested
    })
    const report = reportSurface(s, r)
    current = { surface: s, report, relaxed: true }
    const view = viewData(s, copies)
    return transfer({ report, view }, [view.positions.buffer, view.indices.buffer, view.curvature.buffer])
  },
  cancel(): void { cancelRequested = true },
  /** View data of the current mesh with other copies. */
  view(copies: Copies): SurfaceViewData | null {
    if (!current) return null
    const view = viewData(current.surface, copies)
    return transfer(view, [view.positions.buffer, view.indices.buffer, view.curvature.buffer])
  },
  /** The current mesh as a file (bytes for STL, text for OBJ and glTF). */
  exportMesh(format: SurfaceFormat, meta: Omit<SurfaceExportMeta, 'mesh' | 'settings'>): Uint8Array | string | null {
    if (!current) return null
    return exportSurface(current.surface.mesh, format, { ...meta, mesh: current.relaxed ? 'relaxed' : 'schematic', settings: current.surface.settings, ...(current.relaxed ? { relax: parseRelaxSettings({}) } : {}) })
  },
  }
}

export type SurfaceWorkerApi = ReturnType<typeof createSurfaceWorkerApi>

if (typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined') expose(createSurfaceWorkerApi())
