/**
 * The demo seed against the built server: every seeded run and map re-verifies through the
 * server's own re-verification routes, every kind of special point the product names is present
 * where its closed form puts it, the showcase patterns pass the published existence checklist,
 * and the discussions (one of them linking a saved comparison) are there.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, type ApiClient } from '../support/http'
import { analyzePattern } from '../../shared/pattern/analyze'
import { parsePatternDocument } from '../../shared/types/pattern'
import type { RunSummary, StoredRunPoint } from '../../shared/types/runs'
import type { MapDetail, MapSummary } from '../../shared/types/maps'
import { DEMO_RUNS } from '../../server/db/demo-runs'
import { DEMO_MAPS } from '../../server/db/demo-maps'
import { DEMO_PROJECTS } from '../../server/db/demo-data'
import { projectIdByName } from './runs-helpers'

const ctx = useTestServer()
let owner: ApiClient
let projectIds: number[]
const runs = new Map<string, RunSummary>()
const special = new Map<string, StoredRunPoint[]>()

beforeAll(async () => {
  owner = await signInAs(ctx.server.url, 'owner')
  projectIds = await Promise.all(DEMO_PROJECTS.map(p => projectIdByName(owner, p.name)))
  for (const id of projectIds) {
    for (const r of (await owner.json('GET', `/api/projects/${id}/runs`)).body as RunSummary[]) {
      runs.set(r.name, r)
      special.set(r.name, (await owner.json('GET', `/api/runs/${r.id}/special-points`)).body as StoredRunPoint[])
    }
  }
})

const seededNames = DEMO_RUNS.flatMap(s => [s.name, ...(s.otherBranch ? [s.otherBranch.name] : [])])
const located = (run: string, kind: string) => special.get(run)!.filter(s => s.specialKind === kind).map(s => s.lambda)

describe('seeded runs', () => {
  it('are all there, complete and verified by the seed', () => {
    for (const name of seededNames) {
      expect(runs.get(name), name).toMatchObject({ status: 'complete', verification: 'verified', verticalBalance: 'cuts-v1' })
      expect(runs.get(name)!.pointCount, name).toBeGreaterThan(3)
    }
  })

  it('re-verify from their stored points through the server route', async () => {
    for (const name of seededNames) {
      const res = await owner.json('POST', `/api/runs/${runs.get(name)!.id}/reverify`)
      expect(res.status, name).toBe(200)
      expect(res.body.verification, `${name}: ${res.body.verificationReason}`).toBe('verified')
    }
  })

  it('show every kind of special point: fold, branch point, collapse, rigidity loss, order flip, wall', () => {
    const kinds = new Set([...special.values()].flat().map(s => s.specialKind))
    for (const k of ['fold', 'branch point', 'collapse', 'rigidity loss', 'order flip', 'wall']) expect(kinds, k).toContain(k)
    for (const s of DEMO_RUNS) for (const k of s.shows) expect(located(s.name, k).length, `${s.name}: ${k}`).toBeGreaterThan(0)
  })

  it('put each special point where its closed form says', () => {
    // Fold of the weighted ring (derived): K_i sin φ_i = c round the ring, Σ φ_i = α1; with the
    // light edge at φ and weight k = 3/5, α1 = φ + 3 arcsin(k sin φ), and dα1/dφ = 0 at
    // cos φ* = −√((1/k² − 1)/8).
    const k = 3 / 5
    const phiStar = Math.acos(-Math.sqrt((1 / k ** 2 - 1) / 8))
    const foldAt = phiStar + 3 * Math.asin(k * Math.sin(phiStar))
    expect(located('Weighted ring of four — α1 to the fold', 'fold')[0]).toBeCloseTo(foldAt, 7)
    // Branch point of the even ring (derived): the light edges reach φ = π/2 together when
    // s · sin(π/2) = sin(π/6), i.e. s = 1/2.
    expect(located('Even ring of four — lighter opposite edges', 'branch point')[0]).toBeCloseTo(1 / 2, 7)
    // Twisted ring of five: rigidity lost at α1/5 = π/2 (D. A. Wiley, S. H. Strogatz, M. Girvan,
    // "The size of the sync basin", Chaos 16, 015103, 2006).
    expect(located('Twisted ring of five — α1 past 5π/2', 'rigidity loss')[0]).toBeCloseTo(5 * Math.PI / 2, 6)
    // Fermat pair: an angle of the triangle (0, ω1, ω2) reaches 120° at s = −1/2 − 1/√3 (first
    // isogonic centre X(13), C. Kimberling, Encyclopedia of Triangle Centers); the run's collapse
    // tolerance 1e-6 of the mean length puts the event O(1e-6) early.
    expect(Math.abs(located('Fermat pair — shear to the collapse', 'collapse')[0]! - (-1 / 2 - 1 / Math.sqrt(3)))).toBeLessThan(1e-4)
    // Leaning square pair (derived): ω2 = (−1/4 + s, 1) is perpendicular to ω1 at s = 1/4, where the four lengths tie.
    expect(located('Leaning square pair — shear across the square cell', 'wall')[0]).toBeCloseTo(1 / 4, 7)
    // Plane bridge (derived): the turned wings become parallel to the closed edge at λ = π/2.
    expect(located('Plane bridge — turning two wings', 'order flip')[0]).toBeCloseTo(Math.PI / 2, 7)
  })

  it('keep the other branch at the branch point as a child run, on the uneven states', async () => {
    const parent = runs.get('Even ring of four — lighter opposite edges')!
    const child = runs.get('Even ring of four — the uneven branch')!
    expect(child.parentRunId).toBe(parent.id)
    expect(child.restartPointIndex).toBe(-1 - special.get(parent.name)!.find(s => s.specialKind === 'branch point')!.index)
    // Uneven states (derived): the heavy edges sit at φ1 = φ3 = (α1 − π)/2 = π/6 and the light
    // ones at φ0 = π − φ2 with s sin φ0 = sin(π/6). u = (ψ1, ψ2, ψ3), ψ0 = 0, α1 = 4π/3.
    const pts = (await owner.json('GET', `/api/runs/${child.id}/points?limit=2000`)).body.points as StoredRunPoint[]
    const wrap = (x: number) => Math.atan2(Math.sin(x), Math.cos(x))
    let worst = 0, uneven = 0
    for (const p of pts) {
      const [p1, p2, p3] = p.state.u as [number, number, number]
      const phi = [p1, p2 - p1, p3 - p2, 4 * Math.PI / 3 - p3]
      worst = Math.max(worst, Math.abs(wrap(phi[1]! - Math.PI / 6)), Math.abs(wrap(phi[3]! - Math.PI / 6)), Math.abs(p.lambda * Math.sin(phi[0]!) - 1 / 2), Math.abs(wrap(phi[0]! + phi[2]! - Math.PI)))
      uneven = Math.max(uneven, Math.abs(wrap(phi[0]! - phi[2]!)))
    }
    expect(worst).toBeLessThan(1e-8)
    expect(uneven).toBeGreaterThan(0.5) // it leaves the even states, not back along the parent
  })
})

describe('switching branch from the run page', () => {
  it('creates the restart run at a special point (restartPointIndex −1 − k), as the run page asks', async () => {
    const parent = runs.get('Even ring of four — lighter opposite edges')!
    const k = special.get(parent.name)!.find(s => s.specialKind === 'branch point')!.index
    const graphs = (await owner.json('GET', `/api/projects/${projectIds[0]}/graphs`)).body as Array<{ id: number, name: string }>
    const res = await owner.json('POST', `/api/projects/${projectIds[0]}/runs`, {
      graphId: graphs.find(g => g.name === parent.graphName)!.id, version: parent.graphVersion, name: `${parent.name} — switch branch at special point ${k}`,
      settings: (await owner.json('GET', `/api/runs/${parent.id}`)).body.settings, parentRunId: parent.id, restartPointIndex: -1 - k,
    })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body).toMatchObject({ parentRunId: parent.id, restartPointIndex: -1 - k, status: 'running' })
  })
})

describe('seeded maps', () => {
  it('re-verify through the server route and show collapses and branch points', async () => {
    const list = (await Promise.all(projectIds.map(async id => (await owner.json('GET', `/api/projects/${id}/maps`)).body as MapSummary[]))).flat()
    for (const spec of DEMO_MAPS) {
      const m = list.find(x => x.name === spec.name)
      expect(m, spec.name).toMatchObject({ verification: 'verified' })
      const res = await owner.json('POST', `/api/maps/${m!.id}/reverify`)
      expect(res.status).toBe(200)
      const detail = res.body as MapDetail
      expect(detail.verification, detail.verificationReason ?? '').toBe('verified')
      const seen = new Set(detail.result.rows.flatMap(r => [...r.cells.map(c => c.endedBy ?? ''), ...r.crossings.map(c => c.kind)]).join(' ').split(/[^a-z ]+/))
      for (const k of spec.shows) expect([...seen].some(s => s.includes(k)), `${spec.name}: ${k}`).toBe(true)
    }
  })
})

describe('seeded patterns and discussions', () => {
  it('each project shows first a showcase pattern that passes the whole published checklist', async () => {
    for (const id of projectIds) {
      const graphs = (await owner.json('GET', `/api/projects/${id}/graphs`)).body as Array<{ id: number, name: string }>
      const top = (await owner.json('GET', `/api/projects/${id}/graphs/${graphs[0]!.id}`)).body
      const doc = parsePatternDocument(top.document)
      const report = analyzePattern(doc)
      expect(report.existence.allHold, `${graphs[0]!.name}: ${report.existence.line}`).toBe(true)
      expect(report.summary.gluingPattern && report.summary.orientable && report.summary.balanced).toBe(true)
    }
  })

  it('has a pattern with phases away from 0 and π that is vertically balanced and phase-rigid', async () => {
    const graphs = (await owner.json('GET', `/api/projects/${projectIds[0]}/graphs`)).body as Array<{ id: number, name: string, summary: { keepsMirrorPlanes: boolean, ok: boolean } }>
    const turned = graphs.filter(g => g.summary.ok && !g.summary.keepsMirrorPlanes)
    expect(turned.map(g => g.name)).toContain('Square pair')
  })

  it('has a thread on a run linking a saved comparison, and one on a special point', async () => {
    const run = runs.get('Even ring of four — lighter opposite edges')!
    const list = (await owner.json('GET', `/api/runs/${run.id}/comments`)).body as Array<{ id: number, body: string, parentId: number | null, pointIndex: number | null }>
    const link = list.find(c => c.body.includes('/compare?runs='))!
    expect(list.some(c => c.parentId === link.id)).toBe(true)
    const ids = /\/compare\?runs=([\d,]+)/.exec(link.body)![1]!
    const compared = (await owner.json('GET', `/api/compare?runs=${ids}`)).body as { runs: Array<{ name: string }> }
    expect(compared.runs.map(r => r.name).sort()).toEqual([run.name, 'Even ring of four — the uneven branch'].sort())
    const onPoint = list.filter(c => c.pointIndex === -1)
    expect(onPoint.length).toBeGreaterThanOrEqual(2)
  })
})
