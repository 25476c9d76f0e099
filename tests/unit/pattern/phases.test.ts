/**
 * Outside check: twisted states on a ring of n identical phase oscillators with nearest-neighbour
 * sine coupling (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin", Chaos 16,
 * 015103, 2006): the winding-q state is an equilibrium whose Jacobian has weights cos(2πq/n);
 * singular (identically zero) at n = 4q; linearly stable (all reduced eigenvalues negative) iff
 * cos(2πq/n) > 0. The reduced eigenvalues are −cos(2πq/n)·(2 − 2cos(2πj/n)), j = 1..n−1
 * (spectrum of the ring Laplacian, a circulant matrix: common practice).
 */
import { describe, expect, it } from 'vitest'
import { analyzePhaseRigidity, solvePhases } from '../../../shared/pattern/phase-solve'
import { distanceToZeroMod2Pi, phaseJacobian, phaseResidual } from '../../../shared/pattern/phases'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { dense, reportDeviation, torusDoc, torusModel } from './helpers'

/** Ring of n vertices along ω1 in the unit square torus; the closing edge carries shift (1, 0). */
function ring(n: number) {
  const positions: Record<string, [number, number]> = {}
  for (let i = 0; i < n; i++) positions[`r${i}`] = [i / n, 0]
  const edges: [string, string, [number, number]][] = []
  for (let i = 0; i < n; i++) edges.push([`r${i}`, `r${(i + 1) % n}`, i === n - 1 ? [1, 0] : [0, 0]])
  return { positions, edges }
}

function twisted(n: number, q: number): Float64Array {
  return Float64Array.from({ length: n }, (_, i) => (2 * Math.PI * q * i) / n)
}

describe('twisted states on a ring (Wiley–Strogatz–Girvan 2006)', () => {
  const cases: [number, number][] = [[8, 2], [12, 3], [4, 1], [5, 1], [5, 2], [7, 3], [6, 1], [10, 3], [9, 4]]
  for (const [n, q] of cases) {
    it(`n = ${n}, q = ${q}: equilibrium, inertia per the sign of cos(2πq/n), eigenvalues in closed form`, () => {
      const { positions, edges } = ring(n)
      const m = torusModel([1, 0], [0, 1], positions, edges)
      const psi = twisted(n, q)
      const K = m.weight
      const g = phaseResidual(m, psi, [0, 0], K)
      expect(Math.max(...g.map(Math.abs))).toBeLessThan(1e-14)
      const c = Math.cos((2 * Math.PI * q) / n)
      const r = analyzePhaseRigidity(m, psi, [0, 0], K, 1e-9, 400)
      if (n === 4 * q) {
        const maxEntry = Math.max(...dense(phaseJacobian(m, psi, [0, 0], K)).flat().map(Math.abs))
        reportDeviation(`twisted state n=${n}, q=${q}: max |Jacobian entry| (should be 0)`, 'Wiley–Strogatz–Girvan 2006', maxEntry)
        // cos(π/2) from phase differences of size 2πq/n: zero up to rounding
        expect(maxEntry).toBeLessThan(1e-14)
        expect(r.rigid).toBe(false)
        expect(r.inertia).toEqual({ negative: 0, zero: n - 1, positive: 0 })
      } else {
        expect(r.rigid).toBe(true)
        expect(r.inertia).toEqual(c > 0
          ? { negative: n - 1, zero: 0, positive: 0 }
          : { negative: 0, zero: 0, positive: n - 1 })
      }
      const expected = Array.from({ length: n - 1 }, (_, j) => -c * (2 - 2 * Math.cos((2 * Math.PI * (j + 1)) / n))).sort((a, b) => a - b)
      const dev = Math.max(...r.eigenvalues.map((l, i) => Math.abs(l - expected[i]!)))
      reportDeviation(`twisted state n=${n}, q=${q}: reduced eigenvalues`, 'WSG 2006 + circulant spectrum', dev)
      expect(dev).toBeLessThan(1e-12)
    })
  }

  it('the phase solve returns to a stable twisted state from a perturbed start', () => {
    const n = 7, q = 1
    const { positions, edges } = ring(n)
    const m = torusModel([1, 0], [0, 1], positions, edges)
    const exact = twisted(n, q)
    const start = exact.map((x, i) => x + 0.05 * Math.sin(3 * i + 1) * (i > 0 ? 1 : 0))
    const r = solvePhases(m, start, [0, 0], m.weight)
    expect(r.converged).toBe(true)
    const dev = Math.max(...r.psi.map((x, i) => distanceToZeroMod2Pi(x - exact[i]!)))
    reportDeviation('phase solve back to the q = 1, n = 7 twisted state', 'Wiley–Strogatz–Girvan 2006', dev)
    expect(dev).toBeLessThan(1e-10)
  })
})

