/**
 * The table of every route file under server/api with who may call it, for the authorisation
 * matrix test (route-matrix.test.ts). A new route file must be added here, or the test fails
 * naming it. Per route:
 * - `method`, `path`: the request; `:name` placeholders are filled from the fixtures of the
 *   object variant (own / foreign / missing), see `Ids`;
 * - `access`: `public` (anyone; only "never 5xx" is checked), `user` (any signed-in caller, token
 *   or cookie), `session` (cookie only: tokens get 401), `admin` (site admins), or a project role
 *   (`viewer` / `editor` / `owner`: members with at least that role; others 404, lower roles 403);
 * - `allowed` (optional): the identities allowed on own objects when the rule is not a role
 *   (e.g. only a comment's author may edit it);
 * - `body`: a valid body for the allowed callers (so refusals are about access, not input);
 * - `fresh`: the call ends or changes something the next cells need (a session, a run, a
 *   member): each cell gets a freshly signed-in client and fresh objects.
 */
import type { Ids } from './route-matrix-fixtures'

export type Access = 'public' | 'user' | 'session' | 'admin' | 'viewer' | 'editor' | 'owner'
export type Identity = 'anonymous' | 'non-member' | 'viewer' | 'editor' | 'owner' | 'site admin' | 'read token' | 'write token'

export interface RouteSpec {
  method: string
  path: string
  access: Access
  allowed?: Identity[]
  body?: (ids: Ids) => unknown
  fresh?: boolean
}

