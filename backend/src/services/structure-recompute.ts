import { and, asc, eq, gte, lt, sql } from 'drizzle-orm'
import { structures, type Hole, type Project } from '../../../schema/index'
import type { Executor } from '../db/client'
import { computeStructures, storedInputs, type ComputeContext } from '../../../orient/index'
import { affectedRange, loadComputeContext } from './structure-context'
import { computedColumns, computedValues } from '../db/structure-columns'

export interface DepthRange {
  from: number
  to: number
}

/**
 * Recomputes the hole's structures — all of them, or only those a write at the `near` depths can
 * change (their runs: beta jumps compare neighbours) — with the survey and runs read once. Returns
 * how many rows were written.
 */
export async function recomputeStructures(
  tx: Executor,
  project: Project,
  hole: Hole,
  near?: number[],
): Promise<number> {
  const ctx = await loadComputeContext(tx, project, hole)
  if (!near) return recomputeRange(tx, ctx, hole)
  const ranges = new Map(
    near.map((depth) => {
      const r = affectedRange(ctx, depth)
      return [`${r.from}/${r.to}`, r]
    }),
  )
  let written = 0
  for (const range of ranges.values()) written += await recomputeRange(tx, ctx, hole, range)
  return written
}

/**
 * Recomputes the structures in these depth ranges only, touching ranges merged first. A range
 * must hold whole runs (beta jumps compare neighbours within a run), which every run's own
 * extent does.
 */
export async function recomputeRanges(
  tx: Executor,
  project: Project,
  hole: Hole,
  ranges: readonly DepthRange[],
): Promise<number> {
  if (ranges.length === 0) return 0
  const ctx = await loadComputeContext(tx, project, hole)
  let written = 0
  for (const range of mergeRanges(ranges)) written += await recomputeRange(tx, ctx, hole, range)
  return written
}

/** Sorted, with overlapping or touching ranges joined: [0, 3) and [3, 6) → [0, 6). */
export function mergeRanges(ranges: readonly DepthRange[]): DepthRange[] {
  const sorted = [...ranges].sort((a, b) => a.from - b.from)
  const out: DepthRange[] = []
  for (const r of sorted) {
    const last = out[out.length - 1]
    if (last && r.from <= last.to) last.to = Math.max(last.to, r.to)
    else out.push({ from: r.from, to: r.to })
  }
  return out
}

/** Recomputes the structures in [from, to) (all without a range) and writes them in one statement. */
async function recomputeRange(
  tx: Executor,
  ctx: ComputeContext,
  hole: Hole,
  range?: DepthRange,
): Promise<number> {
  const where = range
    ? and(
        eq(structures.holeId, hole.id),
        gte(structures.depth, range.from),
        lt(structures.depth, range.to),
      )
    : eq(structures.holeId, hole.id)
  const rows = await tx
    .select()
    .from(structures)
    .where(where)
    .orderBy(asc(structures.depth), asc(structures.id))
  if (rows.length === 0) return 0
  // Every source is recomputed from its inputs: core angles, true orientation, or the raw pick.
  const computed = computeStructures(ctx, rows.map(storedInputs))
  const payload = rows.map((r, i) => ({
    id: r.id,
    ...computedValues(computed[i], hole.surveyRevision),
  }))
  await tx.execute(sql`
    update structures s set ${assignments}
    from jsonb_to_recordset(${JSON.stringify(payload)}::jsonb) as v(id int, ${recordColumns})
    where s.id = v.id`)
  return rows.length
}

// The update's SET list and the payload's record type, both from the one list of computed columns:
// column = v."key", the payload carrying each value under its TS key.
const computedEntries = Object.entries(computedColumns)
const assignments = sql.join(
  computedEntries.map(
    ([key, column]) => sql`${sql.identifier(column.name)} = v.${sql.identifier(key)}`,
  ),
  sql`, `,
)
const recordColumns = sql.join(
  computedEntries.map(
    ([key, column]) => sql`${sql.identifier(key)} ${sql.raw(column.getSQLType())}`,
  ),
  sql`, `,
)
