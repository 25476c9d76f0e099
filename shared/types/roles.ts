/** Enumerations shared by the database schema, the API schemas and the screens. */

/** Site-wide roles: admins see the admin pages and settings. */
export const SITE_ROLES = ['admin', 'member'] as const
export type SiteRole = typeof SITE_ROLES[number]

/** Project roles, weakest first. */
export const PROJECT_ROLES = ['viewer', 'editor', 'owner'] as const
export type ProjectRole = typeof PROJECT_ROLES[number]

/** True when `role` is at least `min` (owner ⊇ editor ⊇ viewer). */
export function roleAtLeast(role: ProjectRole, min: ProjectRole): boolean {
  return PROJECT_ROLES.indexOf(role) >= PROJECT_ROLES.indexOf(min)
}

/**
 * 'stopped': the corrector kept failing, the family was not followed to its end. `interrupted`:
 * nobody wrote to the run for `runIdleMinutes`; the server ended it (server/plugins/run-sweeper.ts).
 */
export const RUN_STATUSES = ['running', 'complete', 'stopped', 'cancelled', 'failed', 'interrupted'] as const
export type RunStatus = typeof RUN_STATUSES[number]

export const VERIFICATION_STATES = ['pending', 'verified', 'rejected'] as const
export type VerificationState = typeof VERIFICATION_STATES[number]

export const TOKEN_SCOPES = ['read', 'write'] as const
export type TokenScope = typeof TOKEN_SCOPES[number]
