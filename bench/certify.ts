/**
 * `npx tsx bench/certify.ts` (also the last section of `npm run bench`): time of one interval
 * certificate by size. Horizontal: m×m supercells of the demo net "six-wing-lattice" (rigid for
 * every m, n = 2V − 2 positions). Phase: twisted rings of n vertices with winding 1 (D. A. Wiley,
 * S. H. Strogatz, M. Girvan, Chaos 16, 2006), n − 1 phases. Plane: arrangements of k seeded
 * random lines in general position (each crossing a four-wing tower, the line's two ends open
 * wings; balanced by construction, rigid by H. Chen, Comm. Anal. Geom. 32, 2024, Prop. 1: no
 * parallel closed edges, every tower ordinary; directions spread over [0, π) with jitter), n = 2V + 1 unknowns of the square reduction of
 * shared/certify/plane.ts (its pivoted Gram–Schmidt is dense, O(n³)). The target is one certificate in
 * under 10 s; DEFAULT_CERTIFY_OPTIONS.maxSize is set from these figures (dense C = J̃⁻¹ costs n²
 * memory and n sparse solves, the product C·J̃ n·nnz, each radius tried n² + nnz).
 */
import { performance } from 'node:perf_hooks'
import { certifyHorizontal, certifyPhases, PLANE_MAX_SIZE } from '../shared/certify/pattern'
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

/** k lines through seeded random points with seeded random directions, cut at their crossings. */
function lineArrangement(k: number) {
  let seed = 12345
  const rnd = () => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648 }
  // directions spread over [0, π) with jitter: no two lines nearly parallel, crossings stay near
  const lines = Array.from({ length: k }, (_, i) => {
    const a = Math.PI * (i + 0.2 + 0.6 * rnd()) / k
    return { p: [rnd() - 0.5, rnd() - 0.5], d: [Math.cos(a), Math.sin(a)] }
  })
  const vertices: { id: string, position: [number, number] }[] = []
  const onLine: { t: number, id: string }[][] = lines.map(() => [])
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const A = lines[i]!, B = lines[j]!
      const det = A.d[0]! * -B.d[1]! + B.d[0]! * A.d[1]!
      const rx = B.p[0]! - A.p[0]!, ry = B.p[1]! - A.p[1]!
      const t = (rx * -B.d[1]! + B.d[0]! * ry) / det, u = (A.d[0]! * ry - A.d[1]! * rx) / det
      const id = `v${i}_${j}`
      vertices.push({ id, position: [A.p[0]! + t * A.d[0]!, A.p[1]! + t * A.d[1]!] })
      onLine[i]!.push({ t, id }); onLine[j]!.push({ t: u, id })
    }
  }
  const edges: { id: string, from: string, to: string }[] = []
  const wings: { id: string, vertex: string, direction: [number, number] }[] = []
  onLine.forEach((pts, i) => {
    pts.sort((x, y) => x.t - y.t)
    const d = lines[i]!.d as [number, number]
    for (let q = 0; q + 1 < pts.length; q++) edges.push({ id: `l${i}_${q}`, from: pts[q]!.id, to: pts[q + 1]!.id })
    wings.push({ id: `w${i}a`, vertex: pts[0]!.id, direction: [-d[0], -d[1]] }, { id: `w${i}b`, vertex: pts.at(-1)!.id, direction: d })
  })
  return compilePattern(parsePatternDocument({ format: 'wingfold-pattern', version: 1, name: `${k} lines`, space: 'plane', vertices, edges, wings }))
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
console.log(`plane certificates: size limit now ${PLANE_MAX_SIZE} unknowns (dense column choice, O(n³))`)
for (const k of quick ? [8, 16] : [8, 16, 20, 24]) {
  const model = lineArrangement(k)
  const t0 = performance.now()
  const c = certifyHorizontal(model, model.positions, model.lattice, big)
  row('plane', c.size, performance.now() - t0, c.certified ? `certified, rMin ${c.rMin.toExponential(1)}, rMax ${c.rMax.toExponential(1)}` : `not certified: ${c.reason}`)
}
