/**
 * One census run: enumerate (enumerate.ts), classify each pattern (classify.ts) and hand out one
 * row per pattern. The same function serves the CLI, the in-process job and the BullMQ worker.
 * Resume: `skip(code)` names patterns already stored; they are enumerated again (cheap) but not
 * classified (the expensive part) nor handed out. Cancel: an AbortSignal, checked between
 * patterns; the run yields to the event loop every `yieldEvery` patterns so a signal sent by a
 * request in the same process is seen.
 */
import { classifyCensusMap, type ClassifyOptions, type CensusVerdicts } from './classify'
import { enumerateCensus, type CensusBounds, type CensusPattern } from './enumerate'

/** One row of the census: the combinatorics and the verdicts. */
export type CensusRow = Omit<CensusPattern, 'sigma'> & Omit<CensusVerdicts, 'document'> & {
  sigma: number[]
  document: CensusVerdicts['document']
}

/** Progress as the run goes. */
export interface CensusProgress {
  /** Maps searched (every intermediate map of the augmentation tree). */
  visited: number
  /** Census patterns met so far (stored or skipped). */
  found: number
  /** Patterns classified in this run. */
  classified: number
  elapsedMs: number
}

export interface CensusRunOptions {
  bounds: CensusBounds
  classify?: ClassifyOptions
  skip?: (code: string) => boolean
  signal?: AbortSignal
  onRow?: (row: CensusRow, progress: CensusProgress) => void | Promise<void>
  onProgress?: (progress: CensusProgress) => void | Promise<void>
  /** Yield to the event loop after this many patterns (default 1). */
  yieldEvery?: number
}

export interface CensusRunResult {
  progress: CensusProgress
  cancelled: boolean
}

/** Classifies one census pattern into its row. */
export function censusRow(p: CensusPattern, options?: ClassifyOptions): CensusRow {
  const { sigma, ...rest } = p
  const c = classifyCensusMap(Int32Array.from(sigma), `census ${p.towers} towers, ${p.edges} edges`, options)
  return { ...rest, ...c, sigma }
}

/** Runs the census; rows go to `onRow` in enumeration order. */
export async function runCensus(o: CensusRunOptions): Promise<CensusRunResult> {
  const t0 = Date.now()
  const progress: CensusProgress = { visited: 0, found: 0, classified: 0, elapsedMs: 0 }
  const every = o.yieldEvery ?? 1
  for (const p of enumerateCensus(o.bounds, () => { progress.visited++ })) {
    if (o.signal?.aborted) return { progress: { ...progress, elapsedMs: Date.now() - t0 }, cancelled: true }
    progress.found++
    if (!o.skip?.(p.code)) {
      const row = censusRow(p, o.classify)
      progress.classified++
      progress.elapsedMs = Date.now() - t0
      await o.onRow?.(row, { ...progress })
    }
    progress.elapsedMs = Date.now() - t0
    await o.onProgress?.({ ...progress })
    if (progress.found % every === 0) await new Promise(resolve => setTimeout(resolve, 0))
  }
  progress.elapsedMs = Date.now() - t0
  return { progress, cancelled: o.signal?.aborted ?? false }
}
