import { outboxParamsSchema } from '#shared/types/team'
import { requeueMessage } from '~~/server/mail/outbox'

/** Send a failed (or waiting) message again now (site admins). */
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  const { messageId } = await getValidatedRouterParams(event, outboxParamsSchema.parse)
  if (!(await requeueMessage(messageId))) throw httpError(409, 'not_retryable', 'Only failed or waiting messages can be sent again.')
  return { ok: true }
})
