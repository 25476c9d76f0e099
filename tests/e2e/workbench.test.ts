/**
 * The pattern workbench in real Chromium against the built server: an editor draws a pattern
 * with the mouse, sees it unbalanced, balances it, saves and finds the version; a viewer gets it
 * read-only; a 200-tower pattern is dragged while the Long Tasks API watches the main thread.
 */
import { availableParallelism, loadavg } from 'node:os'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'

const ctx = useServerAndBrowser()
let patternUrl = ''

/** Page position of world point p on the workbench canvas (reads the view from data attributes). */
async function at(page: Page, p: [number, number]): Promise<[number, number]> {
  const canvas = page.locator('[data-testid=canvas]')
  const box = (await canvas.boundingBox())!
  const [scale, cx, cy] = await Promise.all(['data-scale', 'data-cx', 'data-cy'].map(async a => Number(await canvas.getAttribute(a))))
  return [box.x + box.width / 2 + (p[0] - cx!) * scale!, box.y + box.height / 2 - (p[1] - cy!) * scale!]
}

async function dragWorld(page: Page, a: [number, number], b: [number, number], steps = 6) {
  const [x0, y0] = await at(page, a)
  const [x1, y1] = await at(page, b)
  await page.mouse.move(x0, y0)
  await page.mouse.down()
  await page.mouse.move(x1, y1, { steps })
  await page.mouse.up()
}

/** Wait until the verdict panel shows a finished analysis of the current drawing. */
async function verdictsCurrent(page: Page, minRuns = 1) {
  await page.waitForFunction((n) => {
    const el = document.querySelector('[data-testid=verdicts]')
    return el?.getAttribute('data-state') === 'current' && Number(el.getAttribute('data-runs')) >= n
  }, minRuns, { timeout: 30_000 })
}

const runsOf = async (page: Page) => Number(await page.getAttribute('[data-testid=verdicts]', 'data-runs'))

