import { eq } from 'drizzle-orm'
import { passwordResetRequestSchema } from '#shared/types/team'
import { passwordResetMail } from '~~/server/mail/templates'
import { enqueueMail } from '~~/server/mail/outbox'
import { linkLifetimes, mailSettings } from '~~/server/mail/config'

/** The one answer, whether or not the address has an account (existence is not revealed). */
const ANSWER = { ok: true,
  message: 'If an account exists for this address, we have sent it a link to choose a new password.' }

/** Ask for a password-reset link by e-mail. Limited per account and per address, apart from sign-in failures. */
export default defineEventHandler(async (event) => {
  const { email } = await readValidatedBody(event, passwordResetRequestSchema.parse)
  const ip = clientAddress(event)
  // Counted on its own limit, so the endpoint cannot flood an inbox and never locks anyone's sign-in.
  await limitResetRequest(email, ip)
  const user = await useDb().query.users.findFirst({ where: eq(tables.users.email, email) })
  if (user) {
    const token = newSecret()
    const { resetMinutes } = linkLifetimes()
    await useDb().insert(tables.passwordResets).values({ userId: user.id, tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + resetMinutes * 60_000) })
    const url = `${mailSettings().baseUrl}/reset-password/${token}`
    await enqueueMail({ to: user.email, kind: 'password-reset', secretUrl: url,
      ...passwordResetMail({ name: user.name, url, minutes: resetMinutes }) })
  }
  return ANSWER
})
