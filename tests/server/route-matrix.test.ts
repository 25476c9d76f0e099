/**
 * Authorisation matrix: every route file under server/api (the table in route-matrix.ts) ×
 * every identity (anonymous, non-member, viewer, editor, owner, site admin, read token, write
 * token) × own / foreign / missing objects. Rules (server/utils/access.ts): no session → 401;
 * an object the caller may not see (missing, or in a project they are not a member of) → 404;
 * a member below the role → 403; a read token on a writing method → 403; allowed callers get
 * neither 401, 403 nor 404; nobody ever gets a 5xx.
 */
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signIn, signInAs, signUp, type ApiClient } from '../support/http'
import { ROOT } from '../support/server'
import { ROUTES, type Identity, type RouteSpec } from './route-matrix'
import { buildFixtures, fillPath, makeComment, makeInvitation, makeMap, makeMember, makeRun, type Ids } from './route-matrix-fixtures'

const ctx = useTestServer()
const IDENTITIES: Identity[] = ['anonymous', 'non-member', 'viewer', 'editor', 'owner', 'site admin', 'read token', 'write token']
const ROLE_OF: Partial<Record<Identity, 'viewer' | 'editor' | 'owner'>> = { viewer: 'viewer', editor: 'editor', owner: 'owner', 'read token': 'viewer', 'write token': 'editor' }
const RANK = { viewer: 1, editor: 2, owner: 3 }
type Variant = 'own' | 'foreign' | 'missing'

function routeFiles(dir = join(ROOT, 'server/api')): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name)
    return statSync(p).isDirectory() ? routeFiles(p) : [relative(join(ROOT, 'server/api'), p)]
  }).sort()
}

const projectScoped = (s: RouteSpec) => s.access === 'viewer' || s.access === 'editor' || s.access === 'owner'
function variantsOf(s: RouteSpec): Variant[] {
  if (projectScoped(s)) return ['own', 'foreign', 'missing']
  if (s.access === 'admin' && s.path.includes(':message')) return ['own', 'missing']
  return ['own']
}

/** What `who` must get: 'allowed' (not 401/403/404), 'any' (public) or a status. */
function expected(s: RouteSpec, who: Identity, variant: Variant): 'allowed' | 'any' | number {
  if (s.access === 'public') return 'any'
  if (who === 'anonymous') return 401
  const token = who.endsWith('token')
  if (s.access === 'session' && token) return 401
  if (who === 'read token' && s.method !== 'GET') return 403
  // server-wide objects (census jobs and patterns) are seen by every signed-in user; a missing one is 404
  if (s.access === 'user' || s.access === 'session') return variant === 'missing' && s.path.includes(':census') ? 404 : 'allowed'
  if (s.access === 'admin') return who !== 'site admin' ? 403 : variant === 'missing' ? 404 : 'allowed'
  if (variant !== 'own') return 404
  const role = ROLE_OF[who]
  if (!role) return 404
  if (s.allowed) return s.allowed.includes(who) ? 'allowed' : 403
  return RANK[role] >= RANK[s.access as 'viewer'] ? 'allowed' : 403
}

let callers: Record<Identity, ApiClient>
let tokens: { read: string, write: string }
let fixtures: Record<Variant, Ids>
// helpers that make fresh objects use write tokens: "sign out everywhere" cells end sessions, not tokens
let editor: ApiClient, owner: ApiClient, spareUserId: number

