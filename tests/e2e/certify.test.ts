/**
 * Certificates in Chromium against the built server: the demo editor opens a saved shear run of
 * the Fermat pair, clicks "Certify points", watches the worker's progress, and every point's badge
 * turns to "certified (radius r)" once the server has re-proven the claims; after a reload the
 * badges come from the server alone.
 */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { computeBatches, graphIdByName, projectIdByName } from '../server/runs-helpers'

const ctx = useServerAndBrowser()
const fermat = findPatternExample('fermat-pair')!

describe('certificates on the run page', () => {
  it('certifies every saved point from the browser', async () => {
    const editor = await signInAs(ctx.server.url, 'editor')
    const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
    const graphId = await graphIdByName(editor, torusId, fermat.title)
    const shear = { path: { kind: 'shear' as const }, to: -0.5, stop: { maxPoints: 12 } }
    const runId = (await editor.json('POST', `/api/projects/${torusId}/runs`, { graphId, name: 'shear to certify', settings: shear })).body.id
    const batches = computeBatches(fermat.document, shear, 6)
    for (const b of batches) await editor.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })
    await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    const n = batches.reduce((s, b) => s + b.points.length, 0)

    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/${runId}`)
    await page.waitForSelector('[data-testid=certify-panel]')
    expect(await page.locator('[data-testid=certificate-badge][data-certified=false]').count()).toBe(n)
    await expect.poll(() => page.locator('[data-testid=certify-summary]').innerText()).toContain(`0 of ${n} saved points certified`)
    await page.click('[data-testid=certify-run]')
    await page.waitForSelector('[data-testid=certify-message]', { timeout: 60_000 })
    expect(await page.locator('[data-testid=certify-message]').innerText()).toContain(`${n} of ${n} points certified`)
    await expect.poll(() => page.locator('[data-testid=certificate-badge][data-certified=true]').count()).toBe(n)
    expect(await page.locator('[data-testid=certificate-badge]').first().innerText()).toMatch(/^certified \(radius \d\.\de-\d+\)$/)
    await page.locator('[data-testid=certify-panel]').scrollIntoViewIfNeeded()
    await screenshot(page, 'certify-run-page')

    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/${runId}`)
    await page.waitForSelector('[data-testid=certify-panel]')
    expect(await page.locator('[data-testid=certificate-badge][data-certified=true]').count()).toBe(n)
    expect(await page.locator('[data-testid=certify-summary]').innerText()).toContain(`${n} of ${n} saved points certified`)
    await page.close()
  }, 180_000)
})
