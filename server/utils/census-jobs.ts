/**
 * Census jobs: start, cancel, resume. Without a Redis URL the job runs in this process (the core's
 * `runCensus`, which yields to the event loop between patterns; cancel aborts it). With
 * `NUXT_CENSUS_REDIS_URL` it is handed to BullMQ (census-queue.ts) and run by workers in
 * sandboxed processors (server/jobs/census-processor.ts), which send rows back as job progress.
 * Resume starts the job again with the stored codes as skip list: the enumeration is repeated,
 * the classification (the expensive part) is not.
 */
import type { H3Event } from 'h3'
import { and, eq, inArray } from 'drizzle-orm'
import { runCensus } from '#shared/census/run'
import { censusThreads } from '../jobs/census-threads'
import type { ClassifyOptions } from '#shared/census/classify'

const running = new Map<number, AbortController>()

type JobRow = typeof tables.censusJobs.$inferSelect

/** The classification options stored with a job. */
export function censusJobOptions(j: JobRow): ClassifyOptions {
  return JSON.parse(j.options) as ClassifyOptions
}

/** True when jobs go to BullMQ. */
export function censusUsesQueue(): boolean {
  return Boolean(useRuntimeConfig().censusRedisUrl)
}

/** Starts (or resumes) a job; returns at once, the work goes on in the background. */
export async function launchCensusJob(j: JobRow): Promise<void> {
  await updateCensusJob(j.id, { status: 'queued', error: null })
  if (j.queue === 'bullmq') {
    await enqueueCensusJob(j.id, { maxTowers: j.maxTowers, maxHalfEdges: j.maxHalfEdges }, censusJobOptions(j),
      [...await storedCensusCodes()])
    return
  }
  const controller = new AbortController()
  running.set(j.id, controller)
  runInProcess(j, controller).finally(() => running.delete(j.id))
}

async function runInProcess(j: JobRow, controller: AbortController): Promise<void> {
  try {
    const skip = await storedCensusCodes()
    await updateCensusJob(j.id, { status: 'running' })
    const r = await runCensus({
      bounds: { maxTowers: j.maxTowers, maxHalfEdges: j.maxHalfEdges },
      classify: censusJobOptions(j),
      skip,
      subtrees: censusThreads() ?? undefined,
      signal: controller.signal,
      onRow: row => storeCensusRow(j.id, row),
      onProgress: p => updateCensusJob(j.id, p),
    })
    await updateCensusJob(j.id, { ...r.progress, status: r.cancelled ? 'cancelled' : 'done', finished: true })
  } catch (e) {
    await updateCensusJob(j.id, { status: 'failed', error: e instanceof Error ? e.message : String(e), finished: true })
  }
}

/** Asks a job to stop: aborts it in process, or raises its cancel flag for the BullMQ worker. */
export async function cancelCensusJob(j: JobRow): Promise<void> {
  await updateCensusJob(j.id, { status: 'cancelling' })
  if (j.queue === 'bullmq') await requestQueueCancel(j.id)
  else running.get(j.id)?.abort()
}

/** In-process jobs that a restart cut off become 'interrupted' (resumable). */
export async function markInterruptedCensusJobs(): Promise<void> {
  const db = useDb()
  for (const status of ['queued', 'running', 'cancelling'] as const) {
    await db.update(tables.censusJobs).set({ status: status === 'cancelling' ? 'cancelled' : 'interrupted' })
      .where(and(eq(tables.censusJobs.status, status), eq(tables.censusJobs.queue, 'in-process')))
  }
}

/** The job (401 signed out, 404 missing). */
export async function requireCensusJob(event: H3Event, id: number): Promise<JobRow> {
  await requireUser(event)
  const job = await useDb().query.censusJobs.findFirst({ where: eq(tables.censusJobs.id, id) })
  if (!job) throw httpError(404, 'census_job_not_found', 'No such census job.')
  return job
}

/** 409 while a job is queued, running or cancelling: one census at a time per server. */
export async function assertNoActiveCensusJob(): Promise<void> {
  const active = await useDb().select({ id: tables.censusJobs.id }).from(tables.censusJobs)
    .where(inArray(tables.censusJobs.status, ['queued', 'running', 'cancelling'])).get()
  if (active) throw httpError(409, 'census_busy', `Census job ${active.id} is still running; cancel it or wait for it.`)
}
