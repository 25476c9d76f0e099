/** Documents for the family tests: the Fermat pair in a chosen lattice and rings of n towers. */
import { findPatternExample } from '../../../shared/examples'
import { parsePatternDocument, type PatternDocument } from '../../../shared/types/pattern'

/** The fermat-pair example with ω1 = (1, 0), ω2 = (a, 1). */
export function fermatPair(a = 0): PatternDocument {
  const doc = structuredClone(findPatternExample('fermat-pair')!.document)
  doc.lattice = { w1: [1, 0], w2: [a, 1] }
  doc.vertices[1]!.position = [0.4, 0.3]
  return doc
}

/** A ring of n vertices along ω1 = (n, 0): edges i → i+1, the last one closing with shift (1, 0). */
export function ring(n: number): PatternDocument {
  return parsePatternDocument({
    format: 'wingfold-pattern', version: 1, name: `ring of ${n}`, space: 'torus',
    lattice: { w1: [n, 0], w2: [0, 1] },
    vertices: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, position: [i, 0] })),
    edges: Array.from({ length: n }, (_, i) => ({ id: `e${i}`, from: `v${i}`, to: `v${(i + 1) % n}`, ...(i === n - 1 ? { shift: [1, 0] } : {}) })),
  })
}

/** The plane-bridge example. */
export function planeBridge(): PatternDocument {
  return structuredClone(findPatternExample('plane-bridge')!.document)
}

/** Wing sets of plane-bridge used by the rotation tests (each set's directions sum to zero). */
export const BRIDGE_WINGS = { rotate: ['west-up', 'east-down'], compensate: ['west-down', 'east-up'] }
