/**
 * One quantity, one name and one unit across runs (axes, CSV headers, inspector) and maps; no
 * "[1]" as a unit; numbers never printed as "0.0e+0".
 */
import { describe, expect, it, vi } from 'vitest'
import { formatNumber } from '../../../shared/format'
import { FAMILY_PATH_KINDS } from '../../../shared/types/family'
import { MAP_QUANTITIES, mapQuantityLabel } from '../../../shared/types/maps'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
vi.mock('#shared/runs/units', () => import('../../../shared/runs/units'))
vi.mock('#shared/types/runs', () => import('../../../shared/types/runs'))
const { availableAxes } = await import('../../../app/utils/family/axes')
const { buildRunCsv } = await import('../../../shared/runs/export')
const { expectedDiagnostics, residualQuantity, sigmaMinQuantity, STEP_SIZE } = await import('../../../shared/runs/units')

/** "name [unit]" → [name, unit]. */
const split = (s: string): [string, string] => { const m = /^(.*) \[([^\]]+)\]$/.exec(s)!; return [m[1]!, m[2]!] }

/** Every (name, unit) a user meets: run axes and CSV columns of every path kind, map quantities of both planes. */
function allQuantities(): [string, string][] {
  const out: [string, string][] = []
  for (const kind of FAMILY_PATH_KINDS) {
    for (const a of availableAxes(kind, ['v0', 'v1'], [])) out.push([a.label, a.unit])
    for (const q of [residualQuantity(kind), sigmaMinQuantity(kind), STEP_SIZE]) out.push([q.label, q.unit])
    const summary = { id: 1, name: 'r', pathKind: kind, status: 'complete' as const, verification: 'verified' as const, verificationReason: null, graphName: 'g', graphVersion: 1, appVersion: '0', createdAt: '2026-12-02T00:00:00.000Z' }
    // one point recording every diagnostic of its kind, σ_min among them (as the server stores it)
    const point = { index: 0, lambda: 0, residual: 0, specialKind: null, state: { u: [] }, diagnostics: Object.fromEntries([...expectedDiagnostics(kind), 'sigmaMin'].map(k => [k, 1])) }
    const header = buildRunCsv({ summary, settings: {}, points: [point], specialPoints: [], exportedBy: '0' }).split('\n').find(l => l.startsWith('index,'))!
    for (const col of header.split(',').slice(1, -1)) out.push(split(col.replace(/^[^:]*: /, '')))
  }
  for (const plane of ['tau', 'alpha'] as const) for (const q of MAP_QUANTITIES) out.push(split(mapQuantityLabel(q, plane)))
  return out
}

describe('quantities', () => {
  it('one name never carries two units, and "1" is never a unit', () => {
    const units = new Map<string, Set<string>>()
    for (const [name, unit] of allQuantities()) {
      expect(unit, name).not.toBe('1')
      units.set(name, (units.get(name) ?? new Set()).add(unit))
    }
    for (const [name, set] of units) expect([...set], name).toHaveLength(1)
  })

  it('the rigidity margin has one name and one unit on runs of every kind and on maps of both planes', () => {
    // runs and maps both record the rigidity verdict's margin (trivial motions removed, × ℓ̄ or ÷ K̄)
    const all = allQuantities().filter(([name]) => name.includes('σ_min'))
    expect(all.length).toBeGreaterThan(FAMILY_PATH_KINDS.length)
    expect(new Set(all.map(([name, unit]) => `${name} [${unit}]`))).toEqual(new Set(['rigidity margin σ_min [dimensionless]']))
  })

  it('prints 0 as "0" and small numbers without "e+"', () => {
    expect(formatNumber(0)).toBe('0')
    expect(formatNumber(-0)).toBe('0')
    expect(formatNumber(1.234e-17)).toBe('1.23e-17')
    expect(formatNumber(2.5e7)).toBe('2.50e7')
    expect(formatNumber(0.012345)).toBe('0.0123')
    expect(formatNumber(undefined)).toBe('—')
    for (const v of [0, 1e-300, 3, 1e20]) expect(formatNumber(v)).not.toMatch(/e\+|0\.0e/)
  })
})
