/**
 * `analyzePattern`: every verdict of issue 3 on a parsed document, as one JSON-serialisable
 * `PatternReport`. The drawing is judged as it is (no solve); `balancePattern` and
 * `solvePhases` move it to a balanced state first when wanted.
 */
import type { PatternDocument } from '../types/pattern'
import { balanceResidual } from './balance'
import { openWingSum } from './balance-solve'
import { badDegreeVertices, computeComponents, computeFaces, computeTopology, type Faces } from './combinatorics'
import { edgeLengths, meanEdgeLength, orderMargins } from './geometry'
import { compilePattern, degree, type PatternModel } from './model'
import { cycleSpaceBasis, spanningForest } from './operators'
import { checkOrientability } from './orientability'
import { analyzePhaseRigidity, meanWeight } from './phase-solve'
import { distanceToMirror, distanceToZeroMod2Pi, phaseDifferences, phaseResidual } from './phases'
import type { PatternReport, PatternVerdicts, VerdictName } from './report'
import { analyzeRigidity } from './rigidity'
import { cycleShifts, openFaces, sublatticeIndex } from './shifts'
import { maxOf, minOf, norm2 } from './vector'

/** Tolerances and limits of the analysis; every one optional, defaults below. */
export interface AnalyzeOptions {
  /** Balanced iff ‖B‖₂ ≤ this (dimensionless). Default 1e-8. */
  balanceTolerance?: number
  /** Rigid iff σ_min·ℓ̄ > this; also the zero band of the inertia. Default 1e-7. */
  rigidityTolerance?: number
  /** Phase-balanced iff ‖G‖₂/K̄ ≤ this. Default 1e-8. */
  phaseTolerance?: number
  /** Phase-rigid iff σ_min/K̄ > this; also the zero band of the phase inertia. Default 1e-7. */
  phaseRigidityTolerance?: number
  /** φ within this of 0 or π (mod 2π) counts as a mirror phase; also the curl φ check. Default 1e-9. */
  mirrorTolerance?: number
  /** An edge shorter than this × mean length has collapsed. Default 1e-9. */
  collapseTolerance?: number
  /** det(ω1, ω2)/(|ω1||ω2|) must exceed this. Default 1e-9. */
  latticeTolerance?: number
  /** Directions within this angle (radians) are parallel. Default 1e-12. */
  orderTolerance?: number
  /** |Σ open wing directions| must not exceed this. Default 1e-9. */
  wingTolerance?: number
  /**
   * Dense spectra up to this many vertices; above, sparse LDLᵀ + inverse iteration. Default 32:
   * measured (`npm run bench`), the sparse check is already faster from about 30 vertices.
   */
  maxDenseVertices?: number
}

export const DEFAULT_ANALYZE_OPTIONS: Required<AnalyzeOptions> = {
  balanceTolerance: 1e-8,
  rigidityTolerance: 1e-7,
  phaseTolerance: 1e-8,
  phaseRigidityTolerance: 1e-7,
  mirrorTolerance: 1e-9,
  collapseTolerance: 1e-9,
  latticeTolerance: 1e-9,
  orderTolerance: 1e-12,
  wingTolerance: 1e-9,
  maxDenseVertices: 32,
}

/** Fills defaults; throws on a non-positive tolerance or a bad vertex limit. */
export function resolveAnalyzeOptions(o: AnalyzeOptions = {}): Required<AnalyzeOptions> {
  const r = { ...DEFAULT_ANALYZE_OPTIONS, ...o }
  for (const [k, v] of Object.entries(r)) {
    if (!(typeof v === 'number' && v > 0 && Number.isFinite(v))) throw new Error(`option ${k} must be a positive number`)
  }
  if (!Number.isInteger(r.maxDenseVertices)) throw new Error('option maxDenseVertices must be an integer')
  return r
}

const DISCLAIMER = 'Numerical evidence in floating point, not a proof.'

