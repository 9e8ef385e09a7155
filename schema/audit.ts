import { bigserial, index, integer, jsonb, pgTable, text, timestamp } from 'drizzle-orm/pg-core'
import { projects } from './projects'
import { users } from './users'

/** One row per write: who, when, what, and the row before and after. Kept when users go. */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    projectId: integer('project_id').references(() => projects.id, { onDelete: 'cascade' }),
    userId: integer('user_id').references(() => users.id, { onDelete: 'set null' }),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    action: text('action').notNull(),
    before: jsonb('before'),
    after: jsonb('after'),
  },
  (t) => [index('audit_events_project_at_idx').on(t.projectId, t.at)],
)

export type AuditEvent = typeof auditEvents.$inferSelect

/** Demo and data seeding steps already applied, so each runs once even after people edit or delete. */
export const seedSteps = pgTable('seed_steps', {
  name: text('name').primaryKey(),
  appliedAt: timestamp('applied_at', { withTimezone: true }).notNull().defaultNow(),
})
