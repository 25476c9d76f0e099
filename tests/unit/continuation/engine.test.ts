import { describe, expect, it } from 'vitest'
import { createContinuation, restartFrom, runContinuation, resolveContinuationOptions, type ContinuationProblem } from '../../../shared/continuation'
import { TripletBuilder } from '../../../shared/linalg/triplets'
import { bratu, scalarProblem } from './problems'

const parabola = (events?: Parameters<typeof scalarProblem>[3]) => scalarProblem((x, l) => x * x + l, (x) => 2 * x, () => 1, events)

describe('restart', () => {
  it('a run restarted from a middle point reproduces the later points to 1e-10', () => {
    const p = bratu(50)
    const opts = { maxStep: 2, initialStep: 0.1, maxPoints: 30 }
    const full = runContinuation(p, { u: new Array(50).fill(0), lambda: 0 }, opts)
    expect(full.points).toHaveLength(30)
    const k = 5
    const again = runContinuation(p, restartFrom(full.points[k]!), { ...opts, maxPoints: 30 - k })
    let dev = 0
    for (let j = 1; j < again.points.length; j++) {
      const a = full.points[k + j]!, b = again.points[j]!
      dev = Math.max(dev, Math.abs(a.lambda - b.lambda), ...a.u.map((v, i) => Math.abs(v - b.u[i]!)))
    }
    console.log(`restart from point ${k}: max deviation of later points ${dev.toExponential(2)} over ${again.points.length - 1} points`)
    expect(again.points).toHaveLength(30 - k)
    expect(dev).toBeLessThan(1e-10)
    // the fold after the restart point is found again at the same λ
    const f1 = full.specialPoints.find((s) => s.kind === 'fold')!, f2 = again.specialPoints.find((s) => s.kind === 'fold')!
    expect(f1.afterPoint).toBeGreaterThan(k)
    expect(Math.abs(f1.lambda - f2.lambda)).toBeLessThan(1e-10)
  })
})

describe('closed loop, events, milestones, bounds', () => {
  it('the circle x² + λ² = 1 closes on itself after two folds at λ = ±1 (derived)', () => {
    const p = scalarProblem((x, l) => x * x + l * l - 1, (x) => 2 * x, (_x, l) => 2 * l)
    const r = runContinuation(p, { u: [1], lambda: 0 }, { maxStep: 0.3 })
    expect(r.specialPoints.map((s) => s.kind)).toEqual(['fold', 'fold', 'closed loop'])
    expect(Math.abs(r.specialPoints[0]!.lambda - 1)).toBeLessThan(1e-12)
    expect(Math.abs(r.specialPoints[1]!.lambda + 1)).toBeLessThan(1e-12)
    expect(r.finishReason).toMatch(/closed loop/)
    // The stored arclength is pseudo-arclength: a step of arc a on the unit circle has tangent
    // projection Δs = sin a ≤ 0.3, so Σ Δs lies in [2π(1 − asin(0.3)²/6), 2π] (derived).
    const s = r.points.at(-1)!.arclength
    console.log(`circle: pseudo-arclength at closing ${s}, 2π = ${2 * Math.PI}`)
    expect(s).toBeLessThanOrEqual(2 * Math.PI)
    expect(s).toBeGreaterThanOrEqual(2 * Math.PI * (1 - Math.asin(0.3) ** 2 / 6))
  })

  it('x² + λ = 0: milestone, problem event, fold and state bound at their closed-form places', () => {
    const p = parabola([{ kind: 'collapse', label: 'x reaches −1/2', fn: (u) => u[0]! + 0.5, terminal: false }])
    const r = runContinuation(p, { u: [-1], lambda: -1 }, { milestones: [-0.5], stateBounds: [{ component: 0, max: 0.5 }] })
    expect(r.specialPoints.map((s) => s.kind)).toEqual(['milestone', 'collapse', 'fold', 'bound'])
    const [m, c, f, b] = r.specialPoints as [typeof r.specialPoints[0], typeof r.specialPoints[0], typeof r.specialPoints[0], typeof r.specialPoints[0]]
    expect(Math.abs(m.lambda + 0.5)).toBeLessThan(1e-12)
    expect(Math.abs(m.u[0]! + Math.SQRT1_2)).toBeLessThan(1e-9)
    expect(r.points.some((q) => Math.abs(q.lambda + 0.5) < 1e-12)).toBe(true) // the milestone forced a point
    expect(Math.abs(c.u[0]! + 0.5)).toBeLessThan(1e-12)
    expect(Math.abs(c.lambda + 0.25)).toBeLessThan(1e-9)
    expect(Math.abs(f.lambda)).toBeLessThan(1e-12)
    expect(Math.abs(b.u[0]! - 0.5)).toBeLessThan(1e-12)
    expect(r.points.at(-1)!.u[0]).toBeCloseTo(0.5, 12)
    expect(r.finishReason).toMatch(/bound/)
  })

  it('stops at the first special point when asked', () => {
    const r = runContinuation(parabola(), { u: [-1], lambda: -1 }, { stopAtSpecialPoint: true })
    expect(r.specialPoints.map((s) => s.kind)).toEqual(['fold'])
    expect(Math.abs(r.points.at(-1)!.lambda)).toBeLessThan(1e-12)
  })
})

