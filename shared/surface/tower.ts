/**
 * The core of one saddle tower in the schematic surface: the symmetric Karcher–Scherk tower with
 * 2n wings from its Weierstrass data (H. Karcher, "Embedded minimal surfaces derived from
 * Scherk's examples", Manuscripta Math. 62, 1988; ./karcher.ts), whose four-wing member is
 * Scherk's tower sin z = sinh x sinh y (H. F. Scherk, J. reine angew. Math. 13, 1835). The tower
 * has 2n sectors between consecutive wings (counter-clockwise order σ); sector j is occupied
 * during one half period and empty during the other, alternately. In sector j the mesh has rows
 * of constant height t = z − ψ (the level curves h = t of the Weierstrass chart) and columns of
 * constant u = Im H ∈ [−M, M] (the conjugate harmonic coordinate, ≈ the distance along the wing
 * far out), so rows and columns are the images of a conformal grid. At the two saddle heights
 * (ψ and ψ + π) the rows are the 2n rays from the axis to the wings. The points at |u| = M form,
 * for each wing, a closed loop over one period: where the wing's vertical sheet starts.
 *
 * Wing directions: the symmetric tower's wings are at θ_0 + kπ/n; when the actual wings are not
 * equally spaced, every horizontal point is bent by mapping its polar angle piecewise linearly
 * (./tower.ts `bendPoint`), which keeps heights and radii. This is exact (a rotation) for equally
 * spaced wings and a schematic otherwise.
 */
import { karcherPoint, saddleHeight, solveInWedge, solveOnRay, type Complex } from './karcher'
import type { MeshBuilder } from './mesh'

/** Input of {@link buildTowerCore}. */
export interface TowerSpec {
  /** Key prefix, unique per tower. */
  prefix: string
  /** Owner tag of the vertices (the pattern vertex index). */
  owner: number
  centre: [number, number]
  /** Phase ψ: height of the tower's lower saddle. */
  psi: number
  /** Wing angles in σ order, strictly increasing, spanning less than 2π: θ_0 < θ_1 < … < θ_0 + 2π. */
  angles: number[]
  /** Per sector j (between wing j and j+1): occupied during the first half period [ψ, ψ + π]. */
  firstHalf: boolean[]
  /** Rows per vertical period (even). */
  rows: number
  /** Columns on each side of μ = 0. */
  radial: number
  /** Cut-off |u| ≤ M (u the conjugate coordinate of ./karcher.ts, about the distance along the wing). */
  cutoff: number
}

/**
 * Bends a horizontal point of the symmetric tower (wings at kπ/n) onto the actual wing angles:
 * the polar angle φ in [kπ/n, (k+1)π/n] goes linearly onto [θ_k, θ_{k+1}], the radius is kept.
 * A rotation when the actual wings are equally spaced; otherwise the schematic's only
 * approximation (the relaxation then moves it towards a minimal surface).
 */
export function bendPoint(x: number, y: number, angles: number[]): [number, number] {
  const d = angles.length, step = 2 * Math.PI / d
  const rho = Math.hypot(x, y)
  if (rho === 0) return [0, 0]
  let phi = Math.atan2(y, x)
  if (phi < 0) phi += 2 * Math.PI
  const k = Math.min(d - 1, Math.floor(phi / step))
  const beta = (k + 1 < d ? angles[k + 1]! : angles[0]! + 2 * Math.PI) - angles[k]!
  const ang = angles[k]! + (phi - k * step) * beta / step
  return [rho * Math.cos(ang), rho * Math.sin(ang)]
}

