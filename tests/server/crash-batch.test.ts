/**
 * Crash safety of batch uploads: the server is killed (SIGKILL) while it receives or stores a
 * batch, then restarted on the same SQLite file. The file passes `PRAGMA integrity_check`, every
 * run's point count equals its stored rows, and the retried batch is accepted (200: stored now,
 * or recognised as stored before).
 */
import { request } from 'node:http'
import { afterAll, describe, expect, it } from 'vitest'
import { startServer, type TestServer } from '../support/server'
import { signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { computeBatches, graphIdByName, projectIdByName } from './runs-helpers'
import { sqlOnServer } from './team-support'

const fermat = findPatternExample('fermat-pair')!
const settings = { path: { kind: 'shear' as const }, to: -2, stop: { maxPoints: 400 } }
const [batch] = computeBatches(fermat.document, settings, 400)
const body = JSON.stringify({ points: batch!.points, specialPoints: batch!.specialPoints })
let server: TestServer | undefined

afterAll(async () => { await server?.stop() })

/** Send the batch and SIGKILL the server once `fraction` of the body has been written. */
function uploadAndKill(s: TestServer, owner: ApiClient, runId: number, fraction: number): Promise<void> {
  const bytes = Buffer.from(body)
  const cut = Math.floor(bytes.length * fraction)
  return new Promise((resolve) => {
    const req = request(new URL(`/api/runs/${runId}/points`, s.url), {
      method: 'POST', headers: { 'content-type': 'application/json', 'content-length': bytes.length, cookie: owner.cookie() },
    })
    req.on('error', () => resolve()) // the connection dies with the server
    req.on('response', res => res.resume().on('end', () => resolve()))
    req.write(bytes.subarray(0, cut), () => {
      void s.kill().then(resolve)
      req.end(bytes.subarray(cut))
    })
  })
}

async function checkFile(s: TestServer) {
  expect(await sqlOnServer(s, 'PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }])
  const rows = await sqlOnServer(s, 'SELECT r.id, r.point_count AS c, r.special_count AS sc, (SELECT count(*) FROM run_points p WHERE p.run_id = r.id AND p."index" >= 0) AS n, (SELECT count(*) FROM run_points p WHERE p.run_id = r.id AND p."index" < 0) AS sn FROM runs r')
  for (const r of rows) {
    expect(r.c, `run ${r.id}`).toBe(r.n)
    expect(r.sc, `run ${r.id}`).toBe(r.sn)
  }
}

describe('a server killed during a batch upload', () => {
  it.each([0.5, 1])('keeps the file consistent and accepts the retried batch (killed at %s of the body)', async (fraction) => {
    expect(batch!.points.length).toBeGreaterThan(10)
    server = await startServer()
    let owner = await signInAs(server.url, 'owner')
    const project = await projectIdByName(owner, 'Genus-three torus gluings')
    const graphId = await graphIdByName(owner, project, fermat.title)
    const run = (await owner.json('POST', `/api/projects/${project}/runs`, { graphId, name: 'killed mid-batch', settings })).body as { id: number }
    await uploadAndKill(server, owner, run.id, fraction)
    await checkFile(server)
    server = await startServer({ dataDir: server.dataDir })
    await checkFile(server)
    owner = await signInAs(server.url, 'owner')
    const retry = await owner.json('POST', `/api/runs/${run.id}/points`, JSON.parse(body))
    expect(retry.status).toBe(200)
    expect(retry.body).toMatchObject({ accepted: true, pointCount: batch!.points.length })
    const again = await owner.json('POST', `/api/runs/${run.id}/points`, JSON.parse(body))
    expect(again.body).toMatchObject({ accepted: true, duplicate: true, pointCount: batch!.points.length })
    await checkFile(server)
    await server.stop()
    server = undefined
  }, 240_000)
})
