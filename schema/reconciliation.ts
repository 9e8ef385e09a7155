import {
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  serial,
  text,
  timestamp,
} from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import { holes } from './holes'
import { coreRuns } from './logging'
import { users } from './users'
import { adjustmentKinds } from './vocabulary'

export const adjustmentKind = pgEnum('adjustment_kind', adjustmentKinds)

/**
 * A recorded reconciliation adjustment of a hole: the image records' depth shift (image depth −
 * core depth, metres; the image side is moved onto core depths) or one core run's orientation-line
 * rotation (degrees clockwise looking down-hole, added to the run's logged beta values). `value` is
 * the total from the logged records, not an increment; the one in force for a hole (depth shift)
 * or a run (rotation) is the newest not undone. Logged values are never changed.
 */
export const adjustments = pgTable(
  'reconciliation_adjustments',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    kind: adjustmentKind('kind').notNull(),
    runId: integer('run_id').references(() => coreRuns.id, { onDelete: 'cascade' }),
    value: doublePrecision('value').notNull(),
    /** The value in force before this one (0 when none). */
    previous: doublePrecision('previous').notNull().default(0),
    /** What the estimate was when it was accepted: matches, spread, verdict. */
    basis: jsonb('basis').notNull().default({}),
    reason: text('reason').notNull().default(''),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    undoneBy: integer('undone_by').references(() => users.id, { onDelete: 'set null' }),
    undoneAt: timestamp('undone_at', { withTimezone: true }),
  },
  (t) => [
    index('reconciliation_adjustments_hole_idx').on(t.holeId, t.createdAt),
    check(
      'reconciliation_adjustments_run',
      sql`(${t.kind} = 'run-rotation') = (${t.runId} is not null)`,
    ),
  ],
)

export type Adjustment = typeof adjustments.$inferSelect
