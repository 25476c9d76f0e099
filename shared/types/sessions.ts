/** Shapes of the account's session list (GET /api/account/sessions). */

/** One active session as the account page shows it. */
export interface SessionItem {
  id: number
  /** Browser or client that signed in (its User-Agent, cut to 300 characters). */
  userAgent: string
  ip: string
  /** The session of this request. */
  current: boolean
  createdAt: string
  lastSeenAt: string
}
