import { and, asc, eq, sql } from 'drizzle-orm'
import { logCurves } from '../../../schema/index'
import type { Db } from '../db/client'
import { notFound } from '../http/errors'

/** The hole's curves without their sample arrays. */
export const listCurves = (db: Db, holeId: number) =>
  db
    .select({
      id: logCurves.id,
      mnemonic: logCurves.mnemonic,
      unit: logCurves.unit,
      description: logCurves.description,
      sourceFile: logCurves.sourceFile,
      depthShift: logCurves.depthShift,
      minDepth: logCurves.minDepth,
      maxDepth: logCurves.maxDepth,
      sampleCount: sql<number>`coalesce(array_length(${logCurves.values}, 1), 0)`.mapWith(Number),
      importId: logCurves.importId,
    })
    .from(logCurves)
    .where(eq(logCurves.holeId, holeId))
    .orderBy(asc(logCurves.id))

/** One curve with its samples; `values` holds null where a sample is absent. */
export async function getCurve(
  db: Db,
  holeId: number,
  curveId: number,
): Promise<{
  id: number
  mnemonic: string
  unit: string
  depths: number[]
  values: (number | null)[]
}> {
  const [row] = await db
    .select({
      id: logCurves.id,
      mnemonic: logCurves.mnemonic,
      unit: logCurves.unit,
      depths: logCurves.depths,
      values: logCurves.values,
    })
    .from(logCurves)
    .where(and(eq(logCurves.id, curveId), eq(logCurves.holeId, holeId)))
  if (!row) throw notFound('Curve')
  return row
}
