/**
 * One census run: enumerate (enumerate.ts), classify each pattern (classify.ts) and hand out one
 * row per pattern. The same function serves the CLI, the in-process job and the BullMQ worker.
 * Resume: `skip` names patterns already stored; they are enumerated again (cheap) but not
 * classified (the expensive part) nor handed out. Cancel: an AbortSignal, checked between
 * patterns; the run yields to the event loop every `yieldEvery` patterns so a signal sent by a
 * request in the same process is seen.
 */
import { classifyCensusMap, type ClassifyOptions, type CensusVerdicts } from './classify'
import { enumerateCensus, type CensusBounds, type CensusPattern } from './enumerate'
import { splitCensus, splitDepth, type CensusTask } from './split'

/**
 * Runs the subtrees below `tasks` elsewhere (threads: server/jobs/census-threads.ts) and reports
 * each classified row, the maps searched and the patterns met; resolves when all are done or the
 * signal aborts. Patterns whose code is in `skip` are counted but not classified.
 */
export type SubtreeRunner = (
  job: { bounds: CensusBounds, classify?: ClassifyOptions, skip: string[], tasks: CensusTask[] },
  on: { row: (row: CensusRow) => Promise<void>, visited: (n: number) => void, found: (n: number) => void },
  signal?: AbortSignal,
) => Promise<void>

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
  /** Codes already stored (resume): met again, not classified. */
  skip?: Iterable<string>
  signal?: AbortSignal
  /**
   * Search below a shallow split elsewhere (several threads); without it the run is one thread.
   * Only used from `minHalfEdges` half-edges on (default 16): starting a thread costs seconds
   * (loading the core), more than a smaller census takes on one thread.
   */
  subtrees?: { runner: SubtreeRunner, threads: number, minHalfEdges?: number }
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

/** Runs the census; rows go to `onRow` in enumeration order (one thread) or as threads finish them. */
export async function runCensus(o: CensusRunOptions): Promise<CensusRunResult> {
  const t0 = Date.now()
  const progress: CensusProgress = { visited: 0, found: 0, classified: 0, elapsedMs: 0 }
  const skipSet = new Set(o.skip ?? [])
  const every = o.yieldEvery ?? 1
  const seen = new Set<string>()
  const handle = async (p: CensusPattern) => {
    progress.found++
    if (!skipSet.has(p.code) && !seen.has(p.code)) {
      seen.add(p.code)
      const row = censusRow(p, o.classify)
      progress.classified++
      progress.elapsedMs = Date.now() - t0
      await o.onRow?.(row, { ...progress })
    }
    progress.elapsedMs = Date.now() - t0
    await o.onProgress?.({ ...progress })
    if (progress.found % every === 0) await new Promise(resolve => setTimeout(resolve, 0))
  }
  const done = () => ({ progress: { ...progress, elapsedMs: Date.now() - t0 }, cancelled: o.signal?.aborted ?? false })
  if (o.subtrees && o.subtrees.threads > 1 && o.bounds.maxHalfEdges >= (o.subtrees.minHalfEdges ?? 16)) {
    // the shallow part here, the subtrees in threads; rows merged by canonical code (each once)
    const split = splitCensus(o.bounds, splitDepth(o.bounds, 8 * o.subtrees.threads))
    progress.visited += split.visited
    for (const p of split.patterns) {
      if (o.signal?.aborted) return done()
      await handle(p)
    }
    let lastReport = 0
    await o.subtrees.runner({ bounds: o.bounds, classify: o.classify, skip: [...skipSet], tasks: split.tasks }, {
      row: async (row) => {
        if (seen.has(row.code)) return
        seen.add(row.code)
        progress.classified++
        progress.elapsedMs = Date.now() - t0
        await o.onRow?.(row, { ...progress })
        await o.onProgress?.({ ...progress })
      },
      visited: (n) => {
        progress.visited += n
        if (Date.now() - lastReport > 250) {
          lastReport = Date.now()
          progress.elapsedMs = Date.now() - t0
          void o.onProgress?.({ ...progress })
        }
      },
      found: (n) => { progress.found += n },
    }, o.signal)
    const r = done()
    await o.onProgress?.({ ...r.progress })
    return r
  }
  for (const p of enumerateCensus(o.bounds, () => { progress.visited++ })) {
    if (o.signal?.aborted) return done()
    await handle(p)
  }
  return done()
}