/** Analyses a parsed document (see `parsePatternDocument`). */
export function analyzePattern(doc: PatternDocument, options?: AnalyzeOptions): PatternReport {
  const o = resolveAnalyzeOptions(options)
  const m = compilePattern(doc)
  const faces = computeFaces(m)
  const comps = computeComponents(m)
  const forest = spanningForest(m)
  const cycles = cycleSpaceBasis(m, forest)
  const topology = {
    ...computeTopology(m, faces, comps),
    cutSpaceDimension: m.nVertices - comps.count,
    cycleSpaceDimension: cycles.length,
  }
  const verdicts: PatternVerdicts = {
    ...combinatorialVerdicts(m, comps.of, comps.count),
    lattice: latticeVerdict(m, o.latticeTolerance),
    faceClosure: faceClosureVerdict(m, faces, sublatticeIndex(cycleShifts(m, cycles))),
    ...geometricVerdicts(m, o),
    ...phaseVerdicts(m, faces, o),
  }
  const phi = phaseDifferences(m, m.psi, m.alpha)
  const keepsMirrorPlanes = Array.from(phi).every(x => distanceToMirror(x) <= o.mirrorTolerance)
  const failing = (Object.keys(verdicts) as VerdictName[]).filter(k => !verdicts[k].ok)
  return {
    reportVersion: 1,
    name: doc.name,
    summary: {
      ok: failing.length === 0,
      failing,
      space: m.space,
      vertices: m.nVertices,
      closedEdges: m.nEdges,
      openWings: m.nWings,
      gluingPattern: verdicts.degrees.ok && verdicts.connected.ok,
      orientable: verdicts.orientable.ok,
      balanced: verdicts.balance.ok,
      rigid: verdicts.rigidity.method === 'dense' ? verdicts.rigidity.ok : null,
      phaseRigid: verdicts.phaseRigidity.method === 'dense' ? verdicts.phaseRigidity.ok : null,
      keepsMirrorPlanes,
      predictedGenus: topology.predictedGenus,
      openEnds: topology.openEnds,
    },
    topology,
    verdicts,
    phases: {
      present: doc.phases !== undefined,
      alpha: [...m.alpha],
      differences: Array.from(phi),
      keepsMirrorPlanes,
      mirrorTolerance: o.mirrorTolerance,
    },
    tolerances: { ...o },
    disclaimer: DISCLAIMER,
  }
}

function combinatorialVerdicts(m: PatternModel, compOf: Int32Array, compCount: number) {
  const bad = badDegreeVertices(m)
  const orient = checkOrientability(m)
  const groups: string[][] = Array.from({ length: compCount }, () => [])
  compOf.forEach((c, v) => groups[c]!.push(m.vertexIds[v]!))
  return {
    connected: compCount === 1
      ? { ok: true, components: 1 }
      : {
          ok: false, components: compCount, witness: { components: groups },
          explanation: `The graph falls into ${compCount} pieces; a gluing pattern must be connected.`,
        },
    degrees: {
      ok: bad.length === 0,
      degrees: m.vertexIds.map((_, v) => degree(m, v)),
      ...(bad.length ? {
        witness: { vertices: bad.map(v => m.vertexIds[v]!) },
        explanation: 'Every vertex needs an even degree of at least 4 (a tower with 2n ≥ 4 wings); this is not a valid gluing pattern.',
      } : {}),
    },
    orientable: orient.orientable
      ? { ok: true }
      : {
          ok: false, witness: { halfEdges: orient.oddChain.map(h => m.halfEdgeIds[h]!) },
          explanation: 'The half-edges cannot alternate outgoing/incoming around every vertex: the witness is a closed chain of odd length.',
        },
  }
}

function latticeVerdict(m: PatternModel, tolerance: number): PatternVerdicts['lattice'] {
  if (m.space === 'plane') return { ok: true, determinant: null, relativeArea: null, tolerance }
  const { w1, w2 } = m.lattice
  const det = w1[0] * w2[1] - w1[1] * w2[0]
  const rel = det / (Math.hypot(...w1) * Math.hypot(...w2))
  return rel > tolerance
    ? { ok: true, determinant: det, relativeArea: rel, tolerance }
    : { ok: false, determinant: det, relativeArea: rel, tolerance, explanation: 'The lattice vectors are (nearly) parallel: the torus has lost its area.' }
}

function faceClosureVerdict(m: PatternModel, faces: Faces, index: number | null): PatternVerdicts['faceClosure'] {
  const open = openFaces(m, faces)
  const base = { faces: faces.count, openFaces: open.length, latticeIndex: index }
  if (!open.length) return { ok: true, ...base }
  return {
    ok: false, ...base,
    witness: {
      faces: open.map(f => ({ face: f.face, halfEdges: faces.cycles[f.face]!.map(h => m.halfEdgeIds[h]!), shiftSum: f.sum })),
    },
    explanation: 'The lattice shifts around some faces do not sum to zero, so the drawing does not close up in the torus.',
  }
}

