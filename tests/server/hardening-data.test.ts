/**
 * Hardening of data routes: security headers on pages, JSON and CSV; body limits enforced while
 * reading (chunked too); HEAD on GET routes; idempotent, crash-safe batch uploads; runs that
 * nobody writes to end as "interrupted"; a map with no solved cell is not "verified".
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { runMapSweep } from '../../shared/maps'
import { parseMapSettings } from '../../shared/types/maps'
import { computeBatches, graphIdByName, projectIdByName } from './runs-helpers'
import { sqlOnServer } from './team-support'

// Runs idle for 0.05 min = 3 s are ended; the sweep runs every second.
const ctx = useTestServer({ env: { NUXT_RUN_IDLE_MINUTES: '0.05', NUXT_RUN_SWEEP_SECONDS: '1' } })
let owner: ApiClient, torusId: number, fermatGraph: number
const fermat = findPatternExample('fermat-pair')!
const shear = { path: { kind: 'shear' as const }, to: -2, stop: { maxPoints: 12 } }
const batches = computeBatches(fermat.document, shear, 3)

beforeAll(async () => {
  owner = await signInAs(ctx.server.url, 'owner')
  torusId = await projectIdByName(owner, 'Genus-three torus gluings')
  fermatGraph = await graphIdByName(owner, torusId, fermat.title)
})

async function newRun(name: string) {
  const r = await owner.json('POST', `/api/projects/${torusId}/runs`, { graphId: fermatGraph, name, settings: shear })
  expect(r.status).toBe(201)
  return r.body.id as number
}

const batchBody = (b: (typeof batches)[number]) => ({ points: b.points, specialPoints: b.specialPoints })

/** Poll until `check` returns a value (the condition, not a fixed sleep). */
async function until<T>(check: () => Promise<T | undefined>, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const v = await check()
    if (v !== undefined) return v
    if (Date.now() > deadline) throw new Error('condition not met in time')
    await new Promise(ok => setTimeout(ok, 200))
  }
}

/** A body sent chunked (no Content-Length), `total` bytes of a JSON string value. */
function chunkedJson(prefix: string, total: number, suffix: string): ReadableStream<Uint8Array> {
  const enc = new TextEncoder()
  let sent = 0
  let started = false
  return new ReadableStream({
    pull(controller) {
      if (!started) { started = true; controller.enqueue(enc.encode(prefix)); return }
      if (sent >= total) { controller.enqueue(enc.encode(suffix)); controller.close(); return }
      const n = Math.min(64 * 1024, total - sent)
      sent += n
      controller.enqueue(enc.encode('a'.repeat(n)))
    },
  })
}

describe('security headers', () => {
  const expectHeaders = (h: Headers, page = false) => {
    const csp = h.get('content-security-policy') ?? ''
    expect(csp).toContain("frame-ancestors 'none'")
    if (page) {
      expect(csp).toContain("worker-src 'self' blob:")
      expect(csp).toContain("object-src 'none'")
      expect(csp).toMatch(/script-src 'self' 'strict-dynamic' 'nonce-[A-Za-z0-9+/=]+'/)
    }
    else expect(csp).toContain("default-src 'none'")
    expect(h.get('x-frame-options')).toBe('DENY')
    expect(h.get('x-content-type-options')).toBe('nosniff')
    expect(h.get('referrer-policy')).toBe('same-origin')
    expect(h.get('x-powered-by')).toBeNull()
  }
  it('are sent on an HTML page, a JSON route and a CSV export', async () => {
    expectHeaders((await fetch(new URL('/about', ctx.server.url))).headers, true)
    expectHeaders((await owner.fetch('/api/projects')).headers)
    const runId = await newRun('for the csv')
    expect((await owner.json('POST', `/api/runs/${runId}/points`, batchBody(batches[0]!))).status).toBe(200)
    const csv = await owner.fetch(`/api/runs/${runId}/export.csv`)
    expect(csv.status).toBe(200)
    expectHeaders(csv.headers)
  })
})

describe('body limits', () => {
  it('answers 413 to a chunked pattern upload past 2 MB and stores nothing', async () => {
    const before = await sqlOnServer(ctx.server, 'SELECT count(*) AS n FROM graphs')
    const res = await owner.fetch(`/api/projects/${torusId}/graphs`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: chunkedJson('{"name":"huge","document":{"title":"', 2_500_000, '"}}'), duplex: 'half',
    } as RequestInit)
    expect(res.status).toBe(413)
    expect(await sqlOnServer(ctx.server, 'SELECT count(*) AS n FROM graphs')).toEqual(before)
  })

  it('answers 413 to a 20 MB comment, chunked or with Content-Length', async () => {
    const runId = await newRun('for comments')
    const chunked = await owner.fetch(`/api/runs/${runId}/comments`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: chunkedJson('{"body":"', 20_000_000, '"}'), duplex: 'half',
    } as RequestInit)
    expect(chunked.status).toBe(413)
    const declared = await owner.fetch(`/api/runs/${runId}/comments`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ body: 'a'.repeat(20_000_000) }),
    })
    expect(declared.status).toBe(413)
    expect(await sqlOnServer(ctx.server, 'SELECT count(*) AS n FROM comments')).toEqual([{ n: 0 }])
  })
})

