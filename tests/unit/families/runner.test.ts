/**
 * FamilyRunner: batches and progress, pause / resume / cancel, a step that throws, a refused
 * start, and the settings schema (defaults, invalid input, paths that do not fit the pattern).
 */
import { describe, expect, it, vi } from 'vitest'
import { FamilyRunner, type FamilyBatch } from '../../../shared/families'
import { FamilySettingsSchema, parseFamilySettings } from '../../../shared/types/family'
import { fermatPair, planeBridge, ring } from './fixtures'
import { evenRingOfFour } from '../../../server/db/demo-patterns'

/** n turns of the event loop (zero-delay timers: no wall-clock wait). */
const eventLoopTurns = async (n: number) => { for (let k = 0; k < n; k++) await new Promise(resolve => setTimeout(resolve, 0)) }

const shear = { path: { kind: 'shear' as const }, to: 1.5, step: { max: 0.05 } }

describe('FamilyRunner', () => {
  it('delivers the start point and every later point once, in order, with progress', async () => {
    const r = new FamilyRunner(fermatPair(), shear)
    const batches: FamilyBatch[] = []
    const res = await r.start((b) => { batches.push(b) }, { points: 3 })
    const streamed = batches.flatMap(b => b.points)
    expect(res.status).toBe('finished')
    expect(streamed.map(p => p.index)).toEqual(res.branch.points.map(p => p.index))
    expect(streamed.map(p => p.index)).toEqual(streamed.map((_, i) => i))
    expect(batches.length).toBeGreaterThan(3)
    for (const b of batches.slice(0, -1)) expect(b.points.length).toBeLessThanOrEqual(4) // first batch adds the start point
    const last = batches.at(-1)!
    expect(last.done).toBe(true)
    expect(last.progress.points).toBe(res.branch.points.length)
    expect(last.progress.lambda).toBe(res.branch.points.at(-1)!.lambda)
    expect(last.progress.stepSize).toBeGreaterThan(0)
    expect(batches.flatMap(b => b.specialPoints).map(s => s.kind)).toEqual(res.branch.specialPoints.map(s => s.kind))
  })

  it('mixes synchronous steps and start() without repeating a point', async () => {
    const r = new FamilyRunner(fermatPair(), shear)
    const first = r.step({ points: 2 }).points
    const rest: number[] = []
    const res = await r.start((b) => { rest.push(...b.points.map(p => p.index)) }, { points: 5 })
    expect([...first.map(p => p.index), ...rest]).toEqual(res.branch.points.map((_, i) => i))
  })

  it('pauses, resumes and runs to the same end as an uninterrupted run', async () => {
    const plain = new FamilyRunner(fermatPair(), shear)
    const ref = await plain.start(() => {}, { points: 1 })
    const r = new FamilyRunner(fermatPair(), shear)
    let paused = false
    const done = r.start((b) => {
      if (!paused && b.progress.points >= 4) { paused = true; r.pause() }
    }, { points: 1 })
    // the runner yields one macrotask turn between batches: wait for the pause, then give it
    // twenty turns, in which a running runner makes twenty batches of one point
    await vi.waitUntil(() => r.result().status === 'paused')
    const whilePaused = r.result().branch.points.length
    await eventLoopTurns(20)
    expect(r.result().branch.points.length).toBe(whilePaused)
    expect(r.result().status).toBe('paused')
    r.resume()
    await eventLoopTurns(2)
    expect(r.result().branch.points.length).toBeGreaterThan(whilePaused) // the same turns do move a running runner
    const res = await done
    expect(res.status).toBe('finished')
    expect(res.branch.points.map(p => p.lambda)).toEqual(ref.branch.points.map(p => p.lambda))
  })

  it('restarts at a branch point along its kernel onto the other branch (the run page\'s "Switch branch")', () => {
    // Even ring of four (server/db/demo-patterns.ts): weight s on e0, e2, α1 = 4π/3. Derived:
    // K_i sin φ_i = c round the ring; the even states (φ0 = φ2) meet the uneven ones
    // (φ0 = π − φ2, φ1 = φ3 = (α1 − π)/2 = π/6, s sin φ0 = sin(π/6)) at s = 1/2, where F_u is singular.
    const doc = evenRingOfFour()
    const settings = { path: { kind: 'weight-scale' as const, edges: ['e0', 'e2'] }, to: 0.2, stop: { maxPoints: 30 } }
    const parent = new FamilyRunner(doc, settings)
    while (!parent.done) parent.step({ points: 1000, ms: 60_000 })
    const bp = parent.result().branch.specialPoints.find(p => p.kind === 'branch point')!
    expect(bp.lambda).toBeCloseTo(1 / 2, 8)
    const k = Array.from(bp.kernel!), norm = Math.hypot(...k)
    const child = new FamilyRunner(doc, settings, { u: bp.u, lambda: bp.lambda, tangent: k.map(x => x / norm) })
    while (!child.done) child.step({ points: 1000, ms: 60_000 })
    const r = child.result()
    expect(r.status).toBe('finished')
    expect(r.branch.points.length).toBeGreaterThan(10)
    const wrap = (x: number) => Math.atan2(Math.sin(x), Math.cos(x))
    for (const p of r.branch.points.slice(1)) {
      const [p1, p2, p3] = Array.from(p.u) as [number, number, number]
      expect(Math.abs(wrap(p2 - p1 - Math.PI / 6))).toBeLessThan(1e-8)
      expect(Math.abs(wrap(4 * Math.PI / 3 - p3 - Math.PI / 6))).toBeLessThan(1e-8)
      expect(Math.abs(wrap(p1 + (p3 - p2) - Math.PI))).toBeLessThan(1e-8)
      expect(Math.abs(p.lambda * Math.sin(p1) - 1 / 2)).toBeLessThan(1e-8)
    }
  })

  it('returns every point computed so far when cancelled', async () => {
    const r = new FamilyRunner(fermatPair(), shear)
    let seen = 0
    const res = await r.start((b) => { seen += b.points.length; if (seen >= 5) r.cancel() }, { points: 1 })
    expect(res.status).toBe('cancelled')
    expect(res.branch.finishReason).toBe('cancelled')
    expect(res.branch.points.length).toBe(seen)
    expect(res.branch.points.length).toBeGreaterThanOrEqual(5)
  })

  it('returns the points so far and the error when a step throws', () => {
    const r = new FamilyRunner(fermatPair(), shear)
    r.step({ points: 3 })
    const before = r.result().branch.points.length
    r.setup.problem.residual = () => { throw new Error('injected failure') }
    const b = r.step({ points: 3 })
    expect(b.done).toBe(true)
    expect(b.finishReason).toMatch(/injected failure/)
    const res = r.result()
    expect(res.status).toBe('failed')
    expect(res.error).toBe('injected failure')
    expect(res.branch.points.length).toBe(before)
  })

  it('reports a refused start as a result', async () => {
    // the twisted ring of 4 at α1 = 2π: weights cos(π/2) = 0, F_u = 0
    // (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin", Chaos 16, 015103, 2006)
    const doc = ring(4)
    doc.phases = { alpha: [2 * Math.PI, 0], vertexPhases: { v0: 0, v1: Math.PI / 2, v2: Math.PI, v3: 1.5 * Math.PI } }
    const r = new FamilyRunner(doc, { path: { kind: 'alpha1' }, to: 7, balanceFirst: false })
    expect(r.done).toBe(true)
    const batches: FamilyBatch[] = []
    const res = await r.start(b => { batches.push(b) })
    expect(res.status).toBe('refused')
    expect(res.branch.started).toBe(false)
    expect(batches.at(-1)!.finishReason).toMatch(/singular/)
  })
})

