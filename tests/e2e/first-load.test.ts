/**
 * First load stays light: the JavaScript a fresh visit downloads on the sign-in page and on the
 * project list, summed over every script response and compressed with gzip (level 9, what a
 * compressing proxy would send; the target is 250 KB). Charts (ECharts), the workers and the
 * numerical core load only on the pages that use them. The figures are printed.
 */
import { gzipSync } from 'node:zlib'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, signInWithForm } from '../support/browser'

const ctx = useServerAndBrowser()

/** Records every script response of `page` (cache disabled) until stopped. */
async function recordScripts(page: Page): Promise<() => Promise<{ files: number; raw: number; gzip: number; largest: string }>> {
  const cdp = await page.context().newCDPSession(page)
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true })
  const bodies: Promise<{ url: string; body: Buffer } | null>[] = []
  const onResponse = (r: Awaited<ReturnType<Page['waitForResponse']>>) => {
    if (r.request().resourceType() !== 'script') return
    bodies.push(r.body().then(body => ({ url: r.url(), body }), () => null))
  }
  page.on('response', onResponse)
  return async () => {
    page.off('response', onResponse)
    const got = (await Promise.all(bodies)).filter(b => b !== null)
    let raw = 0, gzip = 0, largest = '', largestSize = 0
    for (const b of got) {
      const z = gzipSync(b.body, { level: 9 }).length
      raw += b.body.length; gzip += z
      if (z > largestSize) { largestSize = z; largest = `${b.url.split('/').pop()} ${(z / 1024).toFixed(0)} KB` }
    }
    return { files: got.length, raw, gzip, largest }
  }
}

const kb = (x: number) => `${(x / 1024).toFixed(0)} KB`

describe('first load', () => {
  it('sign-in and project list pages download under 250 KB of compressed JavaScript', async () => {
    const page = await ctx.browser.newPage()
    let stop = await recordScripts(page)
    await gotoHydrated(page, `${ctx.server.url}/sign-in`)
    const signIn = await stop()
    await signInWithForm(page, ctx.server.url, 'owner')
    await page.waitForSelector('[data-testid=projects-table]')
    // a fresh load of the project list (signed in)
    const fresh = await ctx.browser.newPage()
    stop = await recordScripts(fresh)
    await gotoHydrated(fresh, `${ctx.server.url}/projects`)
    await fresh.waitForSelector('[data-testid=projects-table]')
    const projects = await stop()
    for (const [name, r] of [['sign-in', signIn], ['projects', projects]] as const) {
      console.log(`[first load] ${name}: ${r.files} scripts, ${kb(r.raw)} raw, ${kb(r.gzip)} gzip (target < 250 KB); largest ${r.largest}`)
    }
    expect(signIn.files).toBeGreaterThan(0)
    expect(signIn.gzip).toBeLessThan(250 * 1024)
    expect(projects.gzip).toBeLessThan(250 * 1024)
    await fresh.close()
    await page.close()
  })
})
