/**
 * Classification of one census pattern: draw it (draw.ts), balance the drawing with the pattern
 * core's balance solve, and read the verdicts from `analyzePattern` (no verdict is recomputed
 * here). The lattice is either the one the user set, or searched: the user's lattice first, then
 * sample shapes τ = ω2/ω1 of the fundamental domain |Re τ| ≤ 1/2, |τ| ≥ 1 (ω1 = (1, 0)); the
 * first τ where a balanced drawing with the rotation kept is found wins. With `sweep`, the
 * moduli-map sweep (shared/maps) then continues that balanced drawing over a grid of the
 * fundamental domain's window and reports how many cells it reached and how many were rigid.
 */
import { runMapSweep } from '../maps'
import { analyzePattern, balancePattern } from '../pattern'
import { parsePatternDocument, type PatternDocument } from '../types/pattern'
import { censusDocument, SQUARE_LATTICE, type CensusLattice } from './draw'

/** Options; defaults: square lattice, search on, no sweep. */
export interface ClassifyOptions {
  lattice?: CensusLattice
  /** Try the sample τ of the fundamental domain after the given lattice (default true). */
  searchTau?: boolean
  /** Run the τ map sweep from the balanced drawing (default false; costs a continuation per row). */
  sweep?: boolean
  /** Grid of the sweep per axis (default 5). */
  sweepGrid?: number
}

/** Sample shapes τ of the fundamental domain, square and hexagonal first. */
export const TAU_SAMPLES: [number, number][] = [
  [0, 1], [0.5, Math.sqrt(3) / 2], [0, 1.5], [0.25, 1.2], [0.5, 1.2], [0, 2.2], [0.4, 1.7], [0.15, 1.05],
]

/** What the census stores per pattern beside the combinatorics. */
export interface CensusVerdicts {
  /** A balanced straight-line drawing with the cyclic order of σ and no collapsed edge was found. */
  balanced: boolean
  /** Why not, when not balanced (the solve's or the report's explanation). */
  reason: string | null
  /** τ = ω2/ω1 of the lattice where the verdicts were taken. */
  tau: [number, number]
  /** Rigid (torus sense) at the balanced drawing; null when not balanced. */
  rigid: boolean | null
  /** Kernel dimension of the phase Jacobian at trivial phases (zero eigenvalues); null when not balanced. */
  phaseKernelDimension: number | null
  /** Failing verdicts of `analyzePattern` at the final drawing. */
  failing: string[]
  /** Cells reached and rigid cells of the τ sweep, when run (never for one tower: no unknowns, every τ is balanced). */
  sweep: { cells: number, solved: number, rigid: number } | null
  /** The final drawing (balanced when `balanced`). */
  document: PatternDocument
}

function latticeOf(tau: [number, number], scale = 1): CensusLattice {
  return { w1: [scale, 0], w2: [scale * tau[0], scale * tau[1]] }
}

function tauOf(l: CensusLattice): [number, number] {
  const n = l.w1[0] ** 2 + l.w1[1] ** 2
  return [(l.w2[0] * l.w1[0] + l.w2[1] * l.w1[1]) / n, (l.w1[0] * l.w2[1] - l.w1[1] * l.w2[0]) / n]
}

interface Attempt { ok: boolean, reason: string | null, document: PatternDocument, report: ReturnType<typeof analyzePattern> | null }

/** Closed edges of zero length in a document's drawing (ids). */
function zeroLengthEdges(doc: PatternDocument): string[] {
  const pos = new Map(doc.vertices.map(v => [v.id, v.position]))
  const { w1, w2 } = doc.lattice!
  return doc.edges.filter((e) => {
    const a = pos.get(e.from)!, b = pos.get(e.to)!, [k1, k2] = e.shift ?? [0, 0]
    return Math.hypot(b[0] + k1 * w1[0] + k2 * w2[0] - a[0], b[1] + k1 * w1[1] + k2 * w2[1] - a[1]) < 1e-9
  }).map(e => e.id)
}

/**
 * The harmonic drawing puts a vertex onto a neighbour when all its edges are homotopic to one
 * segment; the balance solve needs distinct ends, so such vertices are moved off by a small
 * deterministic offset (the solve then either balances or reports why not).
 */
