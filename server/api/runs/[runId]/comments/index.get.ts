import { and, asc, eq, type SQL } from 'drizzle-orm'
import { commentListQuerySchema, commentRunParamsSchema, type CommentItem } from '#shared/types/team'

/** A run's comments, oldest first (optionally only those on one point). Any member. */
export default defineEventHandler(async (event): Promise<CommentItem[]> => {
  const { runId } = await getValidatedRouterParams(event, commentRunParamsSchema.parse)
  const { pointIndex } = await getValidatedQuery(event, commentListQuerySchema.parse)
  const { user, role } = await requireRunAccess(event, runId, 'viewer')
  const { comments: c, users: u } = tables
  const where: SQL[] = [eq(c.runId, runId)]
  if (pointIndex !== undefined) where.push(eq(c.pointIndex, pointIndex))
  const rows = await useDb().select({ c, authorName: u.name }).from(c).leftJoin(u, eq(u.id, c.authorId))
    .where(and(...where)).orderBy(asc(c.createdAt), asc(c.id))
  return rows.map(r => toCommentItem(r.c,
    r.c.authorId && r.authorName ? { id: r.c.authorId, name: r.authorName } : null, user.id, role))
})