describe('family settings', () => {
  it('fills documented defaults', () => {
    const s = parseFamilySettings({ path: { kind: 'shear' }, to: 1 })
    expect(s.stop).toEqual({ maxPoints: 500, collapseTolerance: 1e-3, orderFlip: true, stopAtEvents: true, stopAtSpecialPoint: false, locateTolerance: 1e-9 })
    expect(s.balanceFirst).toBe(true)
    expect(s.step).toEqual({})
  })

  it('rejects nonsense with the offending field named', () => {
    expect(() => parseFamilySettings({ path: { kind: 'spin' }, to: 1 })).toThrow(/path/)
    expect(() => parseFamilySettings({ path: { kind: 'shear' }, to: 1, stop: { collapseTolerance: 2 } })).toThrow(/stop.collapseTolerance/)
    expect(FamilySettingsSchema.safeParse({ path: { kind: 'shear' } }).success).toBe(false)
  })

  it('refuses paths that do not fit the pattern', () => {
    expect(() => new FamilyRunner(planeBridge(), { path: { kind: 'shear' }, to: 1 })).toThrow(/torus/)
    expect(() => new FamilyRunner(fermatPair(), { path: { kind: 'wing-rotation', rotate: ['a'], compensate: ['b'] }, to: 1 })).toThrow(/plane/)
    expect(() => new FamilyRunner(ring(5), { path: { kind: 'weight-scale', edges: ['nope'] }, to: 2 })).toThrow(/unknown edge/)
  })

  it('round-trips through JSON (a stored run can be reproduced)', () => {
    const s = parseFamilySettings({ path: { kind: 'tau-polyline', points: [[0.5, 1], [0, 1.2]] }, to: 2, step: { max: 0.1 } })
    expect(parseFamilySettings(JSON.parse(JSON.stringify(s)))).toEqual(s)
  })
})
