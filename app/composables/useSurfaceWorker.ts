import { wrap, type Remote } from 'comlink'
import type { SurfaceWorkerApi } from '../../workers/surface.worker'

/**
 * The surface worker (workers/surface.worker.ts) wrapped with comlink: one per view (it holds the
 * view's mesh), created only in the browser on first use; `terminate()` when the view goes.
 */
export function useSurfaceWorker() {
  let held: { worker: Worker, api: Remote<SurfaceWorkerApi> } | undefined
  function api(): Remote<SurfaceWorkerApi> {
    if (import.meta.server) throw new Error('useSurfaceWorker: workers exist only in the browser')
    if (!held) {
      const worker = new Worker(new URL('../../workers/surface.worker.ts', import.meta.url), { type: 'module' })
      held = { worker, api: wrap<SurfaceWorkerApi>(worker) }
    }
    return held.api
  }
  function terminate() { held?.worker.terminate(); held = undefined }
  return { api, terminate }
}
