/** Paginated, filtered reading of the activity log (one project, or every project for admins). */
import { and, count, desc, eq, like, or, type SQL } from 'drizzle-orm'
import { activityVerbGroup, type ActivityItem, type ActivityQuery, type Page } from '#shared/types/team'

/**
 * One page of activity, newest first. Filters: verb, actor, object type, project.
 * @param q validated query (page from 1)
 */
export async function activityPage(q: ActivityQuery): Promise<Page<ActivityItem>> {
  const { activity: a, users: u, projects: p } = tables
  const filters: SQL[] = []
  if (q.projectId) filters.push(eq(a.projectId, q.projectId))
  // a verb filter matches its group: "finished" also finds older "finished (stopped: …)" entries
  if (q.verb) filters.push(or(eq(a.verb, q.verb), like(a.verb, `${q.verb} (%`))!)
  if (q.actorId) filters.push(eq(a.actorId, q.actorId))
  if (q.objectType) filters.push(eq(a.objectType, q.objectType))
  const where = filters.length ? and(...filters) : undefined
  const db = useDb()
  const [rows, [total]] = await Promise.all([
    db.select({ e: a, actor: u.name, projectName: p.name }).from(a)
      .innerJoin(p, eq(p.id, a.projectId)).leftJoin(u, eq(u.id, a.actorId))
      .where(where).orderBy(desc(a.createdAt), desc(a.id)).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
    db.select({ n: count() }).from(a).where(where),
  ])
  const items = rows.map(({ e, actor, projectName }) => ({
    id: e.id, projectId: e.projectId, projectName, actor, verb: e.verb, objectType: e.objectType, objectId: e.objectId,
    data: JSON.parse(e.data) as Record<string, unknown>, createdAt: e.createdAt.toISOString(),
  }))
  return { items, total: total!.n, page: q.page, pageSize: q.pageSize }
}

/** The distinct verbs (grouped by {@link activityVerbGroup}) and object types in a project's log (or all logs), for filter menus. */
export async function activityFacets(projectId?: number) {
  const a = tables.activity
  const where = projectId ? eq(a.projectId, projectId) : undefined
  const db = useDb()
  const [verbs, types] = await Promise.all([
    db.selectDistinct({ v: a.verb }).from(a).where(where).orderBy(a.verb),
    db.selectDistinct({ v: a.objectType }).from(a).where(where).orderBy(a.objectType),
  ])
  return { verbs: [...new Set(verbs.map(r => activityVerbGroup(r.v)))].sort(), objectTypes: types.map(r => r.v) }
}
