/**
 * A BullMQ worker for census jobs: `npm run census:worker` with WINGFOLD_CENSUS_REDIS_URL (or
 * NUXT_CENSUS_REDIS_URL) set. Each job runs in a sandboxed processor (a child process), so a
 * CPU-bound census never blocks this process; start one worker per free core, on any machine
 * that reaches the Redis server. Stops cleanly on SIGTERM / SIGINT.
 */
import { fileURLToPath } from 'node:url'
import { Worker } from 'bullmq'
import { Redis } from 'ioredis'
import { CENSUS_QUEUE_NAME } from './census-keys'

const url = process.env.WINGFOLD_CENSUS_REDIS_URL ?? process.env.NUXT_CENSUS_REDIS_URL
if (!url) {
  console.error('census worker: set WINGFOLD_CENSUS_REDIS_URL (e.g. redis://127.0.0.1:6379)')
  process.exit(2)
}
process.env.WINGFOLD_CENSUS_REDIS_URL = url
const processor = fileURLToPath(new URL('./census-processor.ts', import.meta.url))
const worker = new Worker(CENSUS_QUEUE_NAME, processor, {
  connection: new Redis(url, { maxRetriesPerRequest: null }),
  concurrency: Number(process.env.WINGFOLD_CENSUS_CONCURRENCY ?? 1),
})
worker.on('ready', () => console.info(`census worker ready on ${CENSUS_QUEUE_NAME}`))
worker.on('failed', (job, err) => console.error(`census job ${job?.id} failed: ${err.message}`))
for (const sig of ['SIGTERM', 'SIGINT'] as const) {
  process.on(sig, () => { worker.close().then(() => process.exit(0), () => process.exit(1)) })
}
