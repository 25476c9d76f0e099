/**
 * `analyzePattern`: every verdict of the pattern checks on a parsed document, as one JSON-serialisable
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
import { existenceChecklist } from './existence'
import { analyzePhaseRigidity, meanWeight } from './phase-solve'
import { distanceToMirror, distanceToZeroMod2Pi, phaseDifferences } from './phases'
import { analyzePlaneRigidity } from './plane-rigidity'
import { VERTICAL_BALANCE_DEFINITION, type PatternReport, type PatternVerdicts, type VerdictName } from './report'
import { analyzeRigidity } from './rigidity'
import { checkStraightDrawing } from './straight-drawing'
import { classifyVertices } from './vertex-towers'
import { levelResidual, modelLevels, rowsDependingOnK } from './vertical-balance'
import { wallReport } from './vertical-levels'
import { cycleShifts, openFaces, sublatticeIndex } from './shifts'
import { maxOf, minOf, norm2 } from '../linalg/vectors'

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

/** What K stands for, in one line (shown beside the K editor and in reports). */
export const K_NOTE = 'K = 1 assumed (exact when symmetry equalises equal-length weights, as in the published examples): K_h stands for the product of the two wings\' undulation amplitudes times a factor from the towers\' offsets; only ratios of K among equal-length edges matter.'

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
  const zero = zeroLengthEdges(Array.from(edgeLengths(m, m.positions, m.lattice)))
  const drawing = checkStraightDrawing(m)
  const drawingOk = drawing.ok && verdicts.cyclicOrder.ok && verdicts.edgeLengths.ok && verdicts.lattice.ok
  const existence = existenceChecklist({
    space: m.space,
    connected: verdicts.connected.ok,
    openWings: m.nWings,
    loops: Array.from(m.edgeFrom).filter((v, e) => v === m.edgeTo[e]).length,
    embeddingGenus: topology.embeddingGenus,
    smallestFace: faces.cycles.reduce((a, c) => Math.min(a, c.length), Infinity),
    minDegree: verdicts.degrees.degrees.reduce((a, d) => Math.min(a, d), Infinity),
    orientable: verdicts.orientable.ok,
    drawing: {
      ok: drawingOk,
      checked: drawing.checked,
      detail: [
        drawing.coincidentVertices.length ? `coincident vertices ${drawing.coincidentVertices.map(([a, b]) => `${m.vertexIds[a]}=${m.vertexIds[b]}`).join(', ')}` : '',
        drawing.crossings.length ? `crossing edges ${drawing.crossings.map(([a, b]) => `${m.edgeIds[a]}×${m.edgeIds[b]}`).join(', ')}` : '',
        drawing.wingCrossings.length ? `crossing wings ${drawing.wingCrossings.map(w => `${m.wingIds[w.wing]}×${w.edge !== undefined ? m.edgeIds[w.edge] : m.wingIds[w.otherWing!]}`).join(', ')}` : '',
        verdicts.cyclicOrder.ok || zero.length ? '' : 'drawn order differs from σ',
        zero.length ? `degenerate: zero-length edge${zero.length > 1 ? 's' : ''} ${zero.map(e => m.edgeIds[e]).join(', ')}` : verdicts.edgeLengths.ok ? '' : 'collapsed edge',
      ].filter(Boolean).join('; ') || 'no crossings, distinct points, order = σ',
    },
    balanced: verdicts.balance.ok,
    rigid: verdicts.rigidity.ok,
    ordinary: verdicts.ordinary.ok,
    trivialPhases: keepsMirrorPlanes,
    phaseClosure: verdicts.phaseClosure.ok,
    verticallyBalanced: verdicts.phaseBalance.ok,
    phaseRigid: verdicts.phaseRigidity.ok,
    predictedGenus: topology.predictedGenus,
    dependsOnK: verdicts.phaseBalance.dependsOnK,
  })
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
    existence,
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

/**
 * Closed edges whose ends coincide (length ≤ 1e-12 × the longest edge, or not finite): their
 * direction is undefined, so the drawing is degenerate and no verdict that uses edge directions
 * (order, balance, rigidity, ordinary towers) can be judged.
 */
export function zeroLengthEdges(lengths: readonly number[]): number[] {
  const longest = lengths.reduce((a, l) => (Number.isFinite(l) ? Math.max(a, l) : a), 0)
  return lengths.flatMap((l, e) => (!Number.isFinite(l) || l <= 1e-12 * longest ? [e] : []))
}

/** Sentence for the verdicts a degenerate drawing leaves undefined. */
function degenerateExplanation(m: PatternModel, zero: number[], what: string): string {
  const ids = zero.map(e => m.edgeIds[e]!).join(', ')
  return `Degenerate drawing: edge${zero.length > 1 ? 's' : ''} ${ids} ${zero.length > 1 ? 'have' : 'has'} zero length (${zero.length > 1 ? 'their' : 'its'} ends coincide), so ${what} cannot be judged.`
}

