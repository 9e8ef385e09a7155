import { eq } from 'drizzle-orm'
import { coreRuns, type CoreRun, type Hole, type RunInputT } from '../../../schema/index'
import type { Executor } from '../db/client'
import { badRequest, type ErrorDetail } from '../http/errors'
import { guardWrite, type Demoted, type FreezeChange } from './freeze'
import type { DepthRange } from './structure-recompute'
import { assertWithinHole } from './structure-context'

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

/** 400 unless the run fits between the hole's other runs. */
export async function assertFits(
  tx: Executor,
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

/** 400 naming `toDepth` of each run that ends beyond the hole's final depth. */
export const assertRunsWithinHole = (
  hole: Pick<Hole, 'finalDepth'>,
  runs: readonly { toDepth: number; path: string }[],
) =>
  assertWithinHole(
    hole,
    runs.map((r) => ({ path: r.path, depth: r.toDepth })),
  )

const runKey = (r: RunInputT | CoreRun) =>
  JSON.stringify([
    r.fromDepth,
    r.toDepth,
    r.recovered,
    r.solid,
    r.rqdLength,
    r.fractureCount,
    r.markConfidence,
    r.comment,
  ])

/** The extents of the runs a replacement removes or adds; a run kept exactly as it was is left out. */
export function changedRunRanges(
  before: readonly CoreRun[],
  after: readonly RunInputT[],
): DepthRange[] {
  const kept = new Set(before.map(runKey))
  const added = after.filter((r) => !kept.has(runKey(r)))
  const next = new Set(after.map(runKey))
  const removed = before.filter((r) => !next.has(runKey(r)))
  return [...removed, ...added].map((r) => ({ from: r.fromDepth, to: r.toDepth }))
}

/**
 * A run decides, for the structures inside its own extent only, their run flags, beta-jump
 * neighbours and whether they are oriented at all; its RQD and frequency count only towards the
 * intervals it overlaps. Nothing outside the extent changes, so a run write touches the intervals
 * overlapping its old and new extents — not the whole hole as a survey change does.
 */
export async function guardRuns(
  tx: Executor,
  actorId: number,
  hole: Hole,
  ranges: DepthRange[],
  change: FreezeChange,
  demoted: Demoted[],
): Promise<void> {
  demoted.push(...(await guardWrite(tx, actorId, hole.projectId, hole.id, { ranges }, change)))
}
