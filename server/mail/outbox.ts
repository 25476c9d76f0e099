/**
 * The outbox: every message is first written to `mail_messages` (status `queued`), then sent
 * through nodemailer. A failed attempt leaves the row `retrying` with the error and a next-attempt
 * time (exponential backoff, see config.ts); after `maxAttempts` it is `failed` and stays visible
 * on the admin outbox page, where it can be retried. The action that caused a message never
 * waits for delivery and never fails because of it.
 * Statuses: queued → sending → sent (real SMTP) | delivered (received by the fake server)
 *           sending → retrying → … → failed.
 */
import { randomBytes } from 'node:crypto'
import { and, eq, inArray, lte } from 'drizzle-orm'
import { backoffMs } from './backoff'
import { mailSettings } from './config'
import { useMailTransport } from './transport'
import type { RenderedMail } from './templates'

/** A message to send: recipient plus a rendered template. */
export interface OutgoingMail extends RenderedMail {
  to: string
  /** Template name, shown in the outbox. */
  kind: string
}

const DUE_STATUSES = ['queued', 'retrying']

/** Write a message to the outbox and start delivering it in the background. Returns its id. */
export async function enqueueMail(mail: OutgoingMail): Promise<number> {
  const { from } = mailSettings()
  const messageId = `<wf-${randomBytes(12).toString('hex')}@wingfold.local>`
  const [row] = await useDb().insert(tables.mailMessages).values({
    toAddress: mail.to, subject: mail.subject, textBody: mail.text, htmlBody: mail.html,
    kind: mail.kind, fromAddress: from, messageId, status: 'queued', nextAttemptAt: new Date(),
  }).returning({ id: tables.mailMessages.id })
  void deliverMessage(row!.id).catch(error => console.error('[wingfold] mail delivery:', error))
  return row!.id
}

/**
 * Try to deliver one queued or retrying message (claimed atomically, so a concurrent tick
 * cannot send it twice). Resolves to the new status, or null when the row was not due.
 */
export async function deliverMessage(id: number): Promise<string | null> {
  const m = tables.mailMessages
  const db = useDb()
  const [row] = await db.update(m).set({ status: 'sending' })
    .where(and(eq(m.id, id), inArray(m.status, DUE_STATUSES))).returning()
  if (!row) return null
  const { maxAttempts, retrySeconds } = mailSettings()
  const attempts = row.attempts + 1
  try {
    const transport = await useMailTransport()
    await transport.sendMail({
      from: row.fromAddress, to: row.toAddress, subject: row.subject,
      text: row.textBody, html: row.htmlBody ?? undefined, messageId: row.messageId ?? undefined,
    })
    // The fake server may already have marked the row `delivered` during the SMTP conversation.
    await db.update(m).set({ attempts, sentAt: new Date(), error: null, nextAttemptAt: null }).where(eq(m.id, id))
    await db.update(m).set({ status: 'sent' }).where(and(eq(m.id, id), eq(m.status, 'sending')))
    return 'sent'
  }
  catch (error) {
    const failed = attempts >= maxAttempts
    await db.update(m).set({
      attempts,
      status: failed ? 'failed' : 'retrying',
      error: (error as Error).message?.slice(0, 500) || String(error),
      nextAttemptAt: failed ? null : new Date(Date.now() + backoffMs(attempts, retrySeconds)),
    }).where(eq(m.id, id))
    return failed ? 'failed' : 'retrying'
  }
}

/** Deliver every message whose next attempt is due (called by the mail plugin's timer). */
export async function deliverDue(limit = 20): Promise<void> {
  const m = tables.mailMessages
  const due = await useDb().select({ id: m.id }).from(m)
    .where(and(inArray(m.status, DUE_STATUSES), lte(m.nextAttemptAt, new Date()))).limit(limit)
  for (const { id } of due) await deliverMessage(id)
}

/** Put a message back in the queue now with a fresh attempt budget (admin "retry"). */
export async function requeueMessage(id: number): Promise<boolean> {
  const m = tables.mailMessages
  const rows = await useDb().update(m).set({ status: 'queued', attempts: 0, nextAttemptAt: new Date() })
    .where(and(eq(m.id, id), inArray(m.status, ['failed', 'retrying']))).returning({ id: m.id })
  if (rows.length) void deliverMessage(id).catch(error => console.error('[wingfold] mail delivery:', error))
  return rows.length > 0
}

/** After a restart, messages caught mid-send go back to `retrying`. */
export async function releaseStuckMessages(): Promise<void> {
  const m = tables.mailMessages
  await useDb().update(m).set({ status: 'retrying', nextAttemptAt: new Date() }).where(eq(m.status, 'sending'))
}
