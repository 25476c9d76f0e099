import { desc } from 'drizzle-orm'

/** The latest census jobs (signed-in users). */
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const rows = await useDb().select().from(tables.censusJobs).orderBy(desc(tables.censusJobs.id)).limit(50)
  return rows.map(censusJobView)
})
