/**
 * The 3-D surface view in real Chromium against the built server: it opens on every demo
 * pattern (a reason instead of a mesh where the pattern has no saddle towers); on a demo torus
 * pattern the schematic is drawn with WebGL (software rendering with --disable-gpu), relaxed in
 * the worker while the Long Tasks API watches the main thread, and exported as STL whose quotient
 * genus, read from the file, is E − V + 1 (H. Chen, M. Traizet, arXiv 2103.15676, 2021,
 * Thm 6.7); three.js is loaded only on pages that draw a surface; on a run page one click shows
 * the surface at a point and the family animates along its branch.
 */
import { mkdirSync } from 'node:fs'
import { readFile } from 'node:fs/promises'
import { resolve } from 'node:path'
import { availableParallelism, loadavg } from 'node:os'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { PATTERN_EXAMPLES, findPatternExample } from '../../shared/examples'
import { readStl } from '../../shared/surface/export-stl'
import { buildSchematic } from '../../shared/surface/schematic'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { soupGenus } from '../support/surface-genus'
import { computeBatches, graphIdByName, projectIdByName } from '../server/runs-helpers'

const ctx = useServerAndBrowser()

/** Requests for three.js chunks (the module's code, whatever the chunk is called). */
function watchThree(page: Page): string[] {
  const seen: string[] = []
  page.on('response', async (r) => {
    if (!r.url().endsWith('.js')) return
    const body = await r.text().catch(() => '')
    if (body.includes('WebGLRenderer') || body.includes('THREE.WebGLRenderer')) seen.push(r.url())
  })
  return seen
}

/** The 3-D view alone, larger than in the page screenshot. */
async function canvasShot(page: Page, name: string) {
  mkdirSync(resolve(__dirname, '../artifacts'), { recursive: true })
  await page.locator('[data-testid=surface-canvas]').screenshot({ path: resolve(__dirname, `../artifacts/${name}.png`) })
}

async function openSurface(page: Page) {
  await page.click('[data-testid=show-surface]')
  await page.waitForFunction(() => {
    const p = document.querySelector('[data-testid=surface-panel]')
    return p && (p.getAttribute('data-kind') || document.querySelector('[data-testid=surface-error]')) && p.getAttribute('data-webgl') !== ''
  }, null, { timeout: 60_000 })
}

