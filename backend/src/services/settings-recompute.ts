import { asc, eq, sql } from 'drizzle-orm'
import { holes, surveyStations, type Hole, type Project } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import type { Mailer } from '../mail/transport'
import { audit } from './audit'
import { assertNotFrozen, demoteChecked, noticeDemoted, type Demoted } from './freeze'
import { listStations, stationRow } from './survey'
import { recomputeStructures } from './structures'

/** The project settings that the stored true azimuths (and so every structure) depend on. */
export const conventionFields = [
  'declinationMode',
  'declinationDeg',
  'convergenceMode',
  'gridConvergenceDeg',
  'crsEpsg',
] as const satisfies readonly (keyof Project)[]

export const conventionsChanged = (before: Project, after: Project) =>
  conventionFields.some((k) => before[k] !== after[k])

/** Corrections closer than this (degrees) are the same correction. */
const SAME = 1e-9

export interface HoleDemotions {
  hole: Pick<Hole, 'id' | 'name'>
  demoted: Demoted[]
}

export const REASON = "the project's declination or convergence settings changed"

/**
 * Inside the project update's transaction: every survey station of every hole is corrected again
 * from what was entered (azimuth, reference, date) with the new declination and convergence. A hole
 * whose stations change gets its survey revision bumped, all its structures recomputed, its checked
 * intervals back to draft, and one audit row with the counts; an approved or issued interval in
 * such a hole refuses the whole update (409, assertNotFrozen). Holes whose stations keep their
 * values (true-north surveys, no survey) are left alone.
 */
export async function recomputeConventions(
  tx: Executor,
  actorId: number,
  project: Project,
): Promise<HoleDemotions[]> {
  const rows = await tx
    .select()
    .from(holes)
    .where(eq(holes.projectId, project.id))
    .orderBy(asc(holes.name))
  const out: HoleDemotions[] = []
  for (const hole of rows) {
    const stations = await listStations(tx, hole.id)
    const changed = stations.flatMap((st) => {
      const next = stationRow(project, hole, {
        depth: st.depth,
        azimuth: st.azimuthEntered,
        plunge: st.plunge,
        azimuthReference: st.azimuthReference,
        method: st.method,
        surveyedOn: st.surveyedOn,
      })
      const same =
        Math.abs(next.azimuth - st.azimuth) < SAME &&
        Math.abs((next.declinationApplied ?? 0) - st.declinationApplied) < SAME &&
        Math.abs((next.convergenceApplied ?? 0) - st.convergenceApplied) < SAME
      return same ? [] : [{ before: st, next }]
    })
    if (changed.length === 0) continue
    await assertNotFrozen(
      tx,
      hole.id,
      { hole: true },
      `Changing the project's declination or convergence (hole ${hole.name})`,
    )
    for (const { before, next } of changed) {
      await tx
        .update(surveyStations)
        .set({
          azimuth: next.azimuth,
          declinationApplied: next.declinationApplied,
          convergenceApplied: next.convergenceApplied,
        })
        .where(eq(surveyStations.id, before.id))
    }
    const [bumped] = await tx
      .update(holes)
      .set({ surveyRevision: sql`${holes.surveyRevision} + 1` })
      .where(eq(holes.id, hole.id))
      .returning()
    const structures = await recomputeStructures(tx, project, bumped)
    const demoted = await demoteChecked(tx, actorId, project.id, hole.id, { hole: true }, REASON)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'recompute-conventions',
      before: {
        surveyRevision: hole.surveyRevision,
        stations: changed.map(({ before: b }) => ({
          id: b.id,
          azimuth: b.azimuth,
          declinationApplied: b.declinationApplied,
          convergenceApplied: b.convergenceApplied,
        })),
      },
      after: {
        surveyRevision: bumped.surveyRevision,
        stations: changed.length,
        structures,
        demotedIntervals: demoted.map((d) => d.interval.id),
      },
    })
    out.push({ hole: { id: hole.id, name: hole.name }, demoted })
  }
  return out
}

/** After the commit: each checker of a demoted interval is told. */
export async function noticeConventionDemotions(
  db: Db,
  mail: Mailer,
  projectId: number,
  all: HoleDemotions[],
) {
  for (const { hole, demoted } of all)
    await noticeDemoted(db, mail, projectId, hole, demoted, REASON)
}
