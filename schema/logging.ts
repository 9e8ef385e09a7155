import {
  check,
  doublePrecision,
  index,
  integer,
  pgEnum,
  pgTable,
  serial,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import { holes } from './holes'
import { referenceLine } from './projects'
import { users } from './users'
import { imports } from './imports'
import { markConfidences, structureSources, structureTypes } from './vocabulary'

export const markConfidence = pgEnum('mark_confidence', markConfidences)

/** A drilled core run, [fromDepth, toDepth) in metres along hole. */
export const coreRuns = pgTable(
  'core_runs',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    fromDepth: doublePrecision('from_depth').notNull(),
    toDepth: doublePrecision('to_depth').notNull(),
    recovered: doublePrecision('recovered').notNull(),
    solid: doublePrecision('solid').notNull(),
    rqdLength: doublePrecision('rqd_length').notNull(),
    fractureCount: integer('fracture_count').notNull().default(0),
    markConfidence: markConfidence('mark_confidence').notNull().default('good'),
    comment: text('comment').notNull().default(''),
    importId: uuid('import_id').references(() => imports.id, { onDelete: 'set null' }),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('core_runs_hole_from_idx').on(t.holeId, t.fromDepth),
    check('core_runs_order', sql`${t.toDepth} > ${t.fromDepth}`),
  ],
)

export const structureType = pgEnum('structure_type', structureTypes)
export const structureSource = pgEnum('structure_source', structureSources)

/**
 * A planar structure at a depth. Inputs (alpha/beta/gamma, an image pick, or a true orientation)
 * are kept beside the computed true orientation and the conventions used to compute it.
 */
export const structures = pgTable(
  'structures',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    depth: doublePrecision('depth').notNull(),
    type: structureType('type').notNull(),
    source: structureSource('source').notNull().default('core'),
    // inputs: core angles
    alpha: doublePrecision('alpha'),
    beta: doublePrecision('beta'),
    gamma: doublePrecision('gamma'),
    gammaConvention: text('gamma_convention'),
    referenceLine: referenceLine('reference_line'),
    // inputs: measured otherwise (true source)
    inputDip: doublePrecision('input_dip'),
    inputDipDirection: doublePrecision('input_dip_direction'),
    // inputs: image pick, raw
    pickAmplitude: doublePrecision('pick_amplitude'),
    pickDiameter: doublePrecision('pick_diameter'),
    pickTroughAzimuth: doublePrecision('pick_trough_azimuth'),
    pickReference: text('pick_reference'),
    pickAzimuthReference: text('pick_azimuth_reference'),
    pickQuality: text('pick_quality'),
    // computed by the server with orient/
    dip: doublePrecision('dip'),
    dipDirection: doublePrecision('dip_direction'),
    poleTrend: doublePrecision('pole_trend'),
    polePlunge: doublePrecision('pole_plunge'),
    holeTrend: doublePrecision('hole_trend'),
    holePlunge: doublePrecision('hole_plunge'),
    east: doublePrecision('east'),
    north: doublePrecision('north'),
    elevation: doublePrecision('elevation'),
    terzaghiWeight: doublePrecision('terzaghi_weight'),
    declinationApplied: doublePrecision('declination_applied'),
    surveyRevision: integer('survey_revision'),
    flags: text('flags')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    /** Run rotation in force when computed (degrees added to the logged beta; 0 when none). */
    betaRotationApplied: doublePrecision('beta_rotation_applied'),
    /** Image side: depth shift in force (image depth − core depth, m); depth = logged − this. */
    depthShiftApplied: doublePrecision('depth_shift_applied').notNull().default(0),
    /** Monte Carlo 95 % cone half-angle about the pole (degrees), its ellipse and why it is large. */
    uncertainty95: doublePrecision('uncertainty95'),
    uncertaintyMajor: doublePrecision('uncertainty_major'),
    uncertaintyMinor: doublePrecision('uncertainty_minor'),
    uncertaintyAxisTrend: doublePrecision('uncertainty_axis_trend'),
    uncertaintyAxisPlunge: doublePrecision('uncertainty_axis_plunge'),
    uncertaintyReasons: text('uncertainty_reasons')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    // condition (ISRM 1978 suggested methods)
    roughness: text('roughness'),
    jrc: doublePrecision('jrc'),
    apertureMm: doublePrecision('aperture_mm'),
    infillType: text('infill_type'),
    infillThicknessMm: doublePrecision('infill_thickness_mm'),
    persistence: text('persistence'),
    wallWeathering: text('wall_weathering'),
    state: text('state'),
    confidence: text('confidence'),
    comment: text('comment').notNull().default(''),
    importId: uuid('import_id').references(() => imports.id, { onDelete: 'set null' }),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    updatedBy: integer('updated_by').references(() => users.id, { onDelete: 'set null' }),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('structures_hole_depth_idx').on(t.holeId, t.depth),
    check('structures_alpha_range', sql`${t.alpha} is null or ${t.alpha} between 0 and 90`),
    check('structures_beta_range', sql`${t.beta} is null or (${t.beta} >= 0 and ${t.beta} <= 360)`),
  ],
)

export type CoreRun = typeof coreRuns.$inferSelect
export type Structure = typeof structures.$inferSelect
export type NewStructure = typeof structures.$inferInsert
