/**
 * `npx tsx bench/conditions.ts`: cost of the published-condition checks inside `analyzePattern`
 * (level structure of vertical balance on cuts, ordinary towers, straight-drawing test, plane
 * rigidity with free wings) on supercells of the demo net "square-pair" (torus) and on square
 * grids of lines in the plane. Each figure is the median of 5 runs, printed beside its target;
 * nothing is asserted. Target: each check ≤ 10 % of the whole analysis, the analysis of a
 * 200-tower pattern ≤ 500 ms (the workbench re-analyses while dragging).
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
