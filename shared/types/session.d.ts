// Shape of the session user carried by nuxt-auth-utils (sealed cookie).
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    siteRole: 'admin' | 'member'
  }
  /** Server-only part of the session (never sent to the browser by /api/_auth/session). */
  interface SecureSessionData {
    /** Random key of this session; `sessions.key_hash` is its SHA-256 (server/utils/sessions.ts). */
    sessionKey: string
  }
}
export {}
