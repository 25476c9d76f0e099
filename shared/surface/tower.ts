/**
 * The core of one saddle tower in the schematic surface, from Scherk's singly periodic tower
 *   sin z = sinh x sinh y
 * (H. F. Scherk, "Bemerkungen über die kleinste Fläche innerhalb gegebener Grenzen", J. reine
 * angew. Math. 13, 1835), which is the four-wing member of the Karcher–Scherk saddle towers
 * (H. Karcher, "Embedded minimal surfaces derived from Scherk's examples", Manuscripta Math. 62,
 * 1988). A tower with 2n wings has 2n sectors between consecutive wings (counter-clockwise order
 * σ); sector j is occupied during one half period and empty during the other, alternately, and in
 * its own quarter-plane coordinates (a, b) ≥ 0 (a along wing j, b along wing j+1) it is the Scherk
 * curve sinh a sinh b = |sin t|, t = z − ψ. Each sector's quarter plane is bent onto the actual
 * sector angle β_j by scaling the polar angle by β_j/(π/2): exact Scherk for four orthogonal
 * wings, a schematic otherwise (the relaxation then moves it towards a minimal surface).
 *
 * The curve is parametrised by μ = a − b ∈ [−M, M]: with σ = arcosh(2s + cosh μ),
 * a = (σ + μ)/2, b = (σ − μ)/2 solves sinh a sinh b = (cosh σ − cosh μ)/2 = s (derived from
 * sinh a sinh b = (cosh(a + b) − cosh(a − b))/2). At s = 0 (t = 0, π) it is the two rays, and the
 * 2n rays meet at the tower's centre: the tower's two saddle points per period, at heights ψ and
 * ψ + π. The points at μ = ±M form, for each wing, a closed loop over one period: where the
 * wing's vertical sheet starts.
 */
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
  /** Cut-off |μ| ≤ M. */
  cutoff: number
}

/** Horizontal point of sector coordinates (a, b) in the sector from angle θ of width β, relative to the centre. */
export function sectorPoint(a: number, b: number, theta: number, beta: number): [number, number] {
  const rho = Math.hypot(a, b)
  const ang = theta + Math.atan2(b, a) * beta / (Math.PI / 2)
  return [rho * Math.cos(ang), rho * Math.sin(ang)]
}

/** Scherk's curve sinh a sinh b = s at μ = a − b (see the header). */
export function scherkCurve(s: number, mu: number): [a: number, b: number] {
  const sig = Math.acosh(2 * s + Math.cosh(mu))
  return [(sig + mu) / 2, Math.max(0, (sig - mu) / 2)]
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
  for (let j = 0; j < d; j++) {
    const theta = t.angles[j]!
    const beta = (j + 1 < d ? t.angles[j + 1]! : t.angles[0]! + 2 * Math.PI) - theta
    const r0 = t.firstHalf[j] ? 0 : half
    const idx: number[][] = []
    for (let r = r0; r <= r0 + half; r++) {
      const s = r % half === 0 ? 0 : Math.abs(Math.sin(2 * Math.PI * r / N))
      const row: number[] = []
      for (let i = -m; i <= m; i++) {
        const [a, bb] = scherkCurve(s, t.cutoff * i / m)
        const [x, y] = sectorPoint(a, bb, theta, beta)
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
