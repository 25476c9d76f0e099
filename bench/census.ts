/**
 * Census bench (`npx tsx bench/census.ts`, also the last section of `npm run bench`): for
 * N = 1..4 towers with M = 4N half-edges (room for N towers of degree 4, or fewer of higher
 * degree), the number of classes, the maps searched by the canonical augmentation, the
 * enumeration rate, the classification time per pattern (mean over at most 40 patterns), and the
 * whole census time T(N) = enumeration + count × classification. The growth of T is extrapolated
 * one step with a growing ratio r(N+1) = r(N)²/r(N−1) (r(N) = T(N)/T(N−1); the ratios measured so
 * far increase) to say up to which N a census finishes in 10 minutes. A census job runs on one
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
for (const N of [1, 2, 3, 4]) {
  const M = 4 * N
  let visited = 0
  const t0 = performance.now()
  const patterns = [...enumerateCensus({ maxTowers: N, maxHalfEdges: M }, () => { visited++ })]
  const enumS = (performance.now() - t0) / 1000
  const sample = patterns.slice(0, 40)
  const t1 = performance.now()
  for (const p of sample) censusRow(p)
  const classifyMs = sample.length ? (performance.now() - t1) / sample.length : 0
  const total = enumS + patterns.length * classifyMs / 1000
  times.push(total)
  const rate = enumS > 0 ? patterns.length / enumS : 0
  console.log(`${String(N).padStart(4)} ${String(M).padStart(4)} ${String(patterns.length).padStart(9)} ${String(visited).padStart(14)} ${enumS.toFixed(2).padStart(14)} ${rate.toFixed(0).padStart(18)} ${classifyMs.toFixed(1).padStart(20)} ${total.toFixed(2).padStart(16)}`)
}
const [t2, t3, t4] = times.slice(1)
const r3 = t3! / t2!, r4 = t4! / t3!
const r5 = r4 * (r4 / r3), t5 = t4! * r5
console.log(`growth of the census time: T(3)/T(2) = ${r3.toFixed(1)}, T(4)/T(3) = ${r4.toFixed(1)}; extrapolated T(5)/T(4) = ${r5.toFixed(0)}, T(5) ≈ ${t5.toFixed(0)} s`)
const lastN = t5 <= TARGET_S ? 5 : 4
console.log(`largest N (M = 4N) whose census finishes in ${TARGET_S / 60} min on one of 2 cores: N = ${lastN} (target: N ≥ 4, ${lastN >= 4 ? 'met' : 'MISSED'})`)
