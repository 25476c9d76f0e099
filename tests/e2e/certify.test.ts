/**
 * Certificates in Chromium against the built server: the demo editor opens a saved shear run of
 * the Fermat pair, clicks "Certify points", watches the worker's progress, and every point's badge
 * turns to "certified (radius r)" once the server has re-proven the claims, the segments between
 * them too ("the branch from λ = a to λ = b is certified"); after a reload the badges come from the
 * server alone, and the checklist marks rigidity as proven by interval arithmetic.
 * In the workbench, "Certify this drawing" on Meeks' pattern [H. Chen, M. Traizet, arXiv
 * 2103.15676, 2021, Ex. 7.1] on ω1 = (1, 0), ω2 = (0.3, 1.3) (phase Jacobian 2 cos b) proves
 * T10, T11 for a = 2π/3, b = π/3 and refuses a = π/3, b = π/2 (T11 fails); on the equiangular
 * triangle with six wings [H. Chen, Comm. Anal. Geom. 32, 2024, Ex. 7] it proves P5, P6 (plane
 * rigidity with the wing directions as unknowns) and P8, P9.
 */
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { EQUILATERAL, meeks, planeTriangle } from '../unit/pattern/published-patterns'
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
    expect(await page.locator('[data-testid=certificate-badge][data-certified=false]:not([data-segment])').count()).toBe(n)
    await expect.poll(() => page.locator('[data-testid=certify-summary]').innerText()).toContain(`0 of ${n} saved points certified`)
    await page.click('[data-testid=certify-run]')
    await page.waitForSelector('[data-testid=certify-message]', { timeout: 60_000 })
    expect(await page.locator('[data-testid=certify-message]').innerText()).toContain(`${n} of ${n} points and ${n - 1} of ${n - 1} segments certified`)
    await expect.poll(() => page.locator('[data-testid=certificate-badge][data-certified=true]:not([data-segment])').count()).toBe(n)
    expect(await page.locator('[data-testid=certificate-badge]').first().innerText()).toMatch(/^certified \(radius \d\.\de-\d+\)$/)
    await page.locator('[data-testid=certify-panel]').scrollIntoViewIfNeeded()
    await screenshot(page, 'certify-run-page')

    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/${runId}`)
    await page.waitForSelector('[data-testid=certify-panel]')
    expect(await page.locator('[data-testid=certificate-badge][data-certified=true]:not([data-segment])').count()).toBe(n)
    expect(await page.locator('[data-testid=certificate-badge][data-certified=true][data-segment]').count()).toBe(n - 1)
    expect(await page.locator('[data-testid=certify-summary]').innerText()).toContain(`${n} of ${n} saved points certified`)
    // the whole run is one certified branch, from λ = 0 to the last saved λ
    const branch = await page.locator('[data-testid=certified-branch]').allInnerTexts()
    expect(branch).toHaveLength(1)
    expect(branch[0]).toMatch(/^The branch from λ = 0\.00000 to λ = -0\.\d+ is certified\.$/)
    expect(await page.locator('[data-testid=hypothesis-checklist] [data-id=T7]').getAttribute('data-status')).toBe('proven-interval')
    expect(await page.locator('[data-testid=hypothesis-line]').innerText()).toMatch(/proven by interval arithmetic: T6, T7/)
    await page.close()
  }, 180_000)
})

describe('"Certify this drawing" in the workbench verdict panel', () => {
  async function certifyInWorkbench(name: string, doc: unknown) {
    const editor = await signInAs(ctx.server.url, 'editor')
    const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
    const created = await editor.json('POST', `/api/projects/${torusId}/graphs`, { name, document: doc })
    expect(created.status).toBe(201)
    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/patterns/${created.body.id}`)
    await page.waitForSelector('[data-testid=verdicts][data-state=current]', { timeout: 30_000 })
    await page.click('[data-testid=certify-drawing]:not([disabled])', { timeout: 30_000 })
    await page.waitForSelector('[data-testid=drawing-certificate] [data-testid=hypothesis-checklist]', { timeout: 60_000 })
    const status = (id: string) => page.getAttribute(`[data-testid=drawing-certificate] li[data-id=${id}]`, 'data-status')
    return { page, status }
  }
  it('Meeks a = 2π/3, b = π/3: both certificates hold; T6, T7, T10, T11 proven, T8 numerical, and the panel says what is proven', async () => {
    const { page, status } = await certifyInWorkbench('Meeks to certify', meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3))
    expect(await page.innerText('[data-testid=certificate-phase]')).toMatch(/^Phases: certified \(radius/)
    for (const id of ['T6', 'T7', 'T10', 'T11']) expect(await status(id)).toBe('proven-interval')
    expect(await status('T8')).toBe('numerical')
    expect(await status('T4')).toBe('exact')
    expect(await page.innerText('[data-testid=drawing-certificate] [data-testid=hypothesis-proof]')).toMatch(/exactly one solution .* level rows of vertical balance on cuts/)
    expect(await page.locator('[data-testid=verdicts] >> text=Results are numerical evidence, not proofs.').count()).toBe(1)
    await page.locator('[data-testid=drawing-certificate]').scrollIntoViewIfNeeded()
    await screenshot(page, 'certify-workbench-meeks-rigid')
    await page.close()
  }, 120_000)
  it('Meeks a = π/3, b = π/2: the phase part is not certified (not rigid), T11 fails', async () => {
    const { page, status } = await certifyInWorkbench('Meeks not to certify', meeks([1, 0], [0.3, 1.3], Math.PI / 3, Math.PI / 2))
    expect(await page.innerText('[data-testid=certificate-phase]')).toMatch(/^Phases: not certified: not rigid/)
    expect(await status('T11')).toBe('fails')
    expect(await status('T10')).toBe('numerical')
    await page.locator('[data-testid=drawing-certificate]').scrollIntoViewIfNeeded()
    await screenshot(page, 'certify-workbench-meeks-flexible')
    await page.close()
  }, 120_000)
  it('equiangular triangle in the plane [C-II Ex. 7]: P5, P6, P8, P9 proven, P7 numerical', async () => {
    const { page, status } = await certifyInWorkbench('Triangle to certify', planeTriangle(EQUILATERAL, [0, 2 * Math.PI / 3, -2 * Math.PI / 3]))
    expect(await page.innerText('[data-testid=certificate-horizontal]')).toMatch(/^Balance: certified \(radius/)
    for (const id of ['P5', 'P6', 'P8', 'P9']) expect(await status(id)).toBe('proven-interval')
    expect(await status('P7')).toBe('numerical')
    await page.locator('[data-testid=drawing-certificate]').scrollIntoViewIfNeeded()
    await screenshot(page, 'certify-workbench-plane-triangle')
    await page.close()
  }, 120_000)
})
