/** Real Chromium against the built server: the demo owner signs in and opens a project. */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { demo } from '../support/http'

const ctx = useServerAndBrowser()

describe('signed-in project page', () => {
  it('signs in through the form, lists projects, opens one and shows the members table', async () => {
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'owner')
    await page.waitForSelector('[data-testid=projects-table]')
    expect(await page.locator('[data-testid=projects-table] tbody tr').count()).toBe(2)

    // sorting: name ascending first, one click on the header reverses it
    const firstName = () => page.locator('[data-testid=projects-table] tbody tr td:first-child a').first().textContent()
    expect(await firstName()).toBe('Genus-three torus gluings')
    await page.click('[data-testid=projects-table] th:first-child button')
    await expect.poll(firstName).toBe('Open-wing towers in the plane')

    // filtering narrows the table
    await page.fill('[data-testid=project-filter]', 'open-wing')
    await expect.poll(() => page.locator('[data-testid=projects-table] tbody tr').count()).toBe(1)
    await screenshot(page, 'projects-list')

    await page.click('text=Open-wing towers in the plane')
    await page.waitForSelector('[data-testid=members-table]')
    expect(await page.textContent('[data-testid=project-name]')).toBe('Open-wing towers in the plane')
    const rows = page.locator('[data-testid=members-table] tbody tr')
    expect(await rows.count()).toBe(2)
    expect(await page.textContent('[data-testid=members-table]')).toContain(demo('editor').email)
    // owner sees role selectors
    expect(await page.locator('[data-testid=members-table] select').count()).toBe(2)
    await page.waitForSelector('[data-testid=activity-chart] canvas')

    // the theme is applied: Space Grotesk is the body font and has loaded
    const font = await page.evaluate(() => getComputedStyle(document.body).fontFamily)
    expect(font).toContain('Space Grotesk')
    expect(await page.evaluate(async () => { await document.fonts.ready; return document.fonts.check('16px "Space Grotesk"') })).toBe(true)
    await screenshot(page, 'project-page')
  })

  it('shows the members table read-only to a viewer, and a not-found page for other projects', async () => {
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'viewer')
    await page.click('text=Genus-three torus gluings')
    await page.waitForSelector('[data-testid=members-table]')
    expect(await page.locator('[data-testid=members-table] select').count()).toBe(0)
    expect(await page.textContent('[data-testid=members]')).toContain('Only owners change roles.')
    // verdict badges from the stored summaries, with the evidence note beside them
    expect(await page.locator('[data-testid=graphs-list] li').count()).toBeGreaterThan(1)
    expect(await page.textContent('[data-testid=graphs]')).toContain('Results are numerical evidence, not proofs.')
    await screenshot(page, 'project-page-viewer')
    // the viewer is not a member of the second seeded project (id 2): same page as a missing one
    const res = await page.goto(`${ctx.server.url}/projects/2`)
    expect(res?.status()).toBe(404)
    await page.waitForSelector('[data-testid=error-page]')
    expect(await page.textContent('[data-testid=error-page]')).toContain('Not found')
  })

  it('shows validation and server messages on the sign-in form', async () => {
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await gotoHydrated(page, `${ctx.server.url}/sign-in`)
    await page.click('button[type=submit]')
    expect(await page.textContent('[data-testid=sign-in-form]')).toContain('Enter a valid e-mail address.')
    await page.fill('#email', demo('viewer').email)
    await page.fill('#password', 'not-the-password')
    await page.click('button[type=submit]')
    await page.waitForSelector('[data-testid=error-state]')
    expect(await page.textContent('[data-testid=error-state]')).toContain('Wrong e-mail or password.')
    await screenshot(page, 'sign-in-error')
  })
})
