import { integer, jsonb, pgTable, primaryKey, text, timestamp } from 'drizzle-orm/pg-core'
import { users } from './users'

/**
 * A client's `Idempotency-Key` and the answer it got: a retry of the same request with the same key
 * gets the same answer and stores nothing new. Written in the same transaction as the write itself.
 */
export const idempotencyKeys = pgTable(
  'idempotency_keys',
  {
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    /** `POST /api/projects/3/holes/7/structures`: a key is bound to one route. */
    route: text('route').notNull(),
    /** SHA-256 of the request body: the same key with another body is refused. */
    requestHash: text('request_hash').notNull(),
    status: integer('status').notNull(),
    body: jsonb('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.key] })],
)

export type IdempotencyKey = typeof idempotencyKeys.$inferSelect
