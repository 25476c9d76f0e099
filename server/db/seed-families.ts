/**
 * Demo runs, maps and discussions: computed with the core (demo-runs.ts, demo-maps.ts) on the
 * stored pattern versions, checked with the very functions the routes use before they store
 * (`checkPoints` of server/utils/runs-verify.ts, `checkPostedMap` of server/utils/maps.ts), and
 * written as an upload + finish would write them. Idempotent: runs and maps are matched by name
 * within their project; comments are only added with a newly created run.
 */
import { and, eq } from 'drizzle-orm'
import { VERTICAL_BALANCE_DEFINITION } from '../../shared/pattern/report'
import { parsePatternDocument, type PatternDocument } from '../../shared/types/pattern'
import { RUN_RESIDUAL_TOLERANCE, checkPoints, rejectionReason } from '../utils/runs-verify'
import { checkPostedMap } from '../utils/maps'
import type { Database } from './client'
import { DEMO_MAPS, computeDemoMap } from './demo-maps'
import { DEMO_RUNS, computeDemoRuns, type DemoRun } from './demo-runs'
import { comments, graphs, graphVersions, maps, runPoints, runs } from './schema'

/** Who is who (account key → user id) and the demo projects' ids in DEMO_PROJECTS order. */
export interface SeedContext { userIds: Map<string, number>, projectIds: number[], appVersion: string }

/** Counts of what was added. */
export interface FamilySeedResult { runs: number, maps: number, comments: number }

async function patternVersion(db: Database, projectId: number, name: string): Promise<{ id: number, doc: PatternDocument }> {
  const g = await db.query.graphs.findFirst({ where: and(eq(graphs.projectId, projectId), eq(graphs.name, name)) })
  if (!g) throw new Error(`demo seed: no pattern "${name}" in project ${projectId}`)
  const v = await db.query.graphVersions.findFirst({ where: and(eq(graphVersions.graphId, g.id), eq(graphVersions.version, 1)) })
  return { id: v!.id, doc: parsePatternDocument(JSON.parse(v!.document)) }
}

/** Stores one computed run with the server's own residuals and verdict; returns its id. */
async function storeRun(db: Database, ctx: SeedContext, versionId: number, doc: PatternDocument, r: DemoRun, parentId: number | null): Promise<number> {
  const check = checkPoints(doc, r.settings, r.points, r.specialPoints)
  const verdict = check.ok
    ? { verification: 'verified' as const, verificationReason: `Every checked point has max|F| ≤ ${RUN_RESIDUAL_TOLERANCE} (largest ${check.maxResidual.toExponential(2)}).` }
    : { verification: 'rejected' as const, verificationReason: rejectionReason(check) }
  const [run] = await db.insert(runs).values({
    projectId: ctx.projectIds[r.spec.project]!, graphVersionId: versionId, name: r.spec.name, pathKind: r.settings.path.kind,
    settings: JSON.stringify(r.settings), status: 'complete', pointCount: r.points.length, specialCount: r.specialPoints.length,
    ...verdict, verticalBalance: VERTICAL_BALANCE_DEFINITION, appVersion: ctx.appVersion, authorId: ctx.userIds.get(r.spec.author)!,
    parentRunId: parentId, restartPointIndex: r.parent ? -1 - r.parent.specialPoint : null,
  }).returning({ id: runs.id })
  // the storage rule of server/utils/runs.ts: regular points at index ≥ 0, special point k at −1 − k
  const rows = [
    ...r.points.map(({ index, lambda, diagnostics, ...rest }) => ({
      runId: run!.id, index, lambda, residual: check.residuals.points.get(index) ?? NaN, state: JSON.stringify(rest),
      diagnostics: JSON.stringify({ ...diagnostics, ...(rest.sigmaMin !== undefined ? { sigmaMin: rest.sigmaMin } : {}) }), specialKind: null,
    })),
    ...r.specialPoints.map(({ index, lambda, kind, ...rest }) => ({
      runId: run!.id, index: -1 - index, lambda, residual: check.residuals.special.get(index) ?? NaN, state: JSON.stringify(rest), diagnostics: '{}', specialKind: kind,
    })),
  ]
  for (let i = 0; i < rows.length; i += 100) await db.insert(runPoints).values(rows.slice(i, i + 100))
  return run!.id
}

