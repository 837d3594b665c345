import { sql } from 'drizzle-orm'
import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import type { ProjectRole } from '@/lib/review/roles'
import type { RevisionState } from '@/lib/review/workflow'

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
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('revisions_calc_label').on(t.calcId, t.label)],
)

export const checkRemarks = sqliteTable('check_remarks', {
  id: id(),
  revisionId: text('revision_id')
    .notNull()
    .references(() => revisions.id, { onDelete: 'cascade' }),
  /** The result step the remark is about; stable across revisions. */
  stepId: text('step_id').notNull(),
  authorId: text('author_id')
    .notNull()
    .references(() => users.id),
  text: text('text').notNull(),
  status: text('status', { enum: ['open', 'answered', 'closed'] }).notNull().default('open'),
  response: text('response'),
  createdAt: createdAt(),
})

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

export type User = typeof users.$inferSelect
export type Project = typeof projects.$inferSelect
export type Calc = typeof calcs.$inferSelect
export type Revision = typeof revisions.$inferSelect
export type CheckRemark = typeof checkRemarks.$inferSelect
export type ApiToken = typeof apiTokens.$inferSelect
