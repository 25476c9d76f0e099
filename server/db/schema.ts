/**
 * Wingfold database schema (SQLite through Drizzle ORM).
 *
 * Conventions: integer ids, `created_at` / `updated_at` as millisecond timestamps on every table,
 * JSON payloads stored as text (validated by zod in `shared/types` before they are written),
 * enumerations as `const` tuples shared with the API schemas.
 * Change this file, then run `npm run db:generate` and commit the new SQL in `server/migrations`.
 */
import { sql } from 'drizzle-orm'
import { index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import {
  PROJECT_ROLES, SITE_ROLES, RUN_STATUSES, VERIFICATION_STATES, TOKEN_SCOPES,
} from '../../shared/types/roles'
import { CENSUS_JOB_STATUSES, CENSUS_QUEUES } from '../../shared/types/census'

const createdAt = () => integer('created_at',
  { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch() * 1000)`).$defaultFn(() => new Date())
const updatedAt = () => integer('updated_at',
  { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch() * 1000)`).$defaultFn(() => new Date()).$onUpdateFn(() => new Date())

/** People who can sign in. `siteRole` admin sees the admin pages. */
export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  siteRole: text('site_role', { enum: SITE_ROLES }).notNull().default('member'),
  notifyOptOut: integer('notify_opt_out', { mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('users_email_unique').on(t.email)])

/** A research project: the unit of sharing. */
export const projects = sqliteTable('projects', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

/** Who belongs to a project and with which role (owner > editor > viewer). */
export const memberships = sqliteTable('memberships', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: PROJECT_ROLES }).notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  uniqueIndex('memberships_project_user_unique').on(t.projectId, t.userId),
  index('memberships_user_idx').on(t.userId),
])

/** A gluing pattern of a project; its content lives in `graph_versions` (one row per save). */
export const graphs = sqliteTable('graphs', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  /** Number of the newest version (denormalised for lists). */
  latestVersion: integer('latest_version').notNull().default(0),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('graphs_project_idx').on(t.projectId)])

/** One saved version of a gluing pattern: the validated document JSON and its analysis summary. */
export const graphVersions = sqliteTable('graph_versions', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  graphId: integer('graph_id').notNull().references(() => graphs.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  document: text('document').notNull(),
  message: text('message').notNull().default(''),
  /** JSON of the core's analysis `summary`, or null while not analysed. */
  analysisSummary: text('analysis_summary'),
  authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('graph_versions_graph_version_unique').on(t.graphId, t.version)])

/** A continuation run (one family followed along a parameter path). */
export const runs = sqliteTable('runs', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  graphVersionId: integer('graph_version_id').notNull().references(() => graphVersions.id, { onDelete: 'restrict' }),
  name: text('name').notNull(),
  pathKind: text('path_kind').notNull(),
  settings: text('settings').notNull(),
  status: text('status', { enum: RUN_STATUSES }).notNull().default('running'),
  pointCount: integer('point_count').notNull().default(0),
  specialCount: integer('special_count').notNull().default(0),
  verification: text('verification', { enum: VERIFICATION_STATES }).notNull().default('pending'),
  verificationReason: text('verification_reason'),
  /**
   * Definition of vertical balance the verification used: 'cuts-v1' (on cuts, over each cut's
   * shortest edges, as published); null for rows verified before it (vertex sums over all edges).
   */
  verticalBalance: text('vertical_balance'),
  /** Why the run ended (the reason given with its final status). */
  finishReason: text('finish_reason'),
  appVersion: text('app_version').notNull(),
  authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
  parentRunId: integer('parent_run_id'),
  /** Index of the parent run's point this run restarted from (with `parentRunId`). */
  restartPointIndex: integer('restart_point_index'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('runs_project_idx').on(t.projectId), index('runs_graph_version_idx').on(t.graphVersionId)])

/** Points of a run. Special points carry `special_kind` (plain words, e.g. "fold"). */
export const runPoints = sqliteTable('run_points', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  runId: integer('run_id').notNull().references(() => runs.id, { onDelete: 'cascade' }),
  index: integer('index').notNull(),
  branch: integer('branch').notNull().default(0),
  lambda: real('lambda').notNull(),
  state: text('state').notNull(),
  residual: real('residual').notNull(),
  diagnostics: text('diagnostics').notNull().default('{}'),
  specialKind: text('special_kind'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  uniqueIndex('run_points_run_index_unique').on(t.runId, t.index),
  index('run_points_run_special_idx').on(t.runId, t.specialKind),
])

