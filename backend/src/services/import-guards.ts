import { and, asc, desc, eq, inArray, ne } from 'drizzle-orm'
import { imports, intervals, type Import, type Interval } from '../../../schema/index'
import type { Executor } from '../db/client'
import { ApiError } from '../http/errors'
import type { Analysis } from '../imports/analyse'
import { describeInterval } from './freeze'

/** What an import writes in its hole: rows at depths (structures, picks) or the whole hole. */
export type ImportReach = { depths: number[] } | { hole: true }

export function reachOf(a: Analysis): ImportReach {
  if (a.kind === 'runs' || a.kind === 'survey') return { hole: true }
  return { depths: a.rows.map((r) => (r.value as { depth: number }).depth) }
}

/**
 * The hole's intervals past draft that an import reaches, shallowest first. Depths are matched in
 * memory against the hole's few intervals, so a 100,000-row file costs no large query.
 */
export async function intervalsReached(
  db: Executor,
  holeId: number,
  reach: ImportReach,
  statuses: Interval['status'][] = ['checked', 'approved', 'issued'],
): Promise<Interval[]> {
  const rows = await db
    .select()
    .from(intervals)
    .where(and(eq(intervals.holeId, holeId), inArray(intervals.status, statuses)))
    .orderBy(asc(intervals.fromDepth))
  if ('hole' in reach) return rows
  const depths = [...reach.depths].sort((x, y) => x - y)
  return rows.filter((i) => {
    // First depth at or below the interval's top: inside when it lies above the base ([from, to)).
    let lo = 0
    let hi = depths.length
    while (lo < hi) {
      const mid = (lo + hi) >> 1
      if (depths[mid] < i.fromDepth) lo = mid + 1
      else hi = mid
    }
    return lo < depths.length && depths[lo] < i.toDepth
  })
}

export const isFrozen = (i: Interval) => i.status === 'approved' || i.status === 'issued'

/** The interval list a preview shows: which would refuse the commit, which would go back to draft. */
export const reachedView = (reached: Interval[]) =>
  reached.map((i) => ({
    id: i.id,
    name: i.name,
    fromDepth: i.fromDepth,
    toDepth: i.toDepth,
    status: i.status,
  }))

/** The latest committed (not undone) import of the same bytes into the same hole as the same kind. */
export async function duplicateOf(
  db: Executor,
  target: Pick<Import, 'holeId' | 'kind' | 'sha256'> & { id?: string },
) {
  if (!target.sha256 || target.holeId === null) return undefined
  const [row] = await db
    .select({ importId: imports.id, fileName: imports.fileName, committedAt: imports.committedAt })
    .from(imports)
    .where(
      and(
        eq(imports.holeId, target.holeId),
        eq(imports.kind, target.kind),
        eq(imports.sha256, target.sha256),
        eq(imports.status, 'committed'),
        ...(target.id ? [ne(imports.id, target.id)] : []),
      ),
    )
    .orderBy(desc(imports.committedAt))
    .limit(1)
  return row
}

/** 409 `duplicate_import` unless the caller confirmed committing the same file again. */
export async function assertNotDuplicate(db: Executor, target: Import, confirmed: boolean) {
  if (confirmed) return
  const dup = await duplicateOf(db, target)
  if (!dup) return
  const when = dup.committedAt ? dup.committedAt.toISOString() : 'earlier'
  throw new ApiError(
    409,
    'duplicate_import',
    `The same file (${dup.fileName}, committed ${when}) is already imported into this hole: committing it again would double its rows. Send confirmDuplicate: true to commit anyway.`,
    [{ path: 'body.confirmDuplicate', message: `same SHA-256 as import ${dup.importId}` }],
    { duplicateOf: dup },
  )
}

export const describeIntervals = (list: Interval[]) => list.map(describeInterval).join(', ')

/**
 * What a replacing import (runs, survey) keeps on its row: the rows it took out, to put back on
 * undo, and the ids of the rows it wrote, to tell whether the hole still holds exactly those.
 */
export interface ReplacedRows {
  kind: 'runs' | 'survey'
  rows: Record<string, unknown>[]
  insertedIds: number[]
}

export function replacedOf(i: Pick<Import, 'replaced'>): ReplacedRows | undefined {
  const r = i.replaced as Partial<ReplacedRows> | null
  return r && Array.isArray(r.rows) && Array.isArray(r.insertedIds)
    ? (r as ReplacedRows)
    : undefined
}
