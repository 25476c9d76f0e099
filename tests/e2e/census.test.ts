/**
 * Real Chromium against the built server: the demo owner starts a small census on the census
 * page, watches it finish, sorts and filters the table, opens a genus-3 pattern in the workbench
 * (its drawing and verdicts load) and saves another to a project.
 */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { enumerateCensus } from '../../shared/census/enumerate'

const ctx = useServerAndBrowser()

describe('census page', () => {
  it('runs a census, filters it, opens a pattern in the workbench and saves one', { timeout: 180_000 }, async () => {
    const page = await ctx.browser.newPage()
    page.on('pageerror', e => console.log('page error:', e.message))
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/census`)
    await page.waitForSelector('text=No census has run yet.')
    await page.fill('[data-testid=census-towers]', '2')
    await page.fill('[data-testid=census-half-edges]', '14')
    await page.click('[data-testid=census-start]')
    await page.waitForSelector('[data-testid=census-progress] >> text=done', { timeout: 120_000 })
    const expected = [...enumerateCensus({ maxTowers: 2, maxHalfEdges: 14 })].length
    await expect.poll(() => page.locator('[data-testid=census-table] tbody tr').count(), { timeout: 30_000 }).toBe(expected)
    // a chiral class names its mirror class, which names it back
    const mirrorOf = new Map<string, string>()
    for (const cell of await page.locator('[data-testid^=census-mirror-]').all()) {
      const m = /mirror #(\d+)/.exec((await cell.textContent()) ?? '')
      if (m) mirrorOf.set((await cell.getAttribute('data-testid'))!.replace('census-mirror-', ''), m[1]!)
    }
    expect(mirrorOf.size).toBeGreaterThan(0)
    for (const [id, other] of mirrorOf) { expect(other).not.toBe(id); expect(mirrorOf.get(other)).toBe(id) }
    expect(await page.textContent('[data-testid=census-total]')).toBe(`${expected} patterns`)
    expect(await page.textContent('body')).toContain('Results are numerical evidence, not proofs.')
    await screenshot(page, 'census-table')

    // H. Chen, M. Traizet, arXiv 2103.15676 (2021), Theorem C.1: two genus-3 graphs
    await page.fill('[data-testid=filter-genus]', '3')
    await expect.poll(() => page.locator('[data-testid=census-table] tbody tr').count()).toBe(2)
    await page.click('th:has-text("Towers") button')
    await page.click('th:has-text("Towers") button')
    const firstTowers = await page.textContent('[data-testid=census-table] tbody tr:first-child td:nth-child(2)')
    expect(firstTowers?.trim()).toBe('2')
    await screenshot(page, 'census-genus-3')

    const rowId = (await page.getAttribute('[data-testid=census-table] tbody tr:first-child', 'data-testid'))!.replace('census-row-', '')
    await page.click(`[data-testid=census-open-${rowId}]`)
    await page.waitForSelector('[data-testid=workbench]')
    await page.waitForSelector('[data-testid=verdicts][data-state=current]', { timeout: 60_000 })
    await expect.poll(() => page.textContent('[data-testid=topology]')).toMatch(/V 2 · E 4 · F 2 · embedding genus 1 · glued surface: genus 3/)
    await screenshot(page, 'census-workbench')

    await gotoHydrated(page, `${ctx.server.url}/census`)
    await page.fill('[data-testid=filter-genus]', '3')
    await expect.poll(() => page.locator('[data-testid=census-table] tbody tr').count()).toBe(2)
    await page.click(`[data-testid=census-save-${rowId}]`)
    await page.waitForURL(/\/projects\/\d+\/patterns\/\d+$/)
    await page.waitForSelector('[data-testid=workbench]')
    expect(await page.inputValue('[data-testid=pattern-name]')).toMatch(/^Census 2 towers, degrees 4,4, genus 3/)
    await screenshot(page, 'census-saved')
    await page.close()
  })
})
