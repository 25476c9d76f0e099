/**
 * `wingfold map FILE --plane tau --re MIN:MAX:N --im MIN:MAX:N [--json | --csv]`: a moduli map
 * of the pattern over the τ plane (or `--plane alpha --a1 … --a2 …`), swept row by row by
 * continuation from the seed, then along columns from solved cells (shared/maps).
 */
import { formatNumber } from '../../shared/format'
import { readFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { mapToCsv, mapToText, runMapSweep, traceAllCurves, type TracedCurve } from '../../shared/maps'
import { joinNegativeValues } from '../args'
import { pastDegeneration, type MapSettingsInput } from '../../shared/types/maps'
import { readPatternFile } from '../read-document'

export const summary = 'FILE --plane tau --re A:B:N --im A:B:N  moduli map (or --plane alpha --a1 … --a2 …); --trace; --json or --csv'

const USAGE = `Usage: wingfold map FILE --plane tau --re MIN:MAX:N --im MIN:MAX:N [--trace] [--json | --csv]
       wingfold map FILE --plane alpha --a1 MIN:MAX:N --a2 MIN:MAX:N [--trace] [--json | --csv]
  --scale area|w1            τ plane: keep the cell area (default) or |ω1|
  --seed X,Y                 start point (default: the document's τ or α)
  --collapse-tolerance T     shortest edge / mean edge that ends a row (default 1e-3)
  --trace                    also trace every collapse and rigidity-loss curve through the crossings found
                             (text: the points; --json: "curves"; --csv: a second table kind,x,y)
  --settings FILE            full map settings (JSON) instead of the options above`

function axis(s: string | undefined, name: string): { min: number; max: number; count: number } {
  const parts = (s ?? '').split(':').map(Number)
  if (parts.length !== 3 || parts.some(p => !Number.isFinite(p))) throw new Error(`--${name} wants MIN:MAX:N, got '${s ?? ''}'`)
  return { min: parts[0]!, max: parts[1]!, count: parts[2]! }
}

/** The traced curves as CSV rows after a blank line. */
function curvesToCsv(curves: TracedCurve[]): string {
  const esc = (s: string) => /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
  return `\ncurve,x,y\n${curves.flatMap(c => c.points.map(([x, y]) => `${esc(c.kind)},${x},${y}`)).join('\n')}\n`
}

/** Settings from the command-line options. */
function settingsFrom(v: Record<string, string | undefined>): MapSettingsInput {
  const plane = v.plane ?? 'tau'
  const [xs, ys] = plane === 'alpha' ? ['a1', 'a2'] : ['re', 'im']
  return {
    plane: plane as MapSettingsInput['plane'],
    x: axis(v[xs!], xs!), y: axis(v[ys!], ys!),
    ...(v.scale ? { scaleBy: v.scale as MapSettingsInput['scaleBy'] } : {}),
    ...(v.seed ? { seed: v.seed.split(',').map(Number) as [number, number] } : {}),
    ...(v['collapse-tolerance'] ? { collapseTolerance: Number(v['collapse-tolerance']) } : {}),
  }
}

const OPTIONS = {
  'plane': { type: 'string' }, 're': { type: 'string' }, 'im': { type: 'string' }, 'a1': { type: 'string' }, 'a2': { type: 'string' },
  'scale': { type: 'string' }, 'seed': { type: 'string' }, 'collapse-tolerance': { type: 'string' }, 'settings': { type: 'string' },
  'json': { type: 'boolean' }, 'csv': { type: 'boolean' }, 'trace': { type: 'boolean' },
} as const

/** Runs the command; returns the exit code (0 done, 2 bad usage or input). */
export async function run(args: string[]): Promise<number> {
  let parsed
  try {
    parsed = parseArgs({ args: joinNegativeValues(args, OPTIONS), allowPositionals: true, options: OPTIONS })
  } catch (e) {
    console.error(`wingfold map: ${(e as Error).message}\n${USAGE}`)
    return 2
  }
  const v = parsed.values as Record<string, string | undefined> & { json?: boolean; csv?: boolean; trace?: boolean }
  const file = parsed.positionals[0]
  if (parsed.positionals.length !== 1 || !file) { console.error(USAGE); return 2 }
  const input = await readPatternFile(file)
  if ('error' in input) { console.error(input.error); return 2 }
  let map
  const t0 = performance.now()
  try {
    const settings = v.settings ? JSON.parse(await readFile(v.settings, 'utf8')) as unknown : settingsFrom(v)
    map = runMapSweep(input.doc, settings)
  } catch (e) {
    console.error(`wingfold map: ${(e as Error).message}`)
    return 2
  }
  const curves = v.trace ? traceAllCurves(input.doc, map) : []
  const ms = performance.now() - t0
  if (v.json) process.stdout.write(`${JSON.stringify(v.trace ? { ...map, curves } : map)}\n`)
  else if (v.csv) process.stdout.write(mapToCsv(map) + (v.trace ? curvesToCsv(curves) : ''))
  else {
    const cells = map.rows.flatMap(r => r.cells)
    const solved = cells.filter(c => c.status === 'solved').length
    const past = cells.filter(pastDegeneration).length
    const ended = new Map<string, number>()
    for (const c of cells) if (c.endedBy) ended.set(c.endedBy, (ended.get(c.endedBy) ?? 0) + 1)
    console.log(`${map.settings.plane} map ${map.xs.length}×${map.ys.length}: ${solved} cells solved, ${past} past a degeneration, ${cells.length - solved - past} unreachable from the seed (${[...ended].map(([k, n]) => `${k}: ${n}`).join(', ') || 'none'}); ${ms.toFixed(0)} ms`)
    console.log('digits: negative eigenvalues of F_u; "x" past a collapse, order flip, lattice degeneracy or fold; "." unreachable from the seed; ^ spine column')
    console.log(mapToText(map))
    for (const c of [...map.spineCrossings, ...map.rows.flatMap(r => r.crossings)]) console.log(`  ${c.kind.padEnd(18)} at (${c.x.toPrecision(10)}, ${c.y.toPrecision(10)}) along a ${c.along}`)
    for (const c of curves) {
      console.log(`curve: ${c.kind}, ${c.points.length} points, max residual ${formatNumber(c.maxResidual, 2)}; ends: ${c.endReasons.join('; ')}`)
      for (const [x, y] of c.points) console.log(`  ${x.toPrecision(10)} ${y.toPrecision(10)}`)
    }
  }
  return 0
}