/** The verdicts of the drawing's geometry. */
type GeometricVerdicts = Pick<PatternVerdicts, 'cyclicOrder' | 'edgeLengths' | 'openWings' | 'balance' | 'rigidity' | 'ordinary'>

function geometricVerdicts(m: PatternModel, o: Required<AnalyzeOptions>): GeometricVerdicts {
  const p = m.positions, lat = m.lattice
  const lengths = Array.from(edgeLengths(m, p, lat))
  const zero = zeroLengthEdges(lengths)
  if (zero.length) return degenerateGeometricVerdicts(m, o, lengths, zero)
  const margins = Array.from(orderMargins(m, p, lat, o.orderTolerance))
  const flipped = margins.flatMap((x, v) => (x < 0 ? [m.vertexIds[v]!] : []))
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
  const towers = classifyVertices(m, p, lat)
  const notable = towers.filter(t => t.kind !== 'ordinary' || t.nearKind)
  const bad = towers.filter(t => t.kind !== 'ordinary')
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
    rigidity: m.space === 'plane' ? planeRigidityVerdict(m, p, lat, o.rigidityTolerance) : {
      ...rigNumbers,
      ok: rigid === true,
      ...(rigid === false ? {
        witness: { kernelMode: weakestMode },
        explanation: 'The drawing can be redrawn with every edge keeping its direction (a parallel redrawing), beyond translations.',
      } : {}),
    },
    ordinary: {
      ok: bad.length === 0,
      kinds: towers.map(t => t.kind),
      notable: notable.map(t => ({
        vertex: m.vertexIds[t.vertex]!, degree: t.degree, kind: t.kind, largestGroup: t.largestGroup,
        coinciding: t.coinciding.map(h => m.halfEdgeIds[h]!), ...(t.nearKind ? { nearKind: t.nearKind } : {}),
      })),
      tolerance: 1e-9,
      nearTolerance: 1e-6,
      ...(bad.length ? {
        witness: { vertices: bad.map(t => m.vertexIds[t.vertex]!), halfEdges: bad.flatMap(t => t.coinciding.map(h => m.halfEdgeIds[h]!)) },
        explanation: 'At some vertices too many wing lines coincide (degenerate or special), so no ordinary saddle tower fits there.',
      } : {}),
    },
  }
}

/**
 * The geometric verdicts of a drawing with zero-length edges: the edge-length verdict names them,
 * and order, balance, rigidity and ordinary towers fail as not judgeable (their numbers are
 * NaN / null, shown as "—"), with the edges and their end vertices as witness. Never throws.
 */
function degenerateGeometricVerdicts(m: PatternModel, o: Required<AnalyzeOptions>, lengths: number[], zero: number[]): GeometricVerdicts {
  const ends = [...new Set(zero.flatMap(e => [m.edgeFrom[e]!, m.edgeTo[e]!]))].sort((a, b) => a - b).map(v => m.vertexIds[v]!)
  const edges = zero.map(e => m.edgeIds[e]!)
  const mean = lengths.reduce((a, l) => a + l, 0) / lengths.length
  const [wx, wy] = openWingSum(m)
  const nan = (n: number) => Array.from({ length: n }, () => Number.NaN)
  return {
    cyclicOrder: {
      ok: false, minMargin: Number.NaN, margins: nan(m.nVertices), explicit: m.rotationExplicit, tolerance: o.orderTolerance,
      witness: { vertices: ends }, explanation: degenerateExplanation(m, zero, `the drawn order at ${ends.join(', ')}`),
    },
    edgeLengths: {
      ok: false, minLength: 0, relativeMinLength: 0, tolerance: o.collapseTolerance,
      witness: { edges: lengths.flatMap((l, e) => (l <= o.collapseTolerance * mean ? [m.edgeIds[e]!] : [])) },
      explanation: `Degenerate drawing: edge${zero.length > 1 ? 's' : ''} ${edges.join(', ')} ${zero.length > 1 ? 'have' : 'has'} zero length (the ends coincide).`,
    },
    openWings: {
      ok: Math.hypot(wx, wy) <= o.wingTolerance, sum: [wx, wy] as [number, number], norm: Math.hypot(wx, wy), tolerance: o.wingTolerance,
      ...(Math.hypot(wx, wy) > o.wingTolerance ? { explanation: 'The open wings\' directions do not sum to zero, so no drawing of this pattern can balance.' } : {}),
    },
    balance: {
      ok: false, residualNorm: Number.NaN, maxVertexResidual: Number.NaN, residuals: m.vertexIds.map(() => [Number.NaN, Number.NaN] as [number, number]),
      tolerance: o.balanceTolerance, witness: { vertices: ends }, explanation: degenerateExplanation(m, zero, 'balance'),
    },
    rigidity: {
      method: 'dense' as const, reason: `zero-length edges ${edges.join(', ')}`, trivialDimension: 2, dimension: 0,
      sigmaMin: null, lengthScale: mean, inertia: null, eigenvalues: [], tolerance: o.rigidityTolerance,
      ok: false, explanation: degenerateExplanation(m, zero, 'rigidity'),
    },
    ordinary: {
      // a tower whose edge has no direction is not ordinary; the others are classified as usual
      ok: false, kinds: classifyVertices(m).map(t => (ends.includes(m.vertexIds[t.vertex]!) ? 'degenerate' as const : t.kind)), notable: [], tolerance: 1e-9, nearTolerance: 1e-6,
      witness: { vertices: ends, halfEdges: [] }, explanation: degenerateExplanation(m, zero, `the towers at ${ends.join(', ')}`),
    },
  }
}

