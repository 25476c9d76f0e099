/**
 * Real Chromium: the demo owner invites a new address as viewer from the project page, the
 * message reaches the in-process fake SMTP server, the invitee opens the link from the e-mail,
 * creates an account, lands on the project and sees it read-only. Screenshots in tests/artifacts/.
 */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { linkIn, waitForMail } from '../server/team-support'

const ctx = useServerAndBrowser()
const INVITEE = 'coauthor@example.org'

describe('inviting a coauthor by e-mail', () => {
  it('invites, accepts from the mailed link, and shows the project read-only', async () => {
    const [owner, admin] = await Promise.all([signInAs(ctx.server.url, 'owner'), signInAs(ctx.server.url, 'admin')])
    const project = ((await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>).find(p => p.name === 'Genus-three torus gluings')!

    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${project.id}`)
    await page.fill('#invite-email', INVITEE)
    await page.selectOption('#invite-role', 'viewer')
    await page.click('[data-testid=invite-form] button[type=submit]')
    await page.waitForSelector(`text=Invitation sent to ${INVITEE}.`)
    await expect.poll(() => page.textContent('[data-testid=invitations-table]')).toContain(INVITEE)
    await page.locator('[data-testid=invitations]').scrollIntoViewIfNeeded()
    await screenshot(page, 'invite-1-owner-sent')

    // the message as the fake SMTP server received it, and as the admin outbox page shows it (without its link)
    const mail = await waitForMail(admin, m => m.toAddress.includes(INVITEE) && m.kind === 'invitation')
    const { path } = linkIn(mail, 'invitations')
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'admin')
    await gotoHydrated(page, `${ctx.server.url}/admin/outbox`)
    await page.click(`[data-testid=outbox-table] tr:has-text("${INVITEE}")`)
    await page.waitForSelector('[data-testid=outbox-message] iframe')
    const shown = page.frameLocator('[data-testid=outbox-message] iframe').locator('body')
    expect(await shown.textContent()).toContain('[link sent only to the recipient]')
    expect(await shown.innerHTML()).not.toContain(path)
    await screenshot(page, 'invite-2-outbox')

    // the invitee, signed out, follows the link from the e-mail
    await ctx.browser.context.clearCookies()
    await gotoHydrated(page, `${ctx.server.url}${path}`)
    expect(await page.textContent('[data-testid=accept-form]')).toContain('Genus-three torus gluings')
    await page.fill('#name', 'Invited Coauthor')
    await page.fill('#password', 'a-long-coauthor-passphrase')
    await screenshot(page, 'invite-3-accept')
    await Promise.all([page.waitForURL(`**/projects/${project.id}`), page.click('[data-testid=accept-form] button[type=submit]')])
    await page.waitForSelector('[data-testid=members-table]')

    // read-only: viewer badge, no role selectors, no invitation panel, writes refused by the API
    expect(await page.textContent('[data-testid=project-name]')).toBe('Genus-three torus gluings')
    expect(await page.textContent('[data-testid=nav-account]')).toContain('Invited Coauthor')
    expect(await page.locator('main span', { hasText: /^viewer$/ }).count()).toBeGreaterThan(0)
    expect(await page.locator('[data-testid=members-table] select').count()).toBe(0)
    expect(await page.locator('[data-testid=invite-form]').count()).toBe(0)
    expect(await page.textContent('[data-testid=members-table]')).toContain(INVITEE)
    const write = await page.request.post(`${ctx.server.url}/api/projects/${project.id}/invitations`, { data: { email: 'x@example.org', role: 'viewer' } })
    expect(write.status()).toBe(403)
    await page.waitForSelector('[data-testid=activity-log] td:has-text("joined")')
    await screenshot(page, 'invite-4-invitee-read-only')
  })

  it('creates an API token on the account page, shows it once, and the token reads the API', async () => {
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/account`)
    await page.fill('#token-name', 'analysis notebook')
    await page.selectOption('#token-scope', 'read')
    await page.click('[data-testid=tokens] button[type=submit]')
    const token = (await page.textContent('[data-testid=new-token] code'))!.trim()
    expect(token).toMatch(/^wfp_/)
    const res = await fetch(`${ctx.server.url}/api/projects`, { headers: { authorization: `Bearer ${token}` } })
    expect(res.status).toBe(200)
    expect(((await res.json()) as unknown[]).length).toBe(2)
    await page.locator('[data-testid=tokens]').scrollIntoViewIfNeeded()
    await screenshot(page, 'invite-5-account-token')
    // reloaded, the page lists the token but no longer shows it
    await gotoHydrated(page, `${ctx.server.url}/account`)
    expect(await page.textContent('[data-testid=tokens]')).toContain('analysis notebook')
    expect(await page.locator('[data-testid=new-token]').count()).toBe(0)
    expect(await page.content()).not.toContain(token)
  })
})
