/**
 * Runs nobody writes to any more: a run still `running` whose row has not changed (no batch, no
 * finish) for `runIdleMinutes` (NUXT_RUN_IDLE_MINUTES, default 30) is ended as `interrupted` and
 * verified on what was saved, so no run hangs whatever the browser does. Its last point stays a
 * restart point (a new run with `parentRunId` / `restartPointIndex`).
 */
import { and, eq, lt } from 'drizzle-orm'

/** End every idle run; returns the ids that were ended. */
export async function endIdleRuns(now = Date.now()): Promise<number[]> {
  const r = tables.runs
  const cutoff = new Date(now - Number(useRuntimeConfig().runIdleMinutes) * 60_000)
  const ended = await useDb().update(r).set({ status: 'interrupted' })
    .where(and(eq(r.status, 'running'), lt(r.updatedAt, cutoff))).returning({ id: r.id, projectId: r.projectId })
  for (const run of ended) {
    await verifyStoredRun(run.id)
    await logActivity({ projectId: run.projectId, actorId: null,
      verb: 'finished (interrupted: no batch arrived for a while)', objectType: 'run', objectId: run.id })
  }
  return ended.map(run => run.id)
}
