import type { AnyPgColumn } from 'drizzle-orm/pg-core'
import { structures, type NewStructure, type Structure } from '../../../schema/index'
import type { StructureComputed } from '../../../orient/index'

/**
 * The stored structure's computed columns: every value orient's computeStructures returns, and
 * the survey revision it was computed with. Named once, here, for every writer: the recompute's
 * update and the COPY of large imports write them from this list; the inserts (one structure,
 * picks, the demo seed) write inputs only (`StructureInputRow`) and leave them to the recompute.
 * A value computeStructures gains without a column here fails to compile.
 */
export const computedColumns = {
  dip: structures.dip,
  dipDirection: structures.dipDirection,
  poleTrend: structures.poleTrend,
  polePlunge: structures.polePlunge,
  holeTrend: structures.holeTrend,
  holePlunge: structures.holePlunge,
  east: structures.east,
  north: structures.north,
  elevation: structures.elevation,
  terzaghiWeight: structures.terzaghiWeight,
  declinationApplied: structures.declinationApplied,
  flags: structures.flags,
  betaRotationApplied: structures.betaRotationApplied,
  uncertainty95: structures.uncertainty95,
  uncertaintyMajor: structures.uncertaintyMajor,
  uncertaintyMinor: structures.uncertaintyMinor,
  uncertaintyAxisTrend: structures.uncertaintyAxisTrend,
  uncertaintyAxisPlunge: structures.uncertaintyAxisPlunge,
  uncertaintyReasons: structures.uncertaintyReasons,
  surveyRevision: structures.surveyRevision,
} satisfies Record<keyof StructureComputed | 'surveyRevision', AnyPgColumn>

export type ComputedKey = keyof typeof computedColumns
export const computedKeys = Object.keys(computedColumns) as ComputedKey[]
export type ComputedValues = Pick<Structure, ComputedKey>

/** A structure row as an insert writes it: inputs and provenance, no computed value. */
export type StructureInputRow = Omit<NewStructure, ComputedKey>

/** The values to store for one computed structure, keyed like their columns. */
export function computedValues(c: StructureComputed, surveyRevision: number): ComputedValues {
  const values: Record<string, unknown> = { surveyRevision }
  for (const key of computedKeys) if (key !== 'surveyRevision') values[key] = c[key]
  return values as ComputedValues
}
