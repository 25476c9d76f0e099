/**
 * Candidate pairs of segments that may meet, by a uniform grid (bucketing, e.g. M. de Berg et al.,
 * Computational Geometry, 3rd ed. 2008, §14 notes; J. L. Bentley, D. F. Stanat, E. H. Williams,
 * "The complexity of finding fixed-radius near neighbors", IPL 6, 1977). Points are mapped to grid
 * coordinates by an affine map g (the lattice coordinates × n in the torus, so the grid is periodic
 * with period n in both directions; a scaled plane frame in the plane). An affine map keeps
 * segments straight, so the cells a segment passes through are found in grid coordinates: every
 * segment is entered in each cell it may touch, with the period offset of that cell, and two
 * entries of one cell give the candidate (i, j, shift). Cost O(S + cells touched + pairs per cell):
 * linear for drawings whose edges are about as long as the grid spacing, instead of O(S²).
 */

/** One segment a + t·d, t ∈ [0, 1], in the plane (torus: a lattice translate of the edge). */
export interface GridSegment { ax: number; ay: number; dx: number; dy: number }

/** The grid frame: point → grid coordinates, and the periods (0 in the plane). */
export interface GridFrame {
  toGrid(x: number, y: number): [number, number]
  /** Cells per lattice period along ω1 and ω2 (torus), 0 in the plane. */
  period: [number, number]
}

/** Numeric key of an integer cell (|cx|, |cy| < 2^20). */
const OFF = 2 ** 20
export const cellKey = (cx: number, cy: number): number => (cx + OFF) * 2 ** 21 + (cy + OFF)

/**
 * The cells a segment may touch (unwrapped integer indices), with a margin of `pad` cells: the
 * segment is cut into k pieces spanning at most one cell in each direction, and each piece's
 * bounding box (at most 2 × 2 cells, 3 × 3 with the margin) is visited; a cell is visited once.
 */
function cellsOf(x0: number, y0: number, x1: number, y1: number, pad: number, visit: (cx: number, cy: number) => void): void {
  const k = Math.max(1, Math.ceil(Math.max(Math.abs(x1 - x0), Math.abs(y1 - y0))))
  const seen = k > 1 ? new Set<number>() : undefined
  for (let s = 0; s < k; s++) {
    const ax = x0 + (s / k) * (x1 - x0), ay = y0 + (s / k) * (y1 - y0)
    const bx = x0 + ((s + 1) / k) * (x1 - x0), by = y0 + ((s + 1) / k) * (y1 - y0)
    const lx = Math.floor(Math.min(ax, bx) - pad), hx = Math.floor(Math.max(ax, bx) + pad)
    const ly = Math.floor(Math.min(ay, by) - pad), hy = Math.floor(Math.max(ay, by) + pad)
    for (let cx = lx; cx <= hx; cx++) {
      for (let cy = ly; cy <= hy; cy++) {
        if (seen) { const key = cellKey(cx, cy); if (seen.has(key)) continue; seen.add(key) }
        visit(cx, cy)
      }
    }
  }
}

/**
 * Calls `visit(i, j, k1, k2)` for every pair whose segments' grid cells meet, each once (i ≤ j;
 * for i = j only non-zero shifts): segment j translated by k1·ω1 + k2·ω2 may meet segment i (in
 * the plane the shift is (0, 0)). A pair that meets is always visited.
 */
export function forEachCandidatePair(segs: GridSegment[], frame: GridFrame, visit: (i: number, j: number, k1: number, k2: number) => void): void {
  const [n1, n2] = frame.period
  const cells = new Map<number, number[]>() // per cell: segment, o1, o2 triples
  for (let s = 0; s < segs.length; s++) {
    const g = segs[s]!
    const [x0, y0] = frame.toGrid(g.ax, g.ay)
    const [x1, y1] = frame.toGrid(g.ax + g.dx, g.ay + g.dy)
    cellsOf(x0, y0, x1, y1, 1e-9, (cx, cy) => {
      const o1 = n1 ? Math.floor(cx / n1) : 0, o2 = n2 ? Math.floor(cy / n2) : 0
      const key = cellKey(cx - o1 * n1, cy - o2 * n2)
      let list = cells.get(key)
      if (!list) { list = []; cells.set(key, list) }
      list.push(s, o1, o2)
    })
  }
  const S = segs.length
  const seen = new Set<number>()
  for (const list of cells.values()) {
    for (let a = 0; a < list.length; a += 3) {
      for (let b = a + 3; b < list.length; b += 3) {
        let pi = a, qi = b
        if (list[pi]! > list[qi]!) { pi = b; qi = a }
        const i = list[pi]!, j = list[qi]!
        // i's copy shifted by −o_i and j's by −o_j share the base cell: j shifted by o_i − o_j
        let k1 = list[pi + 1]! - list[qi + 1]!, k2 = list[pi + 2]! - list[qi + 2]!
        if (i === j) {
          if (k1 === 0 && k2 === 0) continue
          if (k1 < 0 || (k1 === 0 && k2 < 0)) { k1 = -k1; k2 = -k2 } // a self pair once per ± shift
        }
        const key = ((i * S + j) * 1024 + (k1 + 512)) * 1024 + (k2 + 512)
        if (seen.has(key)) continue
        seen.add(key)
        visit(i, j, k1, k2)
      }
    }
  }
}
