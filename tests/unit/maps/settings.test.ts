/** Map settings validation, unreachable rows, verification catching a tampered cell (common practice). */
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { assembleMap, runMapSweep, sampleCells, sweepRow, sweepSpine, verifyMapCells } from '../../../shared/maps'
import { axisValues, parseMapSettings } from '../../../shared/types/maps'

const doc = findPatternExample('square-pair')!.document

describe('map settings', () => {
  it('fills defaults and rejects nonsense with one message', () => {
    const s = parseMapSettings({ plane: 'tau', x: { min: -0.5, max: 0.5, count: 3 }, y: { min: 0.8, max: 2, count: 3 } })
    expect(s.scaleBy).toBe('area')
    expect(axisValues(s.x)).toEqual([-0.5, 0, 0.5])
    expect(() => parseMapSettings({ plane: 'tau', x: { min: 1, max: 0, count: 3 }, y: { min: -1, max: 2, count: 3 } })).toThrow(/x: max must exceed min.*y\.min: Im τ must be positive/)
  })
})

describe('sweep bookkeeping', () => {
  const settings = { plane: 'tau', x: { min: -0.4, max: 0.4, count: 5 }, y: { min: 0.9, max: 1.3, count: 3 } }

  it('rows computed separately and assembled equal the one-thread sweep; a missing row is listed', () => {
    const whole = runMapSweep(doc, settings)
    const spine = sweepSpine(doc, settings)
    const rows = spine.starts.map(s => sweepRow(doc, spine.settings, s, spine.spineColumn))
    expect(assembleMap(spine, rows).rows).toEqual(whole.rows)
    const partial = assembleMap(spine, [rows[0], undefined, rows[2]])
    expect(partial.missingRows).toEqual([1])
  })

  it('a row without a start is marked unreachable, not filled', () => {
    const spine = sweepSpine(doc, settings)
    const row = sweepRow(doc, spine.settings, { i: 0, y: 0.9, endedBy: 'collapse' }, spine.spineColumn)
    expect(row.cells.every(c => c.status === 'unreachable' && /row unreachable \(collapse\)/.test(c.endedBy!))).toBe(true)
  })

  it('verification flags a moved state', () => {
    const cells = runMapSweep(doc, settings).rows.flatMap(r => r.cells)
    const sample = sampleCells(cells, 4)
    expect(sample).toHaveLength(4)
    expect(verifyMapCells(doc, settings, sample).verified).toBe(true)
    const bad = { ...sample[0]!, u: sample[0]!.u!.map((v, k) => k === 0 ? v + 0.1 : v) }
    const r = verifyMapCells(doc, settings, [bad, ...sample.slice(1)])
    expect(r.verified).toBe(false)
    expect(r.offending).toHaveLength(1)
  })
})

describe('document at a cell', () => {
  it('is balanced at the cell: the pattern core re-checks it as a fresh document (analyzePattern)', async () => {
    const { documentAtCell } = await import('../../../shared/maps')
    const { analyzePattern } = await import('../../../shared/pattern')
    const fermat = findPatternExample('fermat-pair')!.document
    const s = parseMapSettings({ plane: 'tau', x: { min: 0.2, max: 0.4, count: 2 }, y: { min: 1.1, max: 1.3, count: 2 } })
    const cell = runMapSweep(fermat, s).rows[1]!.cells[1]!
    const d = documentAtCell(fermat, s, cell)
    const [w1, w2] = [d.lattice!.w1, d.lattice!.w2]
    // τ = ω2/ω1 of the cell's lattice (complex division)
    const n = w1[0] ** 2 + w1[1] ** 2
    expect((w2[0] * w1[0] + w2[1] * w1[1]) / n).toBeCloseTo(cell.x, 12)
    expect((w2[1] * w1[0] - w2[0] * w1[1]) / n).toBeCloseTo(cell.y, 12)
    const report = analyzePattern(d) as unknown as { summary: Record<string, unknown> }
    expect(JSON.stringify(report.summary)).toMatch(/"balanced":true/)
  })
})
