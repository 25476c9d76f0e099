/**
 * Stored runs record the definition of vertical balance their verification used, and can be
 * re-verified on demand. Pattern: Meeks' two towers [H. Chen, M. Traizet, arXiv 2103.15676, 2021,
 * Ex. 7.1] in an acute lattice, where the equations on cuts (edges e2, e4 only) differ from the
 * earlier vertex sums; an α1 phase family of it is computed with the core and uploaded.
 */
import { createClient } from '@libsql/client'
import { join } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, type ApiClient } from '../support/http'
import { meeks } from '../unit/pattern/published-patterns'
import { computeBatches, projectIdByName } from './runs-helpers'

const ctx = useTestServer()
let editor: ApiClient, viewer: ApiClient
let projectId: number, graphId: number
const doc = meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3)
const settings = { path: { kind: 'alpha1' as const }, to: doc.phases!.alpha[0] + 0.3, stop: { maxPoints: 30 } }

beforeAll(async () => {
  ;[editor, viewer] = await Promise.all([signInAs(ctx.server.url, 'editor'), signInAs(ctx.server.url, 'viewer')])
  projectId = await projectIdByName(editor, 'Genus-three torus gluings')
  const g = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name: 'Meeks acute', document: doc })
  expect(g.status).toBe(201)
  graphId = g.body.id
})

describe('vertical-balance definition of stored runs', () => {
  it('records cuts-v1 on verification, shows an older row as the earlier definition, and re-verifies it on demand', async () => {
    const created = await editor.json('POST', `/api/projects/${projectId}/runs`, { graphId, name: 'alpha1 of Meeks', settings })
    expect(created.status).toBe(201)
    const runId = created.body.id as number
    for (const b of computeBatches(doc, settings, 10)) {
      const r = await editor.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })
      expect(r.status).toBe(200)
    }
    const done = await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    expect(done.body.verification).toBe('verified')
    expect(done.body.verticalBalance).toBe('cuts-v1')

    // a row verified before the column existed keeps NULL there (the migration adds it empty)
    const db = createClient({ url: `file:${join(ctx.server.dataDir, 'wingfold.db')}` })
    await db.execute({ sql: 'UPDATE runs SET vertical_balance = NULL WHERE id = ?', args: [runId] })
    db.close()
    expect((await viewer.json('GET', `/api/runs/${runId}`)).body.verticalBalance).toBeNull()

    expect((await viewer.json('POST', `/api/runs/${runId}/reverify`)).status).toBe(403)
    const again = await editor.json('POST', `/api/runs/${runId}/reverify`)
    expect(again.status).toBe(200)
    expect(again.body.verification).toBe('verified')
    expect(again.body.verticalBalance).toBe('cuts-v1')
    expect((await editor.json('POST', '/api/runs/999999/reverify')).status).toBe(404)
  })
})
