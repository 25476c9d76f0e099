/**
 * Helpers for the team-work server tests: read the outbox as the demo admin, wait for a message
 * to reach the fake SMTP server, pull a link out of it, and edit the test server's SQLite file
 * directly (e.g. to age a token past its expiry).
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { createClient } from '@libsql/client'
import { expect } from 'vitest'
import type { ApiClient } from '../support/http'
import { mailboxDirOf, type TestServer } from '../support/server'
import type { OutboxMessage } from '../../shared/types/team'

export type { OutboxMessage }

/**
 * Poll the outbox (as an admin) until `match` finds a message in one of `statuses`. A delivered
 * message comes back with the bodies its recipient received (the mailbox folder, with working
 * links); the admin's own view is `admin.json('GET', '/api/admin/outbox/<id>')`, where
 * single-use links are redacted.
 */
export async function waitForMail(admin: ApiClient, match: (m: OutboxMessage) => boolean, statuses = ['delivered'], timeoutMs = 20_000): Promise<OutboxMessage> {
  const deadline = Date.now() + timeoutMs
  let last: unknown
  while (Date.now() < deadline) {
    const { body } = await admin.json('GET', '/api/admin/outbox?pageSize=100')
    last = body
    const hit = (body.items as OutboxMessage[]).find(m => match(m) && statuses.includes(m.status))
    if (hit) {
      const shown = (await admin.json('GET', `/api/admin/outbox/${hit.id}`)).body as OutboxMessage
      if (hit.status !== 'delivered') return shown
      const got = receivedCopy(mailboxDirOf(admin.baseUrl), hit.id)
      if (got) return { ...shown, textBody: got.text, htmlBody: got.html }
    }
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

/** A message as the recipient received it (the fake SMTP server's mailbox folder). */
export interface ReceivedMail { outboxId: number, to: string, subject: string, text: string, html: string, messageId: string }

function mailboxFiles(dir: string): ReceivedMail[] {
  if (!existsSync(dir)) return []
  return readdirSync(dir).sort().map(f => JSON.parse(readFileSync(join(dir, f), 'utf8')) as ReceivedMail)
}

function receivedCopy(dir: string, outboxId: number): ReceivedMail | undefined {
  return mailboxFiles(dir).find(m => m.outboxId === outboxId)
}

/**
 * The messages to `address` in the test server's mailbox folder (`NUXT_MAILBOX_DIR`, set by
 * tests/support/server.ts): what the recipient got, with its working links. The outbox that
 * admins see never holds those links.
 */
export async function readMailbox(server: TestServer, address: string): Promise<ReceivedMail[]> {
  return mailboxFiles(join(server.dataDir, 'mailbox')).filter(m => m.to.includes(address))
}