describe('pattern workbench', () => {
  it('draws two towers and four edges across the boundary, balances, saves and finds the version', async () => {
    const page = await ctx.browser.newPage({ width: 1366, height: 1000 })
    await signInWithForm(page, ctx.server.url, 'editor')
    await page.click('text=Genus-three torus gluings')
    await page.click('[data-testid=new-pattern]')
    await page.waitForSelector('[data-testid=canvas]')
    await verdictsCurrent(page)
    expect(await page.textContent('[data-testid=draft-issues]')).toContain('vertices')

    // two towers with the mouse
    await page.click('[data-testid=tool-vertex]')
    for (const p of [[0.2, 0.25], [0.6, 0.55]] as [number, number][]) {
      const [x, y] = await at(page, p)
      await page.mouse.click(x, y)
    }
    expect(await page.locator('[data-testid=vertex]').count()).toBe(2)
    expect(await page.locator('[data-testid=copies] use').count()).toBe(8) // the eight faded copies around the cell
    await page.keyboard.press('-') // zoom out so the copies below the cell are on screen

    // four edges from the first tower to the second and three of its copies (the copy sets the shift)
    await page.click('[data-testid=tool-edge]')
    for (const [k1, k2] of [[0, 0], [-1, 0], [0, -1], [-1, -1]] as const) await dragWorld(page, [0.2, 0.25], [0.6 + k1, 0.55 + k2])
    expect(await page.locator('[data-testid=edge]').count()).toBe(4)

    const runsBefore = await runsOf(page)
    await verdictsCurrent(page, runsBefore)
    await page.waitForSelector('[data-testid=verdict-balance][data-ok=false]')
    expect(await page.getAttribute('[data-testid=verdict-degrees]', 'data-ok')).toBe('true')
    expect(await page.getAttribute('[data-testid=verdict-orientable]', 'data-ok')).toBe('true')
    expect(await page.textContent('[data-testid=topology]')).toContain('genus 3') // E − V + 1 = 4 − 2 + 1 (H. Chen, M. Traizet, Gluing Karcher–Scherk saddle towers I: Triply periodic minimal surfaces, arXiv 2103.15676, 2021, Thm 6.7)
    await page.click('[data-testid=verdict-balance] button')
    expect(await page.locator('[data-testid=arrow]').count()).toBe(2)
    await screenshot(page, 'workbench-unbalanced')

    // balance in the worker; the drawing glides to the balanced positions
    await page.click('[data-testid=balance]')
    await page.waitForSelector('[data-testid=balance-note]:has-text("Balanced")')
    await page.waitForSelector('[data-testid=verdict-balance][data-ok=true]', { timeout: 30_000 })
    await page.waitForSelector('[data-testid=verdict-rigidity][data-ok=true]')
    expect(await page.getAttribute('[data-testid=verdicts]', 'data-balanced')).toBe('true')
    expect(await page.getAttribute('[data-testid=verdicts]', 'data-rigid')).toBe('true')
    // undo brings the rough drawing back, redo the balanced one
    await page.click('[data-testid=undo]')
    await page.waitForSelector('[data-testid=verdict-balance][data-ok=false]', { timeout: 30_000 })
    await page.click('[data-testid=redo]')
    await page.waitForSelector('[data-testid=verdict-balance][data-ok=true]', { timeout: 30_000 })
    await screenshot(page, 'workbench-balanced')

    // save, reload, find the version
    await page.fill('[data-testid=pattern-name]', 'Diagonal pair by hand')
    await page.fill('[data-testid=save-message]', 'first drawing, balanced')
    await Promise.all([page.waitForURL(/\/patterns\/\d+$/), page.click('[data-testid=save]')])
    patternUrl = page.url()
    await page.reload()
    await page.waitForSelector('[data-testid=versions-list]')
    expect(await page.textContent('[data-testid=graph-version]')).toContain('version 1 of 1')
    const list = await page.textContent('[data-testid=versions-list]')
    expect(list).toContain('first drawing, balanced')
    expect(list).toContain('Neve Ashdown')
    await verdictsCurrent(page)
    expect(await page.getAttribute('[data-testid=verdict-balance]', 'data-ok')).toBe('true')
    await screenshot(page, 'workbench-saved')

    // the project's list links to it with the stored badges
    await gotoHydrated(page, patternUrl.replace(/\/patterns\/\d+$/, ''))
    const item = page.locator('[data-testid=graphs-list] li', { hasText: 'Diagonal pair by hand' })
    expect(await item.textContent()).toContain('balanced')
    expect(await item.locator('text=✗').count()).toBe(0)
  })

  it('shows a viewer the pattern read-only and the API refuses their save', async () => {
    expect(patternUrl).not.toBe('')
    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'viewer')
    await gotoHydrated(page, patternUrl)
    await page.waitForSelector('[data-testid=workbench][data-readonly=true]')
    await verdictsCurrent(page)
    expect(await page.locator('[data-testid^=tool-]').count()).toBe(0)
    expect(await page.locator('[data-testid=save-form]').count()).toBe(0)
    expect(await page.locator('[data-testid=balance]').count()).toBe(0)
    expect(await page.textContent('[data-testid=read-only-note]')).toContain('viewer')
    const status = await page.evaluate(async (url) => {
      const api = url.replace('/projects/', '/api/projects/').replace('/patterns/', '/graphs/')
      const doc = await (await fetch(api)).json()
      const res = await fetch(`${api}/versions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ document: doc.document, message: 'viewer edit' }) })
      return res.status
    }, patternUrl)
    expect(status).toBe(403)
    await screenshot(page, 'workbench-viewer')
  })

  it('drags a tower of a 200-tower pattern; the worker keeps the verdicts current (long tasks printed)', async () => {
    // 10 × 20 grid of degree-4 towers in the torus with ω1 = (1, 0), ω2 = (0, 2)
    const n1 = 10, n2 = 20
    const id = (i: number, j: number) => `t${i}-${j}`
    const vertices = [], edges = []
    for (let i = 0; i < n1; i++) {
      for (let j = 0; j < n2; j++) {
        // a small seeded-free, deterministic wobble so the drawing is not balanced
        vertices.push({ id: id(i, j), position: [(i + 0.5) / n1 + 0.01 * Math.sin(7 * i + 3 * j), (j + 0.5) / n1 + 0.01 * Math.cos(5 * i - 2 * j)] })
        edges.push({ id: `h${i}-${j}`, from: id(i, j), to: id((i + 1) % n1, j), shift: [i + 1 === n1 ? 1 : 0, 0] })
        edges.push({ id: `u${i}-${j}`, from: id(i, j), to: id(i, (j + 1) % n2), shift: [0, j + 1 === n2 ? 1 : 0] })
      }
    }
    const document = { format: 'wingfold-pattern', version: 1, name: 'Large grid', space: 'torus', lattice: { w1: [1, 0], w2: [0, 2] }, vertices, edges }
    const editor = await signInAs(ctx.server.url, 'editor')
    const projects = (await editor.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
    const projectId = projects.find(p => p.name === 'Genus-three torus gluings')!.id
    const created = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name: 'Large grid', document, message: 'generated' })
    expect(created.status).toBe(201)

    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'editor')
    await gotoHydrated(page, `${ctx.server.url}/projects/${projectId}/patterns/${created.body.id}`)
    await verdictsCurrent(page)
    expect(await page.textContent('[data-testid=topology]')).toContain('V 200 · E 400')
    const runs0 = await runsOf(page)

    await page.evaluate(() => {
      const w = window as unknown as { __longTasks: Array<[number, number]>, __pointer: Record<string, number> }
      w.__longTasks = []
      w.__pointer = {}
      new PerformanceObserver(list => { for (const e of list.getEntries()) w.__longTasks.push([e.startTime, e.duration]) }).observe({ type: 'longtask' })
      for (const t of ['pointerdown', 'pointerup']) window.addEventListener(t, () => { w.__pointer[t] = performance.now() }, true)
    })
    const grab = vertices[37]!.position as [number, number]
    const [x0, y0] = await at(page, grab)
    await page.mouse.move(x0, y0)
    await page.mouse.down()
    for (let s = 1; s <= 60; s++) await page.mouse.move(x0 + s * 1.5, y0 + s * 0.8)
    await page.mouse.up()
    await verdictsCurrent(page, runs0 + 1)
    const { entries, down, up } = await page.evaluate(() => {
      const w = window as unknown as { __longTasks: Array<[number, number]>, __pointer: Record<string, number> }
      return { entries: w.__longTasks, down: w.__pointer.pointerdown ?? 0, up: w.__pointer.pointerup ?? Infinity }
    })
    const tasks = entries.map(([, d]) => d)
    // where each long task started: with the press, between press and release (the moves), or after the release
    const when = entries.map(([t, d]) => `${t + d < down + 1 ? 'before' : t <= down + 1 ? 'press' : t < up ? 'moves' : 'after'} ${d.toFixed(0)}`)
    console.log(`[workbench] 200 towers, 60 drag moves: ${tasks.length} main-thread long tasks (> 50 ms), max ${tasks.length ? Math.max(...tasks).toFixed(0) : 0} ms [${when.join(', ')}]; verdict runs ${runs0} → ${await runsOf(page)}; load average ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} cores`)
    // the worker answered for the dragged drawing: the panel is current and has run again
    expect(await runsOf(page)).toBeGreaterThan(runs0)
    expect(await page.getAttribute('[data-testid=verdicts]', 'data-state')).toBe('current')
    await screenshot(page, 'workbench-large')
  })
})
