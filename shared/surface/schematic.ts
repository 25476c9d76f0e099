/**
 * The schematic surface of a pattern near the degenerate limit of the gluing construction
 * (H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I: Triply periodic minimal surfaces",
 * arXiv 2103.15676, 2021; H. Chen, "Gluing Karcher–Scherk saddle towers II: Singly periodic
 * minimal surfaces", Comm. Anal. Geom. 32, 2024): at every pattern vertex a saddle tower with
 * that vertex's wing directions (./tower.ts), raised by its phase ψ; every closed edge a vertical
 * sheet from one tower's wing to the other's, joined midway; in the plane every open wing a flat
 * sheet cut at `wingLength` from its tower. One vertical period 2π; in the torus the mesh closes
 * up across the cell through the periods (S·ω_i, α_i) and (0, 0, 2π).
 *
 * Topology (derived): a tower with deg(v) wings is a sphere with deg(v) holes in the quotient by
 * its vertical period, a sheet is an annulus, so χ = Σ_v (2 − deg v) = 2V − 2E − W and the
 * quotient genus is E − V + 1 (torus, W = 0; in the plane E counts closed edges and the W wing
 * ends are boundary loops), as predicted in Chen–Traizet Thm 6.7 and Chen Thm 2.
 *
 * This is a schematic, not the minimal surface: ./relax.ts moves it to a discrete minimal surface.
 */
import type { PatternDocument } from '../types/pattern'
import { compilePattern, degree, halfEdgeDirection, halfEdgeVector, type PatternModel } from '../pattern/model'
import { checkOrientability } from '../pattern/orientability'
import { MeshBuilder, type Corner, type PeriodicMesh, type Periods } from './mesh'
import { parseSurfaceSettings, type SurfaceSettings, type SurfaceSettingsInput } from './options'
import { analyzeTopology, type MeshTopology } from './topology'
import { buildTowerCore } from './tower'

/** A pattern the schematic cannot be built for (the message says why). */
export class SurfaceInputError extends Error {
  constructor(message: string) { super(message); this.name = 'SurfaceInputError' }
}

/** The schematic mesh with what it was built from. */
export interface SchematicSurface {
  mesh: PeriodicMesh
  settings: SurfaceSettings
  /** Horizontal scale S: surface units per pattern unit. */
  scale: number
  /** Genus the pattern predicts for the quotient surface: E − V + 1 (E = closed edges). */
  predictedGenus: number
  /** Number of open ends (plane). */
  ends: number
  /** Tower phases ψ used (by vertex index). */
  psi: number[]
  /** Topology of the quotient mesh (its triangles are oriented consistently when it is orientable). */
  topology: MeshTopology
}

function ccwGap(from: number, to: number): number {
  let d = to - from
  while (d <= 0) d += 2 * Math.PI
  while (d > 2 * Math.PI) d -= 2 * Math.PI
  return d
}

/** Wing angles of vertex v in σ order, unwrapped to increase; throws on parallel wings or a wrong order. */
function wingAngles(m: PatternModel, v: number): number[] {
  const out: number[] = []
  const dir = new Float64Array(2)
  let total = 0
  for (let i = m.starStart[v]!; i < m.starStart[v + 1]!; i++) {
    halfEdgeDirection(m, m.positions, m.lattice, m.starHalf[i]!, dir)
    const a = Math.atan2(dir[1]!, dir[0]!)
    if (out.length === 0) { out.push(a); continue }
    const gap = ccwGap(out[out.length - 1]! % (2 * Math.PI), a)
    if (gap < 1e-9 || gap > 2 * Math.PI - 1e-9) throw new SurfaceInputError(`tower '${m.vertexIds[v]}' has two wings in one direction; the schematic needs distinct directions`)
    out.push(out[out.length - 1]! + gap)
    total += gap
  }
  total += ccwGap(out[out.length - 1]!, out[0]!)
  if (Math.abs(total - 2 * Math.PI) > 1e-6) throw new SurfaceInputError(`the drawn order of the wings at tower '${m.vertexIds[v]}' differs from the rotation system`)
  return out
}

