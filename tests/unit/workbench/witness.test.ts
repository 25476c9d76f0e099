/** Witness highlights and verdict rows built from real analysis reports of the core. */
import { describe, expect, it } from 'vitest'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { findPatternExample } from '../../../shared/examples'
import { edgeOfHalfEdge, phaseColour, witnessHighlight } from '../../../app/utils/workbench/witness'
import { topologyLine, verdictRows } from '../../../app/utils/workbench/verdict-rows'

describe('witness highlights', () => {
  it('draws the kernel mode of a non-rigid pattern as arrows no longer than the given length', () => {
    // three-line weave: orientable but not rigid (shared/examples, checked in tests/unit/pattern)
    const doc = findPatternExample('three-line-weave')!.document
    const report = analyzePattern(doc)
    expect(report.verdicts.rigidity.ok).toBe(false)
    const h = witnessHighlight(report, doc, 'rigidity', 0.3)
    expect(h.arrows.length).toBeGreaterThan(0)
    expect(Math.max(...h.arrows.map(a => Math.hypot(...a.d)))).toBeCloseTo(0.3, 12)
  })

  it('shows residual arrows at the towers of an unbalanced drawing and names the odd chain’s edges', () => {
    const doc = structuredClone(findPatternExample('square-pair')!.document)
    doc.vertices[1]!.position = [0.62, 0.41]
    const report = analyzePattern(doc)
    const h = witnessHighlight(report, doc, 'balance')
    expect(h.arrows).toHaveLength(2)
    // B(a) = −B(b) for two towers joined only to each other (each edge vector is shared with opposite sign)
    expect(h.arrows[0]!.d[0]).toBeCloseTo(-h.arrows[1]!.d[0], 12)
    expect(edgeOfHalfEdge('ne:from')).toBe('ne')
    expect(edgeOfHalfEdge('wing-3')).toBe('wing-3')
    const knot = findPatternExample('two-line-knot')!.document
    const kr = analyzePattern(knot)
    expect(kr.verdicts.orientable.ok).toBe(false)
    const edges = witnessHighlight(kr, knot, 'orientable').edges
    expect(edges.length).toBeGreaterThan(0)
    expect(edges.every(e => knot.edges.some(x => x.id === e))).toBe(true)
  })

  it('gives one row per verdict with an explanation exactly when it fails', () => {
    const doc = findPatternExample('three-line-weave')!.document
    const report = analyzePattern(doc)
    const rows = verdictRows(report)
    expect(rows.map(r => r.name).sort()).toEqual(Object.keys(report.verdicts).sort())
    for (const r of rows) expect(r.explanation === undefined).toBe(r.ok)
    expect(topologyLine(report)).toContain(`genus ${report.topology.predictedGenus}`)
  })

  it('colours φ on a symmetric scale: equal at ±φ, distinct at 0 and π', () => {
    expect(phaseColour(1)).toBe(phaseColour(-1))
    expect(phaseColour(0)).not.toBe(phaseColour(Math.PI))
    expect(phaseColour(2 * Math.PI)).toBe(phaseColour(0))
  })
})
