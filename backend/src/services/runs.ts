import { and, asc, eq } from 'drizzle-orm'
import { runMetrics } from '../../../orient/index'
import {
  coreRuns,
  RunInput,
  type CoreRun,
  type Hole,
  type Project,
  type RunInputT,
} from '../../../schema/index'
import { zodDetails } from '../http/validate'
import type { Db, Executor, Tx } from '../db/client'
import { badRequest, notFound, staleVersion, type ErrorDetail } from '../http/errors'
import { audit } from './audit'
import { recomputeStructures } from './structures'

/** A run with its TCR, SCR, RQD (%), fracture frequency (/m) and Deere class. */
export function withMetrics(run: CoreRun) {
  const m = runMetrics({
    from: run.fromDepth,
    to: run.toDepth,
    recovered: run.recovered,
    solid: run.solid,
    rqdLength: run.rqdLength,
    fractures: run.fractureCount,
  })
  return { ...run, metrics: m ?? null }
}

export async function listRuns(db: Executor, holeId: number) {
  const rows = await db
    .select()
    .from(coreRuns)
    .where(eq(coreRuns.holeId, holeId))
    .orderBy(asc(coreRuns.fromDepth))
  return rows.map(withMetrics)
}

const pickRunFields = (r: CoreRun): RunInputT => ({
  fromDepth: r.fromDepth,
  toDepth: r.toDepth,
  recovered: r.recovered,
  solid: r.solid,
  rqdLength: r.rqdLength,
  fractureCount: r.fractureCount,
  markConfidence: r.markConfidence,
  comment: r.comment,
})

/** Overlaps are errors (naming both runs); gaps between runs are reported, not refused. */
export function checkRunSequence(
  runs: readonly { fromDepth: number; toDepth: number }[],
  path = 'runs',
) {
  const order = runs.map((r, i) => ({ ...r, i })).sort((a, b) => a.fromDepth - b.fromDepth)
  const errors: ErrorDetail[] = []
  const gaps: { from: number; to: number }[] = []
  for (let k = 1; k < order.length; k++) {
    const a = order[k - 1]
    const b = order[k]
    if (b.fromDepth < a.toDepth - 1e-9) {
      errors.push({
        path: `${path}.${b.i}.fromDepth`,
        message: `run ${b.fromDepth}–${b.toDepth} m overlaps run ${a.fromDepth}–${a.toDepth} m`,
      })
    } else if (b.fromDepth > a.toDepth + 1e-9) gaps.push({ from: a.toDepth, to: b.fromDepth })
  }
  return { errors, gaps }
}

async function afterRunsChange(tx: Executor, project: Project, hole: Hole) {
  // Mark confidence and run limits change structure flags: recompute the hole.
  await recomputeStructures(tx, project, hole)
}

/** Replaces the hole's runs inside an open transaction (used by the API and by imports). */
export async function replaceRunsIn(
  tx: Executor,
  actorId: number,
  project: Project,
  hole: Hole,
  runs: RunInputT[],
) {
  const { errors, gaps } = checkRunSequence(runs, 'body.runs')
  if (errors.length) throw badRequest('Runs overlap.', errors, 'runs_overlap')
  const before = await tx.select().from(coreRuns).where(eq(coreRuns.holeId, hole.id))
  await tx.delete(coreRuns).where(eq(coreRuns.holeId, hole.id))
  if (runs.length) await tx.insert(coreRuns).values(runs.map((r) => ({ ...r, holeId: hole.id })))
  await afterRunsChange(tx, project, hole)
  const after = await listRuns(tx, hole.id)
  await audit(tx, {
    projectId: project.id,
    userId: actorId,
    entity: 'core_runs',
    entityId: hole.id,
    action: 'replace',
    before,
    after,
  })
  return { runs: after, gaps }
}

export const replaceRuns = (
  db: Db,
  actorId: number,
  project: Project,
  hole: Hole,
  runs: RunInputT[],
) => db.transaction((tx) => replaceRunsIn(tx, actorId, project, hole, runs))

async function assertFits(
  tx: Tx,
  holeId: number,
  run: { fromDepth: number; toDepth: number },
  exceptId?: number,
) {
  const others = await tx.select().from(coreRuns).where(eq(coreRuns.holeId, holeId))
  const clash = others.find(
    (o) =>
      o.id !== exceptId && run.fromDepth < o.toDepth - 1e-9 && run.toDepth > o.fromDepth + 1e-9,
  )
  if (clash) {
    throw badRequest(
      'The run overlaps another.',
      [{ path: 'body.fromDepth', message: `overlaps run ${clash.fromDepth}–${clash.toDepth} m` }],
      'runs_overlap',
    )
  }
}

export async function addRun(
  db: Db,
  actorId: number,
  project: Project,
  hole: Hole,
  input: RunInputT,
) {
  return db.transaction(async (tx) => {
    await assertFits(tx, hole.id, input)
    const [row] = await tx
      .insert(coreRuns)
      .values({ ...input, holeId: hole.id })
      .returning()
    await afterRunsChange(tx, project, hole)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'core_run',
      entityId: row.id,
      action: 'create',
      after: row,
    })
    return withMetrics(row)
  })
}

export async function updateRun(
  db: Db,
  actorId: number,
  project: Project,
  hole: Hole,
  id: number,
  input: Partial<RunInputT> & { version: number },
) {
  const { version, ...fields } = input
  return db.transaction(async (tx) => {
    const [before] = await tx
      .select()
      .from(coreRuns)
      .where(and(eq(coreRuns.id, id), eq(coreRuns.holeId, hole.id)))
    if (!before) throw notFound('Core run')
    const merged = RunInput.safeParse({ ...pickRunFields(before), ...fields })
    if (!merged.success) throw badRequest('Invalid run.', zodDetails('body', merged.error))
    await assertFits(tx, hole.id, merged.data, id)
    const [after] = await tx
      .update(coreRuns)
      .set({ ...fields, version: version + 1 })
      .where(and(eq(coreRuns.id, id), eq(coreRuns.version, version)))
      .returning()
    if (!after) throw staleVersion()
    await afterRunsChange(tx, project, hole)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'core_run',
      entityId: id,
      action: 'update',
      before,
      after,
    })
    return withMetrics(after)
  })
}

export async function deleteRun(db: Db, actorId: number, project: Project, hole: Hole, id: number) {
  await db.transaction(async (tx) => {
    const [before] = await tx
      .delete(coreRuns)
      .where(and(eq(coreRuns.id, id), eq(coreRuns.holeId, hole.id)))
      .returning()
    if (!before) throw notFound('Core run')
    await afterRunsChange(tx, project, hole)
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'core_run',
      entityId: id,
      action: 'delete',
      before,
    })
  })
}