describe('HEAD', () => {
  it('answers HEAD on GET routes with the GET status and no body', async () => {
    const res = await owner.fetch('/api/projects', { method: 'HEAD' })
    expect(res.status).toBe(200)
    expect(await res.text()).toBe('')
    expect((await client(ctx.server.url).fetch('/api/projects', { method: 'HEAD' })).status).toBe(401)
    expect((await owner.fetch('/api/projects/999999', { method: 'HEAD' })).status).toBe(404)
  })
})

describe('docs/api.md examples', () => {
  it('a pattern upload answers 201 with the version as a number; a document of the wrong shape 400, with broken references 422', async () => {
    const ok = await owner.json('POST', `/api/projects/${torusId}/graphs`, { name: 'From the notebook', message: 'From the notebook', document: fermat.document })
    expect(ok.status).toBe(201)
    expect(ok.body).toEqual({ id: expect.any(Number), version: 1 })
    const shape = await owner.json('POST', `/api/projects/${torusId}/graphs`, { name: 'Broken', document: { ...fermat.document, vertices: 'none' } })
    expect(shape.status).toBe(400)
    const edges = fermat.document.edges.map((e, k) => (k === 0 ? { ...e, to: 'nowhere' } : e))
    const bad = await owner.json('POST', `/api/projects/${torusId}/graphs`, { name: 'Broken', document: { ...fermat.document, edges } })
    expect(bad.status).toBe(422)
    expect(bad.body.data.code).toBe('invalid_pattern')
  })
})

describe('batch uploads', () => {
  it('accepts the same batch twice once, answering 200 both times', async () => {
    const runId = await newRun('retried batch')
    const first = await owner.json('POST', `/api/runs/${runId}/points`, batchBody(batches[0]!))
    expect(first.status).toBe(200)
    const again = await owner.json('POST', `/api/runs/${runId}/points`, batchBody(batches[0]!))
    expect(again.status).toBe(200)
    expect(again.body).toMatchObject({ accepted: true, duplicate: true, pointCount: first.body.pointCount })
    const [row] = await sqlOnServer(ctx.server, 'SELECT point_count AS c, (SELECT count(*) FROM run_points WHERE run_id = ? AND "index" >= 0) AS n FROM runs WHERE id = ?', [runId, runId])
    expect(row!.c).toBe(row!.n)
    // A batch overlapping stored points only in part is still a conflict.
    const mixed = { points: [...batches[0]!.points.slice(1), ...batches[1]!.points], specialPoints: [] }
    expect((await owner.json('POST', `/api/runs/${runId}/points`, mixed)).status).toBe(409)
  })
})

describe('idle runs', () => {
  it('ends a run nobody writes to as "interrupted", verified on what was saved, and restartable', async () => {
    const runId = await newRun('abandoned')
    expect((await owner.json('POST', `/api/runs/${runId}/points`, batchBody(batches[0]!))).status).toBe(200)
    const run = await until(async () => {
      const r = (await owner.json('GET', `/api/runs/${runId}`)).body
      return r.status === 'interrupted' ? r : undefined
    })
    expect(run.verification).toBe('verified')
    const last = batches[0]!.points.at(-1)!.index
    const child = await owner.json('POST', `/api/projects/${torusId}/runs`, { graphId: fermatGraph, name: 'resumed', settings: shear, parentRunId: runId, restartPointIndex: last })
    expect(child.status).toBe(201)
  })
})

describe('maps', () => {
  it('does not call a map with no solved cell verified', async () => {
    const settings = parseMapSettings({ plane: 'tau', x: { min: -0.5, max: 0.5, count: 3 }, y: { min: 0.8, max: 1.6, count: 2 } })
    const map = runMapSweep(fermat.document, settings)
    for (const row of map.rows) for (const c of row.cells) { c.status = 'unreachable'; delete c.u }
    const r = await owner.json('POST', `/api/projects/${torusId}/maps`, { graphId: fermatGraph, name: 'nothing solved', settings, result: map })
    expect(r.status).toBe(201)
    expect(r.body.verification).not.toBe('verified')
    expect(r.body.verificationReason).toMatch(/no solved cell/)
  })
})
