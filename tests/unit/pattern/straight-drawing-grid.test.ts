/**
 * The grid search of the straight-drawing check (T5 / P4) against a brute-force O(E²) search over
 * every pair and every lattice shift in a range the longest edge cannot leave (common practice:
 * a fast geometric search checked against the exhaustive one), on seeded random drawings with
 * planted coincidences, plus wing rays in the plane (elementary geometry, derived).
 */
import { describe, expect, it } from 'vitest'
import { computeFaces } from '../../../shared/pattern/combinatorics'
import { edgeVectors, meanEdgeLength } from '../../../shared/pattern/geometry'
import { compilePattern, type PatternModel } from '../../../shared/pattern/model'
import { checkStraightDrawing, interiorsMeet } from '../../../shared/pattern/straight-drawing'
import { parsePatternDocument } from '../../../shared/types/pattern'
import { seeded } from './helpers'

const EPS = 1e-9

/** Every conflict by brute force: vertex pairs, edge pairs, wing pairs (same definitions as the check). */
function bruteForce(m: PatternModel) {
  const p = m.positions, lat = m.lattice, E = m.nEdges, V = m.nVertices
  const torus = m.space === 'torus'
  const x = edgeVectors(m, p, lat)
  const scale = meanEdgeLength(m, p, lat)
  const len = (e: number) => Math.hypot(x[2 * e]!, x[2 * e + 1]!)
  const { w1, w2 } = lat
  let N = 0
  if (torus) {
    const maxLen = Math.max(0, ...Array.from({ length: E }, (_, e) => len(e)))
    const spread = Math.max(...Array.from({ length: V }, (_, v) => Math.hypot(p[2 * v]!, p[2 * v + 1]!)))
    const height = Math.abs(w1[0] * w2[1] - w1[1] * w2[0]) / Math.max(Math.hypot(...w1), Math.hypot(...w2))
    N = Math.ceil((2 * maxLen + 2 * spread + Math.hypot(...w1) + Math.hypot(...w2)) / height) + 1
  }
  const shifts: [number, number][] = []
  for (let i = -N; i <= N; i++) for (let j = -N; j <= N; j++) shifts.push([i * w1[0] + j * w2[0], i * w1[1] + j * w2[1]])
  const coincident: string[] = []
  for (let v = 0; v < V; v++) {
    for (let w = v + 1; w < V; w++) {
      if (shifts.some(([sx, sy]) => Math.hypot(p[2 * w]! + sx - p[2 * v]!, p[2 * w + 1]! + sy - p[2 * v + 1]!) <= EPS * scale)) coincident.push(`${v},${w}`)
    }
  }
  const faces = computeFaces(m)
  const partner = new Int32Array(E).fill(-1)
  for (const c of faces.cycles) if (c.length === 2) { partner[c[0]! >> 1] = c[1]! >> 1; partner[c[1]! >> 1] = c[0]! >> 1 }
  const near = (a: number, b: number, c: number, d: number) => Math.hypot(a - c, b - d) <= EPS * scale
  const segs: [number, number, number, number][] = Array.from({ length: E }, (_, e) => [p[2 * m.edgeFrom[e]!]!, p[2 * m.edgeFrom[e]! + 1]!, x[2 * e]!, x[2 * e + 1]!])
  if (!torus) {
    let lx = Infinity, ly = Infinity, hx = -Infinity, hy = -Infinity
    for (let v = 0; v < V; v++) { lx = Math.min(lx, p[2 * v]!); hx = Math.max(hx, p[2 * v]!); ly = Math.min(ly, p[2 * v + 1]!); hy = Math.max(hy, p[2 * v + 1]!) }
    const g = Math.hypot(hx - lx, hy - ly) || scale
    for (let j = 0; j < m.nWings; j++) {
      const v = m.vertexOf[2 * E + j]!, ux = m.wingDir[2 * j]!, uy = m.wingDir[2 * j + 1]!
      const ax = p[2 * v]!, ay = p[2 * v + 1]!
      const t = Math.min(ux > 0 ? (hx + g - ax) / ux : ux < 0 ? (lx - g - ax) / ux : Infinity, uy > 0 ? (hy + g - ay) / uy : uy < 0 ? (ly - g - ay) / uy : Infinity)
      segs.push([ax, ay, t * ux, t * uy])
    }
  }
  const edges: string[] = [], wings: string[] = []
  for (let i = 0; i < segs.length; i++) {
    for (let j = i; j < segs.length; j++) {
      const [ax, ay, ux, uy] = segs[i]!, [bx, by, vx, vy] = segs[j]!
      const hit = shifts.some(([sx, sy]) => {
        if (i === j && sx === 0 && sy === 0) return false
        if (!interiorsMeet(ax, ay, ux, uy, bx + sx, by + sy, vx, vy, EPS)) return false
        if (j < E && partner[i] === j) {
          const same = (near(ax, ay, bx + sx, by + sy) && near(ax + ux, ay + uy, bx + sx + vx, by + sy + vy)) || (near(ax, ay, bx + sx + vx, by + sy + vy) && near(ax + ux, ay + uy, bx + sx, by + sy))
          return !same
        }
        return true
      })
      if (hit) (j < E ? edges : wings).push(`${i},${j}`)
    }
  }
  return { coincident, edges, wings }
}

function grid(m: PatternModel) {
  const r = checkStraightDrawing(m, m.positions, m.lattice, EPS, Infinity)
  return {
    coincident: r.coincidentVertices.map(([a, b]) => `${a},${b}`),
    edges: r.crossings.map(([a, b]) => `${a},${b}`),
    wings: r.wingCrossings.map(w => (w.edge !== undefined ? `${w.edge},${w.wing + m.nEdges}` : `${w.wing + m.nEdges},${w.otherWing! + m.nEdges}`)),
  }
}

