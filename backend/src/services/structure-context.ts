import { and, asc, eq, gt, lte, sql } from 'drizzle-orm'
import {
  adjustments,
  coreRuns,
  holes,
  intervals,
  surveyStations,
  type Hole,
  type Project,
} from '../../../schema/index'
import type { Executor } from '../db/client'
import { badRequest, notFound } from '../http/errors'
import { DEFAULT_ERROR_MODEL, type ComputeContext, type ErrorModel } from '../../../orient/index'

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

/** The project's error model: its stored values over the stated defaults (orient/error-model.ts). */
export function errorModelOf(project: Pick<Project, 'errorModel'>): ErrorModel {
  const stored = project.errorModel ?? {}
  const model: Record<string, number> = { ...DEFAULT_ERROR_MODEL }
  for (const key of Object.keys(DEFAULT_ERROR_MODEL))
    if (typeof stored[key] === 'number' && Number.isFinite(stored[key])) model[key] = stored[key]
  return model as unknown as ErrorModel
}

/**
 * The orientation-line rotation in force per run of the hole: the newest run-rotation adjustment
 * not undone (reconciliation), keyed by run id.
 */
export async function runRotations(db: Executor, holeId: number): Promise<Map<number, number>> {
  const rows = await db.execute<{ run_id: number; value: number }>(sql`
    select distinct on (${adjustments.runId}) ${adjustments.runId} as run_id, ${adjustments.value} as value
    from ${adjustments}
    where ${adjustments.holeId} = ${holeId} and ${adjustments.kind} = 'run-rotation'
      and ${adjustments.undoneAt} is null
    order by ${adjustments.runId}, ${adjustments.createdAt} desc, ${adjustments.id} desc`)
  return new Map(rows.rows.map((r) => [Number(r.run_id), Number(r.value)]))
}

/** What computing a hole's structures needs: project conventions, error model, survey, runs. */
export async function loadComputeContext(
  db: Executor,
  project: Project,
  hole: Hole,
): Promise<ComputeContext> {
  // One after another: inside a transaction they share one connection anyway.
  const stations = await db
    .select({
      depth: surveyStations.depth,
      azimuth: surveyStations.azimuth,
      plunge: surveyStations.plunge,
      declinationApplied: surveyStations.declinationApplied,
      method: surveyStations.method,
    })
    .from(surveyStations)
    .where(eq(surveyStations.holeId, hole.id))
    .orderBy(asc(surveyStations.depth))
  const runs = await db
    .select({
      id: coreRuns.id,
      fromDepth: coreRuns.fromDepth,
      toDepth: coreRuns.toDepth,
      markConfidence: coreRuns.markConfidence,
    })
    .from(coreRuns)
    .where(eq(coreRuns.holeId, hole.id))
    .orderBy(asc(coreRuns.fromDepth))
  const rotations = await runRotations(db, hole.id)
  return {
    steepThresholdDeg: project.steepThresholdDeg,
    betaJumpDeg: project.betaJumpDeg,
    referenceLine: project.referenceLine,
    collar: { east: hole.collarEast, north: hole.collarNorth, elevation: hole.collarElevation },
    planned: { trend: hole.plannedAzimuth, plunge: hole.plannedPlunge },
    holeDiameter: holeDiameterMm(hole.coreSize),
    stations,
    runs: runs.map(({ id, ...r }) => ({ ...r, betaRotation: rotations.get(id) ?? 0 })),
    errorModel: errorModelOf(project),
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

/**
 * The hole as it is now, share-locked until the transaction ends: a concurrent change of its final
 * depth or survey waits for this write, and this write sees the committed values.
 */
export async function lockHole(tx: Executor, holeId: number): Promise<Hole> {
  const [row] = await tx.select().from(holes).where(eq(holes.id, holeId)).for('share')
  if (!row) throw notFound('Hole')
  return row
}

/** 400 naming each depth that lies beyond the hole's final depth (extend the hole first). */
export function assertWithinHole(
  hole: Pick<Hole, 'finalDepth'>,
  depths: readonly { path: string; depth: number }[],
): void {
  const beyond = depths.filter((d) => d.depth > hole.finalDepth)
  if (beyond.length === 0) return
  const message = `beyond the hole's final depth (${hole.finalDepth} m)`
  throw badRequest(
    `${beyond[0].depth} m is ${message}: extend the hole's final depth first.`,
    beyond.slice(0, 50).map((d) => ({ path: d.path, message })),
  )
}
