/** Personal API tokens as Bearer credentials on the same API routes: scope, revocation, last use. */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, type ApiClient } from '../support/http'
import { sqlOnServer } from './team-support'
import { PATTERN_EXAMPLES } from '../../shared/examples'

const ctx = useTestServer()
let owner: ApiClient

beforeAll(async () => {
  owner = await signInAs(ctx.server.url, 'owner')
})

/** A request with only a bearer token (no cookie). */
async function withToken(token: string, method: string, path: string, body?: unknown) {
  const res = await fetch(new URL(path, ctx.server.url), {
    method,
    headers: { authorization: `Bearer ${token}`, ...(body ? { 'content-type': 'application/json' } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  })
  const text = await res.text()
  return { status: res.status, body: text ? JSON.parse(text) : null }
}

async function createToken(name: string, scope: 'read' | 'write') {
  const res = await owner.json('POST', '/api/account/tokens', { name, scope })
  expect(res.status).toBe(201)
  return res.body as { id: number, token: string, scope: string }
}

describe('API tokens', () => {
  it('shows a token once and stores only its hash', async () => {
    const created = await createToken('notebook', 'read')
    expect(created.token).toMatch(/^wfp_[A-Za-z0-9_-]{43}$/)
    const list = (await owner.json('GET', '/api/account/tokens')).body as Array<Record<string, unknown>>
    expect(list.find(t => t.id === created.id)).toMatchObject({ name: 'notebook', scope: 'read', lastUsedAt: null, revokedAt: null })
    expect(JSON.stringify(list)).not.toContain(created.token)
    const [row] = await sqlOnServer(ctx.server, 'SELECT token_hash FROM api_tokens WHERE id = ?', [created.id])
    expect(row!.token_hash).toMatch(/^[0-9a-f]{64}$/)
  })

  it('reads with a read-scoped token what the session reads, and records the last use', async () => {
    const { id, token } = await createToken('reader', 'read')
    const viaToken = await withToken(token, 'GET', '/api/projects')
    expect(viaToken.status).toBe(200)
    expect(viaToken.body).toEqual((await owner.json('GET', '/api/projects')).body)
    const list = (await owner.json('GET', '/api/account/tokens')).body as Array<{ id: number, lastUsedAt: string | null }>
    expect(list.find(t => t.id === id)!.lastUsedAt).not.toBeNull()
  })

  it('refuses every write with a read-scoped token', async () => {
    const { token } = await createToken('reader-2', 'read')
    const before = (await owner.json('GET', '/api/projects')).body.length
    const res = await withToken(token, 'POST', '/api/projects', { name: 'From a script' })
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('token_read_only')
    const projectId = (await owner.json('GET', '/api/projects')).body[0].id
    expect((await withToken(token, 'PATCH', `/api/projects/${projectId}/members/1`, { role: 'viewer' })).status).toBe(403)
    expect((await owner.json('GET', '/api/projects')).body.length).toBe(before)
  })

  it('writes with a read-write token', async () => {
    const { token } = await createToken('writer', 'write')
    const res = await withToken(token, 'POST', '/api/projects', { name: 'From a script' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect((await owner.json('GET', '/api/projects')).body.some((p: { name: string }) => p.name === 'From a script')).toBe(true)
  })

  it('refuses a revoked token and an unknown one', async () => {
    const { id, token } = await createToken('short-lived', 'write')
    expect((await withToken(token, 'GET', '/api/projects')).status).toBe(200)
    expect((await owner.json('DELETE', `/api/account/tokens/${id}`)).status).toBe(200)
    const res = await withToken(token, 'GET', '/api/projects')
    expect(res.status).toBe(401)
    expect(res.body.data.code).toBe('bad_token')
    expect((await withToken(`wfp_${'A'.repeat(43)}`, 'GET', '/api/projects')).status).toBe(401)
  })

  it('does not let a token manage tokens (the session is needed)', async () => {
    const { token } = await createToken('writer-2', 'write')
    expect((await withToken(token, 'POST', '/api/account/tokens', { name: 'more', scope: 'write' })).status).toBe(401)
    expect((await withToken(token, 'GET', '/api/account/tokens')).status).toBe(401)
  })

  it('lists and uploads patterns as docs/api.md shows, on the same routes as the app', async () => {
    const projectId = ((await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>).find(p => p.name === 'Genus-three torus gluings')!.id
    const reader = await createToken('lister', 'read')
    const listed = await withToken(reader.token, 'GET', `/api/projects/${projectId}/graphs`)
    expect(listed.status).toBe(200)
    expect(listed.body).toEqual((await owner.json('GET', `/api/projects/${projectId}/graphs`)).body)
    const example = PATTERN_EXAMPLES.find(e => e.document.space === 'torus')!
    const upload = { name: 'Uploaded by a script', message: 'From the notebook', document: example.document }
    expect((await withToken(reader.token, 'POST', `/api/projects/${projectId}/graphs`, upload)).status).toBe(403)
    const writer = await createToken('uploader', 'write')
    const created = await withToken(writer.token, 'POST', `/api/projects/${projectId}/graphs`, upload)
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    const after = (await withToken(reader.token, 'GET', `/api/projects/${projectId}/graphs`)).body as Array<{ id: number, name: string }>
    expect(after.find(g => g.id === created.body.id)?.name).toBe('Uploaded by a script')
  })
})
