/**
 * The engine's chord Newton option (added for the family bench): it must find the same special
 * points as full Newton, against the same outside references, with fewer factorisations.
 */
import { describe, expect, it } from 'vitest'
import { runContinuation } from '../../../shared/continuation'
import { resolveContinuationOptions } from '../../../shared/continuation/options'
import { FamilyRunner } from '../../../shared/families'
import { bratu, bratuFoldByShooting } from '../continuation/problems'
import { ring } from './fixtures'

describe('chord Newton', () => {
  it('Bratu N = 100: the same fold as full Newton, where shooting on the same scheme puts it', () => {
    // discrete fold of u'' + λ eᵘ = 0 (G. Bratu, 1914) by shooting, independent of the engine (derived)
    const ref = bratuFoldByShooting(100)
    const opts = { maxStep: 2, initialStep: 0.1, stopAtSpecialPoint: true, maxPoints: 400 }
    const fold = (chordNewton: boolean) => {
      const r = runContinuation(bratu(100), { u: new Array(100).fill(0), lambda: 0 }, { ...opts, chordNewton, fastIterations: chordNewton ? 6 : 3 })
      return { f: r.specialPoints.find(s => s.kind === 'fold')!, iterations: r.points.reduce((s, p) => s + p.newtonIterations, 0), points: r.points.length }
    }
    const full = fold(false), chord = fold(true)
    console.log(`chord Newton, Bratu N=100: fold ${chord.f.lambda} (full Newton ${full.f.lambda}), deviation from ${ref}: ${(chord.f.lambda - ref).toExponential(2)}; Newton iterations ${chord.iterations} over ${chord.points} points (full: ${full.iterations} over ${full.points})`)
    expect(Math.abs(chord.f.lambda - ref)).toBeLessThan(1e-6)
    expect(Math.abs(chord.f.lambda - full.f.lambda)).toBeLessThan(1e-9)
  })

  // twisted ring state φ = α1/5: singular at α1/5 = π/2 (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin", Chaos 16, 015103, 2006)
  it('ring of 5 in α1: rigidity loss at 5π/2 (Wiley–Strogatz–Girvan 2006) with chord Newton', () => {
    const exact = (5 * Math.PI) / 2
    const r = new FamilyRunner(ring(5), { path: { kind: 'alpha1' }, to: exact + 2, step: { max: 0.3 } })
    // the same family problem and start, through the engine with chord Newton
    const res = runContinuation(r.setup.problem, r.setup.start, { ...r.setup.options, chordNewton: true })
    const s = res.specialPoints.find(p => p.kind === 'rigidity loss')!
    expect(Math.abs(s.lambda - exact) / exact).toBeLessThan(1e-9)
  })

  it('is validated as a boolean', () => {
    expect(resolveContinuationOptions({}).chordNewton).toBe(false)
    expect(() => resolveContinuationOptions({ chordNewton: 'yes' as unknown as boolean })).toThrow(/chordNewton/)
  })
})
