/** Run exports and diagram builders: headers with units, caution, version, settings, SVG for papers. */
import { describe, expect, it, vi } from 'vitest'
import { FamilyRunner } from '../../../shared/families/runner'
import { findPatternExample } from '../../../shared/examples'
import { RESULT_CAUTION, RunPointSchema, RunSpecialPointSchema, type StoredRunPoint } from '../../../shared/types/runs'
import { buildRunCsv, buildRunJson, type ExportRun } from '../../../shared/runs/export'
import { availableAxes, specialAxisValue } from '../../../app/utils/family/axes'
import { branchDiagramOption } from '../../../app/utils/family/chart'
import { diagramSvg } from '../../../app/utils/family/chart-export'
import { documentAtPoint } from '../../../app/utils/family/point-doc'
import { parseFamilySettings } from '../../../shared/types/family'

// app/utils import the core through Nuxt's #shared alias; point it at the same files here
vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
vi.mock('#shared/runs/units', () => import('../../../shared/runs/units'))
vi.mock('#shared/types/runs', () => import('../../../shared/types/runs'))
vi.mock('#shared/families/lattice-paths', () => import('../../../shared/families/lattice-paths'))
vi.mock('#shared/families/phase', () => import('../../../shared/families/phase'))
vi.mock('#shared/pattern/model', () => import('../../../shared/pattern/model'))

const fermat = findPatternExample('fermat-pair')!
const settings = parseFamilySettings({ path: { kind: 'shear' }, to: -2 })
const runner = new FamilyRunner(fermat.document, settings)
const result = (() => { while (!runner.done) runner.step({ points: 50, ms: 60_000 }); return runner.result() })()
const stored = (p: { index: number, lambda: number, u: number[], diagnostics?: Record<string, number> }, kind: string | null, state: Record<string, unknown>): StoredRunPoint =>
  ({ index: p.index, lambda: p.lambda, residual: 0, specialKind: kind, state: { ...state, u: p.u }, diagnostics: p.diagnostics ?? {} })
const run: ExportRun = {
  summary: { id: 7, name: 'shear, collapse', pathKind: 'shear', status: 'complete', verification: 'verified', verificationReason: null, graphName: fermat.title, graphVersion: 1, appVersion: '0.1.0', createdAt: '2026-12-02T00:00:00.000Z' },
  settings,
  points: result.branch.points.map(({ diagnostics, ...p }) => stored({ ...p, diagnostics }, null, p)),
  specialPoints: result.branch.specialPoints.map(({ kind, ...s }) => stored(s, kind, s)),
  exportedBy: '0.1.0',
}

describe('CSV export', () => {
  it('names every column with its unit and carries version, settings and caution', () => {
    const csv = buildRunCsv(run)
    const lines = csv.trim().split('\n')
    expect(lines[0]).toContain('Wingfold 0.1.0')
    expect(lines.some(l => l.includes(JSON.stringify(settings)))).toBe(true)
    expect(lines.some(l => l.includes(RESULT_CAUTION))).toBe(true)
    const header = lines.find(l => l.startsWith('index,'))!.split(',')
    for (const col of header.slice(1, -1)) expect(col).toMatch(/\[[^\]]+\]$/)
    const rows = lines.filter(l => /^\d/.test(l))
    expect(rows).toHaveLength(run.points.length)
    expect(rows.every(r => r.split(',').length === header.length)).toBe(true)
    expect(csv).toMatch(/collapse at λ=/)
  })
})

describe('JSON export', () => {
  it('is re-importable: every point passes the import schemas', () => {
    const json = JSON.parse(JSON.stringify(buildRunJson(run)))
    expect(json.caution).toBe(RESULT_CAUTION)
    expect(json.settings).toEqual(settings)
    for (const p of json.points) expect(RunPointSchema.safeParse(p).success).toBe(true)
    for (const s of json.specialPoints) expect(RunSpecialPointSchema.safeParse(s).success).toBe(true)
    expect(json.specialPoints.map((s: { kind: string }) => s.kind)).toEqual(result.branch.specialPoints.map(s => s.kind))
  })
})

describe('diagram', () => {
  const points = result.branch.points.map(p => ({ ...p, diagnostics: p.diagnostics ?? {} }))
  const special = result.branch.specialPoints
  it('offers λ, σ_min, diagnostics and the free vertex coordinates as axes', () => {
    const keys = availableAxes('shear', fermat.document.vertices.map(v => v.id), Object.keys(points[0]!.diagnostics)).map(a => a.key)
    expect(keys).toEqual(expect.arrayContaining(['lambda', 'sigmaMin', 'd:totalLength', 'u:0', 'u:1']))
    expect(keys).not.toContain('u:2') // vertex 0 is pinned: one free vertex, two coordinates
  })

  it('interpolates a quantity at a special point between its neighbours', () => {
    const s = special.find(x => x.kind === 'collapse')!
    const v = specialAxisValue(s, points, 'd:totalLength')!
    const a = points[s.afterPoint]!.diagnostics.totalLength!, b = points[s.afterPoint + 1]?.diagnostics.totalLength ?? a
    expect(v).toBeGreaterThanOrEqual(Math.min(a, b) - 1e-12)
    expect(v).toBeLessThanOrEqual(Math.max(a, b) + 1e-12)
  })

  it('draws one legend entry per run and per special kind, with units on the axes', () => {
    const o = branchDiagramOption({ runs: [{ name: 'run A', points, special }], x: { key: 'lambda', title: 'shear s [1]' }, y: { key: 'd:totalLength', title: 'total length [length]' } })
    expect(o.legend.data).toEqual(['run A', ...new Set(special.map(s => s.kind))])
    expect(o.backgroundColor).toBe('#ffffff')
    const svg = diagramSvg({ runs: [{ name: 'run A', points, special }], x: { key: 'lambda', title: 'shear s [1]' }, y: { key: 'd:totalLength', title: 'total length [length]' } }, 'Wingfold 0.1.0')
    expect(svg.startsWith('<svg')).toBe(true)
    expect(svg).toContain('shear s [1]')
    expect(svg).toContain('total length [length]')
    expect(svg).toContain('Space Grotesk')
    expect(svg).toMatch(/fill="(#ffffff|#fff|white|rgb\(255,255,255\))"/i)
    expect(svg).toContain('numerical evidence, not proofs')
  })

  it('draws the pattern at a point: the lattice sheared by λ and the free vertex at u', () => {
    const p = points[Math.floor(points.length / 2)]!
    const d = documentAtPoint(fermat.document, settings, p.lambda, p.u)
    const l0 = fermat.document.lattice!
    // shear: ω2 = ω2⁰ + λ·ω1 (shared/families/README.md)
    expect(d.lattice!.w2[0]).toBeCloseTo(l0.w2[0] + p.lambda * l0.w1[0], 12)
    expect(d.vertices[1]!.position).toEqual([p.u[0], p.u[1]])
    expect(d.vertices[0]!.position).toEqual(fermat.document.vertices[0]!.position)
  })
})
