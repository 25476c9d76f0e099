/**
 * Helpers for the team-work server tests: read the outbox as the demo admin, wait for a message
 * to reach the fake SMTP server, pull a link out of it, and edit the test server's SQLite file
 * directly (e.g. to age a token past its expiry).
 */
import { join } from 'node:path'
import { createClient } from '@libsql/client'
import { expect } from 'vitest'
import type { ApiClient } from '../support/http'
import type { TestServer } from '../support/server'
import type { OutboxMessage } from '../../shared/types/team'

export type { OutboxMessage }

/** Poll the outbox (as an admin) until `match` finds a message in one of `statuses`. */
export async function waitForMail(admin: ApiClient, match: (m: OutboxMessage) => boolean, statuses = ['delivered'], timeoutMs = 20_000): Promise<OutboxMessage> {
  const deadline = Date.now() + timeoutMs
  let last: unknown
  while (Date.now() < deadline) {
    const { body } = await admin.json('GET', '/api/admin/outbox?pageSize=100')
    last = body
    const hit = (body.items as OutboxMessage[]).find(m => match(m) && statuses.includes(m.status))
    if (hit) return (await admin.json('GET', `/api/admin/outbox/${hit.id}`)).body
    await new Promise(ok => setTimeout(ok, 200))
  }
  throw new Error(`no matching mail in ${statuses.join('/')}: ${JSON.stringify(last)}`)
}

/** The highest outbox id so far (0 when empty): match only newer messages after an action. */
export async function lastMailId(admin: ApiClient): Promise<number> {
  const { body } = await admin.json('GET', '/api/admin/outbox?pageSize=1')
  return (body.items as OutboxMessage[])[0]?.id ?? 0
}

/** All outbox messages to `address`. */
export async function mailsTo(admin: ApiClient, address: string): Promise<OutboxMessage[]> {
  const { body } = await admin.json('GET', '/api/admin/outbox?pageSize=100')
  return (body.items as OutboxMessage[]).filter(m => m.toAddress.includes(address))
}

/** The path of the first link to `<prefix>/<token>` in a message's text body; checks the HTML carries the same link. */
export function linkIn(mail: OutboxMessage, prefix: string): { path: string, token: string } {
  const match = mail.textBody.match(new RegExp(`https?://[^\\s/]+(/${prefix}/([A-Za-z0-9_-]+))`))
  expect(match, mail.textBody).not.toBeNull()
  expect(mail.htmlBody).toContain(`${match![1]}"`)
  return { path: match![1]!, token: match![2]! }
}

/** Run SQL on the test server's database file; returns the rows (if any). */
export async function sqlOnServer(server: TestServer, sql: string, args: Array<string | number | null> = []): Promise<Array<Record<string, unknown>>> {
  const db = createClient({ url: `file:${join(server.dataDir, 'wingfold.db')}` })
  try { return (await db.execute({ sql, args })).rows as unknown as Array<Record<string, unknown>> }
  finally { db.close() }
}