/** The published plane rule: M = [ℓ̄·J | R] of rank 2V (Chen 2024, Def. 1). */
function planeRigidityVerdict(m: PatternModel, p: Float64Array, lat: PatternModel['lattice'], tolerance: number): PatternVerdicts['rigidity'] {
  const r = analyzePlaneRigidity(m, p, lat, tolerance)
  const { witness, ...plane } = r
  return {
    method: r.method, trivialDimension: 2, dimension: r.rows, sigmaMin: r.sigma, lengthScale: r.lengthScale,
    inertia: null, eigenvalues: [], tolerance, plane,
    ok: r.rigid,
    ...(witness ? {
      witness: { kernelMode: witness },
      explanation: 'A parallel redrawing moves no open wing\'s root sideways, so the balanced drawings cannot follow every change of the wing directions (M has rank below 2V).',
    } : {}),
  }
}

function phaseVerdicts(m: PatternModel, faces: Faces, o: Required<AnalyzeOptions>) {
  const phi = phaseDifferences(m, m.psi, m.alpha)
  const defects = faces.cycles.map(c => distanceToZeroMod2Pi(c.reduce((s, h) => s + (h % 2 ? -phi[h >> 1]! : phi[h >> 1]!), 0)))
  const badFaces = defects.flatMap((d, f) => (d > o.mirrorTolerance ? [f] : []))
  const levels = modelLevels(m)
  const kBar = meanWeight(m.weight)
  const g = Array.from(levelResidual(m, levels, m.psi, m.alpha, m.weight), x => x / kBar)
  const gNorm = norm2(Float64Array.from(g))
  const dependent = new Set(rowsDependingOnK(m, levels, m.psi, m.alpha))
  const lengths = edgeLengths(m, m.positions, m.lattice)
  const walls = wallReport(m, lengths, levels)
  const equations = levels.rows.map((r, i) => ({
    level: r.level, length: levels.levels[r.level]!.length,
    vertices: r.vertices.map(v => m.vertexIds[v]!),
    terms: r.terms.map(t => ({ edge: m.edgeIds[t.edge]!, sign: t.sign })),
    residual: g[i]!, dependsOnK: dependent.has(i),
  }))
  const failingRows = g.flatMap((x, i) => (Math.abs(x) > o.phaseTolerance / Math.sqrt(Math.max(1, g.length)) ? [i] : []))
  const pr = analyzePhaseRigidity(m, m.psi, m.alpha, m.weight, o.phaseRigidityTolerance, o.maxDenseVertices, levels)
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
      ok: gNorm <= o.phaseTolerance, definition: VERTICAL_BALANCE_DEFINITION, residualNorm: gNorm, residuals: g,
      equations,
      levels: levels.levels.map(l => ({ length: l.length, edges: l.edges.map(e => m.edgeIds[e]!), spread: l.spread })),
      dependsOnK: dependent.size > 0,
      kNote: K_NOTE,
      nearWall: walls.nearWall
        ? { pairs: walls.pairs.map(w => ({ edges: [m.edgeIds[w.edges[0]]!, m.edgeIds[w.edges[1]]!] as [string, string], relativeGap: w.relativeGap })) }
        : null,
      chainedTies: walls.chainedTies,
      tolerance: o.phaseTolerance,
      ...(gNorm > o.phaseTolerance ? {
        witness: {
          vertices: [...new Set(failingRows.flatMap(i => equations[i]!.vertices))],
          edges: [...new Set(failingRows.flatMap(i => equations[i]!.terms.map(t => t.edge)))],
          equations: failingRows,
        },
        explanation: 'On some cut the weighted sines of the phase differences of its shortest edges do not cancel; run the phase solve.',
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
