/**
 * One census thread (worker_threads): searches the subtrees it is sent (shared/census/split.ts),
 * classifies each pattern not in the skip list (shared/census/run.ts `censusRow`) and posts the
 * rows back; see census-threads.ts for the pool.
 */
import { parentPort, workerData } from 'node:worker_threads'
import { censusRow } from '../../shared/census/run'
import { subtreeCensus } from '../../shared/census/split'
import type { ThreadJob, ThreadMessage, ThreadTask } from './census-threads'

const job = workerData as ThreadJob
const skip = new Set(job.skip)
const post = (m: ThreadMessage) => parentPort!.postMessage(m)

parentPort!.on('message', (t: ThreadTask) => {
  let visited = 0, found = 0
  for (const p of subtreeCensus(job.bounds, t.task, () => {
    if (++visited === 4096) { post({ type: 'visited', n: visited }); visited = 0 }
  })) {
    found++
    if (!skip.has(p.code)) post({ type: 'row', row: censusRow(p, job.classify) })
  }
  post({ type: 'done', index: t.index, visited, found })
})
