/**
 * Mail settings. `smtpUrl`, `mailFrom` and `public.baseUrl` come from runtime config
 * (NUXT_SMTP_URL, NUXT_MAIL_FROM, NUXT_PUBLIC_BASE_URL). The retry policy is read from the
 * environment because nuxt.config.ts declares no key for it:
 * - NUXT_MAIL_MAX_ATTEMPTS (default 5): attempts before a message is marked `failed`;
 * - NUXT_MAIL_RETRY_SECONDS (default 30): first retry delay, doubled after each failure.
 */

/** Validated mail settings. */
export interface MailSettings {
  /** SMTP URL of a real server; empty → the in-process fake server. */
  smtpUrl: string
  from: string
  baseUrl: string
  maxAttempts: number
  retrySeconds: number
}

function positiveInt(name: string, fallback: number): number {
  const raw = process.env[name]
  if (raw === undefined || raw === '') return fallback
  const n = Number(raw)
  if (!Number.isInteger(n) || n < 1) throw new Error(`${name} must be a positive integer, got "${raw}".`)
  return n
}

/** Read the mail settings (throws a clear error on nonsense values). */
export function mailSettings(): MailSettings {
  const config = useRuntimeConfig()
  return {
    smtpUrl: String(config.smtpUrl ?? ''),
    from: String(config.mailFrom || 'Wingfold <no-reply@wingfold.local>'),
    baseUrl: String(config.public.baseUrl || 'http://localhost:3000').replace(/\/+$/, ''),
    maxAttempts: positiveInt('NUXT_MAIL_MAX_ATTEMPTS', 5),
    retrySeconds: positiveInt('NUXT_MAIL_RETRY_SECONDS', 30),
  }
}

/**
 * Lifetimes of the single-use links:
 * - NUXT_INVITATION_DAYS (default 7): invitation links;
 * - NUXT_PASSWORD_RESET_MINUTES (default 60): password-reset links.
 */
export function linkLifetimes(): { invitationMs: number, resetMinutes: number } {
  return {
    invitationMs: positiveInt('NUXT_INVITATION_DAYS', 7) * 86_400_000,
    resetMinutes: positiveInt('NUXT_PASSWORD_RESET_MINUTES', 60),
  }
}
