/**
 * Events of the published existence conditions along drawing families (H. Chen, M. Traizet,
 * arXiv 2103.15676, 2021, Def. 4.8, Def. 6.2 and Rem. 6.5; H. Chen, Comm. Anal. Geom. 32, 2024,
 * Def. 1):
 * - "wall": the length-level structure of vertical balance on cuts changes — two edge lengths
 *   that enter the equations become or stop being equal. With K fixed the vertical equations
 *   depend on the drawing only through this structure, and they jump there (the vertical forces
 *   are not continuous in the lattice, CT-I Rem. 6.5). Only added when the phases are not
 *   trivial (trivial phases balance for every structure).
 * - "vertex no longer ordinary": two groups of wing lines at a vertex pass through each other where
 *   their merging makes the vertex degenerate or special (a continuous signed cross product).
 * - "rank of M drops" (plane): M = [ℓ̄·J | R] loses rank 2V. σ_2V(M) ≥ 0 only touches 0, so the
 *   signed test is the 2V × 2V minor of M on the columns chosen at the start by column-pivoted
 *   Gram–Schmidt (G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed. 2013, §5.4.1), scaled
 *   by its column norms: it has a simple zero where the rank drops transversally.
 * They are recorded, not terminal: the drawing family goes on (only the phase branch may end at a
 * wall, see `describeWall`), and τ maps draw them as crossings.
 * The wall test compares the structure with the one at the last accepted point and changes sign
 * at every change (see `wallEvent`); near a wall its size is the gap of the two lengths that meet,
 * so the engine locates each wall to its locate tolerance. `describeWall` gives the verdicts
 * before, at and after.
 */
import { LuDecomposition, type Matrix } from 'ml-matrix'
import type { ProblemEvent } from '../continuation/types'
import { edgeLengths } from '../pattern/geometry'
import { halfEdgeDirection, type Lattice, type PatternModel } from '../pattern/model'
import { distanceToMirror, phaseDifferences } from '../pattern/phases'
import { analyzePhaseRigidity } from '../pattern/phase-solve'
import { planeRigidityMatrix } from '../pattern/plane-rigidity'
import { levelResidual } from '../pattern/vertical-balance'
import { levelStructure, NEAR_WALL_TOLERANCE, type LevelStructure } from '../pattern/vertical-levels'
import type { DrawingAt } from './events'

/** Same (component, edges) parts. */
function sameParts(a: LevelStructure, b: LevelStructure): boolean {
  return a.partKeys.length === b.partKeys.length && a.partKeys.every((k, i) => k === b.partKeys[i])
}

/**
 * Smallest relative gap (ℓ_f − ℓ_e)/ℓ_f between consecutive closed-edge lengths that lie in
 * different levels (1 when there is one level): it reaches the tie tolerance exactly where a
 * wall's two lengths meet.
 */
function smallestLevelGap(m: PatternModel, lengths: Float64Array, s: LevelStructure): number {
  const sorted = s.levels.flatMap(lev => lev.edges.map(e => lengths[e]!)).sort((a, b) => a - b)
  let gap = 1
  for (let i = 1; i < sorted.length; i++) {
    const g = (sorted[i]! - sorted[i - 1]!) / (sorted[i]! || 1)
    if (g > s.tolerance) gap = Math.min(gap, g)
  }
  return gap
}

/**
 * The wall test. Its reference is the level structure at the LAST ACCEPTED point (`accepted`,
 * called by the engine), and it carries a sign that flips each time the accepted structure
 * changes: fn = ±(tol + smallest level gap), + while the structure is the reference's with the
 * current sign. So every change of structure along the branch is a sign change between two
 * accepted points, not only the first change against the start, and near a wall fn is the length
 * difference of the two edges that meet (relative, continuous up to the 1e-9 tie tolerance):
 * the engine's regula falsi locates it to its locate tolerance. When two walls fall inside one
 * step, the first is located and the step's end becomes the reference (the second is not
 * separated from it).
 */
function wallEvent(m: PatternModel, at: DrawingAt, terminal: boolean): ProblemEvent {
  let ref: LevelStructure | undefined
  let sign = 1
  const structureAt = (u: Float64Array, l: number) => {
    const d = at(u, l)
    const mm = d.model ?? m
    const lengths = edgeLengths(mm, d.p, d.lattice)
    const s = levelStructure(mm, lengths)
    return { s, gap: smallestLevelGap(mm, lengths, s) }
  }
  return {
    kind: 'wall', label: 'two edge lengths that enter the vertical equations become or stop being equal', terminal,
    fn: (u, l) => {
      const { s, gap } = structureAt(u, l)
      ref ??= s
      return (sameParts(s, ref) ? sign : -sign) * (s.tolerance + gap)
    },
    accepted: (u, l) => {
      const { s } = structureAt(u, l)
      if (ref && !sameParts(s, ref)) sign = -sign
      ref = s
    },
  }
}

