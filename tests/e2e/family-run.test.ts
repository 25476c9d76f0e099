/**
 * Families in Chromium against the built server: the demo editor starts a shear family on the
 * Fermat pair, sees the collapse where the Fermat–Torricelli geometry puts it, finds the run
 * verified in the library, restarts from a middle point and overlays the run with one from the
 * other demo project. A second test kills the worker mid-way and checks every saved batch stays.
 */
import { readFileSync } from 'node:fs'
import { availableParallelism, loadavg } from 'node:os'
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { computeBatches, graphIdByName, projectIdByName } from '../server/runs-helpers'

const ctx = useServerAndBrowser()
/** Long-task bounds that hold on this 2-core machine under load ≈ 20 (measured figures are printed). */
const LONG_TASK_COUNT_BOUND = 8
const LONG_TASK_MS_BOUND = 600
const fermat = findPatternExample('fermat-pair')!
const bridge = findPatternExample('plane-bridge')!

/**
 * Shear s of the shipped document: ω2 = ω2⁰ + s·ω1, so τ = ω2/ω1 = τ0 + s. The free vertex is the
 * Fermat point of the triangle (0, ω1, ω2); it reaches the corner 0 (an edge collapses) when the
 * angle at 0 reaches 120°, i.e. Re τ / Im τ = −1/√3 (Fermat–Torricelli; first isogonic centre
 * X(13), C. Kimberling, Encyclopedia of Triangle Centers). Computed from the document's lattice.
 */
function expectedCollapseShear(): number {
  const { w1, w2 } = fermat.document.lattice!
  const d = w1[0] * w1[0] + w1[1] * w1[1]
  const tauRe = (w2[0] * w1[0] + w2[1] * w1[1]) / d
  const tauIm = (w2[1] * w1[0] - w2[0] * w1[1]) / d
  return -tauIm / Math.sqrt(3) - tauRe
}

async function startShear(page: import('playwright-core').Page, projectId: number, graphId: number, name: string, extra: { stepMax: string, maxPoints: string }) {
  await gotoHydrated(page, `${ctx.server.url}/projects/${projectId}/runs/new?graphId=${graphId}`)
  await page.waitForSelector('[data-testid=run-setup]')
  await page.fill('[data-testid=run-name]', name)
  await page.selectOption('[data-testid=run-kind]', 'shear')
  await page.fill('[data-testid=run-to]', '-2')
  await page.click('[data-testid=run-advanced] summary')
  await page.fill('[data-testid=run-collapse-tol]', '1e-6')
  await page.fill('[data-testid=run-step-max]', extra.stepMax)
  await page.fill('[data-testid=run-max-points]', extra.maxPoints)
  await Promise.all([page.waitForURL(/\/runs\/\d+\?live=1/), page.click('[data-testid=run-start]')])
  return Number(page.url().match(/\/runs\/(\d+)/)![1])
}

