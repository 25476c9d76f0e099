import { eq } from 'drizzle-orm'
import { censusJobParamsSchema } from '#shared/types/census'

/** One census pattern with its drawing (a pattern document) and failing verdicts. */
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = await getValidatedRouterParams(event, censusJobParamsSchema.parse)
  const row = await useDb().query.censusPatterns.findFirst({ where: eq(tables.censusPatterns.id, id) })
  if (!row) throw httpError(404, 'census_pattern_not_found', 'No such census pattern.')
  return { ...censusPatternView(row), failing: JSON.parse(row.failing) as string[],
    document: JSON.parse(row.document) as unknown }
})
