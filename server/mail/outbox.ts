/**
 * The outbox: every message is first written to `mail_messages` (status `queued`), then sent
 * through nodemailer. A failed attempt leaves the row `retrying` with the error and a next-attempt
 * time (exponential backoff, see config.ts); after `maxAttempts` it is `failed` and stays visible
 * on the admin outbox page, where it can be retried. The action that caused a message never
 * waits for delivery and never fails because of it.
 * Statuses: queued → sending → sent (real SMTP) | delivered (received by the fake server)
 *           sending → retrying → … → failed.
 *
 * Security mail (password resets, invitations) carries a single-use link. The outbox row shows
 * a redacted copy ({@link REDACTED_LINK} in place of the link), and the working copy lives in
 * `delivery_body` only until the message is sent, or until its link has expired anyway
 * ({@link dropExpiredDeliveryBodies}), so no admin page or API ever returns a usable link. A
 * failed message can be retried while its link lives; after that the recipient asks for a new one.
 */
import { randomBytes } from 'node:crypto'
import { and, eq, inArray, isNotNull, isNull, like, lt, lte, not } from 'drizzle-orm'
import { backoffMs } from './backoff'
import { linkLifetimes, mailSettings } from './config'
import { useMailTransport } from './transport'
import type { RenderedMail } from './templates'

/** A message to send: recipient plus a rendered template. */
export interface OutgoingMail extends RenderedMail {
  to: string
  /** Template name, shown in the outbox. */
  kind: string
  /** A single-use link in the message: kept only for delivery, redacted in what is stored and shown. */
  secretUrl?: string
}

/** What the outbox shows instead of a single-use link. */
export const REDACTED_LINK = '[link sent only to the recipient]'

/** `text` with every occurrence of `secret` (raw or HTML-escaped) replaced by {@link REDACTED_LINK}. */
export function redact(text: string, secret: string): string {
  const escaped = secret.replaceAll('&', '&amp;').replaceAll('<', '&lt;').replaceAll('>', '&gt;').replaceAll('"',
    '&quot;')
  return text.replaceAll(secret, REDACTED_LINK).replaceAll(escaped, REDACTED_LINK)
}

const DUE_STATUSES = ['queued', 'retrying']

/** Write a message to the outbox and start delivering it in the background. Returns its id. */
export async function enqueueMail(mail: OutgoingMail): Promise<number> {
  const { from } = mailSettings()
  const messageId = `<wf-${randomBytes(12).toString('hex')}@wingfold.local>`
  const secret = mail.secretUrl
  const [row] = await useDb().insert(tables.mailMessages).values({
    toAddress: mail.to, subject: mail.subject,
    textBody: secret ? redact(mail.text, secret) : mail.text,
    htmlBody: secret ? redact(mail.html, secret) : mail.html,
    deliveryBody: secret ? JSON.stringify({ text: mail.text, html: mail.html }) : null,
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
    const body = row.deliveryBody ? JSON.parse(row.deliveryBody) as { text: string,
      html: string } : { text: row.textBody, html: row.htmlBody }
    await transport.sendMail({
      from: row.fromAddress, to: row.toAddress, subject: row.subject,
      text: body.text, html: body.html ?? undefined, messageId: row.messageId ?? undefined,
    })
    // The fake server may already have marked the row `delivered` during the SMTP conversation.
    await db.update(m).set({ attempts, sentAt: new Date(), error: null, nextAttemptAt: null,
      deliveryBody: null }).where(eq(m.id, id))
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

/**
 * Put a message back in the queue now with a fresh attempt budget (admin "retry"). A security
 * message whose link was already dropped is not re-sent (it would arrive without its link).
 */
export async function requeueMessage(id: number): Promise<boolean> {
  const m = tables.mailMessages
  const linkGone = and(isNull(m.deliveryBody), like(m.textBody, `%${REDACTED_LINK}%`))
  const rows = await useDb().update(m).set({ status: 'queued', attempts: 0, nextAttemptAt: new Date() })
    .where(and(eq(m.id, id), inArray(m.status, ['failed', 'retrying']), not(linkGone!))).returning({ id: m.id })
  if (rows.length) void deliverMessage(id).catch(error => console.error('[wingfold] mail delivery:', error))
  return rows.length > 0
}

/** Drop the working copies older than the longest link lifetime (their links no longer work). */
export async function dropExpiredDeliveryBodies(): Promise<void> {
  const m = tables.mailMessages
  await useDb().update(m).set({ deliveryBody: null })
    .where(and(isNotNull(m.deliveryBody), lt(m.createdAt, new Date(Date.now() - linkLifetimes().invitationMs))))
}

/** After a restart, messages caught mid-send go back to `retrying`. */
export async function releaseStuckMessages(): Promise<void> {
  const m = tables.mailMessages
  await useDb().update(m).set({ status: 'retrying', nextAttemptAt: new Date() }).where(eq(m.status, 'sending'))
}
