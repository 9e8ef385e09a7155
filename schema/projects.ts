import {
  boolean,
  jsonb,
  doublePrecision,
  integer,
  pgEnum,
  pgTable,
  primaryKey,
  serial,
  text,
  timestamp,
} from 'drizzle-orm/pg-core'
import { users } from './users'
import {
  convergenceModes,
  declinationModes,
  netProjections,
  projectRoles,
  referenceLines,
} from './vocabulary'

export const declinationMode = pgEnum('declination_mode', declinationModes)
export const convergenceMode = pgEnum('convergence_mode', convergenceModes)
export const referenceLine = pgEnum('reference_line', referenceLines)
export const netProjection = pgEnum('net_projection', netProjections)
export const projectRole = pgEnum('project_role', projectRoles)

export const projects = pgTable('projects', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  /** Site coordinate reference system of collar coordinates, as an EPSG code. */
  crsEpsg: integer('crs_epsg').notNull(),
  declinationMode: declinationMode('declination_mode').notNull().default('manual'),
  /** Magnetic declination in degrees, east positive; used when the mode is manual. */
  declinationDeg: doublePrecision('declination_deg').notNull().default(0),
  convergenceMode: convergenceMode('convergence_mode').notNull().default('auto'),
  /** Grid convergence in degrees: grid azimuth = true azimuth − convergence; used when manual. */
  gridConvergenceDeg: doublePrecision('grid_convergence_deg').notNull().default(0),
  referenceLine: referenceLine('reference_line').notNull().default('bottom'),
  /** Hole plunge (degrees below horizontal) above which core orientation is flagged unreliable. */
  steepThresholdDeg: doublePrecision('steep_threshold_deg').notNull().default(85),
  netProjection: netProjection('net_projection').notNull().default('equal-area'),
  /** A beta differing by more than this from the previous structure of the same type in a run is flagged. */
  betaJumpDeg: doublePrecision('beta_jump_deg').notNull().default(60),
  /** Four eyes: the lead who approves an interval must not be the engineer who checked it. */
  fourEyes: boolean('four_eyes').notNull().default(true),
  /** Measurement error model (1σ per input, keys of orient's ErrorModel); missing keys = defaults. */
  errorModel: jsonb('error_model').$type<Record<string, number>>().notNull().default({}),
  /** Soft delete: hidden from members, restorable by an admin for 30 days, then purged. */
  deletedAt: timestamp('deleted_at', { withTimezone: true }),
  deletedBy: integer('deleted_by'),
  version: integer('version').notNull().default(1),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
})

export const memberships = pgTable(
  'memberships',
  {
    projectId: integer('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: projectRole('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.userId] })],
)

export type Project = typeof projects.$inferSelect
export type NewProject = typeof projects.$inferInsert
export type Membership = typeof memberships.$inferSelect
