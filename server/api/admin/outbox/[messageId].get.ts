import { eq } from 'drizzle-orm'
import { outboxParamsSchema, type OutboxMessage } from '#shared/types/team'

/** One message with its text and HTML bodies (site admins). */
export default defineEventHandler(async (event): Promise<OutboxMessage> => {
  await requireAdmin(event)
  const { messageId } = await getValidatedRouterParams(event, outboxParamsSchema.parse)
  const row = await useDb().query.mailMessages.findFirst({ where: eq(tables.mailMessages.id, messageId) })
  if (!row) throw httpError(404, 'message_not_found', 'No such message.')
  return { ...toOutboxItem(row), fromAddress: row.fromAddress, textBody: row.textBody, htmlBody: row.htmlBody }
})
