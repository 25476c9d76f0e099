/**
 * Demo seed: the invented research group of demo-data.ts, two projects, their gluing patterns,
 * and saved runs, maps and discussions computed with the core at seed time (seed-families.ts).
 * Idempotent: accounts are matched by e-mail (password and role reset), projects by name,
 * graphs, runs and maps by name within their project; nothing else is touched.
 */
import { and, eq } from 'drizzle-orm'
import type { Database } from './client'
import { DEMO_ACCOUNTS, DEMO_PROJECTS } from './demo-data'
import { demoGraphsFor } from './demo-graphs'
import { activity, graphs, graphVersions, memberships, projects, users } from './schema'
import { seedFamilies } from './seed-families'

/** Options of {@link seedDemo}. */
export interface SeedOptions {
  /** Password hasher (nuxt-auth-utils' scrypt `hashPassword` in the server). */
  hash: (password: string) => Promise<string>
  /** Version stamped on the seeded runs and maps (the server's `public.appVersion`). */
  appVersion: string
}

/** Summary of what the seed did. */
export interface SeedResult { users: number, projects: number, graphs: number, runs: number, maps: number,
  comments: number }

/** Create or refresh the demo data. */
export async function seedDemo(db: Database, opts: SeedOptions): Promise<SeedResult> {
  const ids = new Map<string, number>()
  for (const a of DEMO_ACCOUNTS) {
    const passwordHash = await opts.hash(a.password)
    const [row] = await db.insert(users)
      .values({ email: a.email, name: a.name, passwordHash, siteRole: a.siteRole })
      .onConflictDoUpdate({ target: users.email, set: { name: a.name, passwordHash, siteRole: a.siteRole } })
      .returning({ id: users.id })
    ids.set(a.key, row!.id)
  }
  let graphCount = 0
  const projectIds: number[] = []
  // the first pattern of each project is its showcase: stored as the newest, it heads the list
  const now = Date.now()
  for (const [i, p] of DEMO_PROJECTS.entries()) {
    const ownerId = ids.get('owner')!
    let project = await db.query.projects.findFirst({ where: eq(projects.name, p.name) })
    if (!project) {
      ;[project] = await db.insert(projects).values({ name: p.name, description: p.description,
        createdBy: ownerId }).returning()
      await db.insert(activity).values({ projectId: project!.id, actorId: ownerId, verb: 'created',
        objectType: 'project', objectId: project!.id })
    }
    const projectId = project!.id
    projectIds.push(projectId)
    for (const m of p.members) {
      await db.insert(memberships).values({ projectId, userId: ids.get(m.key)!, role: m.role })
        .onConflictDoUpdate({ target: [memberships.projectId, memberships.userId], set: { role: m.role } })
    }
    for (const [k, g] of demoGraphsFor(i).entries()) {
      const existing = await db.query.graphs.findFirst({ where: and(eq(graphs.projectId, projectId),
        eq(graphs.name, g.name)) })
      if (existing) continue
      const at = new Date(now - 1000 * k)
      const [graph] = await db.insert(graphs).values({ projectId, name: g.name, description: g.description,
        latestVersion: 1, createdBy: ownerId, createdAt: at, updatedAt: at }).returning()
      await db.insert(graphVersions).values({
        graphId: graph!.id,
        version: 1,
        document: JSON.stringify(g.document),
        message: 'Demo seed',
        analysisSummary: g.summary == null ? null : JSON.stringify(g.summary),
        authorId: ownerId,
        createdAt: at,
        updatedAt: at,
      })
      graphCount++
    }
  }
  const families = await seedFamilies(db, { userIds: ids, projectIds, appVersion: opts.appVersion })
  return { users: DEMO_ACCOUNTS.length, projects: DEMO_PROJECTS.length, graphs: graphCount, ...families }
}

/** True when the database holds no user yet (first start). */
export async function isEmpty(db: Database): Promise<boolean> {
  const one = await db.select({ id: users.id }).from(users).limit(1)
  return one.length === 0
}
