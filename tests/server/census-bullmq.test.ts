/**
 * The same census job on BullMQ: a real Redis server (Debian's redis-server, started here on a
 * free loopback port), the web server configured with its URL, and one worker process
 * (`server/jobs/census-worker.ts`) running the job in a sandboxed processor.
 */
import { spawn, type ChildProcess } from 'node:child_process'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { enumerateCensus } from '../../shared/census/enumerate'
import { startRedis, type TestRedis } from '../support/redis'
import { ROOT, startServer, type TestServer } from '../support/server'
import { signInAs, type ApiClient } from '../support/http'
import { waitForJob } from './census-support'

let redis: TestRedis
let server: TestServer
let worker: ChildProcess
let workerLog = ''
let owner: ApiClient

beforeAll(async () => {
  redis = await startRedis()
  server = await startServer({ env: { NUXT_CENSUS_REDIS_URL: redis.url } })
  owner = await signInAs(server.url, 'owner')
  worker = spawn(process.execPath, ['--import', 'tsx', 'server/jobs/census-worker.ts'], {
    cwd: ROOT, env: { ...process.env, WINGFOLD_CENSUS_REDIS_URL: redis.url }, stdio: ['ignore', 'pipe', 'pipe'], detached: true,
  })
  worker.stdout!.on('data', (b: Buffer) => { workerLog += b.toString() })
  worker.stderr!.on('data', (b: Buffer) => { workerLog += b.toString() })
  await new Promise<void>((resolve, reject) => {
    const check = setInterval(() => { if (workerLog.includes('census worker ready')) { clearInterval(check); resolve() } }, 50)
    worker.once('exit', (code) => { clearInterval(check); reject(new Error(`worker exited ${code}: ${workerLog}`)) })
  })
}, 120_000)

afterAll(async () => {
  if (worker?.pid && worker.exitCode === null) {
    const gone = new Promise(resolve => worker.once('exit', resolve))
    process.kill(-worker.pid, 'SIGTERM')
    await gone
  }
  await server?.stop()
  await redis?.stop()
})

describe('census job on BullMQ workers', () => {
  it('runs on the worker and stores one row per class of the core enumeration', async () => {
    const bounds = { maxTowers: 3, maxHalfEdges: 12 }
    const expected = new Set([...enumerateCensus(bounds)].map(p => p.code))
    const start = await owner.json('POST', '/api/census/jobs', bounds)
    expect(start.status).toBe(201)
    expect(start.body.queue).toBe('bullmq')
    const done = await waitForJob(owner, start.body.id, j => j.status === 'done' || j.status === 'failed')
    expect(done.error).toBeNull()
    expect(done.status).toBe('done')
    expect(done.classified).toBe(expected.size)
    const all = (await owner.json('GET', '/api/census/patterns?limit=500')).body
    expect(new Set(all.patterns.map((p: { code: string }) => p.code))).toEqual(expected)
    // H. Chen, M. Traizet (2021), Theorem C.1: the two genus-3 graphs
    expect((await owner.json('GET', '/api/census/patterns?genus=3')).body.total).toBe(2)
  }, 90_000)

  it('cancels on the worker and resumes where it stopped', async () => {
    const bounds = { maxTowers: 3, maxHalfEdges: 14 }
    const expected = new Set([...enumerateCensus(bounds)].map(p => p.code))
    const before = (await owner.json('GET', '/api/census/patterns?limit=1')).body.total as number
    const id = (await owner.json('POST', '/api/census/jobs', bounds)).body.id as number
    await waitForJob(owner, id, j => j.classified >= 3)
    expect((await owner.json('POST', `/api/census/jobs/${id}/cancel`)).status).toBe(200)
    await waitForJob(owner, id, j => j.status === 'cancelled')
    const partial = (await owner.json('GET', '/api/census/patterns?limit=1')).body.total as number
    expect(partial).toBeLessThan(expected.size)
    expect(partial).toBeGreaterThan(before)
    expect((await owner.json('POST', `/api/census/jobs/${id}/resume`)).status).toBe(200)
    await waitForJob(owner, id, j => j.status === 'done')
    expect((await owner.json('GET', '/api/census/patterns?limit=1')).body.total).toBe(expected.size)
  }, 120_000)
})
