import { censusJobCreateSchema } from '#shared/types/census'

/** Start a census job (any signed-in user; one active job at a time, 409 otherwise). */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  assertBodySize(event)
  const body = await readValidatedBody(event, censusJobCreateSchema.parse)
  const db = useDb()
  await assertNoActiveCensusJob()
  const job = await db.insert(tables.censusJobs).values({
    maxTowers: body.maxTowers, maxHalfEdges: body.maxHalfEdges, queue: censusUsesQueue() ? 'bullmq' : 'in-process',
    options: JSON.stringify({ ...(body.lattice ? { lattice: body.lattice } : {}),
      searchTau: body.searchTau }), createdBy: user.id,
  }).returning().get()
  await launchCensusJob(job)
  setResponseStatus(event, 201)
  return censusJobView(job)
})
