/** Helpers for the run tests: compute a family with the core in node and upload it in batches. */
import { FamilyRunner, type FamilyBatch } from '../../shared/families/runner'
import type { FamilySettingsInput } from '../../shared/types/family'
import type { PatternDocument } from '../../shared/types/pattern'
import type { ApiClient } from '../support/http'

/** Every batch of a run computed to its end (synchronously, batches of `points`). */
export function computeBatches(doc: PatternDocument, settings: FamilySettingsInput, points = 10): FamilyBatch[] {
  const runner = new FamilyRunner(doc, settings)
  const out: FamilyBatch[] = []
  for (;;) {
    const b = runner.step({ points, ms: 60_000 })
    out.push(b)
    if (b.done) return out
  }
}

/** The graph id of a project's pattern by name. */
export async function graphIdByName(c: ApiClient, projectId: number, name: string): Promise<number> {
  const list = (await c.json('GET', `/api/projects/${projectId}/graphs`)).body as Array<{ id: number, name: string }>
  return list.find(g => g.name === name)!.id
}

/** A project id by name, as seen by this client. */
export async function projectIdByName(c: ApiClient, name: string): Promise<number> {
  const list = (await c.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
  return list.find(p => p.name === name)!.id
}
