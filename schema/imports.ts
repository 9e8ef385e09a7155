import {
  customType,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core'
import { holes } from './holes'
import { projects } from './projects'
import { users } from './users'
import { importKinds, importStatuses } from './vocabulary'

const bytea = customType<{ data: Buffer }>({ dataType: () => 'bytea' })

export const importKind = pgEnum('import_kind', importKinds)
export const importStatus = pgEnum('import_status', importStatuses)

/** An uploaded file on its way in: kept for audit, previewed, then committed all-or-nothing. */
export const imports = pgTable(
  'imports',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: integer('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    holeId: integer('hole_id').references(() => holes.id, { onDelete: 'cascade' }),
    kind: importKind('kind').notNull(),
    status: importStatus('status').notNull().default('previewed'),
    fileName: text('file_name').notNull(),
    file: bytea('file').notNull(),
    /** SHA-256 (hex) of the uploaded bytes: the same file committed twice to a hole is warned of. */
    sha256: text('sha256'),
    options: jsonb('options').notNull().default({}),
    rowCount: integer('row_count').notNull().default(0),
    errorCount: integer('error_count').notNull().default(0),
    /** First errors found (row, column, reason); the full list is recomputed on demand. */
    errors: jsonb('errors').notNull().default([]),
    progress: integer('progress').notNull().default(0),
    message: text('message').notNull().default(''),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    committedAt: timestamp('committed_at', { withTimezone: true }),
    /** Rows a replacing import (runs, survey) took out, kept so that undoing it puts them back. */
    replaced: jsonb('replaced'),
    /**
     * While committing: the attempt doing it and how long its lease runs. The attempt renews the
     * lease as it works; a lease that lapses (the server died) marks the import failed —
     * interrupted, and only the attempt named here may mark it committed.
     */
    attempt: uuid('attempt'),
    leaseUntil: timestamp('lease_until', { withTimezone: true }),
    undoneBy: integer('undone_by').references(() => users.id, { onDelete: 'set null' }),
    undoneAt: timestamp('undone_at', { withTimezone: true }),
  },
  (t) => [index('imports_project_idx').on(t.projectId, t.createdAt)],
)

export type Import = typeof imports.$inferSelect
