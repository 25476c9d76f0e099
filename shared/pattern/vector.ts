/**
 * Loop-based reductions over arrays of any length (spreading a long array into Math.hypot or
 * Math.min overflows the call stack for large patterns).
 */

/** Euclidean norm. */
export function norm2(v: ArrayLike<number>): number {
  let s = 0
  for (let i = 0; i < v.length; i++) s += v[i]! * v[i]!
  return Math.sqrt(s)
}

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
