/**
 * Removal of pinned unknowns: the family problems pin the first vertex (translations or the
 * global phase), so the first `k` rows and columns of a full Jacobian are dropped and the rest
 * shifted by k. The triplet pattern stays the same from call to call (the solver reuses it).
 */
import { TripletBuilder, type Triplets } from '../linalg/triplets'

/** Copies the entries of `t` with row ≥ k and col ≥ k into `b`, shifted by −k. */
export function addTrailingBlock(t: Triplets, k: number, b: TripletBuilder): void {
  for (let i = 0; i < t.count; i++) {
    const r = t.rows[i]!, c = t.cols[i]!
    if (r >= k && c >= k) b.add(r - k, c - k, t.values[i]!)
  }
}

/** The trailing (n − k) × (n − k) block of the square matrix `t`. */
export function trailingBlock(t: Triplets, k: number): Triplets {
  const b = new TripletBuilder(t.nRows - k, t.nCols - k, t.count)
  addTrailingBlock(t, k, b)
  return b.build()
}
