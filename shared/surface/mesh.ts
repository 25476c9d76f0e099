/**
 * A periodic triangle mesh stored as its quotient: every vertex once, and every triangle corner
 * as (vertex, integer period shift). The corner's point in space is
 *   x = pos[v] + k1·P1 + k2·P2 + k3·P3
 * with the three period vectors P1, P2, P3 (torus: (S·ω1, α1), (S·ω2, α2), (0, 0, 2π); plane: only
 * the vertical period P3 = (0, 0, 2π) is used). Storing shifts per corner lets the same quotient
 * mesh be relaxed periodically, counted (Euler characteristic of the quotient) and unrolled into
 * any number of copies for display or export.
 */

/** Three period vectors, each (x, y, z). */
export type Periods = [[number, number, number], [number, number, number], [number, number, number]]

/** The quotient mesh; arrays are indexed as documented on each field. */
export interface PeriodicMesh {
  /** Vertex positions (x, y, z) interleaved; length 3·nVertices. */
  positions: Float64Array
  /** Triangle corners: vertex indices, three per triangle. */
  triangles: Int32Array
  /** Period shift (k1, k2, k3) of every corner, nine per triangle. */
  shifts: Int32Array
  periods: Periods
  /** 1 where the vertex is held fixed (the cut ends of open wings), else 0. */
  fixed: Uint8Array
  /** Which tower (pattern vertex index) or edge made each vertex: tower v → v, sheet of edge e → V + e, wing j → V + E + j. */
  owner: Int32Array
  /** Which periods are real symmetries of the surface (plane: only the vertical one). */
  periodic: [boolean, boolean, boolean]
}

/** Number of vertices and triangles. */
export function meshSize(m: PeriodicMesh): { vertices: number, triangles: number } {
  return { vertices: m.positions.length / 3, triangles: m.triangles.length / 3 }
}

/** The point of corner c (0..3·F−1) in space, into out[o..o+2]. */
export function cornerPoint(m: PeriodicMesh, c: number, out: Float64Array | number[], o = 0): void {
  const v = m.triangles[c]!
  const k1 = m.shifts[3 * c]!, k2 = m.shifts[3 * c + 1]!, k3 = m.shifts[3 * c + 2]!
  const [P1, P2, P3] = m.periods
  for (let d = 0; d < 3; d++) out[o + d] = m.positions[3 * v + d]! + k1 * P1[d]! + k2 * P2[d]! + k3 * P3[d]!
}

/** Grows a mesh: vertices are created once per key, triangles get per-corner shifts. */
export class MeshBuilder {
  private keys = new Map<string, number>()
  private pos: number[] = []
  private own: number[] = []
  private held: number[] = []
  private tri: number[] = []
  private sh: number[] = []

  /** Index of the vertex with this key, created at (x, y, z) the first time. */
  vertex(key: string, x: number, y: number, z: number, owner: number, fixed = false): number {
    const found = this.keys.get(key)
    if (found !== undefined) return found
    const i = this.own.length
    this.keys.set(key, i)
    this.pos.push(x, y, z); this.own.push(owner); this.held.push(fixed ? 1 : 0)
    return i
  }

  /** Index of an existing vertex (throws when the key is unknown: a construction bug). */
  existing(key: string): number {
    const found = this.keys.get(key)
    if (found === undefined) throw new Error(`surface mesh: no vertex '${key}'`)
    return found
  }

  /** Position of vertex i. */
  point(i: number): [number, number, number] {
    return [this.pos[3 * i]!, this.pos[3 * i + 1]!, this.pos[3 * i + 2]!]
  }

  /** Holds vertex i fixed. */
  fix(i: number): void { this.held[i] = 1 }

  /** Adds a triangle; each corner is [vertex, k1, k2, k3]. */
  triangle(a: Corner, b: Corner, c: Corner): void {
    for (const [v, k1, k2, k3] of [a, b, c]) { this.tri.push(v); this.sh.push(k1, k2, k3) }
  }

  /** Adds the quad a-b-c-d (in order around it) as two triangles. */
  quad(a: Corner, b: Corner, c: Corner, d: Corner): void {
    this.triangle(a, b, c)
    this.triangle(a, c, d)
  }

  build(periods: Periods, periodic: [boolean, boolean, boolean]): PeriodicMesh {
    return {
      positions: new Float64Array(this.pos),
      triangles: new Int32Array(this.tri),
      shifts: new Int32Array(this.sh),
      periods,
      fixed: new Uint8Array(this.held),
      owner: new Int32Array(this.own),
      periodic,
    }
  }
}

/** A triangle corner while building: vertex index and period shift. */
export type Corner = [v: number, k1: number, k2: number, k3: number]