function separateCoincident(doc: PatternDocument): PatternDocument {
  const scale = Math.hypot(...doc.lattice!.w1)
  return {
    ...doc,
    vertices: doc.vertices.map((v, i) => ({ ...v, position: [v.position[0] + 0.05 * scale * Math.cos(2.4 * i), v.position[1] + 0.05 * scale * Math.sin(2.4 * i)] as [number, number] })),
  }
}

/**
 * Loops whose tree–cotree shift is zero: null-homologous, hence contractible on the torus, and a
 * straight segment from p to p + T(0) has no length. No straight-line drawing exists.
 */
function contractibleLoops(doc: PatternDocument): string[] {
  return doc.edges.filter(e => e.from === e.to && e.shift?.[0] === 0 && e.shift?.[1] === 0).map(e => e.id)
}

function attempt(sigma: Int32Array, name: string, lattice: CensusLattice): Attempt {
  const raw = censusDocument(sigma, name, lattice)
  const loops = contractibleLoops(raw)
  if (loops.length) {
    return { ok: false, reason: `loop${loops.length > 1 ? 's' : ''} ${loops.join(', ')} ${loops.length > 1 ? 'are' : 'is'} contractible on the torus: no straight-line drawing exists`, document: raw, report: null }
  }
  let drawn = parsePatternDocument(raw)
  const collapsed = zeroLengthEdges(drawn)
  if (collapsed.length) drawn = separateCoincident(drawn)
  const b = balancePattern(drawn)
  const stillCollapsed = zeroLengthEdges(b.document)
  if (stillCollapsed.length) {
    return { ok: false, reason: `edges ${stillCollapsed.join(', ')} have zero length: their ends coincide in every drawing tried`, document: drawn, report: null }
  }
  const report = analyzePattern(b.document)
  const v = report.verdicts
  const ok = b.converged && v.balance.ok && v.cyclicOrder.ok && v.edgeLengths.ok
  const reason = ok ? null
    : !b.converged ? (b.reason ?? 'the balance solve did not converge')
    : (v.cyclicOrder.explanation ?? v.edgeLengths.explanation ?? v.balance.explanation ?? 'not balanced')
  return { ok, reason, document: b.document, report }
}

/** Classifies the census map σ (darts with ι(d) = d ^ 1). */
export function classifyCensusMap(sigma: Int32Array, name: string, options: ClassifyOptions = {}): CensusVerdicts {
  const lattice = options.lattice ?? SQUARE_LATTICE
  const lattices = [lattice]
  if (options.searchTau ?? true) {
    const scale = Math.hypot(...lattice.w1)
    for (const t of TAU_SAMPLES) lattices.push(latticeOf(t, scale))
  }
  let first: Attempt | null = null, found: Attempt | null = null, foundAt = lattice
  for (const l of lattices) {
    const a = attempt(sigma, name, l)
    first ??= a
    if (a.ok) { found = a; foundAt = l; break }
    // a contractible loop has zero shift on every lattice: no other lattice can help
    if (a.report === null && a.reason?.includes('contractible')) break
  }
  const a = found ?? first!
  const v = found?.report?.verdicts
  return {
    balanced: v !== undefined,
    reason: a.reason,
    tau: tauOf(foundAt),
    rigid: v ? v.rigidity.ok : null,
    // one length level: the symmetric spectrum counts the kernel; several levels: a phase-rigid
    // pinned row Jacobian has kernel 0, otherwise the dimension is not counted (null)
    phaseKernelDimension: v ? (v.phaseRigidity.inertia?.zero ?? (v.phaseRigidity.ok === true ? 0 : null)) : null,
    failing: a.report?.summary.failing ?? ['edgeLengths'],
    sweep: v && options.sweep && a.document.vertices.length > 1 ? sweepSummary(a.document, options.sweepGrid ?? 5) : null,
    document: a.document,
  }
}

function sweepSummary(doc: PatternDocument, grid: number): CensusVerdicts['sweep'] {
  const map = runMapSweep(doc, {
    plane: 'tau',
    x: { min: -0.5, max: 0.5, count: grid },
    y: { min: Math.sqrt(3) / 2, max: 2, count: grid },
  })
  const cells = map.rows.flatMap(r => r.cells)
  const solved = cells.filter(c => c.status === 'solved')
  return { cells: cells.length, solved: solved.length, rigid: solved.filter(c => (c.sigmaMin ?? 0) > 1e-7).length }
}
