/**
 * Supercells: an m1 × m2 cover of a torus pattern. Checks from graph theory and covering spaces
 * (B. Mohar, C. Thomassen, Graphs on Surfaces, 2001: a k-sheeted cover multiplies V, E, F by k and
 * keeps χ = 0 for the torus), and balance carried over (each vertex copy sees the same edge
 * vectors: derived).
 */
import { describe, expect, it } from 'vitest'
import { supercell } from '../../../shared/pattern/supercell'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { findPatternExample } from '../../../shared/examples'
import { parsePatternDocument } from '../../../shared/types/pattern'

describe('supercell', () => {
  for (const slug of ['square-pair', 'three-line-weave', 'two-line-knot']) {
    it(`${slug} 3×2: V, E, F multiply by 6, genus 1, faces close, balance kept`, () => {
      const doc = findPatternExample(slug)!.document
      const base = analyzePattern(doc)
      const big = supercell(doc, 3, 2)
      expect(() => parsePatternDocument(big)).not.toThrow()
      const r = analyzePattern(big)
      expect(r.topology.vertices).toBe(6 * base.topology.vertices)
      expect(r.topology.closedEdges).toBe(6 * base.topology.closedEdges)
      expect(r.topology.faces).toBe(6 * base.topology.faces)
      expect(r.topology.embeddingGenus).toBe(1)
      expect(r.verdicts.faceClosure.ok).toBe(true)
      expect(r.verdicts.faceClosure.latticeIndex).toBe(base.verdicts.faceClosure.latticeIndex)
      expect(r.verdicts.balance.ok).toBe(base.verdicts.balance.ok)
      expect(r.verdicts.cyclicOrder.ok).toBe(true)
    })
  }
  it('refuses plane patterns and bad sizes', () => {
    expect(() => supercell(findPatternExample('plane-bridge')!.document, 2, 2)).toThrow(/torus/)
    expect(() => supercell(findPatternExample('square-pair')!.document, 0, 2)).toThrow(/positive/)
  })
})
