/**
 * The census of gluing patterns: connected rotation systems on the torus (genus 1, χ = 0), each
 * tower of even degree ≥ 4, every face with ≥ 2 half-edges, orientable (a 2-colouring with
 * s(ιh) = s(σh) = −s(h)), one per orientation-preserving isomorphism class, bounded by towers
 * (vertices) and half-edges (2E). The maps come from the canonical augmentation of augment.ts;
 * the filters apply to the leaves and every intermediate map (genus 0 or 1, any degrees) is only a
 * step. Mirror images (σ⁻¹, ι) have their own class when the pattern is chiral.
 */
import { generateMaps, type GeneratedMap } from './augment'
import { canonicalize, codeToString, isOrientableMap, mapShape, mirrorSigma } from './map-code'

/** Census bounds: a count always refers to both (towers ≤ maxTowers and half-edges ≤ maxHalfEdges). */
export interface CensusBounds {
  maxTowers: number
  maxHalfEdges: number
}

/** One pattern class of the census (combinatorics only). */
export interface CensusPattern {
  /** Canonical code (map-code.ts), unique per class. */
  code: string
  /** Canonical code of the mirror image; equal to `code` when the pattern is achiral. */
  mirrorCode: string
  chiral: boolean
  towers: number
  edges: number
  halfEdges: number
  faces: number
  /** Tower degrees, descending. */
  degrees: number[]
  /** Face sizes (half-edges per face), descending. */
  faceSizes: number[]
  /** Predicted genus of the glued surface, E − V + 1 (= F + 1 on the torus). */
  predictedGenus: number
  /** Order of the orientation-preserving automorphism group. */
  automorphisms: number
  /** σ on darts 0..2E−1 with ι(d) = d ^ 1 (the canonical numbering's map, repaired to pairs). */
  sigma: number[]
}

/** Checks the bounds and throws a clear message on nonsense. */
export function checkCensusBounds(b: CensusBounds): CensusBounds {
  if (!(Number.isInteger(b.maxTowers) && b.maxTowers >= 1)) throw new Error('maxTowers must be an integer ≥ 1')
  if (!(Number.isInteger(b.maxHalfEdges) && b.maxHalfEdges >= 2)) throw new Error('maxHalfEdges must be an integer ≥ 2')
  return b
}

/** True when the generated map is a gluing pattern of the census (beyond the search bounds). */
export function isCensusMap(m: GeneratedMap): boolean {
  if (m.genus !== 1) return false
  const sh = mapShape(m.sigma)
  if (sh.vertices.sizes.some(d => d < 4 || d % 2 !== 0)) return false
  if (sh.faces.sizes.some(s => s < 2)) return false
  return isOrientableMap(m.sigma)
}

/** Describes a census map. */
export function describeCensusMap(m: GeneratedMap): CensusPattern {
  const sh = mapShape(m.sigma)
  const code = codeToString(canonicalize(m.sigma).code)
  const mirrorCode = codeToString(canonicalize(mirrorSigma(m.sigma)).code)
  return {
    code, mirrorCode, chiral: code !== mirrorCode,
    towers: m.vertices, edges: m.edges, halfEdges: 2 * m.edges, faces: m.faces,
    degrees: [...sh.vertices.sizes].sort((a, b) => b - a),
    faceSizes: [...sh.faces.sizes].sort((a, b) => b - a),
    predictedGenus: m.edges - m.vertices + 1,
    automorphisms: m.automorphisms,
    sigma: Array.from(m.sigma),
  }
}

/**
 * Half-edges still needed before a map can become a census pattern: each vertex needs
 * max(4 − d, d mod 2) more darts (one dart raises one degree by one), and a planar map needs one
 * more chord (two darts) to reach the torus. Adding 2k darts lowers this by at most 2k, so a map
 * whose need exceeds the half-edges left has no census descendant (a monotone child filter).
 */
export function halfEdgesNeeded(sigma: Int32Array, genus: number): number {
  const sizes = mapShape(sigma).vertices.sizes
  let need = 0
  for (const d of sizes) need += Math.max(4 - d, d % 2)
  return Math.max(need, genus === 0 ? 2 : 0)
}

/** Every census pattern within the bounds, depth first; `onVisit` sees every map searched. */
export function* enumerateCensus(bounds: CensusBounds, onVisit?: (m: GeneratedMap) => void): Generator<CensusPattern> {
  const b = checkCensusBounds(bounds)
  const admit = (sigma: Int32Array, _v: number, genus: number) => halfEdgesNeeded(sigma, genus) <= b.maxHalfEdges - sigma.length
  for (const m of generateMaps({ maxEdges: Math.floor(b.maxHalfEdges / 2), maxVertices: b.maxTowers, maxGenus: 1 }, undefined, admit)) {
    onVisit?.(m)
    if (isCensusMap(m)) yield describeCensusMap(m)
  }
}
