import { sql } from 'drizzle-orm'
import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import type { ProjectRole } from '@/lib/review/roles'
import type { RemarkSeverity, RevisionState } from '@/lib/review/workflow'

const id = () => text('id').primaryKey()
const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`)

export const users = sqliteTable('users', {
  id: id(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  /** Null until the invited person sets a password. */
  passwordHash: text('password_hash'),
  isAdmin: integer('is_admin', { mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
})

export const sessions = sqliteTable('sessions', {
  id: text('id').primaryKey(),
  userId: text('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  /** Seconds since the epoch, as lucia's adapter expects. */
  expiresAt: integer('expires_at').notNull(),
})

/** One-time tokens sent by mail: invitations and password resets. Only the hash is stored. */
export const mailTokens = sqliteTable('mail_tokens', {
  tokenHash: text('token_hash').primaryKey(),
  kind: text('kind', { enum: ['invite', 'reset'] }).notNull(),
  email: text('email').notNull(),
  projectId: text('project_id').references(() => projects.id, { onDelete: 'cascade' }),
  role: text('role').$type<ProjectRole>(),
  createdBy: text('created_by').references(() => users.id),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  usedAt: integer('used_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
})

export const signInFailures = sqliteTable(
  'sign_in_failures',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    email: text('email').notNull(),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('sign_in_failures_email_at').on(t.email, t.at)],
)

export const projects = sqliteTable('projects', {
  id: id(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  client: text('client').notNull().default(''),
  createdAt: createdAt(),
})

export const projectMembers = sqliteTable(
  'project_members',
  {
    projectId: text('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: text('role').$type<ProjectRole>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.userId] })],
)

export const calcs = sqliteTable(
  'calcs',
  {
    id: id(),
    projectId: text('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    number: text('number').notNull(),
    title: text('title').notNull(),
    /** A mechanism id of the registry (lib/mechanisms). */
    calcType: text('calc_type').notNull(),
    state: text('state').$type<RevisionState>().notNull().default('draft'),
    /** Working inputs of the open draft, saved as the engineer edits. */
    draftInputs: text('draft_inputs', { mode: 'json' }),
    /** The result of running the working inputs, stored with them so a view never recomputes. */
    draftResult: text('draft_result', { mode: 'json' }),
    engineerId: text('engineer_id').references(() => users.id),
    checkerId: text('checker_id').references(() => users.id),
    approverId: text('approver_id').references(() => users.id),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [uniqueIndex('calcs_project_number').on(t.projectId, t.number)],
)

export const revisions = sqliteTable(
  'revisions',
  {
    id: id(),
    calcId: text('calc_id')
      .notNull()
      .references(() => calcs.id, { onDelete: 'cascade' }),
    label: text('label').notNull(),
    state: text('state').$type<RevisionState>().notNull().default('draft'),
    inputs: text('inputs', { mode: 'json' }).notNull(),
    result: text('result', { mode: 'json' }),
    engineVersion: text('engine_version').notNull(),
    templateVersion: text('template_version'),
    /** SHA-256 over the canonical JSON of inputs + result. */
    contentHash: text('content_hash'),
    /** SHA-256 over the stored PDF bytes. */
    pdfHash: text('pdf_hash'),
    pdfKey: text('pdf_key'),
    /** ISO time printed into the PDF, fixed so a re-render is byte-identical. */
    frozenAt: text('frozen_at'),
    engineerId: text('engineer_id').references(() => users.id),
    checkerId: text('checker_id').references(() => users.id),
    approverId: text('approver_id').references(() => users.id),
    checkedAt: integer('checked_at', { mode: 'timestamp_ms' }),
    approvedAt: integer('approved_at', { mode: 'timestamp_ms' }),
    issuedAt: integer('issued_at', { mode: 'timestamp_ms' }),
    /** Why this revision was made, given at submission; shown in the revision history. */
    reason: text('reason'),
    /** Submitted although a check failed, after the engineer confirmed it. */
    submittedFailing: integer('submitted_failing', { mode: 'boolean' }).notNull().default(false),
    /** The checker and approver the engineer named at submission; only they may sign. */
    assignedCheckerId: text('assigned_checker_id').references(() => users.id),
    assignedApproverId: text('assigned_approver_id').references(() => users.id),
    /** Short code printed on the issued package; the public verification page takes it. */
    verificationCode: text('verification_code').unique(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('revisions_calc_label').on(t.calcId, t.label)],
)

/**
 * Every transition of a revision with who, when and why; for signing transitions the Ed25519
 * signature of the server's key over the signed statement (canonical JSON, kept as text).
 */
export const revisionEvents = sqliteTable(
  'revision_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    revisionId: text('revision_id')
      .notNull()
      .references(() => revisions.id),
    action: text('action').notNull(),
    fromState: text('from_state').$type<RevisionState>(),
    toState: text('to_state').$type<RevisionState>().notNull(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    /** The person's name as it was when they acted: the record prints it, whatever they are called later. */
    actorName: text('actor_name'),
    reason: text('reason'),
    statement: text('statement'),
    signature: text('signature'),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('revision_events_revision').on(t.revisionId, t.at)],
)

export const checkRemarks = sqliteTable('check_remarks', {
  id: id(),
  revisionId: text('revision_id')
    .notNull()
    .references(() => revisions.id, { onDelete: 'cascade' }),
  /** The step (or table or figure) the remark is about, stable across revisions; null for the whole calc. */
  stepId: text('step_id'),
  severity: text('severity').$type<RemarkSeverity>().notNull().default('must-resolve'),
  /** The remark on an earlier revision this one continues (open remarks follow the step to the next revision). */
  carriedFromId: text('carried_from_id'),
  authorId: text('author_id')
    .notNull()
    .references(() => users.id),
  /** The author's name as it was when the remark was written. */
  authorName: text('author_name'),
  text: text('text').notNull(),
  status: text('status', { enum: ['open', 'answered', 'closed'] }).notNull().default('open'),
  response: text('response'),
  closedBy: text('closed_by').references(() => users.id),
  closedAt: integer('closed_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
})

/** A remark's thread: replies are added, never overwritten. */
export const remarkReplies = sqliteTable(
  'remark_replies',
  {
    id: id(),
    remarkId: text('remark_id')
      .notNull()
      .references(() => checkRemarks.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    /** The author's name as it was when the reply was written. */
    authorName: text('author_name'),
    text: text('text').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('remark_replies_remark').on(t.remarkId)],
)

/** The checker's tick against a step: verified, by whom and when. */
export const stepTicks = sqliteTable(
  'step_ticks',
  {
    revisionId: text('revision_id')
      .notNull()
      .references(() => revisions.id),
    stepId: text('step_id').notNull(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    /** The checker's name as it was when they ticked. */
    userName: text('user_name'),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.revisionId, t.stepId] })],
)

/** The approver's confirmation, before issue, of a material value the library marks "from memory". */
export const materialConfirmations = sqliteTable(
  'material_confirmations',
  {
    revisionId: text('revision_id')
      .notNull()
      .references(() => revisions.id),
    /** e.g. `S355.fy` */
    value: text('value').notNull(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    /** The approver's name as it was when they confirmed. */
    userName: text('user_name'),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.revisionId, t.value] })],
)

/** In-app notices: what someone must act on next, with a link to the page to act on. */
export const notices = sqliteTable(
  'notices',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    projectId: text('project_id').references(() => projects.id, { onDelete: 'cascade' }),
    calcId: text('calc_id'),
    revisionId: text('revision_id'),
    kind: text('kind').notNull(),
    text: text('text').notNull(),
    link: text('link').notNull(),
    readAt: integer('read_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [index('notices_user').on(t.userId, t.createdAt)],
)

export const attachments = sqliteTable('attachments', {
  id: id(),
  calcId: text('calc_id')
    .notNull()
    .references(() => calcs.id, { onDelete: 'cascade' }),
  revisionId: text('revision_id').references(() => revisions.id),
  name: text('name').notNull(),
  mime: text('mime').notNull(),
  size: integer('size').notNull(),
  sha256: text('sha256').notNull(),
  storageKey: text('storage_key').notNull(),
  uploadedBy: text('uploaded_by').references(() => users.id),
  createdAt: createdAt(),
})

/** Materials a project adds to the built-in library; `data` follows lib/checks' material schema. */
export const projectMaterials = sqliteTable(
  'project_materials',
  {
    id: id(),
    projectId: text('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    data: text('data', { mode: 'json' }).$type<Record<string, unknown>>().notNull(),
    source: text('source').notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('project_materials_name').on(t.projectId, t.name)],
)

export const auditEvents = sqliteTable(
  'audit_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    at: integer('at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
    userId: text('user_id').references(() => users.id),
    projectId: text('project_id'),
    calcId: text('calc_id'),
    action: text('action').notNull(),
    detail: text('detail', { mode: 'json' }),
  },
  (t) => [index('audit_events_project').on(t.projectId, t.at)],
)

/** Personal API tokens: shown once, stored as a SHA-256 hash; a token acts as its user, never more. */
export const apiTokens = sqliteTable(
  'api_tokens',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    /** The first characters of the token, so its owner can tell tokens apart. */
    prefix: text('prefix').notNull(),
    lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [index('api_tokens_user').on(t.userId)],
)

/**
 * Mail waiting to be sent (server/mail/outbox.ts). A row is written in the same transaction as
 * whatever the mail tells about; the sender claims due rows one at a time (`claimed_by` /
 * `claimed_until`), so with several app instances on one database each mail goes out once.
 * A mail that failed `MAX_ATTEMPTS` times keeps its row with `failed_at` and the last error.
 */
export const outbox = sqliteTable(
  'outbox',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    to: text('to').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
    attempts: integer('attempts').notNull().default(0),
    /** When the sender may next try (now for a new row; later after a failure, with back-off). */
    nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
    claimedBy: text('claimed_by'),
    claimedUntil: integer('claimed_until', { mode: 'timestamp_ms' }),
    sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
    /** Set when the sender gave up; the row stays for the admin to see. */
    failedAt: integer('failed_at', { mode: 'timestamp_ms' }),
    lastError: text('last_error'),
    createdAt: createdAt(),
  },
  (t) => [index('outbox_due').on(t.sentAt, t.failedAt, t.nextAttemptAt)],
)

/**
 * Counters of the sign-in and password-reset limits (server/auth/throttle.ts), one row per key
 * (account + source, source, account, …): attempts since the last quiet hour and the time of the last.
 */
export const authThrottle = sqliteTable('auth_throttle', {
  key: text('key').primaryKey(),
  count: integer('count').notNull().default(0),
  lastAt: integer('last_at', { mode: 'timestamp_ms' }).notNull(),
})

/**
 * Browsers that signed in to an account before (a long-lived cookie, only its hash stored). They
 * are exempt from the account-wide sign-in limit, so an attack spread over many addresses slows
 * strangers but never locks the owner out of their own browser.
 */
export const signInDevices = sqliteTable(
  'sign_in_devices',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('sign_in_devices_user').on(t.userId)],
)

/**
 * Package renders waiting to run off the request path (server/render-jobs.ts). A job is claimed by
 * one instance at a time; a claim that runs out (a crashed process) is taken over.
 */
export const renderJobs = sqliteTable(
  'render_jobs',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    revisionId: text('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    /** queued → running → done, or failed after the last attempt. */
    state: text('state', { enum: ['queued', 'running', 'done', 'failed'] }).notNull().default('queued'),
    /** What the job is doing now, for the progress shown to the engineer. */
    stage: text('stage'),
    attempts: integer('attempts').notNull().default(0),
    claimedBy: text('claimed_by'),
    claimedUntil: integer('claimed_until', { mode: 'timestamp_ms' }),
    error: text('error'),
    createdAt: createdAt(),
    finishedAt: integer('finished_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('render_jobs_state').on(t.state, t.id), index('render_jobs_revision').on(t.revisionId)],
)

export type User = typeof users.$inferSelect
export type Project = typeof projects.$inferSelect
export type Calc = typeof calcs.$inferSelect
export type Revision = typeof revisions.$inferSelect
export type CheckRemark = typeof checkRemarks.$inferSelect
export type RevisionEvent = typeof revisionEvents.$inferSelect
export type Notice = typeof notices.$inferSelect
export type ApiToken = typeof apiTokens.$inferSelect
export type OutboxRow = typeof outbox.$inferSelect
