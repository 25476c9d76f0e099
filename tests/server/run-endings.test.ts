/**
 * How runs end on the server: a run stopped by corrector failure keeps its own status and reason
 * (run summary, exports); a collapse located at length 0 is verified on the contracted drawing;
 * settings the pattern cannot run are refused before a run is created.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { computeBatches, graphIdByName, projectIdByName } from './runs-helpers'

const ctx = useTestServer()
let editor: ApiClient, owner: ApiClient
let torusId: number, planeId: number, fermatGraph: number, bridgeGraph: number
const fermat = findPatternExample('fermat-pair')!
const bridge = findPatternExample('plane-bridge')!

beforeAll(async () => {
  editor = await signInAs(ctx.server.url, 'editor')
  owner = await signInAs(ctx.server.url, 'owner')
  torusId = await projectIdByName(owner, 'Genus-three torus gluings')
  planeId = await projectIdByName(owner, 'Open-wing towers in the plane')
  fermatGraph = await graphIdByName(owner, torusId, fermat.title)
  bridgeGraph = await graphIdByName(owner, planeId, bridge.title)
})

async function saveRun(settings: Parameters<typeof computeBatches>[1]) {
  const created = await editor.json('POST', `/api/projects/${torusId}/runs`, { graphId: fermatGraph, name: 'ending', settings })
  expect(created.status).toBe(201)
  const runId = created.body.id as number
  const batches = computeBatches(fermat.document, settings, 20)
  for (const b of batches) expect((await editor.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })).status).toBe(200)
  return { runId, last: batches.at(-1)! }
}

describe('run endings', () => {
  it('a run stopped by corrector failure is "stopped" with its reason, in the summary and the exports', async () => {
    // collapse tolerance 1e-10: the shear of fermat-pair cannot be followed that close to the
    // collapse (F_u grows like 1/length), so the corrector gives up first
    const { runId, last } = await saveRun({ path: { kind: 'shear' }, to: -2, stop: { collapseTolerance: 1e-10 } })
    expect(last.finishReason).toMatch(/^stopped: no convergence past λ = /)
    const done = await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'stopped', reason: last.finishReason })
    expect(done.status).toBe(200)
    expect(done.body).toMatchObject({ status: 'stopped', finishReason: last.finishReason, verification: 'verified' })
    const json = await editor.json('GET', `/api/runs/${runId}/export.json`)
    expect(json.body).toMatchObject({ status: 'stopped', finishReason: last.finishReason })
    const csv = await editor.fetch(`/api/runs/${runId}/export.csv`)
    expect(await csv.text()).toContain(`status stopped (${last.finishReason})`)
  })

  it('a collapse at length 0 is stored and verified', async () => {
    const { runId } = await saveRun({ path: { kind: 'shear' }, to: -2 })
    const done = await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    expect(done.body.verification).toBe('verified')
    const sp = (await editor.json('GET', `/api/runs/${runId}/special-points`)).body as { specialKind: string, lambda: number }[]
    // fermat-pair ω1 = (2, 0), ω2 = (1, 2) + s·ω1: the angle at ω1 of (0, ω1, ω2) is 120° at
    // s = −1/2 − 1/√3 in the decreasing direction (Fermat–Torricelli, Kimberling X(13); see tests/e2e/family-run.test.ts)
    const c = sp.find(s => s.specialKind === 'collapse')!
    expect(Math.abs(c.lambda - (-0.5 - 1 / Math.sqrt(3)))).toBeLessThan(1e-8)
  })

  it('refuses wing sets whose directions do not sum to zero before a run exists (400, nothing written)', async () => {
    const before = (await owner.json('GET', `/api/projects/${planeId}/runs`)).body.length
    const r = await owner.json('POST', `/api/projects/${planeId}/runs`, { graphId: bridgeGraph, name: 'bad wings', settings: { path: { kind: 'wing-rotation', rotate: ['west-up'], compensate: ['west-down', 'east-up'] }, to: 1 } })
    expect(r.status).toBe(400)
    expect(JSON.stringify(r.body)).toMatch(/sum to zero/)
    expect((await owner.json('GET', `/api/projects/${planeId}/runs`)).body.length).toBe(before)
  })
})
