import { graphParamsSchema, graphSaveSchema } from '#shared/types/graphs'

/** Save: the document becomes a new version with a message (editors and owners). */
export default defineEventHandler(async (event) => {
  const { id, graphId } = await getValidatedRouterParams(event, graphParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  assertBodySize(event)
  const body = await readValidatedBody(event, graphSaveSchema.parse)
  const document = checkedDocument(body.document)
  const version = await appendVersion({ projectId: id, graphId, authorId: user.id, document, message: body.message,
    verb: 'saved' })
  setResponseStatus(event, 201)
  return { id: graphId, version }
})