/** Route file (relative to server/api) → spec. */
export const ROUTES: Record<string, RouteSpec> = {
  'account/index.get.ts': { method: 'GET', path: '/api/account', access: 'user' },
  'account/index.patch.ts': { method: 'PATCH', path: '/api/account', access: 'user', body: () => ({ notifyOptOut: false }) },
  'account/notifications.get.ts': { method: 'GET', path: '/api/account/notifications', access: 'user' },
  'account/notifications.patch.ts': { method: 'PATCH', path: '/api/account/notifications', access: 'user', body: () => ({ notifyOptOut: false }) },
  'account/password.post.ts': { method: 'POST', path: '/api/account/password', access: 'user', body: () => ({ currentPassword: 'not-the-password', newPassword: 'a-new-passphrase-0' }) },
  'account/sessions/index.delete.ts': { method: 'DELETE', path: '/api/account/sessions', access: 'session', fresh: true },
  'account/sessions/index.get.ts': { method: 'GET', path: '/api/account/sessions', access: 'session' },
  'account/tokens/[tokenId].delete.ts': { method: 'DELETE', path: '/api/account/tokens/:token', access: 'session', fresh: true },
  'account/tokens/index.get.ts': { method: 'GET', path: '/api/account/tokens', access: 'session' },
  'account/tokens/index.post.ts': { method: 'POST', path: '/api/account/tokens', access: 'session', body: () => ({ name: 'matrix', scope: 'read' }) },
  'admin/activity.get.ts': { method: 'GET', path: '/api/admin/activity', access: 'admin' },
  'admin/outbox/[messageId].get.ts': { method: 'GET', path: '/api/admin/outbox/:message', access: 'admin' },
  'admin/outbox/[messageId]/retry.post.ts': { method: 'POST', path: '/api/admin/outbox/:message/retry', access: 'admin' },
  'admin/outbox/index.get.ts': { method: 'GET', path: '/api/admin/outbox', access: 'admin' },
  'admin/settings.get.ts': { method: 'GET', path: '/api/admin/settings', access: 'admin' },
  'admin/settings.patch.ts': { method: 'PATCH', path: '/api/admin/settings', access: 'admin', body: () => ({ signupEnabled: true }) },
  'admin/users.get.ts': { method: 'GET', path: '/api/admin/users', access: 'admin' },
  'auth/password-reset.post.ts': { method: 'POST', path: '/api/auth/password-reset', access: 'public', body: () => ({ email: 'nobody@example.test' }) },
  'auth/reset/[token].post.ts': { method: 'POST', path: '/api/auth/reset/:link', access: 'public', body: () => ({ password: 'a-new-passphrase-0' }) },
  'auth/settings.get.ts': { method: 'GET', path: '/api/auth/settings', access: 'public' },
  'auth/sign-in.post.ts': { method: 'POST', path: '/api/auth/sign-in', access: 'public', fresh: true, body: () => ({ email: 'nobody@example.test', password: 'wrong-password' }) },
  'auth/sign-out.post.ts': { method: 'POST', path: '/api/auth/sign-out', access: 'public', fresh: true },
  'auth/sign-up.post.ts': { method: 'POST', path: '/api/auth/sign-up', access: 'public', fresh: true, body: () => ({ name: 'Matrix', email: `m${Math.random().toString(36).slice(2)}@example.test`, password: 'a-long-passphrase' }) },
  'census/jobs/[id].get.ts': { method: 'GET', path: '/api/census/jobs/:census', access: 'user' },
  'census/jobs/[id]/cancel.post.ts': { method: 'POST', path: '/api/census/jobs/:census/cancel', access: 'user' },
  'census/jobs/[id]/resume.post.ts': { method: 'POST', path: '/api/census/jobs/:census/resume', access: 'user' },
  'census/jobs/index.get.ts': { method: 'GET', path: '/api/census/jobs', access: 'user' },
  'census/jobs/index.post.ts': { method: 'POST', path: '/api/census/jobs', access: 'user', body: () => ({ maxTowers: 1, maxHalfEdges: 6 }) },
  'census/patterns/[id].get.ts': { method: 'GET', path: '/api/census/patterns/:censuspattern', access: 'user' },
  'census/patterns/index.get.ts': { method: 'GET', path: '/api/census/patterns', access: 'user' },
  'compare.get.ts': { method: 'GET', path: '/api/compare?runs=:run', access: 'user' },
  'health.get.ts': { method: 'GET', path: '/api/health', access: 'public' },
  'invitations/[token].get.ts': { method: 'GET', path: '/api/invitations/:link', access: 'public' },
  'invitations/[token]/accept.post.ts': { method: 'POST', path: '/api/invitations/:link/accept', access: 'public', body: () => ({}) },
  'maps/[mapId].delete.ts': { method: 'DELETE', path: '/api/maps/:map', access: 'editor', fresh: true },
  'maps/[mapId].get.ts': { method: 'GET', path: '/api/maps/:map', access: 'viewer' },
  'maps/[mapId]/export.csv.get.ts': { method: 'GET', path: '/api/maps/:map/export.csv', access: 'viewer' },
  'maps/[mapId]/export.json.get.ts': { method: 'GET', path: '/api/maps/:map/export.json', access: 'viewer' },
  'maps/[mapId]/reverify.post.ts': { method: 'POST', path: '/api/maps/:map/reverify', access: 'editor', fresh: true },
  'projects/[id].get.ts': { method: 'GET', path: '/api/projects/:project', access: 'viewer' },
  'projects/[id]/activity.get.ts': { method: 'GET', path: '/api/projects/:project/activity', access: 'viewer' },
  'projects/[id]/activity/entries.get.ts': { method: 'GET', path: '/api/projects/:project/activity/entries', access: 'viewer' },
  'projects/[id]/archive.get.ts': { method: 'GET', path: '/api/projects/:project/archive', access: 'owner' },
  'projects/[id]/graphs/[graphId].get.ts': { method: 'GET', path: '/api/projects/:project/graphs/:graph', access: 'viewer' },
  'projects/[id]/graphs/[graphId]/versions/[version].get.ts': { method: 'GET', path: '/api/projects/:project/graphs/:graph/versions/1', access: 'viewer' },
  'projects/[id]/graphs/[graphId]/versions/[version]/restore.post.ts': { method: 'POST', path: '/api/projects/:project/graphs/:graph/versions/1/restore', access: 'editor', body: () => ({ message: 'matrix' }) },
  'projects/[id]/graphs/[graphId]/versions/index.get.ts': { method: 'GET', path: '/api/projects/:project/graphs/:graph/versions', access: 'viewer' },
  'projects/[id]/graphs/[graphId]/versions/index.post.ts': { method: 'POST', path: '/api/projects/:project/graphs/:graph/versions', access: 'editor', body: ids => ({ document: ids.document, message: 'matrix' }) },
  'projects/[id]/graphs/index.get.ts': { method: 'GET', path: '/api/projects/:project/graphs', access: 'viewer' },
  'projects/[id]/graphs/index.post.ts': { method: 'POST', path: '/api/projects/:project/graphs', access: 'editor', body: ids => ({ name: 'matrix pattern', document: ids.document }) },
  'projects/[id]/invitations/[invitationId].delete.ts': { method: 'DELETE', path: '/api/projects/:project/invitations/:invitation', access: 'owner', fresh: true },
  'projects/[id]/invitations/index.get.ts': { method: 'GET', path: '/api/projects/:project/invitations', access: 'owner' },
  'projects/[id]/invitations/index.post.ts': { method: 'POST', path: '/api/projects/:project/invitations', access: 'owner', body: () => ({ email: `i${Math.random().toString(36).slice(2)}@example.test`, role: 'viewer' }) },
  'projects/[id]/maps/index.get.ts': { method: 'GET', path: '/api/projects/:project/maps', access: 'viewer' },
  'projects/[id]/maps/index.post.ts': { method: 'POST', path: '/api/projects/:project/maps', access: 'editor', body: ids => ({ graphId: ids.graph, name: 'matrix map', settings: ids.mapSettings, result: ids.mapResult }) },
  'projects/[id]/members/[userId].delete.ts': { method: 'DELETE', path: '/api/projects/:project/members/:member', access: 'owner', fresh: true },
  'projects/[id]/members/[userId].patch.ts': { method: 'PATCH', path: '/api/projects/:project/members/:member', access: 'owner', body: () => ({ role: 'viewer' }) },
  'projects/[id]/members/index.get.ts': { method: 'GET', path: '/api/projects/:project/members', access: 'viewer' },
  'projects/[id]/runs/import.post.ts': { method: 'POST', path: '/api/projects/:project/runs/import', access: 'editor', body: ids => ({ graphId: ids.graph, name: 'matrix import', run: ids.runExport }) },
  'projects/[id]/runs/index.get.ts': { method: 'GET', path: '/api/projects/:project/runs', access: 'viewer' },
  'projects/[id]/runs/index.post.ts': { method: 'POST', path: '/api/projects/:project/runs', access: 'editor', body: ids => ({ graphId: ids.graph, name: 'matrix run', settings: ids.runSettings }) },
  'projects/[id]/runs/source.get.ts': { method: 'GET', path: '/api/projects/:project/runs/source?graphId=:graph', access: 'viewer' },
  'projects/index.get.ts': { method: 'GET', path: '/api/projects', access: 'user' },
  'projects/index.post.ts': { method: 'POST', path: '/api/projects', access: 'user', body: () => ({ name: 'matrix project' }) },
  'projects/import.post.ts': { method: 'POST', path: '/api/projects/import', access: 'user' },
  'runs/[runId].delete.ts': { method: 'DELETE', path: '/api/runs/:run', access: 'editor', fresh: true },
  'runs/[runId].get.ts': { method: 'GET', path: '/api/runs/:run', access: 'viewer' },
  'runs/[runId].patch.ts': { method: 'PATCH', path: '/api/runs/:run', access: 'editor', body: () => ({ name: 'renamed by the matrix' }) },
  'runs/[runId]/certificates.get.ts': { method: 'GET', path: '/api/runs/:run/certificates', access: 'viewer' },
  'runs/[runId]/certificates.post.ts': { method: 'POST', path: '/api/runs/:run/certificates', access: 'editor', body: () => ({ points: [] }) },
  'runs/[runId]/comments/[commentId].delete.ts': { method: 'DELETE', path: '/api/runs/:run/comments/:comment', access: 'viewer', allowed: ['editor', 'owner', 'write token'], fresh: true },
  'runs/[runId]/comments/[commentId].patch.ts': { method: 'PATCH', path: '/api/runs/:run/comments/:comment', access: 'viewer', allowed: ['editor', 'write token'], body: () => ({ body: 'edited by the matrix' }) },
  'runs/[runId]/comments/index.get.ts': { method: 'GET', path: '/api/runs/:run/comments', access: 'viewer' },
  'runs/[runId]/comments/index.post.ts': { method: 'POST', path: '/api/runs/:run/comments', access: 'viewer', body: () => ({ body: 'from the matrix' }) },
  'runs/[runId]/export.csv.get.ts': { method: 'GET', path: '/api/runs/:run/export.csv', access: 'viewer' },
  'runs/[runId]/export.json.get.ts': { method: 'GET', path: '/api/runs/:run/export.json', access: 'viewer' },
  'runs/[runId]/finish.post.ts': { method: 'POST', path: '/api/runs/:run/finish', access: 'editor', fresh: true, body: () => ({ status: 'complete' }) },
  'runs/[runId]/points.get.ts': { method: 'GET', path: '/api/runs/:run/points', access: 'viewer' },
  'runs/[runId]/points.post.ts': { method: 'POST', path: '/api/runs/:run/points', access: 'editor', fresh: true, body: ids => ids.batch },
  'runs/[runId]/reverify.post.ts': { method: 'POST', path: '/api/runs/:run/reverify', access: 'editor', fresh: true },
  'runs/[runId]/special-points.get.ts': { method: 'GET', path: '/api/runs/:run/special-points', access: 'viewer' },
}
