/** Real Chromium: a newcomer signs up, sees the empty projects list, creates a project, and the admin sees them. */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'

const ctx = useServerAndBrowser()

describe('sign-up to first project', () => {
  it('validates the sign-up form, signs up, shows the empty state and creates a project', async () => {
    const page = await ctx.browser.newPage()
    await gotoHydrated(page, `${ctx.server.url}/sign-up`)
    await page.fill('#name', 'Newcomer')
    await page.fill('#email', 'newcomer@example.org')
    await page.fill('#password', 'short')
    await page.click('button[type=submit]')
    expect(await page.textContent('[data-testid=sign-up-form]')).toContain('Use at least 10 characters.')

    await page.fill('#password', 'a-long-enough-passphrase')
    await Promise.all([page.waitForURL('**/projects'), page.click('button[type=submit]')])
    await page.waitForSelector('[data-testid=empty-state]')
    expect(await page.textContent('[data-testid=empty-state]')).toContain('No projects yet')
    await screenshot(page, 'projects-empty')

    await page.click('[data-testid=new-project]')
    await page.click('[data-testid=new-project-form] button[type=submit]')
    expect(await page.textContent('[data-testid=new-project-form]')).toContain('Give the project a name.')
    await page.fill('#project-name', 'Catenoid necks')
    await Promise.all([page.waitForURL(/\/projects\/\d+$/), page.click('[data-testid=new-project-form] button[type=submit]')])
    await page.waitForSelector('[data-testid=members-table]')
    expect(await page.textContent('[data-testid=project-name]')).toBe('Catenoid necks')
    expect(await page.textContent('[data-testid=graphs]')).toContain('No gluing patterns yet')
  })

  it('lists the newcomer on the admin users page, and keeps members off it', async () => {
    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'admin')
    await gotoHydrated(page, `${ctx.server.url}/admin/users`)
    await page.waitForSelector('[data-testid=users-table]')
    expect(await page.textContent('[data-testid=users-table]')).toContain('newcomer@example.org')
    await screenshot(page, 'admin-users')

    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'editor')
    const res = await page.goto(`${ctx.server.url}/admin/users`)
    expect(res?.status()).toBe(404)
  })
})
