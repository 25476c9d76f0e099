import { censusJobParamsSchema } from '#shared/types/census'

/** Ask a queued or running census job to stop (it stops after the pattern in hand). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, censusJobParamsSchema.parse)
  const job = await requireCensusJob(event, id)
  if (!['queued', 'running'].includes(job.status)) throw httpError(409, 'census_not_running',
    `The job is ${job.status}; only a queued or running job can be cancelled.`)
  await cancelCensusJob(job)
  return { id, status: 'cancelling' }
})
