import { and, asc, eq, gt, lte, sql } from 'drizzle-orm'
import { coreRuns, intervals, surveyStations, type Hole, type Project } from '../../../schema/index'
import type { Executor } from '../db/client'
import type { ComputeContext } from '../../../orient/index'

/**
 * Nominal hole diameter (mm) drilled for a wireline core size: NQ ≈ 75.7, HQ ≈ 96, PQ ≈ 122.6
 * (common practice, from memory); undefined for sizes we do not know.
 */
export function holeDiameterMm(coreSize: string): number | undefined {
  const size = coreSize
    .trim()
    .toUpperCase()
    .replace(/[0-9]+$/, '')
  return ({ NQ: 75.7, HQ: 96, PQ: 122.6 } as Record<string, number>)[size]
}

/** What computing a hole's structures needs: project conventions, survey, runs. */
export async function loadComputeContext(
  db: Executor,
  project: Project,
  hole: Hole,
): Promise<ComputeContext> {
  const [stations, runs] = await Promise.all([
    db
      .select({
        depth: surveyStations.depth,
        azimuth: surveyStations.azimuth,
        plunge: surveyStations.plunge,
        declinationApplied: surveyStations.declinationApplied,
      })
      .from(surveyStations)
      .where(eq(surveyStations.holeId, hole.id))
      .orderBy(asc(surveyStations.depth)),
    db
      .select({
        fromDepth: coreRuns.fromDepth,
        toDepth: coreRuns.toDepth,
        markConfidence: coreRuns.markConfidence,
      })
      .from(coreRuns)
      .where(eq(coreRuns.holeId, hole.id))
      .orderBy(asc(coreRuns.fromDepth)),
  ])
  return {
    steepThresholdDeg: project.steepThresholdDeg,
    betaJumpDeg: project.betaJumpDeg,
    referenceLine: project.referenceLine,
    collar: { east: hole.collarEast, north: hole.collarNorth, elevation: hole.collarElevation },
    planned: { trend: hole.plannedAzimuth, plunge: hole.plannedPlunge },
    holeDiameter: holeDiameterMm(hole.coreSize),
    stations,
    runs,
  }
}

/** The depth range whose structures a write at `depth` can affect: its run (beta jumps), or the depth alone. */
export function affectedRange(ctx: ComputeContext, depth: number): { from: number; to: number } {
  const run = ctx.runs.find((r) => depth >= r.fromDepth && depth < r.toDepth)
  return run ? { from: run.fromDepth, to: run.toDepth } : { from: depth, to: depth + 1e-9 }
}

/** True when a checked (or later) interval covers the depth: its structures are locked to loggers. */
export async function lockedAt(db: Executor, holeId: number, depth: number): Promise<boolean> {
  const [row] = await db
    .select({ id: intervals.id })
    .from(intervals)
    .where(
      and(
        eq(intervals.holeId, holeId),
        lte(intervals.fromDepth, depth),
        gt(intervals.toDepth, depth),
        sql`${intervals.status} <> 'draft'`,
      ),
    )
    .limit(1)
  return row !== undefined
}
