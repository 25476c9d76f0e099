/** Password reset by e-mail: one answer for every address, single-use expiring links. */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signIn, signInAs, signUp, type ApiClient } from '../support/http'
import { lastMailId, linkIn, mailsTo, sqlOnServer, waitForMail } from './team-support'

const ctx = useTestServer()
let admin: ApiClient
const EMAIL = 'forgetful@example.org'

beforeAll(async () => {
  admin = await signInAs(ctx.server.url, 'admin')
  await signUp(ctx.server.url, 'Forgetful', EMAIL, 'the-first-passphrase')
})

async function requestReset(email: string) {
  const after = await lastMailId(admin)
  const res = await client(ctx.server.url).json('POST', '/api/auth/password-reset', { email })
  return { res, after }
}

describe('password reset', () => {
  it('gives the same answer for an unknown address as for a known one, and mails only the known one', async () => {
    const known = await requestReset(EMAIL)
    const unknown = await requestReset('nobody-here@example.org')
    expect(unknown.res.status).toBe(known.res.status)
    expect(unknown.res.body).toEqual(known.res.body)
    expect(known.res.body.message).toBe('If an account exists for this address, we have sent it a link to choose a new password.')
    await waitForMail(admin, m => m.id > known.after && m.toAddress.includes(EMAIL))
    expect(await mailsTo(admin, 'nobody-here@example.org')).toEqual([])
  })

  it('sets a new password once through the mailed link', async () => {
    const { after } = await requestReset(EMAIL)
    const mail = await waitForMail(admin, m => m.id > after && m.toAddress.includes(EMAIL))
    expect(mail.subject).toBe('Reset your Wingfold password')
    const { path, token } = linkIn(mail, 'reset-password')
    expect((await client(ctx.server.url).fetch(path)).status).toBe(200)
    const ok = await client(ctx.server.url).json('POST', `/api/auth/reset/${token}`, { password: 'the-second-passphrase' })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    await signIn(ctx.server.url, EMAIL, 'the-second-passphrase')
    expect((await client(ctx.server.url).json('POST', '/api/auth/sign-in', { email: EMAIL, password: 'the-first-passphrase' })).status).toBe(401)

    const again = await client(ctx.server.url).json('POST', `/api/auth/reset/${token}`, { password: 'the-third-passphrase' })
    expect(again.status).toBe(410)
    expect(again.body.data.code).toBe('reset_link_invalid')
  })

  it('refuses an expired link and a too-short password', async () => {
    const { after } = await requestReset(EMAIL)
    const { token } = linkIn(await waitForMail(admin, m => m.id > after && m.toAddress.includes(EMAIL)), 'reset-password')
    expect((await client(ctx.server.url).json('POST', `/api/auth/reset/${token}`, { password: 'short' })).status).toBe(400)
    await sqlOnServer(ctx.server, 'UPDATE password_resets SET expires_at = ? WHERE used_at IS NULL', [Date.now() - 1000])
    const res = await client(ctx.server.url).json('POST', `/api/auth/reset/${token}`, { password: 'the-fourth-passphrase' })
    expect(res.status).toBe(410)
    await signIn(ctx.server.url, EMAIL, 'the-second-passphrase')
  })

  it('stores only hashes of the links', async () => {
    const rows = await sqlOnServer(ctx.server, 'SELECT token_hash FROM password_resets')
    expect(rows.length).toBeGreaterThan(0)
    for (const r of rows) expect(r.token_hash).toMatch(/^[0-9a-f]{64}$/)
  })
})
