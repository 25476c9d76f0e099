import { projectParamsSchema } from '#shared/types/projects'
import { graphCreateSchema } from '#shared/types/graphs'

/** Create a pattern in a project with its first version (editors and owners). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  assertBodySize(event)
  const body = await readValidatedBody(event, graphCreateSchema.parse)
  const document = checkedDocument(body.document)
  const created = await createGraph({ projectId: id, authorId: user.id, name: body.name, description: body.description,
    document, message: body.message })
  setResponseStatus(event, 201)
  return created
})
