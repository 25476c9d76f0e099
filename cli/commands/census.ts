/**
 * `wingfold census --max-towers N --max-half-edges M [--json]`: every torus gluing pattern with at
 * most N towers and M half-edges, once up to orientation-preserving isomorphism, drawn, balanced
 * and classified (shared/census).
 */
import { parseArgs } from 'node:util'
import { runCensus, type CensusRow } from '../../shared/census/run'

export const summary = '--max-towers N --max-half-edges M [--json]  every torus gluing pattern, classified'

const USAGE = `Usage: wingfold census --max-towers N --max-half-edges M [--json]
  --lattice W1X,W1Y,W2X,W2Y  lattice to balance on (default the square lattice 1,0,0,1)
  --no-search                only that lattice (default: then sample shapes τ of the fundamental domain)
  --sweep                    τ map sweep (5 × 5) of every balanced pattern with ≥ 2 towers`

function intOption(v: unknown, name: string): number {
  const n = Number(v)
  if (v === undefined || !Number.isInteger(n)) throw new Error(`--${name} wants an integer`)
  return n
}

function line(r: CensusRow, index: Map<string, number>): string {
  const mirror = r.chiral ? `mirror of #${index.get(r.mirrorCode) ?? '?'}` : 'achiral'
  const verdict = r.balanced
    ? `balanced at τ = ${r.tau[0].toFixed(3)} + ${r.tau[1].toFixed(3)}i, ${r.rigid ? 'rigid' : 'not rigid'}, phase kernel ${r.phaseKernelDimension}`
    : `not balanced: ${r.reason}`
  return `#${index.get(r.code)}  towers ${r.towers}  edges ${r.edges}  degrees ${r.degrees.join(',')}  faces ${r.faceSizes.join(',')}  genus ${r.predictedGenus}  |Aut| ${r.automorphisms}  ${mirror}  ${verdict}`
}

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  let bounds, lattice, values
  try {
    ({ values } = parseArgs({
      args, options: {
        'max-towers': { type: 'string' }, 'max-half-edges': { type: 'string' }, 'json': { type: 'boolean', default: false },
        'lattice': { type: 'string' }, 'no-search': { type: 'boolean', default: false }, 'sweep': { type: 'boolean', default: false },
      },
    }))
    bounds = { maxTowers: intOption(values['max-towers'], 'max-towers'), maxHalfEdges: intOption(values['max-half-edges'], 'max-half-edges') }
    if (values.lattice) {
      const l = values.lattice.split(',').map(Number)
      if (l.length !== 4 || l.some(x => !Number.isFinite(x)) || l[0]! * l[3]! - l[1]! * l[2]! <= 0) throw new Error('--lattice wants W1X,W1Y,W2X,W2Y with det > 0')
      lattice = { w1: [l[0]!, l[1]!] as [number, number], w2: [l[2]!, l[3]!] as [number, number] }
    }
  } catch (e) {
    console.error(`wingfold census: ${(e as Error).message}\n${USAGE}`)
    return 2
  }
  const rows: CensusRow[] = []
  let result
  try {
    result = await runCensus({
      bounds, classify: { ...(lattice ? { lattice } : {}), searchTau: !values['no-search'], sweep: values.sweep },
      onRow: (r) => { rows.push(r) }, yieldEvery: 1000,
    })
  } catch (e) {
    console.error(`wingfold census: ${(e as Error).message}\n${USAGE}`)
    return 2
  }
  if (values.json) {
    console.log(JSON.stringify({ bounds, count: rows.length, visited: result.progress.visited, elapsedMs: result.progress.elapsedMs, patterns: rows }, null, 2))
    return 0
  }
  const index = new Map(rows.map((r, i) => [r.code, i + 1]))
  for (const r of rows) console.log(line(r, index))
  const balanced = rows.filter(r => r.balanced).length, rigid = rows.filter(r => r.rigid).length
  console.log(`${rows.length} patterns with towers ≤ ${bounds.maxTowers} and half-edges ≤ ${bounds.maxHalfEdges} (up to orientation-preserving isomorphism; ${rows.filter(r => r.chiral).length} chiral, in mirror pairs); ${balanced} balanced, ${rigid} balanced and rigid; ${result.progress.visited} maps searched in ${(result.progress.elapsedMs / 1000).toFixed(1)} s`)
  console.log('Results are numerical evidence, not proofs.')
  return 0
}
