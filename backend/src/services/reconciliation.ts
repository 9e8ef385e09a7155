import { and, asc, desc, eq, isNotNull, isNull } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { reconcileCoreImage } from '../../../orient/index'
import {
  adjustments,
  coreRuns,
  structures,
  users,
  type Adjustment,
  type AdjustmentAnswer,
  type Hole,
  type Project,
  type ReconciliationAnswer,
  type ReconciliationQuery,
  type ReconciliationItem,
} from '../../../schema/index'
import type { Executor } from '../db/client'
import { runRotations } from './structure-context'

const undoer = alias(users, 'undoer')

/** The hole's adjustments, newest first, each marked active when it is the one in force. */
export async function listAdjustments(db: Executor, holeId: number): Promise<AdjustmentAnswer[]> {
  const rows = await db
    .select({ a: adjustments, createdBy: users.name, undoneBy: undoer.name })
    .from(adjustments)
    .leftJoin(users, eq(users.id, adjustments.createdBy))
    .leftJoin(undoer, eq(undoer.id, adjustments.undoneBy))
    .where(eq(adjustments.holeId, holeId))
    .orderBy(desc(adjustments.createdAt), desc(adjustments.id))
  const seen = new Set<string>()
  return rows.map(({ a, createdBy, undoneBy }) => {
    const key = `${a.kind}/${a.runId ?? ''}`
    const active = a.undoneAt === null && !seen.has(key)
    if (active) seen.add(key)
    return adjustmentAnswer(a, createdBy, undoneBy, active)
  })
}

export function adjustmentAnswer(
  a: Adjustment,
  createdBy: string | null,
  undoneBy: string | null,
  active: boolean,
): AdjustmentAnswer {
  return {
    id: a.id,
    kind: a.kind,
    runId: a.runId,
    value: a.value,
    previous: a.previous,
    reason: a.reason,
    basis: a.basis as Record<string, unknown>,
    createdAt: a.createdAt.toISOString(),
    createdBy,
    undoneAt: a.undoneAt?.toISOString() ?? null,
    undoneBy,
    active,
  }
}

/** The image side's depth shift in force (0 when none): the newest depth-shift not undone. */
export async function appliedDepthShift(db: Executor, holeId: number): Promise<number> {
  const [row] = await db
    .select({ value: adjustments.value })
    .from(adjustments)
    .where(
      and(
        eq(adjustments.holeId, holeId),
        eq(adjustments.kind, 'depth-shift'),
        isNull(adjustments.undoneAt),
      ),
    )
    .orderBy(desc(adjustments.createdAt), desc(adjustments.id))
    .limit(1)
  return row?.value ?? 0
}

const item = (s: {
  id: number
  depth: number
  type: string
  dip: number | null
  dipDirection: number | null
}): ReconciliationItem => ({
  id: s.id,
  depth: s.depth,
  type: s.type,
  dip: s.dip,
  dipDirection: s.dipDirection,
})

/**
 * Pairs the hole's oriented core structures with its image structures and estimates the depth
 * shift and each run's orientation-line rotation (orient reconcileCoreImage), all from the logged
 * records: core betas as logged, image depths as logged (stored + the shift in force).
 */
export async function reconciliationOf(
  db: Executor,
  project: Project,
  hole: Hole,
  query: ReconciliationQuery,
): Promise<ReconciliationAnswer> {
  const [rows, runs, rotations, adjustmentList] = await Promise.all([
    db
      .select({
        id: structures.id,
        depth: structures.depth,
        type: structures.type,
        source: structures.source,
        alpha: structures.alpha,
        beta: structures.beta,
        referenceLine: structures.referenceLine,
        holeTrend: structures.holeTrend,
        holePlunge: structures.holePlunge,
        dip: structures.dip,
        dipDirection: structures.dipDirection,
        depthShiftApplied: structures.depthShiftApplied,
      })
      .from(structures)
      .where(and(eq(structures.holeId, hole.id), isNotNull(structures.dip)))
      .orderBy(asc(structures.depth), asc(structures.id)),
    db
      .select({ id: coreRuns.id, fromDepth: coreRuns.fromDepth, toDepth: coreRuns.toDepth })
      .from(coreRuns)
      .where(eq(coreRuns.holeId, hole.id))
      .orderBy(asc(coreRuns.fromDepth)),
    runRotations(db, hole.id),
    listAdjustments(db, hole.id),
  ])
  const shiftInForce = adjustmentList.find((a) => a.kind === 'depth-shift' && a.active)?.value ?? 0
  const runAt = (depth: number) =>
    runs.find((r) => depth >= r.fromDepth && depth < r.toDepth)?.id ?? null
  const core = rows.filter(
    (s) => s.source === 'core' && s.alpha !== null && s.beta !== null && s.holeTrend !== null,
  )
  const image = rows.filter((s) => s.source === 'image')
  const result = reconcileCoreImage(
    core.map((s) => ({
      id: s.id,
      depth: s.depth,
      alpha: s.alpha!,
      beta: s.beta!,
      reference: s.referenceLine ?? project.referenceLine,
      hole: { trend: s.holeTrend!, plunge: s.holePlunge! },
      runId: runAt(s.depth),
    })),
    image.map((s) => ({
      id: s.id,
      depth: s.depth + s.depthShiftApplied,
      plane: { dip: s.dip!, dipDirection: s.dipDirection! },
    })),
    runs.map((r) => ({ ...r, appliedRotation: rotations.get(r.id) ?? 0 })),
    query,
  )
  const unmatchedCore = new Set(result.unmatchedCore)
  const unmatchedImage = new Set(result.unmatchedImage)
  return {
    depthShift: result.depthShift,
    depthShiftSpread: result.depthShiftSpread,
    depthTrend: result.depthTrend,
    appliedDepthShift: shiftInForce,
    matches: result.matches.map((m) => ({
      coreStructureId: m.coreId,
      imageStructureId: m.imageId,
      coreDepth: m.coreDepth,
      imageDepth: m.imageDepth,
      depthDifference: m.depthDifference,
      angle: m.angle,
      alignedAngle: m.alignedAngle,
      score: m.score,
    })),
    unmatchedCore: core.filter((s) => unmatchedCore.has(s.id)).map(item),
    unmatchedImage: image.filter((s) => unmatchedImage.has(s.id)).map(item),
    runs: result.runs,
    adjustments: adjustmentList,
    options: result.options,
    counts: { core: core.length, image: image.length },
  }
}
