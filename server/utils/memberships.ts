/** Membership queries shared by the member routes. */
import { and, count, eq } from 'drizzle-orm'
import type { ProjectRole } from '#shared/types/roles'

/** The membership of `userId` in `projectId`, or a 404. */
export async function findMembership(projectId: number, userId: number) {
  const m = tables.memberships
  const row = await useDb().query.memberships.findFirst({ where: and(eq(m.projectId, projectId),
    eq(m.userId, userId)) })
  if (!row) throw httpError(404, 'member_not_found', 'This person is not a member of the project.')
  return row
}

/** 409 unless the project has another owner besides the owner being demoted or removed. */
export async function assertAnotherOwner(projectId: number) {
  const m = tables.memberships
  const [row] = await useDb().select({ n: count() }).from(m).where(and(eq(m.projectId, projectId), eq(m.role, 'owner')))
  if (row!.n < 2) {
    throw httpError(409, 'last_owner', 'A project needs at least one owner. Make someone else owner first.')
  }
}

/** Set a membership's role. */
export async function updateMembership(membershipId: number, set: { role: ProjectRole }) {
  await useDb().update(tables.memberships).set(set).where(eq(tables.memberships.id, membershipId))
}

/** Delete a membership. */
export async function deleteMembership(membershipId: number) {
  await useDb().delete(tables.memberships).where(eq(tables.memberships.id, membershipId))
}
