/** Payload schemas for projects and their members. */
import { z } from 'zod'
import { PROJECT_ROLES } from './roles'

export const projectCreateSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the project a name.' }).max(120, { message: 'Use at most 120 characters.' }),
  description: z.string().trim().max(2000, { message: 'Use at most 2000 characters.' }).default(''),
})
export type ProjectCreatePayload = z.input<typeof projectCreateSchema>

/** Route parameter `id` of /api/projects/[id]/… */
export const projectParamsSchema = z.object({ id: z.coerce.number().int().positive() })

/** Route parameters of /api/projects/[id]/members/[userId] */
export const memberParamsSchema = projectParamsSchema.extend({ userId: z.coerce.number().int().positive() })

export const memberRoleSchema = z.object({ role: z.enum(PROJECT_ROLES) })
export type MemberRolePayload = z.infer<typeof memberRoleSchema>
