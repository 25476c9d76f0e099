import { tokenCreateSchema, type TokenItem } from '#shared/types/team'

/** Create an API token; the answer carries the token once, it cannot be shown again. Session only. */
export default defineEventHandler(async (event): Promise<TokenItem & { token: string }> => {
  const user = await requireSessionUser(event)
  const { name, scope } = await readValidatedBody(event, tokenCreateSchema.parse)
  const { token, row } = await createApiToken(user.id, name, scope)
  setResponseStatus(event, 201)
  return { ...toTokenItem(row), token }
})
