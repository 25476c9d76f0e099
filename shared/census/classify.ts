/**
 * Classification of one census pattern: draw it (draw.ts), balance the drawing with the pattern
 * core's balance solve, and read the verdicts from `analyzePattern` (no verdict is recomputed
 * here). The lattice is either the one the user set, or searched: the user's lattice first, then
 * sample shapes τ = ω2/ω1 of the fundamental domain |Re τ| ≤ 1/2, |τ| ≥ 1 (ω1 = (1, 0)); the
 * first τ where a balanced drawing with the rotation kept is found wins. With `sweep`, the
 * moduli-map sweep (shared/maps) then continues that balanced drawing over a grid of the
 * fundamental domain's window and reports how many cells it reached and how many were rigid.
 * When every sample fails, the same sweep searches: from seeds of a coarse grid of the
 * fundamental domain (each seed solved from the harmonic drawing at that τ) it continues the
 * solution over a coarse τ grid and takes the first solved cell whose drawing keeps the rotation
 * and no edge collapses, within a time budget per pattern (`sweepSearchMs`).
 * The phase kernel dimension is taken at trivial phases (all cos φ = 1), where it is 0 for every
 * balanced pattern (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I", 2021,
 * Prop. 6.12: phase-rigid there); it checks the solve, it does not tell patterns apart.
 */
import { documentAtCell, runMapSweep } from '../maps'
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
  /**
   * When the lattice and the sample τ all fail: time budget (ms) per pattern for the coarse τ
   * map sweep over the fundamental domain (default 500; 0 turns it off). Only with `searchTau`.
   */
  sweepSearchMs?: number
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
  let sweepNote = ''
  const budget = options.sweepSearchMs ?? 500
  if (!found && (options.searchTau ?? true) && budget > 0 && !(first?.report === null && first.reason?.includes('contractible'))) {
    const s = sweepSearch(sigma, name, Math.hypot(...lattice.w1), budget)
    if (s.found) { found = s.found; foundAt = s.lattice! } else sweepNote = `; the coarse τ sweep (${s.seeds} seeds, ${s.solved} solved cells in ${budget} ms) found no drawing that keeps the rotation`
  }
  const a = found ?? first!
  const v = found?.report?.verdicts
  return {
    balanced: v !== undefined,
    reason: found ? null : (a.reason ?? 'not balanced') + sweepNote,
    tau: tauOf(foundAt),
    rigid: v ? v.rigidity.ok : null,
    phaseKernelDimension: v ? phaseKernel(v.phaseRigidity) : null,
    failing: a.report?.summary.failing ?? ['edgeLengths'],
    sweep: v && options.sweep && a.document.vertices.length > 1 ? sweepSummary(a.document, options.sweepGrid ?? 5) : null,
    document: a.document,
  }
}

/**
 * Zero eigenvalues of the phase Jacobian (pinned): from the inertia when the report has it, else
 * 0 when its least singular value clears the tolerance (an invertible matrix has no kernel), else
 * unknown (null).
 */
function phaseKernel(pr: { inertia?: { zero: number } | null, sigmaMin?: number | null, tolerance?: number }): number | null {
  if (pr.inertia) return pr.inertia.zero
  if (typeof pr.sigmaMin === 'number' && typeof pr.tolerance === 'number' && pr.sigmaMin > pr.tolerance) return 0
  return null
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

/** Coarse τ grid of the fundamental domain |Re τ| ≤ 1/2, Im τ from √3/2 to 2 (3 × 3 cells). */
const SEARCH_GRID = { x: { min: -0.5, max: 0.5, count: 3 }, y: { min: Math.sqrt(3) / 2, max: 2, count: 3 } }
/** Seeds of the search sweep: the grid's points that are not sample τ. */
const SEARCH_SEEDS: [number, number][] = [[0, 1.4], [-0.5, 2], [0.5, 2], [-0.5, Math.sqrt(3) / 2], [0.25, 1.7], [-0.25, 1.1], [0, 1.8]]

/** Judges a drawing as `attempt` does (balanced, rotation kept, no collapsed edge). */
function judge(doc: PatternDocument): Attempt {
  if (zeroLengthEdges(doc).length) return { ok: false, reason: 'collapsed edge', document: doc, report: null }
  const report = analyzePattern(doc)
  const v = report.verdicts
  const ok = v.balance.ok && v.cyclicOrder.ok && v.edgeLengths.ok
  return { ok, reason: ok ? null : 'not balanced', document: doc, report }
}

/**
 * The τ map sweep (shared/maps) as a search: at each seed τ the balance solve runs from the
 * harmonic drawing (as for the samples); when it fails, the sweep starts from the solve's last
 * drawing (nudged off coincident vertices) and continues the balanced state over the coarse grid; the first solved
 * cell whose drawing passes `judge` wins. Stops at the budget (checked between seeds and cells).
 * `directSolve = false` skips the balance solve at the seeds (the sweep's own seed solve only).
 */
export function sweepSearch(sigma: Int32Array, name: string, scale: number, budgetMs: number, directSolve = true): { found: Attempt | null, lattice: CensusLattice | null, seeds: number, solved: number } {
  const t0 = Date.now()
  let seeds = 0, solved = 0
  for (const seed of SEARCH_SEEDS) {
    if (Date.now() - t0 > budgetMs) break
    const first = directSolve ? attempt(sigma, name, latticeOf(seed, scale)) : null
    if (first?.ok) return { found: first, lattice: latticeOf(seed, scale), seeds: seeds + 1, solved }
    let doc = first?.document ?? parsePatternDocument(censusDocument(sigma, name, latticeOf(seed, scale)))
    if (zeroLengthEdges(doc).length) doc = separateCoincident(doc)
    if (doc.vertices.length < 2) break
    seeds++
    const settings = { plane: 'tau' as const, scaleBy: 'w1' as const, seed, maxPointsPerRow: 200, ...SEARCH_GRID }
    let map
    try { map = runMapSweep(doc, settings) } catch { continue }
    for (const cell of map.rows.flatMap(r => r.cells)) {
      if (cell.status !== 'solved') continue
      solved++
      const j = judge(documentAtCell(doc, settings, cell))
      if (j.ok) return { found: j, lattice: latticeOf([cell.x, cell.y], scale), seeds, solved }
      if (Date.now() - t0 > budgetMs) break
    }
  }
  return { found: null, lattice: null, seeds, solved }
}
