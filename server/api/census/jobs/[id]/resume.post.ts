import { censusJobParamsSchema } from '#shared/types/census'

/** Resume a cancelled, interrupted or failed job: stored patterns are skipped. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, censusJobParamsSchema.parse)
  const job = await requireCensusJob(event, id)
  if (!['cancelled', 'interrupted', 'failed'].includes(job.status)) throw httpError(409, 'census_not_resumable',
    `The job is ${job.status}; only a cancelled, interrupted or failed job can be resumed.`)
  await assertNoActiveCensusJob()
  await launchCensusJob(job)
  return { id, status: 'queued' }
})
