import {
  doublePrecision,
  integer,
  pgEnum,
  pgTable,
  primaryKey,
  serial,
  text,
  timestamp,
  unique,
  check,
} from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import { holes } from './holes'
import { projects } from './projects'
import { structures } from './logging'
import { analysisWeightings, contourMethods, intervalStatuses, setRules } from './vocabulary'

export const intervalStatus = pgEnum('interval_status', intervalStatuses)
export const setRule = pgEnum('set_rule', setRules)
export const analysisWeighting = pgEnum('analysis_weighting', analysisWeightings)
export const contourMethod = pgEnum('contour_method', contourMethods)

/** A structural/geotechnical domain gathering intervals across holes. */
export const domains = pgTable(
  'domains',
  {
    id: serial('id').primaryKey(),
    projectId: integer('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
  },
  (t) => [unique('domains_project_name_unique').on(t.projectId, t.name)],
)

/** A depth interval [fromDepth, toDepth) of one hole; intervals of a hole never overlap. */
export const intervals = pgTable(
  'intervals',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    domainId: integer('domain_id').references(() => domains.id, { onDelete: 'set null' }),
    name: text('name').notNull(),
    fromDepth: doublePrecision('from_depth').notNull(),
    toDepth: doublePrecision('to_depth').notNull(),
    status: intervalStatus('status').notNull().default('draft'),
    faceDip: doublePrecision('face_dip'),
    faceDipDirection: doublePrecision('face_dip_direction'),
    frictionDeg: doublePrecision('friction_deg'),
    // Analysis settings: stored with the interval, frozen from approval on, used by design packs.
    weighting: analysisWeighting('weighting').notNull().default('terzaghi'),
    contourMethod: contourMethod('contour_method').notNull().default('kamb'),
    /** Wedge/planar lateral limit and flexural toppling limit of the kinematic screening, degrees. */
    lateralLimitDeg: doublePrecision('lateral_limit_deg').notNull().default(20),
    topplingLimitDeg: doublePrecision('toppling_limit_deg').notNull().default(30),
    checkedBy: integer('checked_by'),
    checkedAt: timestamp('checked_at', { withTimezone: true }),
    approvedBy: integer('approved_by'),
    approvedAt: timestamp('approved_at', { withTimezone: true }),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check('intervals_order', sql`${t.toDepth} > ${t.fromDepth}`)],
)

/** A joint set within an interval: by cone about a centre, or by clustering with explicit members. */
export const structureSets = pgTable('structure_sets', {
  id: serial('id').primaryKey(),
  intervalId: integer('interval_id')
    .notNull()
    .references(() => intervals.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  rule: setRule('rule').notNull().default('cone'),
  centreTrend: doublePrecision('centre_trend').notNull(),
  centrePlunge: doublePrecision('centre_plunge').notNull(),
  coneAngle: doublePrecision('cone_angle').notNull().default(20),
  version: integer('version').notNull().default(1),
})

export const setMembers = pgTable(
  'set_members',
  {
    setId: integer('set_id')
      .notNull()
      .references(() => structureSets.id, { onDelete: 'cascade' }),
    structureId: integer('structure_id')
      .notNull()
      .references(() => structures.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.setId, t.structureId] })],
)

export type Domain = typeof domains.$inferSelect
export type Interval = typeof intervals.$inferSelect
export type StructureSet = typeof structureSets.$inferSelect
