/**
 * From a pattern document and family settings to an engine run: the problem, the start point
 * (balanced at the start value of λ when asked) and the engine options.
 */
import { DEFAULT_CONTINUATION_OPTIONS, type ContinuationOptions } from '../continuation/options'
import type { ContinuationProblem, ContinuationStart } from '../continuation/types'
import { solveBalance } from '../pattern/balance-solve'
import { compilePattern, type PatternModel } from '../pattern/model'
import { solvePhases } from '../pattern/phase-solve'
import { LATTICE_PATH_KINDS, PHASE_PATH_KINDS, type FamilySettings } from '../types/family'
import type { PatternDocument } from '../types/pattern'
import { collapseLimitResidual } from './collapse-limit'
import { latticePath } from './lattice-paths'
import { phasePath, phaseProblem } from './phase'
import { planeWingProblem } from './plane'
import { torusLatticeProblem } from './torus'

/** A family ready to run. */
export interface FamilySetup {
  model: PatternModel
  /** 'drawing' (lattice or wing paths: u holds positions) or 'phase' (u holds phases). */
  unknowns: 'drawing' | 'phase'
  problem: ContinuationProblem
  start: ContinuationStart
  options: ContinuationOptions
  /** Why the start could not be balanced (the engine still tries its own Newton). */
  startNote?: string
}

const isLattice = (k: string): boolean => (LATTICE_PATH_KINDS as readonly string[]).includes(k)
const isPhase = (k: string): boolean => (PHASE_PATH_KINDS as readonly string[]).includes(k)

/** The problem of a family, and for drawings max|residual| of a collapse limit (collapse-limit.ts). */
export interface FamilyProblem {
  problem: ContinuationProblem
  lambda0: number
  unknowns: 'drawing' | 'phase'
  collapseResidual?: (u: Float64Array, lambda: number) => number
}

/** The problem alone (no start solve): used by the runner and by point verification. */
export function familyProblem(doc: PatternDocument, settings: FamilySettings, model = compilePattern(doc)): FamilyProblem {
  const kind = settings.path.kind
  const ev = { collapseTolerance: settings.stop.collapseTolerance, orderFlip: settings.stop.orderFlip, terminal: settings.stop.stopAtEvents, locateTolerance: settings.stop.locateTolerance }
  if (isLattice(kind)) {
    if (model.space !== 'torus') throw new Error(`families: the ${kind} path needs a torus pattern`)
    const path = latticePath(settings.path, model.lattice)
    const t = torusLatticeProblem(model, path, ev)
    return { problem: t.problem, lambda0: path.lambda0, unknowns: 'drawing', collapseResidual: (u, l) => collapseLimitResidual(model, t.drawingAt, t.contracted, u, l) }
  }
  if (isPhase(kind)) {
    if (model.space !== 'torus' && (kind === 'alpha1' || kind === 'alpha2' || kind === 'alpha-line')) throw new Error(`families: the ${kind} path needs a torus pattern`)
    const path = phasePath(model, settings.path)
    return { problem: phaseProblem(model, path).problem, lambda0: path.lambda0, unknowns: 'phase' }
  }
  if (settings.path.kind !== 'wing-rotation') throw new Error(`families: unknown path kind '${kind}'`)
  const w = planeWingProblem(model, settings.path.rotate, settings.path.compensate, ev)
  return { problem: w.problem, lambda0: 0, unknowns: 'drawing', collapseResidual: (u, l) => collapseLimitResidual(model, w.drawingAt, w.contracted, u, l) }
}

/** The engine options its messages name, as a family's settings file (and the setup form) spell them. */
export const FAMILY_OPTION_NAMES = {
  allowSingularStart: 'allowSingularStart (form: “start even if the start is not rigid”, under Advanced)',
  minStep: 'step.min (form: “Smallest step”)',
  maxPoints: 'stop.maxPoints (form: “Most points”)',
}

/** Engine options from the settings; λ is bounded on the side of the target. */
export function familyOptions(settings: FamilySettings, lambda0: number): ContinuationOptions {
  const direction = settings.direction ?? (settings.to >= lambda0 ? 'increase' : 'decrease')
  const s = settings.step
  const o: ContinuationOptions = {
    direction,
    maxPoints: settings.stop.maxPoints,
    // messages name the settings keys (and the form field) a user can change
    optionNames: FAMILY_OPTION_NAMES,
    ...(settings.allowSingularStart ? { allowSingularStart: true } : {}),
    stopAtSpecialPoint: settings.stop.stopAtSpecialPoint,
    locateTolerance: settings.stop.locateTolerance,
    // a given max (or min) below (above) the default first step moves the first step with it
    initialStep: s.initial ?? Math.max(s.min ?? 0, Math.min(DEFAULT_CONTINUATION_OPTIONS.initialStep, s.max ?? Infinity)),
    ...(s.min !== undefined ? { minStep: s.min } : {}),
    ...(s.max !== undefined ? { maxStep: s.max } : {}),
    ...(s.maxNewtonIterations !== undefined ? { maxNewtonIterations: s.maxNewtonIterations } : {}),
    // chord (default): one factorisation per step instead of one per Newton iteration (npm run
    // bench); its iterations converge linearly, so allow more before a step counts as slow
    ...(s.chord !== false ? { chordNewton: true, fastIterations: 6 } : {}),
  }
  if (settings.to > lambda0) o.lambdaMax = settings.to
  else if (settings.to < lambda0) o.lambdaMin = settings.to
  return o
}

/** Builds the problem, balances the start (sparse Newton at every size) and fills the engine options. */
export function setupFamily(doc: PatternDocument, settings: FamilySettings): FamilySetup {
  const model = compilePattern(doc)
  const { problem, lambda0, unknowns } = familyProblem(doc, settings, model)
  const V = model.nVertices
  let u: Float64Array
  let startNote: string | undefined
  if (unknowns === 'phase') {
    const path = phasePath(model, settings.path)
    u = model.psi.slice(1)
    if (settings.balanceFirst) {
      const r = solvePhases(model, model.psi, path.alpha(lambda0), path.weights(lambda0))
      if (r.converged) u = r.psi.slice(1)
      else startNote = `phase solve at the start did not converge: ${r.reason ?? ''}`
    }
  } else {
    const lat = model.space === 'torus' ? latticePath(settings.path, model.lattice).at(lambda0).lattice : model.lattice
    let p = model.positions
    if (settings.balanceFirst) {
      const r = solveBalance(model, p, lat)
      if (r.converged) p = r.positions
      else startNote = `balance solve at the start did not converge: ${r.reason ?? ''}`
    }
    u = new Float64Array(problem.n)
    u.set(p.subarray(2, 2 * V))
  }
  return { model, unknowns, problem, start: { u, lambda: lambda0 }, options: familyOptions(settings, lambda0), ...(startNote ? { startNote } : {}) }
}