/**
 * Interval certificates of saved run points (shared/certify): a row exists only after the
 * server re-proved the claimed radii itself — a unique zero within r_min of the stored point,
 * and no other within r_max (max-norm of the family's unknowns).
 */
export const pointCertificates = sqliteTable('point_certificates', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  runId: integer('run_id').notNull().references(() => runs.id, { onDelete: 'cascade' }),
  pointIndex: integer('point_index').notNull(),
  rMin: real('r_min').notNull(),
  rMax: real('r_max').notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('point_certificates_run_point_unique').on(t.runId, t.pointIndex)])

/**
 * Certified segments of runs: the branch between saved points `from_index` and `to_index`
 * (consecutive) re-computed and proven by the server (shared/certify/segment.ts): for every λ
 * between them exactly one zero within r_min of the chord, none other within r_max.
 */
export const segmentCertificates = sqliteTable('segment_certificates', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  runId: integer('run_id').notNull().references(() => runs.id, { onDelete: 'cascade' }),
  fromIndex: integer('from_index').notNull(),
  toIndex: integer('to_index').notNull(),
  rMin: real('r_min').notNull(),
  rMax: real('r_max').notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('segment_certificates_run_from_unique').on(t.runId, t.fromIndex)])

/** Invitations to a project by e-mail (only the token's hash is stored). */
export const invitations = sqliteTable('invitations', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  role: text('role', { enum: PROJECT_ROLES }).notNull(),
  tokenHash: text('token_hash').notNull(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  invitedBy: integer('invited_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('invitations_token_hash_unique').on(t.tokenHash), index('invitations_project_idx').on(t.projectId)])

/** Discussion on a run, optionally pinned to one point; markdown rendered with HTML disabled. */
export const comments = sqliteTable('comments', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  runId: integer('run_id').notNull().references(() => runs.id, { onDelete: 'cascade' }),
  pointIndex: integer('point_index'),
  parentId: integer('parent_id'),
  authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
  body: text('body').notNull(),
  edited: integer('edited', { mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('comments_run_idx').on(t.runId)])

/** Project activity log: "actor verb object" plus free JSON data. */
export const activity = sqliteTable('activity', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  actorId: integer('actor_id').references(() => users.id, { onDelete: 'set null' }),
  verb: text('verb').notNull(),
  objectType: text('object_type').notNull(),
  objectId: integer('object_id'),
  data: text('data').notNull().default('{}'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('activity_project_idx').on(t.projectId, t.createdAt)])

/** Personal API tokens (only the hash is stored). */
export const apiTokens = sqliteTable('api_tokens', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  tokenHash: text('token_hash').notNull(),
  scope: text('scope', { enum: TOKEN_SCOPES }).notNull().default('read'),
  lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('api_tokens_hash_unique').on(t.tokenHash)])

/** Outbox of sent mail (what the fake SMTP server received, for tests and the dev mailbox). */
export const mailMessages = sqliteTable('mail_messages', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  toAddress: text('to_address').notNull(),
  subject: text('subject').notNull(),
  textBody: text('text_body').notNull(),
  htmlBody: text('html_body'),
  status: text('status').notNull().default('queued'),
  error: text('error'),
  /** Sender address used (runtime config `mailFrom` at the time of sending). */
  fromAddress: text('from_address').notNull().default(''),
  /** Template that produced the message (e.g. `invitation`, `password-reset`). */
  kind: text('kind').notNull().default(''),
  /** Message-ID header we set, so the fake SMTP server can match what it received to this row. */
  messageId: text('message_id'),
  /**
   * What delivery needs and admins must not see: the rendered text and HTML with their working
   * single-use link (JSON), kept only while the message waits for delivery and dropped once it is
   * sent or has failed for good. `text_body` / `html_body` hold the redacted copy the outbox shows.
   */
  deliveryBody: text('delivery_body'),
  /** Delivery attempts so far; retried with exponential backoff until `next_attempt_at`. */
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }),
  sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('mail_messages_status_idx').on(t.status,
  t.nextAttemptAt), uniqueIndex('mail_messages_message_id_unique').on(t.messageId)])

