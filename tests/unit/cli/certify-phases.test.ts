/**
 * `wingfold certify` on phases proves the published vertical system (the level rows of vertical
 * balance on cuts, H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I", arXiv
 * 2103.15676, 2021, Def. 6.2). Meeks' pattern [CT-I Ex. 7.1] on ω1 = (1, 0), ω2 = (0.3, 1.3):
 * phase Jacobian 2 cos b — a = 2π/3, b = π/3 phase-rigid (certified, T10/T11 proven by interval
 * arithmetic), a = π/3, b = π/2 not phase-rigid (not certified, T11 fails). The plane: the
 * equiangular triangle with six wings [H. Chen, Comm. Anal. Geom. 32, 2024, Ex. 7]: rigid with
 * dim D = 4 = |R| − 2, phase-rigid at ψ = (0, 2π/3, −2π/3) — P5, P6, P8, P9 proven.
 */
import { execFile } from 'node:child_process'
import { mkdtemp, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'
import { EQUILATERAL, meeks, planeTriangle } from '../pattern/published-patterns'

const root = resolve(__dirname, '../../..')
async function certify(doc: unknown, ...args: string[]) {
  const dir = await mkdtemp(join(tmpdir(), 'wingfold-certify-phases-'))
  const file = join(dir, 'pattern.wfp.json')
  await writeFile(file, JSON.stringify(doc))
  try {
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'certify', file, ...args], { cwd: root })
    return { code: 0, stdout: r.stdout }
  } catch (e) {
    const err = e as { code: number, stdout: string }
    return { code: err.code, stdout: err.stdout }
  }
}
const status = (out: { checklist: { id: string, status: string }[] }, id: string) => out.checklist.find(c => c.id === id)?.status

describe('wingfold certify on Meeks [CT-I Ex. 7.1], ω2 = (0.3, 1.3)', () => {
  it('a = 2π/3, b = π/3: phase-rigid, the phase certificate holds, T10 and T11 proven by interval arithmetic (exit 0)', async () => {
    const r = await certify(meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3), '--json')
    expect(r.code).toBe(0)
    const out = JSON.parse(r.stdout)
    expect(out.certificate.phase.certified).toBe(true)
    expect(status(out, 'T10')).toBe('proven-interval')
    expect(status(out, 'T11')).toBe('proven-interval')
  })
  it('a = π/3, b = π/2: not phase-rigid, not certified (not rigid), T11 fails (exit 1)', async () => {
    const r = await certify(meeks([1, 0], [0.3, 1.3], Math.PI / 3, Math.PI / 2), '--json')
    expect(r.code).toBe(1)
    const out = JSON.parse(r.stdout)
    expect(out.certificate.phase.certified).toBe(false)
    expect(out.certificate.phase.reason).toBe('not-rigid')
    expect(status(out, 'T11')).toBe('fails')
    expect(status(out, 'T10')).not.toBe('proven-interval')
  })
})

describe('wingfold certify on a plane pattern', () => {
  it('equiangular triangle [C-II Ex. 7]: P5, P6 proven by the plane certificate, P8, P9 by the phase certificate, family of dimension 4 (exit 0)', async () => {
    const doc = planeTriangle(EQUILATERAL, [0, 2 * Math.PI / 3, -2 * Math.PI / 3])
    const r = await certify(doc)
    expect(r.code).toBe(0)
    expect(r.stdout).toMatch(/P6 +rigid.*proven by interval arithmetic/)
    expect(r.stdout).toMatch(/P9 +phase-rigid +proven by interval arithmetic/)
    expect(r.stdout).toMatch(/family of dimension 4 \(\|R\| − 2\)/)
    expect(r.stdout).not.toMatch(/\bembedded\b/)
  })
})
