/** Outbox rows as the admin API returns them. */
import type { OutboxItem } from '#shared/types/team'

/** Shape a `mail_messages` row for the outbox list. */
export function toOutboxItem(r: typeof tables.mailMessages.$inferSelect): OutboxItem {
  return {
    id: r.id, toAddress: r.toAddress, subject: r.subject, kind: r.kind, status: r.status, attempts: r.attempts,
    error: r.error, nextAttemptAt: r.nextAttemptAt?.toISOString() ?? null, createdAt: r.createdAt.toISOString(),
  }
}
