/**
 * Census bench (`npx tsx bench/census.ts`, also the last section of `npm run bench`): for
 * N = 1..5 towers with M = 4N half-edges (room for N towers of degree 4, or fewer of higher
 * degree), the number of classes, the maps searched by the canonical augmentation, the search's
 * wall and CPU time on one thread, the classification CPU time per pattern (mean over at most 40
 * patterns spread over the enumeration), and the census on 2 worker threads (search +
 * classification): measured wall time for N ≤ 4 (and N = 5 with BENCH_CENSUS_N5=1), else estimated
 * as CPU time / 2 with every unbalanced pattern charged the sweep search's whole budget. The machine is shared, so CPU time (process.cpuUsage, this thread) is printed
 * beside wall time: it is what 2 free cores would need. N = 6 is extrapolated from the measured
 * growth of maps searched and of patterns (ratio of ratios, as both ratios grow). Nothing is
 * asserted.
 */
import { performance } from 'node:perf_hooks'
import { censusThreads } from '../server/jobs/census-threads'
import { enumerateCensus } from '../shared/census/enumerate'
import { censusRow, runCensus } from '../shared/census/run'

const TARGET_S = 600
const SWEEP_BUDGET_MS = 500 // classify.ts default sweepSearchMs
const cpuS = (since: NodeJS.CpuUsage) => { const u = process.cpuUsage(since); return (u.user + u.system) / 1e6 }
console.log('\nCensus: torus gluing patterns with towers ≤ N and half-edges ≤ M = 4N')
console.log('   N    M  patterns  maps searched  search s (1 thread, wall/CPU)  patterns/s (CPU)  classify CPU ms/pattern  census on 2 threads s (≤)')
const rows: { N: number, visited: number, patterns: number, searchCpu: number, classifyMs: number, census2: number, measured: boolean }[] = []
for (const N of [1, 2, 3, 4, 5]) {
  const M = 4 * N
  let visited = 0
  const c0 = process.cpuUsage(), t0 = performance.now()
  const patterns = [...enumerateCensus({ maxTowers: N, maxHalfEdges: M }, () => { visited++ })]
  const searchWall = (performance.now() - t0) / 1000, searchCpu = cpuS(c0)
  const stride = Math.max(1, Math.ceil(patterns.length / 40))
  const sample = patterns.filter((_, k) => k % stride === 0) // spread over the enumeration order
  const c1 = process.cpuUsage()
  for (const p of sample) censusRow(p)
  const classifyMs = sample.length ? cpuS(c1) * 1000 / sample.length : 0
  // the sweep search's budget is wall-clock: on a loaded machine it burns less CPU than on free
  // cores, so each unbalanced pattern is charged the whole budget (an upper bound)
  const failed = sample.filter(p => !censusRow(p, { sweepSearchMs: 0 }).balanced).length / Math.max(1, sample.length)
  let census2 = (searchCpu + patterns.length * (classifyMs + failed * SWEEP_BUDGET_MS) / 1000) / 2, measured = false
  if (N <= 4 || process.env.BENCH_CENSUS_N5 === '1') {
    const t2 = performance.now()
    await runCensus({ bounds: { maxTowers: N, maxHalfEdges: M }, subtrees: censusThreads(2) ?? undefined, yieldEvery: 1000 })
    census2 = (performance.now() - t2) / 1000; measured = true
  }
  rows.push({ N, visited, patterns: patterns.length, searchCpu, classifyMs, census2, measured })
  const rate = searchCpu > 0 ? patterns.length / searchCpu : 0
  console.log(`${String(N).padStart(4)} ${String(M).padStart(4)} ${String(patterns.length).padStart(9)} ${String(visited).padStart(14)} ${`${searchWall.toFixed(2)} / ${searchCpu.toFixed(2)}`.padStart(30)} ${rate.toFixed(0).padStart(17)} ${classifyMs.toFixed(1).padStart(24)} ${`${census2.toFixed(1)} (${measured ? 'measured, wall' : `CPU / 2, ${(100 * failed).toFixed(0)}% unbalanced × ${SWEEP_BUDGET_MS} ms`})`.padStart(24)}`)
}
const grow = (x: number[]) => x[4]! * (x[4]! / x[3]!) ** 2 / (x[3]! / x[2]!)
const v6 = grow(rows.map(r => r.visited)), p6 = grow(rows.map(r => r.patterns))
const r5 = rows[4]!
const t6 = (v6 * (r5.searchCpu / r5.visited) * 1.5 + p6 * (r5.classifyMs + SWEEP_BUDGET_MS) / 1000) / 2 // maps of N = 6 are larger: 1.5 × the cost per map (assumed)
console.log(`N = 6, M = 24 extrapolated: ${v6.toExponential(2)} maps to search, ${p6.toFixed(0)} patterns; census on 2 free cores ≈ ${(t6 / 60).toFixed(0)} min`)
const fits = rows.filter(r => r.census2 <= TARGET_S).map(r => r.N)
const lastN = Math.max(...fits, t6 <= TARGET_S ? 6 : 0)
console.log(`largest N (M = 4N) whose census finishes in ${TARGET_S / 60} min on 2 cores: N = ${lastN} (${lastN === 6 ? 'extrapolated' : rows[lastN - 1]!.measured ? 'measured wall time' : 'CPU time / 2'}; target: N ≥ 5, ${lastN >= 5 ? 'met' : 'MISSED'})`)
