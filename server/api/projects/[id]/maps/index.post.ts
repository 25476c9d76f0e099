import { projectParamsSchema } from '#shared/types/projects'
import { MapCreateSchema, type MapResult } from '#shared/types/maps'
import { parsePatternDocument } from '#shared/types/pattern'
import { VERTICAL_BALANCE_DEFINITION } from '#shared/pattern/report'

/** Save a map computed in the browser (editor or owner); the server verifies a sample of cells. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  const body = await readValidatedBody(event, MapCreateSchema.parse)
  const version = await resolveGraphVersion(id, body.graphId, body.version)
  const result = { ...body.result, settings: body.settings } as MapResult
  const check = checkPostedMap(parsePatternDocument(JSON.parse(version.document)), body.settings, result)
  const cells = result.rows.flatMap(r => r.cells)
  const [map] = await useDb().insert(tables.maps).values({
    projectId: id, graphVersionId: version.id, name: body.name, plane: body.settings.plane, settings: JSON.stringify(body.settings),
    result: JSON.stringify({ result,
      curves: body.curves }), cellCount: cells.length, solvedCount: cells.filter(c => c.status === 'solved').length,
    wallMs: body.wallMs ?? null, workers: body.workers ?? null, verification: check.verification, verificationReason: check.reason, verticalBalance: VERTICAL_BALANCE_DEFINITION,
    appVersion: useRuntimeConfig().public.appVersion, authorId: user.id,
  }).returning()
  await logActivity({ projectId: id, actorId: user.id, verb: 'saved', objectType: 'map', objectId: map!.id,
    data: { name: body.name, plane: body.settings.plane } })
  setResponseStatus(event, 201)
  return (await listMaps(id)).find(m => m.id === map!.id)
})
