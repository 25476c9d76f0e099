/**
 * Real Chromium: the demo owner downloads a project archive from the project page (progress shown
 * while it streams), the editor imports it from the projects page (upload progress, what was
 * verified again), invites one of the archived members again, and a tampered archive is refused
 * with the names of what failed. Screenshots in tests/artifacts/.
 */
import { readFileSync, writeFileSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { useServerAndBrowser } from '../support/fixtures'
import { gotoHydrated, screenshot, signInWithForm } from '../support/browser'
import { signInAs } from '../support/http'
import { archiveTexts, fillProject, rezip } from '../server/archive-support'

const ctx = useServerAndBrowser()
const work = mkdtempSync(join(tmpdir(), 'wingfold-archive-e2e-'))
afterAll(() => rmSync(work, { recursive: true, force: true }))

describe('project archives in the browser', () => {
  it('downloads, imports, offers the members as invitations, and shows a refusal by name', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const project = ((await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>).find(p => p.name === 'Genus-three torus gluings')!
    const seededRuns = ((await owner.json('GET', `/api/projects/${project.id}/runs`)).body as unknown[]).length // the demo seed's
    await fillProject(owner, project.id)

    const page = await ctx.browser.newPage()
    await signInWithForm(page, ctx.server.url, 'owner')
    await gotoHydrated(page, `${ctx.server.url}/projects/${project.id}`)
    await page.locator('[data-testid=archive-download]').scrollIntoViewIfNeeded()
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid=archive-download-button]')])
    const file = join(work, download.suggestedFilename())
    await download.saveAs(file)
    await page.waitForSelector('text=Archive downloaded')
    await screenshot(page, 'archive-1-downloaded')
    expect(download.suggestedFilename()).toMatch(/^wingfold-project-\d+-Genus-three-torus-gluings\.zip$/)
    const texts = archiveTexts(readFileSync(file))
    expect(JSON.parse(texts['manifest.json']!).counts.runs).toBe(seededRuns + 1)

    await ctx.browser.context.clearCookies()
    await signInWithForm(page, ctx.server.url, 'editor')
    await page.click('[data-testid=import-project]')
    await page.setInputFiles('[data-testid=archive-file]', file)
    await page.click('[data-testid=archive-import-button]')
    await page.waitForSelector('[data-testid=archive-import-result]')
    const summary = await page.textContent('[data-testid=archive-import-result]')
    expect(summary).toContain(`${seededRuns + 1} verified again`)
    expect(summary).toContain('Results are numerical evidence, not proofs.')
    const row = page.locator('[data-testid=archive-invites] tr', { hasText: 'Rafi Okonkwe' })
    await row.locator('input').fill('rafi.again@example.org')
    await row.locator('button').click()
    await row.getByText('Invitation sent').waitFor()
    await screenshot(page, 'archive-2-imported')
    const editor = await signInAs(ctx.server.url, 'editor')
    const imported = ((await editor.json('GET', '/api/projects')).body as Array<{ id: number, name: string, role: string }>).filter(p => p.name === project.name && p.role === 'owner')
    expect(imported).toHaveLength(1)
    const invitations = (await editor.json('GET', `/api/projects/${imported[0]!.id}/invitations`)).body as Array<{ email: string, role: string }>
    expect(invitations.map(i => `${i.email}:${i.role}`)).toEqual(['rafi.again@example.org:viewer'])

    const addedRun = texts['tables/runs.ndjson']!.trim().split('\n').map(l => JSON.parse(l) as { id: number, name: string }).find(r => r.name === 'shear to the collapse 1')!
    const lines = texts['tables/run_points.ndjson']!.trim().split('\n')
    const k = lines.findIndex(l => JSON.parse(l).run_id === addedRun.id && JSON.parse(l).index === 4)
    const point = JSON.parse(lines[k]!)
    point.lambda += 0.01
    lines[k] = JSON.stringify(point)
    const forged = join(work, 'forged.zip')
    writeFileSync(forged, rezip({ ...texts, 'tables/run_points.ndjson': `${lines.join('\n')}\n` }))
    await gotoHydrated(page, `${ctx.server.url}/projects`)
    await page.click('[data-testid=import-project]')
    await page.setInputFiles('[data-testid=archive-file]', forged)
    await page.click('[data-testid=archive-import-button]')
    await page.waitForSelector('[data-testid=archive-import-refusal]')
    expect(await page.textContent('[data-testid=archive-import-refusal]')).toMatch(/run "shear to the collapse 1"/)
    await screenshot(page, 'archive-3-refused')
  })
})
