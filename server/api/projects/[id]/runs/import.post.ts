import { eq } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import { MAX_POINTS_PER_BATCH, runImportSchema } from '#shared/types/runs'

/**
 * Import a JSON export as a new run of one of this project's patterns (editor or owner). The
 * points are checked like appended batches; a forged or corrupted file ends as a rejected run
 * whose reason names the offending points (201 either way: the verdict is in the body).
 */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'editor')
  const { graphId, version, name, run: file } = await readValidatedBody(event, runImportSchema.parse)
  const v = await resolveGraphVersion(id, graphId, version)
  const [row] = await useDb().insert(tables.runs).values({
    projectId: id, graphVersionId: v.id, name: name ?? `${file.name} (imported)`, pathKind: file.settings.path.kind,
    settings: JSON.stringify(file.settings), appVersion: useRuntimeConfig().public.appVersion, authorId: user.id,
  }).returning()
  let run = row!
  for (let i = 0; i < Math.max(file.points.length, 1); i += MAX_POINTS_PER_BATCH) {
    const res = await appendBatch(run,
      { points: file.points.slice(i, i + MAX_POINTS_PER_BATCH), specialPoints: i === 0 ? file.specialPoints : [] })
    if (!res.accepted) break
    run = (await useDb().query.runs.findFirst({ where: eq(tables.runs.id, run.id) }))!
  }
  await useDb().update(tables.runs).set({ status: file.status === 'running' || !file.status ? 'complete' : file.status,
    finishReason: file.finishReason ?? null }).where(eq(tables.runs.id, run.id))
  await verifyStoredRun(run.id)
  await logActivity({ projectId: id, actorId: user.id, verb: 'imported', objectType: 'run', objectId: run.id,
    data: { name: run.name } })
  setResponseStatus(event, 201)
  return await loadRunSummary(run.id)
})
