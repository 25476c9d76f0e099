/**
 * Access decisions in one place. Pages and routes never repeat these checks.
 * Rules: signed-out (no session, no valid API token) → 401; a project the user is not a member of → 404 (its existence is not
 * revealed); a member below the required role → 403. Site admins do not bypass project roles.
 */
import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import { roleAtLeast, type ProjectRole } from '#shared/types/roles'

/**
 * The caller: the user of a valid `Authorization: Bearer` API token (see api-tokens.ts; a
 * read-scoped token is refused with 403 on methods that write), else the signed-in user of the
 * session, else a 401.
 */
export async function requireUser(event: H3Event) {
  const token = bearerToken(event)
  if (token) return (await userFromBearer(event, token)).user
  return requireSessionUser(event)
}

/** The user of the session cookie only (API tokens not accepted, e.g. to manage tokens), or a 401. */
export async function requireSessionUser(event: H3Event) {
  const { user } = await requireUserSession(event, { message: 'Sign in first.' })
  return user
}

/** The signed-in user when their stored site role is admin; 401 / 403 otherwise. */
export async function requireAdmin(event: H3Event) {
  const user = await requireUser(event)
  const row = await useDb().query.users.findFirst({ where: eq(tables.users.id, user.id), columns: { siteRole: true } })
  if (row?.siteRole !== 'admin') throw httpError(403, 'admin_only', 'Only site administrators can do this.')
  return user
}

/**
 * Require the signed-in user to hold at least `minRole` in project `projectId`.
 * @returns the user, the project row and the user's role in it
 */
export async function requireProjectRole(event: H3Event, projectId: number, minRole: ProjectRole) {
  const user = await requireUser(event)
  const row = await useDb()
    .select({ project: tables.projects, role: tables.memberships.role })
    .from(tables.projects)
    .innerJoin(tables.memberships, and(eq(tables.memberships.projectId, tables.projects.id), eq(tables.memberships.userId, user.id)))
    .where(eq(tables.projects.id, projectId))
    .get()
  if (!row) throw httpError(404, 'project_not_found', 'No such project.')
  if (!roleAtLeast(row.role, minRole)) {
    throw httpError(403, 'role_too_low', `This needs the ${minRole} role in this project; you are ${row.role === 'editor' ? 'an' : 'a'} ${row.role}.`)
  }
  return { user, project: row.project, role: row.role }
}
