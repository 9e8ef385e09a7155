import {
  boolean,
  check,
  customType,
  doublePrecision,
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
import { sql } from 'drizzle-orm'
import { holes } from './holes'
import { structures } from './logging'
import { users } from './users'
import {
  imageAzimuthReferences,
  imageKinds,
  imageNorthReferences,
  imageSources,
  imageStatuses,
} from './vocabulary'

const bytea = customType<{ data: Buffer }>({ dataType: () => 'bytea' })

export const imageKind = pgEnum('image_kind', imageKinds)
export const imageSource = pgEnum('image_source', imageSources)
export const imageStatus = pgEnum('image_status', imageStatuses)
export const imageAzimuthReference = pgEnum('image_azimuth_reference', imageAzimuthReferences)
export const imageNorthReference = pgEnum('image_north_reference', imageNorthReferences)

/**
 * A televiewer image of the borehole wall, unrolled: `height` rows from topDepth to bottomDepth
 * (row i covers topDepth + i·rowStep … + rowStep), `width` samples per turn, the left edge at
 * `leftAzimuth` degrees from the reference, azimuth increasing to the right (clockwise looking
 * down-hole). Samples are stored as tiles of a zoom pyramid (image_tiles); the file as uploaded is
 * kept (image_files). Strips overlap: where two of one kind cover a depth, the newer one is shown.
 */
export const images = pgTable(
  'images',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    kind: imageKind('kind').notNull(),
    source: imageSource('source').notNull(),
    /** A short name: the file name, or for a LAS array its curve group (e.g. "AMP"). */
    name: text('name').notNull(),
    fileName: text('file_name').notNull(),
    mediaType: text('media_type').notNull(),
    fileSize: integer('file_size').notNull(),
    /** SHA-256 (hex) of the uploaded bytes. */
    sha256: text('sha256').notNull(),
    topDepth: doublePrecision('top_depth').notNull(),
    bottomDepth: doublePrecision('bottom_depth').notNull(),
    /** Reconciliation depth shift in force (image − core, m): top/bottom = as logged − this. */
    depthShiftApplied: doublePrecision('depth_shift_applied').notNull().default(0),
    /** Samples per turn. */
    width: integer('width').notNull(),
    /** Rows (depth samples) at full resolution. */
    height: integer('height').notNull(),
    /** 1 grey, 3 RGB (optical). */
    channels: integer('channels').notNull(),
    /** 8 or 16: tiles hold uint8 or uint16 (little-endian) samples. */
    sampleBits: integer('sample_bits').notNull(),
    /**
     * For LAS arrays: the physical values that stored samples 1 and 65535 stand for (0 = no value,
     * the file's NULL). Null for rasters, whose samples are the file's own.
     */
    valueMin: doublePrecision('value_min'),
    valueMax: doublePrecision('value_max'),
    valueUnit: text('value_unit'),
    leftAzimuth: doublePrecision('left_azimuth').notNull().default(0),
    azimuthReference: imageAzimuthReference('azimuth_reference').notNull(),
    /** Set for north-referenced images; null for high-side ones. */
    northReference: imageNorthReference('north_reference'),
    /** Borehole diameter the image was logged in (mm): the `diameterMm` of picks made on it. */
    diameterMm: doublePrecision('diameter_mm').notNull(),
    /** Where the diameter came from: `entered`, `caliper` (LAS curve), `bit-size` (LAS), `hole`. */
    diameterSource: text('diameter_source').notNull(),
    /** Rows per tile (at every level) and the number of pyramid levels (level L halves L times). */
    tileRows: integer('tile_rows').notNull().default(256),
    levels: integer('levels').notNull().default(0),
    status: imageStatus('status').notNull().default('processing'),
    /** Percent done while processing. */
    progress: integer('progress').notNull().default(0),
    /** Why it failed, in words a person can act on. */
    message: text('message').notNull().default(''),
    /** Notes from reading the file (e.g. rows resampled, curves left out). */
    notes: jsonb('notes').notNull().default([]),
    /** While a job tiles it: the attempt doing so and its lease (see imports.attempt). */
    attempt: uuid('attempt'),
    leaseUntil: timestamp('lease_until', { withTimezone: true }),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('images_hole_idx').on(t.holeId, t.createdAt),
    check('images_depth_order', sql`${t.bottomDepth} > ${t.topDepth}`),
    check('images_size', sql`${t.width} > 0 and ${t.height} > 0`),
  ],
)

/** The uploaded file, in chunks (a large strip is hundreds of megabytes). */
export const imageFiles = pgTable(
  'image_files',
  {
    imageId: integer('image_id')
      .notNull()
      .references(() => images.id, { onDelete: 'cascade' }),
    seq: integer('seq').notNull(),
    bytes: bytea('bytes').notNull(),
  },
  (t) => [primaryKey({ columns: [t.imageId, t.seq] })],
)

/**
 * One tile of the pyramid: `rows` rows (tileRows, fewer in the last) of every sample across the
 * turn, zlib-deflated, row-major, channels interleaved. Level 0 is full resolution; each row of
 * level L+1 is the mean of two rows of level L (no-value samples left out).
 */
export const imageTiles = pgTable(
  'image_tiles',
  {
    imageId: integer('image_id')
      .notNull()
      .references(() => images.id, { onDelete: 'cascade' }),
    level: integer('level').notNull(),
    tile: integer('tile').notNull(),
    rows: integer('rows').notNull(),
    bytes: bytea('bytes').notNull(),
  },
  (t) => [primaryKey({ columns: [t.imageId, t.level, t.tile] })],
)

/**
 * How a structure was picked on an image: the points clicked (depth m, azimuth degrees in the
 * image's own reference), the fitted sinusoid as picked (centre depth, peak-to-trough height in
 * mm, trough azimuth in the image's reference), its RMS residual, and whether it began as a
 * suggestion. The structure row holds the pick as converted (trough referred to true north).
 */
export const imagePicks = pgTable(
  'image_picks',
  {
    structureId: integer('structure_id')
      .primaryKey()
      .references(() => structures.id, { onDelete: 'cascade' }),
    imageId: integer('image_id').references(() => images.id, { onDelete: 'set null' }),
    points: jsonb('points').notNull(),
    centreDepth: doublePrecision('centre_depth').notNull(),
    heightMm: doublePrecision('height_mm').notNull(),
    troughAzimuth: doublePrecision('trough_azimuth').notNull(),
    diameterMm: doublePrecision('diameter_mm').notNull(),
    azimuthReference: imageAzimuthReference('azimuth_reference').notNull(),
    northReference: imageNorthReference('north_reference'),
    rmsMm: doublePrecision('rms_mm').notNull(),
    suggested: boolean('suggested').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('image_picks_image_idx').on(t.imageId)],
)

export type Image = typeof images.$inferSelect
export type ImageTile = typeof imageTiles.$inferSelect
export type ImagePickRecord = typeof imagePicks.$inferSelect
