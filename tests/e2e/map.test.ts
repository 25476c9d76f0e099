/**
 * Real Chromium against the built server: the demo owner opens the maps page from the project,
 * computes a 21×21 τ map of a demo pattern with one worker and then with the pool (one worker
 * per core), looks at a cell, saves the map (the server verifies a sample of cells) and opens it
 * from the library. Prints both wall times, measured in this run (not asserted).
 */
import { availableParallelism, loadavg } from 'node:os'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { findPatternExample } from '../../shared/examples'
import { signInAs } from '../support/http'
import { computeBatches, graphIdByName, projectIdByName } from '../server/runs-helpers'

const ctx = useServerAndBrowser()
const pattern = findPatternExample('square-pair')!

/** Main-thread long tasks (> 50 ms, PerformanceObserver 'longtask') recorded from page start. */
async function observeLongTasks(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: Array<[number, number]> }
    w.__longTasks = []
    new PerformanceObserver(list => { for (const e of list.getEntries()) w.__longTasks.push([e.startTime, e.duration]) }).observe({ type: 'longtask', buffered: true })
  })
}

/** Long tasks that started at or after `t0` (page clock, ms): [start − t0, duration]. */
async function tasksSince(page: Page, t0: number): Promise<Array<[number, number]>> {
  return page.evaluate(t => (window as unknown as { __longTasks: Array<[number, number]> }).__longTasks.filter(([s]) => s >= t).map(([s, d]) => [s - t, d] as [number, number]), t0)
}

async function compute(page: Page, workers: number): Promise<{ text: string, wallS: number, longTasks: number[] }> {
  await page.fill('[data-testid=map-workers]', String(workers))
  const t0 = await page.evaluate(() => performance.now())
  await page.click('[data-testid=map-compute]')
  await page.waitForSelector('[data-testid=map-timing]', { timeout: 120_000 })
  // the map is on screen when its chart has drawn (the chart code loads on first use)
  await page.locator('[data-testid=map-heatmap] canvas').first().waitFor()
  const text = (await page.textContent('[data-testid=map-timing]'))!
  const tasks = await tasksSince(page, t0)
  console.log(`[map] ${workers} worker(s): long tasks at [start ms after the click, duration ms]: ${JSON.stringify(tasks.map(([a, d]) => [Math.round(a), Math.round(d)]))}`)
  return { text, wallS: Number(/in ([\d.]+) s/.exec(text)![1]), longTasks: tasks.map(([, d]) => d) }
}

/**
 * The colour the heat map's canvas shows at (x, y) of a map whose axes run over [x0, x1] × [y0, y1]
 * (cell centres ± half a step): the plot area is the grid of Heatmap.vue (left 60, right 90,
 * top 56, bottom 50 CSS pixels), the canvas is scaled by its device pixel ratio.
 */
async function heatmapColour(page: Page, x: number, y: number, win: [number, number, number, number]): Promise<[number, number, number]> {
  return page.evaluate(([x, y, x0, x1, y0, y1]) => {
    const c = document.querySelector('[data-testid=map-heatmap] canvas') as HTMLCanvasElement
    const r = c.getBoundingClientRect()
    const px = 60 + ((x! - x0!) / (x1! - x0!)) * (r.width - 150), py = 56 + ((y1! - y!) / (y1! - y0!)) * (r.height - 106)
    const d = c.getContext('2d')!.getImageData(Math.round(px * c.width / r.width), Math.round(py * c.height / r.height), 1, 1).data
    return [d[0]!, d[1]!, d[2]!] as [number, number, number]
  }, [x, y, ...win])
}

