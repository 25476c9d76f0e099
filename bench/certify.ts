/**
 * `npx tsx bench/certify.ts` (also the last section of `npm run bench`): time of one interval
 * certificate by size. Horizontal: m×m supercells of the demo net "six-wing-lattice" (rigid for
 * every m, n = 2V − 2 positions). Phase: twisted rings of n vertices with winding 1 (D. A. Wiley,
 * S. H. Strogatz, M. Girvan, Chaos 16, 2006), n − 1 phases. The target is one certificate in
 * under 10 s; DEFAULT_CERTIFY_OPTIONS.maxSize is set from these figures (dense C = J̃⁻¹ costs n²
 * memory and n sparse solves, the product C·J̃ n·nnz, each radius tried n² + nnz).
 */
import { performance } from 'node:perf_hooks'
import { certifyHorizontal, certifyPhases } from '../shared/certify/pattern'
import { DEFAULT_CERTIFY_OPTIONS } from '../shared/certify/krawczyk'
import { findPatternExample } from '../shared/examples'
import { compilePattern } from '../shared/pattern/model'
import { supercell } from '../shared/pattern/supercell'
import { parsePatternDocument } from '../shared/types/pattern'

const quick = process.argv.includes('--quick')
const big = { maxSize: 1e7 }

function ringModel(n: number) {
  const doc = parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: `ring ${n}`, space: 'torus', lattice: { w1: [1, 0], w2: [0, 1] },
    vertices: Array.from({ length: n }, (_, i) => ({ id: `r${i}`, position: [i / n, 0] })),
    edges: Array.from({ length: n }, (_, i) => ({ id: `e${i}`, from: `r${i}`, to: `r${(i + 1) % n}`, shift: [i === n - 1 ? 1 : 0, 0] })),
  })
  return compilePattern(doc)
}

const row = (kind: string, n: number, ms: number, detail: string) =>
  console.log(`${kind.padEnd(11)} ${String(n).padStart(6)} ${(ms / 1000).toFixed(2).padStart(9)} s   ${ms < 10_000 ? 'met   ' : 'MISSED'}  ${detail}`)

console.log('\ninterval certificate (Krawczyk / radii polynomial), one certificate per size (target < 10 s each)')
console.log(`system        n     time      target  result            (maxSize now ${DEFAULT_CERTIFY_OPTIONS.maxSize})`)
const cell = findPatternExample('six-wing-lattice')!.document
for (const m of quick ? [6, 12] : [6, 12, 18, 24, 28, 32]) {
  const model = compilePattern(supercell(cell, m, m))
  const t0 = performance.now()
  const c = certifyHorizontal(model, model.positions, model.lattice, big)
  row('horizontal', c.size, performance.now() - t0, c.certified ? `certified, rMin ${c.rMin.toExponential(1)}, rMax ${c.rMax.toExponential(1)}` : `not certified: ${c.reason}`)
}
for (const n of quick ? [200, 800] : [200, 800, 1200, 1600, 2000]) {
  const model = ringModel(n)
  const psi = Float64Array.from({ length: n }, (_, i) => (2 * Math.PI * i) / n)
  const t0 = performance.now()
  const c = certifyPhases(model, psi, [0, 0], model.weight, big)
  row('phase ring', c.size, performance.now() - t0, c.certified ? `certified, rMin ${c.rMin.toExponential(1)}, rMax ${c.rMax.toExponential(1)}` : `not certified: ${c.reason}`)
}