/** A client that sends only a bearer token. */
function tokenClient(token: string): ApiClient {
  const c = client(ctx.server.url)
  return {
    ...c,
    fetch: (path, init = {}) => fetch(new URL(path, ctx.server.url), { ...init, headers: { ...(init.headers as Record<string, string>), authorization: `Bearer ${token}` } }),
    json: async (method, path, body) => {
      const res = await fetch(new URL(path, ctx.server.url), {
        method, headers: { authorization: `Bearer ${token}`, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
        body: body === undefined ? undefined : JSON.stringify(body),
      })
      const text = await res.text()
      let parsed: unknown = text
      try { parsed = text ? JSON.parse(text) : null } catch { /* CSV */ }
      return { status: res.status, body: parsed as never }
    },
  }
}

/** A freshly signed-in client for `who` (cells that end sessions use their own). */
async function freshCaller(who: Identity): Promise<ApiClient> {
  if (who === 'anonymous') return client(ctx.server.url)
  if (who === 'read token') return tokenClient(tokens.read)
  if (who === 'write token') return tokenClient(tokens.write)
  if (who === 'non-member') return signIn(ctx.server.url, 'non-member@example.test', 'a-long-test-passphrase')
  return signInAs(ctx.server.url, who === 'site admin' ? 'admin' : who)
}

/** Own objects made anew for a cell that deletes or finishes them. */
async function freshOwn(s: RouteSpec, caller: ApiClient): Promise<Ids> {
  const ids = { ...fixtures.own }
  const path = s.path
  if (path.includes(':run') && s.method !== 'GET') ids.run = await makeRun(editor, ids.project, ids.graph)
  if (path.includes(':comment')) ids.comment = await makeComment(editor, ids.run)
  if (path.includes(':map')) ids.map = await makeMap(editor, ids.project, ids.graph)
  if (path.includes(':invitation')) ids.invitation = await makeInvitation(owner, ids.project)
  if (path.includes(':member')) ids.member = await makeMember(ctx.server, ids.project, spareUserId)
  if (path.includes(':token')) {
    const made = await caller.json('POST', '/api/account/tokens', { name: 'to revoke', scope: 'read' })
    if (made.status === 201) ids.token = made.body.id
  }
  return ids
}

beforeAll(async () => {
  const url = ctx.server.url
  const [viewerC, editorC, ownerC, adminC] = await Promise.all([signInAs(url, 'viewer'), signInAs(url, 'editor'), signInAs(url, 'owner'), signInAs(url, 'admin')])
  const nonMember = await signUp(url, 'Non Member', 'non-member@example.test')
  const outsider = await signUp(url, 'Outsider', 'outsider@example.test')
  const spare = await signUp(url, 'Spare', 'spare@example.test')
  spareUserId = (await spare.json('GET', '/api/account')).body.id
  const outsiderId = (await outsider.json('GET', '/api/account')).body.id
  tokens = {
    read: (await viewerC.json('POST', '/api/account/tokens', { name: 'matrix read', scope: 'read' })).body.token,
    write: (await editorC.json('POST', '/api/account/tokens', { name: 'matrix write', scope: 'write' })).body.token,
  }
  editor = tokenClient(tokens.write)
  owner = tokenClient((await ownerC.json('POST', '/api/account/tokens', { name: 'matrix owner', scope: 'write' })).body.token)
  fixtures = await buildFixtures(ctx.server, { owner: ownerC, editor: editorC, outsider, spareUserId, outsiderId })
  callers = {
    anonymous: client(url), 'non-member': nonMember, viewer: viewerC, editor: editorC, owner: ownerC, 'site admin': adminC,
    'read token': tokenClient(tokens.read), 'write token': tokenClient(tokens.write),
  }
}, 120_000)

describe('authorisation matrix', () => {
  it('lists every route file under server/api', () => {
    const files = routeFiles()
    const unlisted = files.filter(f => !(f in ROUTES))
    const stale = Object.keys(ROUTES).filter(f => !files.includes(f))
    expect(unlisted, `Route files missing from tests/server/route-matrix.ts (add each with its access rule): ${unlisted.join(', ')}`).toEqual([])
    expect(stale, `Entries in tests/server/route-matrix.ts without a route file: ${stale.join(', ')}`).toEqual([])
  })

  it('gives every identity exactly its rights on own, foreign and missing objects', async () => {
    const wrong: string[] = []
    let cells = 0
    const check = async (file: string, s: RouteSpec, who: Identity, variant: Variant, caller: ApiClient, ids: Ids) => {
      const want = expected(s, who, variant)
      const path = fillPath(s.path, ids)
      const body = s.body ? JSON.stringify(s.body(ids)) : undefined
      const res = await caller.fetch(path, { method: s.method, headers: body ? { 'content-type': 'application/json' } : {}, body })
      await res.arrayBuffer()
      const status = res.status
      cells++
      const fine = status < 500 && (want === 'any' || (want === 'allowed' ? ![401, 403, 404].includes(status) : status === want))
      if (!fine) wrong.push(`${file} ${s.method} ${path} as ${who} (${variant}): got ${status}, want ${want}`)
    }
    const entries = Object.entries(ROUTES)
    for (const [file, s] of entries.filter(([, s]) => !s.fresh)) {
      await Promise.all(IDENTITIES.flatMap(who => variantsOf(s).map(v => check(file, s, who, v, callers[who], fixtures[v]))))
    }
    for (const [file, s] of entries.filter(([, s]) => s.fresh)) {
      for (const who of IDENTITIES) {
        for (const v of variantsOf(s)) {
          const caller = await freshCaller(who)
          await check(file, s, who, v, caller, v === 'own' ? await freshOwn(s, caller) : fixtures[v])
        }
      }
    }
    const routes = entries.length
    console.log(`authorisation matrix: ${routes} route files × ${IDENTITIES.length} identities × own/foreign/missing objects where they apply = ${cells} checked requests`)
    expect(wrong).toEqual([])
    // every identity of the table was exercised on every route
    expect(cells).toBeGreaterThanOrEqual(routes * IDENTITIES.length)
  }, 600_000)
})
