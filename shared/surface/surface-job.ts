/**
 * The whole surface computation of one pattern, as the worker, the CLI and the bench run it:
 * schematic → (optional) relaxation → topology and curvature, plus the exports of the result.
 */
import type { PatternDocument } from '../types/pattern'
import { meanCurvature, type MeanCurvature } from './curvature'
import type { SurfaceExportMeta } from './export-meta'
import { writeGltf } from './export-gltf'
import { writeObj } from './export-obj'
import { writeStl } from './export-stl'
import type { PeriodicMesh } from './mesh'
import { parseRelaxSettings, type RelaxSettingsInput } from './options'
import { relaxSteps, cancelledResult, type RelaxProgress, type RelaxResult } from './relax'
import { buildSchematic, type SchematicSurface } from './schematic'
import { analyzeTopology, type MeshTopology } from './topology'
import { unrollMesh, type Copies } from './unroll'

/** What a surface computation reports besides the mesh. */
export interface SurfaceReport {
  kind: 'schematic' | 'relaxed'
  vertices: number
  triangles: number
  predictedGenus: number
  ends: number
  topology: MeshTopology
  /** Quotient genus equals E − V + 1 and the mesh is orientable, closed up to its open ends. */
  genusMatches: boolean
  curvature: Omit<MeanCurvature, 'perVertex'>
  relax?: Omit<RelaxResult, 'history'> & { steps: number }
  scale: number
}

/** Report of a mesh built from `s` (after relaxing it when `relax` is given). */
export function reportSurface(s: SchematicSurface, relax?: RelaxResult): SurfaceReport {
  const topology = analyzeTopology(s.mesh)
  const { perVertex: _, ...curvature } = meanCurvature(s.mesh)
  return {
    kind: relax ? 'relaxed' : 'schematic',
    vertices: topology.vertices,
    triangles: topology.faces,
    predictedGenus: s.predictedGenus,
    ends: s.ends,
    topology,
    genusMatches: topology.orientable && topology.genus === s.predictedGenus && topology.boundaryLoops === s.ends && topology.nonManifoldEdges === 0,
    curvature,
    ...(relax ? { relax: { ...withoutHistory(relax), steps: relax.history.length } } : {}),
    scale: s.scale,
  }
}

function withoutHistory(r: RelaxResult): Omit<RelaxResult, 'history'> {
  const { history: _, ...rest } = r
  return rest
}

/**
 * Relaxes `s.mesh` in place, calling `onStep` after each step; `onStep` returning false stops it
 * (cancelled). Async so that a worker can answer a cancel message between steps.
 */
export async function relaxSurface(
  s: SchematicSurface, input: RelaxSettingsInput, onStep?: (p: RelaxProgress) => boolean | Promise<boolean>,
): Promise<RelaxResult> {
  const history: RelaxProgress[] = []
  const gen = relaxSteps(s.mesh, parseRelaxSettings(input))
  let initialArea = Number.NaN
  for (;;) {
    const r = gen.next()
    if (r.done) return r.value
    if (Number.isNaN(initialArea)) initialArea = r.value.area
    history.push(r.value)
    if (onStep && (await onStep(r.value)) === false) {
      return cancelledResult(initialArea, history)
    }
  }
}

/** The export formats. */
export const SURFACE_FORMATS = ['stl', 'obj', 'gltf'] as const
export type SurfaceFormat = typeof SURFACE_FORMATS[number]

/** Writes the mesh (copies as asked) in one format: bytes for STL, text otherwise. */
export function exportSurface(mesh: PeriodicMesh, format: SurfaceFormat, meta: SurfaceExportMeta): Uint8Array | string {
  const u = unrollMesh(mesh, meta.copies as Copies)
  if (format === 'stl') return writeStl(u, meta)
  if (format === 'obj') return writeObj(u, meta)
  return writeGltf(u, meta)
}

/** Builds the schematic of a document (re-exported for the worker and CLI). */
export function schematicOf(doc: PatternDocument, settings: unknown): SchematicSurface {
  return buildSchematic(doc, (settings ?? {}) as Record<string, unknown>)
}
