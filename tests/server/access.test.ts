/** Project access by role against the built server: the one access helper's rules. */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signInAs, signUp, type ApiClient } from '../support/http'
import { PATTERN_EXAMPLES, findPatternExample } from '../../shared/examples'
import { analyzePattern } from '../../shared/pattern/analyze'
import { demoGraphsFor } from '../../server/db/demo-graphs'

const ctx = useTestServer()
let owner: ApiClient, editor: ApiClient, viewer: ApiClient, stranger: ApiClient, admin: ApiClient
let projectId: number
let viewerId: number

beforeAll(async () => {
  ;[owner, editor, viewer, admin] = await Promise.all([signInAs(ctx.server.url, 'owner'), signInAs(ctx.server.url, 'editor'), signInAs(ctx.server.url, 'viewer'), signInAs(ctx.server.url, 'admin')])
  stranger = await signUp(ctx.server.url, 'Stranger', 'stranger@example.org')
  const list = (await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
  projectId = list.find(p => p.name === 'Genus-three torus gluings')!.id
  const members = (await owner.json('GET', `/api/projects/${projectId}/members`)).body as Array<{ userId: number, role: string }>
  viewerId = members.find(m => m.role === 'viewer')!.userId
})

describe('seeing a project', () => {
  it('lists a project for its members with their role', async () => {
    for (const [c, role] of [[owner, 'owner'], [editor, 'editor'], [viewer, 'viewer']] as const) {
      const list = (await c.json('GET', '/api/projects')).body as Array<{ id: number, role: string }>
      expect(list.find(p => p.id === projectId)?.role).toBe(role)
    }
    // counts: three demo members (server/db/demo-data.ts) and the seeded torus patterns (server/db/demo-graphs.ts)
    const mine = ((await owner.json('GET', '/api/projects')).body as Array<{ id: number, memberCount: number, graphCount: number }>).find(p => p.id === projectId)!
    expect(mine.memberCount).toBe(3)
    expect(mine.graphCount).toBe(demoGraphsFor(0).length)
  })

  it('answers 404 to a stranger, the same as for a project that does not exist', async () => {
    const seen = await stranger.json('GET', `/api/projects/${projectId}`)
    const missing = await stranger.json('GET', '/api/projects/999999')
    expect(seen.status).toBe(404)
    expect(missing.status).toBe(404)
    expect(seen.body.message).toBe(missing.body.message)
    expect((await stranger.json('GET', `/api/projects/${projectId}/members`)).status).toBe(404)
    expect((await stranger.json('GET', '/api/projects')).body).toEqual([])
  })

  it('does not let a site admin who is not a member see the project', async () => {
    expect((await admin.json('GET', `/api/projects/${projectId}`)).status).toBe(404)
  })

  it('answers 401 without a session', async () => {
    expect((await client(ctx.server.url).json('GET', `/api/projects/${projectId}`)).status).toBe(401)
  })
})

describe('changing roles', () => {
  it('refuses a viewer with 403 and an editor with 403', async () => {
    const byViewer = await viewer.json('PATCH', `/api/projects/${projectId}/members/${viewerId}`, { role: 'owner' })
    expect(byViewer.status).toBe(403)
    expect(byViewer.body.data.code).toBe('role_too_low')
    expect((await editor.json('PATCH', `/api/projects/${projectId}/members/${viewerId}`, { role: 'editor' })).status).toBe(403)
    expect((await viewer.json('DELETE', `/api/projects/${projectId}/members/${viewerId}`)).status).toBe(403)
  })

  it('answers 404 to a stranger trying to change a role', async () => {
    expect((await stranger.json('PATCH', `/api/projects/${projectId}/members/${viewerId}`, { role: 'owner' })).status).toBe(404)
  })

  it('lets the owner promote, demote and remove, and logs it', async () => {
    expect((await owner.json('PATCH', `/api/projects/${projectId}/members/${viewerId}`, { role: 'editor' })).status).toBe(200)
    const members = (await owner.json('GET', `/api/projects/${projectId}/members`)).body as Array<{ userId: number, role: string }>
    expect(members.find(m => m.userId === viewerId)?.role).toBe('editor')
    expect((await owner.json('PATCH', `/api/projects/${projectId}/members/${viewerId}`, { role: 'viewer' })).status).toBe(200)
    expect((await owner.json('PATCH', `/api/projects/${projectId}/members/${viewerId}`, { role: 'boss' })).status).toBe(400)

    const created = (await owner.json('POST', '/api/projects', { name: 'Scratch project' })).body as { id: number }
    const me = (await owner.json('GET', '/api/account')).body as { id: number }
    // the only owner cannot step down
    const last = await owner.json('PATCH', `/api/projects/${created.id}/members/${me.id}`, { role: 'viewer' })
    expect(last.status).toBe(409)
    expect((await owner.json('DELETE', `/api/projects/${created.id}/members/${me.id}`)).status).toBe(409)

    const activity = (await owner.json('GET', `/api/projects/${projectId}/activity`)).body as { days: Array<{ count: number }> }
    expect(activity.days).toHaveLength(14)
    expect(activity.days.reduce((s, d) => s + d.count, 0)).toBeGreaterThanOrEqual(3)
  })

  it('lets the owner remove a member, who then gets 404', async () => {
    const list = (await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
    const second = list.find(p => p.name === 'Open-wing towers in the plane')!.id
    const editorId = ((await editor.json('GET', '/api/account')).body as { id: number }).id
    expect((await editor.json('GET', `/api/projects/${second}`)).status).toBe(200)
    expect((await owner.json('DELETE', `/api/projects/${second}/members/${editorId}`)).status).toBe(200)
    expect((await editor.json('GET', `/api/projects/${second}`)).status).toBe(404)
    expect((await owner.json('DELETE', `/api/projects/${second}/members/${editorId}`)).status).toBe(404)
  })
})

describe('creating projects', () => {
  it('makes the creator owner and validates the name', async () => {
    const res = await stranger.json('POST', '/api/projects', { name: '  Stranger lab  ', description: 'mine' })
    expect(res.status).toBe(201)
    const detail = await stranger.json('GET', `/api/projects/${res.body.id}`)
    expect(detail.body).toMatchObject({ name: 'Stranger lab', role: 'owner' })
    expect((await stranger.json('POST', '/api/projects', { name: '' })).status).toBe(400)
    expect((await owner.json('GET', `/api/projects/${res.body.id}`)).status).toBe(404)
  })
})

describe('graphs of a project', () => {
  it('lists the seeded example patterns with their stored summaries, for members only', async () => {
    const graphs = await viewer.json('GET', `/api/projects/${projectId}/graphs`)
    expect(graphs.status).toBe(200)
    // every torus example plus the demo drafts (server/db/demo-graphs.ts)
    expect(graphs.body).toHaveLength(demoGraphsFor(0).length)
    expect(PATTERN_EXAMPLES.filter(e => e.document.space === 'torus').length).toBeLessThan(demoGraphsFor(0).length)
    const squarePair = (graphs.body as Array<{ name: string, version: number, summary: Record<string, unknown> }>)
      .find(g => g.name === findPatternExample('square-pair')!.title)!
    expect(squarePair.version).toBe(1)
    // the stored summary is the core's own summary of the same document (round trip through the DB)
    expect(squarePair.summary).toEqual(JSON.parse(JSON.stringify(analyzePattern(findPatternExample('square-pair')!.document).summary)))
    expect((await stranger.json('GET', `/api/projects/${projectId}/graphs`)).status).toBe(404)
  })
})
