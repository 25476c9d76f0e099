/**
 * Invitations end to end through the in-process fake SMTP server: the owner invites, the test
 * reads the message from the outbox, follows the link and accepts; used, expired and withdrawn
 * links are refused; members cannot be invited twice; only owners invite.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signIn, signInAs, type ApiClient } from '../support/http'
import { lastMailId, linkIn, sqlOnServer, waitForMail } from './team-support'

const ctx = useTestServer()
let owner: ApiClient, admin: ApiClient, editor: ApiClient
let projectId: number

beforeAll(async () => {
  ;[owner, admin, editor] = await Promise.all([signInAs(ctx.server.url, 'owner'), signInAs(ctx.server.url, 'admin'), signInAs(ctx.server.url, 'editor')])
  const list = (await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
  projectId = list.find(p => p.name === 'Genus-three torus gluings')!.id
})

async function invite(email: string, role = 'viewer') {
  const after = await lastMailId(admin)
  const res = await owner.json('POST', `/api/projects/${projectId}/invitations`, { email, role })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  const mail = await waitForMail(admin, m => m.id > after && m.toAddress.includes(email) && m.kind === 'invitation')
  return { invitation: res.body, mail, ...linkIn(mail, 'invitations') }
}

describe('an invitation through the fake SMTP server', () => {
  it('reaches the outbox as received mail, and its link signs the invitee up into the project', async () => {
    const { mail, path, token } = await invite('newcomer@example.org', 'viewer')
    expect(mail.status).toBe('delivered')
    expect(mail.subject).toBe('Tomas Quillon invited you to “Genus-three torus gluings” on Wingfold')
    // the link is a page of the app
    const page = await client(ctx.server.url).fetch(path)
    expect(page.status).toBe(200)
    expect(await page.text()).toContain('<!DOCTYPE html>')

    const invitee = client(ctx.server.url)
    const preview = await invitee.json('GET', `/api/invitations/${token}`)
    expect(preview.body).toMatchObject({ projectName: 'Genus-three torus gluings', role: 'viewer', email: 'newcomer@example.org', inviterName: 'Tomas Quillon', accountExists: false })
    const accepted = await invitee.json('POST', `/api/invitations/${token}/accept`, { name: 'New Comer', password: 'a-long-new-passphrase' })
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200)
    expect(accepted.body).toEqual({ projectId, role: 'viewer' })
    const mine = (await invitee.json('GET', '/api/projects')).body as Array<{ id: number, role: string }>
    expect(mine.find(p => p.id === projectId)?.role).toBe('viewer')
    // a viewer cannot change the project's members
    expect((await invitee.json('POST', `/api/projects/${projectId}/invitations`, { email: 'x@example.org', role: 'viewer' })).status).toBe(403)
    // the new account signs in with the chosen password
    await signIn(ctx.server.url, 'newcomer@example.org', 'a-long-new-passphrase')

    const reused = await client(ctx.server.url).json('POST', `/api/invitations/${token}/accept`, { name: 'Someone', password: 'another-passphrase' })
    expect(reused.status).toBe(410)
    expect(reused.body.data.code).toBe('invitation_used')
    expect((await client(ctx.server.url).json('GET', `/api/invitations/${token}`)).status).toBe(410)

    const log = (await owner.json('GET', `/api/projects/${projectId}/activity/entries?verb=joined`)).body
    expect(log.items[0]).toMatchObject({ verb: 'joined', actor: 'New Comer', data: { role: 'viewer' } })
  })

  it('lets an existing account accept with its password', async () => {
    const { token } = await invite('admin@lanternbay.example', 'editor')
    const anon = client(ctx.server.url)
    expect((await anon.json('GET', `/api/invitations/${token}`)).body.accountExists).toBe(true)
    const wrong = await anon.json('POST', `/api/invitations/${token}/accept`, { password: 'not-the-password' })
    expect(wrong.status).toBe(401)
    const ok = await anon.json('POST', `/api/invitations/${token}/accept`, { password: 'demo-admin-2026' })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    expect((await admin.json('GET', `/api/projects/${projectId}`)).body.role).toBe('editor')
  })

  it('refuses an expired link', async () => {
    const { invitation, token } = await invite('late@example.org')
    await sqlOnServer(ctx.server, 'UPDATE invitations SET expires_at = ? WHERE id = ?', [Date.now() - 1000, invitation.id])
    const res = await client(ctx.server.url).json('POST', `/api/invitations/${token}/accept`, { name: 'Late', password: 'a-long-new-passphrase' })
    expect(res.status).toBe(410)
    expect(res.body.data.code).toBe('invitation_expired')
    const listed = (await owner.json('GET', `/api/projects/${projectId}/invitations`)).body as Array<{ id: number, state: string }>
    expect(listed.find(i => i.id === invitation.id)?.state).toBe('expired')
  })

  it('refuses an unknown token and a withdrawn invitation', async () => {
    expect((await client(ctx.server.url).json('GET', `/api/invitations/${'x'.repeat(43)}`)).status).toBe(404)
    const { invitation, token } = await invite('withdrawn@example.org')
    expect((await owner.json('DELETE', `/api/projects/${projectId}/invitations/${invitation.id}`)).status).toBe(200)
    const res = await client(ctx.server.url).json('GET', `/api/invitations/${token}`)
    expect(res.status).toBe(410)
    expect(res.body.data.code).toBe('invitation_revoked')
  })

  it('replaces an earlier pending invitation to the same address', async () => {
    const first = await invite('twice@example.org')
    const second = await invite('twice@example.org', 'editor')
    expect(second.token).not.toBe(first.token)
    expect((await client(ctx.server.url).json('GET', `/api/invitations/${first.token}`)).body.data.code).toBe('invitation_revoked')
    expect((await client(ctx.server.url).json('GET', `/api/invitations/${second.token}`)).body.role).toBe('editor')
  })

  it('refuses to invite an existing member, with a clear message', async () => {
    const res = await owner.json('POST', `/api/projects/${projectId}/invitations`, { email: 'viewer@lanternbay.example', role: 'editor' })
    expect(res.status).toBe(409)
    expect(res.body.data.code).toBe('already_member')
    expect(res.body.message).toBe('viewer@lanternbay.example is already a member of this project (viewer). Change their role in the member list instead.')
  })

  it('lets only owners invite or list invitations', async () => {
    expect((await editor.json('POST', `/api/projects/${projectId}/invitations`, { email: 'e@example.org', role: 'viewer' })).status).toBe(403)
    expect((await editor.json('GET', `/api/projects/${projectId}/invitations`)).status).toBe(403)
  })

  it('does not let a different signed-in account take the invitation', async () => {
    const { token } = await invite('someone-else@example.org')
    const res = await editor.json('POST', `/api/invitations/${token}/accept`, {})
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('wrong_account')
    // the link still works for the invited address
    expect((await client(ctx.server.url).json('GET', `/api/invitations/${token}`)).status).toBe(200)
  })
})
