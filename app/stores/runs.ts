import { defineStore } from 'pinia'
import type { ContinuationPoint } from '#shared/continuation/types'
import type { FamilyBatch } from '#shared/families/runner'
import type { RUN_END_STATES, RunBatchPayload, RunCreatePayload, RunListQuery, RunPointPayload, RunSummary } from '#shared/types/runs'

type RunEndState = typeof RUN_END_STATES[number]

/** The engine's point as the batch route takes it (its test values as a plain record). */
const pointPayload = (p: ContinuationPoint): RunPointPayload => ({ ...p, tests: { ...p.tests } })

/**
 * Runs of the current project: the library list with its filters, and saving a live run as it
 * goes (one POST per batch, in order; a failed save stops further saves and is reported).
 */
export const useRunsStore = defineStore('runs', () => {
  const request = useRequestFetch()
  const items = ref<RunSummary[]>([])
  const filters = ref<RunListQuery>({ sort: 'createdAt', order: 'desc' })

  /** Load a project's runs with the current filters. */
  async function load(projectId: number) {
    const query = Object.fromEntries(Object.entries(filters.value).filter(([, v]) => v !== undefined && v !== ''))
    items.value = await request<RunSummary[]>(`/api/projects/${projectId}/runs`, { query })
    return items.value
  }

  /** Create a run on the server; returns its summary. */
  function create(projectId: number, payload: RunCreatePayload) {
    return $fetch<RunSummary>(`/api/projects/${projectId}/runs`, { method: 'POST', body: payload })
  }

  /** Save one batch of a live run (points and special points as the worker delivered them). */
  function saveBatch(runId: number, batch: FamilyBatch) {
    const body: RunBatchPayload = { points: batch.points.map(pointPayload), specialPoints: batch.specialPoints }
    return $fetch<{ pointCount: number, specialCount: number }>(`/api/runs/${runId}/points`, { method: 'POST', body })
  }

  /** Mark a run complete, stopped, cancelled or failed (the server then re-checks it). */
  function finish(runId: number, status: RunEndState, reason = '') {
    return $fetch<RunSummary>(`/api/runs/${runId}/finish`, { method: 'POST', body: { status, reason } })
  }

  /** Rename a run. */
  function rename(runId: number, name: string) {
    return $fetch<RunSummary>(`/api/runs/${runId}`, { method: 'PATCH', body: { name } })
  }

  /** Delete a run. */
  function remove(runId: number) {
    return $fetch(`/api/runs/${runId}`, { method: 'DELETE' })
  }

  return { items, filters, load, create, saveBatch, finish, rename, remove }
})
