/** Invitation lookups shared by the invitation routes. */
import { and, eq, gt, isNull } from 'drizzle-orm'
import type { InvitationItem } from '#shared/types/team'

type InvitationRow = typeof tables.invitations.$inferSelect

/** State of an invitation at time `now`. */
export function invitationState(row: InvitationRow, now = Date.now()): InvitationItem['state'] {
  if (row.acceptedAt) return 'accepted'
  if (row.revokedAt) return 'revoked'
  return row.expiresAt.getTime() <= now ? 'expired' : 'pending'
}

const REFUSALS = {
  accepted: ['invitation_used', 'This invitation has already been used. Sign in to reach the project.'],
  revoked: ['invitation_revoked', 'This invitation was withdrawn by the project owner.'],
  expired: ['invitation_expired', 'This invitation has expired. Ask the project owner for a new one.'],
} as const

/**
 * The invitation behind a link token with its project and inviter, or an error:
 * 404 for an unknown token, 410 for a used, withdrawn or expired one.
 */
export async function openInvitation(token: string) {
  const { invitations: i, projects: p, users: u } = tables
  const row = await useDb().select({ invitation: i, projectName: p.name, inviterName: u.name })
    .from(i).innerJoin(p, eq(p.id, i.projectId)).leftJoin(u, eq(u.id, i.invitedBy))
    .where(eq(i.tokenHash, hashToken(token))).get()
  if (!row) throw httpError(404, 'invitation_not_found',
    'This invitation link is not valid. Check that you copied all of it.')
  const state = invitationState(row.invitation)
  if (state !== 'pending') throw httpError(410, REFUSALS[state][0], REFUSALS[state][1])
  return row
}

/** Mark an invitation accepted if it still is pending (atomic: a second use finds nothing). */
export async function claimInvitation(id: number): Promise<boolean> {
  const i = tables.invitations
  const now = new Date()
  const rows = await useDb().update(i).set({ acceptedAt: now })
    .where(and(eq(i.id, id), isNull(i.acceptedAt), isNull(i.revokedAt), gt(i.expiresAt, now))).returning({ id: i.id })
  return rows.length === 1
}