/** Builds the schematic surface of a parsed pattern document. */
export function buildSchematic(doc: PatternDocument, input: SurfaceSettingsInput = {}): SchematicSurface {
  const settings = parseSurfaceSettings(input)
  const m = compilePattern(doc)
  const V = m.nVertices, E = m.nEdges, N = settings.rows
  for (let v = 0; v < V; v++) {
    const d = degree(m, v)
    if (d < 4 || d % 2 !== 0) throw new SurfaceInputError(`tower '${m.vertexIds[v]}' has ${d} wings; a saddle tower needs an even number, at least 4`)
  }
  if (m.space === 'torus' && m.nWings > 0) throw new SurfaceInputError('a torus pattern cannot have open wings')
  const vec = new Float64Array(2)
  let minLen = Infinity
  for (let e = 0; e < E; e++) {
    halfEdgeVector(m, m.positions, m.lattice, 2 * e, vec)
    minLen = Math.min(minLen, Math.hypot(vec[0]!, vec[1]!))
  }
  if (E > 0 && !(minLen > 0)) throw new SurfaceInputError('an edge has length 0')
  const S = E > 0 ? settings.edgeLength / minLen : 1
  const cutoff = Math.min(settings.cutoff, E > 0 ? 0.4 * settings.edgeLength : settings.cutoff, m.space === 'plane' ? settings.wingLength : Infinity)
  const orient = checkOrientability(m)
  const psi = Array.from(m.psi)
  const [a1, a2] = m.alpha
  const periods: Periods = m.space === 'torus'
    ? [[S * m.lattice.w1[0], S * m.lattice.w1[1], a1], [S * m.lattice.w2[0], S * m.lattice.w2[1], a2], [0, 0, 2 * Math.PI]]
    : [[0, 0, 0], [0, 0, 0], [0, 0, 2 * Math.PI]]
  const b = new MeshBuilder()

  // Towers: sector j is occupied first when its first wing points outwards (s = +1), so that the
  // sheets' sides agree across every edge of an orientable pattern; parity otherwise.
  const loopKey: ((j: number, r: number) => string)[] = []
  const slot = new Int32Array(m.nHalf)
  for (let v = 0; v < V; v++) {
    const start = m.starStart[v]!, d = degree(m, v)
    for (let j = 0; j < d; j++) slot[m.starHalf[start + j]!] = j
    const firstHalf = Array.from({ length: d }, (_, j) => orient.orientable ? orient.signs[m.starHalf[start + j]!]! > 0 : j % 2 === 0)
    loopKey.push(buildTowerCore(b, {
      prefix: `t${v}:`, owner: v, centre: [S * m.positions[2 * v]!, S * m.positions[2 * v + 1]!], psi: psi[v]!,
      angles: wingAngles(m, v), firstHalf, rows: N, radial: settings.radial, cutoff,
    }))
  }
  const spacing = settings.sheetSpacing * 2 * Math.PI / N
  const at = (i: number): [number, number, number] => b.point(i)

  // Closed edges: sheet from the loop of wing h at v to the loop of wing ιh at w (shift k_h).
  for (let e = 0; e < E; e++) {
    const h = 2 * e, v = m.vertexOf[h]!, w = m.vertexOf[h + 1]!
    const k1 = m.shift[2 * h]!, k2 = m.shift[2 * h + 1]!
    const s = Math.round(N * (psi[v]! - psi[w]! - k1 * a1 - k2 * a2) / (2 * Math.PI))
    const near = (r: number): Corner => [b.existing(loopKey[v]!(slot[h]!, mod(r, N))), 0, 0, Math.floor(r / N)]
    const far = (r: number): Corner => [b.existing(loopKey[w]!(slot[h + 1]!, mod(r + s, N))), k1, k2, Math.floor((r + s) / N)]
    const place = (c: Corner): [number, number, number] => {
      const p = at(c[0])
      return [0, 1, 2].map(d => p[d]! + c[1] * periods[0][d]! + c[2] * periods[1][d]! + c[3] * periods[2][d]!) as [number, number, number]
    }
    const p0 = place(near(0)), q0 = place(far(0))
    const K = Math.max(2, Math.ceil(Math.hypot(q0[0] - p0[0], q0[1] - p0[1]) / spacing))
    sheet(b, `e${e}:`, V + e, N, K, near, far, place)
  }
  // Open wings: a flat sheet to the cut at wingLength, held fixed there.
  for (let j = 0; j < m.nWings; j++) {
    const h = 2 * E + j, v = m.vertexOf[h]!
    const ux = m.wingDir[2 * j]!, uy = m.wingDir[2 * j + 1]!
    const near = (r: number): Corner => [b.existing(loopKey[v]!(slot[h]!, mod(r, N))), 0, 0, Math.floor(r / N)]
    const R = settings.wingLength
    if (R <= cutoff * 1.05) {
      for (let r = 0; r < N; r++) b.fix(near(r)[0])
      continue
    }
    const cx = S * m.positions[2 * v]!, cy = S * m.positions[2 * v + 1]!
    const outer = (r: number): Corner => [b.vertex(`w${j}:${mod(r, N)}`, cx + R * ux, cy + R * uy, psi[v]! + 2 * Math.PI * mod(r, N) / N, V + E + j, true), 0, 0, Math.floor(r / N)]
    const place = (c: Corner): [number, number, number] => { const p = at(c[0]); return [p[0], p[1], p[2] + 2 * Math.PI * c[3]] }
    const K = Math.max(2, Math.ceil((R - cutoff) / spacing))
    sheet(b, `w${j}:s`, V + E + j, N, K, near, outer, place)
  }
  const mesh = b.build(periods, [m.space === 'torus', m.space === 'torus', true])
  const topology = analyzeTopology(mesh)
  return { mesh, settings, scale: S, predictedGenus: E - V + 1, ends: m.nWings, psi, topology }
}

function mod(a: number, n: number): number { return ((a % n) + n) % n }

/** A strip of K columns between two loops of N rows (columns 1..K−1 interpolated linearly). */
function sheet(
  b: MeshBuilder, prefix: string, owner: number, N: number, K: number,
  near: (r: number) => Corner, far: (r: number) => Corner, place: (c: Corner) => [number, number, number],
): void {
  const inner: number[][] = []
  for (let c = 1; c < K; c++) {
    const col: number[] = []
    for (let r = 0; r < N; r++) {
      const p = place(near(r)), q = place(far(r)), t = c / K
      col.push(b.vertex(`${prefix}${c}:${r}`, p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1]), p[2] + t * (q[2] - p[2]), owner))
    }
    inner.push(col)
  }
  const corner = (c: number, r: number): Corner => {
    if (c === 0) return near(r)
    if (c === K) return far(r)
    return [inner[c - 1]![r % N]!, 0, 0, Math.floor(r / N)]
  }
  for (let r = 0; r < N; r++) {
    for (let c = 0; c < K; c++) b.quad(corner(c, r), corner(c + 1, r), corner(c + 1, r + 1), corner(c, r + 1))
  }
}
