import { censusJobParamsSchema } from '#shared/types/census'

/** One census job with its progress counters. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, censusJobParamsSchema.parse)
  return censusJobView(await requireCensusJob(event, id))
})
