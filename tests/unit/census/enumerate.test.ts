import { describe, expect, it } from 'vitest'
import { generateMaps } from '../../../shared/census/augment'
import { enumerateCensus } from '../../../shared/census/enumerate'
import { canonicalize, codeToString, isOrientableMap, mapShape, pairDarts, parseCode } from '../../../shared/census/map-code'

/** Rooted maps with E edges by genus: Σ over unrooted classes of 2E/|Aut| (each class has 2E/|Aut| rootings). */
function rootedCounts(maxEdges: number): number[][] {
  const out = [[] as number[], [] as number[]]
  for (const m of generateMaps({ maxEdges, maxVertices: maxEdges + 1, maxGenus: 1 })) {
    out[m.genus]![m.edges] = (out[m.genus]![m.edges] ?? 0) + (2 * m.edges) / m.automorphisms
  }
  return out
}

function factorial(n: number): number { return n <= 1 ? 1 : n * factorial(n - 1) }

/** All perfect matchings of 0..n−1 as involutions. */
function* matchings(n: number): Generator<Int32Array> {
  const iota = new Int32Array(n).fill(-1)
  function* rec(): Generator<Int32Array> {
    const a = iota.indexOf(-1)
    if (a < 0) { yield iota.slice(); return }
    for (let b = a + 1; b < n; b++) {
      if (iota[b] !== -1) continue
      iota[a] = b; iota[b] = a
      yield* rec()
      iota[a] = -1; iota[b] = -1
    }
  }
  yield* rec()
}

/** Partitions of n into even parts ≥ 4, at most k parts, descending. */
function evenPartitions(n: number, k: number, max = n): number[][] {
  if (n === 0) return [[]]
  if (k === 0) return []
  const out: number[][] = []
  for (let p = Math.min(max, n); p >= 4; p -= 2) {
    if (p % 2) continue
    for (const rest of evenPartitions(n - p, k - 1, p)) out.push([p, ...rest])
  }
  return out
}

/** Brute force: fixed σ per degree sequence, every ι, filters, canonical codes into a set. */
function bruteForceCensus(maxTowers: number, maxHalfEdges: number): Set<string> {
  const codes = new Set<string>()
  for (let n = 4; n <= maxHalfEdges; n += 2) {
    for (const degrees of evenPartitions(n, maxTowers)) {
      const sigma = new Int32Array(n)
      let start = 0
      for (const d of degrees) { for (let j = 0; j < d; j++) sigma[start + j] = start + ((j + 1) % d); start += d }
      for (const iota of matchings(n)) {
        const s = pairDarts(sigma, iota)
        const sh = mapShape(s)
        // connected: the group ⟨σ, ι⟩ is transitive ⇔ one orbit of darts under both
        const seen = new Uint8Array(n), stack = [0]; seen[0] = 1
        while (stack.length) { const d = stack.pop()!; for (const t of [s[d]!, d ^ 1]) if (!seen[t]) { seen[t] = 1; stack.push(t) } }
        if (seen.includes(0)) continue
        if (sh.genus !== 1 || sh.faces.sizes.some(x => x < 2) || !isOrientableMap(s)) continue
        codes.add(codeToString(canonicalize(s).code))
      }
    }
  }
  return codes
}

describe('map generation by canonical augmentation', () => {
  it('counts rooted planar maps by Tutte\'s formula and rooted torus maps as published', () => {
    const c = rootedCounts(5)
    for (let n = 1; n <= 5; n++) {
      // W. T. Tutte, "A census of planar maps", Canad. J. Math. 15 (1963): 2(2n)! 3^n / (n! (n+2)!)
      const tutte = (2 * factorial(2 * n) * 3 ** n) / (factorial(n) * factorial(n + 2))
      expect(c[0]![n]).toBeCloseTo(tutte, 9)
    }
    // T. R. S. Walsh, A. B. Lehman, "Counting rooted maps by genus I", J. Combin. Theory B 13 (1972), table for genus 1
    expect([2, 3, 4, 5].map(e => Math.round(c[1]![e]!))).toEqual([1, 20, 307, 4280])
    expect(c[1]![1]).toBeUndefined()
  })

  it('gives unrooted planar map counts 2, 4, 14, 57, 312 for 1–5 edges', () => {
    const u: number[] = []
    for (const m of generateMaps({ maxEdges: 5, maxVertices: 6, maxGenus: 0 })) u[m.edges] = (u[m.edges] ?? 0) + 1
    // from memory: unrooted planar maps by edges (T. R. S. Walsh; OEIS A006384: 1, 2, 4, 14, 57, 312, 2071)
    expect(u.slice(1)).toEqual([2, 4, 14, 57, 312])
  })

  it('never yields two maps with one canonical code', () => {
    const codes = new Set<string>()
    let count = 0
    for (const m of generateMaps({ maxEdges: 5, maxVertices: 3, maxGenus: 1 })) { codes.add(codeToString(m.code)); count++ }
    expect(codes.size).toBe(count)
    expect(count).toBeGreaterThan(100)
  })
})

describe('census of torus gluing patterns', () => {
  it('matches a brute force over every involution (towers ≤ 3, half-edges ≤ 14)', () => {
    const census = [...enumerateCensus({ maxTowers: 3, maxHalfEdges: 14 })]
    const brute = bruteForceCensus(3, 14)
    expect(new Set(census.map(p => p.code))).toEqual(brute)
    expect(census.length).toBe(brute.size)
  })

  it('has exactly two genus-3 patterns and no genus-2 one', () => {
    const census = [...enumerateCensus({ maxTowers: 4, maxHalfEdges: 12 })]
    // H. Chen, M. Traizet, "Gluing Karcher–Scherk saddle towers I", arXiv 2103.15676 (2021), Theorem C.1:
    // one tower with three loops, two towers with four edges.
    const g3 = census.filter(p => p.predictedGenus === 3).map(p => ({ towers: p.towers, edges: p.edges, degrees: p.degrees }))
    expect(g3).toEqual(expect.arrayContaining([
      { towers: 1, edges: 3, degrees: [6] },
      { towers: 2, edges: 4, degrees: [4, 4] },
    ]))
    expect(g3).toHaveLength(2)
    // W. H. Meeks, Indiana Univ. Math. J. 39 (1990): no genus-2 minimal surface in a flat 3-torus (from memory)
    expect(census.filter(p => p.predictedGenus <= 2)).toEqual([])
  })

  it('marks mirror pairs: a chiral class comes with its mirror class in the census', () => {
    const census = [...enumerateCensus({ maxTowers: 3, maxHalfEdges: 14 })]
    const codes = new Set(census.map(p => p.code))
    const chiral = census.filter(p => p.chiral)
    expect(chiral.length).toBeGreaterThan(0)
    for (const p of census) {
      expect(codes.has(p.mirrorCode)).toBe(true)
      expect(p.chiral).toBe(p.mirrorCode !== p.code)
    }
  })

  it('codes describe the map: parsing a code and canonising again gives the same code and |Aut|', () => {
    for (const p of enumerateCensus({ maxTowers: 2, maxHalfEdges: 10 })) {
      const { sigma, iota } = parseCode(p.code)
      const c = canonicalize(pairDarts(sigma, iota))
      expect(codeToString(c.code)).toBe(p.code)
      expect(c.roots.length).toBe(p.automorphisms)
    }
  })
})
