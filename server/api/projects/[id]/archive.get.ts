import { Readable } from 'node:stream'
import { projectParamsSchema } from '#shared/types/projects'

/** The whole project as one zip archive (owners only), streamed while it is read. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { project } = await requireProjectRole(event, id, 'owner')
  setResponseHeaders(event, {
    'content-type': 'application/zip',
    'content-disposition': `attachment; filename="${archiveFileName(id, project.name)}"`,
    'cache-control': 'no-store',
  })
  const chunks = projectArchiveChunks({ client: useDb().$client, projectId: id,
    appVersion: useRuntimeConfig().public.appVersion, schema: serverSchemaVersion() })
  return sendStream(event, Readable.from(chunks))
})
