/**
 * Outside checks on the combinatorics:
 * - K7 embeds in the torus as a triangulation with 14 faces (Heawood; G. Ringel, Map Color
 *   Theorem, 1974); Euler's formula V − E + F = 2 − 2g for rotation systems (B. Mohar,
 *   C. Thomassen, Graphs on Surfaces, 2001).
 * - Cut space dimension V − c, cycle space dimension E − V + c, orthogonal complements
 *   (R. Diestel, Graph Theory, §1.9), on seeded random multigraphs; ranks from ml-matrix's SVD.
 * - ker div / im curlᵀ has dimension 2g on a cellular embedding (B. Mohar, C. Thomassen, Graphs on
 *   Surfaces, 2001).
 */
import { describe, expect, it } from 'vitest'
import { Matrix, SingularValueDecomposition } from 'ml-matrix'
import { computeComponents, computeFaces, computeTopology } from '../../../shared/pattern/combinatorics'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { compilePattern } from '../../../shared/pattern/model'
import { curlMatrix, cutSpaceBasis, cycleSpaceBasis, divMatrix, gradientMatrix, spanningForest } from '../../../shared/pattern/operators'
import { PATTERN_EXAMPLES } from '../../../shared/examples'
import { dense, reportDeviation, seeded, torusDoc, torusModel } from './helpers'

const rank = (rowsOrEmpty: number[][], nCols: number) =>
  rowsOrEmpty.length === 0 || nCols === 0 ? 0 : new SingularValueDecomposition(new Matrix(rowsOrEmpty), { autoTranspose: true }).rank

/**
 * K7 drawn in the torus C / Λ with Λ the kernel of a + bω ↦ a + 2b (mod 7), ω = e^{2πi/3}:
 * vertex i at i, edges from i in the directions 1, ω, 1 + ω (to i + 1, i + 2, i + 3 mod 7),
 * the triangular lattice folded onto seven points. Basis of Λ: 7 and −2 + ω.
 */
function k7Document() {
  const s3 = Math.sqrt(3) / 2
  const positions: Record<string, [number, number]> = {}
  for (let i = 0; i < 7; i++) positions[`k${i}`] = [i, 0]
  const edges: [string, string, [number, number]][] = []
  for (let i = 0; i < 7; i++) {
    for (const [da, db] of [[1, 0], [0, 1], [1, 1]] as const) {
      const j = (i + da + 2 * db) % 7
      // T in (a, b) coordinates = (i + da − j, db) = m·(7, 0) + n·(−2, 1)
      const n = db, m = (i + da - j + 2 * n) / 7
      edges.push([`k${i}`, `k${j}`, [m, n]])
    }
  }
  return torusDoc([7, 0], [-2.5, s3], positions, edges)
}

describe('K7 in the torus', () => {
  it('is a triangulation with 14 faces, χ = 0, genus 1; balanced; the drawing covers the torus once', () => {
    const doc = k7Document()
    const m = compilePattern(doc)
    const faces = computeFaces(m)
    const topo = computeTopology(m, faces, computeComponents(m))
    expect([topo.vertices, topo.closedEdges]).toEqual([7, 21])
    expect(topo.faces).toBe(14) // Heawood; Ringel 1974
    expect(faces.cycles.every(c => c.length === 3)).toBe(true)
    expect(topo.eulerCharacteristic).toBe(0)
    expect(topo.embeddingGenus).toBe(1)
    const report = analyzePattern(doc)
    expect(report.verdicts.faceClosure.ok).toBe(true)
    expect(report.verdicts.faceClosure.latticeIndex).toBe(1)
    expect(report.verdicts.balance.residualNorm).toBeLessThan(1e-12)
    expect(report.verdicts.degrees.degrees).toEqual(new Array(7).fill(6))
    reportDeviation('K7 torus triangulation: |faces − 14|', 'Heawood; Ringel, Map Color Theorem, 1974', Math.abs(topo.faces - 14))
  })

  it('has homology ker div / im curlᵀ of dimension 2g = 2', () => {
    const m = compilePattern(k7Document())
    const faces = computeFaces(m)
    const kerDiv = m.nEdges - rank(dense(divMatrix(m)), m.nEdges)
    const imCurlT = rank(dense(curlMatrix(m, faces)), m.nEdges)
    expect(kerDiv - imCurlT).toBe(2)
    // div ∘ curlᵀ = 0
    const product = new Matrix(dense(divMatrix(m))).mmul(new Matrix(dense(curlMatrix(m, faces))).transpose())
    expect(Math.max(...product.to1DArray().map(Math.abs))).toBe(0)
  })
})

