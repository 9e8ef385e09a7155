import { and, asc, eq } from 'drizzle-orm'
import { runMetricsOf } from '../../../orient/index'
import {
  coreRuns,
  RunInput,
  type CoreRun,
  type Hole,
  type Project,
  type RunInputT,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import type { Mailer } from '../mail/transport'
import { badRequest, notFound, staleVersion, zodDetails } from '../http/errors'
import { audit } from './audit'
import { writeOnce, type IdempotencyRequest } from './idempotency'
import { writeAndNotice, type Demoted } from './freeze'
import {
  assertFits,
  assertRunsWithinHole,
  changedRunRanges,
  checkRunSequence,
  guardRuns,
} from './run-rules'
import { lockHole, runRotations } from './structure-context'
import { recomputeRanges, type DepthRange } from './structure-recompute'

export { checkRunSequence } from './run-rules'

/** A run with its TCR, SCR, RQD (%), fracture frequency (/m) and Deere class. */
export function withMetrics(run: CoreRun) {
  return { ...run, metrics: runMetricsOf(run) ?? null }
}

/** The hole's runs with metrics and the orientation-line rotation in force (reconciliation). */
export async function listRuns(db: Executor, holeId: number) {
  // One after another: a transaction's queries share one connection.
  const rows = await db
    .select()
    .from(coreRuns)
    .where(eq(coreRuns.holeId, holeId))
    .orderBy(asc(coreRuns.fromDepth))
  const rotations = await runRotations(db, holeId)
  return rows.map((r) => ({ ...withMetrics(r), betaRotation: rotations.get(r.id) ?? 0 }))
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

const span = (r: { fromDepth: number; toDepth: number }) => `${r.fromDepth}–${r.toDepth} m`
const extent = (r: { fromDepth: number; toDepth: number }): DepthRange => ({
  from: r.fromDepth,
  to: r.toDepth,
})

/**
 * Replaces the hole's runs inside an open transaction (used by the API and by imports). Intervals
 * a checked interval demoted are pushed to `demoted`, for the caller to tell after its commit.
 */
export async function replaceRunsIn(
  tx: Executor,
  actorId: number,
  project: Project,
  hole: Hole,
  runs: RunInputT[],
  demoted: Demoted[] = [],
) {
  const { errors, gaps } = checkRunSequence(runs, 'body.runs')
  if (errors.length) throw badRequest('Runs overlap.', errors, 'runs_overlap')
  const current = await lockHole(tx, hole.id)
  assertRunsWithinHole(
    current,
    runs.map((r, i) => ({ toDepth: r.toDepth, path: `body.runs.${i}.toDepth` })),
  )
  const before = await tx.select().from(coreRuns).where(eq(coreRuns.holeId, hole.id))
  const changed = changedRunRanges(before, runs)
  await guardRuns(
    tx,
    actorId,
    current,
    changed,
    { what: "Replacing the hole's core runs", reason: "the hole's core runs were replaced" },
    demoted,
  )
  await tx.delete(coreRuns).where(eq(coreRuns.holeId, hole.id))
  if (runs.length) await tx.insert(coreRuns).values(runs.map((r) => ({ ...r, holeId: hole.id })))
  await recomputeRanges(tx, project, current, changed)
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
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  runs: RunInputT[],
) =>
  writeAndNotice(db, mail, project.id, hole, (tx, demoted) =>
    replaceRunsIn(tx, actorId, project, hole, runs, demoted),
  )

/** Adds one run, at most once per idempotency key (as `createStructure`). */
export async function addRun(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  input: RunInputT,
  idempotency?: IdempotencyRequest,
) {
  return writeAndNotice(db, mail, project.id, hole, (tx, demoted) =>
    writeOnce(tx, idempotency, 201, async () => {
      const current = await lockHole(tx, hole.id)
      assertRunsWithinHole(current, [{ toDepth: input.toDepth, path: 'body.toDepth' }])
      const change = {
        what: `A core run ${span(input)}`,
        reason: `core run ${span(input)} was added`,
      }
      await assertFits(tx, hole.id, input)
      await guardRuns(tx, actorId, current, [extent(input)], change, demoted)
      const [row] = await tx
        .insert(coreRuns)
        .values({ ...input, holeId: hole.id })
        .returning()
      await recomputeRanges(tx, project, current, [extent(row)])
      await audit(tx, {
        projectId: project.id,
        userId: actorId,
        entity: 'core_run',
        entityId: row.id,
        action: 'create',
        after: row,
      })
      return withMetrics(row)
    }),
  )
}

export async function updateRun(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  id: number,
  input: Partial<RunInputT> & { version: number },
) {
  const { version, ...fields } = input
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const [before] = await tx
      .select()
      .from(coreRuns)
      .where(and(eq(coreRuns.id, id), eq(coreRuns.holeId, hole.id)))
    if (!before) throw notFound('Core run')
    const merged = RunInput.safeParse({ ...pickRunFields(before), ...fields })
    if (!merged.success) throw badRequest('Invalid run.', zodDetails('body', merged.error))
    const current = await lockHole(tx, hole.id)
    assertRunsWithinHole(current, [{ toDepth: merged.data.toDepth, path: 'body.toDepth' }])
    const ranges = [extent(before), extent(merged.data)]
    const change = {
      what: `Editing core run ${span(before)}`,
      reason: `core run ${span(before)} was edited`,
    }
    await assertFits(tx, hole.id, merged.data, id)
    await guardRuns(tx, actorId, current, ranges, change, demoted)
    const [after] = await tx
      .update(coreRuns)
      .set({ ...fields, version: version + 1 })
      .where(and(eq(coreRuns.id, id), eq(coreRuns.version, version)))
      .returning()
    if (!after) throw staleVersion()
    await recomputeRanges(tx, project, current, ranges)
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

export async function deleteRun(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  id: number,
) {
  await writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const current = await lockHole(tx, hole.id)
    const [before] = await tx
      .delete(coreRuns)
      .where(and(eq(coreRuns.id, id), eq(coreRuns.holeId, hole.id)))
      .returning()
    if (!before) throw notFound('Core run')
    const change = {
      what: `Deleting core run ${span(before)}`,
      reason: `core run ${span(before)} was deleted`,
    }
    await guardRuns(tx, actorId, current, [extent(before)], change, demoted)
    await recomputeRanges(tx, project, current, [extent(before)])
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