describe('start', () => {
  it('refuses a singular start with the reason, unless asked', () => {
    const refused = createContinuation(parabola(), { u: [0], lambda: 0 })
    expect(refused.done).toBe(true)
    expect(refused.started).toBe(false)
    expect(refused.finishReason).toMatch(/singular/)
    expect(refused.next().status).toBe('finished')
    const forced = createContinuation(parabola(), { u: [0], lambda: 0 }, { allowSingularStart: true, maxPoints: 5 })
    expect(forced.started).toBe(true)
  })

  it('refuses a start where Newton does not converge (eˣ + 1 = 0 has no real root)', () => {
    const p = scalarProblem((x, l) => Math.exp(x) + l, (x) => Math.exp(x), () => 1)
    const c = createContinuation(p, { u: [0], lambda: 1 })
    expect(c.started).toBe(false)
    expect(c.finishReason).toMatch(/Newton did not converge/)
  })

  it('follows the chosen initial direction', () => {
    const p = scalarProblem((x, l) => x - l, () => 1, () => -1)
    const up = runContinuation(p, { u: [0], lambda: 0 }, { maxPoints: 4 })
    const down = runContinuation(p, { u: [0], lambda: 0 }, { maxPoints: 4, direction: 'decrease' })
    expect(up.points.at(-1)!.lambda).toBeGreaterThan(0)
    expect(down.points.at(-1)!.lambda).toBeLessThan(0)
  })
})

describe('step-wise driver and data', () => {
  it('streams steps; results survive a JSON round trip unchanged', () => {
    const c = createContinuation(bratu(20), { u: new Array(20).fill(0), lambda: 0 }, { maxStep: 2, maxPoints: 25 })
    let streamed = 1
    let steps = 0
    while (!c.done) {
      const o = c.next()
      streamed += o.points.length
      steps++
      expect(['accepted', 'rejected', 'finished']).toContain(o.status)
    }
    const r = c.result()
    expect(streamed).toBe(r.points.length)
    expect(steps).toBeGreaterThanOrEqual(24)
    expect(JSON.parse(JSON.stringify(r))).toEqual(r)
    for (const q of r.points) expect(Array.isArray(q.u) && Array.isArray(q.tangent)).toBe(true)
  })

  it('secant predictor finds the same Bratu fold (N = 10) as the tangent predictor', () => {
    const start = { u: new Array(10).fill(0), lambda: 0 }
    const a = runContinuation(bratu(10), start, { maxStep: 2, stopAtSpecialPoint: true })
    const b = runContinuation(bratu(10), start, { maxStep: 2, stopAtSpecialPoint: true, predictor: 'secant' })
    expect(Math.abs(a.specialPoints[0]!.lambda - b.specialPoints[0]!.lambda)).toBeLessThan(1e-9)
  })

  it('a linear-solver failure is a failed step, not a crash', () => {
    // Jacobian deliberately zero for x > 0.5: the bordered matrix is singular there.
    const p: ContinuationProblem = {
      n: 1,
      residual: (u, l, out) => { out[0] = u[0]! - l },
      jacobian: (u) => {
        const bad = u[0]! > 0.5
        const b = new TripletBuilder(1, 1); b.add(0, 0, bad ? 0 : 1)
        return { Fu: b.build(), Flambda: Float64Array.of(bad ? 0 : -1) }
      },
    }
    const r = runContinuation(p, { u: [0], lambda: 0 }, { maxStep: 0.1 })
    expect(r.stats.rejected).toBeGreaterThan(0)
    expect(r.finishReason).toMatch(/minStep/)
    expect(r.points.at(-1)!.u[0]).toBeLessThanOrEqual(0.5 + 1e-9)
  })

  it('options are validated with clear messages', () => {
    expect(() => resolveContinuationOptions({ minStep: 1, initialStep: 0.1 })).toThrow(/minStep ≤ initialStep/)
    expect(() => resolveContinuationOptions({ direction: 'up' as 'increase' })).toThrow(/direction/)
    expect(() => resolveContinuationOptions({ locateTolerance: 0 })).toThrow(/locateTolerance/)
    expect(resolveContinuationOptions().locateTolerance).toBe(1e-9)
  })
})
