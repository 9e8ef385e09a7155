import { doublePrecision, index, integer, pgTable, serial, text, uuid } from 'drizzle-orm/pg-core'
import { holes } from './holes'
import { imports } from './imports'

/**
 * One LAS curve for a hole. Samples are stored as two parallel float8 arrays (depth in metres
 * after unit conversion and depth shift; values with NULL for absent samples): one row per curve,
 * not one per sample.
 */
export const logCurves = pgTable(
  'log_curves',
  {
    id: serial('id').primaryKey(),
    holeId: integer('hole_id')
      .notNull()
      .references(() => holes.id, { onDelete: 'cascade' }),
    importId: uuid('import_id').references(() => imports.id, { onDelete: 'set null' }),
    mnemonic: text('mnemonic').notNull(),
    unit: text('unit').notNull().default(''),
    description: text('description').notNull().default(''),
    sourceFile: text('source_file').notNull(),
    depthShift: doublePrecision('depth_shift').notNull().default(0),
    depths: doublePrecision('depths').array().notNull(),
    values: doublePrecision('values').array().notNull(),
    minDepth: doublePrecision('min_depth').notNull(),
    maxDepth: doublePrecision('max_depth').notNull(),
  },
  (t) => [index('log_curves_hole_idx').on(t.holeId)],
)

export type LogCurve = typeof logCurves.$inferSelect
