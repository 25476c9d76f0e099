/** Payload schemas for the admin pages. */
import { z } from 'zod'

export const settingsUpdateSchema = z.object({ signupEnabled: z.boolean() })
export type SettingsUpdatePayload = z.infer<typeof settingsUpdateSchema>
