/**
 * Screens with room to read, in real Chromium at 1280 and 1920 px wide: every main screen without
 * horizontal overflow (screenshots in tests/artifacts/screen-*.png); plots the width of the page,
 * resizable and with a full-screen toggle; the inspector keeping the nearest point; the heat map's
 * legend laid out in full and its tooltip clear of the colour bar; the phase table and the run
 * form legible; plane patterns without α; one date format; file names; sentences for refusals.
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { demo, signInAs, type ApiClient } from '../support/http'
import { findPatternExample } from '../../shared/examples'
import { runMapSweep } from '../../shared/maps'
import { parseMapSettings } from '../../shared/types/maps'
import { fermat, fillProject, shear } from '../server/archive-support'
import { computeBatches, graphIdByName, projectIdByName } from '../server/runs-helpers'

const ctx = useServerAndBrowser()
const squarePair = findPatternExample('square-pair')!
const bridge = findPatternExample('plane-bridge')!
const WIDTHS = [1280, 1920] as const
/** "2 Dec 2026, 14:05": the one date-time format (app/utils/when.ts). */
const DATE_TIME = /^\d{1,2} [A-Z][a-z]{2} \d{4}, \d\d:\d\d$/

/** Sign in through the form as `key`, dropping any earlier session of the shared browser context first. */
async function signInFresh(page: Page, key: 'owner' | 'editor' | 'admin') {
  await ctx.browser.context.clearCookies()
  await signInWithForm(page, ctx.server.url, key)
}

/** Horizontal overflow of the page: the document's scroll width, and main-content elements wider than the window. */
async function overflow(page: Page) {
  return page.evaluate(() => {
    const w = window.innerWidth
    const wide = [...document.querySelectorAll('main *')]
      .filter(el => el.getBoundingClientRect().width > w)
      .map(el => `${el.tagName.toLowerCase()}.${String(el.getAttribute('class') ?? '').slice(0, 40)} ${Math.round(el.getBoundingClientRect().width)}px`)
    return { scrollWidth: document.scrollingElement!.scrollWidth, innerWidth: w, wide: wide.slice(0, 5) }
  })
}

/** Everything the screens need: a verified run (and a second one stopped with a reason), a τ map and an α map. */
async function fill(owner: ApiClient) {
  const torusId = await projectIdByName(owner, 'Genus-three torus gluings')
  const planeId = await projectIdByName(owner, 'Open-wing towers in the plane')
  const { runIds: [runId], mapId } = await fillProject(owner, torusId)
  const graphId = await graphIdByName(owner, torusId, fermat.title)
  const stopped = await owner.json('POST', `/api/projects/${torusId}/runs`, { graphId, name: 'shear stopped early', settings: shear })
  for (const b of computeBatches(fermat.document, shear, 10).slice(0, 1)) await owner.json('POST', `/api/runs/${stopped.body.id}/points`, { points: b.points, specialPoints: b.specialPoints })
  const fin = await owner.json('POST', `/api/runs/${stopped.body.id}/finish`, { status: 'stopped', reason: 'no convergence at λ = −0.42' })
  expect(fin.status).toBe(200)
  const pairId = await graphIdByName(owner, torusId, squarePair.title)
  const alphaSettings = parseMapSettings({ plane: 'alpha', x: { min: 0.8, max: 1.6, count: 5 }, y: { min: 0.1, max: 0.7, count: 4 } })
  const alpha = await owner.json('POST', `/api/projects/${torusId}/maps`, { graphId: pairId, name: 'α window', settings: alphaSettings, result: runMapSweep(squarePair.document, alphaSettings), wallMs: 10, workers: 1 })
  expect(alpha.status).toBe(201)
  const bridgeId = await graphIdByName(owner, planeId, bridge.title)
  return { torusId, planeId, runId: runId!, stoppedId: stopped.body.id as number, mapId, alphaMapId: alpha.body.id as number, graphId, pairId, bridgeId }
}

