/**
 * A run that stops because the corrector fails is not a success: its own outcome ("stopped: no
 * convergence past λ = …"), kept in the export, exit code 1 from the CLI.
 */
import { execFile } from 'node:child_process'
import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import { afterAll, describe, expect, it, vi } from 'vitest'
import { FamilyRunner } from '../../../shared/families'
import { buildRunCsv, buildRunJson } from '../../../shared/runs/export'
import { fermatPair } from './fixtures'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
vi.mock('#shared/types/runs', () => import('../../../shared/types/runs'))
vi.mock('#shared/families/lattice-paths', () => import('../../../shared/families/lattice-paths'))

// Collapse tolerance 1e-10 of the mean length: the shear a of the Fermat pair (collapse at
// a = −1/√3, Fermat–Torricelli, C. Kimberling, Encyclopedia of Triangle Centers, X(13)) cannot be
// followed that close to the collapse (F_u grows like 1/length), so the corrector gives up first.
const settings = { path: { kind: 'shear' as const }, to: -2, stop: { collapseTolerance: 1e-10 } }
const root = resolve(__dirname, '../../..')
const dir = mkdtemp(join(tmpdir(), 'wf-stall-'))
afterAll(async () => rm(await dir, { recursive: true, force: true }))

describe('a run the corrector cannot continue', () => {
  it('ends as "stopped" with the λ past which it did not converge', () => {
    const r = new FamilyRunner(fermatPair(0), settings)
    while (!r.done) r.step({ points: 1000, ms: 60_000 })
    const res = r.result()
    expect(res.status).toBe('stopped')
    expect(res.branch.stalled).toBe(true)
    const m = res.branch.finishReason!.match(/^stopped: no convergence past λ = (-?[\d.]+)/)
    expect(m).not.toBeNull()
    expect(Number(m![1])).toBeCloseTo(res.branch.points.at(-1)!.lambda, 8)
    // the export says so
    const summary = { id: 1, name: 'tight', pathKind: 'shear', status: 'stopped' as const, finishReason: res.branch.finishReason!, verification: 'verified' as const, verificationReason: null, graphName: 'Fermat pair', graphVersion: 1, appVersion: '0.1.0', createdAt: '2026-12-02T00:00:00.000Z' }
    const exp = { summary, settings: res.settings, points: [], specialPoints: [], exportedBy: '0.1.0' }
    expect(buildRunJson(exp)).toMatchObject({ status: 'stopped', finishReason: res.branch.finishReason })
    expect(buildRunCsv(exp)).toContain('status stopped (stopped: no convergence past λ = ')
  })

  it('exits 1 from wingfold follow', async () => {
    const doc = join(await dir, 'fermat.wfp.json'), set = join(await dir, 'settings.json')
    await writeFile(doc, JSON.stringify(fermatPair(0)))
    await writeFile(set, JSON.stringify(settings))
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'follow', doc, '--settings', set], { cwd: root }).then(() => ({ code: 0, stdout: '' }), (e: { code: number, stdout: string }) => e)
    expect(r.code).toBe(1)
    expect(r.stdout).toContain('stopped: no convergence past λ = ')
  })
})
