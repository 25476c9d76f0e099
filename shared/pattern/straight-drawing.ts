/**
 * Is the drawing a straight embedding as the gluing theorems assume (H. Chen, M. Traizet,
 * arXiv 2103.15676, 2021, Assumption 3.2; H. Chen, Comm. Anal. Geom. 32, 2024, §2.1)? Vertex
 * points distinct (modulo the lattice in the torus); the two edges of a face with two half-edges
 * drawn on one segment; all other closed edges with disjoint interiors (no crossing, no vertex on
 * an edge's interior). Segments are compared with their lattice translates within the range the
 * longest edge can reach. Tolerances are relative to the mean edge length. Open wings' rays are
 * not tested here (the plane theorem allows parallel wings).
 */
import { computeFaces } from './combinatorics'
import { edgeVectors, meanEdgeLength } from './geometry'
import type { Lattice, PatternModel } from './model'

/** Outcome: ok, or the first offending pairs (up to 10). */
export interface StraightDrawingCheck {
  ok: boolean
  /** False when the pattern is too large for the pairwise test (`maxEdges`). */
  checked: boolean
  coincidentVertices: [number, number][]
  crossings: [number, number][]
}

const cross = (ax: number, ay: number, bx: number, by: number) => ax * by - ay * bx

/** Do the interiors of segments a0 + s·a (s ∈ [0,1]) and b0 + t·b meet (endpoints shared by both are allowed)? */
function interiorsMeet(a0x: number, a0y: number, ax: number, ay: number, b0x: number, b0y: number, bx: number, by: number, eps: number): boolean {
  const d = cross(ax, ay, bx, by)
  const wx = b0x - a0x, wy = b0y - a0y
  const la = Math.hypot(ax, ay), lb = Math.hypot(bx, by)
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

/** Checks the straight drawing (p, lat) of a model. */
export function checkStraightDrawing(m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice, maxEdges = 400, eps = 1e-9): StraightDrawingCheck {
  const E = m.nEdges, V = m.nVertices
  const torus = m.space === 'torus'
  const scale = meanEdgeLength(m, p, lat)
  const x = edgeVectors(m, p, lat)
  const maxLen = Array.from({ length: E }, (_, e) => Math.hypot(x[2 * e]!, x[2 * e + 1]!)).reduce((a, b) => Math.max(a, b), 0)
  const [w1, w2] = [lat.w1, lat.w2]
  const det = Math.abs(w1[0] * w2[1] - w1[1] * w2[0])
  const height = torus ? det / Math.max(Math.hypot(...w1), Math.hypot(...w2)) : Infinity
  const N = torus ? Math.min(4, Math.ceil((2 * maxLen + Math.max(Math.hypot(...w1), Math.hypot(...w2))) / height)) : 0
  const shifts: [number, number][] = []
  for (let i = -N; i <= N; i++) for (let j = -N; j <= N; j++) shifts.push([i * w1[0] + j * w2[0], i * w1[1] + j * w2[1]])
  const out: StraightDrawingCheck = { ok: true, checked: true, coincidentVertices: [], crossings: [] }
  if (E > maxEdges || V > maxEdges) return { ...out, checked: false }
  for (let v = 0; v < V; v++) {
    for (let w = v + 1; w < V; w++) {
      const dx = p[2 * w]! - p[2 * v]!, dy = p[2 * w + 1]! - p[2 * v + 1]!
      if (shifts.some(([sx, sy]) => Math.hypot(dx + sx, dy + sy) <= eps * scale) && out.coincidentVertices.length < 10) out.coincidentVertices.push([v, w])
    }
  }
  // the two edges of a face with two half-edges may share their segment
  const faces = computeFaces(m)
  const partner = new Int32Array(E).fill(-1)
  for (const c of faces.cycles) if (c.length === 2) { partner[c[0]! >> 1] = c[1]! >> 1; partner[c[1]! >> 1] = c[0]! >> 1 }
  const len = Float64Array.from({ length: E }, (_, e) => Math.hypot(x[2 * e]!, x[2 * e + 1]!))
  for (let e = 0; e < E && out.crossings.length < 10; e++) {
    const ax = p[2 * m.edgeFrom[e]!]!, ay = p[2 * m.edgeFrom[e]! + 1]!
    const mx = ax + x[2 * e]! / 2, my = ay + x[2 * e + 1]! / 2
    for (let f = e; f < E; f++) {
      const bx = p[2 * m.edgeFrom[f]!]!, by = p[2 * m.edgeFrom[f]! + 1]!
      // midpoint distance bound: the segments can only meet when the midpoints are within (ℓ_e + ℓ_f)/2
      const reach = (len[e]! + len[f]!) / 2 + eps * scale
      const dx = bx + x[2 * f]! / 2 - mx, dy = by + x[2 * f + 1]! / 2 - my
      let meets = false
      for (let k = 0; k < shifts.length && !meets; k++) {
        const sx = shifts[k]![0], sy = shifts[k]![1]
        if (f === e && sx === 0 && sy === 0) continue
        if (Math.abs(dx + sx) > reach || Math.abs(dy + sy) > reach) continue
        if (!interiorsMeet(ax, ay, x[2 * e]!, x[2 * e + 1]!, bx + sx, by + sy, x[2 * f]!, x[2 * f + 1]!, eps)) continue
        // the two edges of a 2-face may share their segment
        meets = !(partner[e] === f && sameSegment(ax, ay, x[2 * e]!, x[2 * e + 1]!, bx + sx, by + sy, x[2 * f]!, x[2 * f + 1]!, eps * scale))
      }
      if (meets) { out.crossings.push([e, f]); if (out.crossings.length >= 10) break }
    }
  }
  out.ok = out.coincidentVertices.length === 0 && out.crossings.length === 0
  return out
}

/** The two segments are the same point set (either orientation). */
function sameSegment(ax: number, ay: number, ux: number, uy: number, bx: number, by: number, vx: number, vy: number, tol: number): boolean {
  const d = (x1: number, y1: number, x2: number, y2: number) => Math.hypot(x1 - x2, y1 - y2) <= tol
  return (d(ax, ay, bx, by) && d(ax + ux, ay + uy, bx + vx, by + vy)) || (d(ax, ay, bx + vx, by + vy) && d(ax + ux, ay + uy, bx, by))
}
