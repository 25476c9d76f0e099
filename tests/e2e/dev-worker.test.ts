/** The comlink pattern worker is reachable from a page under `nuxt dev` too (not only the build). */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated } from '../support/browser'

const ctx = useServerAndBrowser({ mode: 'dev' })

describe('pattern worker in nuxt dev', () => {
  it('answers from inside a worker on the about page', async () => {
    const page = await ctx.browser.newPage()
    const log: string[] = []
    page.on('console', m => log.push(`${m.type()}: ${m.text()}`))
    // the first visit compiles the page and may trigger one dependency re-optimisation reload
    await gotoHydrated(page, `${ctx.server.url}/about`, 150_000)
    const status = page.locator('[data-testid=worker-status]')
    await expect.poll(() => status.getAttribute('data-status'), { timeout: 60_000 }).not.toBe('checking')
    expect(await status.getAttribute('data-status'), log.join('\n')).toBe('ok')
    expect(await status.textContent()).toContain('analysed in a worker')
  }, 240_000)
})
