import { and, asc, eq, gte, inArray, lt } from 'drizzle-orm'
import { holeAt, type Line } from '../../../orient/index'
import {
  setMembers,
  structures,
  structureSets,
  surveyStations,
  type AnalysisOptions,
  type Interval,
  type StructureSet,
} from '../../../schema/index'
import type { Executor } from '../db/client'

export interface IntervalStructure {
  id: number
  depth: number
  type: string
  source: string
  dip: number | null
  dipDirection: number | null
  poleTrend: number | null
  polePlunge: number | null
  terzaghiWeight: number | null
  flags: string[]
  /** Monte Carlo 95 % cone about the pole (degrees), null when not computed. */
  uncertainty95: number | null
}

/** What an interval's analysis reads: its structures (filtered), sets, explicit members, hole axis. */
export async function loadIntervalData(
  db: Executor,
  interval: Interval,
  filters: Pick<AnalysisOptions, 'types' | 'sources'> = {},
) {
  const rows: IntervalStructure[] = await db
    .select({
      id: structures.id,
      depth: structures.depth,
      type: structures.type,
      source: structures.source,
      dip: structures.dip,
      dipDirection: structures.dipDirection,
      poleTrend: structures.poleTrend,
      polePlunge: structures.polePlunge,
      terzaghiWeight: structures.terzaghiWeight,
      flags: structures.flags,
      uncertainty95: structures.uncertainty95,
    })
    .from(structures)
    .where(
      and(
        eq(structures.holeId, interval.holeId),
        gte(structures.depth, interval.fromDepth),
        lt(structures.depth, interval.toDepth),
        filters.types?.length ? inArray(structures.type, filters.types) : undefined,
        filters.sources?.length ? inArray(structures.source, filters.sources) : undefined,
      ),
    )
    .orderBy(asc(structures.depth), asc(structures.id))
  const sets: StructureSet[] = await db
    .select()
    .from(structureSets)
    .where(eq(structureSets.intervalId, interval.id))
    .orderBy(asc(structureSets.id))
  const members = sets.length
    ? await db
        .select()
        .from(setMembers)
        .where(
          inArray(
            setMembers.setId,
            sets.map((s) => s.id),
          ),
        )
    : []
  const stations = await db
    .select({
      depth: surveyStations.depth,
      azimuth: surveyStations.azimuth,
      plunge: surveyStations.plunge,
    })
    .from(surveyStations)
    .where(eq(surveyStations.holeId, interval.holeId))
    .orderBy(asc(surveyStations.depth))
  const hole: Line | undefined = holeAt(stations, (interval.fromDepth + interval.toDepth) / 2)
  return { structures: rows, sets, members, hole }
}