describe('homology dimension 2g on the example patterns', () => {
  for (const ex of PATTERN_EXAMPLES) {
    it(`${ex.slug}: dim ker div − rank curl = 2 × embedding genus`, () => {
      const m = compilePattern(ex.document)
      const faces = computeFaces(m)
      const topo = computeTopology(m, faces, computeComponents(m))
      const kerDiv = m.nEdges - rank(dense(divMatrix(m)), m.nEdges)
      const imCurlT = rank(dense(curlMatrix(m, faces)), m.nEdges)
      expect(kerDiv - imCurlT).toBe(2 * topo.embeddingGenus)
    })
  }
})

describe('cut and cycle spaces on seeded random multigraphs (Diestel §1.9)', () => {
  for (let seed = 1; seed <= 12; seed++) {
    it(`dimensions V − c and E − V + c, orthogonality, independence (seed ${seed})`, () => {
      const rnd = seeded(seed)
      const V = 2 + Math.floor(rnd() * 10), E = Math.floor(rnd() * 20)
      const positions: Record<string, [number, number]> = {}
      for (let v = 0; v < V; v++) positions[`v${v}`] = [rnd(), rnd()]
      const edges: [string, string, [number, number]][] = []
      for (let e = 0; e < E; e++) {
        const a = Math.floor(rnd() * V), b = Math.floor(rnd() * V)
        edges.push([`v${a}`, `v${b}`, a === b ? [1, 0] : [0, 0]]) // loops need a shift
      }
      const m = torusModel([1, 0], [0, 1], positions, edges)
      const comps = computeComponents(m)
      const forest = spanningForest(m)
      const cuts = cutSpaceBasis(m, forest)
      const cycles = cycleSpaceBasis(m, forest)
      const c = comps.count
      expect(cuts.length).toBe(V - c)
      expect(cycles.length).toBe(E - V + c)
      // independent (ml-matrix SVD rank) and spanning complementary dimensions of R^E
      expect(rank(cuts, E)).toBe(V - c)
      expect(rank(cycles, E)).toBe(E - V + c)
      expect(rank([...cuts, ...cycles], E)).toBe(E)
      // cycles lie in ker div; cut space = im d; the two are orthogonal
      const div = dense(divMatrix(m))
      for (const z of cycles) for (const row of div) expect(row.reduce((s, x, e) => s + x * z[e]!, 0)).toBe(0)
      let maxDot = 0
      for (const z of cycles) for (const k of cuts) maxDot = Math.max(maxDot, Math.abs(z.reduce((s, x, e) => s + x * k[e]!, 0)))
      expect(maxDot).toBe(0)
      const grad = dense(gradientMatrix(m))
      expect(rank([...cuts, ...(grad[0] ? grad[0]!.map((_, v) => grad.map(r => r[v]!)) : [])], E)).toBe(V - c)
      // ml-matrix reference: dim ker div = E − rank(div)
      expect(E - rank(div, E)).toBe(E - V + c)
      reportDeviation(`Diestel §1.9 seed ${seed}: max |⟨cycle, cut⟩|`, 'Diestel, Graph Theory, §1.9', maxDot)
    })
  }
})
