/**
 * Outward rounding without rounding modes. JavaScript only rounds to nearest, so every interval
 * bound is pushed one floating-point neighbour outward after the operation:
 *   succ(c) = c + max(η, φ·|c|),  pred(c) = c − max(η, φ·|c|),  φ = 2⁻⁵³(1 + 2⁻⁵²), η = 2⁻¹⁰⁷⁴,
 * evaluated in round-to-nearest (S. M. Rump, P. Zimmermann, S. Boldo, G. Melquiond, "Computing
 * predecessor and successor in rounding to nearest", BIT Numer. Math. 49, 2009, Algorithm 2:
 * the result is the neighbour or, rarely, the one after it — always outward, never inward).
 * +, −, ×, ÷ and sqrt are correctly rounded (IEEE 754), so one neighbour outward encloses the
 * exact result. Branch-free and allocation-free: used in the hot loops of the certificate.
 */

/** φ = 2⁻⁵³(1 + 2⁻⁵²). */
const PHI = 2 ** -53 * (1 + 2 ** -52)
/** η = 2⁻¹⁰⁷⁴, the smallest positive subnormal. */
const ETA = 2 ** -1074

/** A double ≥ the neighbour of c above it (c itself for +∞, NaN stays NaN). */
export function succ(c: number): number {
  return c + Math.max(ETA, PHI * Math.abs(c))
}

/** A double ≤ the neighbour of c below it. */
export function pred(c: number): number {
  return c - Math.max(ETA, PHI * Math.abs(c))
}

/** Unit roundoff u = 2⁻⁵³ of binary64. */
export const UNIT_ROUNDOFF = 2 ** -53

/**
 * γ_m = m·u / (1 − m·u), rounded up: |fl(Σ_{i≤m} a_i b_i) − Σ a_i b_i| ≤ γ_m Σ |a_i b_i| for
 * recursive summation without underflow (N. J. Higham, Accuracy and Stability of Numerical
 * Algorithms, 2nd ed., 2002, §3.1, (3.5)). Used for the dot products of the certificate.
 */
export function gamma(m: number): number {
  const mu = m * UNIT_ROUNDOFF
  if (!(mu < 0.5)) return Infinity
  return succ(succ(mu) / pred(1 - mu))
}

/** Absolute underflow allowance per product (half the smallest subnormal, rounded up). */
export const UNDERFLOW_PER_TERM = ETA
