/**
 * The hypothesis checklist (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676, 2021, Assumptions 3.2, 3.3, 3.6, Thm 6.7: T1–T11): statuses follow the
 * evidence — a certificate upgrades only the ids it proves, a failing verdict stays "fails"
 * unless a certificate proves it, combinatorial ids are exact, the rest numerical evidence.
 */
import { describe, expect, it } from 'vitest'
import { certifiedChecklist, provenParts } from '../../../shared/certify/checklist'
import { certifyDrawing } from '../../../shared/certify/pattern'
import { hypothesesFromReport } from '../../../shared/certify/report-hypotheses'
import { findPatternExample } from '../../../shared/examples'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { compilePattern } from '../../../shared/pattern/model'

const statusOf = (items: { id: string, status: string }[], id: string) => items.find(i => i.id === id)?.status

describe('hypothesis checklist', () => {
  it('square pair: balance, rigidity and the phase items proven; the drawing order stays numerical', () => {
    const doc = findPatternExample('square-pair')!.document
    const cert = certifyDrawing(compilePattern(doc), doc.phases !== undefined)
    const items = certifiedChecklist(hypothesesFromReport(analyzePattern(doc)), provenParts(cert))
    expect(statusOf(items, 'T6')).toBe('proven-interval')
    expect(statusOf(items, 'T7')).toBe('proven-interval')
    expect(statusOf(items, 'T5')).toBe('numerical')
    expect(statusOf(items, 'T4')).toBe('exact')
  })
  it('square grid (not rigid): T7 fails, nothing is proven', () => {
    const doc = findPatternExample('square-grid')!.document
    const cert = certifyDrawing(compilePattern(doc), doc.phases !== undefined)
    expect(cert.horizontal.certified).toBe(false)
    const items = certifiedChecklist(hypothesesFromReport(analyzePattern(doc)), provenParts(cert))
    expect(statusOf(items, 'T7')).toBe('fails')
    expect(items.some(i => i.status === 'proven-interval')).toBe(false)
  })
  it('consumes any list of ids with verdicts (ids the analysis adds later included)', () => {
    const items = certifiedChecklist([{ id: 'T2', holds: true }, { id: 'T8', holds: false }, { id: 'T11', holds: false }], { horizontal: false, phase: true })
    expect(items.map(i => i.status)).toEqual(['exact', 'fails', 'proven-interval'])
  })
})
