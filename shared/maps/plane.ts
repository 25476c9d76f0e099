/**
 * The two map planes as one-parameter problems for the continuation engine. A row holds y fixed
 * and continues in λ = x; the spine column holds x fixed and continues in λ = y.
 * τ plane: ω1 = s·d (d the document's ω1 direction), ω2 = ω1·τ, with the scale s = |ω1⁰| or
 * s = √(A⁰ / Im τ) (cell area A = s² Im τ kept at the document's A⁰); balance B is
 * 0-homogeneous in the scale, so the scale only sets the size of the drawing.
 * (α1, α2) plane: the phase problem of shared/families with α = (x, y).
 */
import type { ContinuationPoint, ContinuationProblem } from '../continuation/types'
import type { LatticePath } from '../families/lattice-paths'
import { latticeTau } from '../families/lattice-paths'
import { phaseProblem, type PhasePath } from '../families/phase'
import { torusLatticeProblem } from '../families/torus'
import { solveBalance } from '../pattern/balance-solve'
import type { Lattice, PatternModel } from '../pattern/model'
import { solvePhases } from '../pattern/phase-solve'
import type { MapCell, MapSettings } from '../types/maps'

/** Numbers a solved cell records, from an engine point. */
export type CellValues = Pick<MapCell, 'sigmaMin' | 'negativeEigenvalues' | 'minEdgeRatio' | 'lengthPerRootArea' | 'minCos'>

/** A one-parameter slice of the plane. */
export interface PlaneSlice {
  problem: ContinuationProblem
  values(p: ContinuationPoint): CellValues
}

/** A map plane bound to one pattern. */
export interface MapPlaneModel {
  /** Row y fixed, λ = x. */
  row(y: number): PlaneSlice
  /** Column x fixed, λ = y. */
  column(x: number): PlaneSlice
  /** The document's own (x, y). */
  documentPoint: [number, number]
  /** A balanced state at (x, y) from the document state (the one solve from scratch: the seed). */
  seedState(x: number, y: number): { converged: boolean; u: Float64Array; reason?: string }
  /** Lattice at τ = (x, y) (τ plane only). */
  latticeAt?(x: number, y: number): Lattice
}

/** Lattice of the τ plane at (Re τ, Im τ) with the scale rule of the settings, and d/d(Re τ), d/d(Im τ). */
export function tauLattice(l0: Lattice, scaleBy: MapSettings['scaleBy']) {
  const r0 = Math.hypot(...l0.w1)
  const d: [number, number] = [l0.w1[0] / r0, l0.w1[1] / r0]
  const area0 = l0.w1[0] * l0.w2[1] - l0.w1[1] * l0.w2[0]
  const scale = (b: number) => scaleBy === 'w1' ? r0 : Math.sqrt(area0 / b)
  const dScale = (b: number) => scaleBy === 'w1' ? 0 : -0.5 * Math.sqrt(area0 / b) / b
  /** ω = (s d, s d τ) and its derivatives along Re τ and Im τ, as (ω1x, ω1y, ω2x, ω2y). */
  return (a: number, b: number) => {
    const s = scale(b), ds = dScale(b)
    const dt: [number, number] = [d[0] * a - d[1] * b, d[0] * b + d[1] * a]
    const lattice: Lattice = { w1: [s * d[0], s * d[1]], w2: [s * dt[0], s * dt[1]] }
    const dRe = Float64Array.of(0, 0, s * d[0], s * d[1])
    const dIm = Float64Array.of(ds * d[0], ds * d[1], ds * dt[0] - s * d[1], ds * dt[1] + s * d[0])
    return { lattice, dRe, dIm }
  }
}

function tauPlane(m: PatternModel, s: MapSettings): MapPlaneModel {
  const at = tauLattice(m.lattice, s.scaleBy)
  const ev = { collapseTolerance: s.collapseTolerance, orderFlip: s.orderFlip, terminal: true }
  const slice = (path: LatticePath): PlaneSlice => {
    const { problem } = torusLatticeProblem(m, path, ev)
    return { problem, values: drawingValues }
  }
  return {
    row: y => slice({ lambda0: 0, at: x => { const r = at(x, y); return { lattice: r.lattice, derivative: r.dRe } } }),
    column: x => slice({ lambda0: 0, at: y => { const r = at(x, y); return { lattice: r.lattice, derivative: r.dIm } } }),
    documentPoint: latticeTau(m.lattice),
    seedState(x, y) {
      const r = solveBalance(m, m.positions, at(x, y).lattice)
      return { converged: r.converged, u: r.positions.slice(2), ...(r.reason ? { reason: r.reason } : {}) }
    },
    latticeAt: (x, y) => at(x, y).lattice,
  }
}

function drawingValues(p: ContinuationPoint): CellValues {
  const d = p.diagnostics ?? {}
  const v: CellValues = {
    minEdgeRatio: d.minEdgeRatio,
    lengthPerRootArea: d.totalLength !== undefined && d.area !== undefined ? d.totalLength / Math.sqrt(Math.abs(d.area)) : undefined,
  }
  // the torus problems monitor the rigidity verdict's margin (already dimensionless)
  if (p.sigmaMin !== undefined) v.sigmaMin = p.sigmaMin
  if (p.tests.negativeEigenvalues !== undefined) v.negativeEigenvalues = p.tests.negativeEigenvalues
  return v
}

function alphaPlane(m: PatternModel): MapPlaneModel {
  const K = m.weight
  const zero = new Float64Array(m.nEdges)
  const slice = (alpha: (l: number) => [number, number], dAlpha: [number, number]): PlaneSlice => {
    const path: PhasePath = { lambda0: 0, alpha, dAlpha, weights: () => K, dWeights: zero }
    const { problem } = phaseProblem(m, path)
    return {
      problem,
      values: (p) => {
        const v: CellValues = { minCos: p.diagnostics?.minCos }
        if (p.sigmaMin !== undefined) v.sigmaMin = p.sigmaMin // phase problems monitor σ_min/K̄ already
        if (p.tests.negativeEigenvalues !== undefined) v.negativeEigenvalues = p.tests.negativeEigenvalues
        return v
      },
    }
  }
  return {
    row: y => slice(x => [x, y], [1, 0]),
    column: x => slice(y => [x, y], [0, 1]),
    documentPoint: [...m.alpha],
    seedState(x, y) {
      const r = solvePhases(m, m.psi, [x, y], K)
      return { converged: r.converged, u: r.psi.slice(1), ...(r.reason ? { reason: r.reason } : {}) }
    },
  }
}

/** The plane of the settings for a compiled pattern; throws when the plane needs a torus. */
export function mapPlane(m: PatternModel, s: MapSettings): MapPlaneModel {
  if (m.space !== 'torus') throw new Error(`maps: the ${s.plane} plane needs a torus pattern`)
  return s.plane === 'tau' ? tauPlane(m, s) : alphaPlane(m)
}
