import { and, desc, eq, inArray, isNull, ne, sql } from 'drizzle-orm'
import {
  adjustments,
  coreRuns,
  images,
  imagePicks,
  structures,
  type Adjustment,
  type AdjustmentAnswer,
  type Hole,
  type Project,
  type ReconciliationApplyAnswer,
  type ReconciliationApplyBody,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import type { Mailer } from '../mail/transport'
import { badRequest, conflict, notFound } from '../http/errors'
import { audit } from './audit'
import { guardWrite, writeAndNotice, type Demoted } from './freeze'
import { assertWithinHole, lockHole, runRotations } from './structure-context'
import { recomputeStructures } from './structure-recompute'
import { appliedDepthShift, listAdjustments } from './reconciliation'

/** Shifts closer than this (m) or rotations closer than this (degrees) are the same. */
const SAME = 1e-9

/**
 * Moves the hole's image side from one depth shift in force to another: image structures, the
 * images' top and bottom and their picks (centre and clicked points) by −(to − from), so stored =
 * logged − shift. Refused when a structure would pass the collar or the final depth (400) and, where an approved interval
 * holds the old or new depth of a moved structure, 409; checked ones go back to draft.
 */
async function moveImageSide(
  tx: Executor,
  actorId: number,
  project: Project,
  hole: Hole,
  from: number,
  to: number,
  demoted: Demoted[],
): Promise<number> {
  const delta = to - from
  const moved = await tx
    .select({ id: structures.id, depth: structures.depth })
    .from(structures)
    .where(and(eq(structures.holeId, hole.id), eq(structures.source, 'image')))
  const next = moved.map((s) => ({ path: `structure ${s.id}`, depth: s.depth - delta }))
  // Image strips themselves may then start above the collar or end past the hole (a strip logged
  // from 0 m moved up by the shift): the part outside the hole is simply not shown.
  const above = next.find((d) => d.depth < 0)
  if (above)
    throw badRequest(`A shift of ${to} m would put ${above.path} above the collar.`, [
      { path: 'body.depthShift', message: `${above.path} would be at ${above.depth} m` },
    ])
  assertWithinHole(hole, next)
  demoted.push(
    ...(await guardWrite(
      tx,
      actorId,
      project.id,
      hole.id,
      { depths: [...moved.map((s) => s.depth), ...next.map((d) => d.depth)] },
      {
        what: 'Shifting the image depths',
        reason: 'the image depths were shifted onto core depths',
      },
    )),
  )
  await tx
    .update(structures)
    .set({ depth: sql`${structures.depth} - ${delta}`, depthShiftApplied: to })
    .where(and(eq(structures.holeId, hole.id), eq(structures.source, 'image')))
  const holeImages = tx.select({ id: images.id }).from(images).where(eq(images.holeId, hole.id))
  await tx
    .update(images)
    .set({
      topDepth: sql`${images.topDepth} - ${delta}`,
      bottomDepth: sql`${images.bottomDepth} - ${delta}`,
      depthShiftApplied: to,
    })
    .where(eq(images.holeId, hole.id))
  await tx
    .update(imagePicks)
    .set({
      centreDepth: sql`${imagePicks.centreDepth} - ${delta}`,
      points: sql`(select coalesce(jsonb_agg(jsonb_set(p, '{depth}', to_jsonb((p->>'depth')::float8 - ${delta}))), '[]'::jsonb)
        from jsonb_array_elements(${imagePicks.points}) as p)`,
    })
    .where(inArray(imagePicks.imageId, holeImages))
  return moved.length
}

async function guardRun(
  tx: Executor,
  actorId: number,
  project: Project,
  hole: Hole,
  run: { fromDepth: number; toDepth: number },
  demoted: Demoted[],
) {
  demoted.push(
    ...(await guardWrite(
      tx,
      actorId,
      project.id,
      hole.id,
      { ranges: [{ from: run.fromDepth, to: run.toDepth }] },
      {
        what: `Turning the orientation line of run ${run.fromDepth}–${run.toDepth} m`,
        reason: "a run's orientation line was turned",
      },
    )),
  )
}

/**
 * Records the accepted depth shift and run rotations (totals from the logged records) as
 * adjustments and recomputes the hole's structures, in one transaction with one audit row.
 * A value equal to the one in force records nothing. Runs must be the hole's (400 naming them).
 */
export async function applyReconciliation(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  body: ReconciliationApplyBody,
): Promise<ReconciliationApplyAnswer> {
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const current = await lockHole(tx, hole.id)
    const created: Adjustment[] = []
    const before: Record<string, number> = {}
    if (body.depthShift !== undefined) {
      const inForce = await appliedDepthShift(tx, hole.id)
      if (Math.abs(inForce - body.depthShift) > SAME) {
        const moved = await moveImageSide(
          tx,
          actorId,
          project,
          current,
          inForce,
          body.depthShift,
          demoted,
        )
        before.depthShift = inForce
        created.push(
          await record(
            tx,
            actorId,
            hole.id,
            'depth-shift',
            null,
            body.depthShift,
            inForce,
            body.reason,
            {
              moved,
            },
          ),
        )
      }
    }
    if (body.runRotations?.length) {
      const ids = body.runRotations.map((r) => r.runId)
      const runs = await tx
        .select()
        .from(coreRuns)
        .where(and(eq(coreRuns.holeId, hole.id), inArray(coreRuns.id, ids)))
      const missing = body.runRotations.flatMap((r, i) =>
        runs.some((x) => x.id === r.runId)
          ? []
          : [
              {
                path: `body.runRotations.${i}.runId`,
                message: `run ${r.runId} is not in this hole`,
              },
            ],
      )
      if (missing.length) throw badRequest(missing[0].message, missing)
      const inForce = await runRotations(tx, hole.id)
      for (const { runId, rotation } of body.runRotations) {
        const was = inForce.get(runId) ?? 0
        if (Math.abs(was - rotation) <= SAME) continue
        const run = runs.find((x) => x.id === runId)!
        await guardRun(tx, actorId, project, current, run, demoted)
        before[`run ${runId}`] = was
        created.push(
          await record(tx, actorId, hole.id, 'run-rotation', runId, rotation, was, body.reason, {
            fromDepth: run.fromDepth,
            toDepth: run.toDepth,
          }),
        )
      }
    }
    const recomputed = created.length ? await recomputeStructures(tx, project, current) : 0
    if (created.length)
      await audit(tx, {
        projectId: project.id,
        userId: actorId,
        entity: 'hole',
        entityId: hole.id,
        action: 'reconcile-apply',
        before,
        after: {
          adjustments: created.map((a) => ({
            id: a.id,
            kind: a.kind,
            runId: a.runId,
            value: a.value,
          })),
          recomputed,
          reason: body.reason,
        },
      })
    const ids = new Set(created.map((a) => a.id))
    const listed = await listAdjustments(tx, hole.id)
    return { adjustments: listed.filter((a) => ids.has(a.id)), recomputed }
  })
}

