/**
 * The surface worker's API through comlink over a Node MessageChannel (comlink's node adapter):
 * build reports the genus E − V + 1 (H. Chen, M. Traizet, Gluing Karcher–Scherk saddle towers I: Triply periodic minimal surfaces, arXiv 2103.15676, 2021, Thm 6.7) and transfers the view arrays,
 * relax streams its steps to a proxied callback, cancel stops it after the current step, and the
 * export is a binary STL of the current mesh.
 */
import { MessageChannel } from 'node:worker_threads'
import { expose, proxy, wrap, type Remote } from 'comlink'
import nodeEndpoint from 'comlink/dist/esm/node-adapter'
import { afterEach, describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { readStl } from '../../../shared/surface/export-stl'
import type { RelaxProgress } from '../../../shared/surface/relax'
import { createSurfaceWorkerApi, type SurfaceWorkerApi } from '../../../workers/surface.worker'

let channel: MessageChannel | undefined
function connect(): Remote<SurfaceWorkerApi> {
  channel = new MessageChannel()
  expose(createSurfaceWorkerApi(), nodeEndpoint(channel.port1))
  return wrap<SurfaceWorkerApi>(nodeEndpoint(channel.port2))
}
afterEach(() => { channel?.port1.close(); channel?.port2.close() })
const doc = () => findPatternExample('square-pair')!.document

describe('surface worker over comlink', () => {
  it('builds, relaxes with progress, exports; genus E − V + 1 throughout', async () => {
    const api = connect()
    const b = await api.build(doc(), { rows: 12, radial: 3 }, [2, 1, 1])
    expect(b.report).toMatchObject({ kind: 'schematic', predictedGenus: 3, genusMatches: true })
    expect(b.view.indices.length).toBe(3 * 2 * b.report.triangles) // two copies along ω1
    expect(b.view.curvature.length).toBe(b.view.positions.length / 3)
    const steps: RelaxProgress[] = []
    const r = await api.relax({ maxIterations: 5 }, [1, 1, 1], proxy((p: RelaxProgress) => { steps.push(p) }))
    expect(r!.report.kind).toBe('relaxed')
    expect(r!.report.genusMatches).toBe(true)
    expect(steps.length).toBe(r!.report.relax!.steps)
    const stl = readStl(await api.exportMesh('stl', { pattern: 'Square pair', version: 2, copies: [1, 1, 1], unit: 'mm', unitScale: 1 }) as Uint8Array)
    expect(stl.header).toMatch(/^Wingfold relaxed v2/)
    expect(stl.triangles.length / 9).toBe(r!.report.triangles)
  })
  it('cancel stops a relaxation between steps', async () => {
    const api = connect()
    await api.build(doc(), { rows: 12, radial: 3 }, [1, 1, 1])
    let seen = 0
    const r = await api.relax({ maxIterations: 200, tolerance: 1e-12, curvatureTolerance: 0, patience: 100 }, [1, 1, 1], proxy(() => { seen++; if (seen === 2) void api.cancel() }))
    expect(r!.report.relax!.cancelled).toBe(true)
    expect(r!.report.relax!.iterations).toBeLessThan(10)
  })
})
