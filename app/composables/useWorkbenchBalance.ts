import { formatNumber } from '#shared/format'
import { useWorkbenchStore } from '~/stores/workbench'
import type { Vec } from '~/utils/workbench/view'

/** Length of the animation from the drawn to the balanced positions (ms). */
const ANIMATION_MS = 450

/**
 * The balance button: `balancePattern` runs in the pattern worker, then the vertices glide to the
 * balanced positions (one undo step). The note reports iterations and the final residual, or why
 * the solve failed.
 */
export function useWorkbenchBalance() {
  const store = useWorkbenchStore()
  const { api } = usePatternWorker()
  const busy = ref(false)
  const note = ref('')
  const failed = ref(false)

  async function balance() {
    if (busy.value || store.readOnly || !store.doc.vertices.length) return
    busy.value = true; note.value = ''; failed.value = false
    try {
      const r = await api().balance(JSON.parse(JSON.stringify(store.doc)))
      const from: Vec[] = store.doc.vertices.map(v => [v.position[0], v.position[1]])
      const to: Vec[] = r.document.vertices.map(v => [v.position[0], v.position[1]])
      store.checkpoint()
      await animate(from, to)
      if (r.document.rotation && !store.doc.rotation) store.doc.rotation = r.document.rotation
      failed.value = !r.converged
      note.value = r.converged
        ? `Balanced in ${r.iterations} steps; residual max|B| = ${formatNumber(r.residualNorm, 2)}.`
        : `Not balanced after ${r.iterations} steps (residual max|B| = ${formatNumber(r.residualNorm, 2)}): ${r.reason ?? 'the solve did not converge'}.`
    }
    catch (e) {
      failed.value = true
      note.value = `The balance solve could not start: ${(e as Error).message.split('\n')[0]}`
    }
    finally { busy.value = false }
  }

  function animate(from: Vec[], to: Vec[]): Promise<void> {
    return new Promise((resolve) => {
      const t0 = performance.now()
      const frame = (now: number) => {
        const t = Math.min(1, (now - t0) / ANIMATION_MS)
        const e = t * t * (3 - 2 * t) // smoothstep
        store.setPositions(from.map((p, i) => [p[0] + (to[i]![0] - p[0]) * e, p[1] + (to[i]![1] - p[1]) * e]))
        if (t < 1) requestAnimationFrame(frame)
        else resolve()
      }
      requestAnimationFrame(frame)
    })
  }

  return { busy, note, failed, balance }
}
