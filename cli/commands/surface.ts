/**
 * `wingfold surface FILE [--relax] [-o out.stl|out.obj|out.gltf] [--copies 2x2x1] [--rows N]
 * [--edge-length L] [--wing-length R] [--unit-scale S --unit mm]` (lengths in surface units, the
 * vertical period being 2π; R: where the open wings of a plane pattern are cut): builds the schematic surface of a pattern (shared/surface), relaxes
 * it on request, prints size, quotient genus against E − V + 1 and the mean curvature, and writes
 * the mesh. Exit 1 when the quotient genus differs from the prediction.
 */
import { writeFile } from 'node:fs/promises'
import { readCommandInput } from '../read-document'
import { SurfaceInputError } from '../../shared/surface/schematic'
import { exportSurface, relaxSurface, reportSurface, schematicOf, SURFACE_FORMATS, type SurfaceFormat } from '../../shared/surface/surface-job'
import { parseRelaxSettings } from '../../shared/surface/options'
import type { Copies } from '../../shared/surface/unroll'

export const summary = 'FILE [--relax] [-o out.stl|.obj|.gltf] [--copies 2x2x1]  surface mesh; exit 1 when the genus differs from E − V + 1'

export async function run(args: string[]): Promise<number> {
  const input = await readCommandInput('surface', summary, args, {
    relax: { type: 'boolean', default: false },
    output: { type: 'string', short: 'o' },
    copies: { type: 'string', default: '1x1x1' },
    rows: { type: 'string', default: '24' },
    'edge-length': { type: 'string' },
    'wing-length': { type: 'string' },
    'unit-scale': { type: 'string', default: '1' },
    unit: { type: 'string' },
    json: { type: 'boolean', default: false },
  })
  if ('exitCode' in input) return input.exitCode
  const v = input.values as { relax: boolean, output?: string, copies: string, rows: string, 'edge-length'?: string, 'wing-length'?: string, 'unit-scale': string, unit?: string, json: boolean }
  const copies = v.copies.split('x').map(Number)
  const unitScale = Number(v['unit-scale'])
  if (copies.length !== 3 || copies.some(c => !Number.isInteger(c) || c < 1 || c > 20)) { console.error('wingfold surface: --copies must look like 2x2x1 (1..20 each)'); return 2 }
  if (!(unitScale > 0)) { console.error('wingfold surface: --unit-scale must be a positive number'); return 2 }
  const format = v.output ? v.output.split('.').pop()!.toLowerCase() : undefined
  if (format && !SURFACE_FORMATS.includes(format as SurfaceFormat)) { console.error(`wingfold surface: -o must end in ${SURFACE_FORMATS.map(f => '.' + f).join(', ')}`); return 2 }
  let s
  const settings = {
    rows: Number(v.rows),
    ...(v['edge-length'] ? { edgeLength: Number(v['edge-length']) } : {}),
    ...(v['wing-length'] ? { wingLength: Number(v['wing-length']) } : {}),
  }
  try { s = schematicOf(input.doc, settings) }
  catch (e) {
    if (e instanceof SurfaceInputError || (e as Error).name === 'ZodError') { console.error(`wingfold surface: ${(e as Error).message}`); return 2 }
    throw e
  }
  const relax = v.relax ? await relaxSurface(s, {}) : undefined
  const report = reportSurface(s, relax)
  if (v.json) console.log(JSON.stringify(report, null, 2))
  else {
    const t = report.topology
    console.log(`${report.kind} surface of '${input.doc.name}': ${report.vertices} vertices, ${report.triangles} triangles (one cell)`)
    console.log(`quotient: χ = ${t.euler}, ${t.boundaryLoops} boundary loops, ${t.orientable ? `genus ${t.genus}` : `not orientable, ${t.genus} cross-caps`}; predicted genus E − V + 1 = ${report.predictedGenus} → ${report.genusMatches ? 'matches' : 'DIFFERS'}`)
    console.log(`mean curvature |H|·L (L = period/2π): max ${report.curvature.max.toExponential(3)}, mean ${report.curvature.mean.toExponential(3)}`)
    if (relax) console.log(`relaxation: ${relax.converged ? 'converged' : 'not converged'} after ${relax.iterations} steps, kept step ${relax.kept}; area ${relax.initialArea.toFixed(4)} → ${relax.area.toFixed(4)}${relax.reason ? ` (${relax.reason})` : ''}`)
  }
  if (v.output && format) {
    const data = exportSurface(s.mesh, format as SurfaceFormat, {
      pattern: input.doc.name, version: null, mesh: report.kind, settings: s.settings,
      ...(relax ? { relax: parseRelaxSettings({}) } : {}),
      copies: copies as Copies, unit: v.unit ?? 'surface unit (vertical period 2π)', unitScale,
    })
    await writeFile(v.output, data)
    console.log(`wrote ${v.output}`)
  }
  return report.genusMatches ? 0 : 1
}
