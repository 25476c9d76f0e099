/**
 * Surface section of `npm run bench` (alone: `npx tsx bench/surface.ts`): mesh size against time
 * for the schematic (shared/surface/schematic.ts) and for the relaxation (shared/surface/relax.ts,
 * one normal Pinkall–Polthier step: cotangents, one sparse LDLᵀ of V unknowns, normals, curvature),
 * on two demo torus patterns at 12, 24 and 48 rows per period; then the outcome of a default
 * relaxation of every demo torus pattern (start and kept |H|·L). Targets printed beside the figures;
 * nothing is asserted.
 */
import { performance } from 'node:perf_hooks'
import { findPatternExample, PATTERN_EXAMPLES } from '../shared/examples'
import { analyzePattern } from '../shared/pattern/analyze'
import { meanCurvature } from '../shared/surface/curvature'
import { relaxMesh, relaxSteps } from '../shared/surface/relax'
import { buildSchematic } from '../shared/surface/schematic'

const best = (reps: number, f: () => void) => {
  let t = Infinity
  for (let i = 0; i < reps; i++) { const t0 = performance.now(); f(); t = Math.min(t, performance.now() - t0) }
  return t
}
const f = (x: number, w = 10) => x.toFixed(x < 10 ? 1 : 0).padStart(w)

console.log('\nSurface: schematic build (first: with the towers\' Weierstrass points solved; best of 3: their cache reused) and relaxation steps (median of the steps run, at most 6)')
console.log('pattern             rows   vertices  triangles  first build ms  schematic ms  (target ≤ 250 at ≤ 20k triangles)  step ms  (target ≤ 1500 at ≤ 20k)  steps  relax ms')
const rowsList = [12, 24, 48]
const growth: Record<string, [number, number][]> = {}
for (const slug of ['square-pair', 'six-wing-lattice']) {
  const doc = findPatternExample(slug)!.document
  for (const rows of rowsList) {
    const settings = { rows, radial: Math.max(3, rows / 4) }
    const tc0 = performance.now()
    let s = buildSchematic(doc, settings)
    const tCold = performance.now() - tc0
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
    console.log(`${slug.padEnd(18)} ${String(rows).padStart(5)} ${String(vertices).padStart(10)} ${String(faces).padStart(10)} ${f(tCold, 15)} ${f(tBuild, 13)}  ${small ? (tBuild <= 250 ? 'met   ' : 'MISSED') : '—     '}${' '.repeat(30)}${f(step, 8)}  ${small ? (step <= 1500 ? 'met   ' : 'MISSED') : '—     '}${' '.repeat(19)}${String(times.length).padStart(5)} ${f(total, 9)}`)
  }
}
for (const [slug, g] of Object.entries(growth)) {
  const e = Math.log(g[g.length - 1]![1] / g[0]![1]) / Math.log(g[g.length - 1]![0] / g[0]![0])
  console.log(`growth exponent of the relaxation step time, ${slug}, V = ${g[0]![0]} → ${g[g.length - 1]![0]}: ${e.toFixed(2)}  (target ≤ 1.3: ${e <= 1.3 ? 'met' : 'MISSED'})`)
}

// Relaxation outcome with the worker's default settings on every demo torus pattern that passes
// its checks: the start (schematic) and the step kept, against the convergence target.
console.log('\nSurface: relaxation outcome with the default settings (rows 24, at most 40 steps)')
console.log('pattern             start max |H|·L  start mean   kept step  max |H|·L  mean |H|·L  (target max < 2e-3)  stopped because')
for (const ex of PATTERN_EXAMPLES.filter(e => e.document.space === 'torus' && analyzePattern(e.document).summary.ok)) {
  const s = buildSchematic(ex.document, {})
  const h0 = meanCurvature(s.mesh)
  const r = relaxMesh(s.mesh, {})
  console.log(`${ex.slug.padEnd(18)} ${h0.max.toExponential(2).padStart(16)} ${h0.mean.toExponential(2).padStart(11)} ${String(r.kept).padStart(11)} ${r.maxH.toExponential(2).padStart(10)} ${r.meanH.toExponential(2).padStart(11)}  ${r.converged ? 'met   ' : 'MISSED'}${' '.repeat(15)}${r.converged ? 'converged' : r.reason}`)
}
