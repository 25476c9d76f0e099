/**
 * Gluing patterns stored by the demo seed: the core's example documents (shared/examples), each
 * with the summary of `analyzePattern` so the project page can show its verdicts. Torus examples
 * go to the first demo project, plane examples to the second.
 */
import { PATTERN_EXAMPLES } from '../../shared/examples'
import { analyzePattern } from '../../shared/pattern/analyze'

/** A graph for the seed: display name, description, document JSON and summary JSON. */
export interface DemoGraph {
  name: string
  description: string
  document: unknown
  summary: unknown | null
}

/** Demo graphs for the project with the given index in DEMO_PROJECTS (0: torus, 1: plane). */
export async function demoGraphsFor(projectIndex: number): Promise<DemoGraph[]> {
  const space = projectIndex === 0 ? 'torus' : 'plane'
  return PATTERN_EXAMPLES
    .filter(e => e.document.space === space)
    .map(e => ({ name: e.title, description: e.description, document: e.document,
      summary: analyzePattern(e.document).summary }))
}