function geometricVerdicts(m: PatternModel, o: Required<AnalyzeOptions>) {
  const p = m.positions, lat = m.lattice
  const margins = Array.from(orderMargins(m, p, lat, o.orderTolerance))
  const flipped = margins.flatMap((x, v) => (x < 0 ? [m.vertexIds[v]!] : []))
  const lengths = Array.from(edgeLengths(m, p, lat))
  const mean = meanEdgeLength(m, p, lat)
  const minLength = lengths.length ? minOf(lengths) : null
  const short = lengths.flatMap((l, e) => (l <= o.collapseTolerance * mean ? [m.edgeIds[e]!] : []))
  const [wx, wy] = openWingSum(m)
  const b = balanceResidual(m, p, lat)
  const residuals: [number, number][] = m.vertexIds.map((_, v) => [b[2 * v]!, b[2 * v + 1]!])
  const norms = residuals.map(r => Math.hypot(...r))
  const residualNorm = norm2(b)
  const rig = analyzeRigidity(m, p, lat, { tolerance: o.rigidityTolerance, maxDenseVertices: o.maxDenseVertices })
  const { weakestMode, rigid, ...rigNumbers } = rig
  return {
    cyclicOrder: {
      ok: flipped.length === 0, minMargin: margins.length ? minOf(margins) : Math.PI, margins,
      explicit: m.rotationExplicit, tolerance: o.orderTolerance,
      ...(flipped.length ? {
        witness: { vertices: flipped },
        explanation: 'At some vertices the drawn counter-clockwise order of the edges differs from the rotation system.',
      } : {}),
    },
    edgeLengths: {
      ok: short.length === 0, minLength, relativeMinLength: minLength === null ? null : minLength / mean,
      tolerance: o.collapseTolerance,
      ...(short.length ? { witness: { edges: short }, explanation: 'Some edges have collapsed to (nearly) zero length.' } : {}),
    },
    openWings: {
      ok: Math.hypot(wx, wy) <= o.wingTolerance, sum: [wx, wy] as [number, number], norm: Math.hypot(wx, wy),
      tolerance: o.wingTolerance,
      ...(Math.hypot(wx, wy) > o.wingTolerance
        ? { explanation: 'The open wings\' directions do not sum to zero, so no drawing of this pattern can balance.' }
        : {}),
    },
    balance: {
      ok: residualNorm <= o.balanceTolerance, residualNorm, maxVertexResidual: Math.max(0, maxOf(norms)), residuals,
      tolerance: o.balanceTolerance,
      ...(residualNorm > o.balanceTolerance ? {
        witness: { vertices: norms.flatMap((n, v) => (n > o.balanceTolerance / Math.sqrt(m.nVertices) ? [m.vertexIds[v]!] : [])) },
        explanation: 'The unit vectors of the edges do not sum to zero at every vertex; run the balance solve.',
      } : {}),
    },
    rigidity: {
      ...rigNumbers,
      ok: rigid === true,
      ...(rigid === false ? {
        witness: { kernelMode: weakestMode },
        explanation: 'The drawing can be redrawn with every edge keeping its direction (a parallel redrawing), beyond translations'
          + (m.space === 'plane' ? ' and dilation.' : '.'),
      } : {}),
    },
  }
}

function phaseVerdicts(m: PatternModel, faces: Faces, o: Required<AnalyzeOptions>) {
  const phi = phaseDifferences(m, m.psi, m.alpha)
  const defects = faces.cycles.map(c => distanceToZeroMod2Pi(c.reduce((s, h) => s + (h % 2 ? -phi[h >> 1]! : phi[h >> 1]!), 0)))
  const badFaces = defects.flatMap((d, f) => (d > o.mirrorTolerance ? [f] : []))
  const g = phaseResidual(m, m.psi, m.alpha, m.weight)
  const kBar = meanWeight(m.weight)
  const gNorm = norm2(g) / kBar
  const pr = analyzePhaseRigidity(m, m.psi, m.alpha, m.weight, o.phaseRigidityTolerance, o.maxDenseVertices)
  const { weakestMode, rigid, ...prNumbers } = pr
  return {
    phaseClosure: {
      ok: badFaces.length === 0, maxDefect: Math.max(0, maxOf(defects)), tolerance: o.mirrorTolerance,
      ...(badFaces.length ? {
        witness: { faces: badFaces },
        explanation: 'Around some faces the phase differences do not add up to a multiple of 2π.',
      } : {}),
    },
    phaseBalance: {
      ok: gNorm <= o.phaseTolerance, residualNorm: gNorm, residuals: Array.from(g), tolerance: o.phaseTolerance,
      ...(gNorm > o.phaseTolerance ? {
        witness: { vertices: Array.from(g).flatMap((x, v) => (Math.abs(x) / kBar > o.phaseTolerance / Math.sqrt(m.nVertices) ? [m.vertexIds[v]!] : [])) },
        explanation: 'The weighted sines of the phase differences do not cancel at every vertex; run the phase solve.',
      } : {}),
    },
    phaseRigidity: {
      ...prNumbers,
      ok: rigid === true,
      ...(rigid === false ? {
        witness: { kernelMode: weakestMode },
        explanation: 'The vertical balance has a phase change beyond the global shift that keeps it to first order.',
      } : {}),
    },
  }
}