/** Builds the tower core into `b`; returns the key of wing j's cut-off loop at row r (0 ≤ r < rows). */
export function buildTowerCore(b: MeshBuilder, t: TowerSpec): (j: number, r: number) => string {
  const d = t.angles.length, N = t.rows, m = t.radial, half = N / 2, p = t.prefix
  const key = (j: number, r: number, i: number): string => {
    if (r % half === 0) {
      const rr = r % N
      if (i === 0) return `${p}c:${rr}`
      return i > 0 ? `${p}r${j}:${rr}:${i}` : `${p}r${(j + 1) % d}:${rr}:${-i}`
    }
    return `${p}s${j}:${r}:${i}`
  }
  const n = d / 2
  for (let j = 0; j < d; j++) {
    if (t.firstHalf[j] === t.firstHalf[(j + 1) % d]) throw new Error('surface tower: sectors must alternate between the two half periods')
  }
  // Option A (sector 0 first): the saddle at w = ∞ is the lower one, at ψ, and the even wedges
  // fill the half period above it; otherwise the saddle at w = 0 is at ψ (./karcher.ts).
  const lowerAtInfinity = t.firstHalf[0]!
  const core = symmetricCore(n, N, m, t.cutoff, lowerAtInfinity)
  const place = (j: number, r: number, i: number): [number, number] => {
    const o = 2 * ((j * (N + 1) + r) * (2 * m + 1) + i + m)
    return bendPoint(core[o]!, core[o + 1]!, t.angles)
  }
  for (let j = 0; j < d; j++) {
    const r0 = t.firstHalf[j] ? 0 : half
    const idx: number[][] = []
    for (let r = r0; r <= r0 + half; r++) {
      const row: number[] = []
      for (let i = -m; i <= m; i++) {
        const [x, y] = place(j, r, i)
        // Points at r = N are the row-0 points one period up: stored at row 0's height.
        const z = t.psi + 2 * Math.PI * (r % N) / N
        row.push(b.vertex(key(j, r, i), t.centre[0] + x, t.centre[1] + y, z, t.owner))
      }
      idx.push(row)
    }
    for (let r = 0; r < half; r++) {
      const k3a = Math.floor((r0 + r) / N), k3b = Math.floor((r0 + r + 1) / N)
      for (let i = 0; i < 2 * m; i++) {
        b.quad([idx[r]![i]!, 0, 0, k3a], [idx[r]![i + 1]!, 0, 0, k3a], [idx[r + 1]![i + 1]!, 0, 0, k3b], [idx[r + 1]![i]!, 0, 0, k3b])
      }
    }
  }
  return (j: number, r: number): string => {
    if (r % half === 0) return `${p}r${j}:${r % N}:${m}`
    const inFirst = r < half
    const own = t.firstHalf[j] === inFirst
    return own ? `${p}s${j}:${r}:${m}` : `${p}s${(j - 1 + d) % d}:${r}:${-m}`
  }
}

const cores = new Map<string, Float64Array>()

/**
 * Horizontal points (x, y) of the symmetric 2n-wing tower at sector j, row r (0 ≤ r ≤ rows) and
 * column i (−m ≤ i ≤ m), computed once per (n, rows, m, cutoff, which saddle is lower): every
 * tower of that degree shares them before bending. Rows outside sector j's half period stay 0.
 */
function symmetricCore(n: number, N: number, m: number, cutoff: number, lowerAtInfinity: boolean): Float64Array {
  const id = `${n}:${N}:${m}:${cutoff}:${lowerAtInfinity}`
  const found = cores.get(id)
  if (found) return found
  const d = 2 * n, half = N / 2
  const h0 = saddleHeight(n), hBase = lowerAtInfinity ? h0 - Math.PI : h0
  const out = new Float64Array(2 * d * (N + 1) * (2 * m + 1))
  for (let j = 0; j < d; j++) {
    const r0 = (j % 2 === 0) === lowerAtInfinity ? 0 : half
    for (let r = r0; r <= r0 + half; r++) {
      for (let i = -m; i <= m; i++) {
        const u = (j % 2 === 0 ? 1 : -1) * cutoff * i / m
        let w: Complex | null
        if (r % half === 0) {
          const outer = (r % N === 0) === lowerAtInfinity
          if (i === 0) continue
          w = i > 0 ? solveOnRay(n, j, Math.abs(u), outer) : solveOnRay(n, (j + 1) % d, Math.abs(u), outer)
        } else {
          w = solveInWedge(n, j, hBase + 2 * Math.PI * r / N, u)
        }
        if (!w) throw new Error(`surface tower: no point of the ${d}-wing tower at row ${r}, column ${i}`)
        const p = karcherPoint(n, w)
        const o = 2 * ((j * (N + 1) + r) * (2 * m + 1) + i + m)
        out[o] = p.x; out[o + 1] = p.y
      }
    }
  }
  if (cores.size > 32) cores.clear()
  cores.set(id, out)
  return out
}
