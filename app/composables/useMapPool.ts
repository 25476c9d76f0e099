import { wrap, type Remote } from 'comlink'
import type { MapWorkerApi } from '../../workers/map.worker'
import { assembleMap, type MapSpine, type TracedCurve } from '#shared/maps'
import type { MapCrossing, MapResult, MapRow } from '#shared/types/maps'
import type { PatternDocument } from '#shared/types/pattern'

/** Workers the machine offers: `navigator.hardwareConcurrency` (at least 1), never more than one per core. */
export function machineWorkers(): number {
  return Math.max(1, (import.meta.client && navigator.hardwareConcurrency) || 1)
}

/**
 * A pool of map workers (workers/map.worker.ts) for the calling component: the spine runs on one
 * worker, then rows are handed out one at a time to `size` workers (default and maximum: one per
 * core), then one worker fills what rows alone cannot reach (shared/maps/fill.ts). `cancel()` terminates the workers; the rows finished so far are kept in the result
 * (`missingRows` lists the others). Workers exist only in the browser and end on unmount.
 */
export function useMapPool() {
  const progress = ref({ done: 0, total: 0 })
  const running = ref(false)
  const rows = shallowRef<MapRow[]>([])
  let workers: { worker: Worker; api: Remote<MapWorkerApi> }[] = []
  let cancelled = false
  let stopWaiting: (() => void) | undefined

  function spawn(n: number) {
    terminate()
    for (let k = 0; k < n; k++) {
      const worker = new Worker(new URL('../../workers/map.worker.ts', import.meta.url), { type: 'module' })
      workers.push({ worker, api: wrap<MapWorkerApi>(worker) })
    }
  }

  function terminate() {
    for (const w of workers) w.worker.terminate()
    workers = []
  }

  /** Computes a map with `size` workers (clamped to 1..cores); resolves with all rows done (partial after cancel). */
  async function run(doc: PatternDocument, settings: unknown, size = machineWorkers()): Promise<{ map: MapResult; wallMs: number; workers: number }> {
    if (import.meta.server) throw new Error('useMapPool: workers exist only in the browser')
    const n = Math.max(1, Math.min(Math.floor(size), machineWorkers()))
    // plain copies: reactive proxies cannot be posted to a worker
    doc = JSON.parse(JSON.stringify(doc)) as PatternDocument
    settings = JSON.parse(JSON.stringify(settings)) as unknown
    cancelled = false
    running.value = true
    rows.value = []
    const t0 = performance.now()
    spawn(n)
    const cancelWait = new Promise<void>((resolve) => { stopWaiting = resolve })
    try {
      const spine = await Promise.race([workers[0]!.api.spine(doc, settings), cancelWait.then(() => undefined)]) as MapSpine | undefined
      if (!spine) throw new Error('cancelled')
      progress.value = { done: 0, total: spine.starts.length }
      const done: MapRow[] = []
      let next = 0
      const loop = async (w: (typeof workers)[number]) => {
        while (!cancelled && next < spine.starts.length) {
          const start = spine.starts[next++]!
          const row = await w.api.row(doc, spine.settings, start, spine.spineColumn)
          if (cancelled) return
          done.push(row)
          rows.value = [...done]
          progress.value = { done: done.length, total: spine.starts.length }
        }
      }
      await Promise.race([Promise.all(workers.map(loop)), cancelWait])
      let map = assembleMap(spine, done)
      // then along columns and from solved neighbours (one worker; a cancel keeps the rows as they are)
      if (!cancelled) map = (await Promise.race([workers[0]!.api.fill(doc, spine.settings, map), cancelWait.then(() => undefined)])) ?? map
      return { map, wallMs: performance.now() - t0, workers: n }
    } finally {
      running.value = false
      terminate()
    }
  }

  /** Traces the curve through a crossing on a fresh worker. */
  async function trace(doc: PatternDocument, settings: unknown, crossing: MapCrossing): Promise<TracedCurve> {
    const worker = new Worker(new URL('../../workers/map.worker.ts', import.meta.url), { type: 'module' })
    try { return await wrap<MapWorkerApi>(worker).trace(JSON.parse(JSON.stringify(doc)), JSON.parse(JSON.stringify(settings)), JSON.parse(JSON.stringify(crossing))) } finally { worker.terminate() }
  }

  /** Stops at once; `run` resolves with the rows finished so far. */
  function cancel() {
    cancelled = true
    terminate()
    stopWaiting?.()
  }

  onBeforeUnmount(terminate)

  return { run, cancel, trace, progress, running, rows }
}