/** Password-reset requests (only the token's hash is stored; single use, expiring). */
export const passwordResets = sqliteTable('password_resets', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  usedAt: integer('used_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('password_resets_token_hash_unique').on(t.tokenHash), index('password_resets_user_idx').on(t.userId)])

/** Key/value application settings (e.g. `signup_enabled`). */
export const appSettings = sqliteTable('app_settings', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

/** Failed sign-in attempts, for rate limiting per account and per address. */
export const signInFailures = sqliteTable('sign_in_failures', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull(),
  ip: text('ip').notNull(),
  /** `sign-in` (a failed sign-in) or `reset` (a password-reset request, limited separately). */
  kind: text('kind').notNull().default('sign-in'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('sign_in_failures_email_idx').on(t.email, t.createdAt), index('sign_in_failures_ip_idx').on(t.ip,
  t.createdAt)])

/**
 * Signed-in sessions: the sealed cookie carries a random session key, only its SHA-256 is stored
 * here. A request whose key has no row (signed out, ended by a password change or reset, or
 * past its idle or absolute lifetime) is treated as signed out.
 */
export const sessions = sqliteTable('sessions', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  keyHash: text('key_hash').notNull(),
  userAgent: text('user_agent').notNull().default(''),
  ip: text('ip').notNull().default(''),
  lastSeenAt: integer('last_seen_at', { mode: 'timestamp_ms' }).notNull().$defaultFn(() => new Date()),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('sessions_key_hash_unique').on(t.keyHash), index('sessions_user_idx').on(t.userId)])

/**
 * A saved moduli map: its settings, the whole result (cells with their states, rows, crossings,
 * traced curves) as JSON, and the server's verification of a sample of cells with the same core.
 */
export const maps = sqliteTable('maps', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  graphVersionId: integer('graph_version_id').notNull().references(() => graphVersions.id, { onDelete: 'restrict' }),
  name: text('name').notNull(),
  plane: text('plane').notNull(),
  settings: text('settings').notNull(),
  result: text('result').notNull(),
  cellCount: integer('cell_count').notNull(),
  solvedCount: integer('solved_count').notNull(),
  /** Wall time of the computation as reported by the browser (ms) and the number of workers. */
  wallMs: real('wall_ms'),
  workers: integer('workers'),
  verification: text('verification', { enum: VERIFICATION_STATES }).notNull().default('pending'),
  verificationReason: text('verification_reason'),
  /**
   * Definition of vertical balance the verification used: 'cuts-v1' (on cuts, over each cut's
   * shortest edges, as published); null for rows verified before it (vertex sums over all edges).
   */
  verticalBalance: text('vertical_balance'),
  appVersion: text('app_version').notNull(),
  authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('maps_project_idx').on(t.projectId)])

/**
 * A census job: enumerate and classify every torus gluing pattern within the bounds
 * (shared/census). Progress counters are written as it runs; `options` holds the lattice and the
 * τ search switch as JSON.
 */
export const censusJobs = sqliteTable('census_jobs', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  status: text('status', { enum: CENSUS_JOB_STATUSES }).notNull().default('queued'),
  queue: text('queue', { enum: CENSUS_QUEUES }).notNull(),
  maxTowers: integer('max_towers').notNull(),
  maxHalfEdges: integer('max_half_edges').notNull(),
  options: text('options').notNull().default('{}'),
  visited: integer('visited').notNull().default(0),
  found: integer('found').notNull().default(0),
  classified: integer('classified').notNull().default(0),
  error: text('error'),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  finishedAt: integer('finished_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

/** One census pattern class (unique canonical code) with its verdicts and its drawing. */
export const censusPatterns = sqliteTable('census_patterns', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  code: text('code').notNull(),
  mirrorCode: text('mirror_code').notNull(),
  chiral: integer('chiral', { mode: 'boolean' }).notNull(),
  towers: integer('towers').notNull(),
  edges: integer('edges').notNull(),
  halfEdges: integer('half_edges').notNull(),
  faces: integer('faces').notNull(),
  /** Degrees descending, comma-separated ("6,4,4"): filterable as text. */
  degrees: text('degrees').notNull(),
  faceSizes: text('face_sizes').notNull(),
  predictedGenus: integer('predicted_genus').notNull(),
  automorphisms: integer('automorphisms').notNull(),
  balanced: integer('balanced', { mode: 'boolean' }).notNull(),
  reason: text('reason'),
  rigid: integer('rigid', { mode: 'boolean' }),
  phaseKernelDimension: integer('phase_kernel_dimension'),
  tau: text('tau').notNull(),
  failing: text('failing').notNull(),
  document: text('document').notNull(),
  jobId: integer('job_id').references(() => censusJobs.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  uniqueIndex('census_patterns_code_unique').on(t.code),
  index('census_patterns_towers_idx').on(t.towers, t.predictedGenus),
])
