/**
 * A worker_threads pool for the census (the `SubtreeRunner` of shared/census/run.ts): the tasks
 * (nodes of the search tree at a shallow depth) go one at a time to the next idle thread, so a
 * large subtree does not hold up the others; rows come back as the threads classify them. Used by
 * the CLI, the in-process job and the BullMQ processor. The thread is TypeScript, loaded through
 * census-thread-boot.mjs (which registers tsx in the thread) from this folder or, inside the
 * built server, from the project's `server/jobs` folder; without it the caller runs on one
 * thread (`censusThreads` returns null).
 */
import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Worker } from 'node:worker_threads'
import type { ClassifyOptions } from '../../shared/census/classify'
import type { CensusBounds } from '../../shared/census/enumerate'
import type { CensusRow, SubtreeRunner } from '../../shared/census/run'
import type { CensusTask } from '../../shared/census/split'

export interface ThreadJob { bounds: CensusBounds, classify?: ClassifyOptions, skip: string[] }
export interface ThreadTask { index: number, task: CensusTask }
export type ThreadMessage =
  | { type: 'row', row: CensusRow }
  | { type: 'visited', n: number }
  | { type: 'done', index: number, visited: number, found: number }

function threadEntry(): string | null {
  const here = import.meta.url.startsWith('file:') ? fileURLToPath(new URL('./census-thread-boot.mjs', import.meta.url)) : ''
  for (const p of [here, resolve(process.cwd(), 'server/jobs/census-thread-boot.mjs')]) if (p && existsSync(p)) return p
  return null
}

/** Runs the tasks on `threads` worker threads. */
export function threadRunner(threads: number, entry: string): SubtreeRunner {
  return (job, on, signal) => new Promise<void>((resolveAll, reject) => {
    const workers: Worker[] = []
    let next = 0, pending = job.tasks.length, settled = false
    let chain = Promise.resolve()
    const finish = (err?: unknown) => {
      if (settled) return
      settled = true
      for (const w of workers) void w.terminate()
      chain.then(() => (err ? reject(err) : resolveAll()), reject)
    }
    const feed = (w: Worker) => {
      if (next < job.tasks.length) { const index = next++; w.postMessage({ index, task: job.tasks[index]! } satisfies ThreadTask) }
    }
    if (!pending) { finish(); return }
    signal?.addEventListener('abort', () => finish(), { once: true })
    const data: ThreadJob = { bounds: job.bounds, classify: job.classify, skip: job.skip }
    for (let k = 0; k < Math.min(threads, job.tasks.length); k++) {
      const w = new Worker(entry, { workerData: data, execArgv: [] })
      workers.push(w)
      w.on('message', (m: ThreadMessage) => {
        if (settled) return
        if (m.type === 'row') { const row = m.row; chain = chain.then(() => on.row(row)) } else if (m.type === 'visited') on.visited(m.n)
        else {
          on.visited(m.visited); on.found(m.found)
          if (--pending === 0) finish()
          else feed(w)
        }
      })
      w.on('error', e => finish(e))
      w.on('exit', (code) => { if (!settled && code !== 0) finish(new Error(`census thread stopped with code ${code}`)) })
      feed(w)
    }
  })
}

/**
 * The runner for `runCensus` with as many threads as the machine has cores (or `threads`), or
 * null when one thread is asked for or the thread entry is missing.
 */
export function censusThreads(threads = availableParallelism()): { runner: SubtreeRunner, threads: number } | null {
  const entry = threadEntry()
  if (threads < 2 || !entry) return null
  return { runner: threadRunner(threads, entry), threads }
}
