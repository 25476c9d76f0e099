/**
 * Is the drawing a straight embedding as the gluing theorems assume (H. Chen, M. Traizet,
 * arXiv 2103.15676, 2021, Assumption 3.2; H. Chen, Comm. Anal. Geom. 32, 2024, §2.1)? Vertex
 * points distinct (modulo the lattice in the torus); the two edges of a face with two half-edges
 * drawn on one segment; all other closed edges with disjoint interiors (no crossing, no vertex on
 * an edge's interior); in the plane the open wings too, as rays cut at the bounding box of the
 * vertices enlarged by its diameter (parallel wings are allowed; two rays meeting farther out are
 * not seen). Pairs are found by a uniform grid over the fundamental cell with the lattice copies
 * (segment-grid.ts), so the cost grows about linearly with the size, not quadratically.
 * Tolerances are relative to the mean edge length.
 */
import { computeFaces } from './combinatorics'
import { edgeVectors, meanEdgeLength } from './geometry'
import type { Lattice, PatternModel } from './model'
import { cellKey, forEachCandidatePair, type GridFrame, type GridSegment } from './segment-grid'

/** Outcome: ok, or the first offending pairs (up to `limit`, default 10). */
export interface StraightDrawingCheck {
  ok: boolean
  /** Always true: every size is checked (kept for the checklist, which reads it). */
  checked: boolean
  coincidentVertices: [number, number][]
  /** Closed-edge pairs [e, f], e ≤ f (f = e: the edge meets its own lattice translate). */
  crossings: [number, number][]
  /** Open wings meeting a closed edge or another wing (plane). */
  wingCrossings: { wing: number, edge?: number, otherWing?: number }[]
}

const cross = (ax: number, ay: number, bx: number, by: number) => ax * by - ay * bx

/** Do the interiors of segments a0 + s·a (s ∈ [0,1]) and b0 + t·b meet (endpoints shared by both are allowed)? */
export function interiorsMeet(a0x: number, a0y: number, ax: number, ay: number, b0x: number, b0y: number, bx: number, by: number, eps: number): boolean {
  const d = cross(ax, ay, bx, by)
  const wx = b0x - a0x, wy = b0y - a0y
  const la = Math.sqrt(ax * ax + ay * ay), lb = Math.sqrt(bx * bx + by * by)
  if (Math.abs(d) <= eps * la * lb) {
    // parallel: collinear overlap of positive length?
    if (Math.abs(cross(wx, wy, ax, ay)) > eps * la * Math.max(la, lb)) return false
    const t0 = (wx * ax + wy * ay) / (la * la), t1 = t0 + (bx * ax + by * ay) / (la * la)
    const lo = Math.max(0, Math.min(t0, t1)), hi = Math.min(1, Math.max(t0, t1))
    return (hi - lo) * la > eps * Math.max(la, lb)
  }
  const s = cross(wx, wy, bx, by) / d, t = cross(wx, wy, ax, ay) / d
  const ea = eps * Math.max(la, lb) / la, eb = eps * Math.max(la, lb) / lb
  if (s < -ea || s > 1 + ea || t < -eb || t > 1 + eb) return false
  const sEnd = s <= ea || s >= 1 - ea, tEnd = t <= eb || t >= 1 - eb
  return !(sEnd && tEnd)
}

/** Median of the values (0 for none). */
function median(xs: number[]): number {
  if (!xs.length) return 0
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]!
}

/**
 * The grid frame of the drawing, cells about as long as the median segment (at most ~4 per segment
 * or point in all): lattice coordinates × (n1, n2) in the torus, a plane frame in the plane. The
 * origin is offset by an irrational fraction of a cell so that points on a regular lattice do not
 * fall on cell borders.
 */
