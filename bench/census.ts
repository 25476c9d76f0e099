/**
 * Census bench (`npx tsx bench/census.ts`, also the last section of `npm run bench`): for
 * N = 1..4 towers with M = 4N half-edges (room for N towers of degree 4, or fewer of higher
 * degree), the number of classes, the maps searched by the canonical augmentation, the
 * enumeration rate, the classification time per pattern (mean over at most 40 patterns spread over the enumeration), and the
 * whole census time T(N) = enumeration + count × classification. For N = 5 a time-boxed partial
 * run measures the search rate and the counts are extrapolated one step (below) to say up to which
 * N a census finishes in 10 minutes. A census job runs on one
 * core (in process, or one BullMQ worker); the second core of the 2-core target serves the web app.
 * Nothing is asserted.
 */
import { performance } from 'node:perf_hooks'
import { enumerateCensus } from '../shared/census/enumerate'
import { censusRow } from '../shared/census/run'

const TARGET_S = 600
console.log('\nCensus: torus gluing patterns with towers ≤ N and half-edges ≤ M = 4N (one core)')
console.log('   N    M  patterns  maps searched  enumeration s  patterns/s (enum)  classify ms/pattern  census s (est.)')
const times: number[] = []
const counts: { visited: number, patterns: number, classifyMs: number }[] = []
for (const N of [1, 2, 3, 4]) {
  const M = 4 * N
  let visited = 0
  const t0 = performance.now()
  const patterns = [...enumerateCensus({ maxTowers: N, maxHalfEdges: M }, () => { visited++ })]
  const enumS = (performance.now() - t0) / 1000
  const stride = Math.max(1, Math.ceil(patterns.length / 40))
  const sample = patterns.filter((_, k) => k % stride === 0) // spread over the enumeration order
  const t1 = performance.now()
  for (const p of sample) censusRow(p)
  const classifyMs = sample.length ? (performance.now() - t1) / sample.length : 0
  const total = enumS + patterns.length * classifyMs / 1000
  times.push(total)
  counts.push({ visited, patterns: patterns.length, classifyMs })
  const rate = enumS > 0 ? patterns.length / enumS : 0
  console.log(`${String(N).padStart(4)} ${String(M).padStart(4)} ${String(patterns.length).padStart(9)} ${String(visited).padStart(14)} ${enumS.toFixed(2).padStart(14)} ${rate.toFixed(0).padStart(18)} ${classifyMs.toFixed(1).padStart(20)} ${total.toFixed(2).padStart(16)}`)
}
// N = 5: too long to finish here, so a time-boxed partial run gives the search rate at that size,
// and the counts are extrapolated with growing ratios x(5) = x(4)·(x(4)/x(3))²/(x(3)/x(2)), as the
// measured ratios of maps searched and of patterns both grow.
const BOX_S = 20
let v5 = 0, p5seen = 0
const t5start = performance.now()
for (const _ of enumerateCensus({ maxTowers: 5, maxHalfEdges: 20 }, () => { v5++ })) {
  p5seen++
  if ((performance.now() - t5start) / 1000 > BOX_S) break
}
const box = (performance.now() - t5start) / 1000
const rate5 = v5 / box
const grow = (x: number[]) => x[3]! * (x[3]! / x[2]!) ** 2 / (x[2]! / x[1]!)
const visited5 = grow(counts.map(c => c.visited)), patterns5 = grow(counts.map(c => c.patterns))
const t5 = visited5 / rate5 + patterns5 * counts[3]!.classifyMs / 1000
console.log(`N = 5, M = 20, time-boxed to ${BOX_S} s: ${v5} maps searched (${rate5.toFixed(0)} maps/s), ${p5seen} patterns met so far`)
console.log(`extrapolated: ${visited5.toExponential(2)} maps to search, ${patterns5.toFixed(0)} patterns; census T(5) ≈ ${(t5 / 60).toFixed(0)} min`)
const lastN = t5 <= TARGET_S ? 5 : 4
console.log(`largest N (M = 4N) whose census finishes in ${TARGET_S / 60} min on one of 2 cores: N = ${lastN} (T(4) = ${times[3]!.toFixed(1)} s measured; target: N ≥ 4, ${lastN >= 4 && times[3]! <= TARGET_S ? 'met' : 'MISSED'})`)
