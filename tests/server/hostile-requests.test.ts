/**
 * Seeded property test (fast-check): 10,000+ hostile requests against every POST/PATCH/DELETE
 * route of the route table (route-matrix.ts), uploads included — wrong types, huge and deeply
 * nested bodies, NaN/Infinity, control characters, `__proto__` keys, chunked bodies past the
 * limit, foreign Origin, wrong content types, valid bodies with one field made hostile. Never a
 * 5xx, and the row count of every table is unchanged after each refused request. One server;
 * requests go in small parallel groups, the counts are read once per group (a group in which
 * something was accepted is not compared).
 */
import { createClient, type Client } from '@libsql/client'
import { join } from 'node:path'
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { client, signInAs, signUp, type ApiClient } from '../support/http'
import { ROUTES, type RouteSpec } from './route-matrix'
import { buildFixtures, fillPath, type Ids } from './route-matrix-fixtures'

const SEED = 20261202
const TOTAL = 10_400
const GROUP = 8
// no growing delay here: the limits themselves are tested in hardening-auth.test.ts
const ctx = useTestServer({ env: { NUXT_SIGN_IN_LIMIT_FREE_ADDRESS_FAILURES: '100000000' } })

const WRITE_ROUTES = Object.entries(ROUTES).filter(([, s]) => s.method !== 'GET')
// Calls that end the caller's own session are sent without one (else later requests lose it).
const SESSION_ENDING = new Set(['auth/sign-out.post.ts', 'account/sessions/index.delete.ts', 'auth/sign-in.post.ts', 'auth/sign-up.post.ts', 'invitations/[token]/accept.post.ts'])

let db: Client, tablesSql: string
let callers: ApiClient[]
let fixtures: { own: Ids, foreign: Ids, missing: Ids }

beforeAll(async () => {
  const url = ctx.server.url
  const [owner, editor, viewer] = await Promise.all([signInAs(url, 'owner'), signInAs(url, 'editor'), signInAs(url, 'viewer')])
  const outsider = await signUp(url, 'Outsider', 'outsider@example.test')
  const spare = await signUp(url, 'Spare', 'spare@example.test')
  const ids = async (c: ApiClient) => (await c.json('GET', '/api/account')).body.id as number
  fixtures = await buildFixtures(ctx.server, { owner, editor, outsider, spareUserId: await ids(spare), outsiderId: await ids(outsider) })
  const token = (await editor.json('POST', '/api/account/tokens', { name: 'hostile', scope: 'write' })).body.token as string
  const bearer: ApiClient = { ...client(url), fetch: (p, init = {}) => fetch(new URL(p, url), { ...init, headers: { ...(init.headers as Record<string, string>), authorization: `Bearer ${token}` } }) }
  callers = [client(url), owner, editor, viewer, bearer]
  db = createClient({ url: `file:${join(ctx.server.dataDir, 'wingfold.db')}` })
  const names = (await db.execute("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%' AND name <> 'sign_in_failures'")).rows.map(r => String(r.name))
  tablesSql = `SELECT ${names.map(n => `(SELECT count(*) FROM "${n}") AS "${n}"`).join(', ')}`
}, 180_000)

afterAll(() => db?.close())

const counts = async () => JSON.stringify((await db.execute(tablesSql)).rows[0])

/** One hostile request: a route, a caller, a variant of ids, and a body recipe. */
interface Hostile { route: number, caller: number, variant: 'own' | 'foreign' | 'missing', kind: string, payload: unknown, origin: boolean, contentType: string }

const scalar = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 40 }), fc.integer(), fc.double(), fc.boolean(), fc.constant(null),
  fc.constantFrom(-1, 0, 2 ** 53, -(2 ** 31), 1e308, '', ' ', '\u0000', '\u202e', '<script>x</script>', '../../etc', "' OR 1=1 --", 'NaN', 'Infinity'),
)
const hostileValue: fc.Arbitrary<unknown> = fc.letrec(tie => ({
  v: fc.oneof({ depthSize: 'small' }, scalar, fc.array(tie('v'), { maxLength: 4 }), fc.dictionary(fc.string({ maxLength: 8 }), tie('v'), { maxKeys: 4 })),
})).v
const KEYS = ['name', 'email', 'password', 'currentPassword', 'newPassword', 'document', 'message', 'points', 'specialPoints', 'settings', 'result', 'body', 'role', 'status', 'graphId', 'version', 'parentId', 'pointIndex', 'scope', 'notifyOptOut', 'signupEnabled', 'run', 'reason', '__proto__', 'constructor']