describe('families in the browser', () => {
  it('runs a shear of the Fermat pair to its collapse, verifies, restarts and compares', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const torusId = await projectIdByName(owner, 'Genus-three torus gluings')
    const planeId = await projectIdByName(owner, 'Open-wing towers in the plane')
    const fermatGraph = await graphIdByName(owner, torusId, fermat.title)
    // a run in the other demo project, computed with the core and saved by its owner
    const weight = { path: { kind: 'weight-scale' as const, edges: [bridge.document.edges[0]!.id] }, to: 1.5, stop: { maxPoints: 30 } }
    const planeRun = (await owner.json('POST', `/api/projects/${planeId}/runs`, { graphId: await graphIdByName(owner, planeId, bridge.title), name: 'bridge weights', settings: weight })).body.id
    for (const b of computeBatches(bridge.document, weight)) await owner.json('POST', `/api/runs/${planeRun}/points`, { points: b.points, specialPoints: b.specialPoints })
    await owner.json('POST', `/api/runs/${planeRun}/finish`, { status: 'complete' })

    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    const runId = await startShear(page, torusId, fermatGraph, 'Fermat shear to the collapse', { stepMax: '0.05', maxPoints: '500' })
    await page.waitForSelector('[data-testid=live-run][data-state=complete]', { timeout: 60_000 })
    const longTasks = Number(await page.textContent('[data-testid=live-long-tasks]'))
    const longest = longTasks ? Number(await page.textContent('[data-testid=live-longest-task]')) : 0
    console.log(`family run view: ${await page.textContent('[data-testid=live-points]')} points, main-thread long tasks (> 50 ms) during the run: ${longTasks}, longest ${longest} ms (target: none; load average ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} cores)`)
    // generous bounds for a shared, loaded machine; the target is no task over 50 ms
    expect(longTasks).toBeLessThanOrEqual(LONG_TASK_COUNT_BOUND)
    expect(longest).toBeLessThan(LONG_TASK_MS_BOUND)

    page.on('console', m => { if (m.type() === 'error') console.log('browser:', m.text()) })
    await screenshot(page, 'family-run-live')
    // the collapse, located where the geometry of the shipped document puts it
    const row = page.locator('[data-testid=special-points] tr[data-kind=collapse]')
    await row.first().waitFor()
    const lambda = Number(await row.first().locator('[data-testid=special-lambda]').textContent())
    const exact = expectedCollapseShear()
    console.log(`collapse at s = ${lambda}, Fermat–Torricelli s* = ${exact}, deviation ${Math.abs(lambda - exact).toExponential(2)}`)
    expect(Math.abs(exact - (-0.5 - 1 / Math.sqrt(3)))).toBeLessThan(1e-12) // τ0 = ½ + i for ω1 = (2, 0), ω2 = (1, 2)
    // the run stops where the shortest edge is below 1e-6 of the mean length; the collapse itself
    // is located where that edge reaches length 0 (shared/families/collapse-limit.ts)
    expect(Math.abs(lambda - exact) / Math.abs(exact)).toBeLessThan(1e-8)
    await expect.poll(() => page.getAttribute('[data-testid=run-verification]', 'data-state'), { timeout: 15_000 }).toBe('verified')
    await page.waitForSelector('[data-testid=branch-diagram] canvas')
    await screenshot(page, 'family-run-view')

    // the library lists it as verified
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs`)
    await page.selectOption('[data-testid=filter-verification]', 'verified')
    const libRow = page.locator(`[data-testid=runs-table] tr[data-run-id="${runId}"]`)
    await libRow.waitFor()
    expect(await libRow.locator('[data-testid=run-verification-cell]').textContent()).toBe('verified')
    await screenshot(page, 'family-library')

    // restart from a middle point through the inspector
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/${runId}`)
    const count = Number(await page.getAttribute('[data-testid=point-slider]', 'max')) + 1
    const middle = Math.floor(count / 2)
    await page.locator('[data-testid=point-slider]').fill(String(middle))
    await expect.poll(() => page.textContent('[data-testid=inspector-title]')).toContain(`point ${middle}`)
    await page.waitForSelector('[data-testid=point-inspector] [data-testid=pattern-preview] svg')
    await screenshot(page, 'family-inspector')
    // discussion of the collapse (a comment on special point k is stored at point index −1 − k)
    await page.locator('[data-testid=special-points] button', { hasText: 'Comment' }).first().click()
    const thread = page.locator('[data-testid=special-point-comments] [data-testid=comment-thread]')
    await thread.locator('textarea').fill('Collapse lands on the **120°** corner, as expected.')
    await thread.locator('button', { hasText: /^(Post|Comment|Send)/ }).first().click()
    await expect.poll(() => thread.locator('strong', { hasText: '120°' }).count(), { timeout: 15_000 }).toBe(1)
    await screenshot(page, 'family-comment')
    await page.reload()
    await page.waitForSelector('html[data-hydrated="true"]', { state: 'attached' })
    await expect.poll(() => page.locator('section', { hasText: 'Discussion' }).locator('text=on special point 1').count(), { timeout: 15_000 }).toBeGreaterThan(0)
    await page.locator('[data-testid=point-slider]').fill(String(middle))
    await expect.poll(() => page.textContent('[data-testid=inspector-title]')).toContain(`point ${middle}`)
    await page.waitForSelector('[data-testid=point-inspector] [data-testid=pattern-preview] svg')
    await Promise.all([page.waitForURL(/\/runs\/\d+\?live=1/), page.click('[data-testid=inspector-restart]')])
    const restartId = Number(page.url().match(/\/runs\/(\d+)/)![1])
    expect(restartId).not.toBe(runId)
    await page.waitForSelector('[data-testid=live-run][data-state=complete]', { timeout: 60_000 })
    expect(await page.textContent('main')).toContain(`restarted from run ${runId}`)
    const restarted = (await owner.json('GET', `/api/runs/${restartId}`)).body
    expect(restarted.restartPointIndex).toBe(middle)
    const firstPoint = (await owner.json('GET', `/api/runs/${restartId}/points?limit=1`)).body.points[0]
    const parentPoint = (await owner.json('GET', `/api/runs/${runId}/points?offset=${middle}&limit=1`)).body.points[0]
    expect(firstPoint.lambda).toBe(parentPoint.lambda) // the restart begins exactly at the chosen point
    await expect.poll(() => page.getAttribute('[data-testid=run-verification]', 'data-state'), { timeout: 15_000 }).toBe('verified')
    await screenshot(page, 'family-restart')

    // overlay with the run from the other demo project (the editor reads it as a viewer there)
    await gotoHydrated(page, `${ctx.server.url}/compare?runs=${runId},${planeRun}`)
    await page.waitForSelector('[data-testid=branch-diagram] canvas')
    const listed = await page.textContent('[data-testid=compare-runs]')
    expect(listed).toContain('Fermat shear to the collapse')
    expect(listed).toContain('bridge weights')
    expect(listed).toContain('Open-wing towers in the plane')
    expect(await page.locator('[data-testid=special-points] tbody tr').count()).toBeGreaterThan(1)
    await screenshot(page, 'family-compare')

    // diagram exports for papers: SVG with a white background, our font, axis units and the caution; PNG bytes
    const [svgDownload] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid=export-svg]')])
    const svg = readFileSync((await svgDownload.path())!, 'utf8')
    expect(svg).toContain('Space Grotesk')
    // every axis title carries its unit, never "[1]"
    expect(svg).toMatch(/\[[^\]]+\]/)
    expect(svg).not.toContain('[1]')
    expect(svg).toMatch(/fill="(#ffffff|#fff|white)"/i)
    expect(svg).toContain('numerical evidence, not proofs')
    const [pngDownload] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid=export-png]')])
    const png = readFileSync((await pngDownload.path())!)
    expect([...png.subarray(0, 4)]).toEqual([0x89, 0x50, 0x4e, 0x47]) // PNG signature (ISO/IEC 15948)
  })

  it('keeps every batch saved before the worker is killed mid-way', async () => {
    const editor = await signInAs(ctx.server.url, 'editor')
    const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
    const fermatGraph = await graphIdByName(editor, torusId, fermat.title)
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'editor')
    // count the batch uploads on the wire, so the test can wait until none is left after the kill
    let uploading = 0
    const isUpload = (r: { url: () => string, method: () => string }) => r.method() === 'POST' && /\/api\/runs\/\d+\/points$/.test(r.url())
    page.on('request', (r) => { if (isUpload(r)) uploading++ })
    page.on('requestfinished', (r) => { if (isUpload(r)) uploading-- })
    page.on('requestfailed', (r) => { if (isUpload(r)) uploading-- })
    // tiny steps: thousands of points, so the run is still going when the worker is killed
    const runId = await startShear(page, torusId, fermatGraph, 'killed mid-way', { stepMax: '0.0002', maxPoints: '5000' })
    await page.waitForFunction(() => Number(document.querySelector('[data-testid=live-saved]')?.textContent) >= 30, null, { timeout: 60_000 })
    await page.evaluate(() => (window as unknown as { __wingfoldContinuation: { terminate: () => void } }).__wingfoldContinuation.terminate())
    // wait until a save that was already on the wire has landed and the page has counted it
    await expect.poll(() => uploading, { timeout: 30_000 }).toBe(0)
    await expect.poll(async () => Number(await page.textContent('[data-testid=live-saved]')) === (await editor.json('GET', `/api/runs/${runId}`)).body.pointCount, { timeout: 30_000 }).toBe(true)
    const saved = Number(await page.textContent('[data-testid=live-saved]'))
    // the page finishes the run as failed (a run never stays "running" when its worker dies)
    await expect.poll(async () => (await editor.json('GET', `/api/runs/${runId}`)).body.status, { timeout: 30_000 }).toBe('failed')
    const run = (await editor.json('GET', `/api/runs/${runId}`)).body
    expect(run.pointCount).toBe(saved)
    expect(saved).toBeGreaterThanOrEqual(30)
    expect(saved).toBeLessThan(5000)
    const stored = (await editor.json('GET', `/api/runs/${runId}/points?limit=2000`)).body.points as Array<{ index: number }>
    expect(stored.map(p => p.index)).toEqual(Array.from({ length: saved }, (_, i) => i))
    console.log(`worker killed after ${saved} saved points; the server keeps ${run.pointCount}`)
    await screenshot(page, 'family-killed')
  })
})
