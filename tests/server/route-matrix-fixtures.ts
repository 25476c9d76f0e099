/**
 * Objects for the authorisation matrix: the demo project the viewer, editor and owner belong to
 * ("own"), a project of an outsider nobody else belongs to ("foreign"), and ids that exist
 * nowhere ("missing"), with a valid body for every route that takes one.
 */
import { expect } from 'vitest'
import { findPatternExample } from '../../shared/examples'
import { runMapSweep } from '../../shared/maps'
import { parseMapSettings, type MapResult, type MapSettings } from '../../shared/types/maps'
import type { PatternDocument } from '../../shared/types/pattern'
import type { ApiClient } from '../support/http'
import type { TestServer } from '../support/server'
import { computeBatches, graphIdByName, projectIdByName } from './runs-helpers'
import { sqlOnServer } from './team-support'

/** Ids filling a route's placeholders, plus the bodies that need them. */
export interface Ids {
  project: number, graph: number, run: number, map: number, comment: number, invitation: number,
  member: number, token: number, message: number, link: string
  /** A census job: census jobs belong to the server, not to a project (any signed-in user sees them). */
  census: number
  /** A pattern found by that census. */
  censuspattern: number
  document: PatternDocument, mapSettings: MapSettings, mapResult: MapResult, runSettings: unknown, runExport: unknown, batch: unknown
}

const fermat = findPatternExample('fermat-pair')!
export const RUN_SETTINGS = { path: { kind: 'shear' as const }, to: -2, stop: { maxPoints: 6 } }
const batches = computeBatches(fermat.document, RUN_SETTINGS, 3)
const MAP_SETTINGS = parseMapSettings({ plane: 'tau', x: { min: -0.5, max: 0.5, count: 2 }, y: { min: 0.8, max: 1.2, count: 2 } })
const MAP_RESULT = runMapSweep(fermat.document, MAP_SETTINGS)
const MISSING = 999_999

const ok = async <T>(p: Promise<{ status: number, body: T }>, status = 201): Promise<T> => {
  const r = await p
  expect(r.status, JSON.stringify(r.body)).toBe(status)
  return r.body
}

/** A run (with its first batch stored) made by `author` on pattern `graph` of `project`. */
export async function makeRun(author: ApiClient, project: number, graph: number): Promise<number> {
  const run = await ok(author.json('POST', `/api/projects/${project}/runs`, { graphId: graph, name: 'matrix fixture', settings: RUN_SETTINGS })) as { id: number }
  await ok(author.json('POST', `/api/runs/${run.id}/points`, { points: batches[0]!.points, specialPoints: batches[0]!.specialPoints }), 200)
  return run.id
}

export const makeMap = async (author: ApiClient, project: number, graph: number): Promise<number> =>
  (await ok(author.json('POST', `/api/projects/${project}/maps`, { graphId: graph, name: 'matrix fixture', settings: MAP_SETTINGS, result: MAP_RESULT })) as { id: number }).id

export const makeComment = async (author: ApiClient, run: number): Promise<number> =>
  (await ok(author.json('POST', `/api/runs/${run}/comments`, { body: 'fixture comment' })) as { id: number }).id

export async function makeInvitation(owner: ApiClient, project: number): Promise<number> {
  const email = `inv${Math.random().toString(36).slice(2)}@example.test`
  await ok(owner.json('POST', `/api/projects/${project}/invitations`, { email, role: 'viewer' }))
  const list = (await owner.json('GET', `/api/projects/${project}/invitations`)).body as Array<{ id: number, email: string }>
  return list.find(i => i.email === email)!.id
}

/** A member row for `userId` (a spare account) in `project`, written straight to the database. */
export async function makeMember(server: TestServer, project: number, userId: number): Promise<number> {
  await sqlOnServer(server, 'INSERT OR IGNORE INTO memberships (project_id, user_id, role) VALUES (?, ?, ?)', [project, userId, 'viewer'])
  return userId
}

/** The own and foreign fixtures (and the missing ids). */
export async function buildFixtures(server: TestServer, c: { owner: ApiClient, editor: ApiClient, outsider: ApiClient, spareUserId: number, outsiderId: number }) {
  const project = await projectIdByName(c.owner, 'Genus-three torus gluings')
  const graph = await graphIdByName(c.owner, project, fermat.title)
  const run = await makeRun(c.editor, project, graph)
  const runExport = (await c.editor.json('GET', `/api/runs/${run}/export.json`)).body
  const common = { census: 0, censuspattern: 0, document: fermat.document, mapSettings: MAP_SETTINGS, mapResult: MAP_RESULT, runSettings: RUN_SETTINGS, runExport, batch: { points: batches[1]!.points, specialPoints: batches[1]!.specialPoints }, link: 'x'.repeat(43) }
  const invitation = await makeInvitation(c.owner, project)
  // a tiny census (one tower, up to 6 half-edges: the three-loop pattern, H. Chen, M. Traizet,
  // arXiv 2103.15676, 2021, Ex. 7.2) so the census routes have a job to address
  const census = (await ok(c.owner.json('POST', '/api/census/jobs', { maxTowers: 1, maxHalfEdges: 6 })) as { id: number }).id
  let censuspattern = MISSING
  for (let i = 0; i < 400 && censuspattern === MISSING; i++) {
    const job = (await ok(c.owner.json('GET', `/api/census/jobs/${census}`), 200)) as { status: string }
    if (['done', 'failed', 'cancelled'].includes(job.status)) {
      const list = (await ok(c.owner.json('GET', '/api/census/patterns'), 200)) as { patterns: Array<{ id: number }> }
      censuspattern = list.patterns[0]?.id ?? MISSING
      break
    }
    await new Promise(r => setImmediate(r))
  }
  const [msg] = await sqlOnServer(server, 'SELECT max(id) AS id FROM mail_messages')
  const own: Ids = {
    ...common, project, graph, run, map: await makeMap(c.editor, project, graph), comment: await makeComment(c.editor, run), invitation,
    member: await makeMember(server, project, c.spareUserId), token: MISSING, message: Number(msg!.id), census, censuspattern,
  }
  const fProject = (await ok(c.outsider.json('POST', '/api/projects', { name: 'Outsider project' })) as { id: number }).id
  const fGraph = (await ok(c.outsider.json('POST', `/api/projects/${fProject}/graphs`, { name: 'outsider pattern', document: fermat.document })) as { id: number }).id
  const fRun = await makeRun(c.outsider, fProject, fGraph)
  const foreign: Ids = {
    ...common, project: fProject, graph: fGraph, run: fRun, map: await makeMap(c.outsider, fProject, fGraph), comment: await makeComment(c.outsider, fRun),
    invitation: await makeInvitation(c.outsider, fProject), member: c.outsiderId, token: MISSING, message: MISSING, census, censuspattern,
  }
  const missing: Ids = { ...common, project: MISSING, graph: MISSING, run: MISSING, map: MISSING, comment: MISSING, invitation: MISSING, member: MISSING, token: MISSING, message: MISSING, census: MISSING, censuspattern: MISSING }
  return { own, foreign, missing }
}

/** The path with its `:name` placeholders filled from `ids`. */
export function fillPath(path: string, ids: Ids): string {
  return path.replace(/:([a-z]+)/g, (_, k: string) => String((ids as unknown as Record<string, unknown>)[k]))
}
