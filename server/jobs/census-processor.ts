/**
 * BullMQ sandboxed processor for census jobs (runs in a child process of the worker): the core's
 * `runCensus`, rows sent back in batches through job progress, the cancel flag polled in Redis
 * between patterns. Needs only Redis; the web server stores the rows.
 */
import type { SandboxedJob } from 'bullmq'
import { Redis } from 'ioredis'
import { runCensus, type CensusRow } from '../../shared/census/run'
import { censusCancelKey } from './census-keys'
import type { CensusQueueData } from './census-keys'

export default async function processCensus(job: SandboxedJob<CensusQueueData>) {
  const { jobId, bounds, classify, skip } = job.data
  const redis = new Redis(process.env.WINGFOLD_CENSUS_REDIS_URL ?? process.env.NUXT_CENSUS_REDIS_URL ?? 'redis://127.0.0.1:6379')
  const skipSet = new Set(skip)
  const controller = new AbortController()
  let batch: CensusRow[] = []
  let lastSend = 0
  try {
    const r = await runCensus({
      bounds, classify, signal: controller.signal,
      skip: code => skipSet.has(code),
      onRow: (row) => { batch.push(row) },
      onProgress: async (progress) => {
        if (await redis.get(censusCancelKey(jobId))) controller.abort()
        if (batch.length >= 20 || Date.now() - lastSend > 300) {
          await job.updateProgress({ jobId, rows: batch, progress })
          batch = []; lastSend = Date.now()
        }
      },
    })
    await job.updateProgress({ jobId, rows: batch, progress: r.progress })
    return { jobId, cancelled: r.cancelled, progress: r.progress }
  } finally {
    redis.disconnect()
  }
}
