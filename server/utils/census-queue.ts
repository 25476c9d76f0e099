/**
 * The BullMQ side of census jobs (used only with `NUXT_CENSUS_REDIS_URL`): the queue the server
 * adds jobs to, and the queue events it listens to. Workers (server/jobs/census-worker.ts) run
 * the census in sandboxed processors and report `{ rows, progress }` through job progress; this
 * process stores the rows, so workers on other machines need only Redis. Cancel is a Redis key
 * the processor polls between patterns.
 */
import { Queue, QueueEvents } from 'bullmq'
import { Redis } from 'ioredis'
import type { ClassifyOptions } from '#shared/census/classify'
import type { CensusBounds } from '#shared/census/enumerate'
import type { CensusProgress, CensusRow } from '#shared/census/run'
import { CENSUS_QUEUE_NAME, censusCancelKey, type CensusQueueData } from '../jobs/census-keys'

/** What a processor reports as progress. */
export interface CensusQueueProgress {
  rows: CensusRow[]
  progress: CensusProgress
}

let queue: Queue | undefined
let redis: Redis | undefined
let events: QueueEvents | undefined
/** Per job: stores run one after the other, in the order the events arrived. */
const chains = new Map<number, Promise<void>>()

function connection() {
  redis ??= new Redis(useRuntimeConfig().censusRedisUrl, { maxRetriesPerRequest: null })
  return redis
}

function chain(jobId: number, work: () => Promise<void>): void {
  const next = (chains.get(jobId) ?? Promise.resolve()).then(work).catch(e => console.error('[wingfold] census queue:',
    e))
  chains.set(jobId, next)
}

function listen(): void {
  if (events) return
  events = new QueueEvents(CENSUS_QUEUE_NAME, { connection: connection().duplicate() })
  events.on('progress', ({ data }) => {
    const d = data as unknown as CensusQueueProgress & { jobId: number }
    if (!d || typeof d.jobId !== 'number') return
    chain(d.jobId, async () => {
      for (const row of d.rows) await storeCensusRow(d.jobId, row)
      await updateCensusJob(d.jobId, { ...d.progress, status: 'running' })
    })
  })
  events.on('completed', ({ returnvalue }) => {
    const r = (typeof returnvalue === 'string' ? JSON.parse(returnvalue) : returnvalue) as { jobId: number,
      cancelled: boolean, progress: CensusProgress }
    chain(r.jobId,
      () => updateCensusJob(r.jobId, { ...r.progress, status: r.cancelled ? 'cancelled' : 'done', finished: true }))
  })
  events.on('failed', async ({ jobId, failedReason }) => {
    const job = await queue?.getJob(jobId)
    const id = (job?.data as CensusQueueData | undefined)?.jobId
    if (id) chain(id, () => updateCensusJob(id, { status: 'failed', error: failedReason, finished: true }))
  })
}

/** Adds a census job to the queue. */
export async function enqueueCensusJob(jobId: number, bounds: CensusBounds, classify: ClassifyOptions,
  skip: string[]): Promise<void> {
  queue ??= new Queue(CENSUS_QUEUE_NAME, { connection: connection() })
  listen()
  await events!.waitUntilReady()
  await connection().del(censusCancelKey(jobId))
  const data: CensusQueueData = { jobId, bounds, classify, skip }
  await queue.add('census', data, { removeOnComplete: 100, removeOnFail: 100 })
}

/** Raises the cancel flag the processor polls. */
export async function requestQueueCancel(jobId: number): Promise<void> {
  await connection().set(censusCancelKey(jobId), '1', 'EX', 86400)
}
