import type { PatternIssue } from '#shared/types/pattern'
import type { PatternReport } from '#shared/pattern/report'
import { useWorkbenchStore } from '~/stores/workbench'

/** Quiet time after the last edit before the worker analyses the document (ms). */
const DEBOUNCE_MS = 120
/** Quiet time while a drag is in progress: the verdicts wait for the pointer to rest (ms). */
const GESTURE_QUIET_MS = 400

/**
 * The live analysis of the workbench document: `analyzePattern` runs in the pattern worker
 * (never on the main thread), debounced after edits; one request at a time, and the newest
 * document wins (a change during a run schedules exactly one more run).
 * @returns the latest report, the parser's issues when the document is not valid yet, status flags
 */
export function useWorkbenchAnalysis() {
  const store = useWorkbenchStore()
  const { api } = usePatternWorker()
  const report = shallowRef<PatternReport | null>(null)
  const issues = ref<PatternIssue[]>([])
  const running = ref(false)
  const error = ref<string | null>(null)
  /** Completed analyses (tests read it to see that the panel updated). */
  const runs = ref(0)
  /** Revision the current report belongs to. */
  const analysedRevision = ref(-1)
  const lastMs = ref(0)
  let timer: ReturnType<typeof setTimeout> | undefined
  let again = false

  async function run() {
    if (running.value) { again = true; return }
    running.value = true
    const revision = store.revision
    try {
      const r = await api().inspect(JSON.parse(JSON.stringify(toRaw(store.doc))))
      if (r.ok) { report.value = r.report; issues.value = []; lastMs.value = r.ms }
      else { report.value = null; issues.value = r.issues }
      error.value = null
      analysedRevision.value = revision
      runs.value++
    }
    catch (e) { error.value = (e as Error).message }
    finally {
      running.value = false
      if (again) { again = false; schedule() }
    }
  }

  function schedule() {
    clearTimeout(timer)
    timer = setTimeout(run, store.gesture ? GESTURE_QUIET_MS : DEBOUNCE_MS)
  }

  onMounted(() => {
    watch(() => store.revision, schedule, { immediate: true })
    // the end of a drag: analyse the final drawing after the usual short pause
    watch(() => store.gesture, (on) => { if (!on && analysedRevision.value !== store.revision) schedule() })
  })
  onBeforeUnmount(() => clearTimeout(timer))

  const stale = computed(() => analysedRevision.value !== store.revision)
  return { report, issues, running, error, runs, stale, lastMs, refresh: run }
}
