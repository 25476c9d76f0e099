import { memberParamsSchema } from '#shared/types/projects'

/** Remove a member (owners only; the last owner cannot be removed). */
export default defineEventHandler(async (event) => {
  const { id, userId } = await getValidatedRouterParams(event, memberParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'owner')
  const member = await findMembership(id, userId)
  if (member.role === 'owner') await assertAnotherOwner(id)
  await deleteMembership(member.id)
  await logActivity({ projectId: id, actorId: user.id, verb: 'removed', objectType: 'member', objectId: userId,
    data: { role: member.role } })
  return { ok: true }
})
