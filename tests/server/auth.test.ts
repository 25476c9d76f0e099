/** Accounts against the built server: sign-up, sign-in, wrong password, sign-out, rate limits. */
import { describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, demo, signIn, signUp } from '../support/http'

const ctx = useTestServer()

describe('sign-up', () => {
  it('creates a member account, signs it in and lowercases the e-mail', async () => {
    const c = client(ctx.server.url)
    const res = await c.json('POST', '/api/auth/sign-up', { name: 'Test Person', email: 'New.Person@Example.org', password: 'a-long-test-passphrase' })
    expect(res.status).toBe(201)
    expect(res.body.user).toMatchObject({ email: 'new.person@example.org', name: 'Test Person', siteRole: 'member' })
    const me = await c.json('GET', '/api/account')
    expect(me.status).toBe(200)
    expect(me.body.email).toBe('new.person@example.org')
  })

  it('rejects a duplicate e-mail with 409 and a short password with 400', async () => {
    const dup = await client(ctx.server.url).json('POST', '/api/auth/sign-up', { name: 'X', email: demo('editor').email, password: 'a-long-test-passphrase' })
    expect(dup.status).toBe(409)
    const short = await client(ctx.server.url).json('POST', '/api/auth/sign-up', { name: 'X', email: 'short@example.org', password: 'short' })
    expect(short.status).toBe(400)
  })

  it('is refused with 403 once an admin switches sign-up off', async () => {
    const admin = await signIn(ctx.server.url, demo('admin').email, demo('admin').password)
    expect((await admin.json('PATCH', '/api/admin/settings', { signupEnabled: false })).status).toBe(200)
    expect((await client(ctx.server.url).json('GET', '/api/auth/settings')).body).toEqual({ signupEnabled: false })
    const res = await client(ctx.server.url).json('POST', '/api/auth/sign-up', { name: 'Late', email: 'late@example.org', password: 'a-long-test-passphrase' })
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('signup_closed')
    await admin.json('PATCH', '/api/admin/settings', { signupEnabled: true })
    await signUp(ctx.server.url, 'Late', 'late@example.org')
  })
})

describe('sign-in', () => {
  it('accepts the demo owner and carries id and site role in the session', async () => {
    const c = await signIn(ctx.server.url, demo('owner').email, demo('owner').password)
    const session = await c.json('GET', '/api/_auth/session')
    expect(session.body.user).toMatchObject({ email: demo('owner').email, siteRole: 'member' })
    expect(typeof session.body.user.id).toBe('number')
  })

  it('answers 401 to a wrong password and to an unknown account, with the same message', async () => {
    const wrong = await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email: demo('viewer').email, password: 'not-the-password' })
    const unknown = await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email: 'nobody@example.org', password: 'whatever-it-is' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.message).toBe(unknown.body.message)
  })

  it('signs out: the session cookie no longer opens the account', async () => {
    const c = await signIn(ctx.server.url, demo('editor').email, demo('editor').password)
    expect((await c.json('GET', '/api/account')).status).toBe(200)
    expect((await c.json('POST', '/api/auth/sign-out')).status).toBe(200)
    expect((await c.json('GET', '/api/account')).status).toBe(401)
  })

  it('locks an account with 429 after 5 failures, even for the right password', async () => {
    const email = 'locked@example.org'
    await signUp(ctx.server.url, 'Locked Out', email, 'the-right-passphrase')
    for (let i = 0; i < 5; i++) {
      expect((await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email, password: `wrong-${i}` })).status).toBe(401)
    }
    const blocked = await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email, password: 'the-right-passphrase' })
    expect(blocked.status).toBe(429)
    expect(blocked.body.message).toMatch(/Too many failed sign-ins/)
    // other accounts from the same address are not affected by this account's limit
    await signIn(ctx.server.url, demo('viewer').email, demo('viewer').password)
  })
})
