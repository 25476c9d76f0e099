import { eq } from 'drizzle-orm'
import { outboxParamsSchema } from '#shared/types/team'
import { requeueMessage } from '~~/server/mail/outbox'

/** Send a failed (or waiting) message again now (site admins). */
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  const { messageId } = await getValidatedRouterParams(event, outboxParamsSchema.parse)
  if (await requeueMessage(messageId)) return { ok: true }
  const exists = await useDb().query.mailMessages.findFirst({ where: eq(tables.mailMessages.id, messageId),
    columns: { id: true } })
  if (!exists) throw httpError(404, 'message_not_found', 'No such message.')
  throw httpError(409, 'not_retryable',
    'Only failed or waiting messages can be sent again, and not one whose single-use link has expired: the '
      + 'recipient asks for a new link.')
})
