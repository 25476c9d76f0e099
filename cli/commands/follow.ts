/**
 * `wingfold follow FILE --path KIND --to VALUE [--json] [--max-points N] [...]`: follow a family
 * of the pattern with the continuation engine and print its special points (all points with --json).
 */
import { formatNumber } from '../../shared/format'
import { readFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { FamilyRunner } from '../../shared/families/runner'
import { FAMILY_PATH_KINDS, type FamilyPath, type FamilySettingsInput } from '../../shared/types/family'
import { joinNegativeValues } from '../args'
import { readPatternFile } from '../read-document'

export const summary = 'FILE --path KIND --to X  follow a family (shear, stretch, angle, alpha1, …); --json for all points'

const USAGE = `Usage: wingfold follow FILE --path KIND --to X [--json] [--max-points N]
  KIND: ${FAMILY_PATH_KINDS.join(', ')}
  --target W1X,W1Y,W2X,W2Y   lattice for --path interpolate
  --points X,Y;X,Y…          τ points for --path tau-polyline
  --rotate ID,ID --compensate ID,ID   wing sets for --path wing-rotation
  --direction D1,D2          for --path alpha-line
  --edges ID,ID              for --path weight-scale
  --settings FILE            full family settings (JSON) instead of the options above`

const OPTIONS = {
  'path': { type: 'string' }, 'to': { type: 'string' }, 'json': { type: 'boolean' }, 'max-points': { type: 'string' },
  'target': { type: 'string' }, 'points': { type: 'string' }, 'rotate': { type: 'string' }, 'compensate': { type: 'string' },
  'direction': { type: 'string' }, 'edges': { type: 'string' }, 'settings': { type: 'string' },
} as const

const nums = (s: string): number[] => s.split(',').map(Number)

/** Relative precision reached in λ, as printed: "exact" for 0, else two digits. */
const formatPrecision = (p: number): string => p === 0 ? 'exact' : formatNumber(p, 2)

/** The path object from the command-line options. */
function pathFrom(kind: string, v: Record<string, string | undefined>): FamilyPath {
  switch (kind) {
    case 'interpolate': { const t = nums(v.target ?? ''); return { kind, target: { w1: [t[0]!, t[1]!], w2: [t[2]!, t[3]!] } } }
    case 'tau-polyline': return { kind, points: (v.points ?? '').split(';').map(p => nums(p) as [number, number]) }
    case 'wing-rotation': return { kind, rotate: (v.rotate ?? '').split(','), compensate: (v.compensate ?? '').split(',') }
    case 'alpha-line': return { kind, direction: nums(v.direction ?? '') as [number, number] }
    case 'weight-scale': return { kind, edges: (v.edges ?? '').split(',') }
    default: return { kind } as FamilyPath
  }
}

/** Runs the command; returns the exit code (0 finished, 1 refused, stopped (no convergence) or failed run, 2 bad usage). */
export async function run(args: string[]): Promise<number> {
  let parsed
  try {
    parsed = parseArgs({ args: joinNegativeValues(args, OPTIONS), allowPositionals: true, options: OPTIONS })
  } catch (e) {
    console.error(`wingfold follow: ${(e as Error).message}\n${USAGE}`)
    return 2
  }
  const v = parsed.values as Record<string, string | undefined> & { json?: boolean }
  const file = parsed.positionals[0]
  if (parsed.positionals.length !== 1 || !file || (!v.settings && (!v.path || v.to === undefined))) {
    console.error(USAGE)
    return 2
  }
  const input = await readPatternFile(file)
  if ('error' in input) { console.error(input.error); return 2 }
  let settings: FamilySettingsInput
  let runner: FamilyRunner
  try {
    settings = v.settings
      ? JSON.parse(await readFile(v.settings, 'utf8')) as FamilySettingsInput
      : { path: pathFrom(v.path!, v), to: Number(v.to) }
    if (v['max-points'] !== undefined) settings = { ...settings, stop: { ...settings.stop, maxPoints: Number(v['max-points']) } }
    runner = new FamilyRunner(input.doc, settings)
  } catch (e) {
    console.error(`wingfold follow: ${(e as Error).message}`)
    return 2
  }
  while (!runner.done) runner.step({ points: 1000, ms: 1000 })
  const r = runner.result()
  if (v.json) {
    process.stdout.write(`${JSON.stringify(r, null, 2)}\n`)
  } else {
    const pts = r.branch.points
    console.log(`${r.settings.path.kind}: ${pts.length} points, λ from ${pts[0]?.lambda ?? 'n/a'} to ${pts.at(-1)?.lambda ?? 'n/a'}; ${r.branch.finishReason ?? r.status}`)
    if (r.startNote) console.log(`note: ${r.startNote}`)
    for (const s of r.branch.specialPoints) console.log(`  ${s.kind.padEnd(18)} λ = ${s.lambda.toPrecision(12)}  ${s.label}; precision ${formatPrecision(s.precision)}${s.located ? '' : ` (not located to the tolerance ${r.settings.stop.locateTolerance})`}`)
    if (r.branch.specialPoints.length === 0) console.log('  no special points')
  }
  return r.status === 'finished' ? 0 : 1
}
