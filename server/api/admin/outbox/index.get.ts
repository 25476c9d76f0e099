import { count, desc, eq } from 'drizzle-orm'
import { outboxQuerySchema, type OutboxItem, type Page } from '#shared/types/team'

/** The outbox, newest first, optionally by status (site admins). */
export default defineEventHandler(async (event): Promise<Page<OutboxItem>> => {
  await requireAdmin(event)
  const { page, pageSize, status } = await getValidatedQuery(event, outboxQuerySchema.parse)
  const m = tables.mailMessages
  const where = status ? eq(m.status, status) : undefined
  const db = useDb()
  const [rows, [total]] = await Promise.all([
    db.select().from(m).where(where).orderBy(desc(m.id)).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ n: count() }).from(m).where(where),
  ])
  return { items: rows.map(r => toOutboxItem(r)), total: total!.n, page, pageSize }
})
