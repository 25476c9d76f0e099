/**
 * Mail delivery failures: with an SMTP server that cannot be reached, the invitation is still
 * made, and its message is retried with backoff and then shown as failed, with the error, in the
 * outbox; an admin can queue it again.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { freePort } from '../support/server'
import { signInAs, type ApiClient } from '../support/http'
import { waitForMail } from './team-support'

// A port nobody listens on (asked from the OS, then released): connections are refused.
const port = await freePort()
const ctx = useTestServer({ env: { NUXT_SMTP_URL: `smtp://127.0.0.1:${port}`, NUXT_MAIL_MAX_ATTEMPTS: '2', NUXT_MAIL_RETRY_SECONDS: '1' } })
let owner: ApiClient, admin: ApiClient
let projectId: number

beforeAll(async () => {
  ;[owner, admin] = await Promise.all([signInAs(ctx.server.url, 'owner'), signInAs(ctx.server.url, 'admin')])
  projectId = ((await owner.json('GET', '/api/projects')).body as Array<{ id: number }>)[0]!.id
})

describe('when the SMTP server cannot be reached', () => {
  it('keeps the invitation, retries the message, then shows it failed with the error', async () => {
    const res = await owner.json('POST', `/api/projects/${projectId}/invitations`, { email: 'unlucky@example.org', role: 'viewer' })
    expect(res.status).toBe(201)
    const listed = (await owner.json('GET', `/api/projects/${projectId}/invitations`)).body as Array<{ email: string, state: string }>
    expect(listed.find(i => i.email === 'unlucky@example.org')?.state).toBe('pending')

    const retrying = await waitForMail(admin, m => m.toAddress === 'unlucky@example.org', ['retrying'])
    expect(retrying.attempts).toBe(1)
    expect(retrying.error).toMatch(/ECONNREFUSED|connect/i)
    // second attempt after the 1 s backoff, on the outbox timer (5 s tick)
    const failed = await waitForMail(admin, m => m.toAddress === 'unlucky@example.org', ['failed'], 30_000)
    expect(failed.attempts).toBe(2)
    // the outbox shows the message without its single-use link (kept only for delivery)
    expect(failed.textBody).toContain('[link sent only to the recipient]')
    expect(failed.textBody).not.toContain('/invitations/')

    const again = await admin.json('POST', `/api/admin/outbox/${failed.id}/retry`)
    expect(again.status).toBe(200)
    const retried = await waitForMail(admin, m => m.id === failed.id, ['retrying', 'failed'])
    expect(retried.attempts).toBe(1)
    expect((await admin.json('POST', `/api/admin/outbox/${failed.id}/retry`)).status).toBe(200)
  })

  it('keeps the outbox for admins only', async () => {
    expect((await owner.json('GET', '/api/admin/outbox')).status).toBe(403)
  })
})
