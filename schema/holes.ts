import {
  check,
  date,
  doublePrecision,
  integer,
  pgEnum,
  pgTable,
  serial,
  text,
  timestamp,
  unique,
} from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import { projects } from './projects'
import { azimuthReferences, holeStatuses } from './vocabulary'

export const holeStatus = pgEnum('hole_status', holeStatuses)
export const azimuthReference = pgEnum('azimuth_reference', azimuthReferences)

export const holes = pgTable(
  'holes',
  {
    id: serial('id').primaryKey(),
    projectId: integer('project_id')
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    collarEast: doublePrecision('collar_east').notNull(),
    collarNorth: doublePrecision('collar_north').notNull(),
    collarElevation: doublePrecision('collar_elevation').notNull(),
    /** Planned azimuth (true north) and plunge (degrees below horizontal, positive down). */
    plannedAzimuth: doublePrecision('planned_azimuth').notNull(),
    plannedPlunge: doublePrecision('planned_plunge').notNull(),
    finalDepth: doublePrecision('final_depth').notNull(),
    coreSize: text('core_size').notNull().default('HQ'),
    startDate: date('start_date'),
    status: holeStatus('status').notNull().default('planned'),
    /** Bumped on every survey change; stored structures record the revision they were computed with. */
    surveyRevision: integer('survey_revision').notNull().default(0),
    /** Soft delete: hidden everywhere, restorable by a lead or admin for 30 days, then purged. */
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
    deletedBy: integer('deleted_by'),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('holes_project_name_unique').on(t.projectId, t.name),
    check('holes_final_depth_positive', sql`${t.finalDepth} > 0`),
    check('holes_planned_plunge_range', sql`${t.plannedPlunge} between -90 and 90`),
  ],
)

/**
 * Survey stations. `azimuth` is true-north azimuth after correction; what was entered is kept in
 * `azimuthEntered` + `azimuthReference` with the declination/convergence applied.
 */
export const surveyStations = pgTable(
  'survey_stations',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    depth: doublePrecision('depth').notNull(),
    azimuth: doublePrecision('azimuth').notNull(),
    plunge: doublePrecision('plunge').notNull(),
    azimuthReference: azimuthReference('azimuth_reference').notNull().default('true'),
    azimuthEntered: doublePrecision('azimuth_entered').notNull(),
    declinationApplied: doublePrecision('declination_applied').notNull().default(0),
    convergenceApplied: doublePrecision('convergence_applied').notNull().default(0),
    /** How the plunge was given at import: 'plunge-down', 'dip-negative-down' or 'inclination-from-vertical'. */
    plungeConvention: text('plunge_convention').notNull().default('plunge-down'),
    method: text('method').notNull().default(''),
    surveyedOn: date('surveyed_on'),
    version: integer('version').notNull().default(1),
  },
  (t) => [
    unique('survey_stations_hole_depth_unique').on(t.holeId, t.depth),
    check('survey_stations_depth_nonnegative', sql`${t.depth} >= 0`),
    check('survey_stations_plunge_range', sql`${t.plunge} between -90 and 90`),
    check('survey_stations_azimuth_range', sql`${t.azimuth} >= 0 and ${t.azimuth} < 360`),
  ],
)

export type Hole = typeof holes.$inferSelect
export type NewHole = typeof holes.$inferInsert
export type SurveyStation = typeof surveyStations.$inferSelect
