/**
 * Gluing patterns stored by the demo seed. Until the core's example documents exist these are
 * clearly marked placeholders (no analysis summary, so no verdict is shown for them).
 */

/** A graph for the seed: display name, description, document JSON and optional summary JSON. */
export interface DemoGraph {
  name: string
  description: string
  document: unknown
  summary: unknown | null
}

/** Demo graphs for the project with the given index in DEMO_PROJECTS. */
export async function demoGraphsFor(projectIndex: number): Promise<DemoGraph[]> {
  const placeholder = (name: string): DemoGraph => ({
    name,
    description: 'Placeholder until the pattern format exists.',
    document: { placeholder: true, name },
    summary: null,
  })
  return projectIndex === 0 ? [placeholder('Two-tower torus pattern')] : [placeholder('Open-wing pair')]
}