/** The phases of the model are trivial (every φ within 1e-9 of 0 or π). */
export function trivialPhases(m: PatternModel): boolean {
  return Array.from(phaseDifferences(m, m.psi, m.alpha)).every(x => distanceToMirror(x) <= 1e-9)
}

/** Two half-edges at one vertex whose lines, once they coincide, make the vertex degenerate or special. */
interface CriticalPair { a: number; b: number; /** sign of cross(u_a, u_b) at the start */ s0: number }

/**
 * Pairs of line groups whose merging changes the kind of an ordinary vertex: merging groups A
 * and B gives |A| + |B| coinciding lines, degenerate when that is n and special when it is n − 2
 * with n ≥ 6 (CT-I Def. 4.8). One representative half-edge per group.
 */
function criticalLinePairs(m: PatternModel, p: Float64Array, lat: Lattice): CriticalPair[] {
  const out: CriticalPair[] = []
  const d = new Float64Array(2)
  for (let v = 0; v < m.nVertices; v++) {
    const n = m.starStart[v + 1]! - m.starStart[v]!
    const groups: { h: number; dx: number; dy: number; size: number }[] = []
    for (let i = m.starStart[v]!; i < m.starStart[v + 1]!; i++) {
      const h = m.starHalf[i]!
      halfEdgeDirection(m, p, lat, h, d)
      const len = Math.hypot(d[0]!, d[1]!) || 1
      const dx = d[0]! / len, dy = d[1]! / len
      const g = groups.find(q => Math.abs(q.dx * dy - q.dy * dx) <= 1e-9)
      if (g) g.size++
      else groups.push({ h, dx, dy, size: 1 })
    }
    if (groups.length < 2) continue
    for (let i = 0; i < groups.length; i++) {
      for (let j = i + 1; j < groups.length; j++) {
        const k = groups[i]!.size + groups[j]!.size
        const gi = groups[i]!, gj = groups[j]!
        if (k === n || (n >= 6 && k === n - 2)) out.push({ a: gi.h, b: gj.h, s0: Math.sign(gi.dx * gj.dy - gi.dy * gj.dx) || 1 })
      }
    }
  }
  return out
}

/**
 * min over vertices of sign(Π cross(u_a, u_b)) · min |cross(u_a, u_b)| over that vertex's critical
 * pairs: continuous, positive at the start, and negative once the lines of one pair at some vertex
 * have passed through each other (vertices changing at the same λ do not cancel). +1 without pairs.
 */
function signedLineMargin(m: PatternModel, p: Float64Array, lat: Lattice, pairs: CriticalPair[]): number {
  const da = new Float64Array(2), db = new Float64Array(2)
  const perVertex = new Map<number, { sign: number; min: number }>()
  for (const { a, b, s0 } of pairs) {
    halfEdgeDirection(m, p, lat, a, da)
    halfEdgeDirection(m, p, lat, b, db)
    const c = s0 * (da[0]! * db[1]! - da[1]! * db[0]!) / ((Math.hypot(da[0]!, da[1]!) * Math.hypot(db[0]!, db[1]!)) || 1)
    const v = m.vertexOf[a]!
    const q = perVertex.get(v) ?? { sign: 1, min: Infinity }
    if (c < 0) q.sign = -q.sign
    q.min = Math.min(q.min, Math.abs(c))
    perVertex.set(v, q)
  }
  let out = 1
  for (const q of perVertex.values()) out = Math.min(out, q.sign * q.min)
  return out
}

/** Options of {@link conditionEvents}. */
export interface ConditionEventOptions {
  terminal: boolean
  /** Add the wall event (lattice paths with non-trivial phases). */
  walls: boolean
  /** Add the rank drop event (plane families); its tolerance. */
  planeRankTolerance?: number
}

/**
 * The wall, ordinary-vertex and (plane) rank events of a drawing family. The references (the
 * critical line pairs, the level structure) are taken at the first point the engine evaluates:
 * the corrected start, which may differ from the document's unbalanced drawing.
 */
export function conditionEvents(m: PatternModel, at: DrawingAt, o: ConditionEventOptions): ProblemEvent[] {
  const ev: ProblemEvent[] = []
  let pairs: CriticalPair[] | undefined
  ev.push({
    kind: 'vertex no longer ordinary', label: 'the wing lines of a vertex coincide so that it becomes degenerate or special', terminal: o.terminal,
    fn: (u, l) => {
      const d = at(u, l)
      const mm = d.model ?? m
      pairs ??= criticalLinePairs(mm, d.p, d.lattice)
      return signedLineMargin(mm, d.p, d.lattice, pairs)
    },
  })
  if (o.walls && m.nEdges > 1) ev.push(wallEvent(m, at, o.terminal))
  if (o.planeRankTolerance !== undefined) {
    let columns: number[] | undefined
    ev.push({
      kind: 'rank of M drops', label: 'M = [ℓ̄·J | R] loses rank 2V: the drawing is no longer rigid with free wing directions', terminal: o.terminal,
      fn: (u, l) => {
        const d = at(u, l)
        const { M } = planeRigidityMatrix(d.model ?? m, d.p, d.lattice)
        columns ??= pivotColumns(M)
        return normalisedMinor(M, columns)
      },
    })
  }
  return ev
}

