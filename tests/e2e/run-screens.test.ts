/**
 * The run screens as a geometer uses them: the setup form picks wings from the pattern, says
 * what is wrong in sentences and refuses an unbalanced wing choice before a run exists; a live
 * run shows progress towards its target, warns before it is left, finishes saving after a cancel;
 * the workbench asks before switching space throws a drawing away; compare defaults to a shared axis.
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { computeBatches, graphIdByName, projectIdByName } from '../server/runs-helpers'

const ctx = useServerAndBrowser()
const fermat = findPatternExample('fermat-pair')!
const bridge = findPatternExample('plane-bridge')!

/** Collects dialog messages and answers them (accept or dismiss). */
function answerDialogs(page: Page, accept: () => boolean): string[] {
  const seen: string[] = []
  page.on('dialog', (d) => { seen.push(d.message()); void (accept() ? d.accept() : d.dismiss()) })
  return seen
}

describe('run screens', () => {
  it('setup form: wings picked from the pattern, sentences, and an unbalanced wing set refused before a run exists', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const planeId = await projectIdByName(owner, 'Open-wing towers in the plane')
    const graphId = await graphIdByName(owner, planeId, bridge.title)
    const runsBefore = (await owner.json('GET', `/api/projects/${planeId}/runs`)).body.length
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${planeId}/runs/new?graphId=${graphId}`)
    await page.waitForSelector('[data-testid=run-setup]')
    await page.fill('[data-testid=run-name]', 'turn the bridge wings')
    await page.selectOption('[data-testid=run-kind]', 'wing-rotation')
    await page.click('[data-testid=run-start]')
    expect(await page.textContent('[data-testid=run-pick-error-pathArg]')).toBe('Choose at least one wing that turns by λ.')
    expect(await page.textContent('[data-testid=run-pick-error-pathArg2]')).toBe('Choose at least one compensating wing.')
    // west-up by a click on the drawing; the compensating pair by the checkboxes
    await page.locator('[data-testid=run-pick-canvas] [data-testid=wing][data-id=west-up]').dispatchEvent('click') // a zero-width SVG line: Playwright calls it invisible
    expect(await page.locator('[data-testid=run-pick-pathArg] label', { hasText: 'west-up' }).locator('input').isChecked()).toBe(true)
    for (const id of ['west-down', 'east-up']) await page.locator('[data-testid=run-pick-pathArg2] label', { hasText: id }).locator('input').check()
    await page.click('[data-testid=run-start]')
    // directions (0, 1) alone do not sum to zero (Σ_open u_h must stay 0, C-II §2; derived)
    expect(await page.textContent('[data-testid=run-pick-error-pathArg]')).toMatch(/^The directions of the turning wings must sum to zero/)
    await screenshot(page, 'run-setup-wings-refused')
    expect(page.url()).toMatch(/\/runs\/new/)
    expect((await owner.json('GET', `/api/projects/${planeId}/runs`)).body.length).toBe(runsBefore)
    // with east-down the set balances and the run starts
    await page.locator('[data-testid=run-pick-pathArg] label', { hasText: 'east-down' }).locator('input').check()
    await page.fill('[data-testid=run-to]', '1')
    await Promise.all([page.waitForURL(/\/runs\/\d+\?live=1/), page.click('[data-testid=run-start]')])
    await page.waitForSelector('[data-testid=live-run][data-state=complete]', { timeout: 60_000 })
    await page.close()
  })

  it('live run: progress towards the target, a warning before leaving, saving finished after cancel', async () => {
    const editor = await signInAs(ctx.server.url, 'editor')
    const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
    const graphId = await graphIdByName(editor, torusId, fermat.title)
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/runs/new?graphId=${graphId}`)
    await page.waitForSelector('[data-testid=run-setup]')
    await page.fill('[data-testid=run-name]', 'slow shear')
    await page.selectOption('[data-testid=run-kind]', 'shear')
    await page.fill('[data-testid=run-to]', '-1')
    await page.click('[data-testid=run-advanced] summary')
    await page.fill('[data-testid=run-step-max]', '0.0001') // about 10 000 steps to the target: still running when we act
    await page.fill('[data-testid=run-max-points]', '20000')
    await Promise.all([page.waitForURL(/\/runs\/\d+\?live=1/), page.click('[data-testid=run-start]')])
    const runId = Number(page.url().match(/\/runs\/(\d+)/)![1])
    await page.waitForFunction(() => Number(document.querySelector('[data-testid=live-saved]')?.textContent) >= 50, null, { timeout: 60_000 })
    // progress is λ's way from 0 to −1, not points against the limit of 20 000
    const label = (await page.textContent('[data-testid=live-progress]'))!
    const lambda = Number(/λ = (-?[\d.e-]+)/.exec(label)![1])
    const pct = Number(/\((\d+) %\)/.exec(label)![1])
    expect(label).toContain('on the way from 0 to -1')
    expect(Math.abs(pct - Math.round(100 * Math.abs(lambda)))).toBeLessThanOrEqual(1)
    // leaving through the app asks first; dismissing keeps the page
    let accept = false
    const dialogs = answerDialogs(page, () => accept)
    await page.click('nav[aria-label=Main] a[href="/projects"]')
    await expect.poll(() => dialogs.length).toBe(1)
    expect(dialogs[0]).toMatch(/still computing or saving points/)
    expect(page.url()).toContain(`/runs/${runId}`)
    // the worker never runs far ahead of the server
    const ahead = await page.evaluate(() => Number(document.querySelector('[data-testid=live-points]')?.textContent?.split('/')[0]) - Number(document.querySelector('[data-testid=live-saved]')?.textContent))
    expect(ahead).toBeLessThanOrEqual(200 + 20) // the bound plus one batch in flight
    await page.click('[data-testid=run-cancel]')
    await page.waitForSelector('[data-testid=live-run][data-state=cancelled]', { timeout: 60_000 })
    const saved = Number(await page.textContent('[data-testid=live-saved]'))
    const run = (await editor.json('GET', `/api/runs/${runId}`)).body
    expect(run.status).toBe('cancelled')
    expect(run.pointCount).toBe(saved)
    expect(Number((await page.textContent('[data-testid=live-points]'))!.split('/')[0])).toBe(saved) // nothing computed was lost
    await screenshot(page, 'run-cancelled-saved')
    accept = true
    await page.close()
  })

  it('workbench: switching a new drawing to "in the plane" asks first', async () => {
    const page = await ctx.browser.newPage({ width: 1366, height: 1000 })
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'editor')
    const editor = await signInAs(ctx.server.url, 'editor')
    const torusId = await projectIdByName(editor, 'Genus-three torus gluings')
    await gotoHydrated(page, `${ctx.server.url}/projects/${torusId}/patterns/new`)
    await page.waitForSelector('[data-testid=canvas]')
    await page.click('[data-testid=tool-vertex]')
    const box = (await page.locator('[data-testid=canvas]').boundingBox())!
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2)
    expect(await page.locator('[data-testid=vertex]').count()).toBe(1)
    const dialogs = answerDialogs(page, () => false)
    await page.click('[data-testid=space-plane]')
    await expect.poll(() => dialogs.length).toBe(1)
    expect(dialogs[0]).toMatch(/starts a new empty drawing/)
    expect(page.url()).not.toContain('space=plane')
    expect(await page.locator('[data-testid=vertex]').count()).toBe(1)
    await page.close()
  })

  it('compare: a shear and a stretch are drawn over the lattice angle they share', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const torusId = await projectIdByName(owner, 'Genus-three torus gluings')
    const graphId = await graphIdByName(owner, torusId, fermat.title)
    const ids: number[] = []
    for (const settings of [{ path: { kind: 'shear' as const }, to: 0.3, stop: { maxPoints: 40 } }, { path: { kind: 'stretch' as const }, to: 1.6, stop: { maxPoints: 40 } }]) {
      const id = (await owner.json('POST', `/api/projects/${torusId}/runs`, { graphId, name: settings.path.kind, settings })).body.id as number
      for (const b of computeBatches(fermat.document, settings)) await owner.json('POST', `/api/runs/${id}/points`, { points: b.points, specialPoints: b.specialPoints })
      await owner.json('POST', `/api/runs/${id}/finish`, { status: 'complete' })
      ids.push(id)
    }
    const page = await ctx.browser.newPage()
    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/compare?runs=${ids.join(',')}`)
    expect(await page.textContent('[data-testid=compare-shared-axis]')).toContain('lattice angle arg τ')
    expect(await page.locator('[data-testid=axis-x]').inputValue()).toBe('latticeAngle')
    await screenshot(page, 'compare-shared-axis')
    await page.close()
  })
})
