/**
 * Notice e-mails to a run's author, skipped when the author opted out (`users.notify_opt_out`)
 * or is the person who caused the notice. Queued through the outbox; never throws into the
 * caller's action (a failure is logged and the action stands).
 */
import { eq } from 'drizzle-orm'
import { commentMail, runVerdictMail } from './templates'
import { enqueueMail } from './outbox'
import { mailSettings } from './config'

async function runWithAuthor(runId: number) {
  const { runs: r, users: u, projects: p } = tables
  return useDb().select({ run: r, author: u, projectName: p.name })
    .from(r).innerJoin(p, eq(p.id, r.projectId)).leftJoin(u, eq(u.id, r.authorId))
    .where(eq(r.id, runId)).get()
}

/** Address of a run's page in the app. */
export function runUrl(projectId: number, runId: number): string {
  return `${mailSettings().baseUrl}/projects/${projectId}/runs/${runId}`
}

/**
 * Tell a run's author that the run was verified or rejected (call after storing the verdict).
 * @returns the outbox id, or null when no notice was due
 */
export async function noticeRunVerdict(runId: number): Promise<number | null> {
  try {
    const row = await runWithAuthor(runId)
    if (!row?.author || row.author.notifyOptOut || row.run.verification === 'pending') return null
    const mail = runVerdictMail({
      name: row.author.name, runName: row.run.name, projectName: row.projectName, verdict: row.run.verification,
      reason: row.run.verificationReason, url: runUrl(row.run.projectId, runId),
    })
    return await enqueueMail({ to: row.author.email, kind: 'run-verdict', ...mail })
  }
  catch (error) {
    console.error('[wingfold] run verdict notice:', error)
    return null
  }
}

/** Tell a run's author that `commenter` commented on it (not when they comment on their own run). */
export async function noticeComment(runId: number, commenter: { id: number, name: string },
  body: string): Promise<number | null> {
  try {
    const row = await runWithAuthor(runId)
    if (!row?.author || row.author.notifyOptOut || row.author.id === commenter.id) return null
    const excerpt = body.length > 400 ? `${body.slice(0, 400)}…` : body
    const mail = commentMail({ name: row.author.name, authorName: commenter.name, runName: row.run.name, excerpt,
      url: runUrl(row.run.projectId, runId) })
    return await enqueueMail({ to: row.author.email, kind: 'comment', ...mail })
  }
  catch (error) {
    console.error('[wingfold] comment notice:', error)
    return null
  }
}
