import { eq } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import { graphCreateSchema } from '#shared/types/graphs'

/** Create a pattern in a project with its first version (editors and owners). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  assertBodySize(event)
  const body = await readValidatedBody(event, graphCreateSchema.parse)
  const document = checkedDocument(body.document)
  const db = useDb()
  const g = await db.insert(tables.graphs).values({ projectId: id, name: body.name, description: body.description, createdBy: user.id }).returning().get()
  const version = await appendVersion({ projectId: id, graphId: g.id, authorId: user.id, document, message: body.message, verb: 'created' })
  await db.update(tables.projects).set({ updatedAt: new Date() }).where(eq(tables.projects.id, id))
  setResponseStatus(event, 201)
  return { id: g.id, version }
})