describe('phase solve with period phases', () => {
  it('square pair: ψ_b = (α1 + α2)/2 balances (the four sines cancel in pairs), found from ψ = 0', () => {
    // φ = ψ_b, ψ_b − α1, ψ_b − α2, ψ_b − α1 − α2; with ψ_b = (α1 + α2)/2 they are ±(α1 + α2)/2 and
    // ±(α1 − α2)/2, so Σ sin φ = 0 (derived by hand)
    const m = torusModel([1, 0], [0, 1], { a: [0, 0], b: [0.5, 0.5] },
      [['a', 'b', [0, 0]], ['a', 'b', [-1, 0]], ['a', 'b', [0, -1]], ['a', 'b', [-1, -1]]])
    const alpha: [number, number] = [1.2, 0.4]
    const r = solvePhases(m, new Float64Array(2), alpha, m.weight)
    expect(r.converged).toBe(true)
    expect(distanceToZeroMod2Pi(r.psi[1]! - 0.8)).toBeLessThan(1e-12)
  })
})

describe('phase report', () => {
  it('flags patterns whose phase differences are all 0 or π (mirror planes), and not the twisted ones', () => {
    const { positions, edges } = ring(6)
    const vertexPhases = Object.fromEntries(Object.keys(positions).map((id, i) => [id, i % 2 ? Math.PI : 0]))
    const mirror = analyzePattern(torusDoc([1, 0], [0, 1], positions, edges, { phases: { alpha: [0, 0], vertexPhases } }))
    expect(mirror.phases.keepsMirrorPlanes).toBe(true)
    const tw = Object.fromEntries(Object.keys(positions).map((id, i) => [id, (2 * Math.PI * i) / 6]))
    const twisted6 = analyzePattern(torusDoc([1, 0], [0, 1], positions, edges, { phases: { alpha: [0, 0], vertexPhases: tw } }))
    expect(twisted6.phases.keepsMirrorPlanes).toBe(false)
    expect(twisted6.verdicts.phaseBalance.ok).toBe(true)
  })

  it('detects faces whose phase curl is not a multiple of 2π', () => {
    // one vertex, loops along ω1 and ω2, with a rotation that does not interleave them: the two
    // faces do not close (Σk ≠ 0) and curl φ = (Σk)·α there (derived: round a face the ψ terms of
    // φ_h = ψ(v(ιh)) − ψ(v(h)) + k_h·α cancel and the shifts add up)
    const rotation = { a: ['e0:from', 'e0:to', 'e1:from', 'e1:to'] }
    const loops: [string, string, [number, number]][] = [['a', 'a', [1, 0]], ['a', 'a', [0, 1]]]
    const bad = analyzePattern(torusDoc([1, 0], [0, 1], { a: [0, 0] }, loops, { rotation, phases: { alpha: [0.3, 0.5] } }))
    expect(bad.verdicts.faceClosure.ok).toBe(false)
    expect(bad.verdicts.phaseClosure.ok).toBe(false)
    const sums = bad.verdicts.faceClosure.witness!.faces.map(f => f.shiftSum)
    const expectedDefect = Math.max(...sums.map(([k1, k2]) => distanceToZeroMod2Pi(0.3 * k1 + 0.5 * k2)))
    expect(Math.abs(bad.verdicts.phaseClosure.maxDefect - expectedDefect)).toBeLessThan(1e-15)
    // with α in 2πZ² the same faces have curl φ ≡ 0 mod 2π
    const whole = analyzePattern(torusDoc([1, 0], [0, 1], { a: [0, 0] }, loops, { rotation, phases: { alpha: [2 * Math.PI, -4 * Math.PI] } }))
    expect(whole.verdicts.phaseClosure.ok).toBe(true)
  })
})
