/**
 * Orientability (H. Chen, M. Traizet, Gluing Karcher–Scherk saddle towers I: Triply periodic minimal surfaces, arXiv 2103.15676, 2021, Def. 3.5: signs with s(ιh) = −s(h), s(σh) = −s(h)) and the outside check "every orientable torus pattern has genus
 * ≥ 3" (no genus-2 minimal surfaces in flat 3-tori: W. H. Meeks III, Indiana Univ. Math. J. 39,
 * 1990 — from memory). For valid gluing patterns (every degree even ≥ 4) E ≥ 2V, so the
 * predicted genus E − V + 1 ≥ V + 1 and genus 2 happens only for one vertex with two loops.
 * The test enumerates all of those drawings (shifts in [−2, 2]², every cyclic order) and checks
 * that none is an orientable, closing, consistently drawn torus pattern.
 */
import { describe, expect, it } from 'vitest'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { compilePattern } from '../../../shared/pattern/model'
import { checkOrientability } from '../../../shared/pattern/orientability'
import { PATTERN_EXAMPLES } from '../../../shared/examples'
import { torusDoc } from './helpers'

type S = [number, number]

function gcd(a: number, b: number): number { return b === 0 ? Math.abs(a) : gcd(b, a % b) }

describe('orientability', () => {
  it('returns a closed chain of odd length whose consecutive half-edges are related by σ or ι', () => {
    for (const ex of PATTERN_EXAMPLES) {
      const m = compilePattern(ex.document)
      const o = checkOrientability(m)
      if (o.orientable) {
        // s(ιh) = −s(h) on closed edges and s(σh) = −s(h)
        for (let h = 0; h < m.nHalf; h++) {
          expect(o.signs[m.sigma[h]!]).toBe(-o.signs[h]!)
          if (m.iota[h] !== h) expect(o.signs[m.iota[h]!]).toBe(-o.signs[h]!)
        }
        continue
      }
      const chain = o.oddChain
      expect(chain.length % 2).toBe(1)
      const related = (a: number, b: number) => m.sigma[a] === b || m.sigma[b] === a || (m.iota[a] === b && a !== b)
      chain.forEach((h, i) => expect(related(h, chain[(i + 1) % chain.length]!)).toBe(true))
    }
  })

  it('classifies the line nets: even edge counts per line are orientable, odd are not', () => {
    const verdict = (slug: string) => analyzePattern(PATTERN_EXAMPLES.find(e => e.slug === slug)!.document).verdicts.orientable.ok
    expect(verdict('square-pair')).toBe(true) // two lines, two edges each
    expect(verdict('three-line-weave')).toBe(true) // three lines, two edges each
    expect(verdict('square-grid')).toBe(true)
    expect(verdict('two-line-knot')).toBe(false) // two lines, three edges each
  })
})

describe('genus ≥ 3 for orientable torus patterns (Meeks 1990, from memory)', () => {
  it('no one-vertex two-loop torus drawing (the only genus-2 candidates) is orientable and consistent', () => {
    const box: S[] = []
    for (let a = -2; a <= 2; a++) for (let b = -2; b <= 2; b++) if (gcd(a, b) === 1) box.push([a, b])
    const others = ['e0:to', 'e1:from', 'e1:to']
    const orders = [[0, 1, 2], [0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0]].map(p => ['e0:from', ...p.map(i => others[i]!)])
    let checked = 0, orientableCount = 0
    for (const k of box) {
      for (const l of box) {
        if (k[0] * l[1] - k[1] * l[0] === 0) continue // parallel loops do not span the torus
        for (const order of orders) {
          const doc = torusDoc([1, 0], [0.3, 1.1], { a: [0.2, 0.1] }, [['a', 'a', k], ['a', 'a', l]], { rotation: { a: order } })
          const r = analyzePattern(doc)
          checked++
          if (r.verdicts.orientable.ok) orientableCount++
          expect(r.topology.predictedGenus).toBe(2)
          const genuineTorusPattern = r.verdicts.faceClosure.ok && r.verdicts.cyclicOrder.ok
          expect(r.verdicts.orientable.ok && genuineTorusPattern).toBe(false)
        }
      }
    }
    expect(checked).toBeGreaterThan(1000)
    expect(orientableCount).toBeGreaterThan(0) // the combinatorial order alone can be orientable
  })

  it('the orientable example torus patterns have predicted genus ≥ 3', () => {
    for (const ex of PATTERN_EXAMPLES) {
      const r = analyzePattern(ex.document)
      if (ex.document.space === 'torus' && r.verdicts.orientable.ok && r.verdicts.degrees.ok) {
        expect(r.topology.predictedGenus).toBeGreaterThanOrEqual(3)
      }
    }
  })
})
