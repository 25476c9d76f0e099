/**
 * Small dense-vector helpers on arrays of any length (no allocation unless stated). Loop-based:
 * spreading a long array into Math.hypot or Math.min overflows the call stack for large patterns.
 */

/** Σ a_i b_i. */
export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0
  for (let i = 0; i < a.length; i++) s += a[i]! * b[i]!
  return s
}

/** Euclidean norm. */
export function norm2(a: ArrayLike<number>): number { return Math.sqrt(dot(a, a)) }

/** Smallest entry (Infinity when empty). */
export function minOf(v: ArrayLike<number>): number {
  let m = Infinity
  for (let i = 0; i < v.length; i++) if (v[i]! < m) m = v[i]!
  return m
}

/** Largest entry (−Infinity when empty). */
export function maxOf(v: ArrayLike<number>): number {
  let m = -Infinity
  for (let i = 0; i < v.length; i++) if (v[i]! > m) m = v[i]!
  return m
}

/** max |a_i|. */
export function normInf(a: ArrayLike<number>): number {
  let m = 0
  for (let i = 0; i < a.length; i++) { const v = Math.abs(a[i]!); if (v > m || Number.isNaN(v)) m = v }
  return m
}

/** New vector a + s·b. */
export function axpy(a: ArrayLike<number>, s: number, b: ArrayLike<number>): Float64Array {
  const r = new Float64Array(a.length)
  for (let i = 0; i < a.length; i++) r[i] = a[i]! + s * b[i]!
  return r
}

/** New vector a / |a|₂ (throws on a zero vector). */
export function normalized(a: ArrayLike<number>): Float64Array {
  const s = norm2(a)
  if (!(s > 0) || !Number.isFinite(s)) throw new Error('cannot normalise a zero or non-finite vector')
  const r = new Float64Array(a.length)
  for (let i = 0; i < a.length; i++) r[i] = a[i]! / s
  return r
}

/** Deterministic, well-spread unit start vector for inverse iterations (no RNG state). */
export function probeVector(n: number): Float64Array {
  const v = new Float64Array(n)
  for (let i = 0; i < n; i++) v[i] = 1 + 0.5 * Math.sin(1.7 + 2.3 * i) + 0.25 * Math.cos(0.37 * i * i)
  return normalized(v)
}

/** y = (u, λ) packed into one vector of length n+1. */
export function pack(u: ArrayLike<number>, lambda: number): Float64Array {
  const y = new Float64Array(u.length + 1)
  for (let i = 0; i < u.length; i++) y[i] = u[i]!
  y[u.length] = lambda
  return y
}