function frameOf(torus: boolean, lat: Lattice, segs: GridSegment[], points: [number, number][]): GridFrame {
  const lengths = segs.map(g => Math.hypot(g.dx, g.dy)).filter(l => l > 0)
  const maxCells = 4 * (segs.length + points.length) + 16
  const o1 = 0.3819660112501051, o2 = 0.6180339887498949 // 1 − 1/φ, 1/φ
  if (torus) {
    const [w1, w2] = [lat.w1, lat.w2]
    const det = w1[0] * w2[1] - w1[1] * w2[0]
    const h = median(lengths) || Math.sqrt(Math.abs(det) / Math.max(1, points.length))
    const l1 = Math.hypot(...w1), l2 = Math.hypot(...w2)
    let n1 = Math.max(1, Math.floor(l1 / h)), n2 = Math.max(1, Math.floor(l2 / h))
    while (n1 * n2 > maxCells) { n1 = Math.max(1, Math.floor(n1 / 2)); n2 = Math.max(1, Math.floor(n2 / 2)) }
    return { period: [n1, n2], toGrid: (x, y) => [((x * w2[1] - y * w2[0]) / det) * n1 + o1, ((w1[0] * y - w1[1] * x) / det) * n2 + o2] }
  }
  let ox = Infinity, oy = Infinity, hx = -Infinity, hy = -Infinity
  for (const g of segs) { ox = Math.min(ox, g.ax, g.ax + g.dx); oy = Math.min(oy, g.ay, g.ay + g.dy); hx = Math.max(hx, g.ax, g.ax + g.dx); hy = Math.max(hy, g.ay, g.ay + g.dy) }
  for (const [x, y] of points) { ox = Math.min(ox, x); oy = Math.min(oy, y); hx = Math.max(hx, x); hy = Math.max(hy, y) }
  if (!Number.isFinite(ox)) { ox = 0; oy = 0; hx = 1; hy = 1 }
  let h = median(lengths) || 1
  while (((hx - ox) / h + 1) * ((hy - oy) / h + 1) > maxCells) h *= 2
  return { period: [0, 0], toGrid: (x, y) => [(x - ox) / h + o1, (y - oy) / h + o2] }
}

/** Vertex pairs at distance ≤ tol (modulo the lattice), by the grid: neighbours within one cell. */
function coincidentPairs(points: [number, number][], frame: GridFrame, lat: Lattice, tol: number): [number, number][] {
  const [n1, n2] = frame.period
  const wrap = (cx: number, cy: number): [number, number, number, number] => {
    const k1 = n1 ? Math.floor(cx / n1) : 0, k2 = n2 ? Math.floor(cy / n2) : 0
    return [cx - k1 * n1, cy - k2 * n2, k1, k2]
  }
  const cell = new Map<number, number[]>() // per wrapped cell: vertex, wrap offsets
  const at = points.map(([x, y], v) => {
    const [gx, gy] = frame.toGrid(x, y)
    const cx = Math.floor(gx), cy = Math.floor(gy)
    const [bx, by, o1, o2] = wrap(cx, cy)
    const key = cellKey(bx, by)
    const list = cell.get(key) ?? []
    list.push(v, o1, o2); cell.set(key, list)
    return [cx, cy] as const
  })
  const out: [number, number][] = []
  points.forEach(([x, y], v) => {
    const [cx, cy] = at[v]!
    for (let ox = -1; ox <= 1; ox++) {
      for (let oy = -1; oy <= 1; oy++) {
        const [bx, by, k1, k2] = wrap(cx + ox, cy + oy)
        const list = cell.get(cellKey(bx, by)) ?? []
        for (let i = 0; i < list.length; i += 3) {
          const w = list[i]!
          if (w <= v) continue
          // the copy of w in the neighbouring (unwrapped) cell
          const s1 = k1 - list[i + 1]!, s2 = k2 - list[i + 2]!
          const wx = points[w]![0] + s1 * lat.w1[0] + s2 * lat.w2[0], wy = points[w]![1] + s1 * lat.w1[1] + s2 * lat.w2[1]
          if (Math.hypot(wx - x, wy - y) <= tol) out.push([v, w])
        }
      }
    }
  })
  return [...new Map(out.map(pr => [`${pr[0]},${pr[1]}`, pr])).values()].sort((a, b) => a[0] - b[0] || a[1] - b[1])
}

