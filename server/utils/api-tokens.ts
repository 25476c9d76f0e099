/**
 * Personal API tokens and single-use link tokens.
 *
 * A token is 32 random bytes (256 bits) from the OS generator, base64url-encoded; API tokens get
 * a `wfp_` prefix so they are recognisable in scripts and secret scanners. Only the SHA-256 hash
 * is stored. Why a fast hash rather than scrypt: slow hashes protect low-entropy secrets
 * (passwords) against guessing; a 256-bit random token cannot be guessed, so a single SHA-256
 * is enough, and because it is unsalted and deterministic it can be looked up through the unique
 * index on `token_hash` in one query on every request.
 */
import type { H3Event } from 'h3'
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, isNull } from 'drizzle-orm'
import type { TokenScope } from '#shared/types/roles'

/** Prefix of personal API tokens. */
export const API_TOKEN_PREFIX = 'wfp_'

/** A fresh random secret (32 bytes, base64url, 43 characters). */
export function newSecret(): string {
  return randomBytes(32).toString('base64url')
}

/** SHA-256 of a token, hex. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}

/** Methods a read-scoped token may use. */
const READ_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

/** The bearer token of the request, or null when there is no `Authorization: Bearer` header. */
export function bearerToken(event: H3Event): string | null {
  const header = getRequestHeader(event, 'authorization')
  const match = header?.match(/^Bearer\s+(\S+)\s*$/i)
  return match ? match[1]! : null
}

/**
 * Authenticate a request by its bearer token: 401 when the token is unknown or revoked, 403 when a
 * read-scoped token is used with a method that writes. Records the last-used time.
 * @returns the session-shaped user and the token's scope
 */
export async function userFromBearer(event: H3Event, token: string) {
  const t = tables.apiTokens
  const db = useDb()
  const row = await db.select({ tokenId: t.id, scope: t.scope, id: tables.users.id, email: tables.users.email,
    name: tables.users.name, siteRole: tables.users.siteRole })
    .from(t).innerJoin(tables.users, eq(tables.users.id, t.userId))
    .where(and(eq(t.tokenHash, hashToken(token)), isNull(t.revokedAt))).get()
  if (!row) throw httpError(401, 'bad_token', 'This API token is not valid or has been revoked.')
  if (row.scope === 'read' && !READ_METHODS.has(event.method.toUpperCase())) {
    throw httpError(403, 'token_read_only', 'This API token is read-only; create a read-write token to make changes.')
  }
  await db.update(t).set({ lastUsedAt: new Date() }).where(eq(t.id, row.tokenId))
  const { tokenId: _tokenId, scope, ...user } = row
  return { user, scope: scope as TokenScope }
}

/** Create a personal API token; returns the plain token (shown once) and its row id. */
export async function createApiToken(userId: number, name: string, scope: TokenScope) {
  const token = API_TOKEN_PREFIX + newSecret()
  const [row] = await useDb().insert(tables.apiTokens).values({ userId, name, scope,
    tokenHash: hashToken(token) }).returning()
  return { token, row: row! }
}

/** A token row as the account page lists it. */
export function toTokenItem(r: typeof tables.apiTokens.$inferSelect) {
  return {
    id: r.id, name: r.name, scope: r.scope, lastUsedAt: r.lastUsedAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null, createdAt: r.createdAt.toISOString(),
  }
}