const recipe = fc.oneof(
  fc.record({ kind: fc.constant('anything'), payload: fc.anything({ maxDepth: 3 }) }),
  fc.record({ kind: fc.constant('keys'), payload: fc.dictionary(fc.constantFrom(...KEYS), hostileValue, { maxKeys: 6 }) }),
  fc.record({ kind: fc.constant('mutate'), payload: fc.tuple(fc.constantFrom(...KEYS), hostileValue) }),
  fc.record({ kind: fc.constant('raw'), payload: fc.constantFrom('{"x": NaN}', '{"name": Infinity}', '{', '[', '', 'null', '"text"', '{"__proto__": {"siteRole": "admin"}}', '{"constructor": {"prototype": {"x": 1}}}', '{"body": "\u0000\u0001\u0007\u001b[31m"}', '{"a":1,"a":2}', '\uFEFF{}') }),
  fc.record({ kind: fc.constant('deep'), payload: fc.tuple(fc.integer({ min: 1000, max: 20000 }), fc.boolean()) }),
  fc.record({ kind: fc.constant('huge'), payload: fc.integer({ min: 1_000_001, max: 1_600_000 }) }),
  fc.record({ kind: fc.constant('chunked'), payload: fc.integer({ min: 1_000_001, max: 1_300_000 }) }),
)

const hostile: fc.Arbitrary<Hostile> = fc.record({
  route: fc.nat({ max: WRITE_ROUTES.length - 1 }),
  caller: fc.nat({ max: 4 }),
  variant: fc.constantFrom('own', 'own', 'foreign', 'missing'),
  origin: fc.constantFrom(false, false, false, true), // a quarter of the requests claim a foreign Origin
  contentType: fc.constantFrom('application/json', 'application/json', 'application/json', 'text/plain', 'application/x-www-form-urlencoded', 'application/json; charset=utf-8'),
  recipe,
}).map(({ recipe: r, ...rest }) => ({ ...rest, kind: r.kind, payload: r.payload }))

function bodyOf(h: Hostile, spec: RouteSpec, ids: Ids): BodyInit {
  switch (h.kind) {
    case 'raw': return h.payload as string
    case 'deep': { const [n, arrays] = h.payload as [number, boolean]; return arrays ? '['.repeat(n) + ']'.repeat(n) : '{"a":'.repeat(n) + '1' + '}'.repeat(n) }
    case 'huge': return JSON.stringify({ body: 'a'.repeat(h.payload as number) })
    case 'chunked': {
      const total = h.payload as number
      let sent = 0
      return new ReadableStream({ pull(c) { if (sent >= total) { c.close(); return } const n = Math.min(65536, total - sent); sent += n; c.enqueue(new TextEncoder().encode('a'.repeat(n))) } })
    }
    case 'mutate': {
      const [key, value] = h.payload as [string, unknown]
      const base = (spec.body?.(ids) ?? {}) as Record<string, unknown>
      return JSON.stringify({ ...base, [key]: value }, (_, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v))
    }
    default: return JSON.stringify(h.payload ?? null) ?? 'null'
  }
}

describe('hostile requests', () => {
  it(`${TOTAL} seeded hostile requests: never a 5xx, nothing written when refused`, async () => {
    const requests = fc.sample(hostile, { seed: SEED, numRuns: TOTAL })
    const serverErrors: string[] = []
    const partialWrites: string[] = []
    const seen = new Map<string, number>()
    let compared = 0
    for (let g = 0; g < requests.length; g += GROUP) {
      const group = requests.slice(g, g + GROUP)
      const before = await counts()
      const statuses = await Promise.all(group.map(async (h) => {
        const [file, spec] = WRITE_ROUTES[h.route]!
        const caller = SESSION_ENDING.has(file) ? callers[0]! : callers[h.caller]!
        const ids = fixtures[h.variant]
        const headers: Record<string, string> = { 'content-type': h.contentType }
        if (h.origin) headers.origin = 'https://elsewhere.example'
        const res = await caller.fetch(fillPath(spec.path, ids), { method: spec.method, headers, body: bodyOf(h, spec, ids), duplex: 'half' } as RequestInit)
          .catch((e: Error) => ({ status: 599, arrayBuffer: async () => new ArrayBuffer(0), text: async () => e.message }))
        const text = res.status >= 500 ? await res.text() : (await res.arrayBuffer(), '')
        const key = `${res.status}`
        seen.set(key, (seen.get(key) ?? 0) + 1)
        if (res.status >= 500) serverErrors.push(`${spec.method} ${file} (${h.kind}, caller ${h.caller}) → ${res.status} ${text.slice(0, 200)}`)
        return res.status
      }))
      if (statuses.every(s => s >= 400)) {
        const after = await counts()
        compared++
        if (after !== before) partialWrites.push(`group at ${g}: ${statuses.join(',')} changed ${before} → ${after}`)
      }
    }
    console.log(`hostile requests: ${requests.length} over ${WRITE_ROUTES.length} POST/PATCH/DELETE routes, statuses ${JSON.stringify(Object.fromEntries([...seen].sort()))}, ${compared} of ${Math.ceil(requests.length / GROUP)} groups compared row counts`)
    expect(serverErrors.slice(0, 20)).toEqual([])
    expect(partialWrites.slice(0, 20)).toEqual([])
    expect(requests.length).toBeGreaterThanOrEqual(10_000)
  }, 600_000)
})
