import { graphRestoreSchema, graphVersionParamsSchema } from '#shared/types/graphs'

/** Restore: an older version's document becomes a new version (history is never rewritten). */
export default defineEventHandler(async (event) => {
  const { id, graphId, version } = await getValidatedRouterParams(event, graphVersionParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  const body = await readValidatedBody(event, b => graphRestoreSchema.parse(b ?? {}))
  const old = await loadGraphDetail(id, graphId, version)
  const document = checkedDocument(old.document)
  const next = await appendVersion({
    projectId: id, graphId, authorId: user.id, document, message: body.message || `Restored version ${version}`, verb: 'restored',
  })
  setResponseStatus(event, 201)
  return { id: graphId, version: next }
})
