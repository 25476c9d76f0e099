import { inArray } from 'drizzle-orm'
import { compareQuerySchema, type RunSummary, type StoredRunPoint } from '#shared/types/runs'

/**
 * Runs to overlay, from any projects the user can read: each with its settings, points and
 * special points. Runs the user cannot read are left out and counted in `hidden` (no 403 that
 * would reveal they exist).
 */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { runs: ids } = await getValidatedQuery(event, compareQuerySchema.parse)
  const readable = await readableProjectIds(user.id)
  const rows = (await runSummaryQuery().where(inArray(tables.runs.id, ids))).filter(r => readable.has(r.run.projectId))
  const runs: Array<RunSummary & { settings: unknown, points: StoredRunPoint[], specialPoints: StoredRunPoint[] }> = []
  for (const id of ids) {
    const row = rows.find(r => r.run.id === id)
    if (!row) continue
    const [points, specialPoints] = await Promise.all([loadRunPoints(id), loadSpecialPoints(id)])
    runs.push({ ...toRunSummary(row), settings: JSON.parse(row.run.settings), points, specialPoints })
  }
  return { runs, hidden: ids.length - runs.length }
})
