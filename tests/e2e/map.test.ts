/**
 * Real Chromium against the built server: the demo owner opens the maps page from the project,
 * computes a 21×21 τ map of a demo pattern with one worker and then with the pool (one worker
 * per core), looks at a cell, saves the map (the server verifies a sample of cells) and opens it
 * from the library. Prints both wall times, measured in this run (not asserted).
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useServerAndBrowser } from '../support/fixtures'
import { screenshot, signInWithForm } from '../support/browser'
import { findPatternExample } from '../../shared/examples'

const ctx = useServerAndBrowser()
const pattern = findPatternExample('square-pair')!

async function compute(page: Page, workers: number): Promise<{ text: string, wallS: number }> {
  await page.fill('[data-testid=map-workers]', String(workers))
  await page.click('[data-testid=map-compute]')
  await page.waitForSelector('[data-testid=map-timing]', { timeout: 120_000 })
  const text = (await page.textContent('[data-testid=map-timing]'))!
  return { text, wallS: Number(/in ([\d.]+) s/.exec(text)![1]) }
}

describe('moduli map in the browser', () => {
  it('computes a 21×21 τ map with the pool, shows it and saves it', { timeout: 300_000 }, async () => {
    const page = await ctx.browser.newPage({ width: 1500, height: 1000 })
    page.on('pageerror', e => console.log('page error:', e.message))
    await signInWithForm(page, ctx.server.url, 'owner')
    await page.click('text=Genus-three torus gluings')
    await page.click('[data-testid=maps-link]')
    await page.waitForSelector('[data-testid=map-setup]')
    await page.selectOption('[data-testid=map-graph]', { label: pattern.title })
    const cores = await page.evaluate(() => navigator.hardwareConcurrency)

    const one = await compute(page, 1)
    expect(one.text).toMatch(/21 of 21 rows .* with 1 worker\./)
    const pool = await compute(page, cores)
    expect(pool.text).toMatch(new RegExp(`21 of 21 rows .* with ${cores} worker`))
    console.log(`21×21 τ map of ${pattern.title}: ${one.wallS.toFixed(2)} s with 1 worker, ${pool.wallS.toFixed(2)} s with the pool of ${cores} (navigator.hardwareConcurrency = ${cores})`)

    // drawn: the chart canvas exists; a click on the centre picks a cell and shows the pattern there
    const canvas = page.locator('[data-testid=map-heatmap] canvas').first()
    await canvas.waitFor()
    const box = (await canvas.boundingBox())!
    await page.mouse.click(box.x + box.width * 0.45, box.y + box.height * 0.5)
    await page.waitForSelector('[data-testid=map-cell] [data-testid=pattern-preview]')
    expect(await page.textContent('[data-testid=map-cell]')).toContain('solved')

    await page.fill('[data-testid=map-name]', 'τ window of the square pair')
    await page.click('[data-testid=map-save]')
    await page.waitForSelector('[data-testid=map-saved]')
    expect(await page.textContent('[data-testid=map-saved]')).toMatch(/verified: 40 sampled cells re-evaluated/)
    await page.waitForSelector('[data-testid=map-list-item]')
    await screenshot(page, 'map-computed')

    await page.click('[data-testid=map-list-item] a')
    await page.waitForSelector('[data-testid=map-title]')
    expect(await page.textContent('[data-testid=map-verification]')).toContain('verified')
    await page.locator('[data-testid=map-heatmap] canvas').first().waitFor()
    await screenshot(page, 'map-saved')
  })
})
