import { inArray } from 'drizzle-orm'
import { users, type Interval } from '../../../schema/index'
import type { Executor } from '../db/client'
import type { SignOff } from '../exports/pack-types'

/** Each interval's sign-off with the checker's and approver's names, read in one query. */
export async function signOffsOf(
  db: Executor,
  rows: Interval[],
): Promise<{ byInterval: Map<number, SignOff>; names: [number, string][] }> {
  const ids = [...new Set(rows.flatMap((i) => [i.checkedBy, i.approvedBy]))].filter(
    (id): id is number => id !== null,
  )
  const found = ids.length
    ? await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids))
    : []
  const names = new Map(found.map((u) => [u.id, u.name]))
  const nameOf = (id: number | null) => (id === null ? null : (names.get(id) ?? `user ${id}`))
  const byInterval = new Map(
    rows.map((i) => [
      i.id,
      {
        checkedBy: nameOf(i.checkedBy),
        checkedAt: i.checkedAt,
        approvedBy: nameOf(i.approvedBy),
        approvedAt: i.approvedAt,
      },
    ]),
  )
  return { byInterval, names: [...names].sort((a, b) => a[0] - b[0]) }
}
