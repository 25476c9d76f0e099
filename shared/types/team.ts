/** Payload schemas for team work: invitations, password reset, API tokens, comments, activity. */
import { z } from 'zod'
import { PROJECT_ROLES, TOKEN_SCOPES } from './roles'
import { emailSchema, nameSchema, passwordSchema } from './auth'

/** Owner invites an address with a role. */
export const invitationCreateSchema = z.object({ email: emailSchema, role: z.enum(PROJECT_ROLES) })
export type InvitationCreatePayload = z.infer<typeof invitationCreateSchema>

/** Route parameters of /api/projects/[id]/invitations/[invitationId] */
export const invitationParamsSchema = z.object({
  id: z.coerce.number().int().positive(),
  invitationId: z.coerce.number().int().positive(),
})

/** A secret link token (base64url, 43 characters for 32 random bytes). */
export const linkTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, { message: 'This link is not valid.' })
export const tokenParamsSchema = z.object({ token: linkTokenSchema })

/**
 * Accepting an invitation: signed in → no fields; existing account → its password;
 * new account → name and a new password.
 */
export const invitationAcceptSchema = z.object({
  name: nameSchema.optional(),
  password: z.string().max(200).optional(),
})
export type InvitationAcceptPayload = z.infer<typeof invitationAcceptSchema>

/** Form schema for a new account made from an invitation. */
export const invitationSignUpSchema = z.object({ name: nameSchema, password: passwordSchema })

export const passwordResetRequestSchema = z.object({ email: emailSchema })
export const passwordResetSchema = z.object({ password: passwordSchema })

export const tokenCreateSchema = z.object({
  name: z.string().trim().min(1, { message: 'Name the token (e.g. the script that uses it).' }).max(80, { message: 'Use at most 80 characters.' }),
  scope: z.enum(TOKEN_SCOPES),
})
export type TokenCreatePayload = z.infer<typeof tokenCreateSchema>
export const tokenIdParamsSchema = z.object({ tokenId: z.coerce.number().int().positive() })

/**
 * Comments: Markdown body; `parentId` answers a top-level comment; `pointIndex` pins the comment
 * to a stored point of the run (the runs' storage rule: ≥ 0 a regular point, −1 − k special point k).
 */
export const commentBodySchema = z.string().trim().min(1, { message: 'Write something first.' }).max(10_000, { message: 'Use at most 10 000 characters.' })
export const commentCreateSchema = z.object({
  body: commentBodySchema,
  parentId: z.number().int().positive().optional(),
  pointIndex: z.number().int().optional(),
})
export type CommentCreatePayload = z.infer<typeof commentCreateSchema>
export const commentUpdateSchema = z.object({ body: commentBodySchema })
export const commentRunParamsSchema = z.object({ runId: z.coerce.number().int().positive() })
export const commentParamsSchema = commentRunParamsSchema.extend({ commentId: z.coerce.number().int().positive() })
export const commentListQuerySchema = z.object({ pointIndex: z.coerce.number().int().optional() })

/** Activity list: page numbers from 1, filters optional. */
export const activityQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
  verb: z.string().trim().max(40).optional(),
  actorId: z.coerce.number().int().positive().optional(),
  objectType: z.string().trim().max(40).optional(),
  projectId: z.coerce.number().int().positive().optional(),
})
export type ActivityQuery = z.infer<typeof activityQuerySchema>

/**
 * The verb an activity entry is filtered by: its first words, without a parenthesised detail
 * (entries written before the detail moved into `data` read "finished (stopped: …)").
 */
export function activityVerbGroup(verb: string): string {
  return verb.replace(/\s*\(.*$/s, '').trim() || verb
}

export const outboxQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
  status: z.string().trim().max(20).optional(),
})
export const outboxParamsSchema = z.object({ messageId: z.coerce.number().int().positive() })

export const notificationsSchema = z.object({ notifyOptOut: z.boolean() })

/** A pending (or past) invitation as owners see it. */
export interface InvitationItem {
  id: number
  email: string
  role: (typeof PROJECT_ROLES)[number]
  state: 'pending' | 'accepted' | 'revoked' | 'expired'
  invitedBy: string | null
  expiresAt: string
  createdAt: string
}

/** What the invitee sees before accepting. */
export interface InvitationPreview {
  projectName: string
  role: (typeof PROJECT_ROLES)[number]
  email: string
  inviterName: string | null
  accountExists: boolean
  expiresAt: string
}

export interface TokenItem {
  id: number
  name: string
  scope: (typeof TOKEN_SCOPES)[number]
  lastUsedAt: string | null
  revokedAt: string | null
  createdAt: string
}

export interface CommentItem {
  id: number
  parentId: number | null
  pointIndex: number | null
  author: { id: number, name: string } | null
  body: string
  /** Markdown rendered with markdown-it, raw HTML disabled. */
  html: string
  edited: boolean
  canEdit: boolean
  canDelete: boolean
  createdAt: string
  updatedAt: string
}

export interface ActivityItem {
  id: number
  projectId: number
  projectName: string
  actor: string | null
  verb: string
  objectType: string
  objectId: number | null
  data: Record<string, unknown>
  createdAt: string
}

/** One page of a list. */
export interface Page<T> {
  items: T[]
  total: number
  page: number
  pageSize: number
}

export interface OutboxItem {
  id: number
  toAddress: string
  subject: string
  kind: string
  status: string
  attempts: number
  error: string | null
  nextAttemptAt: string | null
  createdAt: string
}

export interface OutboxMessage extends OutboxItem {
  fromAddress: string
  textBody: string
  htmlBody: string | null
}