/** Checks the straight drawing (p, lat) of a model, at every size; reports the first `limit` pairs of each kind. */
export function checkStraightDrawing(m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice, eps = 1e-9, limit = 10): StraightDrawingCheck {
  const E = m.nEdges, V = m.nVertices, W = m.space === 'plane' ? m.nWings : 0
  const torus = m.space === 'torus'
  const scale = meanEdgeLength(m, p, lat)
  const x = edgeVectors(m, p, lat)
  const [w1, w2] = [lat.w1, lat.w2]
  const det = w1[0] * w2[1] - w1[1] * w2[0]
  // torus: each point moved into the fundamental cell (lattice coordinates in [0, 1)²)
  const reduce = (px: number, py: number): [number, number] => {
    if (!torus) return [px, py]
    const a = Math.floor((px * w2[1] - py * w2[0]) / det), b = Math.floor((w1[0] * py - w1[1] * px) / det)
    return [px - a * w1[0] - b * w2[0], py - a * w1[1] - b * w2[1]]
  }
  const points = Array.from({ length: V }, (_, v) => reduce(p[2 * v]!, p[2 * v + 1]!))
  const segs: GridSegment[] = []
  for (let e = 0; e < E; e++) {
    const [ax, ay] = reduce(p[2 * m.edgeFrom[e]!]!, p[2 * m.edgeFrom[e]! + 1]!)
    segs.push({ ax, ay, dx: x[2 * e]!, dy: x[2 * e + 1]! })
  }
  if (W) {
    // wings: rays from their vertex, cut at the vertices' bounding box enlarged by its diameter
    let lx = Infinity, ly = Infinity, hx = -Infinity, hy = -Infinity
    for (const [px, py] of points) { lx = Math.min(lx, px); ly = Math.min(ly, py); hx = Math.max(hx, px); hy = Math.max(hy, py) }
    const grow = Math.hypot(hx - lx, hy - ly) || scale
    lx -= grow; ly -= grow; hx += grow; hy += grow
    for (let j = 0; j < W; j++) {
      const v = m.vertexOf[2 * E + j]!
      const [ax, ay] = points[v]!
      const ux = m.wingDir[2 * j]!, uy = m.wingDir[2 * j + 1]!
      const tx = ux > 0 ? (hx - ax) / ux : ux < 0 ? (lx - ax) / ux : Infinity
      const ty = uy > 0 ? (hy - ay) / uy : uy < 0 ? (ly - ay) / uy : Infinity
      const t = Math.min(tx, ty)
      segs.push({ ax, ay, dx: t * ux, dy: t * uy })
    }
  }
  const frame = frameOf(torus, lat, segs, points)
  const out: StraightDrawingCheck = { ok: true, checked: true, coincidentVertices: coincidentPairs(points, frame, lat, eps * scale).slice(0, limit), crossings: [], wingCrossings: [] }
  // the two edges of a face with two half-edges may share their segment
  const faces = computeFaces(m)
  const partner = new Int32Array(E).fill(-1)
  for (const c of faces.cycles) if (c.length === 2) { partner[c[0]! >> 1] = c[1]! >> 1; partner[c[1]! >> 1] = c[0]! >> 1 }
  const edgePairs = new Set<string>()
  const wingPairs = new Set<string>()
  forEachCandidatePair(segs, frame, (i, j, k1, k2) => {
    const a = segs[i]!, b = segs[j]!
    const sx = k1 * w1[0] + k2 * w2[0], sy = k1 * w1[1] + k2 * w2[1]
    if (!interiorsMeet(a.ax, a.ay, a.dx, a.dy, b.ax + sx, b.ay + sy, b.dx, b.dy, eps)) return
    if (j < E) {
      if (partner[i] === j && sameSegment(a.ax, a.ay, a.dx, a.dy, b.ax + sx, b.ay + sy, b.dx, b.dy, eps * scale)) return
      edgePairs.add(`${i},${j}`)
    } else {
      wingPairs.add(`${i},${j}`)
    }
  })
  out.crossings = [...edgePairs].map(k => k.split(',').map(Number) as [number, number]).sort((a, b) => a[0] - b[0] || a[1] - b[1]).slice(0, limit)
  out.wingCrossings = [...wingPairs].map(k => k.split(',').map(Number) as [number, number]).sort((a, b) => a[0] - b[0] || a[1] - b[1]).slice(0, limit)
    .map(([i, j]) => (i < E ? { wing: j - E, edge: i } : { wing: i - E, otherWing: j - E }))
  out.ok = out.coincidentVertices.length === 0 && out.crossings.length === 0 && out.wingCrossings.length === 0
  return out
}

/** The two segments are the same point set (either orientation). */
function sameSegment(ax: number, ay: number, ux: number, uy: number, bx: number, by: number, vx: number, vy: number, tol: number): boolean {
  const d = (x1: number, y1: number, x2: number, y2: number) => Math.hypot(x1 - x2, y1 - y2) <= tol
  return (d(ax, ay, bx, by) && d(ax + ux, ay + uy, bx + vx, by + vy)) || (d(ax, ay, bx + vx, by + vy) && d(ax + ux, ay + uy, bx, by))
}
