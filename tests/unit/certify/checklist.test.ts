/**
 * The hypothesis checklist (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I",
 * arXiv 2103.15676, 2021, Assumptions 3.2, 3.3, 3.6, Thm 6.7: T1–T11): statuses follow the
 * evidence — a certificate upgrades only the ids it proves, a failing verdict stays "fails"
 * unless a certificate proves it, combinatorial ids are exact, the rest numerical evidence.
 */
import { describe, expect, it } from 'vitest'
import { certifiedChecklist, certifiedExistence, provenParts, runProvenParts } from '../../../shared/certify/checklist'
import { certifyDrawing } from '../../../shared/certify/pattern'
import { hypothesesFromReport } from '../../../shared/certify/report-hypotheses'
import { findPatternExample } from '../../../shared/examples'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { compilePattern } from '../../../shared/pattern/model'
import { EQUILATERAL, meeks, planeTriangle } from '../pattern/published-patterns'

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
  it('consumes the ids with their statuses (ids the analysis adds later included)', () => {
    const items = certifiedChecklist([
      { id: 'T2', status: 'ok' }, { id: 'T8', status: 'fails' }, { id: 'T11', status: 'fails' },
      { id: 'T5', status: 'not checked' }, { id: 'T10', status: 'not needed' }, { id: 'T12', status: 'ok' },
    ], { horizontal: false, phase: true })
    expect(items.map(i => i.status)).toEqual(['exact', 'fails', 'proven-interval', 'not-checked', 'proven-interval', 'numerical'])
  })
})

describe('the certified checklist follows the report\'s existence checklist id by id', () => {
  const allowed = ['proven-interval', 'exact', 'numerical', 'fails', 'not-needed', 'not-checked']
  it('Meeks [CT-I Ex. 7.1], ω2 = (0.3, 1.3), a = 2π/3, b = π/3: T1–T11 in order; T6, T7, T10, T11 proven, T1–T4, T9 exact, T5, T8 numerical', () => {
    const doc = meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3)
    const report = analyzePattern(doc)
    const ex = certifiedExistence(report.existence, provenParts(certifyDrawing(compilePattern(doc), true)))
    expect(ex.items.map(i => i.id)).toEqual(report.existence.items.map(i => i.id))
    expect(ex.items.map(i => i.id)).toEqual(['T1', 'T2', 'T3', 'T4', 'T5', 'T6', 'T7', 'T8', 'T9', 'T10', 'T11'])
    for (const i of ex.items) expect(allowed).toContain(i.status)
    expect(['T6', 'T7', 'T10', 'T11'].map(id => statusOf(ex.items, id))).toEqual(Array(4).fill('proven-interval'))
    expect(['T1', 'T2', 'T3', 'T4', 'T9'].map(id => statusOf(ex.items, id))).toEqual(Array(5).fill('exact'))
    expect(['T5', 'T8'].map(id => statusOf(ex.items, id))).toEqual(['numerical', 'numerical'])
    expect(ex.items.find(i => i.id === 'T11')!.note).toMatch(/exactly one zero .* Jacobian is invertible .* true zero/)
    expect(ex.line).toBe('proven by interval arithmetic: T6, T7, T10, T11; exact: T1, T2, T3, T4, T9; numerical evidence only: T5, T8')
  })
  it('Meeks, a = π/3, b = π/2 (not phase-rigid [CT-I Ex. 7.1]): T11 fails, T6, T7 still proven, T10 only numerical', () => {
    const doc = meeks([1, 0], [0.3, 1.3], Math.PI / 3, Math.PI / 2)
    const ex = certifiedExistence(analyzePattern(doc).existence, provenParts(certifyDrawing(compilePattern(doc), true)))
    expect(statusOf(ex.items, 'T11')).toBe('fails')
    expect(statusOf(ex.items, 'T10')).toBe('numerical')
    expect(statusOf(ex.items, 'T7')).toBe('proven-interval')
    expect(ex.line).toMatch(/^failing: T11; /)
  })
  it('trivial phases (no phase data, square pair): T9–T11 not needed, never "proven"', () => {
    const doc = findPatternExample('square-pair')!.document
    const noPhases = { ...doc, phases: undefined }
    const ex = certifiedExistence(analyzePattern(noPhases).existence, provenParts(certifyDrawing(compilePattern(noPhases), false)))
    expect(['T9', 'T10', 'T11'].map(id => statusOf(ex.items, id))).toEqual(Array(3).fill('not-needed'))
  })
  it('equiangular triangle in the plane [C-II Ex. 7]: P1–P9; P5, P6 proven by the plane certificate, P8, P9 by the phase certificate, P7 numerical', () => {
    const doc = planeTriangle(EQUILATERAL, [0, 2 * Math.PI / 3, -2 * Math.PI / 3])
    const cert = certifyDrawing(compilePattern(doc), true)
    const ex = certifiedExistence(analyzePattern(doc).existence, provenParts(cert))
    expect(ex.items.map(i => i.id)).toEqual(['P1', 'P2', 'P3', 'P4', 'P5', 'P6', 'P7', 'P8', 'P9'])
    expect(statusOf(ex.items, 'P5')).toBe('proven-interval')
    expect(statusOf(ex.items, 'P6')).toBe('proven-interval')
    expect(statusOf(ex.items, 'P7')).toBe('numerical')
    expect(statusOf(ex.items, 'P8')).toBe('proven-interval')
    expect(statusOf(ex.items, 'P9')).toBe('proven-interval')
  })
  it('a run proves its system only when every saved point is certified', () => {
    expect(runProvenParts('alpha1', [0, 1, 2], new Set([0, 1, 2]))).toEqual({ horizontal: false, phase: true })
    expect(runProvenParts('shear', [0, 1, 2], new Set([0, 1, 2]))).toEqual({ horizontal: true, phase: false })
    expect(runProvenParts('shear', [0, 1, 2], new Set([0, 2]))).toEqual({ horizontal: false, phase: false })
    expect(runProvenParts('wing-rotation', [0], new Set([0]))).toEqual({ horizontal: false, phase: false })
    expect(runProvenParts('alpha1', [], new Set())).toEqual({ horizontal: false, phase: false })
  })
})
