/**
 * FamilyRunner: drives the continuation engine for one family, step by step, in batches of
 * N points or T milliseconds, with pause, resume and cancel. Pure (no DOM): the worker, the CLI
 * and the tests use it. A cancelled run, or a run where a step throws, ends with every point
 * computed so far and the reason.
 */
import type { Continuation } from '../continuation/engine'
import type { BranchResult, ContinuationPoint, ContinuationStart, SpecialPoint } from '../continuation/types'
import { parseFamilySettings, type FamilySettings, type FamilySettingsInput } from '../types/family'
import type { PatternDocument } from '../types/pattern'
import { setupFamily, type FamilySetup } from './build'
import { createFamilyRun, NO_UNKNOWNS_NOTE, type PathOnlyRun } from './path-only'

/** Batch limits: a batch ends after `points` new points or `ms` milliseconds, whichever first. */
export interface BatchOptions {
  /** Default 20. */
  points?: number
  /** Default 50. */
  ms?: number
}

/** Defaults of {@link BatchOptions}. */
export const DEFAULT_BATCH_OPTIONS: Required<BatchOptions> = { points: 20, ms: 50 }

/** Progress after a batch. */
export interface FamilyProgress {
  points: number
  lambda: number
  stepSize: number
  specialPoints: number
  rejectedSteps: number
}

/** What a batch delivers (plain JSON data). */
export interface FamilyBatch {
  points: ContinuationPoint[]
  specialPoints: SpecialPoint[]
  progress: FamilyProgress
  done: boolean
  /** Set when done: why the run ended. */
  finishReason?: string
}

/**
 * How a run ended. 'stopped': the corrector kept failing (no convergence past the last point), so
 * the family was not followed to its end; not a success.
 */
export type FamilyStatus = 'running' | 'paused' | 'finished' | 'stopped' | 'cancelled' | 'failed' | 'refused'

/** The whole run as plain data. */
export interface FamilyRunResult {
  status: FamilyStatus
  settings: FamilySettings
  branch: BranchResult
  /** Set for 'failed': the message of the error a step threw. */
  error?: string
  startNote?: string
}

function validateBatch(o: BatchOptions = {}): Required<BatchOptions> {
  const r = { ...DEFAULT_BATCH_OPTIONS, ...o }
  if (!(Number.isInteger(r.points) && r.points >= 1)) throw new Error('families: batch points must be an integer ≥ 1')
  if (!(r.ms > 0)) throw new Error('families: batch ms must be positive')
  return r
}

const tick = (): Promise<void> => new Promise(resolve => setTimeout(resolve, 0))

/** Runs one family; see the file header. */
export class FamilyRunner {
  readonly settings: FamilySettings
  readonly setup: FamilySetup
  private readonly run: Continuation | PathOnlyRun
  private status: FamilyStatus = 'paused'
  private error?: string
  private stepSize: number
  private wake?: () => void
  /** Whether a batch has carried the start point yet. */
  private startDelivered = false

  /**
   * Throws on invalid settings or a document the path does not apply to. `from` restarts the
   * family at a stored point (`restartFrom(point)` of the engine) instead of the document's start.
   */
  constructor(doc: PatternDocument, settings: FamilySettingsInput | FamilySettings, from?: ContinuationStart) {
    this.settings = parseFamilySettings(settings)
    this.setup = setupFamily(doc, this.settings)
    const branch = { id: `family-${this.settings.path.kind}` }
    // a restart may begin at a special point where F_u is singular by nature (a branch point,
    // followed along its kernel to the other branch; a fold): the given tangent leads off it
    const options = from ? { ...this.setup.options, allowSingularStart: true } : this.setup.options
    // no unknowns (one tower): nothing to continue, the family is the path itself (path-only.ts)
    this.run = createFamilyRun(this.setup.problem, from ?? this.setup.start, options, branch)
    this.stepSize = this.run.options.initialStep
    if (!this.run.started) this.status = 'refused'
  }

  /** True once the run can make no more steps. */
  get done(): boolean {
    return this.status === 'finished' || this.status === 'stopped' || this.status === 'cancelled' || this.status === 'failed' || this.status === 'refused'
  }

  private progress(): FamilyProgress {
    const last = this.run.points.at(-1)
    return { points: this.run.points.length, lambda: last?.lambda ?? this.setup.start.lambda, stepSize: this.stepSize, specialPoints: this.run.specialPoints.length, rejectedSteps: this.run.stats.rejected }
  }

  /** Makes steps until the batch limit or the end; synchronous. The first batch also carries the start point. */
  step(batch: BatchOptions = {}): FamilyBatch {
    const b = validateBatch(batch)
    const points: ContinuationPoint[] = this.startDelivered ? [] : this.run.points.slice(0, 1)
    const specialPoints: SpecialPoint[] = []
    this.startDelivered = true
    const t0 = Date.now()
    const limit = points.length + b.points
    while (!this.done && !this.run.done && points.length < limit && Date.now() - t0 < b.ms) {
      try {
        const s = this.run.next()
        points.push(...s.points)
        specialPoints.push(...s.specialPoints)
        this.stepSize = s.stepSize
      } catch (e) {
        this.status = 'failed'
        this.error = e instanceof Error ? e.message : String(e)
      }
    }
    if (this.run.done && !this.done) this.status = this.run.stalled ? 'stopped' : 'finished'
    return { points, specialPoints, progress: this.progress(), done: this.done, ...(this.done ? { finishReason: this.finishReason() } : {}) }
  }

  private finishReason(): string {
    if (this.status === 'failed') return `a step failed: ${this.error}`
    if (this.status === 'cancelled') return 'cancelled'
    if (this.status === 'stopped') return `stopped: ${this.run.finishReason ?? ''}`
    return this.run.finishReason ?? ''
  }

  /**
   * Runs to the end, delivering each batch to `onBatch` (the start point comes in the first
   * batch) and yielding to the event loop between batches so pause and cancel can arrive.
   * A refused start delivers one final batch with the reason.
   */
  async start(onBatch: (b: FamilyBatch) => void | Promise<void>, batch: BatchOptions = {}): Promise<FamilyRunResult> {
    validateBatch(batch)
    if (this.status === 'paused') this.status = 'running'
    if (this.done) await onBatch(this.step(batch))
    while (!this.done) {
      if (this.isPaused()) await new Promise<void>((resolve) => { this.wake = resolve })
      if (this.done) break
      await onBatch(this.step(batch))
      await tick()
    }
    return this.result()
  }

  private isPaused(): boolean { return this.status === 'paused' }

  /** Stops after the current batch until {@link resume}. */
  pause(): void { if (this.status === 'running') this.status = 'paused' }

  /** Continues a paused run. */
  resume(): void {
    if (this.status === 'paused') this.status = 'running'
    this.wake?.(); this.wake = undefined
  }

  /** Ends the run; {@link result} keeps every point computed so far. */
  cancel(): void {
    if (!this.done) this.status = 'cancelled'
    this.wake?.(); this.wake = undefined
  }

  /** The run so far as plain data (copies). */
  result(): FamilyRunResult {
    const r = this.run.result()
    const branch: BranchResult = { ...r, points: [...r.points], specialPoints: [...r.specialPoints], finishReason: this.done ? this.finishReason() : r.finishReason }
    return { status: this.status, settings: this.settings, branch, ...(this.error ? { error: this.error } : {}), ...(this.setup.problem.n === 0 ? { startNote: NO_UNKNOWNS_NOTE } : this.setup.startNote ? { startNote: this.setup.startNote } : {}) }
  }
}
