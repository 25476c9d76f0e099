/** Everything an export of one run needs, loaded once. */
import type { ExportRun } from '#shared/runs/export'

/** Summary, settings and all points of a run, with the writing app version. */
export async function loadRunExport(runId: number, settingsText: string): Promise<ExportRun> {
  const [summary, points,
    specialPoints] = await Promise.all([loadRunSummary(runId), loadRunPoints(runId), loadSpecialPoints(runId)])
  return { summary: summary!, settings: JSON.parse(settingsText), points, specialPoints,
    exportedBy: useRuntimeConfig().public.appVersion }
}

/** A file name made of the run's id and name. */
export function exportFileName(runId: number, name: string, ext: string): string {
  return `wingfold-run-${runId}-${name.replace(/[^\w-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'run'}.${ext}`
}