describe('moduli map in the browser', () => {
  it('computes a 21×21 τ map with the pool, shows it and saves it', { timeout: 300_000 }, async () => {
    const page = await ctx.browser.newPage({ width: 1500, height: 1000 })
    page.on('pageerror', e => console.log('page error:', e.message))
    await observeLongTasks(page)
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
    const tasks = [...one.longTasks, ...pool.longTasks]
    console.log(`[map] main-thread long tasks (> 50 ms) during the two computations: ${tasks.length}, max ${tasks.length ? Math.max(...tasks).toFixed(0) : 0} ms [${tasks.map(d => d.toFixed(0)).join(', ')}] (target: none; load average ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} cores)`)
    // generous bounds for a shared, loaded machine (measured: 3 tasks, longest 105–185 ms at load
    // 18–23 on 2 cores, all while the finished map is first drawn; once up to 533 ms at load 18);
    // the target is no task over 50 ms
    expect(tasks.length).toBeLessThanOrEqual(8)
    expect(Math.max(0, ...tasks)).toBeLessThan(800)

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

describe('curves and cancel', () => {
  it('traces the collapse curves of the Fermat pair over its map, draws a saved family, saves them, and keeps partial rows on cancel', { timeout: 300_000 }, async () => {
    // a saved family of the same pattern (stretch of Im τ), stored through the run API
    const api = await signInAs(ctx.server.url, 'owner')
    const fermat = findPatternExample('fermat-pair')!
    const projectId = await projectIdByName(api, 'Genus-three torus gluings')
    const settings = { path: { kind: 'stretch' as const }, to: 1.5, stop: { maxPoints: 40 } }
    const run = await api.json('POST', `/api/projects/${projectId}/runs`, { graphId: await graphIdByName(api, projectId, fermat.title), name: 'stretch up', settings })
    expect(run.status).toBe(201)
    for (const b of computeBatches(fermat.document, settings)) expect((await api.json('POST', `/api/runs/${run.body.id}/points`, { points: b.points, specialPoints: b.specialPoints })).status).toBe(200)

    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage({ width: 1500, height: 1000 })
    page.on('pageerror', e => console.log('page error:', e.message))
    await observeLongTasks(page)
    await signInWithForm(page, ctx.server.url, 'owner')
    await page.click('text=Genus-three torus gluings')
    await page.click('[data-testid=maps-link]')
    await page.waitForSelector('[data-testid=map-setup]')
    await page.selectOption('[data-testid=map-graph]', { label: fermat.title })
    for (const [k, v] of Object.entries({ 'x-min': '-0.9', 'x-max': '1.9', 'x-count': '15', 'y-min': '0.4', 'y-max': '1.6', 'y-count': '7' })) await page.fill(`[data-testid=map-${k}]`, v)
    await compute(page, 2)
    // rows end where an angle of the triangle (0, 1, τ) reaches 120° (Fermat–Torricelli): two curves, at 0 and at 1
    await page.click('[data-testid=map-trace]')
    await page.waitForSelector('[data-testid=map-curves]', { timeout: 60_000 })
    expect(await page.textContent('[data-testid=map-curves]')).toBe('2 curves traced')
    const overlays = await page.textContent('[data-testid=map-overlays]')
    expect(overlays).toContain('collapse of edge to-origin')
    expect(overlays).toContain('collapse of edge to-w1')
    expect(overlays).toContain('family: stretch up')
    await page.fill('[data-testid=map-name]', 'Fermat pair: collapse curves')
    await page.click('[data-testid=map-save]')
    await page.waitForSelector('[data-testid=map-saved]')
    expect(await page.textContent('[data-testid=map-saved]')).toContain('verified')
    await screenshot(page, 'map-fermat-curves')

    // the two shades: on the Fermat pair at Im τ = 0.1, τ = −0.9 + 0.1i is unreachable from the seed
    // (no straight run from a balanced cell gets there) and τ = 0.5 + 0.1i lies past a collapse (the
    // angle at τ is 2·atan(5) ≈ 157° > 120°: Fermat–Torricelli, derived); the map's own cell states say so
    for (const [k, v] of Object.entries({ 'x-min': '-0.9', 'x-max': '1.9', 'x-count': '15', 'y-min': '0.1', 'y-max': '0.5', 'y-count': '5' })) await page.fill(`[data-testid=map-${k}]`, v)
    await page.fill('[data-testid=map-workers]', '2')
    await page.click('[data-testid=map-compute]')
    await expect.poll(async () => (await page.textContent('[data-testid=map-timing]').catch(() => '')) ?? '', { timeout: 120_000, interval: 100 }).toMatch(/5 of 5 rows/)
    const win: [number, number, number, number] = [-1.0, 2.0, 0.05, 0.55]
    // sample a little off the cell centre, away from crossing markers drawn on the cell borders
    const UNREACHABLE = [0xec, 0xe8, 0xdf], DEGENERATE = [0x9b, 0x93, 0x84] // Heatmap.vue's two stones
    const near = (a: number[], b: number[]) => a.every((v, i) => Math.abs(v - b[i]!) <= 3)
    await expect.poll(async () => near(await heatmapColour(page, -0.9 + 0.04, 0.1 + 0.015, win), UNREACHABLE), { timeout: 20_000, interval: 100 }).toBe(true)
    expect(near(await heatmapColour(page, 0.5 + 0.04, 0.1 + 0.015, win), DEGENERATE)).toBe(true)
    // a solved cell of the same map is neither
    const solved = await heatmapColour(page, 0.1 + 0.04, 0.3 + 0.015, win)
    expect(near(solved, UNREACHABLE) || near(solved, DEGENERATE)).toBe(false)
    await page.mouse.move(0, 0)
    await screenshot(page, 'map-two-shades')

    // cancel: a 61-row map stopped early keeps the rows it finished
    await page.selectOption('[data-testid=map-graph]', { label: pattern.title })
    for (const [k, v] of Object.entries({ 'x-min': '-0.5', 'x-max': '0.5', 'x-count': '61', 'y-min': '0.8', 'y-max': '2', 'y-count': '61' })) await page.fill(`[data-testid=map-${k}]`, v)
    await page.fill('[data-testid=map-workers]', '1')
    await page.click('[data-testid=map-compute]')
    await expect.poll(async () => /^\s*([1-9]\d*) \/ 61 rows/.test((await page.textContent('[data-testid=map-progress]')) ?? ''), { timeout: 60_000, interval: 50 }).toBe(true)
    await page.click('[data-testid=map-cancel]')
    await page.waitForSelector('[data-testid=map-timing]')
    const done = Number(/(\d+) of 61 rows/.exec((await page.textContent('[data-testid=map-timing]'))!)![1])
    expect(done).toBeGreaterThan(0)
    expect(done).toBeLessThan(61)
  })
})

describe('a collapsed run in the special-points table', () => {
  it('shows where the run stopped beside where the collapse is', { timeout: 120_000 }, async () => {
    // the demo Fermat pair (ω1 = (2, 0), ω2 = (1, 2)) sheared by s: τ = (0.5 + s) + i, and the edge to
    // the origin reaches length 0 where the corner angle at 0 is 120°, Re τ = −1/√3 (Fermat–Torricelli,
    // derived): s = −1/2 − 1/√3; the run stops at the collapse tolerance before it
    const api = await signInAs(ctx.server.url, 'owner')
    const fermat = findPatternExample('fermat-pair')!
    const projectId = await projectIdByName(api, 'Genus-three torus gluings')
    const settings = { path: { kind: 'shear' as const }, to: -2 }
    const run = await api.json('POST', `/api/projects/${projectId}/runs`, { graphId: await graphIdByName(api, projectId, fermat.title), name: 'shear to the collapse', settings })
    const batches = computeBatches(fermat.document, settings)
    for (const b of batches) expect((await api.json('POST', `/api/runs/${run.body.id}/points`, { points: b.points, specialPoints: b.specialPoints })).status).toBe(200)
    const collapse = batches.flatMap(b => b.specialPoints).find(s => s.kind === 'collapse')!

    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage({ width: 1500, height: 1000 })
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${projectId}/runs/${run.body.id}`)
    const row = page.locator('[data-testid=special-points] tr[data-kind=collapse]')
    await row.waitFor()
    const exact = -0.5 - 1 / Math.sqrt(3)
    expect(Number(await row.locator('[data-testid=special-lambda]').innerText())).toBeCloseTo(exact, 6)
    const stopped = Number(await row.locator('[data-testid=special-stopped-at]').innerText())
    expect(stopped).toBeCloseTo(collapse.stoppedAt!.lambda, 6)
    expect(stopped).toBeGreaterThan(exact)
    await screenshot(page, 'run-stopped-at')
  })
})
