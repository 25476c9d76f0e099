/**
 * Real Chromium on the demo data: the editor opens the seeded run through the even ring's branch
 * point, clicks "Switch branch", and the new run is computed in the browser, saved, verified by
 * the server, and lies on the uneven states (derived: φ1 = φ3 = π/6 and s sin φ0 = sin(π/6), see
 * server/db/demo-runs.ts). The comparison linked from the run's discussion opens with both runs.
 */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { projectIdByName } from '../server/runs-helpers'
import type { RunSummary, StoredRunPoint } from '../../shared/types/runs'

const ctx = useServerAndBrowser()

describe('demo: switching branch at the seeded branch point', () => {
  it('computes and saves the other branch from the run page', async () => {
    const editor = await signInAs(ctx.server.url, 'editor')
    const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
    const list = (await editor.json('GET', `/api/projects/${torusId}/runs`)).body as RunSummary[]
    const parent = list.find(r => r.name === 'Even ring of four — lighter opposite edges')!
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/${parent.id}`)
    const row = page.locator('[data-testid=special-points] tbody tr[data-kind="branch point"]')
    await row.waitFor()
    await screenshot(page, 'demo-branch-point')
    await Promise.all([page.waitForURL(/\/runs\/\d+\?live=1/), row.locator('button', { hasText: 'Switch branch' }).click()])
    const childId = Number(page.url().match(/\/runs\/(\d+)/)![1])
    await page.waitForSelector('[data-testid=live-run][data-state=complete]', { timeout: 90_000 })
    await expect.poll(() => page.getAttribute('[data-testid=run-verification]', 'data-state'), { timeout: 30_000 }).toBe('verified')
    expect(await page.textContent('main')).toContain(`restarted from run ${parent.id}`)
    await screenshot(page, 'demo-switched-branch')
    const pts = (await editor.json('GET', `/api/runs/${childId}/points?limit=2000`)).body.points as StoredRunPoint[]
    expect(pts.length).toBeGreaterThan(10)
    const wrap = (x: number) => Math.atan2(Math.sin(x), Math.cos(x))
    let worst = 0
    for (const p of pts) {
      const [p1, p2, p3] = p.state.u as [number, number, number]
      worst = Math.max(worst, Math.abs(wrap(p2 - p1 - Math.PI / 6)), Math.abs(wrap(4 * Math.PI / 3 - p3 - Math.PI / 6)), Math.abs(p.lambda * Math.sin(p1) - 1 / 2))
    }
    expect(worst).toBeLessThan(1e-8)
  })

  it('opens the comparison linked from the discussion with both branches', async () => {
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'viewer')
    const viewer = await signInAs(ctx.server.url, 'viewer')
    const torusId = await projectIdByName(viewer, 'Genus-three torus gluings')
    const parent = ((await viewer.json('GET', `/api/projects/${torusId}/runs`)).body as RunSummary[]).find(r => r.name === 'Even ring of four — lighter opposite edges')!
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/${parent.id}`)
    const link = page.locator('a', { hasText: 'compare the even and the uneven branch' })
    await link.waitFor()
    // comment links open in a new tab
    const [tab] = await Promise.all([page.context().waitForEvent('page'), link.click()])
    await tab.waitForURL(/\/compare\?runs=\d+,\d+/)
    await tab.waitForSelector('[data-testid=branch-diagram] canvas')
    const listed = await tab.textContent('[data-testid=compare-runs]')
    expect(listed).toContain('Even ring of four — lighter opposite edges')
    expect(listed).toContain('Even ring of four — the uneven branch')
    await screenshot(tab, 'demo-compare')
  })
})
