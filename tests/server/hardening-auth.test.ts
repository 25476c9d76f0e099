/**
 * Hardening of accounts: security mail that only its recipient can use, cross-site request
 * defence, revocable sessions, rate limits that never refuse a correct password because of other
 * accounts' failures, and small contract fixes (PATCH /api/account {} → 400, comments 401 → 404).
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, demo, signIn, signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { graphIdByName, projectIdByName } from './runs-helpers'
import { lastMailId, readMailbox, sqlOnServer, waitForMail } from './team-support'

const ctx = useTestServer({
  env: {
    NUXT_SIGN_IN_LIMIT_PER_ACCOUNT: '5',
    NUXT_SIGN_IN_LIMIT_FREE_ADDRESS_FAILURES: '3',
    NUXT_SIGN_IN_LIMIT_DELAY_BASE_MS: '10',
    NUXT_SIGN_IN_LIMIT_DELAY_MAX_MS: '80',
    NUXT_RESET_LIMIT_PER_ACCOUNT: '3',
  },
})
let admin: ApiClient

beforeAll(async () => { admin = await signInAs(ctx.server.url, 'admin') })

/** A request carrying exactly this cookie header (a replayed cookie). */
async function withCookie(cookie: string, method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
  const res = await fetch(new URL(path, ctx.server.url), {
    method,
    headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...headers },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  return res.status
}

/** Every `/<prefix>/<token>` path in a text. */
function pathsIn(text: string, prefix: string): string[] {
  return [...text.matchAll(new RegExp(`/${prefix}/([A-Za-z0-9_-]{20,})`, 'g'))].map(m => m[0])
}

describe('security mail in the outbox', () => {
  it('never shows an admin a working reset or invitation link; the recipient still gets one', async () => {
    const editor = demo('editor')
    const since = await lastMailId(admin)
    expect((await client(ctx.server.url).json('POST', '/api/auth/password-reset', { email: editor.email })).status).toBe(200)
    const owner = await signInAs(ctx.server.url, 'owner')
    const projects = (await owner.json('GET', '/api/projects')).body as Array<{ id: number }>
    expect((await owner.json('POST', `/api/projects/${projects[0]!.id}/invitations`, { email: 'newcomer@example.test', role: 'owner' })).status).toBe(201)
    const reset = await waitForMail(admin, m => m.id > since && m.kind === 'password-reset')
    const invite = await waitForMail(admin, m => m.id > since && m.kind === 'invitation')
    // Everything the admin routes return about these messages (list and each message):
    const list = JSON.stringify((await admin.json('GET', '/api/admin/outbox?pageSize=100')).body)
    const shownReset = (await admin.json('GET', `/api/admin/outbox/${reset.id}`)).body
    const shownInvite = (await admin.json('GET', `/api/admin/outbox/${invite.id}`)).body
    const seen = [list, JSON.stringify(shownReset), JSON.stringify(shownInvite)].join('\n')
    for (const path of pathsIn(seen, 'reset-password')) {
      const token = path.split('/').pop()!
      expect((await client(ctx.server.url).json('POST', `/api/auth/reset/${token}`, { password: 'taken-over-password' })).status).not.toBe(200)
    }
    for (const path of pathsIn(seen, 'invitations')) {
      const token = path.split('/').pop()!
      expect((await client(ctx.server.url).json('GET', `/api/invitations/${token}`)).status).not.toBe(200)
    }
    expect(shownReset.textBody).toContain('link sent only to the recipient')
    expect(shownInvite.htmlBody).toContain('link sent only to the recipient')
    // The stored row keeps no usable secret once delivered.
    const rows = await sqlOnServer(ctx.server, 'SELECT * FROM mail_messages WHERE id IN (?, ?)', [reset.id, invite.id])
    expect(pathsIn(JSON.stringify(rows), 'reset-password')).toEqual([])
    expect(pathsIn(JSON.stringify(rows), 'invitations')).toEqual([])
    // The recipient's mailbox holds the working link.
    const box = await readMailbox(ctx.server, editor.email)
    const link = pathsIn(box.map(m => m.text).join('\n'), 'reset-password')[0]
    expect(link).toBeTruthy()
    expect((await client(ctx.server.url).json('POST', `/api/auth/reset/${link!.split('/').pop()}`, { password: editor.password })).status).toBe(200)
  })
})

describe('cross-site requests', () => {
  it('refuses cookie requests from a foreign origin and bodies that are not JSON; bearer tokens pass', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const cookie = owner.cookie()
    const projectsBefore = (await owner.json('GET', '/api/projects')).body.length
    expect(await withCookie(cookie, 'POST', '/api/projects', { name: 'Forged' }, { origin: 'https://evil.example' })).toBe(403)
    expect(await withCookie(cookie, 'POST', '/api/projects', { name: 'Forged' }, { referer: 'https://evil.example/page' })).toBe(403)
    const projectId = (await owner.json('GET', '/api/projects')).body[0].id
    const form = await fetch(new URL(`/api/projects/${projectId}/invitations`, ctx.server.url), {
      method: 'POST', headers: { cookie, 'content-type': 'application/x-www-form-urlencoded' }, body: 'email=evil%40example.test&role=owner',
    })
    expect(form.status).toBe(415)
    const formForeign = await fetch(new URL(`/api/projects/${projectId}/invitations`, ctx.server.url), {
      method: 'POST', headers: { cookie, origin: 'https://evil.example', 'content-type': 'application/x-www-form-urlencoded' }, body: 'email=evil%40example.test&role=owner',
    })
    expect(formForeign.status).toBe(403)
    expect((await owner.json('GET', '/api/projects')).body.length).toBe(projectsBefore)
    expect(await withCookie(cookie, 'POST', '/api/projects', { name: 'Same origin' }, { origin: ctx.server.url })).toBe(201)
    const token = (await owner.json('POST', '/api/account/tokens', { name: 'script', scope: 'write' })).body.token as string
    const res = await fetch(new URL('/api/projects', ctx.server.url), {
      method: 'POST', headers: { authorization: `Bearer ${token}`, origin: 'https://elsewhere.example', 'content-type': 'application/json' }, body: JSON.stringify({ name: 'By token' }),
    })
    expect(res.status).toBe(201)
  })
})