describe('room to read', () => {
  let ids: Awaited<ReturnType<typeof fill>>

  it('every main screen fits 1280 and 1920 px without horizontal overflow', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    ids = await fill(owner)
    const screens: Array<[string, string, 'owner' | 'admin']> = [
      ['projects', '/projects', 'owner'],
      ['project', `/projects/${ids.torusId}`, 'owner'],
      ['workbench', `/projects/${ids.torusId}/patterns/${ids.pairId}`, 'owner'],
      ['run', `/projects/${ids.torusId}/runs/${ids.runId}`, 'owner'],
      ['run-library', `/projects/${ids.torusId}/runs`, 'owner'],
      ['run-form', `/projects/${ids.torusId}/runs/new?graphId=${ids.graphId}`, 'owner'],
      ['compare', `/compare?runs=${ids.runId},${ids.stoppedId}`, 'owner'],
      ['map', `/projects/${ids.torusId}/maps/${ids.mapId}`, 'owner'],
      ['maps', `/projects/${ids.torusId}/maps`, 'owner'],
      ['account', '/account', 'owner'],
      ['admin-users', '/admin/users', 'admin'],
      ['admin-activity', '/admin/activity', 'admin'],
    ]
    for (const who of ['owner', 'admin'] as const) {
      const page = await ctx.browser.newPage({ width: 1280, height: 900 })
      await signInFresh(page, who)
      for (const [name, path] of screens.filter(s => s[2] === who)) {
        for (const width of WIDTHS) {
          await page.setViewportSize({ width, height: 900 })
          await gotoHydrated(page, `${ctx.server.url}${path}`)
          await page.waitForLoadState('networkidle')
          if (['run', 'compare', 'map'].includes(name)) await page.waitForSelector('canvas')
          const o = await overflow(page)
          expect({ name, width, ...o }).toEqual({ name, width, scrollWidth: width, innerWidth: width, wide: [] })
          await screenshot(page, `screen-${name}-${width}`)
        }
      }
      await page.close()
    }
  })

  it('branch diagram: the width of the page, resizable, full screen; the inspector keeps the nearest point', async () => {
    const page = await ctx.browser.newPage({ width: 1920, height: 1000 })
    await signInFresh(page, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/runs/${ids.runId}`)
    const frame = page.locator('[data-testid=branch-diagram] [data-testid=plot-resizable]')
    await frame.waitFor()
    const box = (await frame.boundingBox())!
    // the page is 1920 px wide: the plot takes the content width (120rem less the page padding), not a third of it
    expect(box.width).toBeGreaterThan(0.8 * 1920)
    expect(await frame.evaluate(el => getComputedStyle(el).resize)).toBe('vertical')
    // before any pick the inspector shows the first point; the pointer over the plot, between points, picks the nearest
    await page.waitForSelector('[data-testid=branch-diagram] canvas')
    expect(await page.textContent('[data-testid=inspector-title]')).toMatch(/point 0\b/)
    const title = () => page.textContent('[data-testid=inspector-title]')
    const index = async () => Number((await title())?.match(/point (\d+)/)?.[1] ?? Number.NaN)
    // the middle of the plot: λ ≈ −0.6 of the run's 0 … −1.08, far from the first point (x runs from −1.2 to 0)
    await page.mouse.move(box.x + 0.5 * box.width, box.y + 0.55 * box.height)
    await expect.poll(index).toBeGreaterThan(2)
    const middle = await index()
    expect(middle).toBeLessThan(12)
    // near the collapse end (top left): a later point or the collapse marker
    await page.mouse.move(box.x + 0.12 * box.width, box.y + 0.2 * box.height)
    await expect.poll(async () => (await title())!.includes('collapse') || (await index()) > middle).toBe(true)
    const last = await title()
    await page.mouse.move(box.x + box.width / 2, box.y + box.height + 200) // off the plot: the last point stays
    await page.mouse.move(box.x + box.width / 2, box.y + box.height + 220)
    expect(await title()).toBe(last)
    await screenshot(page, 'room-run-inspector-1920')
    await page.click('[data-testid=branch-diagram] [data-testid=plot-full-screen]')
    const full = page.locator('[data-testid=branch-diagram] [data-testid=plot-frame][data-full=true]')
    await full.waitFor()
    await expect.poll(async () => (await page.locator('[data-testid=branch-diagram] canvas').boundingBox())!.width).toBeGreaterThan(0.95 * 1920)
    await screenshot(page, 'room-run-full-screen-1920')
    await page.keyboard.press('Escape')
    await full.waitFor({ state: 'detached' })
    await page.close()
  })

  it('heat map: full legend under the plot, tooltip clear of the colour bar; the α map without τ captions', async () => {
    const page = await ctx.browser.newPage({ width: 1280, height: 900 })
    await signInFresh(page, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/maps/${ids.mapId}`)
    const frame = page.locator('[data-testid=map-heatmap] [data-testid=plot-resizable]')
    await frame.waitFor()
    const box = (await frame.boundingBox())!
    expect(box.width).toBeGreaterThan(0.8 * 1280)
    const legend = await page.locator('[data-testid=map-legend] li').allTextContents()
    expect(legend.map(s => s.trim())).toEqual(expect.arrayContaining(['seed', 'fundamental domain']))
    expect(await page.textContent('[data-testid=map-caption]')).toContain('fundamental domain')
    // a cell near the right edge: the tooltip opens to its left, clear of the colour bar (the last 110 px)
    await page.waitForSelector('[data-testid=map-heatmap] canvas')
    await page.mouse.move(box.x + box.width - 120, box.y + box.height / 2)
    const tip = page.locator('[data-testid=map-heatmap] div[style*="z-index: 9999999"]')
    await expect.poll(async () => (await tip.isVisible()) && (await tip.textContent())?.includes('τ =')).toBe(true)
    const tipBox = (await tip.boundingBox())!
    expect(tipBox.x + tipBox.width).toBeLessThanOrEqual(box.x + box.width - 100)
    await screenshot(page, 'room-map-tooltip-1280')

    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/maps/${ids.alphaMapId}`)
    await page.waitForSelector('[data-testid=map-heatmap] canvas')
    expect(await page.textContent('[data-testid=map-caption]')).not.toContain('fundamental domain')
    expect((await page.locator('[data-testid=map-legend] li').allTextContents()).join('|')).not.toContain('fundamental domain')
    for (const q of await page.locator('[data-testid=map-quantity] option').evaluateAll(os => os.map(o => (o as HTMLOptionElement).value))) {
      await page.selectOption('[data-testid=map-quantity]', q)
      const label = page.locator('[data-testid=map-scale-label]')
      const text = (await label.textContent())!
      // never a flat "1.0000–1.0000" scale: a constant quantity says so
      if ((await label.getAttribute('data-constant')) === 'true') expect(text).toMatch(/is constant on this map/)
      else expect(text).toMatch(/scale on the right/)
    }
    await screenshot(page, 'room-alpha-map-1280')
    await page.close()
  })

  it('workbench: φ with four decimals on one line, one-line help for α, K, σ_min and inertia; plane patterns without α; run form path in full', async () => {
    const page = await ctx.browser.newPage({ width: 1280, height: 900 })
    await signInFresh(page, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/patterns/${ids.pairId}`)
    await page.waitForSelector('[data-testid=verdicts][data-state=current] [data-testid=verdict-rigidity]')
    const phis = await page.locator('[data-testid=phi-cell]').allTextContents()
    expect(phis.length).toBeGreaterThan(0)
    for (const p of phis) expect(p.trim()).toMatch(/^−?-?\d\.\d{4}$/)
    // one text line: the cell is no taller than the row's input, and "Solve phases" does not wrap
    const solve = page.getByRole('button', { name: 'Solve phases' })
    const lineHeight = await solve.evaluate(el => parseFloat(getComputedStyle(el).lineHeight))
    expect((await solve.boundingBox())!.height).toBeLessThan(2 * lineHeight)
    for (const sel of ['[data-testid=phi-cell]', '[data-testid=weights-table] td:nth-child(2)']) {
      const h = await page.locator(sel).first().evaluate(el => ({ h: el.getBoundingClientRect().height, lh: parseFloat(getComputedStyle(el).lineHeight) }))
      expect(h.h).toBeLessThan(2 * h.lh + 16)
    }
    expect(await page.locator('[data-testid=alpha-control]').count()).toBe(2)
    expect(await page.locator('[data-testid=alpha-control]').first().getAttribute('title')).toMatch(/^α₁, α₂ \[rad\]/)
    expect(await page.locator('[data-testid=weights-table] th', { hasText: 'K' }).first().getAttribute('title')).toMatch(/^K \(default 1\)/)
    const legend = await page.textContent('[data-testid=verdict-legend]')
    expect(legend).toContain('rigidity margin σ_min [dimensionless]')
    expect(legend).toContain('inertia n₋/n₀/n₊')
    await page.locator('[data-testid=phase-panel]').scrollIntoViewIfNeeded()
    await screenshot(page, 'room-workbench-phases-1280')

    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.planeId}/patterns/${ids.bridgeId}`)
    await page.waitForSelector('[data-testid=phase-panel]')
    expect(await page.locator('[data-testid=alpha-control]').count()).toBe(0)
    expect(await page.textContent('[data-testid=phase-legend]')).not.toContain('α')
    await screenshot(page, 'room-workbench-plane-1280')

    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/runs/new?graphId=${ids.graphId}`)
    const select = page.locator('[data-testid=run-kind]')
    await select.waitFor()
    // the select is at least as wide as its longest option text (measured in its own font) plus the arrow
    const fit = await select.evaluate((el) => {
      const s = el as HTMLSelectElement
      const c = document.createElement('canvas').getContext('2d')!
      c.font = getComputedStyle(s).font
      const longest = Math.max(...[...s.options].map(o => c.measureText(o.text).width))
      return { width: s.clientWidth, longest }
    })
    expect(fit.width).toBeGreaterThan(fit.longest + 24)
    await screenshot(page, 'room-run-form-1280')
    await page.close()
  })

  it('one date format, a file keeps its name, verbs grouped, refusals in sentences', async () => {
    const page = await ctx.browser.newPage({ width: 1280, height: 900 })
    // a refused sign-in
    await ctx.browser.context.clearCookies()
    await gotoHydrated(page, `${ctx.server.url}/sign-in`)
    await page.fill('#email', demo('owner').email)
    await page.fill('#password', 'not-the-password')
    await page.click('button[type=submit]')
    await expect.poll(() => page.textContent('[data-testid=sign-in-form]')).toContain('Wrong e-mail or password.')
    expect(await page.textContent('[data-testid=sign-in-form]')).not.toContain('Server Error')

    await signInFresh(page, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/runs`)
    const started = await page.locator('tr[data-run-id] td:last-child').allTextContents()
    expect(started.length).toBeGreaterThan(0)
    for (const d of started) expect(d.trim()).toMatch(DATE_TIME)
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/patterns/${ids.graphId}`)
    const versionDates = await page.locator('[data-testid=versions-list] li div.text-xs > span:first-child').allTextContents()
    expect(versionDates.length).toBeGreaterThan(0)
    for (const d of versionDates) expect(d.split(' · ').at(-1)!.trim()).toMatch(DATE_TIME)

    // a file whose document carries only the blank name takes the file's name
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/patterns/new`)
    await page.waitForSelector('[data-testid=files-panel]')
    const blankNamed = { ...squarePair.document, name: 'Untitled pattern' }
    await page.setInputFiles('[data-testid=file-input]', { name: 'diagonal-pair-study.wfp.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(blankNamed)) })
    await expect.poll(() => page.inputValue('[data-testid=pattern-name]')).toBe('diagonal-pair-study')
    await page.setInputFiles('[data-testid=file-input]', { name: 'download.wfp.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(squarePair.document)) })
    await expect.poll(() => page.inputValue('[data-testid=pattern-name]')).toBe(squarePair.document.name)

    // an editor made a viewer while editing: the save says so in a sentence
    const owner = await signInAs(ctx.server.url, 'owner')
    const editorId = ((await owner.json('GET', `/api/projects/${ids.torusId}/members`)).body as Array<{ userId: number, email: string }>).find(m => m.email === demo('editor').email)!.userId
    await signInFresh(page, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${ids.torusId}/patterns/${ids.pairId}`)
    await page.waitForSelector('[data-testid=save-form]')
    expect((await owner.json('PATCH', `/api/projects/${ids.torusId}/members/${editorId}`, { role: 'viewer' })).status).toBe(200)
    await page.fill('[data-testid=save-message]', 'moved nothing')
    await page.click('[data-testid=save]')
    await expect.poll(() => page.textContent('[data-testid=save-error]')).toMatch(/^Viewers cannot save\./)
    await screenshot(page, 'room-viewer-save-refused-1280')
    expect((await owner.json('PATCH', `/api/projects/${ids.torusId}/members/${editorId}`, { role: 'editor' })).status).toBe(200)

    // the admin's activity filter: one "finished", whatever the runs' endings
    await signInFresh(page, 'admin')
    await gotoHydrated(page, `${ctx.server.url}/admin/activity`)
    const verbs = await page.locator('select[aria-label="Filter by action"] option').allTextContents()
    expect(verbs.filter(v => v.startsWith('finished'))).toEqual(['finished'])
    await page.selectOption('select[aria-label="Filter by action"]', 'finished')
    await expect.poll(() => page.locator('[data-testid=activity-table] tbody tr').count()).toBe(2)
    expect(await page.textContent('[data-testid=activity-table] tbody')).toContain('stopped: no convergence at λ = −0.42')
    for (const d of await page.locator('[data-testid=activity-table] tbody tr td:first-child').allTextContents()) expect(d.trim()).toMatch(DATE_TIME)
    await screenshot(page, 'room-admin-activity-1280')
    await page.close()
  })
})