function randomTorus(seed: number): PatternModel {
  const rnd = seeded(seed)
  const V = 4 + Math.floor(rnd() * 26)
  const w1: [number, number] = [1, 0], w2: [number, number] = [rnd() - 0.5, 0.6 + rnd()]
  const pos: [number, number][] = Array.from({ length: V }, () => [3 * rnd() - 1, 3 * rnd() - 1])
  if (seed % 3 === 0) pos[V - 1] = [pos[0]![0] + w1[0] - 2 * w2[0], pos[0]![1] + w1[1] - 2 * w2[1]] // coincident modulo the lattice
  const edges: { id: string, from: string, to: string, shift: [number, number] }[] = []
  const E = Math.floor(V * (0.5 + rnd()))
  for (let e = 0; e < E; e++) {
    const a = Math.floor(rnd() * V), b = Math.floor(rnd() * V)
    const shift: [number, number] = [Math.floor(rnd() * 3) - 1, Math.floor(rnd() * 3) - 1]
    if (a === b && shift[0] === 0 && shift[1] === 0) shift[0] = 1
    edges.push({ id: `e${e}`, from: `v${a}`, to: `v${b}`, shift })
  }
  if (seed % 4 === 1 && E > 0) {
    // a vertex on the interior of an edge's lattice translate
    const e = edges[0]!, a = pos[Number(e.from.slice(1))]!, b = pos[Number(e.to.slice(1))]!
    const mid: [number, number] = [(a[0] + b[0] + e.shift[0] * w1[0] + e.shift[1] * w2[0]) / 2 + w2[0], (a[1] + b[1] + e.shift[0] * w1[1] + e.shift[1] * w2[1]) / 2 + w2[1]]
    const v = Number(edges[E - 1]!.from.slice(1))
    if (v !== Number(e.from.slice(1)) && v !== Number(e.to.slice(1))) pos[v] = mid
  }
  return compilePattern(parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: `r${seed}`, space: 'torus', lattice: { w1, w2 },
    vertices: pos.map((position, i) => ({ id: `v${i}`, position })), edges,
  }))
}

function randomPlane(seed: number): PatternModel {
  const rnd = seeded(seed)
  const V = 3 + Math.floor(rnd() * 25)
  const pos: [number, number][] = Array.from({ length: V }, () => [10 * rnd(), 10 * rnd()])
  const edges: { id: string, from: string, to: string }[] = []
  const E = Math.floor(V * rnd())
  for (let e = 0; e < E; e++) {
    const a = Math.floor(rnd() * V), b = (a + 1 + Math.floor(rnd() * (V - 1))) % V
    edges.push({ id: `e${e}`, from: `v${a}`, to: `v${b}` })
  }
  const wings = Array.from({ length: 2 + Math.floor(rnd() * 8) }, (_, j) => {
    const t = 2 * Math.PI * rnd()
    // every third wing parallel to the first (allowed unless the rays overlap)
    return { id: `w${j}`, vertex: `v${Math.floor(rnd() * V)}`, direction: (j % 3 === 2 ? [1, 0.5] : [Math.cos(t), Math.sin(t)]) as [number, number] }
  })
  return compilePattern(parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: `p${seed}`, space: 'plane',
    vertices: pos.map((position, i) => ({ id: `v${i}`, position })), edges, wings,
  }))
}

describe('straight-drawing check by the grid = brute force', () => {
  it('60 seeded random torus drawings: the same coincident vertices and crossing pairs', () => {
    let conflicts = 0
    for (let seed = 1; seed <= 60; seed++) {
      const m = randomTorus(seed)
      const b = bruteForce(m), g = grid(m)
      expect(g, `seed ${seed}`).toEqual(b)
      conflicts += b.edges.length + b.coincident.length
    }
    expect(conflicts).toBeGreaterThan(60) // the drawings do exercise the search
  })

  it('60 seeded random plane drawings with wing rays: the same crossings, edge–wing and wing–wing', () => {
    let wingHits = 0
    for (let seed = 1; seed <= 60; seed++) {
      const m = randomPlane(seed)
      const b = bruteForce(m), g = grid(m)
      expect(g, `seed ${seed}`).toEqual(b)
      wingHits += b.wings.length
    }
    expect(wingHits).toBeGreaterThan(20)
  })

  it('a wing ray through another tower is a crossing; parallel wings are not (derived)', () => {
    const doc = (dir: [number, number]) => compilePattern(parsePatternDocument({
      format: 'wingfold-pattern', version: 1, name: 'w', space: 'plane',
      vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: [2, 0] }, { id: 'c', position: [2, 3] }],
      edges: [{ id: 'ab', from: 'a', to: 'b' }, { id: 'bc', from: 'b', to: 'c' }],
      wings: [{ id: 'wa', vertex: 'a', direction: dir }, { id: 'wc', vertex: 'c', direction: [0, 1] }],
    }))
    // from a = (0, 0) along (2, 3)/|·| the ray passes through c = (2, 3): it meets wing wc's start and edge bc's end
    const r = checkStraightDrawing(doc([2, 3]))
    expect(r.ok).toBe(false)
    expect(r.wingCrossings).toEqual(expect.arrayContaining([{ wing: 0, edge: 1 }]))
    // along (0, 1) from a: parallel to wc, disjoint from both edges
    expect(checkStraightDrawing(doc([0, 1])).ok).toBe(true)
  })
})