describe('sessions', () => {
  it('a cookie replayed after sign-out no longer works', async () => {
    const viewer = await signInAs(ctx.server.url, 'viewer')
    const cookie = viewer.cookie()
    expect(await withCookie(cookie, 'GET', '/api/account')).toBe(200)
    expect((await viewer.json('POST', '/api/auth/sign-out')).status).toBe(200)
    expect(await withCookie(cookie, 'GET', '/api/account')).toBe(401)
  })

  it('a password change ends every other session; a reset ends all', async () => {
    const v = demo('viewer')
    const a = await signIn(ctx.server.url, v.email, v.password)
    const b = await signIn(ctx.server.url, v.email, v.password)
    const bCookie = b.cookie()
    expect((await a.json('POST', '/api/account/password', { currentPassword: v.password, newPassword: 'a-second-passphrase' })).status).toBe(200)
    expect(await withCookie(bCookie, 'GET', '/api/account')).toBe(401)
    expect((await a.json('GET', '/api/account')).status).toBe(200)
    const aCookie = a.cookie()
    const since = await lastMailId(admin)
    await client(ctx.server.url).json('POST', '/api/auth/password-reset', { email: v.email })
    await waitForMail(admin, m => m.id > since && m.kind === 'password-reset')
    const box = await readMailbox(ctx.server, v.email)
    const link = pathsIn(box.map(m => m.text).join('\n'), 'reset-password').pop()!
    expect((await client(ctx.server.url).json('POST', `/api/auth/reset/${link.split('/').pop()}`, { password: v.password })).status).toBe(200)
    expect(await withCookie(aCookie, 'GET', '/api/account')).toBe(401)
  })

  it('lists active sessions and signs out everywhere', async () => {
    const e = demo('editor')
    const a = await signIn(ctx.server.url, e.email, e.password)
    const b = await signIn(ctx.server.url, e.email, e.password)
    const list = (await a.json('GET', '/api/account/sessions')).body as Array<{ id: string, current: boolean }>
    expect(list.length).toBeGreaterThanOrEqual(2)
    expect(list.filter(s => s.current)).toHaveLength(1)
    const bCookie = b.cookie()
    expect((await a.json('DELETE', '/api/account/sessions')).status).toBe(200)
    expect(await withCookie(bCookie, 'GET', '/api/account')).toBe(401)
    expect((await a.json('GET', '/api/account')).status).toBe(401)
  })

  it('ends a session past its idle or absolute lifetime', async () => {
    const e = demo('editor')
    const a = await signIn(ctx.server.url, e.email, e.password)
    const [row] = await sqlOnServer(ctx.server, 'SELECT id FROM sessions ORDER BY created_at DESC LIMIT 1')
    await sqlOnServer(ctx.server, 'UPDATE sessions SET last_seen_at = ? WHERE id = ?', [Date.now() - 25 * 3_600_000, row!.id as string])
    expect((await a.json('GET', '/api/account')).status).toBe(401)
    const b = await signIn(ctx.server.url, e.email, e.password)
    const [row2] = await sqlOnServer(ctx.server, 'SELECT id FROM sessions ORDER BY created_at DESC LIMIT 1')
    await sqlOnServer(ctx.server, 'UPDATE sessions SET created_at = ? WHERE id = ?', [Date.now() - 8 * 86_400_000, row2!.id as string])
    expect((await b.json('GET', '/api/account')).status).toBe(401)
  })
})

