/**
 * Access decisions in one place. Pages and routes never repeat these checks.
 * Rules: signed-out (no session, no valid API token) → 401; a project the user is not a member of
 * → 404 (its existence is not revealed); a member below the required role → 403. Site admins do
 * not bypass project roles.
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

/** The 404 a caller gets for a missing object and for one in a project they cannot see alike. */
type NotFound = readonly [code: string, message: string]

/**
 * The project row and the user's role in it: `notFound` when the user is not a member (or there
 * is no such project), 403 when the role is below `minRole`.
 */
async function memberRole(userId: number, projectId: number, minRole: ProjectRole, notFound: NotFound) {
  const row = await useDb()
    .select({ project: tables.projects, role: tables.memberships.role })
    .from(tables.projects)
    .innerJoin(tables.memberships,
      and(eq(tables.memberships.projectId, tables.projects.id), eq(tables.memberships.userId, userId)))
    .where(eq(tables.projects.id, projectId))
    .get()
  if (!row) throw httpError(404, ...notFound)
  if (!roleAtLeast(row.role, minRole)) {
    throw httpError(403, 'role_too_low',
      `This needs the ${minRole} role in this project; you are ${row.role === 'editor' ? 'an' : 'a'} ${row.role}.`)
  }
  return { project: row.project, role: row.role }
}

/**
 * Require the signed-in user to hold at least `minRole` in project `projectId`.
 * @returns the user, the project row and the user's role in it
 */
export async function requireProjectRole(event: H3Event, projectId: number, minRole: ProjectRole) {
  const user = await requireUser(event)
  return { user, ...(await memberRole(user.id, projectId, minRole, ['project_not_found', 'No such project.'])) }
}

/**
 * A run and the user's role in its project: 401 first, then the same 404 for a missing run and
 * for a run in a project the user cannot see, 403 below `minRole`.
 */
export async function requireRunAccess(event: H3Event, runId: number, minRole: ProjectRole) {
  const user = await requireUser(event)
  const notFound = ['run_not_found', 'No such run.'] as const
  const run = await useDb().query.runs.findFirst({ where: eq(tables.runs.id, runId) })
  if (!run) throw httpError(404, ...notFound)
  return { user, ...(await memberRole(user.id, run.projectId, minRole, notFound)), run }
}

/** A saved map and the user's role in its project (the same rules as {@link requireRunAccess}). */
export async function requireMapAccess(event: H3Event, mapId: number, minRole: ProjectRole) {
  const user = await requireUser(event)
  const notFound = ['map_not_found', 'No such map.'] as const
  const map = await useDb().query.maps.findFirst({ where: eq(tables.maps.id, mapId) })
  if (!map) throw httpError(404, ...notFound)
  return { user, ...(await memberRole(user.id, map.projectId, minRole, notFound)), map }
}

/**
 * Ids of the projects the user may read (any membership), for routes that gather objects from
 * several projects and leave out the ones the user cannot see.
 */
export async function readableProjectIds(userId: number): Promise<Set<number>> {
  const m = tables.memberships
  const rows = await useDb().select({ projectId: m.projectId }).from(m).where(eq(m.userId, userId))
  return new Set(rows.map(r => r.projectId))
}
