import { and, eq, gt } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'

const DAYS = 14

/** Activity counts per UTC day over the last two weeks, oldest first. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  const start = new Date(Date.now() - (DAYS - 1) * 86_400_000)
  start.setUTCHours(0, 0, 0, 0)
  const a = tables.activity
  const rows = await useDb().select({ at: a.createdAt }).from(a).where(and(eq(a.projectId, id), gt(a.createdAt, start)))
  const days = Array.from({ length: DAYS },
    (_, i) => ({ day: new Date(start.getTime() + i * 86_400_000).toISOString().slice(0, 10), count: 0 }))
  for (const r of rows) {
    const i = Math.floor((r.at.getTime() - start.getTime()) / 86_400_000)
    if (i >= 0 && i < DAYS) days[i]!.count++
  }
  return { days }
})
