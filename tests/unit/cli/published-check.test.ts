/**
 * The published verdicts through the command line (`wingfold check`, text and JSON), on patterns
 * built from the descriptions in H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676 (2021) [CT-I] and H. Chen, "Gluing Karcher–Scherk saddle towers II",
 * Comm. Anal. Geom. 32 (2024) [C-II].
 */
import { execFile } from 'node:child_process'
import { mkdtemp, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import { beforeAll, describe, expect, it } from 'vitest'
import type { PatternDocument } from '../../../shared/types/pattern'
import { EQUILATERAL, meeks, planeTriangle, threeLines } from '../pattern/published-patterns'

const root = resolve(__dirname, '../../..')
let dir = ''
beforeAll(async () => { dir = await mkdtemp(join(tmpdir(), 'wingfold-published-')) })

async function check(doc: PatternDocument, ...flags: string[]) {
  const file = join(dir, `${doc.name}-${Math.random().toString(36).slice(2)}.wfp.json`)
  await writeFile(file, JSON.stringify(doc))
  try {
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'check', file, ...flags], { cwd: root })
    return { code: 0, stdout: r.stdout }
  } catch (e) {
    const err = e as { code: number, stdout: string }
    return { code: err.code, stdout: err.stdout }
  }
}

describe('wingfold check on the published examples', () => {
  it('Meeks, acute lattice, a = π/3, b = π/2 [CT-I Ex. 7.1]: not phase-rigid, T11 fails, exit 1 (JSON)', async () => {
    const r = await check(meeks([1, 0], [0.3, 1.3], Math.PI / 3, Math.PI / 2), '--json')
    expect(r.code).toBe(1)
    const report = JSON.parse(r.stdout)
    expect(report.verdicts.phaseRigidity.ok).toBe(false)
    expect(Math.abs(report.verdicts.phaseRigidity.pinnedDeterminant)).toBeLessThan(1e-12) // 2 cos b = 0
    expect(report.existence.failing).toEqual(['T11'])
    expect(report.verdicts.phaseBalance.definition).toBe('cuts-v1')
  }, 60_000)

  it('Meeks, acute lattice, a = 2π/3, b = π/3 [CT-I Ex. 7.1]: phase-rigid, every hypothesis holds, exit 0 (text)', async () => {
    const r = await check(meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3))
    expect(r.code).toBe(0)
    expect(r.stdout).toMatch(/ok +phase-rigid +σ_min\/K̄ [\d.]+, det -?1\.00000/)
    expect(r.stdout).toMatch(/all hypotheses of the published existence theorem hold \(numerically\): a family of embedded triply periodic/)
    expect(r.stdout).toMatch(/\[1\] level 1 .*X = \{w\}: −e2 −e4 = [\d.e+-]+ +\(depends on K\)/)
  }, 60_000)

  it('three lines [CT-I Ex. 7.9]: balanced, not rigid, genus 4', async () => {
    const r = await check(threeLines(), '--json')
    const report = JSON.parse(r.stdout)
    expect(report.verdicts.balance.ok).toBe(true)
    expect(report.verdicts.rigidity.ok).toBe(false)
    expect(report.summary.predictedGenus).toBe(4)
    expect(report.existence.line).toMatch(/failing: .*T7/)
  }, 60_000)

  it('equiangular triangle [C-II Ex. 7]: det 0.75, dim D = 4, immersed (never embedded) family (text)', async () => {
    const r = await check(planeTriangle(EQUILATERAL, [0, 2 * Math.PI / 3, -2 * Math.PI / 3]))
    expect(r.code).toBe(0)
    expect(r.stdout).toMatch(/det 0\.750000/)
    expect(r.stdout).toMatch(/rank M 6\/6, σ_2V [\d.e-]+, dim D 4/)
    expect(r.stdout).toMatch(/a family of immersed singly periodic minimal surfaces of genus 1 with 6 Scherk ends/)
    expect(r.stdout).not.toMatch(/\bembedded\b/)
  }, 60_000)
})
