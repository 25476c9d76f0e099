/**
 * Gluing patterns stored by the demo seed: the core's example documents (shared/examples) and the
 * demo group's own drafts (demo-patterns.ts), each with the summary of `analyzePattern` so the
 * project page can show its verdicts. Torus patterns go to the first demo project, plane patterns
 * to the second. The first pattern of each list is the project's showcase (stored as the newest,
 * so it heads the pattern list): it passes every hypothesis of the published existence checklist.
 */
import { PATTERN_EXAMPLES } from '../../shared/examples'
import { analyzePattern } from '../../shared/pattern/analyze'
import type { PatternDocument } from '../../shared/types/pattern'
import { evenRingOfFour, leaningSquarePair, threeLineTriangle, twistedRingOfFive,
  weightedRingOfFour } from './demo-patterns'

/** A graph for the seed: display name, description, document JSON and summary JSON. */
export interface DemoGraph {
  name: string
  description: string
  document: PatternDocument
  summary: unknown | null
}

/** Showcase first, then in the order the pattern list should show them. */
const ORDER: Record<'torus' | 'plane', string[]> = {
  torus: ['Square pair', 'Leaning square pair', 'Weighted ring of four', 'Even ring of four', 'Six-wing lattice'],
  plane: ['Three-line triangle', 'Plane bridge'],
}

const DRAFTS: Array<{ description: string, document: PatternDocument }> = [
  { description: 'The square pair in a leaning cell: a shear across the square cell meets a wall of vertical balance.',
    document: leaningSquarePair() },
  { description: 'Four degree-4 towers on a ring, one light phase weight: the α1 family of its phases has a fold.',
    document: weightedRingOfFour() },
  { description: 'The ring of four with equal weights and twisted phases: making two opposite edges lighter meets a branch point.', document: evenRingOfFour() },
  { description: 'Five phase oscillators on a ring (degree 2, not a gluing pattern): its twisted state loses phase rigidity.', document: twistedRingOfFive() },
  { description: 'Three degree-4 towers where three lines meet, phases a third of a turn apart: balanced and phase-rigid.', document: threeLineTriangle() },
]

/** Demo graphs for the project with the given index in DEMO_PROJECTS (0: torus, 1: plane), showcase first. */
export function demoGraphsFor(projectIndex: number): DemoGraph[] {
  const space = projectIndex === 0 ? 'torus' : 'plane'
  const all = [...PATTERN_EXAMPLES.map(e => ({ description: e.description, document: e.document })), ...DRAFTS]
    .filter(e => e.document.space === space)
  const rank = (name: string) => { const k = ORDER[space].indexOf(name); return k < 0 ? ORDER[space].length : k }
  return all
    .map((e, i) => ({ e, i }))
    .sort((a, b) => rank(a.e.document.name) - rank(b.e.document.name) || a.i - b.i)
    .map(({ e }) => ({ name: e.document.name, description: e.description, document: e.document,
      summary: analyzePattern(e.document).summary }))
}
