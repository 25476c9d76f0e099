/** Builders and numeric helpers for the pattern tests. */
import { parsePatternDocument, type PatternDocument } from '../../../shared/types/pattern'
import { compilePattern, type PatternModel } from '../../../shared/pattern/model'
import { tripletsToDense } from '../../../shared/linalg/dense'
import type { Triplets } from '../../../shared/linalg/triplets'

export { seeded } from '../linalg/random'

type Shift = [number, number]

/** A torus document from compact data: positions by id, edges as [from, to, shift]. */
export function torusDoc(
  w1: Shift, w2: Shift, positions: Record<string, [number, number]>,
  edges: [string, string, Shift][], extra: Partial<PatternDocument> = {},
): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: 'test', space: 'torus',
    lattice: { w1, w2 },
    vertices: Object.entries(positions).map(([id, position]) => ({ id, position })),
    edges: edges.map(([from, to, shift], i) => ({ id: `e${i}`, from, to, shift })),
    ...extra,
  })
}

/** Compiled torus model (see torusDoc). */
export function torusModel(...args: Parameters<typeof torusDoc>): PatternModel {
  return compilePattern(torusDoc(...args))
}

/** Central finite-difference Jacobian of f: Rⁿ → Rᵐ at x (dense, row-major m × n). */
export function finiteDifference(
  f: (x: Float64Array) => Float64Array, x: Float64Array, h = 1e-6,
): number[][] {
  const f0 = f(x)
  const out = Array.from({ length: f0.length }, () => new Array<number>(x.length).fill(0))
  for (let j = 0; j < x.length; j++) {
    const xp = Float64Array.from(x), xm = Float64Array.from(x)
    xp[j]! += h; xm[j]! -= h
    const fp = f(xp), fm = f(xm)
    for (let i = 0; i < f0.length; i++) out[i]![j] = (fp[i]! - fm[i]!) / (2 * h)
  }
  return out
}

/** max |a − b| over two dense matrices of equal shape. */
export function maxAbsDiff(a: number[][], b: number[][]): number {
  let d = 0
  a.forEach((row, i) => row.forEach((x, j) => { d = Math.max(d, Math.abs(x - b[i]![j]!)) }))
  return d
}

/** Dense rows of triplets. */
export function dense(t: Triplets): number[][] {
  return tripletsToDense(t).to2DArray()
}

/** Row-major flat array as rows. */
export function rows(flat: Float64Array, nCols: number): number[][] {
  const out: number[][] = []
  for (let i = 0; i < flat.length / nCols; i++) out.push(Array.from(flat.subarray(i * nCols, (i + 1) * nCols)))
  return out
}

/** Logs one outside check with its deviation so the run shows the measured numbers. */
export function reportDeviation(check: string, source: string, deviation: number): void {
  console.info(`[outside-check] ${check} | ${source} | deviation ${deviation.toExponential(2)}`)
}

/** A ring of n vertices r0..r(n−1) on the x axis of the unit square torus, every edge of length 1/n (the wrap edge shifted by ω1). */
export function ringModel(n: number): PatternModel {
  const positions: Record<string, [number, number]> = {}
  const edges: [string, string, Shift][] = []
  for (let i = 0; i < n; i++) {
    positions[`r${i}`] = [i / n, 0]
    edges.push([`r${i}`, `r${(i + 1) % n}`, [i === n - 1 ? 1 : 0, 0]])
  }
  return torusModel([1, 0], [0, 1], positions, edges)
}
