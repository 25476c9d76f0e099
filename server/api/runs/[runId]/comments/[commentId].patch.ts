import { eq } from 'drizzle-orm'
import { commentParamsSchema, commentUpdateSchema, type CommentItem } from '#shared/types/team'

/** Edit your own comment (marked "edited"). */
export default defineEventHandler(async (event): Promise<CommentItem> => {
  const { runId, commentId } = await getValidatedRouterParams(event, commentParamsSchema.parse)
  const { user, role } = await requireRunAccess(event, runId, 'viewer')
  const { body } = await readValidatedBody(event, commentUpdateSchema.parse)
  const comment = await findComment(runId, commentId)
  if (comment.authorId !== user.id) throw httpError(403, 'not_your_comment', 'You can only edit your own comments.')
  const [row] = await useDb().update(tables.comments).set({ body, edited: true }).where(eq(tables.comments.id,
    commentId)).returning()
  return toCommentItem(row!, { id: user.id, name: user.name }, user.id, role)
})
