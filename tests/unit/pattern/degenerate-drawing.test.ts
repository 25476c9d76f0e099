/**
 * A drawing with a zero-length edge is degenerate: analyzePattern reports it (edge id in the
 * verdicts and in the straight-drawing hypothesis of the checklist) and never throws. Meeks'
 * pattern [H. Chen, M. Traizet, arXiv 2103.15676, 2021, Ex. 7.1] with v moved onto w: the edge e1
 * (shift (0, 0)) joins two coinciding points, so its length is exactly 0 (derived); e2–e4 keep
 * the lengths |ω1|, |ω1 + ω2|, |ω2| > 0.
 */
import { describe, expect, it } from 'vitest'
import { analyzePattern, zeroLengthEdges } from '../../../shared/pattern/analyze'
import { meeks, twoTowers } from './published-patterns'

describe('zero-length edges', () => {
  it('torus: Meeks with v on w reports e1 as a degenerate drawing, T5–T8 fail, no throw', () => {
    const d = meeks([1, 0], [0.3, 1.3], 1, 2)
    d.vertices[0]!.position = [0, 0]
    const r = analyzePattern(d)
    const v = r.verdicts
    expect(v.edgeLengths.ok).toBe(false)
    expect(v.edgeLengths.minLength).toBe(0)
    expect(v.edgeLengths.witness!.edges).toEqual(['e1'])
    expect(v.edgeLengths.explanation).toContain('e1')
    for (const k of ['cyclicOrder', 'balance', 'rigidity', 'ordinary'] as const) {
      expect(v[k].ok).toBe(false)
      expect(v[k].explanation).toMatch(/Degenerate drawing: edge e1 has zero length/)
    }
    expect(v.balance.witness!.vertices).toEqual(['v', 'w'])
    const t5 = r.existence.items.find(i => i.id === 'T5')!
    expect(t5.status).toBe('fails')
    expect(t5.detail).toContain('zero-length edge e1')
    expect(r.existence.failing).toEqual(expect.arrayContaining(['T5', 'T6', 'T7', 'T8']))
    expect(() => JSON.stringify(r)).not.toThrow()
  })

  it('plane: two towers on one point, the bridge edge is named, P4–P7 fail', () => {
    const d = twoTowers()
    d.vertices[1]!.position = [0, 0]
    const r = analyzePattern(d)
    expect(r.verdicts.edgeLengths.witness!.edges).toEqual(['bridge'])
    expect(r.verdicts.rigidity.ok).toBe(false)
    expect(r.existence.items.find(i => i.id === 'P4')!.detail).toContain('zero-length edge bridge')
    expect(r.existence.failing).toEqual(expect.arrayContaining(['P4', 'P5', 'P6', 'P7']))
  })

  it('zeroLengthEdges: exact zeros and non-finite lengths, relative to the longest edge (common practice)', () => {
    expect(zeroLengthEdges([1, 0, 2e-13, 3e-12, Number.NaN])).toEqual([1, 2, 4])
    expect(zeroLengthEdges([])).toEqual([])
  })
})
