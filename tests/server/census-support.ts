/** Helpers of the census server tests: wait for a job's state by polling its route. */
import type { ApiClient } from '../support/http'

export interface JobBody { id: number, status: string, classified: number, found: number, visited: number, queue: string, error: string | null }

/** Polls GET /api/census/jobs/:id until `done(job)` holds (or fails after `timeoutMs`). */
export async function waitForJob(c: ApiClient, id: number, done: (j: JobBody) => boolean, timeoutMs = 50_000): Promise<JobBody> {
  const until = Date.now() + timeoutMs
  let last: JobBody | undefined
  while (Date.now() < until) {
    const r = await c.json('GET', `/api/census/jobs/${id}`)
    last = r.body as JobBody
    if (done(last)) return last
    await new Promise(resolve => setTimeout(resolve, 20)) // poll interval while waiting for the condition
  }
  throw new Error(`census job ${id} did not reach the state in time; last: ${JSON.stringify(last)}`)
}
