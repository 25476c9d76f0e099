/**
 * `npx tsx bench/conditions.ts`: cost of the published-condition checks inside `analyzePattern`
 * (level structure of vertical balance on cuts, ordinary towers, straight-drawing test, plane
 * rigidity with free wings) on supercells of the demo net "square-pair" (torus) and on square
 * grids of lines in the plane. Each figure is the median of 5 runs, printed beside its target;
 * nothing is asserted. Target: each check ≤ 10 % of the whole analysis, the analysis of a
 * 200-tower pattern ≤ 500 ms (the workbench re-analyses while dragging).
 * Second table: the straight-drawing check (grid search, segment-grid.ts) at every size up to
 * 10 000 towers, target ≤ 500 ms at 10 000 towers, about linear growth; third table: the whole
 * existence checklist (`analyzePattern`) as the run page's point checklist computes it, target
 * ≤ 100 ms per point (the limit of towers above which the page leaves it to the workbench).
 * Measured 2026-12-02 on the shared 2-core machine at load average ≈ 20 (so figures vary up to
 * ~10× between runs): straight drawing 25 / 160 / 409 ms for 400 / 4 000 / 20 000 torus segments
 * (200 / 2 000 / 10 000 towers), 9 / 591 ms for the 30×30 / 100×100 plane grids (before: skipped
 * above 400 edges; the pairwise search grew as E²). Checklist: torus 9–93 ms at 60 towers,
 * 240–410 ms at 120, 45–170 ms at 200, 43–192 ms at 400; plane 179–272 ms at 64, 766–1435 ms at
 * 144 (dense plane rigidity, 567 ms at 100). So the run page computes the checklist up to 400
 * towers in the torus and keeps 60 in the plane.
 */
import { performance } from 'node:perf_hooks'
import { findPatternExample } from '../shared/examples'
import { analyzePattern } from '../shared/pattern/analyze'
import { edgeLengths } from '../shared/pattern/geometry'
import { compilePattern } from '../shared/pattern/model'
import { analyzePlaneRigidity } from '../shared/pattern/plane-rigidity'
import { checkStraightDrawing } from '../shared/pattern/straight-drawing'
import { supercell } from '../shared/pattern/supercell'
import { classifyVertices } from '../shared/pattern/vertex-towers'
import { levelStructure } from '../shared/pattern/vertical-levels'
import { parsePatternDocument, type PatternDocument } from '../shared/types/pattern'

function median(f: () => void, n = 5): number {
  const t: number[] = []
  for (let i = 0; i < n; i++) { const a = performance.now(); f(); t.push(performance.now() - a) }
  return t.sort((x, y) => x - y)[Math.floor(n / 2)]!
}

/** k × k square grid of lines in the plane: k² towers, wings on the border. */
function planeGrid(k: number): PatternDocument {
  const id = (i: number, j: number) => `v${i}-${j}`
  const vertices = [], edges = [], wings = []
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      vertices.push({ id: id(i, j), position: [i, j] as [number, number] })
      if (i + 1 < k) edges.push({ id: `h${i}-${j}`, from: id(i, j), to: id(i + 1, j) })
      if (j + 1 < k) edges.push({ id: `u${i}-${j}`, from: id(i, j), to: id(i, j + 1) })
      if (i === 0) wings.push({ id: `w${i}-${j}`, vertex: id(i, j), direction: [-1, 0] as [number, number] })
      if (i === k - 1) wings.push({ id: `e${i}-${j}`, vertex: id(i, j), direction: [1, 0] as [number, number] })
      if (j === 0) wings.push({ id: `s${i}-${j}`, vertex: id(i, j), direction: [0, -1] as [number, number] })
      if (j === k - 1) wings.push({ id: `n${i}-${j}`, vertex: id(i, j), direction: [0, 1] as [number, number] })
    }
  }
  return parsePatternDocument({ format: 'wingfold-pattern', version: 1, name: `grid ${k}`, space: 'plane', vertices, edges, wings })
}

const base = findPatternExample('square-pair')!.document
const cases: [string, PatternDocument][] = [
  ['torus V = 200 (square-pair 10×10)', supercell(base, 10, 10)],
  ['torus V = 800 (square-pair 20×20)', supercell(base, 20, 20)],
  ['plane V = 100 (10×10 grid)', planeGrid(10)],
  ['plane V = 196 (14×14 grid)', planeGrid(14)],
]
console.log('case'.padEnd(36), 'analysis ms', 'levels ms', 'ordinary ms', 'drawing ms', 'plane rigidity ms')
for (const [name, doc] of cases) {
  const m = compilePattern(doc)
  const all = median(() => analyzePattern(doc), 3)
  const lv = median(() => levelStructure(m, edgeLengths(m, m.positions, m.lattice)))
  const ord = median(() => classifyVertices(m))
  const dr = median(() => checkStraightDrawing(m))
  const pr = m.space === 'plane' ? median(() => analyzePlaneRigidity(m), 3).toFixed(1) : '—'
  console.log(name.padEnd(36), all.toFixed(1).padStart(11), lv.toFixed(2).padStart(9), ord.toFixed(2).padStart(11), dr.toFixed(1).padStart(10), pr.padStart(17))
}
console.log('targets: each check ≤ 10 % of the analysis; analysis of ~200 towers ≤ 500 ms')

console.log()
console.log('straight drawing'.padEnd(36), 'towers', 'segments', 'check ms', 'ms per 1000 segments')
const drawingCases: [string, PatternDocument][] = [
  ['torus square-pair 10×10', supercell(base, 10, 10)],
  ['torus square-pair 25×40', supercell(base, 25, 40)],
  ['torus square-pair 50×100', supercell(base, 50, 100)],
  ['plane 30×30 grid', planeGrid(30)],
  ['plane 100×100 grid', planeGrid(100)],
]
for (const [name, doc] of drawingCases) {
  const m = compilePattern(doc)
  const segs = m.nEdges + (m.space === 'plane' ? m.nWings : 0)
  const t = median(() => checkStraightDrawing(m), 3)
  console.log(name.padEnd(36), String(m.nVertices).padStart(6), String(segs).padStart(8), t.toFixed(1).padStart(8), (1000 * t / segs).toFixed(2).padStart(20))
}
console.log('target: ≤ 500 ms at 10 000 towers, ms per 1000 segments about constant')

console.log()
console.log('existence checklist (analyzePattern)'.padEnd(36), 'towers', 'ms')
for (const [name, doc] of [
  ['torus square-pair 5×6', supercell(base, 5, 6)],
  ['torus square-pair 6×10', supercell(base, 6, 10)],
  ['torus square-pair 10×10', supercell(base, 10, 10)],
  ['torus square-pair 10×20', supercell(base, 10, 20)],
  ['plane 8×8 grid', planeGrid(8)],
  ['plane 12×12 grid', planeGrid(12)],
] as [string, PatternDocument][]) {
  console.log(name.padEnd(36), String(doc.vertices.length).padStart(6), median(() => analyzePattern(doc), 3).toFixed(1).padStart(8))
}
console.log('target: ≤ 100 ms per point for the run page (PointChecklist, WallDetails)')
