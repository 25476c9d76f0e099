import { commentCreateSchema, commentRunParamsSchema, type CommentItem } from '#shared/types/team'
import { noticeComment } from '~~/server/mail/notices'

/**
 * Comment on a run or one of its points, or answer a top-level comment (one level of threads;
 * an answer takes its parent's point). Any member may comment; the run's author gets a notice.
 */
export default defineEventHandler(async (event): Promise<CommentItem> => {
  const { runId } = await getValidatedRouterParams(event, commentRunParamsSchema.parse)
  const { user, role, run } = await requireRunAccess(event, runId, 'viewer')
  const { body, parentId, pointIndex } = await readValidatedBody(event, commentCreateSchema.parse)
  const parent = parentId ? await findComment(runId, parentId) : null
  if (parent?.parentId) throw httpError(400, 'reply_too_deep',
    'Answer the first comment of the thread: threads have one level.')
  const [row] = await useDb().insert(tables.comments).values({
    runId, body, parentId: parent?.id ?? null, pointIndex: parent ? parent.pointIndex : (pointIndex ?? null), authorId: user.id,
  }).returning()
  await logActivity({ projectId: run.projectId, actorId: user.id, verb: 'commented', objectType: 'run',
    objectId: runId, data: { commentId: row!.id, pointIndex: row!.pointIndex } })
  await noticeComment(runId, user, body)
  setResponseStatus(event, 201)
  return toCommentItem(row!, { id: user.id, name: user.name }, user.id, role)
})
