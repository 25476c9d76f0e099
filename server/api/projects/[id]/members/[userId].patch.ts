import { memberParamsSchema, memberRoleSchema } from '#shared/types/projects'

/** Change a member's role (owners only; the last owner cannot step down). */
export default defineEventHandler(async (event) => {
  const { id, userId } = await getValidatedRouterParams(event, memberParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'owner')
  const { role } = await readValidatedBody(event, memberRoleSchema.parse)
  const member = await findMembership(id, userId)
  if (member.role === 'owner' && role !== 'owner') await assertAnotherOwner(id)
  await updateMembership(member.id, { role })
  await logActivity({ projectId: id, actorId: user.id, verb: 'changed role', objectType: 'member', objectId: userId,
    data: { from: member.role, to: role } })
  return { userId, role }
})
