import { projectParamsSchema } from '#shared/types/projects'
import { runCreateSchema } from '#shared/types/runs'

/** Start a run (editor or owner) on a version of one of the project's patterns; points follow in batches. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  const body = await readValidatedBody(event, runCreateSchema.parse)
  const version = await resolveGraphVersion(id, body.graphId, body.version)
  assertSettingsFit(version.document, body.settings)
  if (body.parentRunId !== undefined) {
    const parent = await useDb().query.runs.findFirst({ where: (r, { eq }) => eq(r.id, body.parentRunId!) })
    if (!parent || parent.projectId !== id) throw httpError(404, 'run_not_found', 'No such parent run in this project.')
  }
  const [run] = await useDb().insert(tables.runs).values({
    projectId: id, graphVersionId: version.id, name: body.name, pathKind: body.settings.path.kind,
    settings: JSON.stringify(body.settings), appVersion: useRuntimeConfig().public.appVersion, authorId: user.id,
    parentRunId: body.parentRunId ?? null, restartPointIndex: body.restartPointIndex ?? null,
  }).returning()
  await logActivity({ projectId: id, actorId: user.id, verb: 'started', objectType: 'run', objectId: run!.id,
    data: { name: body.name, kind: body.settings.path.kind } })
  setResponseStatus(event, 201)
  return await loadRunSummary(run!.id)
})