describe('surface view', () => {
  it('opens on every demo pattern, with the genus E − V + 1 or the reason it cannot be built', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'owner')
    let opened = 0
    for (const project of ['Genus-three torus gluings', 'Open-wing towers in the plane']) {
      const pid = await projectIdByName(owner, project)
      const graphs = (await owner.json('GET', `/api/projects/${pid}/graphs`)).body as Array<{ id: number, name: string }>
      for (const g of graphs) {
        const ex = PATTERN_EXAMPLES.find(e => e.title === g.name)
        if (!ex) continue
        await gotoHydrated(page, `${ctx.server.url}/projects/${pid}/patterns/${g.id}`)
        await openSurface(page)
        const kind = await page.getAttribute('[data-testid=surface-panel]', 'data-kind')
        if (kind) {
          const d = ex.document
          expect(await page.textContent('[data-testid=surface-genus]'), ex.slug).toContain(`E − V + 1 = ${d.edges.length - d.vertices.length + 1}`)
          expect(await page.textContent('[data-testid=surface-kind-note]')).toContain('It is not the minimal surface')
          if (d.space === 'plane') {
            // one open end per wing (Chen 2024, Thm 2), also after cutting the wings shorter
            const wings = d.wings?.length ?? 0
            expect(await page.textContent('[data-testid=surface-report]')).toContain(`open ends${wings} (pattern: ${wings})`)
            const before = await page.textContent('[data-testid=surface-report]')
            await page.selectOption('[data-testid=surface-wing-length]', String(2 * Math.PI))
            await page.waitForFunction((b) => document.querySelector('[data-testid=surface-report]')?.textContent !== b, before, { timeout: 30_000 })
            expect(await page.textContent('[data-testid=surface-report]')).toContain(`open ends${wings} (pattern: ${wings})`)
          }
        }
        else expect(await page.textContent('[data-testid=surface-error]'), ex.slug).toMatch(/wings; a saddle tower needs an even number/)
        await canvasShot(page, `surface-demo-${ex.slug}`)
        opened++
      }
    }
    expect(opened).toBe(PATTERN_EXAMPLES.length)
  })

  it('draws a demo torus pattern with WebGL, relaxes it without long main-thread tasks, exports an STL of genus E − V + 1; three.js only where used', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const pid = await projectIdByName(owner, 'Genus-three torus gluings')
    const ex = findPatternExample('square-pair')!
    const gid = await graphIdByName(owner, pid, ex.title)
    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    const three = watchThree(page)
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${pid}`)
    await gotoHydrated(page, `${ctx.server.url}/projects/${pid}/patterns/${gid}`)
    expect(three, 'three.js loaded before the surface view was opened').toEqual([])
    await openSurface(page)
    const webgl = await page.getAttribute('[data-testid=surface-panel]', 'data-webgl')
    console.log(`[surface] WebGL in headless Chromium (--disable-gpu): ${webgl === 'true' ? 'available (software rendering)' : 'NOT available'}`)
    expect(three.length).toBeGreaterThan(0)
    if (webgl === 'true') {
      // the canvas is not blank: some pixels differ from the background
      const distinct = await page.evaluate(() => {
        const c = document.querySelector('[data-testid=surface-webgl]') as HTMLCanvasElement
        const g = document.createElement('canvas'); g.width = c.width; g.height = c.height
        const x = g.getContext('2d')!; x.drawImage(c, 0, 0)
        const px = x.getImageData(0, 0, g.width, g.height).data
        let n = 0
        for (let i = 0; i < px.length; i += 4 * 97) if (Math.abs(px[i]! - 248) + Math.abs(px[i + 1]! - 250) + Math.abs(px[i + 2]! - 252) > 30) n++
        return n
      })
      expect(distinct).toBeGreaterThan(50)
    }
    else expect(await page.textContent('[data-testid=surface-no-webgl]')).toContain('WebGL is not available')
    await screenshot(page, 'surface-schematic')

    await page.evaluate(() => {
      const w = window as unknown as { __longTasks: Array<[number, number]> }
      w.__longTasks = []
      new PerformanceObserver(list => { for (const e of list.getEntries()) w.__longTasks.push([e.startTime, e.duration]) }).observe({ type: 'longtask' })
    })
    const t0 = await page.evaluate(() => performance.now())
    await page.click('[data-testid=surface-relax]')
    await page.waitForSelector('[data-testid=surface-panel][data-kind=relaxed]', { timeout: 120_000 })
    const { tasks, ended } = await page.evaluate(() => ({
      tasks: (window as unknown as { __longTasks: Array<[number, number]> }).__longTasks,
      ended: Number(document.querySelector('[data-testid=surface-panel]')!.getAttribute('data-relax-ended')),
    }))
    const during = tasks.filter(([t]) => t >= t0 && t < ended).map(([, d]) => d)
    const after = tasks.filter(([t]) => t >= ended).map(([, d]) => d)
    console.log(`[surface] relaxation ${(ended - t0).toFixed(0)} ms; main-thread tasks over 50 ms while relaxing: ${during.length} [${during.map(d => d.toFixed(0)).join(', ')}]; drawing the result: ${after.length} [${after.map(d => d.toFixed(0)).join(', ')}]; load average ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} cores`)
    // The aim is no task over 50 ms; the bound is generous because 2 cores are shared by many jobs
    // (seen: none in two runs, one of 110 ms at load average 18). Relaxing on the main thread
    // would be one task as long as the relaxation itself (700–1300 ms here).
    expect(Math.max(0, ...during)).toBeLessThan(250)
    expect(await page.textContent('[data-testid=surface-kind-note]')).toContain('discrete minimal surface')
    expect(await page.textContent('[data-testid=surface-genus]')).toContain('= E − V + 1 = 3')
    await screenshot(page, 'surface-relaxed')
    await canvasShot(page, 'surface-relaxed-canvas')

    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid=surface-export-stl]')])
    const stl = readStl(new Uint8Array(await readFile((await download.path())!)))
    expect(stl.header).toMatch(/^Wingfold relaxed v\d+ rows=24 .*n=2x2x1/)
    // one cell's genus, read back from the file (the 2×2×1 copies fold onto the one cell)
    const periods = buildSchematic(ex.document).mesh.periods
    expect(soupGenus(stl.triangles, periods)).toBe(ex.document.edges.length - ex.document.vertices.length + 1)

    await page.selectOption('[data-testid=surface-colour]', 'height')
    await canvasShot(page, 'surface-relaxed-height')
  })

  it('on a run page: one click shows the surface at a point, and the family animates along its branch', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const pid = await projectIdByName(owner, 'Genus-three torus gluings')
    const ex = findPatternExample('square-pair')!
    const settings = { path: { kind: 'alpha1' as const }, to: 2.5, stop: { maxPoints: 12 } }
    const runId = (await owner.json('POST', `/api/projects/${pid}/runs`, { graphId: await graphIdByName(owner, pid, ex.title), name: 'square pair α1', settings })).body.id
    for (const b of computeBatches(ex.document, settings)) await owner.json('POST', `/api/runs/${runId}/points`, { points: b.points, specialPoints: b.specialPoints })
    await owner.json('POST', `/api/runs/${runId}/finish`, { status: 'complete' })
    await ctx.browser.context.clearCookies()
    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${pid}/runs/${runId}`)
    await page.click('[data-testid=run-surface-show]')
    await page.waitForSelector('[data-testid=surface-panel][data-kind=schematic]', { timeout: 60_000 })
    expect(await page.textContent('[data-testid=run-surface-label]')).toContain('point 0')
    await page.click('[data-testid=run-surface-animate]')
    const labels = new Set<string>()
    await page.waitForFunction(() => /point [1-9]/.test(document.querySelector('[data-testid=run-surface-label]')?.textContent ?? ''), null, { timeout: 30_000 })
    for (let i = 0; i < 3; i++) {
      labels.add((await page.textContent('[data-testid=run-surface-label]'))!)
      await page.waitForFunction((l) => document.querySelector('[data-testid=run-surface-label]')?.textContent !== l, [...labels].pop(), { timeout: 30_000 })
    }
    expect(labels.size).toBeGreaterThanOrEqual(3)
    await screenshot(page, 'surface-run-animating')
    await page.click('[data-testid=run-surface-animate]')
  })
})
