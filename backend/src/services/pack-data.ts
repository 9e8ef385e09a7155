import { and, asc, eq, inArray, isNull } from 'drizzle-orm'
import {
  domains,
  holes,
  intervals,
  setMembers,
  structures,
  structureSets,
  surveyStations,
  type Project,
} from '../../../schema/index'
import type { Executor } from '../db/client'
import { badRequest } from '../http/errors'
import { sha256Hex, canonicalJson } from '../exports/hash'
import type { PackData, PackInterval, RunWithMetrics } from '../exports/pack-types'
import { intervalRunSummary } from '../exports/run-summary'
import { isApproved } from '../exports/sign-off'
import { analyseInterval } from './analysis'
import { settingsOf } from './intervals'
import { listRuns } from './runs'
import { signOffsOf } from './sign-offs'

export interface PackSelection {
  holeIds?: number[]
  intervalIds?: number[]
}

/**
 * Reads everything a pack shows, once: the selected holes and intervals (an empty selection is the
 * whole project), their structures, runs and surveys, and each interval's analysis. The SHA-256 of
 * the canonical JSON of every row read is the pack's inputs hash.
 */
export async function loadPackData(
  db: Executor,
  project: Project,
  selection: PackSelection,
): Promise<PackData> {
  const allHoles = await db
    .select()
    .from(holes)
    // a deleted hole (in the bin) is in no pack
    .where(and(eq(holes.projectId, project.id), isNull(holes.deletedAt)))
    .orderBy(asc(holes.name))
  const holeIdsAll = allHoles.map((h) => h.id)
  const allIntervals = holeIdsAll.length
    ? await db
        .select()
        .from(intervals)
        .where(inArray(intervals.holeId, holeIdsAll))
        .orderBy(asc(intervals.holeId), asc(intervals.fromDepth))
    : []
  const unknownHole = (selection.holeIds ?? []).find((id) => !holeIdsAll.includes(id))
  const unknownInterval = (selection.intervalIds ?? []).find(
    (id) => !allIntervals.some((i) => i.id === id),
  )
  if (unknownHole !== undefined || unknownInterval !== undefined)
    throw badRequest('The selection names holes or intervals outside this project.', [
      { path: unknownHole !== undefined ? 'body.holeIds' : 'body.intervalIds', message: 'unknown' },
    ])
  const whole = !selection.holeIds?.length && !selection.intervalIds?.length
  const chosenIntervals = allIntervals.filter(
    (i) =>
      whole ||
      selection.intervalIds?.includes(i.id) ||
      (!selection.intervalIds?.length && selection.holeIds?.includes(i.holeId)),
  )
  const holeIds = new Set<number>([
    ...(whole ? holeIdsAll : (selection.holeIds ?? [])),
    ...chosenIntervals.map((i) => i.holeId),
  ])
  const chosenHoles = allHoles.filter((h) => holeIds.has(h.id))
  const ids = chosenHoles.map((h) => h.id)
  const stations = ids.length
    ? await db
        .select()
        .from(surveyStations)
        .where(inArray(surveyStations.holeId, ids))
        .orderBy(asc(surveyStations.holeId), asc(surveyStations.depth))
    : []
  const allStructures = ids.length
    ? await db
        .select()
        .from(structures)
        .where(inArray(structures.holeId, ids))
        .orderBy(asc(structures.holeId), asc(structures.depth), asc(structures.id))
    : []
  // Only intervals chosen (not whole holes): structures inside those intervals only.
  const byIntervalOnly = !whole && !!selection.intervalIds?.length && !selection.holeIds?.length
  const packStructures = byIntervalOnly
    ? allStructures.filter((s) =>
        chosenIntervals.some(
          (i) => i.holeId === s.holeId && s.depth >= i.fromDepth && s.depth < i.toDepth,
        ),
      )
    : allStructures
  const runs = new Map<number, RunWithMetrics[]>()
  for (const h of chosenHoles) runs.set(h.id, await listRuns(db, h.id))
  const domainRows = await db.select().from(domains).where(eq(domains.projectId, project.id))
  const setRows = chosenIntervals.length
    ? await db
        .select()
        .from(structureSets)
        .where(
          inArray(
            structureSets.intervalId,
            chosenIntervals.map((i) => i.id),
          ),
        )
        .orderBy(asc(structureSets.id))
    : []
  const memberRows = setRows.length
    ? await db
        .select()
        .from(setMembers)
        .where(
          and(
            inArray(
              setMembers.setId,
              setRows.map((s) => s.id),
            ),
          ),
        )
        .orderBy(asc(setMembers.setId), asc(setMembers.structureId))
    : []
  const signOffs = await signOffsOf(db, chosenIntervals)
  const packIntervals: PackInterval[] = []
  const assignment: PackData['assignment'] = new Map()
  for (const interval of chosenIntervals) {
    const hole = chosenHoles.find((h) => h.id === interval.holeId)!
    // No options: each interval's own saved settings, exactly as GET …/analysis answers.
    const analysis = await analyseInterval(db, interval)
    const setName = new Map(analysis.sets.map((s) => [s.id, s.name]))
    for (const s of analysis.structures) {
      if (!assignment.has(s.id))
        assignment.set(s.id, {
          interval: interval.name,
          intervalId: interval.id,
          set: s.setId === null ? '' : (setName.get(s.setId) ?? ''),
        })
    }
    packIntervals.push({
      interval,
      hole,
      domain: domainRows.find((d) => d.id === interval.domainId)?.name ?? '',
      analysis,
      settings: settingsOf(interval),
      signOff: signOffs.byInterval.get(interval.id)!,
      runs: intervalRunSummary(runs.get(hole.id) ?? [], interval.fromDepth, interval.toDepth),
    })
  }
  const inputsHash = sha256Hex(
    canonicalJson({
      project,
      holes: chosenHoles,
      stations,
      runs: [...runs.values()].flat(),
      structures: packStructures,
      intervals: chosenIntervals,
      domains: domainRows,
      sets: setRows,
      members: memberRows,
      settings: chosenIntervals.map((i) => ({ id: i.id, ...settingsOf(i) })),
      signers: signOffs.names,
    }),
  )
  return {
    project,
    holes: chosenHoles,
    stations,
    runs,
    structures: packStructures,
    intervals: packIntervals,
    assignment,
    draft: !chosenIntervals.every(isApproved),
    inputsHash,
  }
}