async function record(
  tx: Executor,
  actorId: number,
  holeId: number,
  kind: Adjustment['kind'],
  runId: number | null,
  value: number,
  previous: number,
  reason: string,
  basis: Record<string, unknown>,
): Promise<Adjustment> {
  const [row] = await tx
    .insert(adjustments)
    .values({ holeId, kind, runId, value, previous, reason, basis, createdBy: actorId })
    .returning()
  return row
}

/**
 * Undoes one adjustment: marked undone (kept, with who and when), the value in force falls back
 * to the newest other one not undone (or none), and the hole is recomputed — in one transaction,
 * audited. An adjustment already undone answers 409; one of another hole 404.
 */
export async function undoAdjustment(
  db: Db,
  mail: Mailer,
  actorId: number,
  project: Project,
  hole: Hole,
  adjustmentId: number,
): Promise<{ undone: AdjustmentAnswer; recomputed: number }> {
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const current = await lockHole(tx, hole.id)
    const [target] = await tx
      .select()
      .from(adjustments)
      .where(and(eq(adjustments.id, adjustmentId), eq(adjustments.holeId, hole.id)))
      .for('update')
    if (!target) throw notFound('Adjustment')
    if (target.undoneAt) throw conflict('This adjustment was undone already.', 'already_undone')
    const sameKind = and(
      eq(adjustments.holeId, hole.id),
      eq(adjustments.kind, target.kind),
      target.runId === null ? isNull(adjustments.runId) : eq(adjustments.runId, target.runId),
      isNull(adjustments.undoneAt),
    )
    const [newest] = await tx
      .select()
      .from(adjustments)
      .where(sameKind)
      .orderBy(desc(adjustments.createdAt), desc(adjustments.id))
      .limit(1)
    const [fallback] = await tx
      .select()
      .from(adjustments)
      .where(and(sameKind, ne(adjustments.id, target.id)))
      .orderBy(desc(adjustments.createdAt), desc(adjustments.id))
      .limit(1)
    const wasInForce = newest?.id === target.id
    const next = fallback?.value ?? 0
    if (wasInForce && Math.abs(next - target.value) > SAME) {
      if (target.kind === 'depth-shift')
        await moveImageSide(tx, actorId, project, current, target.value, next, demoted)
      else {
        const [run] = await tx.select().from(coreRuns).where(eq(coreRuns.id, target.runId!))
        if (run) await guardRun(tx, actorId, project, current, run, demoted)
      }
    }
    const [undone] = await tx
      .update(adjustments)
      .set({ undoneAt: new Date(), undoneBy: actorId })
      .where(eq(adjustments.id, target.id))
      .returning()
    const recomputed = wasInForce ? await recomputeStructures(tx, project, current) : 0
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'reconcile-undo',
      before: {
        adjustment: target.id,
        kind: target.kind,
        runId: target.runId,
        value: target.value,
      },
      after: { inForce: wasInForce ? next : null, recomputed },
    })
    const listed = await listAdjustments(tx, hole.id)
    return { undone: listed.find((a) => a.id === undone.id)!, recomputed }
  })
}
