/**
 * Surface section of `npm run bench` (alone: `npx tsx bench/surface.ts`): mesh size against time
 * for the schematic (shared/surface/schematic.ts) and for the relaxation (shared/surface/relax.ts,
 * one normal Pinkall–Polthier step: cotangents, one sparse LDLᵀ of V unknowns, normals, curvature),
 * on two demo torus patterns at 12, 24 and 48 rows per period. Targets printed beside the figures;
 * nothing is asserted.
 */
import { performance } from 'node:perf_hooks'
import { findPatternExample } from '../shared/examples'
import { relaxSteps } from '../shared/surface/relax'
import { buildSchematic } from '../shared/surface/schematic'

const best = (reps: number, f: () => void) => {
  let t = Infinity
  for (let i = 0; i < reps; i++) { const t0 = performance.now(); f(); t = Math.min(t, performance.now() - t0) }
  return t
}
const f = (x: number, w = 10) => x.toFixed(x < 10 ? 1 : 0).padStart(w)

console.log('\nSurface: schematic build (best of 3) and relaxation steps (median of the steps run, at most 6)')
console.log('pattern             rows   vertices  triangles  schematic ms  (target ≤ 250 at ≤ 20k triangles)  step ms  (target ≤ 1500 at ≤ 20k)  steps  relax ms')
const rowsList = [12, 24, 48]
const growth: Record<string, [number, number][]> = {}
for (const slug of ['square-pair', 'six-wing-lattice']) {
  const doc = findPatternExample(slug)!.document
  for (const rows of rowsList) {
    const settings = { rows, radial: Math.max(3, rows / 4) }
    let s = buildSchematic(doc, settings)
    const tBuild = best(3, () => { s = buildSchematic(doc, settings) })
    const times: number[] = []
    const gen = relaxSteps(s.mesh, { maxIterations: 6 })
    const t0 = performance.now()
    let last = performance.now()
    for (let r = gen.next(); ; r = gen.next()) {
      const now = performance.now(); times.push(now - last); last = now
      if (r.done) break
    }
    const total = performance.now() - t0
    times.sort((a, b) => a - b)
    const step = times[Math.floor(times.length / 2)]!
    const { vertices, faces } = s.topology
    ;(growth[slug] ??= []).push([vertices, step])
    const small = faces <= 20_000
    console.log(`${slug.padEnd(18)} ${String(rows).padStart(5)} ${String(vertices).padStart(10)} ${String(faces).padStart(10)} ${f(tBuild, 13)}  ${small ? (tBuild <= 250 ? 'met   ' : 'MISSED') : '—     '}${' '.repeat(30)}${f(step, 8)}  ${small ? (step <= 1500 ? 'met   ' : 'MISSED') : '—     '}${' '.repeat(19)}${String(times.length).padStart(5)} ${f(total, 9)}`)
  }
}
for (const [slug, g] of Object.entries(growth)) {
  const e = Math.log(g[g.length - 1]![1] / g[0]![1]) / Math.log(g[g.length - 1]![0] / g[0]![0])
  console.log(`growth exponent of the relaxation step time, ${slug}, V = ${g[0]![0]} → ${g[g.length - 1]![0]}: ${e.toFixed(2)}  (target ≤ 1.3: ${e <= 1.3 ? 'met' : 'MISSED'})`)
}
