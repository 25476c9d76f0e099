/**
 * Run exports: CSV (one row per point, a header naming every column with its unit) and JSON
 * (settings + points + special points; re-importable by POST /api/projects/[id]/runs/import).
 * Both carry the app version, the settings and the caution line. Pure functions.
 */
import { RESULT_CAUTION, RUN_EXPORT_FORMAT, type RunSummary, type StoredRunPoint } from '../types/runs'
import { ARCLENGTH, diagnosticQuantity, lambdaQuantity, residualQuantity, STEP_SIZE, withUnit } from './units'

/** What an export needs about the run. */
export interface ExportRun {
  summary: Pick<RunSummary, 'id' | 'name' | 'pathKind' | 'status' | 'verification' | 'verificationReason' | 'graphName' | 'graphVersion' | 'appVersion' | 'createdAt'> & Partial<Pick<RunSummary, 'verticalBalance'>> & { finishReason?: string | null }
  settings: unknown
  points: StoredRunPoint[]
  specialPoints: StoredRunPoint[]
  /** Version of the app writing the export. */
  exportedBy: string
}

const csvCell = (v: unknown): string => {
  const s = v === undefined || v === null ? '' : typeof v === 'number' ? (Number.isFinite(v) ? String(v) : '') : String(v)
  return /[",\n#]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}

/** Sorted diagnostic keys over all points (stored points and view points alike). */
export function diagnosticKeys(points: readonly { diagnostics: Record<string, number> }[]): string[] {
  const keys = new Set<string>()
  for (const p of points) for (const k of Object.keys(p.diagnostics)) keys.add(k)
  return [...keys].sort()
}

/**
 * CSV text: `#` comment lines (app version, run, settings JSON, caution), then the header and one
 * row per regular point; a point followed by a special point names it in `special_after`.
 */
export function buildRunCsv(run: ExportRun): string {
  const keys = diagnosticKeys(run.points)
  const lam = lambdaQuantity(run.summary.pathKind)
  const after = new Map<number, string[]>()
  for (const s of run.specialPoints) {
    const a = Number((s.state as { afterPoint?: number }).afterPoint ?? -1)
    after.set(a, [...(after.get(a) ?? []), `${s.specialKind} at λ=${s.lambda}`])
  }
  const kind = run.summary.pathKind
  const header = ['index', `lambda: ${withUnit(lam)}`, `residual: ${withUnit(residualQuantity(kind))}`, `arclength: ${withUnit(ARCLENGTH)}`, `step size: ${withUnit(STEP_SIZE)}`, ...keys.map(k => `${k}: ${withUnit(diagnosticQuantity(k, kind))}`), 'special_after']
  const lines = [
    `# Wingfold ${run.exportedBy} run export (computed with Wingfold ${run.summary.appVersion})`,
    `# run ${run.summary.id} "${run.summary.name}" on pattern "${run.summary.graphName}" version ${run.summary.graphVersion}; status ${run.summary.status}${run.summary.finishReason ? ` (${run.summary.finishReason})` : ''}; verification ${run.summary.verification}`,
    `# settings ${JSON.stringify(run.settings)}`,
    `# ${RESULT_CAUTION}`,
    header.map(csvCell).join(','),
  ]
  for (const p of run.points) {
    const st = p.state as { arclength?: number, stepSize?: number }
    lines.push([p.index, p.lambda, p.residual, st.arclength, st.stepSize, ...keys.map(k => p.diagnostics[k]), (after.get(p.index) ?? []).join('; ')].map(csvCell).join(','))
  }
  return `${lines.join('\n')}\n`
}

/** JSON export object (re-importable). */
export function buildRunJson(run: ExportRun) {
  const unpack = (p: StoredRunPoint) => ({ index: p.index, lambda: p.lambda, ...p.state, ...(p.specialKind ? { kind: p.specialKind } : { diagnostics: p.diagnostics }) })
  return {
    format: RUN_EXPORT_FORMAT,
    formatVersion: 1,
    appVersion: run.exportedBy,
    computedWith: run.summary.appVersion,
    caution: RESULT_CAUTION,
    name: run.summary.name,
    pattern: { name: run.summary.graphName, version: run.summary.graphVersion },
    status: run.summary.status,
    finishReason: run.summary.finishReason ?? null,
    // verticalBalance: the definition the verdict used ('cuts-v1'); null = the earlier vertex-sum one
    verification: { state: run.summary.verification, reason: run.summary.verificationReason, verticalBalance: run.summary.verticalBalance ?? null },
    lambda: lambdaQuantity(run.summary.pathKind),
    settings: run.settings,
    points: run.points.map(unpack),
    specialPoints: run.specialPoints.map(unpack),
  }
}
