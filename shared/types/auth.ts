/** Payload schemas for accounts: one schema per payload, used by the form and the route. */
import { z } from 'zod'

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' }))

/** Passwords: at least 10 characters (long passphrases welcome, up to 200). */
export const passwordSchema = z.string()
  .min(10, { message: 'Use at least 10 characters.' })
  .max(200, { message: 'Use at most 200 characters.' })

export const nameSchema = z.string().trim()
  .min(1, { message: 'Enter your name.' })
  .max(100, { message: 'Use at most 100 characters.' })

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { message: 'Enter your password.' }).max(200),
})
export type SignInPayload = z.infer<typeof signInSchema>

export const signUpSchema = z.object({ name: nameSchema, email: emailSchema, password: passwordSchema })
export type SignUpPayload = z.infer<typeof signUpSchema>

export const accountUpdateSchema = z.object({
  name: nameSchema.optional(),
  notifyOptOut: z.boolean().optional(),
})
export type AccountUpdatePayload = z.infer<typeof accountUpdateSchema>

export const passwordChangeSchema = z.object({
  currentPassword: z.string().min(1, { message: 'Enter your current password.' }).max(200),
  newPassword: passwordSchema,
})
export type PasswordChangePayload = z.infer<typeof passwordChangeSchema>
