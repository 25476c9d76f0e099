/**
 * The demo pattern documents (invented scenario: the Larkspur scaffold study), validated at
 * import so a broken example fails loudly. Used by the seed, the app and the tests.
 */
import { parsePatternDocument, type PatternDocument } from '../types/pattern'
import fermatPair from './fermat-pair.wfp.json'
import planeBridge from './plane-bridge.wfp.json'
import sixWingLattice from './six-wing-lattice.wfp.json'
import squareGrid from './square-grid.wfp.json'
import squarePair from './square-pair.wfp.json'
import threeLineWeave from './three-line-weave.wfp.json'
import twoLineKnot from './two-line-knot.wfp.json'

/** One example: a URL-safe slug, a title, one sentence, and the parsed document. */
export interface PatternExample {
  slug: string
  title: string
  description: string
  document: PatternDocument
}

const raw: [slug: string, description: string, json: unknown][] = [
  ['square-pair', 'Two degree-4 towers in the square torus: balanced, rigid, orientable, genus 3.', squarePair],
  ['three-line-weave', 'Three degree-4 towers in the hexagonal torus on three lines: orientable but not rigid.', threeLineWeave],
  ['two-line-knot', 'Three degree-4 towers in the hexagonal torus on two lines: rigid but not orientable.', twoLineKnot],
  ['square-grid', 'Four degree-4 towers in the square torus on four lines: two parallel redrawings, not rigid.', squareGrid],
  ['plane-bridge', 'Two towers in the plane with six open wings: singly periodic, six ends.', planeBridge],
  ['six-wing-lattice', 'One degree-6 tower in the hexagonal torus: balanced for every lattice, rigid, orientable, genus 3.', sixWingLattice],
  ['fermat-pair', 'A rough two-vertex three-edge drawing whose balanced state is the Fermat point.', fermatPair],
]

/** All examples in display order. */
export const PATTERN_EXAMPLES: PatternExample[] = raw.map(([slug, description, json]) => {
  const document = parsePatternDocument(json)
  return { slug, title: document.name, description, document }
})

/** The example with this slug, or undefined. */
export function findPatternExample(slug: string): PatternExample | undefined {
  return PATTERN_EXAMPLES.find(e => e.slug === slug)
}
