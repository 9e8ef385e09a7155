import {
  boolean,
  customType,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  serial,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core'
import { projectRole, projects } from './projects'
import { users } from './users'
import { packStatuses, tokenPurposes } from './vocabulary'

const bytea = customType<{ data: Buffer }>({ dataType: () => 'bytea' })

export const tokenPurpose = pgEnum('token_purpose', tokenPurposes)

/**
 * Single-use, expiring e-mail tokens (invitations and password resets). Only a SHA-256 hash of
 * the token is stored; the token itself travels once, in the e-mail.
 */
export const authTokens = pgTable(
  'auth_tokens',
  {
    id: serial('id').primaryKey(),
    purpose: tokenPurpose('purpose').notNull(),
    email: text('email').notNull(),
    userId: integer('user_id').references(() => users.id, { onDelete: 'cascade' }),
    projectId: integer('project_id').references(() => projects.id, { onDelete: 'cascade' }),
    role: projectRole('role'),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('auth_tokens_email_idx').on(t.email)],
)

/** Comments on structures and intervals, with the project members they mention. */
export const comments = pgTable(
  'comments',
  {
    id: serial('id').primaryKey(),
    projectId: integer('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    entity: text('entity').notNull(),
    entityId: integer('entity_id').notNull(),
    userId: integer('user_id').references(() => users.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    mentions: integer('mentions').array().notNull().default([]),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('comments_entity_idx').on(t.projectId, t.entity, t.entityId)],
)

/** Mail caught by the local fake SMTP server (development and tests only). */
export const capturedMails = pgTable('captured_mails', {
  id: serial('id').primaryKey(),
  from: text('from').notNull(),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html'),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
})

export const packStatus = pgEnum('pack_status', packStatuses)

/** A design pack: a selection of holes/intervals built into files, frozen once issued. */
export const packs = pgTable('packs', {
  id: uuid('id').primaryKey().defaultRandom(),
  projectId: integer('project_id')
    .notNull()
    .references(() => projects.id, { onDelete: 'cascade' }),
  status: packStatus('status').notNull().default('queued'),
  selection: jsonb('selection').notNull().default({}),
  /** True when any packed interval was not approved at build: every page says DRAFT, never issued. */
  draft: boolean('draft').notNull().default(false),
  progress: integer('progress').notNull().default(0),
  message: text('message').notNull().default(''),
  /** The build attempt at work and its lease (see imports.attempt): a lapsed lease = interrupted. */
  attempt: uuid('attempt'),
  leaseUntil: timestamp('lease_until', { withTimezone: true }),
  /** SHA-256 of the inputs (rows read) and of the files, fixed at issue. */
  inputsHash: text('inputs_hash'),
  contentHash: text('content_hash'),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  issuedBy: integer('issued_by').references(() => users.id, { onDelete: 'set null' }),
  issuedAt: timestamp('issued_at', { withTimezone: true }),
})

export const packFiles = pgTable(
  'pack_files',
  {
    packId: uuid('pack_id')
      .notNull()
      .references(() => packs.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    mime: text('mime').notNull(),
    sha256: text('sha256').notNull(),
    bytes: bytea('bytes').notNull(),
  },
  (t) => [primaryKey({ columns: [t.packId, t.name] })],
)

export type AuthToken = typeof authTokens.$inferSelect
export type Comment = typeof comments.$inferSelect
export type Pack = typeof packs.$inferSelect
