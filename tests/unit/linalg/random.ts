import { TripletBuilder, type Triplets } from '../../../shared/linalg/triplets'

/** Seeded generator (mulberry32; T. Ettinger's public-domain PRNG, common practice). */
export function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Random sparse n×n matrix: a random diagonal plus about `perRow` off-diagonal entries per row. */
export function randomSparse(n: number, perRow: number, rnd: () => number, symmetric: boolean): Triplets {
  const b = new TripletBuilder(n, n)
  for (let i = 0; i < n; i++) b.add(i, i, 2 * rnd() - 1)
  for (let k = 0; k < n * perRow; k++) {
    const i = Math.floor(rnd() * n), j = Math.floor(rnd() * n)
    if (i === j) continue
    const v = 2 * rnd() - 1
    b.add(i, j, v)
    if (symmetric) b.add(j, i, v)
  }
  return b.build()
}

/** 5-point Laplacian of an m×m grid (Dirichlet), n = m² unknowns. */
export function gridLaplacian(m: number): Triplets {
  const n = m * m
  const b = new TripletBuilder(n, n, 5 * n)
  for (let r = 0; r < m; r++) {
    for (let c = 0; c < m; c++) {
      const i = r * m + c
      b.add(i, i, 4)
      if (c > 0) b.add(i, i - 1, -1)
      if (c < m - 1) b.add(i, i + 1, -1)
      if (r > 0) b.add(i, i - m, -1)
      if (r < m - 1) b.add(i, i + m, -1)
    }
  }
  return b.build()
}
