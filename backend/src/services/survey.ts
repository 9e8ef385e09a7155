import { and, asc, eq, sql } from 'drizzle-orm'
import {
  holes,
  surveyStations,
  type Hole,
  type Project,
  type StationInputT,
  type SurveyStation,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import type { Mailer } from '../mail/transport'
import { notFound, staleVersion } from '../http/errors'
import { audit } from './audit'
import { azimuthToTrue, convergenceFor, declinationFor } from './declination'
import { recomputeStructures } from './structures'
import { guardWrite, writeAndNotice, type Demoted } from './freeze'

export const listStations = (db: Executor, holeId: number) =>
  db
    .select()
    .from(surveyStations)
    .where(eq(surveyStations.holeId, holeId))
    .orderBy(asc(surveyStations.depth))

type StationFields = Omit<typeof surveyStations.$inferInsert, 'holeId'>

/** Entered values → stored row: azimuth corrected to true north, the correction recorded. */
export function stationRow(project: Project, hole: Hole, input: StationInputT): StationFields {
  const reference = input.azimuthReference ?? 'true'
  const date = input.surveyedOn
    ? new Date(input.surveyedOn)
    : hole.startDate
      ? new Date(hole.startDate)
      : new Date()
  const declination = reference === 'magnetic' ? declinationFor(project, hole, date) : 0
  const convergence = reference === 'grid' ? convergenceFor(project, hole) : 0
  const corrected = azimuthToTrue(input.azimuth, reference, declination, convergence)
  return {
    depth: input.depth,
    plunge: input.plunge,
    azimuthEntered: input.azimuth,
    azimuthReference: reference,
    method: input.method ?? '',
    surveyedOn: input.surveyedOn ?? null,
    ...corrected,
  }
}

/**
 * Run in the same transaction after any survey change: the hole's survey revision goes up and
 * every structure of the hole is recomputed with the new survey, audited as one recompute. Every
 * interval of the hole is touched: 409 with an approved one, checked ones go back to draft (the
 * hole row is locked before the intervals, in the order structure writes take them: no deadlock).
 */
async function afterSurveyChange(
  tx: Executor,
  project: Project,
  hole: Hole,
  actorId: number,
  demoted: Demoted[],
) {
  const [bumped] = await tx
    .update(holes)
    .set({ surveyRevision: sql`${holes.surveyRevision} + 1` })
    .where(eq(holes.id, hole.id))
    .returning()
  const change = { what: "Changing the hole's survey", reason: "the hole's survey changed" }
  demoted.push(...(await guardWrite(tx, actorId, project.id, hole.id, { hole: true }, change)))
  const count = await recomputeStructures(tx, project, bumped)
  if (count > 0) {
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'structures',
      entityId: hole.id,
      action: 'recompute',
      after: { surveyRevision: bumped.surveyRevision, structures: count },
    })
  }
}

/** Replaces the hole's survey inside an open transaction (used by the API and by imports). */
export async function replaceSurveyIn(
  tx: Executor,
  actorId: number,
  project: Project,
  hole: Hole,
  stations: StationInputT[],
  demoted: Demoted[] = [],
): Promise<SurveyStation[]> {
  const before = await listStations(tx, hole.id)
  await tx.delete(surveyStations).where(eq(surveyStations.holeId, hole.id))
  if (stations.length > 0) {
    await tx
      .insert(surveyStations)
      .values(stations.map((s) => ({ ...stationRow(project, hole, s), holeId: hole.id })))
  }
  const after = await listStations(tx, hole.id)
  await afterSurveyChange(tx, project, hole, actorId, demoted)
  await audit(tx, {
    projectId: project.id,
    userId: actorId,
    entity: 'survey',
    entityId: hole.id,
    action: 'replace',
    before,
    after,
  })
  return after
}

export const replaceSurvey = (
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  stations: StationInputT[],
) =>
  writeAndNotice(db, mail, project.id, hole, (tx, demoted) =>
    replaceSurveyIn(tx, actorId, project, hole, stations, demoted),
  )

export async function addStation(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  input: StationInputT,
) {
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const [row] = await tx
      .insert(surveyStations)
      .values({ ...stationRow(project, hole, input), holeId: hole.id })
      .returning()
    await afterSurveyChange(tx, project, hole, actorId, demoted)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'survey_station',
      entityId: row.id,
      action: 'create',
      after: row,
    })
    return row
  })
}

export async function updateStation(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  stationId: number,
  input: Partial<StationInputT> & { version: number },
) {
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const where = and(eq(surveyStations.id, stationId), eq(surveyStations.holeId, hole.id))
    const [before] = await tx.select().from(surveyStations).where(where)
    if (!before) throw notFound('Survey station')
    const merged: StationInputT = {
      depth: input.depth ?? before.depth,
      azimuth: input.azimuth ?? before.azimuthEntered,
      plunge: input.plunge ?? before.plunge,
      azimuthReference: input.azimuthReference ?? before.azimuthReference,
      method: input.method ?? before.method,
      surveyedOn: input.surveyedOn !== undefined ? input.surveyedOn : before.surveyedOn,
    }
    const [after] = await tx
      .update(surveyStations)
      .set({ ...stationRow(project, hole, merged), version: input.version + 1 })
      .where(and(where, eq(surveyStations.version, input.version)))
      .returning()
    if (!after) throw staleVersion()
    await afterSurveyChange(tx, project, hole, actorId, demoted)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'survey_station',
      entityId: stationId,
      action: 'update',
      before,
      after,
    })
    return after
  })
}

export async function deleteStation(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  stationId: number,
) {
  await writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const [before] = await tx
      .delete(surveyStations)
      .where(and(eq(surveyStations.id, stationId), eq(surveyStations.holeId, hole.id)))
      .returning()
    if (!before) throw notFound('Survey station')
    await afterSurveyChange(tx, project, hole, actorId, demoted)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'survey_station',
      entityId: stationId,
      action: 'delete',
      before,
    })
  })
}
