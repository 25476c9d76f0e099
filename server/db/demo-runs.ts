/**
 * The demo group's saved families, computed at seed time with the real core (FamilyRunner; the
 * other branch at a branch point with the engine's `switchBranch`), never stored numbers. Each run
 * shows one kind of special point where it genuinely occurs in a Wingfold family:
 *
 * | run | special point | where (closed form) |
 * |---|---|---|
 * | Even ring of four, weight scale s on e0, e2 | branch point (+ its other branch as a child run) | s = 1/2 (derived: K_i sin φ_i = c round the ring; the uneven states φ0 = π − φ2 exist for s ≥ sin(π/6)) |
 * | Weighted ring of four, α1 | fold | α1* = φ* + 3 arcsin(k sin φ*), cos φ* = −√((1/k² − 1)/8), k = 3/5 (derived: K_i sin φ_i = c round the ring) |
 * | Twisted ring of five, α1 | rigidity loss | α1 = 5π/2 (Wiley, Strogatz, Girvan, Chaos 16, 015103, 2006) |
 * | Fermat pair, shear | collapse | s = −1/2 − 1/√3 (first isogonic centre X(13), C. Kimberling, Encyclopedia of Triangle Centers) |
 * | Leaning square pair, shear | wall | s = 1/4 (Re τ = 0: the four edge lengths tie) |
 * | Plane bridge, wing rotation | order flip | λ = π/2 (the turned wings meet the closed edge's line; shared/families/README.md) |
 * | Square pair, stretch | none (the showcase's regular family: ω1 ⊥ ω2 keeps the four lengths tied) | — |
 */
import { switchBranch } from '../../shared/continuation'
import { FamilyRunner, setupFamily } from '../../shared/families'
import { parseFamilySettings, type FamilySettings, type FamilySettingsInput } from '../../shared/types/family'
import type { PatternDocument } from '../../shared/types/pattern'
import { RunPointSchema, RunSpecialPointSchema } from '../../shared/types/runs'
import type { z } from 'zod'

/** One run of the demo: which project and pattern, who ran it, the settings. */
export interface DemoRunSpec {
  project: 0 | 1
  graph: string
  name: string
  author: 'owner' | 'editor'
  settings: FamilySettingsInput
  /** The kinds of special point this run is seeded to show (checked by the seed test). */
  shows: string[]
  /** Also save the other branch through the first branch point, as a child run with this name. */
  otherBranch?: { name: string, shows: string[] }
}

type Point = z.infer<typeof RunPointSchema>
type Special = z.infer<typeof RunSpecialPointSchema>

/** A computed run, in the shape the run routes store (points parsed by the routes' schemas). */
export interface DemoRun {
  spec: Pick<DemoRunSpec, 'project' | 'graph' | 'name' | 'author' | 'shows'>
  settings: FamilySettings
  points: Point[]
  specialPoints: Special[]
  finishReason: string
  /** For the other branch: the parent's name and the parent's special point it leaves from. */
  parent?: { name: string, specialPoint: number }
}

export const DEMO_RUNS: readonly DemoRunSpec[] = [
  { project: 0, graph: 'Square pair', name: 'Square pair — stretching the square cell', author: 'owner', settings: { path: { kind: 'stretch' }, to: 1.8 }, shows: [] },
  {
    project: 0, graph: 'Even ring of four', name: 'Even ring of four — lighter opposite edges', author: 'editor',
    settings: { path: { kind: 'weight-scale', edges: ['e0', 'e2'] }, to: 0.2, stop: { maxPoints: 80 } },
    shows: ['branch point'],
    otherBranch: { name: 'Even ring of four — the uneven branch', shows: [] },
  },
  { project: 0, graph: 'Weighted ring of four', name: 'Weighted ring of four — α1 to the fold', author: 'editor', settings: { path: { kind: 'alpha1' }, to: 6, stop: { maxPoints: 200 } }, shows: ['fold'] },
  { project: 0, graph: 'Twisted ring of five', name: 'Twisted ring of five — α1 past 5π/2', author: 'owner', settings: { path: { kind: 'alpha1' }, to: 10, step: { max: 0.3 } }, shows: ['rigidity loss'] },
  { project: 0, graph: 'Fermat pair (rough drawing)', name: 'Fermat pair — shear to the collapse', author: 'owner', settings: { path: { kind: 'shear' }, to: -2, stop: { collapseTolerance: 1e-6 } }, shows: ['collapse'] },
  { project: 0, graph: 'Leaning square pair', name: 'Leaning square pair — shear across the square cell', author: 'editor', settings: { path: { kind: 'shear' }, to: 0.5 }, shows: ['wall'] },
  {
    project: 1, graph: 'Plane bridge', name: 'Plane bridge — turning two wings', author: 'owner',
    settings: { path: { kind: 'wing-rotation', rotate: ['west-up', 'east-down'], compensate: ['west-down', 'east-up'] }, to: 2 },
    shows: ['order flip'],
  },
]

/** Typed arrays to plain arrays, then the route's schema (so the rows are what an upload stores). */
function plain<T>(x: unknown, schema: { parse: (v: unknown) => T }): T {
  return schema.parse(JSON.parse(JSON.stringify(x, (_k, v) => (ArrayBuffer.isView(v) ? Array.from(v as unknown as ArrayLike<number>) : v))))
}

/** Computes one spec's run (and its other branch, if asked) on the stored document. */
export function computeDemoRuns(doc: PatternDocument, spec: DemoRunSpec): DemoRun[] {
  const settings = parseFamilySettings(spec.settings)
  const runner = new FamilyRunner(doc, settings)
  while (!runner.done) runner.step({ points: 1000, ms: 60_000 })
  const result = runner.result()
  if (result.status !== 'finished') throw new Error(`demo run "${spec.name}" did not finish: ${result.status} ${result.branch.finishReason ?? ''}`)
  const { shows, project, graph, name, author } = spec
  const out: DemoRun[] = [{
    spec: { project, graph, name, author, shows }, settings, finishReason: result.branch.finishReason ?? '',
    points: result.branch.points.map((p, index) => plain({ ...p, index }, RunPointSchema)),
    specialPoints: result.branch.specialPoints.map(s => plain(s, RunSpecialPointSchema)),
  }]
  if (spec.otherBranch) {
    const k = result.branch.specialPoints.findIndex(s => s.kind === 'branch point')
    if (k < 0) throw new Error(`demo run "${spec.name}" has no branch point to switch at`)
    const setup = setupFamily(doc, settings)
    const other = switchBranch(setup.problem, result.branch, k, setup.options)
    while (!other.done) other.next()
    const r = other.result()
    if (r.points.length < 2) throw new Error(`demo run "${spec.otherBranch.name}": ${r.finishReason ?? 'no points'}`)
    out.push({
      spec: { project, graph, name: spec.otherBranch.name, author, shows: spec.otherBranch.shows }, settings, finishReason: r.finishReason ?? '',
      points: r.points.map((p, index) => plain({ ...p, index }, RunPointSchema)),
      specialPoints: r.specialPoints.map(s => plain(s, RunSpecialPointSchema)),
      parent: { name: spec.name, specialPoint: k },
    })
  }
  return out
}
