import { and, asc, desc, eq, sql } from 'drizzle-orm'
import { censusPatternQuerySchema } from '#shared/types/census'

/** Census patterns, filtered and sorted (signed-in users); `total` counts the filtered rows. */
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const q = await getValidatedQuery(event, censusPatternQuerySchema.parse)
  const t = tables.censusPatterns
  const where = and(
    q.towers !== undefined ? eq(t.towers, q.towers) : undefined,
    q.genus !== undefined ? eq(t.predictedGenus, q.genus) : undefined,
    q.degrees !== undefined ? eq(t.degrees, q.degrees) : undefined,
    q.balanced !== undefined ? eq(t.balanced, q.balanced) : undefined,
    q.rigid !== undefined ? eq(t.rigid, q.rigid) : undefined,
    q.chiral !== undefined ? eq(t.chiral, q.chiral) : undefined,
  )
  const dir = q.order === 'desc' ? desc : asc
  const db = useDb()
  const rows = await db.select().from(t).where(where).orderBy(dir(t[q.sort]), asc(t.id)).limit(q.limit).offset(q.offset)
  const total = await db.select({ n: sql<number>`count(*)` }).from(t).where(where).get()
  return { total: total?.n ?? 0, patterns: rows.map(censusPatternView) }
})
