/**
 * The published existence conditions in the workbench and on a run page, in real Chromium
 * against the built server. Pattern: Meeks' two towers in an acute lattice [H. Chen, M. Traizet,
 * arXiv 2103.15676, 2021, Ex. 7.1]: a = 2π/3, b = π/3 is phase-rigid (det 2 cos b = 1) with one
 * vertical equation on the shortest edges e2, e4; a = π/3, b = π/2 is not (det 2 cos b = 0).
 */
import { createClient } from '@libsql/client'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { meeks } from '../unit/pattern/published-patterns'
import { computeBatches } from '../server/runs-helpers'

const ctx = useServerAndBrowser()

async function openPattern(name: string, doc: unknown) {
  const editor = await signInAs(ctx.server.url, 'editor')
  const projects = (await editor.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
  const projectId = projects.find(p => p.name === 'Genus-three torus gluings')!.id
  const created = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name, document: doc })
  expect(created.status).toBe(201)
  await ctx.browser.context.clearCookies()
  const page = await ctx.browser.newPage()
  await signInWithForm(page, ctx.server.url, 'editor')
  await gotoHydrated(page, `${ctx.server.url}/projects/${projectId}/patterns/${created.body.id}`)
  await page.waitForSelector('[data-testid=existence-line]', { timeout: 30_000 })
  return page
}

describe('published conditions in the workbench', () => {
  it('Meeks, a = 2π/3, b = π/3: one equation on e2, e4 (depends on K), levels, every hypothesis holds', async () => {
    const page = await openPattern('Meeks acute rigid', meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3))
    await page.waitForFunction(() => document.querySelector('[data-testid=existence-line]')?.textContent?.includes('all hypotheses'), null, { timeout: 30_000 })
    expect(await page.textContent('[data-testid=vertical-equations]')).toMatch(/\{w\}: −e2 − e4/)
    expect(await page.getAttribute('[data-testid=vertical-equations] li', 'data-depends-on-k')).toBe('true')
    expect(await page.textContent('[data-testid=length-levels]')).toMatch(/level 1 · ℓ 0\.738 · e2, e4/)
    expect(await page.textContent('[data-testid=existence-line]')).toMatch(/embedded triply periodic/)
    expect(await page.textContent('[data-testid=k-explanation]')).toMatch(/K \(default 1\)/)
    expect(await page.locator('[data-testid=conditions-panel] >> text=Results are numerical evidence, not proofs.').count()).toBe(1)
    await screenshot(page, 'published-conditions-meeks-rigid')
    await page.close()
  })

  it('Meeks, a = π/3, b = π/2: phase rigidity fails and the checklist names T11', async () => {
    const page = await openPattern('Meeks acute flexible', meeks([1, 0], [0.3, 1.3], Math.PI / 3, Math.PI / 2))
    await page.waitForFunction(() => document.querySelector('[data-testid=existence-line]')?.textContent?.includes('failing'), null, { timeout: 30_000 })
    expect(await page.textContent('[data-testid=existence-line]')).toBe('failing: T11')
    expect(await page.getAttribute('[data-testid=existence-checklist] li[data-id=T11]', 'data-status')).toBe('fails')
    expect(await page.getAttribute('[data-testid=verdict-phaseRigidity]', 'data-ok')).toBe('false')
    await screenshot(page, 'published-conditions-meeks-flexible')
    await page.close()
  })
})

describe('a run checked under the earlier definition of vertical balance', () => {
  it('is shown as such on its page, and "Re-verify now" checks it on cuts', async () => {
    const doc = meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3)
    const settings = { path: { kind: 'alpha1' as const }, to: doc.phases!.alpha[0] + 0.3, stop: { maxPoints: 20 } }
    const editor = await signInAs(ctx.server.url, 'editor')
    const projects = (await editor.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
    const projectId = projects.find(p => p.name === 'Genus-three torus gluings')!.id
    const g = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name: 'Meeks for a phase run', document: doc })
    const run = await editor.json('POST', `/api/projects/${projectId}/runs`, { graphId: g.body.id, name: 'alpha1 checked earlier', settings })
    const runId = run.body.id as number
    for (const b of computeBatches(doc, settings, 10)) await editor.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })
    await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    // as a row verified before the definition was recorded (the migration leaves it empty)
    const db = createClient({ url: `file:${join(ctx.server.dataDir, 'wingfold.db')}` })
    await db.execute({ sql: 'UPDATE runs SET vertical_balance = NULL WHERE id = ?', args: [runId] })
    db.close()

    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${projectId}/runs/${runId}`)
    const note = page.locator('[data-testid=vertical-balance-definition]')
    expect(await note.getAttribute('data-definition')).toBe('earlier')
    expect(await note.textContent()).toMatch(/earlier definition of vertical balance/)
    await screenshot(page, 'published-conditions-run-earlier-definition')
    await page.click('[data-testid=reverify]')
    await expect.poll(() => note.getAttribute('data-definition'), { timeout: 15_000 }).toBe('cuts-v1')
    expect(await note.textContent()).toMatch(/published definition/)
    expect(await page.getAttribute('[data-testid=run-verification]', 'data-state')).toBe('verified')
    await page.close()
  })
})

describe('a wall along a lattice run [CT-I Ex. 7.1, Rem. 6.5]', () => {
  it('Meeks sheared through the orthogonal lattice: the wall special point shows the equations before, at and after', async () => {
    // a = 2π/3, b = π/2: before (obtuse) det 2 cos a ≠ 0, after (acute) det 2 cos b = 0 (derived from Ex. 7.1)
    const doc = meeks([1, 0], [-0.2, 1.3], 2 * Math.PI / 3, Math.PI / 2)
    const settings = { path: { kind: 'shear' as const }, to: 0.4, stop: { maxPoints: 60 } }
    const editor = await signInAs(ctx.server.url, 'editor')
    const projects = (await editor.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
    const projectId = projects.find(p => p.name === 'Genus-three torus gluings')!.id
    const g = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name: 'Meeks for a shear', document: doc })
    const run = await editor.json('POST', `/api/projects/${projectId}/runs`, { graphId: g.body.id, name: 'shear through a wall', settings })
    const runId = run.body.id as number
    for (const b of computeBatches(doc, settings, 10)) await editor.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })
    await editor.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })

    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${projectId}/runs/${runId}`)
    await page.click('[data-testid=special-points] tr[data-kind=wall]')
    await page.waitForSelector('[data-testid=wall-details]', { timeout: 15_000 })
    const cells = async (side: string) => (await page.locator(`[data-testid=wall-details] tr[data-side=${side}] td`).allTextContents()).map(t => t.trim())
    // the terms of one equation are edges of one length: their order inside it is not part of the verdict
    const terms = (cell: string) => cell.match(/e\d/g)!.sort()
    const before = await cells('before'), at = await cells('at'), after = await cells('after')
    expect([before[0], before[1]!.startsWith('{w}: '), terms(before[1]!), ...before.slice(2)]).toEqual(['before', true, ['e1', 'e3'], 'yes', 'yes'])
    // at the tie all four edges are one level
    expect(terms(at[1]!)).toEqual(['e1', 'e2', 'e3', 'e4'])
    expect([after[0], after[1]!.startsWith('{w}: '), terms(after[1]!), ...after.slice(2)]).toEqual(['after', true, ['e2', 'e4'], 'yes', 'no'])
    expect(await page.textContent('[data-testid=wall-branch]')).toMatch(/also solve/)
    await screenshot(page, 'published-conditions-wall')
    await page.close()
  })
})