/** The short discussions of the demo, keyed by run name; `special` pins a thread to a special point. */
function threadsFor(name: string, runIds: Map<string, number>): Array<{ author: string, body: string, special?: number, replies?: Array<{ author: string, body: string }> }> {
  if (name === 'Even ring of four — lighter opposite edges') {
    const other = runIds.get('Even ring of four — the uneven branch')
    return [
      {
        author: 'editor', body: `Both branches through the branch point side by side: [compare the even and the uneven branch](/compare?runs=${runIds.get(name)},${other}&x=lambda&y=sigmaMin).`,
        replies: [{ author: 'owner', body: 'Saved as our reference comparison for the ring study.' }],
      },
      {
        author: 'owner', special: 0, body: 'The two light edges reach a quarter turn together here, at s = sin(π/6) = 1/2. The uneven states (one light edge at φ, the other at π − φ) branch off towards heavier weights.',
        replies: [{ author: 'viewer', body: 'Do the heavy edges stay at π/6 past this point?' }, { author: 'editor', body: 'On the uneven branch they do, exactly; on the even branch they drop below π/6 while the light edges turn past the quarter turn.' }],
      },
    ]
  }
  if (name === 'Weighted ring of four — α1 to the fold') {
    return [
      { author: 'owner', body: 'The light edge gives out first: past the first fold this family of twisted states cannot be pushed further in α1, it turns back.', replies: [{ author: 'editor', body: 'The fold agrees with the ring formula to the located precision.' }] },
      { author: 'editor', special: 0, body: 'Fold of α1: the branch turns back here and comes back through the second fold.' },
    ]
  }
  return []
}

/** Seeds the demo runs (parents before their other branches), maps and comments. */
export async function seedFamilies(db: Database, ctx: SeedContext): Promise<FamilySeedResult> {
  const out: FamilySeedResult = { runs: 0, maps: 0, comments: 0 }
  const runIds = new Map<string, number>()
  const created: string[] = []
  for (const spec of DEMO_RUNS) {
    const projectId = ctx.projectIds[spec.project]!
    const version = await patternVersion(db, projectId, spec.graph)
    const existing = await db.query.runs.findFirst({ where: and(eq(runs.projectId, projectId), eq(runs.name, spec.name)) })
    if (existing) {
      runIds.set(spec.name, existing.id)
      continue
    }
    for (const r of computeDemoRuns(version.doc, spec)) {
      const prev = await db.query.runs.findFirst({ where: and(eq(runs.projectId, projectId), eq(runs.name, r.spec.name)) })
      const id = prev?.id ?? await storeRun(db, ctx, version.id, version.doc, r, r.parent ? runIds.get(r.parent.name) ?? null : null)
      if (!prev) { out.runs++; created.push(r.spec.name) }
      runIds.set(r.spec.name, id)
    }
  }
  for (const name of created) {
    for (const t of threadsFor(name, runIds)) {
      const pointIndex = t.special === undefined ? null : -1 - t.special
      const [top] = await db.insert(comments).values({ runId: runIds.get(name)!, pointIndex, authorId: ctx.userIds.get(t.author)!, body: t.body }).returning({ id: comments.id })
      out.comments++
      for (const a of t.replies ?? []) {
        await db.insert(comments).values({ runId: runIds.get(name)!, pointIndex, parentId: top!.id, authorId: ctx.userIds.get(a.author)!, body: a.body })
        out.comments++
      }
    }
  }
  for (const spec of DEMO_MAPS) {
    const projectId = ctx.projectIds[spec.project]!
    if (await db.query.maps.findFirst({ where: and(eq(maps.projectId, projectId), eq(maps.name, spec.name)) })) continue
    const version = await patternVersion(db, projectId, spec.graph)
    const m = computeDemoMap(version.doc, spec)
    const check = checkPostedMap(version.doc, m.settings, m.result)
    const cells = m.result.rows.flatMap(r => r.cells)
    await db.insert(maps).values({
      projectId, graphVersionId: version.id, name: spec.name, plane: m.settings.plane, settings: JSON.stringify(m.settings),
      result: JSON.stringify({ result: m.result, curves: [] }), cellCount: cells.length, solvedCount: cells.filter(c => c.status === 'solved').length,
      verification: check.verification, verificationReason: check.reason, verticalBalance: VERTICAL_BALANCE_DEFINITION,
      appVersion: ctx.appVersion, authorId: ctx.userIds.get(spec.author)!,
    })
    out.maps++
  }
  return out
}
