/**
 * The symmetric Karcher–Scherk saddle tower with 2n wings from its Weierstrass representation
 * (H. Karcher, "Embedded minimal surfaces derived from Scherk's examples", Manuscripta Math. 62,
 * 1988): on the sphere with 2n punctures at the 2n-th roots of unity ζ_k = e^{ikπ/n}, Gauss map
 * g = w^{n−1} and height differential dh = 2n i w^{n−1} dw / (w^{2n} − 1) (up to the orientation
 * of the parameter; residue ±i at each puncture, so the vertical period is 2π).
 *
 * Closed form (derived, by partial fractions 1/(w^{2n} − 1) = Σ_k (ζ_k / 2n) / (w − ζ_k)): with
 * ε_k = ζ_k^n = (−1)^k,
 *   X = x + i y = −Σ_k ζ_k ln|w − ζ_k|,   height h = Re H,   H(w) = −i Σ_k ε_k log(w − ζ_k),
 * and u = Im H = −Σ_k ε_k ln|w − ζ_k|. The map is conformal: with φ = ∂/∂w of (x, y, h),
 * (φ_x + iφ_y)(φ_x − iφ_y) = (Σ ζ_k/(w − ζ_k))(Σ ζ̄_k/(w − ζ_k)) = 4n² w^{2n−2}/(w^{2n} − 1)²
 * = −φ_h², so φ_x² + φ_y² + φ_h² = 0; its coordinates are harmonic, hence it is minimal. Near ζ_k,
 * X ≈ −ζ_k ln|w − ζ_k| → ∞ along ζ_k: wing k is asymptotic to the vertical half-plane at angle kπ/n.
 * Only h is multivalued (by 2π around each puncture), so the punctured sphere is one vertical
 * period of the tower, and (h, u) is a conformal chart away from the two saddles w = 0 and w = ∞
 * (zeros of dh of order n − 1, both on the axis X = 0, u = 0).
 *
 * Level curves: in the wedge W_j = {jπ/n < arg w < (j+1)π/n} the map H is a conformal bijection
 * onto a strip of height-width π; the curve h = t in W_j runs from puncture ζ_j to ζ_{j+1}, with u
 * monotone from ε_j·∞ to ε_{j+1}·∞. At the two saddle heights it degenerates to the rays of W_j's
 * sides through 0 (resp. ∞). Points are found by Newton's method on H(w) = t + iu, continued from
 * the wedge's bisector (H′ ≠ 0 inside the wedge), and on the rays by bisection in |w|.
 */

/** Complex number as [re, im]. */
export type Complex = [number, number]

/** Position (x, y) and chart value (h mod 2π in (−π, π], u) of the tower with 2n wings at w. */
export function karcherPoint(n: number, w: Complex): { x: number, y: number, h: number, u: number } {
  let x = 0, y = 0, h = 0, u = 0
  for (let k = 0; k < 2 * n; k++) {
    const c = Math.cos(k * Math.PI / n), s = Math.sin(k * Math.PI / n), e = k % 2 === 0 ? 1 : -1
    const dx = w[0] - c, dy = w[1] - s
    const l = 0.5 * Math.log(dx * dx + dy * dy)
    x -= c * l; y -= s * l; u -= e * l
    h += e * Math.atan2(dy, dx)
  }
  return { x, y, h: wrap(h), u }
}

/** H′(w) = −i Σ ε_k / (w − ζ_k). */
function dH(n: number, w: Complex): Complex {
  let re = 0, im = 0
  for (let k = 0; k < 2 * n; k++) {
    const e = k % 2 === 0 ? 1 : -1
    const dx = w[0] - Math.cos(k * Math.PI / n), dy = w[1] - Math.sin(k * Math.PI / n), q = dx * dx + dy * dy
    re += e * dx / q; im -= e * dy / q
  }
  return [im, -re]
}

/** Reduces an angle to (−π, π]. */
export function wrap(a: number): number {
  let r = a % (2 * Math.PI)
  if (r > Math.PI) r -= 2 * Math.PI
  if (r <= -Math.PI) r += 2 * Math.PI
  return r
}

/** Height of the saddle at w = 0 (mod 2π); the saddle at ∞ is π higher (see the tests). */
export function saddleHeight(n: number): number {
  return karcherPoint(n, [0, 0]).h
}

function inWedge(n: number, j: number, w: Complex): boolean {
  const a = Math.atan2(w[1], w[0]) - j * Math.PI / n
  const r = ((a % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)
  return r > 0 && r < Math.PI / n
}

/**
 * The point w of wedge W_j with H(w) = t + iu (t taken mod 2π), or null when Newton's method
 * fails; t must lie strictly inside the wedge's half period.
 */
export function solveInWedge(n: number, j: number, t: number, u: number): Complex | null {
  const b = (j + 0.5) * Math.PI / n
  let w: Complex = [Math.cos(b), Math.sin(b)]
  const p0 = karcherPoint(n, w)
  const dt = wrap(t - p0.h), du = u - p0.u
  const steps = 8 + Math.ceil(4 * Math.abs(du))
  for (let s = 1; s <= steps; s++) {
    const target: [number, number] = [p0.h + dt * s / steps, p0.u + du * s / steps]
    let ok = false
    for (let it = 0; it < 60; it++) {
      const p = karcherPoint(n, w)
      const rh = wrap(p.h - target[0]), ru = p.u - target[1]
      const res = Math.hypot(rh, ru)
      if (res < 1e-13) { ok = true; break }
      const d = dH(n, w), q = d[0] * d[0] + d[1] * d[1]
      // Newton: w ← w − (H − T)/H′.
      const sx = (rh * d[0] + ru * d[1]) / q, sy = (ru * d[0] - rh * d[1]) / q
      let lam = 1, next: Complex = w
      for (let k = 0; k < 30; k++, lam /= 2) {
        next = [w[0] - lam * sx, w[1] - lam * sy]
        if (!inWedge(n, j, next)) continue
        const pn = karcherPoint(n, next)
        if (Math.hypot(wrap(pn.h - target[0]), pn.u - target[1]) < res) break
      }
      if (next === w || !inWedge(n, j, next)) break
      w = next
    }
    if (!ok && s === steps) return null
  }
  return w
}

/**
 * The point of the ray from w = 0 (`outer` false) or from w = ∞ (`outer` true) to puncture ζ_k
 * where u = ε_k·s, s ≥ 0 (s = 0: the saddle itself; returned as [0, 0] or null for ∞).
 */
export function solveOnRay(n: number, k: number, s: number, outer: boolean): Complex | null {
  const e = k % 2 === 0 ? 1 : -1
  const c = Math.cos(k * Math.PI / n), sn = Math.sin(k * Math.PI / n)
  if (s === 0) return outer ? null : [0, 0]
  // ρ ∈ (0, 1): w = ρ ζ_k (inner) or w = ζ_k / ρ (outer); ε_k u grows from 0 to ∞ as ρ → 1.
  let lo = 0, hi = 1
  for (let it = 0; it < 200 && hi - lo > 1e-16; it++) {
    const rho = (lo + hi) / 2, r = outer ? 1 / rho : rho
    if (e * karcherPoint(n, [r * c, r * sn]).u < s) lo = rho
    else hi = rho
  }
  const rho = (lo + hi) / 2, r = outer ? 1 / rho : rho
  return [r * c, r * sn]
}
