import { eq, or } from 'drizzle-orm'
import { roleAtLeast } from '#shared/types/roles'
import { commentParamsSchema } from '#shared/types/team'

/** Delete your own comment, or any comment as a project owner; answers to it go with it. */
export default defineEventHandler(async (event) => {
  const { runId, commentId } = await getValidatedRouterParams(event, commentParamsSchema.parse)
  const { user, role } = await requireRunAccess(event, runId, 'viewer')
  const comment = await findComment(runId, commentId)
  if (comment.authorId !== user.id && !roleAtLeast(role, 'owner')) throw httpError(403, 'not_your_comment',
    'You can delete your own comments; owners can delete any.')
  const c = tables.comments
  await useDb().delete(c).where(or(eq(c.id, commentId), eq(c.parentId, commentId)))
  return { ok: true }
})
