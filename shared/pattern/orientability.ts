/**
 * Orientability (docs/theory.md §2): signs s(h) = ±1 with s(ιh) = −s(h) on closed edges and
 * s(σh) = −s(h) at vertices. Solvable iff the relation graph on half-edges is bipartite
 * (breadth-first 2-colouring); otherwise a closed chain of relations of odd length is returned.
 */
import type { PatternModel } from './model'

/** Result of the 2-colouring. */
export interface Orientability {
  orientable: boolean
  /** s(h) = ±1 per half-edge when orientable (outgoing = +1), else empty. */
  signs: number[]
  /** When not orientable: half-edges of an odd closed chain h0 ~ h1 ~ … ~ h_{n−1} ~ h0. */
  oddChain: number[]
}

/** Neighbours of h in the relation graph: ι (closed edges), σ and σ⁻¹. */
function relationNeighbours(m: PatternModel, sigmaInv: Int32Array, h: number): number[] {
  const out = [m.sigma[h]!, sigmaInv[h]!]
  if (m.iota[h] !== h) out.push(m.iota[h]!)
  return out.filter(g => g !== h)
}

/** Walks parents from h up to the root of its breadth-first tree. */
function pathToRoot(parent: Int32Array, h: number): number[] {
  const path = [h]
  while (parent[h] !== -1) { h = parent[h]!; path.push(h) }
  return path
}

/** 2-colours the half-edges; reports an odd chain as witness when impossible. */
export function checkOrientability(m: PatternModel): Orientability {
  const n = m.nHalf
  const sigmaInv = new Int32Array(n)
  for (let h = 0; h < n; h++) sigmaInv[m.sigma[h]!] = h
  // A half-edge alone at its vertex with σ(h) = h relates to itself: s(h) = −s(h) is impossible.
  for (let h = 0; h < n; h++) {
    if (m.sigma[h] === h) return { orientable: false, signs: [], oddChain: [h] }
  }
  const colour = new Int8Array(n)
  const parent = new Int32Array(n).fill(-1)
  for (let root = 0; root < n; root++) {
    if (colour[root] !== 0) continue
    colour[root] = 1
    const queue = [root]
    for (let qi = 0; qi < queue.length; qi++) {
      const h = queue[qi]!
      for (const g of relationNeighbours(m, sigmaInv, h)) {
        if (colour[g] === 0) {
          colour[g] = -colour[h]! as -1 | 1
          parent[g] = h
          queue.push(g)
        } else if (colour[g] === colour[h]) {
          return { orientable: false, signs: [], oddChain: oddChain(parent, h, g) }
        }
      }
    }
  }
  return { orientable: true, signs: Array.from(colour), oddChain: [] }
}

/** The cycle h → … → lca → … → g (closed by the relation g ~ h); odd when colours agree. */
function oddChain(parent: Int32Array, h: number, g: number): number[] {
  const ph = pathToRoot(parent, h)
  const pg = pathToRoot(parent, g)
  const inG = new Set(pg)
  const lcaIndex = ph.findIndex(x => inG.has(x))
  const lca = ph[lcaIndex]!
  const up = ph.slice(0, lcaIndex + 1)
  const down = pg.slice(0, pg.indexOf(lca)).reverse()
  return [...up, ...down]
}
