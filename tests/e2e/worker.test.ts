/** The comlink pattern worker is reachable from a page of the production build. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type TestServer } from '../support/server'
import { gotoHydrated, launchBrowser, screenshot, type TestBrowser } from '../support/browser'

let server: TestServer
let browser: TestBrowser
beforeAll(async () => { [server, browser] = await Promise.all([startServer(), launchBrowser()]) })
afterAll(async () => { await browser?.close(); await server?.stop() })

describe('pattern worker', () => {
  it('answers from inside a worker on the about page', async () => {
    const page = await browser.newPage()
    const workers: string[] = []
    page.on('worker', w => workers.push(w.url()))
    await gotoHydrated(page, `${server.url}/about`)
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