describe('sign-in limits', () => {
  it('never refuses a correct password because of failures on other accounts from the same address', async () => {
    const anon = client(ctx.server.url)
    const delays: number[] = []
    for (let i = 0; i < 30; i++) {
      const res = await anon.fetch('/api/auth/sign-in', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: `nobody${i}@example.test`, password: 'wrong-password' }) })
      expect(res.status).toBe(401)
      delays.push(Number(res.headers.get('x-sign-in-delay-ms')))
    }
    // Growing delay, never a lock: 0 for the first free failures, then doubling up to the cap.
    expect(delays.slice(0, 3)).toEqual([0, 0, 0])
    for (let i = 1; i < delays.length; i++) expect(delays[i]).toBeGreaterThanOrEqual(delays[i - 1]!)
    expect(delays.at(-1)).toBe(80)
    const o = demo('owner')
    expect((await anon.json('POST', '/api/auth/sign-in', { email: o.email, password: o.password })).status).toBe(200)
  })

  it('locks an account after its own failures, and reset requests do not count as failures', async () => {
    const o = demo('owner')
    for (let i = 0; i < 3; i++) expect((await client(ctx.server.url).json('POST', '/api/auth/password-reset', { email: o.email })).status).toBe(200)
    // A separate limit for reset requests.
    expect((await client(ctx.server.url).json('POST', '/api/auth/password-reset', { email: o.email })).status).toBe(429)
    expect((await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email: o.email, password: o.password })).status).toBe(200)
    const target = 'lock-target@example.test'
    for (let i = 0; i < 5; i++) expect((await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email: target, password: 'wrong-password' })).status).toBe(401)
    expect((await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email: target, password: 'wrong-password' })).status).toBe(429)
  })
})

describe('contract fixes', () => {
  it('PATCH /api/account with no known field answers 400', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const res = await owner.json('PATCH', '/api/account', {})
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/nothing to change/i)
    expect((await owner.json('PATCH', '/api/account', { unknown: 1 })).status).toBe(400)
  })

  it('comment routes answer 401 first, then the same 404 for a missing and a hidden run', async () => {
    const anon = client(ctx.server.url)
    expect((await anon.json('GET', '/api/runs/999999/comments')).status).toBe(401)
    expect((await anon.json('POST', '/api/runs/999999/comments', { body: 'hi' })).status).toBe(401)
    const owner = await signInAs(ctx.server.url, 'owner')
    const torusId = await projectIdByName(owner, 'Genus-three torus gluings')
    const fermat = findPatternExample('fermat-pair')!
    const graphId = await graphIdByName(owner, torusId, fermat.title)
    const run = await owner.json('POST', `/api/projects/${torusId}/runs`, { graphId, name: 'hidden run', settings: { path: { kind: 'shear' }, to: -2, stop: { maxPoints: 5 } } })
    expect(run.status).toBe(201)
    expect((await anon.json('GET', `/api/runs/${run.body.id}/comments`)).status).toBe(401)
    const stranger = client(ctx.server.url)
    expect((await stranger.json('POST', '/api/auth/sign-up', { name: 'Stranger', email: 'stranger@example.test', password: 'a-long-test-passphrase' })).status).toBe(201)
    const missing = await stranger.json('GET', '/api/runs/999999/comments')
    const foreign = await stranger.json('GET', `/api/runs/${run.body.id}/comments`)
    expect(missing.status).toBe(404)
    expect(foreign.status).toBe(404)
    expect(foreign.body.message).toBe(missing.body.message)
  })
})
