/** Comment helpers: loading a comment, shaping it for the API (access: requireRunAccess in access.ts). */
import { and, eq } from 'drizzle-orm'
import { roleAtLeast, type ProjectRole } from '#shared/types/roles'
import type { CommentItem } from '#shared/types/team'

/** A comment of this run, or a 404. */
export async function findComment(runId: number, commentId: number) {
  const c = tables.comments
  const row = await useDb().query.comments.findFirst({ where: and(eq(c.id, commentId), eq(c.runId, runId)) })
  if (!row) throw httpError(404, 'comment_not_found', 'No such comment on this run.')
  return row
}

/** Shape a comment row for a viewer with `role` and id `viewerId`. */
export function toCommentItem(r: typeof tables.comments.$inferSelect, author: { id: number, name: string } | null,
  viewerId: number, role: ProjectRole): CommentItem {
  const own = r.authorId === viewerId
  return {
    id: r.id, parentId: r.parentId, pointIndex: r.pointIndex, author, body: r.body, html: renderCommentMarkdown(r.body),
    edited: r.edited, canEdit: own, canDelete: own || roleAtLeast(role,
      'owner'), createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString(),
  }
}
