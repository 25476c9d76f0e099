/**
 * Topology of a periodic mesh's quotient: edges are vertex pairs with their relative period
 * shift, so two triangles share an edge only when they meet in the quotient. Gives the Euler
 * characteristic χ = V − E + F, the boundary loops b, connectedness, orientability (breadth-first
 * propagation of the winding across shared edges) and the genus from χ = 2 − 2g − b
 * (orientable; B. Mohar, C. Thomassen, "Graphs on Surfaces", 2001, §3.1 for the classification).
 */
import type { PeriodicMesh } from './mesh'

/** Topology of the quotient surface. */
export interface MeshTopology {
  vertices: number
  edges: number
  faces: number
  euler: number
  boundaryLoops: number
  components: number
  /** Edges used by more than two triangles (0 for a surface). */
  nonManifoldEdges: number
  orientable: boolean
  /** Orientable genus (2 − χ − b)/2; for a non-orientable surface the number of cross-caps 2 − χ − b. */
  genus: number
}

interface EdgeUse { tri: number, forward: boolean }

/** Edge key (smaller vertex first, relative shift of the larger) and whether the corner order a→b runs along it. */
function edgeKey(m: PeriodicMesh, ca: number, cb: number): [string, boolean] {
  const a = m.triangles[ca]!, b = m.triangles[cb]!
  const r = [0, 1, 2].map(d => m.shifts[3 * cb + d]! - m.shifts[3 * ca + d]!)
  if (a < b) return [`${a},${b},${r}`, true]
  if (a > b) return [`${b},${a},${r.map(x => -x)}`, false]
  const neg = r.map(x => -x)
  const positive = r[0]! > 0 || (r[0] === 0 && (r[1]! > 0 || (r[1] === 0 && r[2]! > 0)))
  return positive ? [`${a},${a},${r}`, true] : [`${a},${a},${neg}`, false]
}

/** The quotient's edges with the triangles using them. */
function edgeUses(m: PeriodicMesh): Map<string, EdgeUse[]> {
  const uses = new Map<string, EdgeUse[]>()
  const F = m.triangles.length / 3
  for (let t = 0; t < F; t++) {
    for (let i = 0; i < 3; i++) {
      const [k, forward] = edgeKey(m, 3 * t + i, 3 * t + (i + 1) % 3)
      let list = uses.get(k)
      if (!list) { list = []; uses.set(k, list) }
      list.push({ tri: t, forward })
    }
  }
  return uses
}

/** Swaps corners 1 and 2 of triangle t (reverses its winding). */
function flip(m: PeriodicMesh, t: number): void {
  const a = 3 * t + 1, b = 3 * t + 2
  const v = m.triangles[a]!; m.triangles[a] = m.triangles[b]!; m.triangles[b] = v
  for (let d = 0; d < 3; d++) {
    const s = m.shifts[3 * a + d]!; m.shifts[3 * a + d] = m.shifts[3 * b + d]!; m.shifts[3 * b + d] = s
  }
}

/**
 * Computes the topology and, when the surface is orientable, makes every triangle's winding
 * agree with its neighbours' (in place), so normals point to one side.
 */
export function analyzeTopology(m: PeriodicMesh): MeshTopology {
  const F = m.triangles.length / 3, V = m.positions.length / 3
  const uses = edgeUses(m)
  const neighbours: { tri: number, same: boolean }[][] = Array.from({ length: F }, () => [])
  let nonManifold = 0
  const parent = new Int32Array(V).map((_, i) => i)
  const find = (x: number): number => { while (parent[x] !== x) { parent[x] = parent[parent[x]!]!; x = parent[x]! } return x }
  for (const [key, list] of uses) {
    if (list.length === 1) {
      const [a, b] = key.split(',').map(Number)
      parent[find(a!)] = find(b!)
    }
    else if (list.length > 2) nonManifold++
    else {
      const [p, q] = list as [EdgeUse, EdgeUse]
      // Consistent windings traverse a shared edge in opposite directions.
      const same = p.forward === q.forward
      neighbours[p.tri]!.push({ tri: q.tri, same }); neighbours[q.tri]!.push({ tri: p.tri, same })
    }
  }
  let boundaryLoops = 0
  const onBoundary = new Uint8Array(V)
  for (const [key, list] of uses) if (list.length === 1) for (const x of key.split(',').slice(0, 2).map(Number)) onBoundary[x] = 1
  for (let v = 0; v < V; v++) if (onBoundary[v] && find(v) === v) boundaryLoops++

  const state = new Int8Array(F) // 0 unseen, +1 kept, −1 flipped
  let orientable = true, components = 0
  const queue: number[] = []
  for (let s = 0; s < F; s++) {
    if (state[s]) continue
    components++
    state[s] = 1; queue.push(s)
    while (queue.length) {
      const t = queue.pop()!
      for (const { tri, same } of neighbours[t]!) {
        const want = (same ? -1 : 1) * state[t]! as 1 | -1
        if (!state[tri]) { state[tri] = want; queue.push(tri) }
        else if (state[tri] !== want) orientable = false
      }
    }
  }
  if (orientable) for (let t = 0; t < F; t++) if (state[t] === -1) flip(m, t)
  const euler = V - uses.size + F
  const defect = 2 * components - euler - boundaryLoops
  return {
    vertices: V, edges: uses.size, faces: F, euler, boundaryLoops, components, nonManifoldEdges: nonManifold, orientable,
    genus: orientable ? defect / 2 : defect,
  }
}
