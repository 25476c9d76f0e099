/** Admin-only routes and the account page's routes against the built server. */
import { describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, DEMO_ACCOUNTS, demo, signIn, signInAs, signUp } from '../support/http'

const ctx = useTestServer()

describe('admin pages', () => {
  it('lists every account to the admin', async () => {
    const admin = await signInAs(ctx.server.url, 'admin')
    const res = await admin.json('GET', '/api/admin/users')
    expect(res.status).toBe(200)
    const rows = res.body as Array<{ email: string, projectCount: number }>
    for (const a of DEMO_ACCOUNTS) expect(rows.map(u => u.email)).toContain(a.email)
    // memberships of the demo seed (server/db/demo-data.ts): owner 2, editor 2, viewer 1, admin 0
    const countOf = (key: Parameters<typeof demo>[0]) => rows.find(u => u.email === demo(key).email)!.projectCount
    expect([countOf('owner'), countOf('editor'), countOf('viewer'), countOf('admin')]).toEqual([2, 2, 1, 0])
  })

  it('refuses members with 403 and visitors with 401', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    expect((await owner.json('GET', '/api/admin/users')).status).toBe(403)
    expect((await owner.json('PATCH', '/api/admin/settings', { signupEnabled: false })).status).toBe(403)
    expect((await client(ctx.server.url).json('GET', '/api/admin/users')).status).toBe(401)
  })

  it('keeps the admin page itself away from members (rendered 404)', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    expect((await owner.fetch('/admin/users')).status).toBe(404)
    const admin = await signInAs(ctx.server.url, 'admin')
    const page = await admin.fetch('/admin/users')
    expect(page.status).toBe(200)
    expect(await page.text()).toContain(demo('viewer').email)
  })
})

describe('account', () => {
  it('changes name, notification choice and password', async () => {
    const c = await signUp(ctx.server.url, 'Before', 'renamer@example.org', 'first-passphrase-1')
    const patched = await c.json('PATCH', '/api/account', { name: 'After', notifyOptOut: true })
    expect(patched.body).toEqual({ name: 'After', notifyOptOut: true })
    expect((await c.json('POST', '/api/account/password', { currentPassword: 'wrong-one', newPassword: 'second-passphrase-2' })).status).toBe(400)
    expect((await c.json('POST', '/api/account/password', { currentPassword: 'first-passphrase-1', newPassword: 'second-passphrase-2' })).status).toBe(200)
    await signIn(ctx.server.url, 'renamer@example.org', 'second-passphrase-2')
  })
})
