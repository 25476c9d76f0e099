/**
 * A census job cut off by a server restart: the next start marks it 'interrupted', and resume
 * finishes it on the same database without classifying the stored patterns again.
 */
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { enumerateCensus } from '../../shared/census/enumerate'
import { startServer, type TestServer } from '../support/server'
import { signInAs } from '../support/http'
import { waitForJob } from './census-support'

const dir = mkdtempSync(join(tmpdir(), 'wingfold-census-restart-'))
const env = { NUXT_DATABASE_URL: `file:${join(dir, 'wingfold.db')}` }
let second: TestServer | undefined
afterAll(async () => {
  await second?.stop()
  rmSync(dir, { recursive: true, force: true })
})

describe('census job across a restart', () => {
  it('is interrupted by the restart and resumes to the full census', async () => {
    const bounds = { maxTowers: 3, maxHalfEdges: 14 }
    const expected = new Set([...enumerateCensus(bounds)].map(p => p.code))
    const first = await startServer({ env })
    let id: number
    try {
      const owner = await signInAs(first.url, 'owner')
      id = (await owner.json('POST', '/api/census/jobs', bounds)).body.id
      await waitForJob(owner, id, j => j.classified >= 3)
    } finally {
      await first.stop()
    }
    second = await startServer({ env })
    const owner = await signInAs(second.url, 'owner')
    const after = (await owner.json('GET', `/api/census/jobs/${id}`)).body
    expect(after.status).toBe('interrupted')
    const stored = (await owner.json('GET', '/api/census/patterns?limit=1')).body.total as number
    expect(stored).toBeGreaterThanOrEqual(3)
    expect(stored).toBeLessThan(expected.size)
    expect((await owner.json('POST', `/api/census/jobs/${id}/resume`)).status).toBe(200)
    const done = await waitForJob(owner, id, j => j.status === 'done')
    expect(done.classified).toBe(expected.size - stored)
    const all = (await owner.json('GET', '/api/census/patterns?limit=500')).body
    expect(new Set(all.patterns.map((p: { code: string }) => p.code))).toEqual(expected)
  }, 150_000)
})
