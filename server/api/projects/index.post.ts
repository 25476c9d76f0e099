import { sql } from 'drizzle-orm'
import { projectCreateSchema } from '#shared/types/projects'

/** Create a project; its creator becomes the owner (one batch: see server/db/client.ts on batches). */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readValidatedBody(event, projectCreateSchema.parse)
  const db = useDb()
  // The batch runs on one connection without yielding, so the project just inserted is the newest.
  const newest = sql<number>`(SELECT max(id) FROM projects)` as unknown as number
  const [[project]] = await db.batch([
    db.insert(tables.projects).values({ ...body, createdBy: user.id }).returning({ id: tables.projects.id,
      name: tables.projects.name }),
    db.insert(tables.memberships).values({ projectId: newest, userId: user.id, role: 'owner' }),
    db.insert(tables.activity).values({ projectId: newest, actorId: user.id, verb: 'created', objectType: 'project',
      objectId: newest }),
  ])
  setResponseStatus(event, 201)
  return { id: project!.id, name: project!.name }
})