/** Vertical verdicts of the model's phases under one level structure. */
export interface SideVerdict {
  /** The equations as edge-id sets with signs. */
  equations: { vertices: string[]; terms: { edge: string; sign: 1 | -1 }[] }[]
  balanced: boolean
  phaseRigid: boolean | null
}

/** What a wall looks like: the tied edges and the verdicts before, at and after. */
export interface WallDescription {
  /** Edge pairs whose lengths tie (relative gap ≤ 1e-6) at the wall, with their gap. */
  ties: { edges: [string, string]; relativeGap: number }[]
  before: SideVerdict
  at: SideVerdict
  after: SideVerdict
  /** The phases do not solve the equations after the wall: the phase branch ends here. */
  phaseBranchEnds: boolean
}

function sideVerdict(m: PatternModel, s: LevelStructure, tol: number): SideVerdict {
  const F = levelResidual(m, s, m.psi, m.alpha, m.weight)
  const r = analyzePhaseRigidity(m, m.psi, m.alpha, m.weight, 1e-7, 400, s)
  return {
    equations: s.rows.map(r => ({ vertices: r.vertices.map(v => m.vertexIds[v]!), terms: r.terms.map(t => ({ edge: m.edgeIds[t.edge]!, sign: t.sign })) })),
    balanced: Math.hypot(...F) <= tol,
    phaseRigid: r.rigid,
  }
}

/** Lattice at which a drawing is evaluated, and its positions. */
export interface DrawingState { p: Float64Array; lattice: Lattice }

/**
 * Describes a located wall from the drawings just before, at and just after it (for instance the
 * accepted points around the special point); the model's phases ψ, α and weights K are judged.
 */
export function describeWall(m: PatternModel, before: DrawingState, at: DrawingState, after: DrawingState, tol = 1e-8): WallDescription {
  const lengths = (d: DrawingState) => edgeLengths(m, d.p, d.lattice)
  const sb = levelStructure(m, lengths(before)), sa = levelStructure(m, lengths(after))
  const la = lengths(at)
  const sAt = levelStructure(m, la, NEAR_WALL_TOLERANCE)
  const ties: WallDescription['ties'] = []
  for (const lev of sAt.levels) {
    for (let i = 1; i < lev.edges.length; i++) {
      const e = lev.edges[i - 1]!, f = lev.edges[i]!
      ties.push({ edges: [m.edgeIds[e]!, m.edgeIds[f]!], relativeGap: Math.abs(la[e]! - la[f]!) / Math.max(la[e]!, la[f]!) })
    }
  }
  const afterVerdict = sideVerdict(m, sa, tol)
  return {
    ties, before: sideVerdict(m, sb, tol), at: sideVerdict(m, sAt, tol), after: afterVerdict,
    phaseBranchEnds: !afterVerdict.balanced,
  }
}

/** 2V columns of M picked greedily by the largest residual after projecting out the chosen ones. */
function pivotColumns(M: Matrix): number[] {
  const r = M.rows, c = M.columns
  const cols = Array.from({ length: c }, (_, j) => M.getColumn(j))
  const chosen: number[] = []
  for (let k = 0; k < r; k++) {
    let best = -1, bestNorm = -1
    cols.forEach((x, j) => {
      if (chosen.includes(j)) return
      const nrm = Math.hypot(...x)
      if (nrm > bestNorm) { best = j; bestNorm = nrm }
    })
    if (best < 0 || bestNorm <= 0) break
    chosen.push(best)
    const q = cols[best]!.map(t => t / bestNorm)
    for (const x of cols) {
      const dot = x.reduce((s, t, i) => s + t * q[i]!, 0)
      for (let i = 0; i < r; i++) x[i]! -= dot * q[i]!
    }
  }
  return chosen
}

/** det of M on the columns, divided by the product of their norms (|value| ≤ 1, Hadamard). */
function normalisedMinor(M: Matrix, columns: number[]): number {
  if (columns.length < M.rows) return 0
  const S = M.subMatrixColumn(columns)
  let scale = 1
  for (let j = 0; j < S.columns; j++) scale *= Math.hypot(...S.getColumn(j)) || 1
  return new LuDecomposition(S).determinant / scale
}
