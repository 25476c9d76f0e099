/** The comlink pattern worker is reachable from a page of the production build. */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot } from '../support/browser'

const ctx = useServerAndBrowser()

describe('pattern worker', () => {
  it('answers from inside a worker on the about page', async () => {
    const page = await ctx.browser.newPage()
    const workers: string[] = []
    page.on('worker', w => workers.push(w.url()))
    await gotoHydrated(page, `${ctx.server.url}/about`)
    const status = page.locator('[data-testid=worker-status]')
    await expect.poll(() => status.getAttribute('data-status'), { timeout: 20_000 }).not.toBe('checking')
    expect(await status.getAttribute('data-status')).toBe('ok')
    expect(workers.some(u => /pattern\.worker/.test(u))).toBe(true)
    // the square pair example is described by its authors as balanced and rigid (shared/examples)
    expect(await status.textContent()).toContain('balanced, rigid')
    expect(await page.textContent('[data-testid=caution]')).toContain('licensed review')
    await screenshot(page, 'about-worker')
  })
})
