import type { FamilyBatch } from '#shared/families/runner'
import { SaveQueue, type SaveQueueState } from '~/utils/family/save-queue'

/**
 * The save queue of a live run (utils/family/save-queue.ts) with its counts as refs: computed,
 * saved and unsaved points, the save error, and whether the computation waits for the server.
 */
export function useRunSaveQueue(runId: () => number, maxUnsaved?: number) {
  const runs = useRunsStore()
  const state = ref<SaveQueueState>({ computed: 0, saved: 0, error: '', waiting: false })
  const queue = new SaveQueue(b => runs.saveBatch(runId(), b), apiErrorMessage, (s) => { state.value = s }, maxUnsaved)
  return {
    push: (b: FamilyBatch) => queue.push(b),
    flush: () => queue.flush(),
    state,
    unsaved: computed(() => state.value.computed - state.value.saved),
  }
}
